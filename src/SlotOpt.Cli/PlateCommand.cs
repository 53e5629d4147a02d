using System.CommandLine;
using System.Globalization;
using System.Text;
using System.Text.Json;
using SlotOpt.Tables;
using SlotOpt.Input;
using SlotOpt.Plates;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Reports;
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
            var limits = limitOptions.Start(parseResult);
            using var deadline = limits.Deadline!;
            var (reportDir, replace) = (parseResult.GetValue(outDir), parseResult.GetValue(force));
            ReportOutput.Check(reportDir, replace, parseResult.GetValue(file)!);
            var plate = PlateFileReader.Read(parseResult.GetValue(file)!);
            var evaluation = deadline.Run("the plate solve", () => PlateFileEvaluation.Evaluate(plate, forcedKind: ModelKind(parseResult.GetValue(model)!), limits: limits,
                discSweep: Sweep(parseResult.GetValue(speeds))));
            var mapPath = parseResult.GetValue(map);
            if (!string.IsNullOrEmpty(mapPath)) WriteMap(evaluation.Result.Map, mapPath);
            output.Write(parseResult.GetValue(json) ? Json(evaluation) : Text(evaluation));
            if (reportDir is not null)
            {
                var figures = PlateFigures.Of(evaluation);
                if (ReportOutput.Write(reportDir, replace, deadline, folder => PlateReportWriter.Write(evaluation, figures, Json(evaluation), DateTimeOffset.UtcNow, folder)) is { } signalExit)
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
            speeds.Add(rpm * 2 * Math.PI / 60);
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

    private static string Json(PlateFileEvaluation e)
    {
        var r = e.Result;
        var heating = e.Heating;
        var t = heating?.Temperature;
        var limit = e.Case.Thermal?.Limit;
        return new PlateJson(
            e.Case.Path,
            ReactionModelChoice.Name(e.Choice.Kind),
            e.Choice.Reason,
            e.LossW,
            e.MeanDragN,
            e.GridError?.Relative,
            e.GridError?.MethodName,
            e.Case.MovingSource is null && e.Case.Rotation is null ? null : e.Case.AveragedOver,
            e.OffsetsXM,
            e.DragPerOffsetN,
            e.LossPerOffsetW,
            r.PeakCurrentDensityAPerM2,
            r.RmsCurrentDensityAPerM2,
            r.Validity.ReynoldsNumber,
            r.Validity.ThicknessToSkinDepth,
            e.Case.Sheet.SheetConductanceS,
            r.Unknowns,
            e.TotalIterations,
            e.RelativeResidual,
            t?.MaxRiseK,
            t?.MeanRiseK,
            t?.HottestK,
            t is null ? null : [t.HottestXM, t.HottestYM],
            t?.AmbientK,
            t?.ConvectionCoefficientWPerM2K,
            t?.ConvectedW,
            t?.RadiatedW,
            t?.EdgeW,
            heating?.LossWeightedTemperatureK,
            heating is null ? null : [heating.ResistivityMinK, heating.ResistivityMaxK],
            heating?.CouplingIterations,
            t is not null && limit is { IsSet: true } ? limit.Breach(t) is not null : null,
            r.Validity.Warnings,
            r.Notes)
        {
            TorqueNM = e.TorqueNm,
            RotationSpeedRpm = e.Case.Rotation is { } rotation ? rotation.Source.AngularSpeedRadPerS * 60 / (2 * Math.PI) : null,
            ApproachSpeedMPerS = e.Case.Approach?.SpeedMPerS,
            ApproachGapsM = e.ApproachCurve?.Select(p => p.GapM).ToList(),
            ApproachForceN = e.ApproachCurve?.Select(p => p.ForceN).ToList(),
            SlabSpeedsMPerS = e.SlabSpeedCurve?.Select(f => f.SpeedMPerS).ToList(),
            SlabDragN = e.SlabSpeedCurve?.Select(f => f.DragN).ToList(),
            SlabLiftN = e.SlabSpeedCurve?.Select(f => f.LiftN).ToList(),
            SlabLossW = e.SlabSpeedCurve?.Select(f => f.LossW).ToList(),
            SlabQuadratureError = e.SlabSpeedCurve?.Max(f => f.RelativeErrorEstimate),
            TorqueCurve = e.SpeedCurve?.Points.Select(p => DiscSpeed(p, e)).ToList(),
            TorquePeak = e.SpeedCurve?.Peak is { } peak ? DiscSpeed(peak, e) : null,
        }.Serialize();
    }

    private static DiscSpeedJson DiscSpeed(DiscSpeedPoint p, PlateFileEvaluation e) =>
        new(p.Rpm, p.TorqueNm, p.TorqueNm / e.Case.Rotation!.Source.SourceRadiusM, p.LossW, p.Model);

    private static string Text(PlateFileEvaluation e)
    {
        var r = e.Result;
        var c = CultureInfo.InvariantCulture;
        var s = new StringBuilder();
        s.AppendLine(c, $"plate {e.Case.Path}: sheet conductance {e.Case.Sheet.SheetConductanceS:G4} S");
        s.AppendLine(c, $"  model                {ReactionModelChoice.Name(e.Choice.Kind)}: {e.Choice.Reason}");
        s.AppendLine(c, $"  loss                 {Numbers.Watts(e.LossW)}{(e.Case.MovingSource is null && e.Case.Rotation is null ? (e.Case.Approach is null ? " (time average)" : "") : $" (mean over {e.Case.AveragedOver})")}");
        if (e.TorqueNm is { } torque && e.Case.Rotation is { } rotation)
            s.AppendLine(c, $"  torque               {Numbers.Of(torque, "N m")} at {Numbers.Of(rotation.Source.AngularSpeedRadPerS * 60 / (2 * Math.PI), "rpm")} ({rotation.Source.Words})");
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
            s.AppendLine(c, $"  against speed        (thick-slab, wavenumber quadrature error below {slab.Max(f => f.RelativeErrorEstimate):E1})");
            foreach (var f in slab) s.AppendLine(c, $"    {Numbers.Of(f.SpeedMPerS, "m/s"),-14} drag {Numbers.Newtons(f.DragN),-12} lift {Numbers.Newtons(f.LiftN),-12} loss {Numbers.Watts(f.LossW)}");
        }
        if (e.GridError is { } grid) s.AppendLine(c, $"  grid error           {grid.Relative:P2} of loss{(e.MeanDragN is null ? "" : " and drag")} ({grid.Description})");
        s.AppendLine(c, $"  current density      peak {Numbers.Sig(r.PeakCurrentDensityAPerM2 / 1e6)} A/mm2, rms {Numbers.Sig(r.RmsCurrentDensityAPerM2 / 1e6)} A/mm2");
        s.Append(c, $"  magnetic Reynolds    {r.Validity.ReynoldsNumber:G3}");
        s.AppendLine(r.Validity.ThicknessToSkinDepth is { } td ? string.Create(c, $", thickness/skin depth {td:G3}") : "");
        PlateTemperatureOutput.AppendText(s, e);
        s.AppendLine(c, $"  solver               {r.Unknowns} unknowns, {e.TotalIterations} iterations, residual {e.RelativeResidual:E1}, {e.SetupSeconds + e.SolveSeconds:F2} s");
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
