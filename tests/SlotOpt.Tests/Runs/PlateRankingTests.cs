using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Input;
using SlotOpt.Plates;
using SlotOpt.Plates.Conductors;
using SlotOpt.Reports;
using SlotOpt.Reports.Json;
using SlotOpt.Runs;
using SlotOpt.Selection;

namespace SlotOpt.Tests.Runs;

/// <summary>
/// Issue 12, item 1: plates ranked with the model their validity figures call for before the selection sees them.
/// </summary>
public class PlateRankingTests
{
    // An invented test scenario (the input only): an aluminium clamp-plate shield in a 50 Hz leakage field. At 50 Hz the skin depth
    // of Al-1350 is about 12 mm, so the 6 and 10 mm plates are thin sheets whose own field matters (Rm of order 1-10 over their
    // loops) and the 25 mm plate is thick (t/delta about 2): no option, and not the current design, may be ranked resistance-limited.
    private const string Shield = """
        [problem]
        name = "Aluminium clamp-plate shield, 50 Hz (test)"
        currency = "EUR"
        objective = "lowest-owning-cost"

        [economics]
        value_per_watt = 5.0

        [[parts]]
        name = "shield"
        kind = "plate"
        width = "400 mm"
        height = "200 mm"
        thicknesses = ["6 mm", "10 mm", "25 mm"]
        materials = ["Al-1350"]
        processes = ["waterjet"]
        min_ligament = "20 mm"

        [parts.grid]
        cell = "10 mm"

        [parts.source]
        kind = "uniform_ac"
        peak_flux_density = "10 mT"
        frequency = "50 Hz"

        [[parts.slots]]
        pattern = "comb"
        edge = "bottom"
        pitch = ["50 mm", "100 mm"]
        depth = ["120 mm"]
        width = ["10 mm"]

        [parts.current]
        thickness = "10 mm"
        material = "Al-1350"
        process = "waterjet"
        """;

    private static RunResult RunShield() => DesignRun.Execute(ProblemReader.Read(Shield, "shield-test.toml"));

