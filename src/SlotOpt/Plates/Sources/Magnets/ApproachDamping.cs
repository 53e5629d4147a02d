using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Sources.Magnets;

/// <summary>
/// Magnets moving straight toward a thin plate at speed v, the eddy currents' own field neglected (low speed):
/// the field pattern B(x, y, z - z_m(t)) with dz_m/dt = -v gives dBz/dt = v dBz/dz at the sheet, integrated per
/// dual cell from the closed form (<see cref="MagnetArray.IntegrateNormalGradient"/>); one solve of the sheet
/// equation div(grad(psi) / G) = dBz/dt at unit conductance; the damping force opposing the approach is
/// F = P / v = G (loss per siemens) / v. Infinite sheet: F = sigma t v times the integral of Bz^2 over the sheet
/// (derived in MagnetSheetDragTests).
/// </summary>
public static class ApproachDamping
{
    public static bool TrySolve(SheetModel model, MagnetArray magnets, double approachSpeedMPerS, ConvergenceCriterion? criterion,
        out ApproachDampingSolution? solution, out string failure)
    {
        if (!(approachSpeedMPerS > 0) || !double.IsFinite(approachSpeedMPerS)) throw new InputException($"the approach speed must be positive (got {approachSpeedMPerS} m/s)");
        criterion ??= ConvergenceCriterion.Default;
        solution = null;
        var l = model.Lattice;
        var node = new double[l.NodeCount];
        magnets.IntegrateNormalGradient(l, 0, 0, node);
        for (int n = 0; n < node.Length; n++) node[n] *= approachSpeedMPerS;   // dBz/dt = v dBz/dz
        var b = model.RightHandSide(node);
        var psi = new double[model.Unknowns];
        if (!model.TrySolve(b, psi, criterion, out var report))
        {
            failure = $"sheet solver: {report.Description}";
            return false;
        }
        double loss = model.LossPerSiemens(psi);
        if (!double.IsFinite(loss)) { failure = "the loss is not finite"; return false; }
        solution = new ApproachDampingSolution(loss, approachSpeedMPerS, psi, report.Iterations, report.RelativeResidual);
        failure = "";
        return true;
    }

    public static ApproachDampingSolution Solve(SheetModel model, MagnetArray magnets, double approachSpeedMPerS, ConvergenceCriterion? criterion = null) =>
        TrySolve(model, magnets, approachSpeedMPerS, criterion, out var s, out var failure) ? s! : throw new NumericalFailureException(failure);
}

/// <summary>The approach solve at unit reference sheet conductance (1 S): psi per unknown, loss (W per S); both scale linearly with G.</summary>
public sealed record ApproachDampingSolution(double LossPerSiemensW, double SpeedMPerS, double[] PsiPerSiemens, int Iterations, double RelativeResidual)
{
    /// <summary>The force opposing the approach, F = P / v (newtons), for sheet conductance G = sigma t.</summary>
    public double DampingForceN(double sheetConductanceS) => sheetConductanceS * LossPerSiemensW / SpeedMPerS;
}
