using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.Sources.Rotation;
using SlotOpt.Tables;

namespace SlotOpt.Design.Limits;

/// <summary>
/// What a run holds at once, in bytes, estimated before anything is built (measured peak resident sizes of the
/// `slotopt` process, fitted per cell, with <see cref="Margin"/> on top; see README, Reliability). The terms:
/// the runtime itself; the screening, where every slot geometry of a part keeps its solved model (grid, operator,
/// multigrid hierarchy: the confirmation and the figures read it) and Threads solves work at once; and the
/// confirmation of a chosen plate with its own field, one model plus the reaction operator's zero-padded FFT lattice
/// and the GMRES basis. The run's peak is the larger phase.
/// </summary>
public static class MemoryModel
{
    /// <summary>
    /// The process with its libraries (CP-SAT included) loaded, before the grids: measured 54 MB peak for `slotopt plate` on a
    /// 4.9 k-cell grid, and 88 MB for `slotopt run` on the tie-plate demo less its grids' share.
    /// </summary>
    public const double RuntimeBytes = 100e6;

    /// <summary>
    /// A solved model kept per slot geometry: grid, node regions, structured multigrid with its lattice operator, solution. Measured
    /// 2026-12-02 (`slotopt run`, tie-plate demo without its [parts.thermal] section, 13 geometries, one thread): peaks of 175 MB
    /// on 21.6 k cells and 358 MB on 86.4 k cells, 2.83 kB per added cell, of which 13 kept models take all but one solve's work:
    /// (2830 - 150) / 13 = about 210 B (was 400 B before the structured multigrid stopped storing the CSR matrix). Since 3 Dec 2026 the
    /// lattice sheet operator keeps no lattice vector of its own (its products borrow one from the shared array pool, counted in
    /// <see cref="SolveBytesPerCell"/>): the sheets bench's retained bytes fell by 19 B per unknown, so 210 B is still a bound. The plate
    /// temperature solves have their own terms (<see cref="ThermalKeptBytesPerCell"/> and the two after it).
    /// </summary>
    public const double ModelBytesPerCell = 210;

    /// <summary>One solve at work beyond the model it keeps: the four CG vectors and the right-hand sides (8 B each, a few more for the sweep;
    /// among them the lattice vector the sheet operator's product borrows from the shared array pool, one a thread).</summary>
    public const double SolveBytesPerCell = 150;

    /// <summary>
    /// With a thermal section, what each slot geometry keeps for the screening of its thicknesses and materials: the thermal network with
    /// its cached multigrid (ThermalScreen; the kept temperatures reach them). Measured 2026-12-02 on the tie-plate demo's 21.6 k-cell grid
    /// (ThermalMemoryTests, the managed heap after a full collection): 148 B per cell; 152 B since the multigrid takes one unknown per node (its
    /// node-to-unknown map, 4 B a node, kept with it; 2 Dec 2026 23:12 UTC); 127 B since the V-cycle runs in place on the conjugate
    /// gradients' vectors (the multigrid no longer makes and keeps a right-hand side of its own; 3 Dec 2026 07:07 UTC).
    /// </summary>
    public const double ThermalKeptBytesPerCell = 160;

    /// <summary>Each thickness and material's temperature kept for the report: one double per node (nodes slightly outnumber cells); measured 8.2 B per cell.</summary>
    public const double ThermalOptionBytesPerCell = 9;

    /// <summary>
    /// One thermal solve at work: everything its first solve on a geometry allocates (network, multigrid, the iteration's vectors, the
    /// answer), a bound on what it holds at once. Measured 307 B per cell (ThermalMemoryTests, GC.GetTotalAllocatedBytes); 267 B since the
    /// conjugate gradients keep their vectors across the iteration's steps (2 Dec 2026 23:12 UTC); 246 B since the V-cycle runs in place
    /// (no z vector, no copy of the residual; 3 Dec 2026 07:07 UTC). End to end,
    /// `slotopt run` on the tie-plate demo with --out (13 geometries x 6 thicknesses and materials, two threads, 2026-12-02): the thermal
    /// section raised the peak resident size from 261 to 411 MB at 21.6 k cells and from 592 to 856 MB at 86.4 k cells, 1.8 kB per added
    /// cell, within this model's 13 x (160 + 6 x 9) + 2 x 320 = 3.4 kB.
    /// </summary>
    public const double ThermalSolveBytesPerCell = 320;

    /// <summary>
    /// The own-field operator per cell of its zero-padded lattice, 16 B (a real and an imaginary double) for each of: the
    /// transform buffer and the reaction spectrum, and for a moving source the preconditioner's spectral factor with its own
    /// buffer (on a circular lattice at most half the padded one: together at most 1 lattice) and the x-difference's spectrum,
    /// which on a lattice of 2n - 2 rows (ReactionOperator's even-kernel product, at most 3/4 of the padded one) has its own buffer
    /// too (together at most 1.5): 4.5 lattices at most. Measured with the GMRES basis below (before the basis was allocated as used): `slotopt plate` on 80 k and 320 k
    /// cells (padded 0.5 M and 2.1 M) peaks at 147 MB and 398 MB, 1.05 kB per added cell; this model is above that, as it counts the whole GMRES basis.
    /// </summary>
    public const double OwnFieldBytesPerPaddedCell = 4.5 * 16;

