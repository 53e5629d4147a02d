using System.CommandLine;
using System.Globalization;
using System.Text;
using SlotOpt.Tables;
using SlotOpt.Input;
using SlotOpt.Plates;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources.Rotation;
using SlotOpt.Reports;
using SlotOpt.Reports.Json;
using SlotOpt.Runs;

namespace SlotOpt.Cli;

/// <summary>`slotopt plate FILE [--json] [--map FILE.csv] [--out DIR [--force]]`: eddy-current loss (and drag) of one plate described in TOML, and its report.</summary>
public static class PlateCommand
{
    public static Command Build()
    {
        var file = new Argument<string>("file") { Description = "plate file (TOML): [plate], [grid], [source], [[cutout]], [[slots]], [[cut]], [thermal]" };
        var json = new Option<bool>("--json") { Description = "print one JSON object instead of text" };
        var map = new Option<string?>("--map") { HelpName = "FILE.csv", Description = "write the current-density map as CSV (x_m,y_m,j_a_per_m2)" };
        var outDir = new Option<string?>("--out") { HelpName = "DIR", Description = "Write the plate's report (index.html, summary.md, result.json, plots) into this folder" };
        var force = new Option<bool>("--force") { Description = "With --out: replace the folder if it holds an earlier report" };
        var model = new Option<string>("--model")
        {
            HelpName = "MODEL",
            Description = "the plate model: auto (the validity figures choose), resistance-limited, own-field (thin sheet with its own field), thick (layered, AC only) or thick-slab (a wide plain block under sliding magnets: the exact infinite slab)",
            DefaultValueFactory = _ => "auto",
        };
        model.AcceptOnlyFromAmong("auto", "resistance-limited", "own-field", "thick", "thick-slab");
        var speeds = new Option<string?>("--speeds")
        {
            HelpName = "RPM,RPM,...|auto",
            Description = "a turning disc: torque against speed at these speeds (rpm), or auto for a sweep up to past the torque's peak; the peak is found between the sweep's points",
        };
        var command = new Command("plate", "Eddy-current loss and drag of one conducting plate in a normal field, with the model its validity figures call for.");
        command.Arguments.Add(file);
        command.Options.Add(json);
        command.Options.Add(map);
        command.Options.Add(model);
        command.Options.Add(speeds);
        command.Options.Add(outDir);
        command.Options.Add(force);
        var limitOptions = new RunLimitOptions();
        limitOptions.AddTo(command, parallel: false, search: false);
        command.SetAction(parseResult => CommandRunner.Run(parseResult, (output, error) =>
        {
            var (reportDir, replace) = (parseResult.GetValue(outDir), parseResult.GetValue(force));
            var limits = limitOptions.Start(parseResult) with { WritesReport = reportDir is not null };
            using var deadline = limits.Deadline!;
            ReportOutput.Check(reportDir, replace, parseResult.GetValue(file)!);
            var plate = PlateFileReader.Read(parseResult.GetValue(file)!);
            var evaluation = deadline.Run("the plate solve", () => PlateFileEvaluation.Evaluate(plate, forcedKind: ModelKind(parseResult.GetValue(model)!), limits: limits,
                discSweep: Sweep(parseResult.GetValue(speeds))));
            var mapPath = parseResult.GetValue(map);
            if (!string.IsNullOrEmpty(mapPath)) WriteMap(evaluation.Result.Map, mapPath);
            output.Write(parseResult.GetValue(json) ? PlateJson.From(evaluation).Serialize() : Text(evaluation));
            if (reportDir is not null)
            {
                var figures = PlateFigures.Of(evaluation);
                if (ReportOutput.Write(reportDir, replace, deadline, folder => ReportWriter.Write(evaluation, figures, DateTimeOffset.UtcNow, folder)) is { } signalExit)
                {
                    error.WriteLine("interrupted: the report was not written");
                    return signalExit;
                }
                error.WriteLine($"report: {Path.Combine(reportDir, ReportWriter.HtmlFile)}");
            }
            return ExitCodes.Success;
        }));
        return command;
    }

    /// <summary>The --speeds value: null without it, the default sweep for auto, else the listed speeds (rpm) in rad/s.</summary>
    private static DiscSweep? Sweep(string? value)
    {
        if (value is null) return null;
        if (value.Trim() == "auto") return new DiscSweep(null);
        var speeds = new List<double>();
        foreach (var word in value.Split(',', StringSplitOptions.TrimEntries))
        {
            if (!double.TryParse(word, NumberStyles.Float, CultureInfo.InvariantCulture, out var rpm) || !(rpm > 0) || !double.IsFinite(rpm))
                throw new InputException($"--speeds: '{word}' is not a positive speed in rpm (give RPM,RPM,... or auto)");
            speeds.Add(RotationalSpeed.RadPerSFromRpm(rpm));
        }
        return new DiscSweep(speeds);
    }

    /// <summary>The --model word as a model kind; null for auto.</summary>
    private static SheetModelKind? ModelKind(string word) => word switch
    {
        "resistance-limited" => SheetModelKind.ResistanceLimited,
        "own-field" => SheetModelKind.ThinSheetReaction,
        "thick" => SheetModelKind.BeyondThinSheet,
        "thick-slab" => SheetModelKind.ThickSlab,
        _ => null,
    };

