namespace SlotOpt.Design;

/// <summary>One part of the product, with its own choice space and limits.</summary>
public abstract record Part(string Name, int Line, double TemperatureK, double? MaxLossW);
