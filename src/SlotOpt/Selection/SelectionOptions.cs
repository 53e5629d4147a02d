namespace SlotOpt.Selection;

/// <summary>What a selection run computes besides the chosen design.</summary>
public sealed record SelectionOptions
{
    /// <summary>Also sweep the trade-off front for objectives other than <see cref="Objective.TradeOffCurve"/>.</summary>
    public bool IncludeFront { get; init; }

    /// <summary>Most points the front sweep finds before it stops and reports itself capped.</summary>
    public int MaxFrontPoints { get; init; } = 60;

    /// <summary>Told of each front point as the sweep finds it (most expensive first).</summary>
    public IProgress<FrontPoint>? FrontProgress { get; init; }
}
