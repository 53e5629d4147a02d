using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Runs;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// Every plot of one run: the trade-off curve and the loss breakdown (when there is a front and a design),
/// loss against frequency for each core part, and for each plate the current-density map (and drag
/// against speed where a source moves, braking torque against speed on a turning disc, the temperature map where it has [parts.thermal]), drawn from the numbers the run computed (<see cref="RunFigures"/>).
/// </summary>
public sealed record ReportFigures(
    Figure? TradeOff,
    Figure? LossBreakdown,
    IReadOnlyList<(LossFrequencyCurves Curves, Figure Figure)> LossFrequency,
    IReadOnlyList<(PlatePart Part, Figure Figure)> CurrentDensity,
    IReadOnlyList<(PlatePart Part, Figure Figure)> DragSpeed,
    IReadOnlyList<(PlatePart Part, Figure Figure)> Temperature)
{
    public IEnumerable<Figure> All =>
        new[] { TradeOff, LossBreakdown }.OfType<Figure>()
            .Concat(LossFrequency.Select(x => x.Figure)).Concat(CurrentDensity.Select(x => x.Figure)).Concat(DragSpeed.Select(x => x.Figure)).Concat(Temperature.Select(x => x.Figure));

    public static ReportFigures Of(RunResult r)
    {
        var lossFrequency = new List<(LossFrequencyCurves, Figure)>();
        var currentDensity = new List<(PlatePart, Figure)>();
        var dragSpeed = new List<(PlatePart, Figure)>();
        var temperature = new List<(PlatePart, Figure)>();
        for (var i = 0; i < r.Parts.Count; i++)
        {
            var evaluation = r.Parts[i];
            var chosen = r.Chosen?[i];
            switch (evaluation.Part)
            {
                case CorePart core:
                    var curves = r.Figures.LossFrequencyOf(core.Name);
                    lossFrequency.Add((curves, LossFrequencyPlot.Build(i, curves, (chosen?.Choice as CoreChoice)?.Grade)));
                    break;
                case PlatePart plate when chosen is not null:
                    currentDensity.Add((plate, CurrentDensityPlot.Build(i, plate, r.Figures.CurrentDensityOf(plate.Name))));
                    if (plate.Excitation.IsMoving) dragSpeed.Add((plate, SpeedLinesPlot.Drag(i, evaluation, r.Figures.DragSpeedOf(plate.Name), r.Figures.LowSpeedReynoldsLimit)));
                    if (plate.Excitation is PlateExcitation.Turning) dragSpeed.Add((plate, SpeedLinesPlot.Torque(i, evaluation, r.Figures.TorqueSpeedOf(plate.Name))));
                    if (r.Figures.TemperatureOf(plate.Name) is { } maps) temperature.Add((plate, TemperaturePlot.Build(i, plate, maps, evaluation.ReferenceIsCurrent)));
                    if (r.Confirmation(plate.Name) is { SpeedSweep: not null } confirmed) dragSpeed.Add((plate, CoupledSpeedPlot.Build(i, plate, confirmed)));
                    break;
            }
        }
        return new ReportFigures(TradeOffPlot.Build(r), LossBreakdownPlot.Build(r), lossFrequency, currentDensity, dragSpeed, temperature);
    }
}
