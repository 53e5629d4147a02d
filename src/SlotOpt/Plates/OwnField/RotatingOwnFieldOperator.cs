using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.OwnField;

/// <summary>
/// The coupled operator of a thin disc turning at omega about an axis under a fixed source, A + c M with c = omega G
/// (u = psi / G; A the unit-conductance resistance operator, M the turned reaction flux of <see cref="ReactionOperator.ApplyThetaR"/>).
/// Derivation (lab frame, fields steady): Ohm's law in the moving sheet K / G = E + v x B with v = omega z x r and E = -grad(phi); the in-plane
/// part of v x B is omega Bz r, so -div(grad psi / G) = -omega dBz/dtheta with Bz = Bz_source + Bz_own[psi] (the sheet's own field is steady in
/// the lab frame too). It is the sliding case's equation with the uniform velocity replaced by the rigid rotation: div v = 0, so
/// curl(v x B)_z = -(v . grad) Bz, and -(v . grad) = -omega d/dtheta = -omega (x d/dy - y d/dx). Integrated over each dual cell, with the own
/// field's flux through basis m being (R psi)_m: A u + omega G M u = -s, s the dual-cell integrals of omega dBz_source/dtheta
/// (<see cref="Sources.Rotation.RotatingSource.IntegrateRate"/>). M is skew-symmetric (u^T M u = 0), so the loss G u^T A u is the mechanical power.
/// The operator is real: real GMRES. Preconditioner: one multigrid V-cycle of A (the preconditioned spectrum is 1 + i (omega r / w) mu with
/// |mu| &lt;= 1 on a uniform sheet, w = 2 / (mu0 G): GMRES iterations grow with the rim speed over w).
/// </summary>
internal sealed class RotatingOwnFieldOperator
{
    private readonly SheetModel _model;
    private readonly ReactionOperator _reaction;
    private readonly double _coefficient;
    private readonly Vec2 _axis;
    private readonly double[] _work, _product;

    internal RotatingOwnFieldOperator(ReactionOperator reaction, Vec2 axis, double angularSpeedRadPerS, double sheetConductanceS)
    {
        _model = reaction.Model;
        _reaction = reaction;
        _axis = axis;
        _coefficient = angularSpeedRadPerS * sheetConductanceS;
        _work = new double[_model.Unknowns];
        _product = new double[_model.Unknowns];
    }

    public void Apply(double[] x, double[] y)
    {
        _reaction.ApplyThetaR(x, _work, _axis);
        _model.Multigrid.Operator.Multiply(x, _product);
        for (int i = 0; i < y.Length; i++) y[i] = _product[i] + _coefficient * _work[i];
    }

    /// <summary>z = M^-1 r: one multigrid V-cycle of A.</summary>
    public void Precondition(double[] r, double[] z) => _model.Multigrid.Apply(r, z);
}
