using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Tables;

namespace SlotOpt.Plates;

/// <summary>How a grid-error estimate was made (<see cref="DiscretisationError"/>).</summary>
public enum GridErrorMethod
{
    /// <summary>Cells h, 2h and 4h; the order they show (at least 0.5, at most 2 taken) and the grid convergence index with safety factor 1.25.</summary>
    ThreeGrid,
    /// <summary>Cells h, 2h and 4h whose differences show no order (they change sign) or one below 0.5: order 1, safety factor 3.</summary>
    ThreeGridOrderUnconfirmed,
    /// <summary>Cells h and 2h, order 1 assumed, no safety factor: where the 4h grid cannot be built or does not resolve the plate's geometry,
    /// or where the 2h grid does not resolve it and no finer grid can be solved.</summary>
    TwoGrid,
    /// <summary>Cells h and h/2 where the 2h grid does not resolve the plate: the h value's error from the finer grid's, order 1 assumed, safety factor 1.25.</summary>
    FinerGrid,
}

/// <summary>
/// Grid-error estimate of a plate number (its loss: drag and torque scale with it) from the same plate solved on coarser grids,
/// relative to the number on the fine grid. Three grids, cells h, 2h and 4h (values P1, P2, P3): the observed order p from the two
/// differences, and the grid convergence index GCI = Fs |P2 - P1| / |P1| / (r^p - 1) (P. J. Roache, "Quantification of uncertainty in
/// computational fluid dynamics", Annu. Rev. Fluid Mech. 29:123-160, 1997; I. B. Celik et al., "Procedure for estimation and reporting
/// of uncertainty due to discretization in CFD applications", J. Fluids Eng. 130:078001, 2008, Eq. 5c), with Fs = 1.25, Roache's
/// factor for a three-grid study whose observed order is used. The scheme shows first order at the cut cells of curved and slanted
/// outlines and slot corners and second on grid-aligned plates (DiscretisationErrorTests); an observed order above 2 is taken as 2 (the
/// differences cancel by chance, and a narrower bar would rest on that). Where the differences change sign (oscillatory convergence) or
/// show an order below 0.5, the grids are not in the asymptotic range: p = 1 with Fs = 3, Roache's bar for an order the grids do not
/// confirm; 0.5 is where the observed-order bar, 1.25 / (2^p - 1) = 3.02 times the change, meets it, so the estimate does not jump there. Where the 4h grid cannot be built or does not resolve the geometry (fewer than 2 cells across a slot or cut-out, the
/// house's rule for a whole empty cell column; fewer than 1 across a conducting strip), two grids with p = 1 and no safety factor:
/// (P1 - P2) / (2^1 - 1) (L. F. Richardson, "The deferred approach to the limit", Phil. Trans. R. Soc. A 226:299-361, 1927), exact for
/// first-order convergence and three times the error at second order. Where even the 2h grid does not resolve the plate, a coarser grid
/// solves a different plate and its difference is no estimate: the same plate is solved on cells h/2 instead (when that grid resolves it,
/// fits the run's memory and converges), and the error of the reported h value is the Richardson estimate of the coarser member of the
/// pair h, h/2: P_ext = P_{h/2} + (P_{h/2} - P_h) / (r^p - 1) (Celik et al. 2008, Eq. 4a, from memory), so |P_h - P_ext| = |P_h - P_{h/2}| r^p / (r^p - 1),
/// the grid convergence index of the coarser grid (P. J. Roache, "Perspective: a method for uniform reporting of grid refinement studies",
/// J. Fluids Eng. 116:405-413, 1994, from memory) with Fs = 1.25 and p = 1 (<see cref="FromFinerGrid"/>). The reported number
/// stays the h grid's, the one the options were ranked with; the words give the finer grid's number so that a reader sees where it heads.
/// </summary>
/// <param name="Relative">The estimate, relative to the reported value (the GCI for three grids).</param>
/// <param name="Values">The number on each grid (a loss, W), the reported grid's first: then the coarser grids, or the finer grid (FinerGrid).</param>
/// <param name="CellsM">Each grid's representative cell, sqrt(hx hy) (Celik et al. 2008, Eq. 1, in 2-D), in the order of Values.</param>
/// <param name="ObservedOrder">The order the three grids show (null for two grids, or when the differences change sign).</param>
/// <param name="Order">The order the estimate uses.</param>
/// <param name="SafetyFactor">Fs of the estimate.</param>
/// <param name="Caveat">Why the estimate fell back from the three-grid one, or null.</param>
public sealed record DiscretisationError(
    double Relative,
    GridErrorMethod Method,
    IReadOnlyList<double> Values,
    IReadOnlyList<double> CellsM,
    double? ObservedOrder,
    double Order,
    double SafetyFactor,
    string? Caveat)
{
    /// <summary>Above this a note asks for a finer cell (common practice, no source: the house's 1 % accuracy target).</summary>
    public const double WarningThreshold = 0.01;
    /// <summary>The order two grids assume, and an unconfirmed order falls back to: the scheme's slowest (cut cells).</summary>
    public const double AssumedOrder = 1;
    /// <summary>Observed orders below this are not used (Roache's bar at order 1 takes over, see above); above HighestOrder the estimate takes HighestOrder.</summary>
    public const double LowestObservedOrder = 0.5, HighestOrder = 2;
    /// <summary>Roache (1997)'s safety factors: for a three-grid study with its observed order, and for an order the grids do not confirm.</summary>
    public const double ObservedOrderSafetyFactor = 1.25, UnconfirmedOrderSafetyFactor = 3;
    /// <summary>
    /// Fs of the finer-grid estimate: Roache (1997)'s 1.25 with the scheme's slowest order, where the two-grid coarsening takes 1. The reported grid does
    /// not resolve the plate, so the step to the finer grid mixes the slots' resolution into the order-1 convergence, and the bar keeps Roache's margin
    /// for it: on the conveyor rail (DiscretisationErrorTests) the step's Richardson estimate alone (Fs = 1) is 0.95 times the error against a fine solve, 1.25 times it 1.19.
    /// </summary>
    public const double FinerGridSafetyFactor = 1.25;
    /// <summary>Cells the coarser grids must leave across a slot or cut-out (a whole empty column: GridOptions.MinCellsAcrossCutout) and across a conducting strip.</summary>
    public const double CellsAcrossCutout = 2, CellsAcrossStrip = 1;

    /// <summary>
    /// The estimate of fineValue, solved on model's grid: valueOn solves the same plate on another model (2h, then 4h when it resolves
    /// the geometry; h/2 where 2h does not). Null where no grid of twice the cell exists (fewer than 2 cells across, or nothing conducting left).
    /// </summary>
    /// <param name="refusesCell">Why a grid of the given cell (m) must not be solved (the run's memory limit), or null; null: every grid may be.</param>
    public static DiscretisationError? Estimate(SheetModel model, double fineValue, Func<SheetModel, double> valueOn, Func<double, string?>? refusesCell = null)
    {
        var geometry = model.Grid.Geometry;
        double h = Math.Max(model.Lattice.Hx, model.Lattice.Hy);
        if (Coarsened(geometry, 2 * h) is not { } medium) return null;
        string? caveat = null;
        if (Unresolved(geometry, medium) is { } gap2h)
        {
            var unresolved = $"the coarser grid does not resolve the plate ({gap2h})";
            var refined = Refined(model, h / 2, fineValue, valueOn, refusesCell, unresolved);
            if (refined.Estimate is { } finer) return finer;
            caveat = $"even {unresolved}: the two grids solve different plates; no finer grid: {refined.WhyNot}";
        }
        double mediumValue = valueOn(medium);
        if (caveat is null)
        {
            if (Coarsened(geometry, 4 * h) is not { } coarse) caveat = $"a grid of {Millimetres(4 * h)} mm cells cannot be built for this plate";
            else if (Unresolved(geometry, coarse) is { } gap4h) caveat = gap4h;
            else
            {
                try { return FromThreeGrids(fineValue, mediumValue, valueOn(coarse), CellOf(model), CellOf(medium), CellOf(coarse)); }
                catch (NumericalFailureException failure) { caveat = $"the solve on {Millimetres(CellOf(coarse))} mm cells failed ({failure.Message})"; }
            }
        }
        return FromTwoGrids(fineValue, mediumValue, CellOf(model), CellOf(medium), caveat);
    }

    /// <summary>Three grids, finest first, with their representative cells (Celik et al. 2008, steps 3 to 5).</summary>
    public static DiscretisationError FromThreeGrids(double fine, double medium, double coarse, double cellM, double mediumCellM, double coarseCellM)
    {
        CheckFinite(fine, medium, coarse);
        double r21 = mediumCellM / cellM, r32 = coarseCellM / mediumCellM;
        if (!(r21 > 1) || !(r32 > 1)) throw new ArgumentException($"the grids must coarsen in turn (cells {cellM}, {mediumCellM}, {coarseCellM} m)");
        double e21 = medium - fine, e32 = coarse - medium;                                   // epsilon_21 = phi_2 - phi_1, epsilon_32 = phi_3 - phi_2 (Celik 2008, step 3)
        double relative = RelativeChange(fine, medium);                                        // e_a^21 = |(phi_1 - phi_2) / phi_1| (Celik 2008, Eq. 5a)
        double[] values = [fine, medium, coarse], cells = [cellM, mediumCellM, coarseCellM];
        if (e21 == 0 || e32 == 0 || Math.Sign(e21) != Math.Sign(e32))
            return Unconfirmed(relative, r21, values, cells, null, e21 == 0 || e32 == 0
                ? "the grids' differences vanish, so they show no order"
                : "the grids' differences change sign (oscillatory convergence), so they show no order");
        double p = ObservedOrderOf(e32 / e21, r21, r32);
        if (!(p >= LowestObservedOrder))
            return Unconfirmed(relative, r21, values, cells, double.IsFinite(p) ? p : null, double.IsFinite(p)
                ? $"the grids show order {Numbers.Sig(p)}, under {Numbers.Sig(LowestObservedOrder)}: they are not yet in the asymptotic range"
                : "the grids show no settled order: they are not yet in the asymptotic range");
        double order = Math.Min(p, HighestOrder);
        return new DiscretisationError(ObservedOrderSafetyFactor * relative / (Math.Pow(r21, order) - 1), GridErrorMethod.ThreeGrid, values, cells, p, order,
            ObservedOrderSafetyFactor, null);                                                  // GCI_fine^21 = Fs e_a^21 / (r21^p - 1) (Celik 2008, Eq. 5c)
    }

    /// <summary>Two grids, order 1 assumed, no safety factor: (P1 - P2) / (2^1 - 1) relative (Richardson 1927); caveat says why there is no third grid.</summary>
    public static DiscretisationError FromTwoGrids(double fine, double coarse, double cellM, double coarseCellM, string? caveat)
    {
        CheckFinite(fine, coarse);
        double r = coarseCellM / cellM;
        return new DiscretisationError(RelativeChange(fine, coarse) / (Math.Pow(r, AssumedOrder) - 1), GridErrorMethod.TwoGrid, [fine, coarse], [cellM, coarseCellM], null,
            AssumedOrder, 1, caveat);
    }

    /// <summary>
    /// The reported value on cells cellM against the same plate on finer cells finerCellM, order 1 (the scheme's slowest): the Richardson
    /// estimate of the coarser member's error, |P_h - P_ext| with P_ext = (r^p P_fine - P_h) / (r^p - 1) (Celik et al. 2008, Eq. 4a), times
    /// <see cref="FinerGridSafetyFactor"/>: Fs r^p |P_h - P_fine| / (r^p - 1) / |P_h|, Roache (1994)'s GCI of the coarser grid. caveat: why no coarser grid served.
    /// </summary>
    public static DiscretisationError FromFinerGrid(double reported, double finer, double cellM, double finerCellM, string caveat)
    {
        CheckFinite(reported, finer);
        double r = cellM / finerCellM;
        if (!(r > 1)) throw new ArgumentException($"the finer grid must be finer (cells {cellM}, {finerCellM} m)");
        double rp = Math.Pow(r, AssumedOrder);
        return new DiscretisationError(FinerGridSafetyFactor * rp * RelativeChange(reported, finer) / (rp - 1), GridErrorMethod.FinerGrid, [reported, finer], [cellM, finerCellM],
            null, AssumedOrder, FinerGridSafetyFactor, caveat);                               // GCI_coarse = Fs r^p |eps| / (r^p - 1) (Roache 1994), relative to P_h
    }

    public bool IsLarge => Relative > WarningThreshold;

    /// <summary>The method's name in the JSON outputs: three-grid, three-grid-order-unconfirmed, two-grid or finer-grid.</summary>
    public string MethodName => Method switch
    {
        GridErrorMethod.ThreeGrid => "three-grid",
        GridErrorMethod.ThreeGridOrderUnconfirmed => "three-grid-order-unconfirmed",
        GridErrorMethod.FinerGrid => "finer-grid",
        _ => "two-grid",
    };

    /// <summary>The method and the cells in words, e.g. "grid convergence index from 2, 4 and 8 mm cells, observed order 1.62, safety factor 1.25";
    /// a finer-grid estimate gives the finer grid's number (a loss: every caller estimates one).</summary>
    public string Description => Method switch
    {
        GridErrorMethod.ThreeGrid => $"grid convergence index from {Cells()} cells, observed order {Numbers.Sig(ObservedOrder!.Value)}{(ObservedOrder > HighestOrder ? $" taken as {Numbers.Sig(HighestOrder)}" : "")}, safety factor {Numbers.Sig(SafetyFactor)}",
        GridErrorMethod.ThreeGridOrderUnconfirmed => $"grid convergence index from {Cells()} cells at order 1, safety factor {Numbers.Sig(SafetyFactor)}: {Caveat}",
        GridErrorMethod.FinerGrid => $"Richardson against a finer grid, {Cells()} cells, order 1 assumed, safety factor {Numbers.Sig(SafetyFactor)}; on {Millimetres(CellsM[1])} mm cells: {Numbers.Watts(Values[1])}; {Caveat}",
        _ => $"Richardson, {Cells()} cells, order 1 assumed{(Caveat is null ? "" : $"; no third grid: {Caveat}")}",
    };

    public string Warning =>
        $"estimated grid error {Numbers.EstimatePercent(Relative)} ({Description}) exceeds {Numbers.Percent(WarningThreshold)}: give a smaller [grid] cell";

    private static DiscretisationError Unconfirmed(double relative, double r21, double[] values, double[] cells, double? observed, string why) =>
        new(UnconfirmedOrderSafetyFactor * relative / (Math.Pow(r21, AssumedOrder) - 1), GridErrorMethod.ThreeGridOrderUnconfirmed, values, cells, observed,
            AssumedOrder, UnconfirmedOrderSafetyFactor, why);

    /// <summary>
    /// p = [ln(eps32 / eps21) + q(p)] / ln r21, q(p) = ln((r21^p - 1) / (r32^p - 1)) for differences of one sign, by fixed-point iteration
    /// (Celik et al. 2008, Eqs. 3a-3c with s = 1; without 3a's absolute value, so that differences growing on refinement give p &lt; 0 rather
    /// than a positive order). Stops when p changes by less than 1e-10 (converges in a few steps for r21 near r32; q = 0 when they are
    /// equal); NaN when p leaves (0, 20) or does not settle in 100 steps, which the caller treats as an unconfirmed order.
    /// </summary>
    private static double ObservedOrderOf(double ratio, double r21, double r32)
    {
        double p = Math.Log(ratio) / Math.Log(r21);
        for (int k = 0; k < 100; k++)
        {
            if (!(p > 0 && p < 20)) return p <= 0 ? p : double.NaN;
            double next = (Math.Log(ratio) + Math.Log((Math.Pow(r21, p) - 1) / (Math.Pow(r32, p) - 1))) / Math.Log(r21);
            if (Math.Abs(next - p) < 1e-10) return next;
            p = next;
        }
        return double.NaN;
    }

    private static double RelativeChange(double fine, double coarse) =>
        fine == 0 ? (coarse == 0 ? 0 : 1) : Math.Abs(fine - coarse) / Math.Abs(fine);

    private static void CheckFinite(params double[] values)
    {
        if (values.Any(v => !double.IsFinite(v))) throw new NumericalFailureException($"the grid-error estimate got a non-finite value ({string.Join(", ", values)})");
    }

    /// <summary>
    /// The finer-grid estimate (<see cref="FromFinerGrid"/>) from the plate on cells finerCellM, or why there is none: the grid is refused
    /// (refusesCell: memory), cannot be built, does not resolve the plate either, or its solve fails (the fallback then says so, never a guessed number).
    /// </summary>
    private static (DiscretisationError? Estimate, string WhyNot) Refined(SheetModel model, double finerCellM, double reportedValue, Func<SheetModel, double> valueOn,
        Func<double, string?>? refusesCell, string caveat)
    {
        var geometry = model.Grid.Geometry;
        var cells = $"{Millimetres(finerCellM)} mm cells";
        if (refusesCell?.Invoke(finerCellM) is { } refusal) return (null, refusal);
        SheetModel finer;
        try { finer = SheetModel.Build(geometry, new GridOptions { CellSizeM = finerCellM }); }
        catch (InputException e) { return (null, $"a grid of {cells} cannot be built for this plate ({e.Message})"); }
        if (Unresolved(geometry, finer) is { } gap) return (null, $"a grid of {cells} does not resolve it either ({gap})");
        double value;
        try { value = valueOn(finer); }
        catch (NumericalFailureException e) { return (null, $"the solve on {cells} failed ({e.Message})"); }
        if (!double.IsFinite(value)) return (null, $"the solve on {cells} gave a non-finite value ({value})");
        return (FromFinerGrid(reportedValue, value, CellOf(model), CellOf(finer), caveat), "");
    }

    /// <summary>The plate on a grid of the given cell, or null where none exists (fewer than 2 cells across, or nothing conducting left).</summary>
    private static SheetModel? Coarsened(PlateGeometry geometry, double cellM)
    {
        try { return SheetModel.Build(geometry, new GridOptions { CellSizeM = cellM }); }
        catch (InputException) { return null; }
    }

    /// <summary>Why the grid does not resolve the geometry (the narrowest slot, cut-out or strip short of its cells), or null.</summary>
    private static string? Unresolved(PlateGeometry geometry, SheetModel coarse)
    {
        double cell = Math.Max(coarse.Lattice.Hx, coarse.Lattice.Hy);
        var widths = GeometryFeatures.Of(geometry)
            .Where(f => f.Kind is GridFeatureKind.ConductingStrip or GridFeatureKind.Cutout)
            .Select(f => (f.Name, f.WidthM, Needed: f.Kind == GridFeatureKind.Cutout ? CellsAcrossCutout : CellsAcrossStrip))
            .Concat(geometry.Slots.Select((s, k) => (Name: $"slot {k + 1}", s.WidthM, Needed: CellsAcrossCutout)));
        var worst = widths.Where(w => w.WidthM / cell < w.Needed).OrderBy(w => w.WidthM / cell / w.Needed).FirstOrDefault();
        return worst.Name is null ? null
            : $"{Millimetres(cell)} mm cells put {Numbers.Sig(worst.WidthM / cell)} across {worst.Name} ({Millimetres(worst.WidthM)} mm), under the {worst.Needed} that resolve it";
    }

    private static double CellOf(SheetModel model) => Math.Sqrt(model.Lattice.Hx * model.Lattice.Hy);

    private string Cells() => CellsM.Count == 2
        ? $"{Millimetres(CellsM[0])} mm against {Millimetres(CellsM[1])} mm"
        : $"{Millimetres(CellsM[0])}, {Millimetres(CellsM[1])} and {Millimetres(CellsM[2])} mm";

    private static string Millimetres(double m) => Numbers.Sig(m * 1e3);
}
