using SlotOpt.Plates;
using SlotOpt.Plates.Conductors;

namespace SlotOpt.Design.SolidParts;

/// <summary>A turning disc's number for one sheet: the model that gave it (and why), the mean loss (W) and the mean braking torque (N m).</summary>
public sealed record DiscNumber(OptionModel Model, double LossW, double TorqueNm);

/// <summary>
/// The one seam every turning-disc evaluation of a problem file passes (the ranking, the confirmation, the speed lines): the number of one
/// solved disc geometry for one sheet, by the model the disc's validity calls for: that of a slide at the magnets' path speed v = omega r
/// (Rm = mu0 sigma t v / 2, <see cref="ReactionModelChoice.ForMoving"/>). Resistance-limited (<see cref="Plates.Sources.Rotation.DiscTorque"/>):
/// the geometry's unit-conductance loss scaled by G = sigma t (one solve per geometry serves every thickness and material; at another speed n
/// the loss scales as (n / n0)^2, Faraday's law being linear in omega). Where the validity calls for the disc's own field, the own-field
/// turning-disc solve of that sheet (<see cref="PlateModels.SolveDisc"/>, the same call `slotopt plate` makes). Torque T = P / omega
/// (power balance of a steady rotation).
/// </summary>
public static class TurningDiscModel
{
    /// <param name="rpm">The disc's speed (null: the source's own); positive.</param>
    public static DiscNumber Evaluate(PlatePart part, PlateOptions.SolvedGeometry solved, ConductingSheet sheet, double? rpm = null)
    {
        var atSource = part.Excitation as PlateExcitation.Turning ?? throw new InvalidOperationException($"part {part.Name} is not a turning disc");
        var turning = rpm is { } n && n != atSource.Rpm ? atSource with { Source = atSource.Source.AtSpeed(n * 2 * Math.PI / 60) } : atSource;
        var wanted = ValidityOf(turning, sheet);
        if (wanted.Kind != SheetModelKind.ResistanceLimited)
        {
            var model = solved.Peak?.Model ?? throw new InvalidOperationException($"part {part.Name}: no solved disc geometry");
            var disc = PlateModels.SolveDisc(model, turning.Source, sheet, turning.Angles(solved.Slots?.Radial));
            return new DiscNumber(new OptionModel(disc.Choice.Kind, string.Join("; ", disc.Notes)), disc.MeanLossW, disc.MeanTorqueNm);
        }
        var ratio = turning.AngularSpeedRadPerS / atSource.AngularSpeedRadPerS;
        var lossW = solved.LossPerSiemensW * sheet.SheetConductanceS * (ratio == 1 ? 1 : ratio * ratio);          // P ~ omega^2
        return new DiscNumber(new OptionModel(SheetModelKind.ResistanceLimited, "resistance-limited at the magnets' path speed: " + wanted.Reason),
            lossW, lossW / turning.AngularSpeedRadPerS);   // T = P / omega
    }

    /// <summary>The model the disc's validity figures call for: those of a slide at the magnets' path speed omega r, over the magnets' length along their path.</summary>
    public static ModelChoice ValidityOf(PlateExcitation.Turning turning, ConductingSheet sheet) =>
        ReactionModelChoice.ForMoving(sheet, turning.PathSpeedMPerS, turning.Source.LoopLengthM);
}