    // Every option and the current design carry own-field or thick, never the screen; and each ranked loss is the own-field (or
    // layered thick-plate) solver's loss for that plate, computed here directly through the plate models' facade on the part's grid:
    // the same computation, so 1e-9 relative. The resistance-limited loss of the same plate bounds it from above (A + j omega G R with
    // R symmetric positive semi-definite: every mode is damped by 1/(1 + j omega G k_i); the eddy currents' field opposes the applied one).
    [Fact]
    public void Aluminium_shield_at_50_Hz_is_ranked_with_its_own_field_everywhere()
    {
        var result = RunShield();
        var part = Assert.IsType<PlatePart>(result.Problem.Parts[0]);
        var field = Assert.IsType<PlateExcitation.AcField>(part.Excitation);
        var options = result.Parts[0].Options;
        Assert.NotEmpty(options);
        foreach (var o in options.Append(result.Parts[0].Reference))
        {
            var choice = (PlateChoice)o.Choice;
            Assert.NotNull(o.Model);
            Assert.NotEqual(SheetModelKind.ResistanceLimited, o.Model!.Kind);
            Assert.False(o.Model.IsScreenOnly, o.Id);
            Assert.Equal(choice.ThicknessM >= 0.025 ? "thick" : "own-field", o.Model.Name);
            var (geometry, _) = PlateGeometryFactory.Build(part.Outline, choice.Slots);
            var model = PlateOptions.BuildModel(part, geometry, EvaluationLimits.Default);
            var material = result.Problem.Library.GetConductor(choice.Material, part.Name);
            var sheet = new ConductingSheet(material.ConductivityAt(part.TemperatureK), choice.ThicknessM, material.RelativePermeability);
            var direct = PlateModels.SolveAc(model, field.Source, sheet);
            Assert.Equal(direct.MeanLossW, o.Loss.TotalW, 1e-9 * direct.MeanLossW);
            Assert.True(o.Loss.TotalW < direct.ResistanceLimitedLossW[0], $"{o.Id}: {o.Loss.TotalW} W not below the screen's {direct.ResistanceLimitedLossW[0]} W");
        }
        Assert.Equal(SelectionStatus.Optimal, result.Outcome.Status);
        var chosen = Assert.Single(result.Chosen!);
        var confirmed = result.Confirmation("shield")!;
        Assert.Equal(chosen.Loss.TotalW, confirmed.LossW, 1e-9 * chosen.Loss.TotalW);     // the chosen plate's confirmation is the ranking's number
        Assert.NotNull(confirmed.GridError);

        // the outputs name the model: the run's JSON for the chosen plate and its reference, and candidates.csv per option
        var json = ResultJson.From(result).Parts![0];
        Assert.Equal(chosen.Model!.Name, json.Model);
        Assert.Equal(confirmed.ModelName, json.Confirmed!.Model);
        Assert.Equal(confirmed.GridError!.Relative, json.Confirmed.DiscretisationError);
        Assert.Equal("own-field", json.Reference.Model);
        var csv = CandidatesCsv.Write(result).Split("\r\n", StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal("model", csv[0].Split(',')[^1]);                                          // the last column without [parts.thermal]
        Assert.All(csv.Skip(1), row => Assert.Contains(row.Split(',')[^1], new[] { "own-field", "thick" }));   // descriptions hold quoted commas: read from the end
    }

    // Moving poles, conveyor-like rail at Rm 0.14-0.30 (own-field): the ranking prunes by bounds, and the pruning changes nothing the selection
    // can see. Reference computation: the same part ranked without pruning (every option solved to convergence); the loss-cost front of the
    // feasible options and the lowest owning cost are then found by brute force over the options (no CP-SAT), for both.
    [Fact]
    public void Pruning_by_bounds_keeps_the_front_and_the_choice_of_the_full_ranking()
    {
        var problem = ProblemReader.Read(Rail, "rail-test.toml");
        var part = Assert.IsType<PlatePart>(problem.Parts[0]);
        var pruned = PlateOptions.Evaluate(part, problem.Library, problem.Shop, processCapped: false);
        var full = Full(part, problem);
        Assert.Contains(pruned, o => o.Model!.IsScreenOnly);                                    // the test exercises the pruning
        var vpw = problem.Economics.ValuePerWatt;
        string Best(IEnumerable<EvaluatedOption> os) => os.Where(o => o.IsFeasible).MinBy(o => o.BuildCost + vpw * o.Loss.TotalW)!.Id;
        Assert.Equal(Best(full), Best(pruned));
        Assert.Equal(Front(full), Front(pruned));
        var byId = full.ToDictionary(o => o.Id);
        foreach (var o in pruned.Where(o => Front(pruned).Contains(o.Id) || o.Id == Best(pruned)))
        {
            Assert.False(o.Model!.IsScreenOnly, o.Id);
            Assert.Equal("own-field", o.Model.Name);
            Assert.Equal(byId[o.Id].Loss.TotalW, o.Loss.TotalW, 1e-12 * o.Loss.TotalW);       // the same converged solve
        }
        foreach (var o in pruned.Where(o => o.Model!.IsScreenOnly))
            Assert.True(o.Loss.TotalW >= byId[o.Id].Loss.TotalW, $"{o.Id}: the screen's number is not an upper bound");
    }

    /// <summary>Ids of the feasible options on the loss-against-build-cost front (none cheaper and at most as lossy, with one strictly better).</summary>
    private static SortedSet<string> Front(IReadOnlyList<EvaluatedOption> options)
    {
        var feasible = options.Where(o => o.IsFeasible).ToList();
        return new SortedSet<string>(feasible.Where(b => !feasible.Any(a => a.BuildCost <= b.BuildCost && a.Loss.TotalW <= b.Loss.TotalW
            && (a.BuildCost < b.BuildCost || a.Loss.TotalW < b.Loss.TotalW))).Select(o => o.Id), StringComparer.Ordinal);
    }

    private static IReadOnlyList<EvaluatedOption> Full(PlatePart part, Problem problem)
    {
        var geometries = PlateOptions.SlotChoices(part).ToList();
        var solved = geometries.Select(g => PlateOptions.Solve(part, g)).ToList();
        var screened = new List<IReadOnlyList<EvaluatedOption>>();
        foreach (var s in solved)
        {
            var processes = s.Slots is null ? part.Processes : part.SlotFamilies[0].Processes;
            screened.Add((from t in part.ThicknessesM from m in part.Materials from p in processes
                select PlateOptions.Scale(part, s, t, problem.Library.GetConductor(m, part.Name), problem.Shop.Processes[p], problem.Shop)).ToList());
        }
        var heat = solved.Select(_ => (IReadOnlyDictionary<(double, string), SlotOpt.Plates.Thermal.TemperatureBracket.Outcome>)new Dictionary<(double, string), SlotOpt.Plates.Thermal.TemperatureBracket.Outcome>()).ToList();
        return PlateModelRanking.Rank(part, solved, screened, problem.Library, problem.Shop, heat, EvaluationLimits.Default, mayPrune: false, processCapped: false);
    }

    // An invented test scenario: a rail under a pole row at 1.5 m/s, Rm 0.14-0.30 for its thicknesses and alloys (own-field throughout).
    private const string Rail = """
        [problem]
        name = "Rail under poles (test)"
        currency = "EUR"
        objective = "lowest-owning-cost"

        [economics]
        value_per_watt = 4.0

        [[parts]]
        name = "rail"
        kind = "plate"
        width = "300 mm"
        height = "60 mm"
        thicknesses = ["6 mm", "10 mm"]
        materials = ["Al-6061-T6", "Al-6063-T6"]
        processes = ["laser", "milling"]
        max_drag = "30 N"
        min_ligament = "10 mm"

        [parts.grid]
        cell = "4 mm"

        [parts.source]
        kind = "moving_poles"
        pole = "rectangle"
        pole_width = "30 mm"
        pole_height = "30 mm"
        peak_flux_density = "0.35 T"
        count = 2
        pole_pitch = "45 mm"
        speed = "1.5 m/s"
        positions = 3
        average = "slot_pitch"

        [[parts.slots]]
        pattern = "comb"
        edge = "bottom"
        pitch = ["12 mm", "20 mm"]
        depth = ["35 mm", "45 mm"]
        width = ["4 mm"]
        """;
}
