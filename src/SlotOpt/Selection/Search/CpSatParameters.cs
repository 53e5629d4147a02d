using System.Globalization;

namespace SlotOpt.Selection.Search;

/// <summary>
/// The CP-SAT parameter text. A misspelt parameter name aborts the process natively (no exception to
/// catch), so the names are constants here and nowhere else is such text written.
/// </summary>
internal static class CpSatParameters
{
    private const string NumWorkers = "num_workers";
    private const string RandomSeed = "random_seed";
    private const string MaxDeterministicTime = "max_deterministic_time";
    private const string MaxTimeInSeconds = "max_time_in_seconds";

    /// <summary>One worker: with a fixed seed the search, and so its answer among ties, repeats exactly.</summary>
    private const int Workers = 1;

    public static string Format(CpSatSettings settings)
    {
        var budget = settings.MaxDeterministicTimeSeconds;
        if (!double.IsFinite(budget) || budget <= 0)
            throw new ArgumentOutOfRangeException(nameof(settings), budget, "deterministic-time budget must be finite and positive");
        var text = string.Create(CultureInfo.InvariantCulture,
            $"{NumWorkers}:{Workers} {RandomSeed}:{settings.RandomSeed} {MaxDeterministicTime}:{budget:R}");
        if (settings.MaxWallSeconds is not { } wall) return text;
        if (!double.IsFinite(wall) || wall <= 0)
            throw new ArgumentOutOfRangeException(nameof(settings), wall, "wall-time cap must be finite and positive");
        return text + string.Create(CultureInfo.InvariantCulture, $" {MaxTimeInSeconds}:{wall:R}");
    }
}
