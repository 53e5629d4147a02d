using System.Globalization;
using SlotOpt.Reports.Plots;
using SlotOpt.Runs;
using SlotOpt.Tables;

namespace SlotOpt.Reports;

/// <summary>
/// What the plate report says, in order: a one-line result (with the model that made it and its grid error), the numbers
/// (each with its model), the curve of the case's motion as a table, the plots, the solver's warnings and notes, the
/// cautions, and the files. Numbers follow <see cref="Numbers"/>, as the plate command's text does, so the two agree.
/// </summary>
public static class PlateReportContent
{
    private static readonly CultureInfo Ci = CultureInfo.InvariantCulture;

    /// <summary>Below this ambient (kelvin) the report gives the cryogenic cautions: about -150 °C, where cryogenics is taken to begin (common practice, no source).</summary>
    public const double CryogenicBelowK = 123;

    /// <summary>Above this hottest temperature (kelvin) the report gives the hot-part caution: 100 °C (common practice, no source).</summary>
    public const double HotAboveK = 373.15;

    public static ReportDocument Build(PlateFileEvaluation e, PlateFigures f, PlateReportFigures figures, string stampLine)
    {
        var blocks = new List<ReportBlock> { new StampLine(stampLine), new Verdict(ResultLine(e, f)) };
        Numbers(e, f, blocks);
        MotionTable(f, blocks);
        Plots(figures, blocks);
        Remarks(e, blocks);
        Cautions(e, f, blocks);
        Files(figures, blocks);
        return new ReportDocument($"Plate {Path.GetFileName(e.Case.Path)}", blocks);
    }

    private static string N(double value) => Tables.Numbers.Sig(value);

    /// <summary>"grid error 0.7 % (grid convergence index from 0.5, 1 and 2 mm cells, ...)" or why there is none.</summary>
    private static string GridWords(PlateFigures f) => f.GridErrorRelative is { } g
        ? $"grid error {Tables.Numbers.EstimatePercent(g)} ({f.GridErrorWords})"
        : "no grid-error estimate (the grid cannot be coarsened to twice its cell, or the plate is solved with its temperature)";

    /// <summary>The one line at the top: what the plate does under its source, from which model, with its grid error.</summary>
    private static string ResultLine(PlateFileEvaluation e, PlateFigures f)
    {
        var loss = Tables.Numbers.Watts(e.LossW);
        var what = f switch
        {
            { Approach: { } a } => $"damping force {Tables.Numbers.Newtons(a.Points[0].ForceN)} at a {N(a.Points[0].GapM * 1e3)} mm gap"
                + (a.Points.Count > 1 ? $", {Tables.Numbers.Newtons(a.Points[^1].ForceN)} at {N(a.Points[^1].GapM * 1e3)} mm" : "")
                + $", the magnets approaching at {Tables.Numbers.Of(a.SpeedMPerS, "m/s")} (loss {loss} at the first gap)",
            { DiscAngle: { } d } => $"braking torque {Tables.Numbers.Of(d.MeanTorqueNm, "N m")} at {Tables.Numbers.Of(d.SpeedRpm, "rpm")}, loss {loss}, means over {d.AveragedOver}",
            { Travel: { } t } => $"drag {Tables.Numbers.Newtons(t.MeanDragN)} at {Tables.Numbers.Of(t.SpeedMPerS, "m/s")}, loss {loss}, means over {t.AveragedOver}",
            _ => $"loss {loss} (time average)",
        };
        return $"Result: {what}; {f.Model} model, {GridWords(f)}.";
    }

    private static void Numbers(PlateFileEvaluation e, PlateFigures f, List<ReportBlock> b)
    {
        var r = e.Result;
        b.Add(new Heading("The numbers"));
        b.Add(new Paragraph($"The plate: sheet conductance (conductivity times thickness) {N(e.Case.Sheet.SheetConductanceS)} S, {N(e.Case.Sheet.ThicknessM * 1e3)} mm thick; the source: {SourceWords(e)}. "
            + $"Model of the loss{(e.MeanDragN is null ? "" : " and force")} figures: {f.ModelReason}."));
        var rows = new List<IReadOnlyList<string>>();
        void Row(string quantity, string value, string model) => rows.Add([quantity, value, model]);
        var averaged = e.Case.MovingSource is null && e.Case.Rotation is null ? (e.Case.Approach is null ? "time average" : "at the first gap") : $"mean over {e.Case.AveragedOver}";
        Row($"loss ({averaged})", Tables.Numbers.Watts(e.LossW), f.Model);
        if (f.DiscAngle is { } disc)
        {
            Row($"braking torque (mean over {disc.AveragedOver})", Tables.Numbers.Of(disc.MeanTorqueNm, "N m"), f.Model);
            Row("force along the magnets' path (torque over their radius)", Tables.Numbers.Newtons(e.MeanDragN!.Value), f.Model);
        }
        else if (f.Travel is { } travel)
            Row($"drag (mean over {travel.AveragedOver}; min {Tables.Numbers.Newtons(travel.DragN.Min())}, max {Tables.Numbers.Newtons(travel.DragN.Max())})", Tables.Numbers.Newtons(travel.MeanDragN), f.Model);
        else if (f.Approach is { } approach)
            Row($"damping force at the first gap, {N(approach.Points[0].GapM * 1e3)} mm", Tables.Numbers.Newtons(approach.Points[0].ForceN), f.Model);
        Row("grid error of loss and force (relative)", f.GridErrorRelative is { } g ? Tables.Numbers.EstimatePercent(g) : "none", f.GridErrorWords ?? "");
        Row("peak current density", Tables.Numbers.CurrentDensity(r.PeakCurrentDensityAPerM2), f.MapModel);
        Row("RMS current density", Tables.Numbers.CurrentDensity(r.RmsCurrentDensityAPerM2), f.MapModel);
        Row("magnetic Reynolds number", N(r.Validity.ReynoldsNumber), "validity figure");
        if (r.Validity.ThicknessToSkinDepth is { } td) Row("thickness over skin depth", N(td), "validity figure");
        if (f.Temperature is { } t)
        {
            Row("hottest temperature", Tables.Numbers.Celsius(t.HottestK), "thermal network, resistance-limited loss");
            Row("temperature rise, hottest and mean", $"{Tables.Numbers.Kelvin(t.MaxRiseK)}, {Tables.Numbers.Kelvin(t.MeanRiseK)}", $"over {Tables.Numbers.Celsius(t.AmbientK)} ambient");
            Row("temperature limit", t.Breach ?? (t.LimitSet ? "within" : "none set"), "");
        }
        Row("solver", $"{r.Unknowns} unknowns, {e.TotalIterations} iterations, residual {e.RelativeResidual.ToString("E1", Ci)}", "");
        b.Add(new Table(["quantity", "value", "model"], rows, [false, true, false]));
    }

