using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Plates.Conductors;

namespace SlotOpt.Runs;

/// <summary>
/// Drag against speed in the resistance-limited (low-speed) model for a plate passed by moving poles: the chosen
/// option, the solid plate of the same sheet (when the chosen one is slotted) and the reference (when it is neither).
/// Drag is proportional to speed, F(v) = F(v0) v / v0, while the magnetic Reynolds number mu0 sigma t v / 2 stays
/// below <see cref="Validity.ReynoldsLimit"/>; each line carries the speed at which its sheet reaches that limit.
/// </summary>
public sealed record DragSpeedLines(string PartName, double RunSpeedMPerS, IReadOnlyList<DragSpeedLines.Line> Lines)
{
    /// <summary>One design's drag at the run's speed (in its option) and the speed where Rm reaches the limit.</summary>
    public sealed record Line(EvaluatedOption Option, DesignRole Role, double ReynoldsLimitSpeedMPerS);

    public static DragSpeedLines Of(PartEvaluation plate, EvaluatedOption chosen, Problem problem)
    {
        var part = (PlatePart)plate.Part;
        var designs = new List<(EvaluatedOption Option, DesignRole Role)> { (chosen, DesignRole.Chosen) };
        var solid = SolidCounterpart.Of(plate, chosen);
        if (!ReferenceEquals(solid, chosen)) designs.Add((solid, DesignRole.SolidCounterpart));
        if (!designs.Any(d => d.Option.Id == plate.Reference.Id)) designs.Add((plate.Reference, DesignRole.Reference));
        return new DragSpeedLines(part.Name, ((PlateExcitation.Moving)part.Excitation).SpeedMPerS,
            designs.Select(d => new Line(d.Option, d.Role, ReynoldsLimitSpeed(part, d.Option, problem))).ToList());
    }

    /// <summary>The speed at which this option's sheet reaches the Reynolds-number limit: Rm is proportional to v.</summary>
    private static double ReynoldsLimitSpeed(PlatePart part, EvaluatedOption option, Problem problem)
    {
        var choice = (PlateChoice)option.Choice;
        var material = problem.Library.GetConductor(choice.Material, part.Name);
        var sheet = new ConductingSheet(material.ConductivityAt(part.TemperatureK), choice.ThicknessM, material.RelativePermeability);
        var v0 = ((PlateExcitation.Moving)part.Excitation).SpeedMPerS;
        return v0 * Validity.ReynoldsLimit / Validity.ForMoving(sheet, v0).ReynoldsNumber;
    }
}
