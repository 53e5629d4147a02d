using System.Diagnostics;
using SlotOpt.Numerics;
using SlotOpt.Plates;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources.Magnets;
using SlotOpt.Plates.Thick;

namespace SlotOpt.Runs;

/// <summary>
/// Magnets sliding over a wide plain block, solved as the exact laterally infinite slab (<see cref="SlabUnderMovingMagnets"/>,
/// model "thick-slab"): drag, lift and loss at the case's speed and at 1/8 to 8 times it. Chosen automatically when the
/// validity figures find the plate beyond the thin-sheet models (t / delta_c above the threshold) or the plate is at least
/// as thick as the gap (the field then changes across the thickness even at low speed), and the block is plain (no slots,
/// cut-outs, cuts, grooves or zones), non-magnetic and wide: its edges lie at least <see cref="EdgeClearanceInSourceHeights"/>
/// times the magnets' far-face height (gap + magnet height) beyond the magnets' footprint at every travel offset.
/// The slab neglects the edges (the currents' return paths and the vertical currents there); the map printed beside it is
/// the thin-sheet resistance-limited one and says so.
/// </summary>
public static class PlateThickSlab
{
    /// <summary>Edge clearance, in far-face heights, beyond which the fringing field is a few per cent of its peak (common practice, no source: the field of a magnet face falls off as a dipole's beyond about its height).</summary>
    public const double EdgeClearanceInSourceHeights = 3;

    /// <summary>Speeds of the curve, in multiples of the case's speed.</summary>
    public static readonly double[] SpeedFactors = [0.125, 0.25, 0.5, 1, 2, 4, 8];

    /// <summary>The sliding magnets and the reason when this case goes to the slab; null when it does not. Refuses --model thick-slab where it cannot apply.</summary>
    public static (SlidingMagnets Source, ModelChoice Choice)? Wanted(PlateCase plate, SheetModelKind? forcedKind)
    {
        bool asked = forcedKind == SheetModelKind.ThickSlab;
        if (forcedKind is { } k && !asked) return null;
        if (plate.MovingSource is not SlidingMagnets magnets)
            return asked ? throw new InputException($"{plate.Path}: --model thick-slab is for magnets sliding over a block ([source] kind = \"magnets\"); this [source] is not") : null;
        var auto = ReactionModelChoice.ForMoving(plate.Sheet, magnets.SpeedMPerS, magnets.LoopLengthXM);
        string? obstacle = Obstacle(plate, magnets);
        if (obstacle is not null)
            return asked ? throw new InputException($"{plate.Path}: --model thick-slab cannot be used: {obstacle}") : null;
        double gap = magnets.Magnets.GapM, t = plate.Sheet.ThicknessM;
        bool thickAgainstGap = t >= gap;
        if (!asked && auto.Kind != SheetModelKind.BeyondThinSheet && !thickAgainstGap) return null;
        string why = auto.Kind == SheetModelKind.BeyondThinSheet ? auto.Reason
            : thickAgainstGap ? $"the block ({t * 1e3:G3} mm) is at least as thick as the gap ({gap * 1e3:G3} mm): the field changes across it; {auto.Reason}"
            : $"asked for; the validity figures call for {ReactionModelChoice.Name(auto.Kind)} ({auto.Reason})";
        return (magnets, auto with { Kind = SheetModelKind.ThickSlab, Reason = $"exact wide slab under sliding magnets, every depth and its own field: {why}" });
    }

    /// <summary>Why the slab does not describe this plate, or null: slots and holes, a magnetic block, edges too near the magnets.</summary>
    private static string? Obstacle(PlateCase plate, SlidingMagnets magnets)
    {
        var g = plate.Geometry;
        if (g.Cutouts.Count + g.Slots.Count + g.Cuts.Count + g.Grooves.Count + g.Zones.Count + g.Patterns.Count > 0 || g.ConductivityFactorAt is not null)
            return "the plate has slots, cut-outs, cuts, grooves or zones, and the slab model is a plain block";
        if (plate.Sheet.RelativePermeability != 1) return $"the block is magnetic (relative permeability {plate.Sheet.RelativePermeability:G3}) and the slab model is for mu = mu0";
        var array = magnets.Magnets;
        double reach = EdgeClearanceInSourceHeights * (array.GapM + array.Magnets.Max(m => m.Magnet.HeightM));
        var (min, max) = g.Bounds;
        double left = array.ExtentX.MinXM + plate.OffsetsXM.Min() - min.X, right = max.X - (array.ExtentX.MaxXM + plate.OffsetsXM.Max());
        double bottom = array.Magnets.Min(m => m.Centre.Y - m.Magnet.HalfWidthYM) - min.Y, top = max.Y - array.Magnets.Max(m => m.Centre.Y + m.Magnet.HalfWidthYM);
        double clearance = Math.Min(Math.Min(left, right), Math.Min(bottom, top));
        return clearance < reach
            ? $"the plate's edge comes within {clearance * 1e3:G3} mm of the magnets' footprint, less than {EdgeClearanceInSourceHeights} far-face heights ({reach * 1e3:G3} mm): the block is not wide against the magnets"
            : null;
    }

    public static PlateFileEvaluation Evaluate(PlateCase plate, (SlidingMagnets Source, ModelChoice Choice) wanted, SheetModel model, ConvergenceCriterion? criterion)
    {
        var (source, choice) = wanted;
        var clock = Stopwatch.StartNew();
        double v = source.SpeedMPerS;
        var slab = new SlabUnderMovingMagnets(plate.Sheet.ConductivitySPerM, plate.Sheet.ThicknessM);
        var curve = slab.Solve(SurfaceFieldSpectrum.Of(source.Magnets), SpeedFactors.Select(f => f * v).ToArray());
        var atSpeed = curve[Array.IndexOf(SpeedFactors, 1.0)];
        var map = ResistanceLimitedSolver.SolveMoving(model, source, plate.OffsetsXM, criterion);
        var peak = map.Peak.ScaleTo(plate.Sheet);
        var notes = peak.Notes.Concat(new[]
        {
            $"thick-slab: drag, lift and loss are the laterally infinite block's (wavenumber quadrature error below {curve.Max(f => f.RelativeErrorEstimate):E1}); the plate's edges are neglected, and the block is the same at every travel offset",
            "the current-density map and its peak and RMS are the thin-sheet resistance-limited ones, for orientation only; loss and drag are from the model that ran",
        }).ToList();
        var result = peak with { Validity = peak.Validity with { Warnings = Array.Empty<string>() }, Notes = notes };
        return new PlateFileEvaluation(plate, choice, result, atSpeed.LossW, atSpeed.DragN, plate.OffsetsXM, plate.OffsetsXM.Select(_ => atSpeed.DragN).ToArray(),
            plate.OffsetsXM.Select(_ => atSpeed.LossW).ToArray(), map.IterationsPerOffset.Sum(), map.Peak.RelativeResidual, model.SetupSeconds, clock.Elapsed.TotalSeconds)
            { SlabSpeedCurve = curve };
    }
}