    private static string Text(PlateFileEvaluation e)
    {
        var r = e.Result;
        var c = CultureInfo.InvariantCulture;
        var s = new StringBuilder();
        s.AppendLine(c, $"plate {e.Case.Path}: sheet conductance {Numbers.Of(e.Case.Sheet.SheetConductanceS, "S")}");
        s.AppendLine(c, $"  model                {ReactionModelChoice.Name(e.Choice.Kind)}: {e.Choice.Reason}");
        s.AppendLine(c, $"  loss                 {Numbers.Watts(e.LossW)}{(e.Case.MovingSource is null && e.Case.Rotation is null ? (e.Case.Approach is null ? " (time average)" : "") : $" (mean over {e.Case.AveragedOver})")}");
        if (e.TorqueNm is { } torque && e.Case.Rotation is { } rotation)
            s.AppendLine(c, $"  torque               {Numbers.Of(torque, "N m")} at {Numbers.Of(RotationalSpeed.RpmFromRadPerS(rotation.Source.AngularSpeedRadPerS), "rpm")} ({rotation.Source.Words})");
        if (e.SpeedCurve is { } speedCurve)
        {
            s.AppendLine(c, $"  torque against speed ({e.Case.Rotation!.Source.Words}):");
            foreach (var p in speedCurve.Points) s.AppendLine(c, $"    {Numbers.Of(p.Rpm, "rpm"),-16} {Numbers.Of(p.TorqueNm, "N m"),-14} loss {Numbers.Watts(p.LossW),-12} {p.Model}");
            if (speedCurve.Peak is { } pk)
                s.AppendLine(c, $"  torque peak          {Numbers.Of(pk.TorqueNm, "N m")} at {Numbers.Of(pk.Rpm, "rpm")} ({pk.Model}; golden-section search to {DiscSpeedCurve.PeakSpeedTolerance:P0} in speed, {speedCurve.PeakSearch.Count} solves)");
            else s.AppendLine("  torque peak          not bracketed: the largest torque is at an end of the speeds given (extend them, or --speeds auto)");
        }
        if (e.ApproachCurve is { } curve)
            foreach (var p in curve) s.AppendLine(c, $"  damping force        {Numbers.Newtons(p.ForceN)} at {Numbers.Of(p.GapM * 1e3, "mm")} gap, approaching at {Numbers.Of(e.Case.Approach!.SpeedMPerS, "m/s")}");
        else if (e.MeanDragN is { } drag) s.AppendLine(c, $"  drag                 {Numbers.Newtons(drag)}{(e.Case.Rotation is null ? "" : " along the magnets' path")} (min {Numbers.Newtons(e.DragPerOffsetN.Min())}, max {Numbers.Newtons(e.DragPerOffsetN.Max())})");
        if (e.SlabSpeedCurve is { } slab)
        {
            s.AppendLine(c, $"  lift                 {Numbers.Newtons(slab.First(f => f.SpeedMPerS == e.Case.MovingSource!.SpeedMPerS).LiftN)} (pushing the magnets away from the block)");
            s.AppendLine(c, $"  against speed        (thick-slab, wavenumber quadrature error below {Numbers.Sig(slab.Max(f => f.RelativeErrorEstimate))})");
            foreach (var f in slab) s.AppendLine(c, $"    {Numbers.Of(f.SpeedMPerS, "m/s"),-14} drag {Numbers.Newtons(f.DragN),-12} lift {Numbers.Newtons(f.LiftN),-12} loss {Numbers.Watts(f.LossW)}");
        }
        if (e.GridError is { } grid) s.AppendLine(c, $"  grid error           {Numbers.EstimatePercent(grid.Relative)} of loss{(e.MeanDragN is null ? "" : " and drag")} ({grid.Description})");
        s.AppendLine(c, $"  current density      peak {Numbers.Sig(r.PeakCurrentDensityAPerM2 / 1e6)} A/mm2, rms {Numbers.Sig(r.RmsCurrentDensityAPerM2 / 1e6)} A/mm2");
        s.Append($"  magnetic Reynolds    {Numbers.Sig(r.Validity.ReynoldsNumber)}");
        s.AppendLine(r.Validity.ThicknessToSkinDepth is { } td ? $", thickness/skin depth {Numbers.Sig(td)}" : "");
        PlateTemperatureOutput.AppendText(s, e);
        s.AppendLine(c, $"  solver               {r.Unknowns} unknowns, {e.TotalIterations} iterations, residual {Numbers.Sig(e.RelativeResidual)}, {Numbers.Of(e.SetupSeconds + e.SolveSeconds, "s")}");
        foreach (var w in r.Validity.Warnings) s.AppendLine($"  warning: {w}");
        foreach (var n in r.Notes) s.AppendLine($"  note: {n}");
        return s.ToString();
    }

    private static void WriteMap(CurrentDensityMap map, string path)
    {
        var c = CultureInfo.InvariantCulture;
        var s = new StringBuilder("x_m,y_m,j_a_per_m2\n");
        for (int j = 0; j < map.YM.Length; j++)
            for (int i = 0; i < map.XM.Length; i++)
                s.Append(c, $"{map.XM[i]:R},{map.YM[j]:R},{map.ValueAPerM2[j, i]:G6}\n");
        string temp = path + ".tmp";
        try
        {
            File.WriteAllText(temp, s.ToString());
            File.Move(temp, path, overwrite: true);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            throw new InputException($"--map {path}: cannot write the map ({ex.Message})");
        }
    }
}