    /// <summary>
    /// The own-field solve's GMRES vectors per unknown, at most restart + 1 basis vectors and restart preconditioned ones
    /// (flexible GMRES), complex, 16 B each: the bound, as both are allocated only as far as the iteration reaches
    /// (16-22 of each in the benches).
    /// </summary>
    public const double GmresBytesPerCell = (2 * ComplexGmresRestart + 1) * 16;

    private const int ComplexGmresRestart = SlotOpt.Numerics.ComplexGmres.DefaultRestart;

    /// <summary>Factor over the fitted estimate: the garbage collector's headroom (a collected grid is not yet returned) and the scatter of the measurements.</summary>
    public const double Margin = 1.25;

    /// <summary>
    /// The coupled ranking of a part passed by a moving source (PlateModelRanking, after the screening): every slot geometry keeps a reduced
    /// basis for the loss bounds, per travel position three basis vectors and their products with the sheet operator (6 x 8 B per cell),
    /// next to its own reaction operator (the zero-padded FFT lattice, <see cref="OwnFieldBytesPerPaddedCell"/>).
    /// </summary>
    public const double RankingKeptBytesPerCellPerPosition = 6 * 8;

    /// <summary>
    /// One geometry's reduced basis grown until its options converge, per travel position, beyond what it keeps: basis vectors and their
    /// products, 16 B per step per cell, taken at 64 steps. Fitted, not a bound (a basis may grow to MovingReducedBasis.MaxSteps = 400 steps):
    /// with it the conveyor-rail demo's estimate covers its measured peaks (<see cref="RankingBytesPerCell"/>).
    /// </summary>
    public const double RankingSolveBytesPerCellPerPosition = 64 * 16;

    /// <summary>
    /// A zero-padded FFT lattice has at most 4 x 4 the cells of the grid (ReactionOperator.PaddedLength below 4 n a side): the bound the
    /// per-cell forms use where the grid's sides are not known yet.
    /// </summary>
    public const double PaddedCellsPerCellBound = 16;

    /// <summary>
    /// Writing the report (`--out`): the drawing library and its bitmaps, the figures' PNG and SVG, the pages with the images embedded.
    /// Measured 2026-12-02 as the peak resident size with --out less the same command's without it: `slotopt plate` on the approach-damper demo
    /// (25.6 k cells, two figures and the map) 25 and 43 MB over 65 MB in two pairs of runs; `slotopt run` on the conveyor-rail demo 33 MB
    /// (660 against 627 MB, 2 threads). The report is written after the screening, whose models the collector may not have returned yet, so
    /// the term is added to the run's largest phase.
    /// </summary>
    public const double ReportBytes = 50e6;

    /// <summary>
    /// A turning disc's source keeps the summed edge moments of each lattice and angle it integrated, one double per lattice node, up to
    /// <see cref="RotatingSource.KeptRates"/> sets (shared with its copies at other speeds). Measured (RotatingSourceMemoryTests: the managed heap
    /// after a full collection, a pole over a 100 x 100-cell lattice at 40 angles, 3 Dec 2026): 2.61 MB kept, 8.15 B per cell per kept set, the nodes outnumbering the cells
    /// by 2 %. On the coupling-cover-disc demo (0.7 mm cells over 160 mm, 52 k cells) a set is 0.42 MB, the 32 at most 13.6 MB.
    /// </summary>
    public const double RotatingRateBytesPerCellPerSet = 8.5;

    /// <summary>The turning disc's kept edge moments per cell of one solve, for <paramref name="rateSets"/> lattice-and-angle pairs integrated (0 for other parts).</summary>
    public static double RotatingRatesBytesPerCell(int rateSets) => Math.Min(Math.Max(rateSets, 0), RotatingSource.KeptRates) * RotatingRateBytesPerCellPerSet;

    /// <summary>What the screening of one part holds per cell of one solve: its geometries' kept models and Threads solves at once; with a thermal
    /// section (<paramref name="thermalOptionsPerGeometry"/> thicknesses x materials, 0 without) each geometry's thermal screen and temperatures too;
    /// for a turning disc, its source's kept edge moments of <paramref name="rotatingRateSets"/> lattices and angles.</summary>
    public static double ScreeningBytesPerCell(int geometries, int threads, int thermalOptionsPerGeometry = 0, int rotatingRateSets = 0) =>
        geometries * (ModelBytesPerCell + ThermalKept(thermalOptionsPerGeometry))
        + Math.Min(threads, geometries) * (SolveBytesPerCell + (thermalOptionsPerGeometry > 0 ? ThermalSolveBytesPerCell : 0))
        + RotatingRatesBytesPerCell(rotatingRateSets);