    private static string SourceWords(PlateFileEvaluation e) =>
        e.Case.Rotation is { } rotation ? $"{rotation.Source.Words} over a turning disc"
        : e.Case.Approach is { } approach ? $"{approach.Magnets.Magnets.Count} magnet{(approach.Magnets.Magnets.Count == 1 ? "" : "s")} moving straight toward the plate at {Tables.Numbers.Of(approach.SpeedMPerS, "m/s")}"
        : e.Case.MovingSource is { } moving ? $"{moving.Words} passing at {Tables.Numbers.Of(moving.SpeedMPerS, "m/s")}"
        : "an AC field";

    /// <summary>The motion's curve as a table (the same numbers as the plot and result.json).</summary>
    private static void MotionTable(PlateFigures f, List<ReportBlock> b)
    {
        if (f.Approach is { } a)
        {
            b.Add(new Heading("Damping force against gap"));
            b.Add(new Table(["gap (mm)", "damping force (N)", "loss (W)"],
                a.Points.Select(p => (IReadOnlyList<string>)[N(p.GapM * 1e3), N(p.ForceN), N(p.LossW)]).ToList(), [true, true, true]));
        }
        if (f.Speed is { } s)
        {
            b.Add(new Heading($"{char.ToUpperInvariant(s.ValueName[0])}{s.ValueName[1..]} against {s.SpeedName}"));
            b.Add(new Table([$"{s.SpeedName} ({s.SpeedUnit})", $"{s.ValueName} ({s.ValueUnit})", "model"],
                s.Points.Select(p => (IReadOnlyList<string>)[N(p.Speed), N(p.Value), p.Model]).ToList(), [true, true, false]));
        }
    }

    private static void Plots(PlateReportFigures figures, List<ReportBlock> b)
    {
        b.Add(new Heading("Plots"));
        foreach (var figure in figures.All) b.Add(new FigureBlock(figure));
    }

    private static void Remarks(PlateFileEvaluation e, List<ReportBlock> b)
    {
        var items = e.Result.Validity.Warnings.Select(w => "warning: " + w).Concat(e.Result.Notes.Select(n => "note: " + n)).ToList();
        if (items.Count == 0) return;
        b.Add(new Heading("Warnings and notes"));
        b.Add(new BulletList(items));
    }

    private static void Cautions(PlateFileEvaluation e, PlateFigures f, List<ReportBlock> b)
    {
        b.Add(new Heading("Assumptions and cautions"));
        var items = new List<string>
        {
            "The figures are engineering estimates from a thin-plate eddy-current model on a grid (the model and its grid error are named beside each number); confirm them by test on the real part before relying on them. The plate is taken as non-magnetic and of uniform thickness.",
        };
        var force = f.Approach is not null ? "damping force" : f.DiscAngle is not null ? "braking torque" : f.Travel is not null ? "drag" : null;
        if (force is not null)
            items.Add($"If this {force} ever slows, stops or holds a load (a brake, a damper, a drop or end-of-travel stop), the plate is part of a safety function: it needs a certified safety analysis, and the {force} here is not a rating for it.");
        if (f.Temperature is { } t && t.HottestK > HotAboveK)
            items.Add("The plate runs above 100 °C: hot parts carry burn and fire hazards, and their resistivity and strength change with temperature.");
        if (e.Case.Thermal is { } thermal && thermal.Cooling.AmbientK < CryogenicBelowK)
            items.Add("The plate is cooled to a cryogenic temperature: cryogens bring asphyxiation, cold burns, pressure build-up on boil-off and embrittlement, and resistivities far below room-temperature values (so far larger currents and forces).");
        items.Add("Strong magnets pinch fingers and pull in tools; strong fields and high currents need the usual electrical safety measures.");
        items.Add("Follow local codes and licensed engineering practice; this report does not replace them.");
        b.Add(new BulletList(items));
    }

    private static void Files(PlateReportFigures figures, List<ReportBlock> b)
    {
        b.Add(new Heading("Files in this folder"));
        var items = new List<string>
        {
            $"{ReportWriter.HtmlFile}: this report, self-contained (plots embedded)",
            $"{ReportWriter.MarkdownFile}: the same report as Markdown",
            $"{ReportWriter.JsonFile}: every number, as slotopt plate --json prints it",
        };
        items.AddRange(figures.All.Select(fig => $"{fig.PngFileName}, {fig.SvgFileName}: {fig.Title}"));
        b.Add(new BulletList(items));
    }
}
