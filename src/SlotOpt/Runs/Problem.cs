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
    IReadOnlyList<string> Warnings);