    /// <summary>
    /// What the coupled ranking of a moving part adds per cell of one solve, with <paramref name="paddedCellsPerCell"/> cells of the padded
    /// lattice per grid cell: every geometry's bound basis and reaction operator, and Threads bases grown to convergence. Measured
    /// 2026-12-02, `slotopt run` on the conveyor-rail demo (12 k cells, 25 geometries, 8 travel positions, padded 2.7 x): with the collector
    /// held to a hard heap limit (DOTNET_GCHeapHardLimit) the run fails at 300 MB in the ranking's bounds and completes at 375 MB (peak 414 MB
    /// resident, 1 or 2 threads). Unlimited, six runs peaked at 615, 616, 627 and 660 MB resident with 2 threads, but one 2-thread run at 927 MB
    /// and one 1-thread run at 803 MB: the collector grows its heap where memory is free, which no model of what the run holds bounds. This
    /// term, times the margin, covers the four typical peaks and the held heap (above 300 MB).
    /// </summary>
    public static double RankingBytesPerCell(int geometries, int threads, int travelPositions, double paddedCellsPerCell = PaddedCellsPerCellBound) =>
        travelPositions <= 0 ? 0
        : geometries * (travelPositions * RankingKeptBytesPerCellPerPosition + paddedCellsPerCell * OwnFieldBytesPerPaddedCell)
          + Math.Min(threads, geometries) * travelPositions * RankingSolveBytesPerCellPerPosition;

    /// <summary>The own-field solve per cell of its grid, the padded lattice at its bound (<see cref="PaddedCellsPerCellBound"/>).</summary>
    public const double OwnFieldBytesPerCellBound = ModelBytesPerCell + SolveBytesPerCell + GmresBytesPerCell + PaddedCellsPerCellBound * OwnFieldBytesPerPaddedCell;

    /// <summary>The run's screening of one part (and, for a moving source over <paramref name="travelPositions"/> positions, its coupled ranking).</summary>
    public static double Screening(long cellsPerSolve, int geometries, int threads, int thermalOptionsPerGeometry = 0, int travelPositions = 0, double paddedCellsPerCell = PaddedCellsPerCellBound,
        int rotatingRateSets = 0) =>
        WithMargin(cellsPerSolve * (ScreeningBytesPerCell(geometries, threads, thermalOptionsPerGeometry, rotatingRateSets) + RankingBytesPerCell(geometries, threads, travelPositions, paddedCellsPerCell)));

    /// <summary>What one geometry keeps of its thermal screening per cell (0 without a thermal section).</summary>
    public static double ThermalKept(int thermalOptionsPerGeometry) =>
        thermalOptionsPerGeometry > 0 ? ThermalKeptBytesPerCell + thermalOptionsPerGeometry * ThermalOptionBytesPerCell : 0;

    /// <summary>One plate solved with its own field (the confirmation, `slotopt plate`): one model, its solve, the FFT lattice and the GMRES basis.</summary>
    public static double OwnField(int nodesX, int nodesY) =>
        WithMargin((double)nodesX * nodesY * (ModelBytesPerCell + SolveBytesPerCell + GmresBytesPerCell) + PaddedCells(nodesX, nodesY) * OwnFieldBytesPerPaddedCell);

    /// <summary>Cells of the zero-padded FFT lattice of a grid of nodesX x nodesY nodes.</summary>
    public static double PaddedCells(int nodesX, int nodesY) =>
        (double)ReactionOperator.PaddedLength(Math.Max(nodesX - 2, 1)) * ReactionOperator.PaddedLength(Math.Max(nodesY - 2, 1));

    /// <summary>An estimate of what is held, with the runtime and the margin; with <paramref name="report"/> the report's bytes too.</summary>
    public static double WithMargin(double heldBytes, bool report = false) => Margin * (RuntimeBytes + heldBytes + (report ? ReportBytes : 0));

    /// <summary>
    /// Cells one solve may have so that <paramref name="bytesPerCell"/> a cell, the runtime (and the report) fit in <paramref name="limitBytes"/> with
    /// the margin: the inverse of <see cref="WithMargin"/>; 0 when even no cells do not fit.
    /// </summary>
    public static double CellsWithin(long limitBytes, double bytesPerCell, bool report = false)
    {
        var room = limitBytes / Margin - RuntimeBytes - (report ? ReportBytes : 0);
        return room <= 0 ? 0 : room / bytesPerCell;
    }

    /// <summary>"1.2 GB" or "350 MB".</summary>
    public static string Words(double bytes) => bytes >= 1e9 ? Numbers.Of(bytes / 1e9, "GB") : Numbers.Of(bytes / 1e6, "MB");
}
