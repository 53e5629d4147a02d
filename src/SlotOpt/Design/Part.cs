namespace SlotOpt.Design;

/// <summary>One part of the product, with its own choice space and limits.</summary>
public abstract record Part(string Name, int Line, double TemperatureK, double? MaxLossW)
{
    /// <summary>Whether the problem file called this part's loss no-load or load loss; null for the default of its kind.</summary>
    public LossKind? DeclaredLossKind { get; init; }

    /// <summary>How this part's loss is valued.</summary>
    public LossKind LossKind => DeclaredLossKind ?? DefaultLossKind;

    /// <summary>Cores lose while energised (no-load); plates beside windings lose with the load current (load).</summary>
    protected abstract LossKind DefaultLossKind { get; }
}
