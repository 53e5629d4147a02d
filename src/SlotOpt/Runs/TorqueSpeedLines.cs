using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Plates.Conductors;

namespace SlotOpt.Runs;

/// <summary>
/// Braking torque against disc speed for a turning disc part: the chosen option, the solid disc of the same sheet (when the chosen one is
/// slotted) and the reference (when it is neither), each from its number at the run's speed (<see cref="TurningDiscModel"/>, the one seam).
/// Resistance-limited the torque is proportional to speed, T(n) = T(n0) n / n0, and has no peak; the model holds while the magnetic Reynolds
/// number at the magnets' radius, mu0 sigma t (omega r) / 2, stays below <see cref="Validity.ReynoldsLimit"/>: each line carries the speed
/// where its sheet reaches it. Points are the torque at <see cref="Samples"/> speeds from 0 to <see cref="MaxRpm"/>, each with its model.
/// </summary>
public sealed record TorqueSpeedLines(string PartName, double RunRpm, double MaxRpm, IReadOnlyList<TorqueSpeedLines.Line> Lines)
{
    public const int Samples = 41;

    /// <summary>One speed of a line: disc speed (rpm), braking torque (N m) and the model that gave it.</summary>
    public sealed record Point(double Rpm, double TorqueNm, string Model);

    /// <summary>One design's torque against speed; PeakRpm where its model shows a peak (the resistance-limited line has none), ValidityEndRpm where Rm reaches the limit.</summary>
    public sealed record Line(EvaluatedOption Option, DesignRole Role, IReadOnlyList<Point> Points, double ValidityEndRpm, double? PeakRpm);

    public static TorqueSpeedLines Of(PartEvaluation plate, EvaluatedOption chosen, Problem problem)
    {
        var part = (PlatePart)plate.Part;
        var turning = (PlateExcitation.Turning)part.Excitation;
        var designs = new List<(EvaluatedOption Option, DesignRole Role)> { (chosen, DesignRole.Chosen) };
        var solid = SolidCounterpart.Of(plate, chosen);
        if (!ReferenceEquals(solid, chosen)) designs.Add((solid, DesignRole.SolidCounterpart));
        if (!designs.Any(d => d.Option.Id == plate.Reference.Id)) designs.Add((plate.Reference, DesignRole.Reference));
        var n0 = turning.Rpm;
        var ends = designs.Select(d => ReynoldsLimitRpm(part, turning, d.Option, problem)).ToList();
        var maxRpm = Math.Max(Math.Max(2 * n0, part.MinTorque?.Rpm * 1.25 ?? 0), Math.Min(1.25 * ends.Max(), 4 * n0));
        var lines = designs.Select((d, k) =>
        {
            var torque = d.Option.TorqueNm ?? throw new InvalidOperationException($"{part.Name}: option {d.Option.Id} has no torque");
            var model = d.Option.Model?.Name ?? "resistance-limited";
            var points = Enumerable.Range(0, Samples).Select(i => maxRpm * i / (Samples - 1))
                .Select(n => new Point(n, torque * n / n0, model)).ToList();                            // resistance-limited: T(n) = T(n0) n / n0
            return new Line(d.Option, d.Role, points, ends[k], null);
        }).ToList();
        return new TorqueSpeedLines(part.Name, n0, maxRpm, lines);
    }

    /// <summary>The disc speed (rpm) at which this option's sheet reaches the Reynolds-number limit at the magnets' radius: Rm is proportional to speed.</summary>
    private static double ReynoldsLimitRpm(PlatePart part, PlateExcitation.Turning turning, EvaluatedOption option, Problem problem)
    {
        var choice = (PlateChoice)option.Choice;
        var material = problem.Library.GetConductor(choice.Material, part.Name);
        var sheet = new ConductingSheet(material.ConductivityAt(part.TemperatureK), choice.ThicknessM, material.RelativePermeability);
        return turning.Rpm * Validity.ReynoldsLimit / Validity.ForMoving(sheet, turning.PathSpeedMPerS).ReynoldsNumber;
    }
}
