using SlotOpt.Plates.OwnField;

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
    /// (2830 - 150) / 13 = about 210 B (was 400 B before the structured multigrid stopped storing the CSR matrix). The plate
    /// temperature solves have their own terms (<see cref="ThermalKeptBytesPerCell"/> and the two after it).
    /// </summary>
    public const double ModelBytesPerCell = 210;

    /// <summary>One solve at work beyond the model it keeps: the four CG vectors and the right-hand sides (8 B each, a few more for the sweep).</summary>
    public const double SolveBytesPerCell = 150;

    /// <summary>
    /// With a thermal section, what each slot geometry keeps for the screening of its thicknesses and materials: the thermal network with
    /// its cached multigrid (ThermalScreen; the kept temperatures reach them). Measured 2026-12-02 on the tie-plate demo's 21.6 k-cell grid
    /// (ThermalMemoryTests, the managed heap after a full collection): 148 B per cell; 152 B since the multigrid takes one unknown per node (its
    /// node-to-unknown map, 4 B a node, kept with it; 2 Dec 2026 23:12 UTC).
    /// </summary>
    public const double ThermalKeptBytesPerCell = 160;

    /// <summary>Each thickness and material's temperature kept for the report: one double per node (nodes slightly outnumber cells); measured 8.2 B per cell.</summary>
    public const double ThermalOptionBytesPerCell = 9;

    /// <summary>
    /// One thermal solve at work: everything its first solve on a geometry allocates (network, multigrid, the iteration's vectors, the
    /// answer), a bound on what it holds at once. Measured 307 B per cell (ThermalMemoryTests, GC.GetTotalAllocatedBytes); 267 B since the
    /// conjugate gradients keep their vectors across the iteration's steps (2 Dec 2026 23:12 UTC). End to end,
    /// `slotopt run` on the tie-plate demo with --out (13 geometries x 6 thicknesses and materials, two threads, 2026-12-02): the thermal
    /// section raised the peak resident size from 261 to 411 MB at 21.6 k cells and from 592 to 856 MB at 86.4 k cells, 1.8 kB per added
    /// cell, within this model's 13 x (160 + 6 x 9) + 2 x 320 = 3.4 kB.
    /// </summary>
    public const double ThermalSolveBytesPerCell = 320;

    /// <summary>
    /// The own-field operator per cell of its zero-padded lattice, 16 B (a real and an imaginary double) for each of: the
    /// transform buffer, the reaction spectrum, and for a moving source its x-difference and the preconditioner's spectral
    /// factor. Measured with the GMRES basis below (before the basis was allocated as used): `slotopt plate` on 80 k and 320 k
    /// cells (padded 0.5 M and 2.1 M) peaks at 147 MB and 398 MB, 1.05 kB per added cell; this model is above that, as it counts the whole GMRES basis.
    /// </summary>
    public const double OwnFieldBytesPerPaddedCell = 4 * 16;

    /// <summary>
    /// The own-field solve's GMRES basis per unknown, at most restart + 1 complex vectors (16 B each): the bound, as the basis
    /// is allocated only as far as the iteration reaches (13-16 vectors in the benches).
    /// </summary>
    public const double GmresBytesPerCell = (ComplexGmresRestart + 1) * 16;

    private const int ComplexGmresRestart = SlotOpt.Numerics.ComplexGmres.DefaultRestart;

    /// <summary>Factor over the fitted estimate: the garbage collector's headroom (a collected grid is not yet returned) and the scatter of the measurements.</summary>
    public const double Margin = 1.25;

    /// <summary>The run's screening of one part: its geometries' kept models and Threads solves at once; with a thermal section
    /// (<paramref name="thermalOptionsPerGeometry"/> thicknesses x materials, 0 without) each geometry's thermal screen and temperatures too.</summary>
    public static double Screening(long cellsPerSolve, int geometries, int threads, int thermalOptionsPerGeometry = 0) =>
        Margin * (RuntimeBytes + cellsPerSolve * (geometries * (ModelBytesPerCell + ThermalKept(thermalOptionsPerGeometry))
            + Math.Min(threads, geometries) * (SolveBytesPerCell + (thermalOptionsPerGeometry > 0 ? ThermalSolveBytesPerCell : 0))));

    /// <summary>What one geometry keeps of its thermal screening per cell (0 without a thermal section).</summary>
    public static double ThermalKept(int thermalOptionsPerGeometry) =>
        thermalOptionsPerGeometry > 0 ? ThermalKeptBytesPerCell + thermalOptionsPerGeometry * ThermalOptionBytesPerCell : 0;

    /// <summary>One plate solved with its own field (the confirmation, `slotopt plate`): one model, its solve, the FFT lattice and the GMRES basis.</summary>
    public static double OwnField(int nodesX, int nodesY)
    {
        double cells = (double)nodesX * nodesY;
        double padded = (double)ReactionOperator.PaddedLength(Math.Max(nodesX - 2, 1)) * ReactionOperator.PaddedLength(Math.Max(nodesY - 2, 1));
        return Margin * (RuntimeBytes + cells * (ModelBytesPerCell + SolveBytesPerCell + GmresBytesPerCell) + padded * OwnFieldBytesPerPaddedCell);
    }

    /// <summary>"1.2 GB" or "350 MB".</summary>
    public static string Words(double bytes) => bytes >= 1e9 ? $"{bytes / 1e9:F1} GB" : $"{bytes / 1e6:F0} MB";
}
