using SlotOpt.Plates;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.Sources.Rotation;

namespace SlotOpt.Design.SolidParts;

/// <summary>A turning disc's number for one sheet: the model that gave it (and why), the mean loss (W) and the mean braking torque (N m).</summary>
public sealed record DiscNumber(OptionModel Model, double LossW, double TorqueNm);

/// <summary>
/// The one seam every turning-disc evaluation of a problem file passes (the ranking, the confirmation, the speed lines): the number of one
/// solved disc geometry for one sheet, by the model the disc's validity calls for: that of a slide at the magnets' path speed v = omega r
/// (Rm = mu0 sigma t v / 2, <see cref="ReactionModelChoice.ForMoving"/>). Resistance-limited (<see cref="Plates.Sources.Rotation.DiscTorque"/>):
/// the geometry's unit-conductance loss scaled by G = sigma t (one solve per geometry serves every thickness and material; at another speed n
/// the loss scales as (n / n0)^2, Faraday's law being linear in omega). Where the validity calls for the disc's own field, the own-field
/// turning-disc solve of that sheet (<see cref="PlateModels.SolveDisc"/>, the same call `slotopt plate` makes) on one
/// <see cref="ReactionOperator"/> of the geometry, built at the first such solve and kept for every sheet and speed after it.
/// Torque T = P / omega (power balance of a steady rotation). Not thread-safe (the operator has one work buffer): one per geometry and thread.
/// </summary>
public sealed class TurningDiscModel
{
    private readonly PlatePart _part;
    private readonly PlateOptions.SolvedGeometry _solved;
    private readonly PlateExcitation.Turning _atSource;
    private readonly int _fftThreads;
    private ReactionOperator? _reaction;

    /// <param name="solved">the disc geometry solved at unit conductance (<see cref="PlateOptions.Solve"/>)</param>
    /// <param name="fftThreads">FFT workers of the reaction operator and of the source's edge moments (the run's --threads where one disc is solved at a time; answers are the same for any count)</param>
    public TurningDiscModel(PlatePart part, PlateOptions.SolvedGeometry solved, int fftThreads = 1)
    {
        _atSource = part.Excitation as PlateExcitation.Turning ?? throw new InvalidOperationException($"part {part.Name} is not a turning disc");
        _part = part;
        _solved = solved;
        _fftThreads = fftThreads;
    }

    /// <param name="rpm">The disc's speed (null: the source's own); positive.</param>
    public DiscNumber Evaluate(ConductingSheet sheet, double? rpm = null)
    {
        var turning = rpm is { } n && n != _atSource.Rpm ? _atSource with { Source = _atSource.Source.AtSpeed(RotationalSpeed.RadPerSFromRpm(n)) } : _atSource;
        var wanted = ValidityOf(turning, sheet);
        if (wanted.Kind != SheetModelKind.ResistanceLimited)
        {
            var model = _solved.Peak?.Model ?? throw new InvalidOperationException($"part {_part.Name}: no solved disc geometry");
            _reaction ??= ReactionOperator.Build(model, _fftThreads);
            var disc = PlateModels.SolveDisc(model, turning.Source, sheet, turning.Angles(_solved.Slots?.Radial), reaction: _reaction, fftThreads: _fftThreads);
            return new DiscNumber(new OptionModel(disc.Choice.Kind, string.Join("; ", disc.Notes)), disc.MeanLossW, disc.MeanTorqueNm);
        }
        var ratio = turning.AngularSpeedRadPerS / _atSource.AngularSpeedRadPerS;
        var lossW = _solved.LossPerSiemensW * sheet.SheetConductanceS * (ratio == 1 ? 1 : ratio * ratio);          // P ~ omega^2
        return new DiscNumber(new OptionModel(SheetModelKind.ResistanceLimited, "resistance-limited at the magnets' path speed: " + wanted.Reason),
            lossW, lossW / turning.AngularSpeedRadPerS);   // T = P / omega
    }

    /// <summary>The disc speed (rpm) above which <see cref="ValidityOf"/> leaves the resistance-limited model: the path speed where the slide's
    /// choice switches (<see cref="ReactionModelChoice.ResistanceLimitedEndSpeed"/>) over the magnets' radius (v = omega r).</summary>
    public static double ModelSwitchRpm(PlateExcitation.Turning turning, ConductingSheet sheet) =>
        turning.Rpm * ReactionModelChoice.ResistanceLimitedEndSpeed(sheet, turning.Source.LoopLengthM) / turning.PathSpeedMPerS;

    /// <summary>The model the disc's validity figures call for: those of a slide at the magnets' path speed omega r, over the magnets' length along their path.</summary>
    public static ModelChoice ValidityOf(PlateExcitation.Turning turning, ConductingSheet sheet) =>
        ReactionModelChoice.ForMoving(sheet, turning.PathSpeedMPerS, turning.Source.LoopLengthM);
}
