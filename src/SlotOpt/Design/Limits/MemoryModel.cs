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
    /// temperature solve is not in this model: with the demo's [parts.thermal] the same runs peak at 681 MB and 2.97 GB.
    /// </summary>
    public const double ModelBytesPerCell = 210;

    /// <summary>One solve at work beyond the model it keeps: the four CG vectors and the right-hand sides (8 B each, a few more for the sweep).</summary>
    public const double SolveBytesPerCell = 150;

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

    /// <summary>The run's screening of one part: its geometries' kept models and Threads solves at once.</summary>
    public static double Screening(long cellsPerSolve, int geometries, int threads) =>
        Margin * (RuntimeBytes + cellsPerSolve * (geometries * ModelBytesPerCell + Math.Min(threads, geometries) * SolveBytesPerCell));

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
