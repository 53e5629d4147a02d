using SlotOpt.Design;
using SlotOpt.Input;
using SlotOpt.Runs;
using SlotOpt.Tests.Selection;

namespace SlotOpt.Tests.Hardening;

public class ResourceLimitTests
{
    private static Problem TiePlate(string? cell = null)
    {
        var path = Path.Combine(AppContext.BaseDirectory, "problems", "tie-plate-50hz.toml");
        var text = File.ReadAllText(path);
        if (cell is not null) text = text.Replace("cell = \"2.5 mm\"", $"cell = \"{cell}\"");
        return ProblemReader.Read(text, path);
    }

    // 900 x 150 mm at 0.2 mm cells is 3.38e6 cells (within the solver's cell limit); the memory model (MemoryModel: 13 slot
    // geometries kept at 210 B per cell plus, with the demo's [parts.thermal], 160 + 6 x 9 B of thermal screen and temperatures,
    // two solves at work at 150 + 320 B per cell, times 1.25) gives about 27 GB, above a 4 GiB limit: refused before any grid
    // is built, with the estimate.
    [Fact]
    public void A_grid_beyond_the_memory_limit_stops_the_run_with_the_estimate()
    {
        var limits = new EvaluationLimits { Threads = 2, MaxMemoryBytes = 4L << 30 };
        var e = Assert.Throws<ResourceLimitException>(() => DesignRun.Execute(TiePlate("0.2 mm"), limits: limits));
        Assert.Contains("3375000 cells", e.Message);
        Assert.Contains("--max-memory", e.Message);
    }

    [Fact]
    public void A_run_past_its_time_limit_stops_with_a_clear_message()
    {
        var e = Assert.Throws<ResourceLimitException>(() => DesignRun.Execute(TiePlate(), limits: new EvaluationLimits { MaxSeconds = 0 }));
        Assert.Contains("--time-limit", e.Message);
    }

    // Reproducibility across thread counts: the plate solves are independent, so one or two at a time give
    // the same numbers to the last bit.
    [Fact]
    public void One_and_two_threads_give_identical_results()
    {
        var one = DesignRun.Execute(TiePlate(), limits: new EvaluationLimits { Threads = 1 });
        var two = DesignRun.Execute(TiePlate(), limits: new EvaluationLimits { Threads = 2 });
        Assert.Equal(one.Parts[0].Options.Select(o => (o.Id, o.Loss.TotalW, o.BuildCost)), two.Parts[0].Options.Select(o => (o.Id, o.Loss.TotalW, o.BuildCost)));
        Assert.Equal(one.Outcome.Design!.CandidateIds, two.Outcome.Design!.CandidateIds);
        Assert.Equal(one.Outcome.Front!.Points.Select(p => (p.BuildCostCents, p.LossMilliwatts)), two.Outcome.Front!.Points.Select(p => (p.BuildCostCents, p.LossMilliwatts)));
    }
}
