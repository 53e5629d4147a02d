namespace SlotOpt.Plates;

/// <summary>
/// Grid-error estimate of a plate result by Richardson extrapolation from the solve on cells of h and one on
/// cells of 2h: error of the fine value ~ (P_h - P_2h) / (2^p - 1) (L. F. Richardson, "The deferred approach to
/// the limit", Phil. Trans. R. Soc. A 226:299-361, 1927). p = 1 is taken, the order of the cut cells on curved and
/// slanted outlines and of the slot corners (the slowest the scheme shows; smooth cases converge at p = 2, for
/// which this overstates the error threefold): the estimate errs on the safe side. Relative = |P_h - P_2h| / |P_h|.
/// </summary>
public sealed record DiscretisationError(double Relative, double FineValue, double CoarseValue, double CellM, double CoarseCellM)
{
    /// <summary>Above this a note asks for a finer cell (common practice, no source: the house's 1 % accuracy target).</summary>
    public const double WarningThreshold = 0.01;

    public static DiscretisationError FromTwoGrids(double fine, double coarse, double cellM, double coarseCellM)
    {
        if (!double.IsFinite(fine) || !double.IsFinite(coarse)) throw new NumericalFailureException($"the grid-error estimate got a non-finite value ({fine}, {coarse})");
        double relative = fine == 0 ? (coarse == 0 ? 0 : 1) : Math.Abs(fine - coarse) / Math.Abs(fine);   // (P_h - P_2h) / (2^1 - 1), relative
        return new DiscretisationError(relative, fine, coarse, cellM, coarseCellM);
    }

    public bool IsLarge => Relative > WarningThreshold;

    public string Warning =>
        $"estimated grid error {Relative:P1} (Richardson, {CellM * 1e3:G3} mm against {CoarseCellM * 1e3:G3} mm cells) exceeds {WarningThreshold:P0}: give a smaller [grid] cell";
}
