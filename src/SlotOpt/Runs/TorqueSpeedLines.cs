using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Plates;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Sources.Rotation;

namespace SlotOpt.Runs;

/// <summary>
/// Braking torque against disc speed for a turning disc part: the chosen option, the solid disc of the same sheet (when the chosen one is
/// slotted) and the reference (when it is neither), each disc geometry solved again once a run (<see cref="SolvedGeometries"/>) and its number
/// at every speed taken from the one seam of turning-disc numbers (<see cref="TurningDiscModel"/>, one per line: its reaction operator serves
/// every own-field speed), with the model that gave it.
/// Resistance-limited the torque is proportional to speed, T(n) = T(n0) n / n0, and has no peak; the seam keeps that model up to the speed where
/// the disc's validity figures call for its own field (<see cref="TurningDiscModel.ModelSwitchRpm"/>): each line carries that speed, the one
/// rule the points' models follow. Points are the torque at <see cref="Samples"/> speeds from 0 to <see cref="MaxRpm"/>, each with its model.
/// </summary>
public sealed record TorqueSpeedLines(string PartName, double RunRpm, double MaxRpm, IReadOnlyList<TorqueSpeedLines.Line> Lines)
{
    public const int Samples = 41;

    /// <summary>One speed of a line: disc speed (rpm), braking torque (N m) and the model that gave it.</summary>
    public sealed record Point(double Rpm, double TorqueNm, string Model);

    /// <summary>One design's torque against speed; PeakRpm where its model shows a peak (the resistance-limited line has none), ModelSwitchRpm where its points leave the resistance-limited model.</summary>
    public sealed record Line(EvaluatedOption Option, DesignRole Role, IReadOnlyList<Point> Points, double ModelSwitchRpm, double? PeakRpm);

    public static TorqueSpeedLines Of(PartEvaluation plate, EvaluatedOption chosen, Problem problem, SolvedGeometries geometries)
    {
        var part = (PlatePart)plate.Part;
        var turning = (PlateExcitation.Turning)part.Excitation;
        var designs = new List<(EvaluatedOption Option, DesignRole Role)> { (chosen, DesignRole.Chosen) };
        var solid = SolidCounterpart.Of(plate, chosen);
        if (!ReferenceEquals(solid, chosen)) designs.Add((solid, DesignRole.SolidCounterpart));
        if (!designs.Any(d => d.Option.Id == plate.Reference.Id)) designs.Add((plate.Reference, DesignRole.Reference));
        var n0 = turning.Rpm;
        var ends = designs.Select(d => TurningDiscModel.ModelSwitchRpm(turning, SheetOf(part, (PlateChoice)d.Option.Choice, problem))).ToList();
        var maxRpm = Math.Max(Math.Max(2 * n0, part.MinBraking?.Speed * 1.25 ?? 0), Math.Min(1.25 * ends.Max(), 4 * n0));
        // a brake (min_torque): on to past the chosen disc's torque peak, which a thin sheet under a compact source shows near the path speed
        // 1.272 w, w the receding-image speed (Reitz, J. Appl. Phys. 41 (1970) 2067, thin-sheet drag), capped at ten times the source's speed
        if (part.MinBraking is not null)
        {
            var chosenSheet = SheetOf(part, (PlateChoice)chosen.Choice, problem);
            var peakRpm = RotationalSpeed.RpmFromRadPerS(1.272 * chosenSheet.RecedingImageSpeedMPerS / turning.Source.SourceRadiusM);
            maxRpm = Math.Max(maxRpm, Math.Min(2 * peakRpm, 10 * n0));
        }
        var lines = designs.Select((d, k) =>
        {
            var choice = (PlateChoice)d.Option.Choice;
            var solved = geometries.Of(part, choice.Slots);
            if (solved.Failure is { } failure) throw new InvalidOperationException($"{part.Name}: the disc solved during the run no longer solves: {failure.Message}");
            var disc = new TurningDiscModel(part, solved, geometries.Limits.Threads);
            var sheet = SheetOf(part, choice, problem);
            var points = new List<Point>();
            for (var i = 0; i < Samples; i++)
            {
                var n = maxRpm * i / (Samples - 1);
                if (n == 0) { points.Add(new Point(0, 0, ReactionModelChoice.Name(TurningDiscModel.ValidityOf(turning, sheet).Kind))); continue; }   // no motion, no torque: the run speed's model names the point
                var number = disc.Evaluate(sheet, n);
                points.Add(new Point(n, number.TorqueNm, number.Model.Name));
            }
            var top = points.IndexOf(points.MaxBy(p => p.TorqueNm)!);
            var peak = top > 0 && top < points.Count - 1 && points[top].Model != "resistance-limited" ? points[top].Rpm : (double?)null;   // an interior maximum of the own-field line
            return new Line(d.Option, d.Role, points, ends[k], peak);
        }).ToList();
        return new TorqueSpeedLines(part.Name, n0, maxRpm, lines);
    }

    private static ConductingSheet SheetOf(PlatePart part, PlateChoice choice, Problem problem)
    {
        var material = problem.Library.GetConductor(choice.Material, part.Name);
        return new ConductingSheet(material.ConductivityAt(part.TemperatureK), choice.ThicknessM, material.RelativePermeability);
    }
}
