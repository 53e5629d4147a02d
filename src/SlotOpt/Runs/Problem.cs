using SlotOpt.Design;
using SlotOpt.Materials;
using SlotOpt.Selection;

namespace SlotOpt.Runs;

/// <summary>A validated problem: the product's parts, their choice spaces, the shared limits and the economics, in SI units.</summary>
public sealed record Problem(
    string Name,
    string SourcePath,
    Objective Goal,
    Economics Economics,
    SharedLimits Limits,
    ManufacturingSettings Shop,
    MaterialLibrary Library,
    IReadOnlyList<Part> Parts,
    IReadOnlyList<string> Warnings)
{
    /// <summary>The value of a watt of the named part's loss: no-load or load, as the part's kind says.</summary>
    public double ValuePerWattOf(string partName) => Economics.ValuePerWattFor(Parts.First(p => p.Name == partName).LossKind);

    /// <summary>Build cost plus each option's loss at the value of its part's kind of loss.</summary>
    public double OwningCost(IEnumerable<EvaluatedOption> options) => options.Sum(o => o.BuildCost + ValuePerWattOf(o.PartName) * o.Loss.TotalW);

    /// <summary>Money a year the options' losses cost, when the energy price and hours are known.</summary>
    public double? YearlyLossCost(IEnumerable<EvaluatedOption> options)
    {
        double total = 0;
        foreach (var o in options)
        {
            if (Economics.YearlyCostPerWattFor(Parts.First(p => p.Name == o.PartName).LossKind) is not { } perWatt) return null;
            total += perWatt * o.Loss.TotalW;
        }
        return total;
    }
}
