using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Plates.ResistanceLimited;

/// <summary>
/// The stream function solved at a reference sheet conductance of 1 S over the geometry's relative
/// conductance profile. Resistance-limited, psi scales with G, so for the real plate
/// G = sigma t: loss P = G * LossPerSiemensW, drag F = P / v, sheet current K = G K_unit and
/// current density J = K / t = sigma K_unit. One solve per slot geometry and source therefore serves
/// every thickness and material: call <see cref="LossW"/>, <see cref="DragN"/> or <see cref="ScaleTo"/>.
/// </summary>
public sealed class UnitConductanceSolution
{
    internal UnitConductanceSolution(SheetModel model, SourceKind kind, double[] psiRe, double[]? psiIm, double lossPerSiemensW,
        double frequencyHz, double speedMPerS, double offsetXM, int iterations, double relativeResidual, IReadOnlyList<string> notes)
    {
        Model = model;
        Kind = kind;
        PsiRe = psiRe;
        PsiIm = psiIm;
        LossPerSiemensW = lossPerSiemensW;
        FrequencyHz = frequencyHz;
        SpeedMPerS = speedMPerS;
        OffsetXM = offsetXM;
        Iterations = iterations;
        RelativeResidual = relativeResidual;
        Notes = notes;
    }

    public SheetModel Model { get; }
    public SourceKind Kind { get; }
    /// <summary>psi per unknown at 1 S (amperes per siemens); the imaginary part only for AC sources.</summary>
    public double[] PsiRe { get; }
    public double[]? PsiIm { get; }
    /// <summary>Loss per siemens of reference sheet conductance (W/S): P = 1/2 (psi_re^T A psi_re + psi_im^T A psi_im) for AC, psi^T A psi moving.</summary>
    public double LossPerSiemensW { get; }
    public double FrequencyHz { get; }
    public double SpeedMPerS { get; }
    public double OffsetXM { get; }
    public int Iterations { get; }
    public double RelativeResidual { get; }
    public IReadOnlyList<string> Notes { get; }

    /// <summary>Loss (W) of the plate whose full-thickness sheet conductance is sheetConductanceS: P = G P_unit.</summary>
    public double LossW(double sheetConductanceS) => sheetConductanceS * LossPerSiemensW;

    /// <summary>Drag (N) for a moving source: F = P / v.</summary>
    public double DragN(double sheetConductanceS) =>
        Kind == SourceKind.Moving ? LossW(sheetConductanceS) / SpeedMPerS : throw new InvalidOperationException("drag exists only for a moving source");

    public PlateResult ScaleTo(ConductingSheet conductor)
    {
        double g = conductor.SheetConductanceS;
        var (map, peak, rms) = CurrentDensityMap.Build(Model, PsiRe, PsiIm, conductor.ConductivitySPerM);
        var validity = Kind == SourceKind.Moving
            ? Validity.ForMoving(conductor, SpeedMPerS)
            : Validity.ForAc(conductor, FrequencyHz, Model.Grid.Geometry.CharacteristicWidthM);
        return new PlateResult(LossW(g), Kind == SourceKind.Moving ? DragN(g) : null, peak, rms, map, validity,
            Model.Unknowns, Iterations, RelativeResidual, Model.Grid.Notes.Concat(Notes).ToList());
    }
}
