using System.Globalization;
using SlotOpt.Runs;

namespace SlotOpt.Reports;

/// <summary>
/// A report's only line that changes from run to run: the time it was generated (from the caller's clock, so a test can fix it)
/// and the wall time the work took. Everything else depends on the problem (or the plate file) alone.
/// </summary>
public static class ReportStamp
{
    public static string Line(RunResult r, DateTimeOffset generatedAt) => string.Create(CultureInfo.InvariantCulture,
        $"Generated {generatedAt.UtcDateTime:yyyy-MM-dd HH:mm:ss} UTC by slotopt run; evaluation took {r.EvaluationSeconds:0.0} s, the selection search {r.Outcome.Effort.WallSeconds:0.00} s.");

    public static string Line(PlateFileEvaluation e, DateTimeOffset generatedAt) => string.Create(CultureInfo.InvariantCulture,
        $"Generated {generatedAt.UtcDateTime:yyyy-MM-dd HH:mm:ss} UTC by slotopt plate; the solve took {e.SetupSeconds + e.SolveSeconds:0.0} s.");
}
