namespace SlotOpt.Design;

/// <summary>One fixed design of one part: a <see cref="CoreChoice"/> or a <see cref="PlateChoice"/>.</summary>
public abstract record DesignChoice;
