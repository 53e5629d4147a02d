using System.Numerics;
using SlotOpt.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Plates.ReducedBasis;

/// <summary>
/// The coupled AC problem of <see cref="ReactionSolver.SolveAc"/>, (A + j c R) u = -s with c = omega G, for every sheet conductance G of
/// one geometry and source from one Krylov basis per part of the source (in phase and in quadrature): M = A^-1 R is self-adjoint and
/// positive semi-definite in the A-inner product (R, the mutual inductance of the hat loops, symmetric positive semi-definite), so
/// (I + j c M) u = u0 is projected on the Krylov space of M from u0 (shift-invariance, Y. Saad, Iterative Methods for Sparse Linear Systems,
/// 2nd ed., SIAM 2003, section 6.1), with the exact residual bound of <see cref="ArnoldiPosition"/>: |(I + j c M) e|_A &gt;= |e|_A.
/// The loss (G/2) |u|_A^2 is the sum over the two parts: for real a, b and real symmetric M the cross term
/// Re(j a^T (I + c^2 M^2)^-1 b) vanishes. Not thread-safe (the reaction operator is not): one per thread.
/// </summary>
public sealed class AcReducedBasis
{
    private readonly ReactionOperator _reaction;
    private readonly ConvergenceCriterion _criterion;
    private readonly ArnoldiPosition[] _parts;
    private readonly double[] _applied;

    public SheetModel Model => _reaction.Model;
    public IAcFieldSource Source { get; }

    private AcReducedBasis(ReactionOperator reaction, IAcFieldSource source, ConvergenceCriterion criterion, ArnoldiPosition[] parts)
    {
        _reaction = reaction;
        Source = source;
        _criterion = criterion;
        _parts = parts;
        _applied = new double[reaction.Model.Unknowns];
    }

    /// <summary>The resistance-limited start A u0 = -s of the in-phase and quadrature parts of the source.</summary>
    public static AcReducedBasis Start(ReactionOperator reaction, IAcFieldSource source, ConvergenceCriterion? criterion = null)
    {
        criterion ??= ConvergenceCriterion.Default;
        var model = reaction.Model;
        var re = new double[model.Lattice.NodeCount];
        var im = new double[model.Lattice.NodeCount];
        source.Integrate(model.Lattice, re, im);
        var parts = new ArnoldiPosition[2];
        var k = 0;
        foreach (var node in new[] { re, im })
        {
            var u0 = new double[model.Unknowns];
            if (!model.TrySolve(model.RightHandSide(node), u0, criterion, out var report))
                throw new NumericalFailureException($"resistance-limited start: {report.Description}");
            parts[k++] = new ArnoldiPosition(model, u0, 0);
        }
        return new AcReducedBasis(reaction, source, criterion, parts);
    }

    /// <summary>The time-averaged loss for one conductor; the bases grow until the error bound meets the criterion.</summary>
    public ReactionAcSolution Solve(ConductingSheet conductor)
    {
        double g = conductor.SheetConductanceS, c = 2 * Math.PI * Source.FrequencyHz * g;
        var projected = new ComplexProjection[_parts.Length];
        while (true)
        {
            var growing = new List<ArnoldiPosition>();
            for (int k = 0; k < _parts.Length; k++)
            {
                projected[k] = _parts[k].ProjectImaginary(c);
                if (projected[k].RelativeError > _criterion.RelativeResidual && !_parts[k].Exhausted) growing.Add(_parts[k]);
            }
            if (growing.Count == 0) break;
            if (growing.Any(p => p.V.Count > MovingReducedBasis.MaxSteps))
                throw new NumericalFailureException($"the reduced basis did not converge in {MovingReducedBasis.MaxSteps} steps at c = omega G = {c:G4} (error bound {projected.Max(p => p.RelativeError):E2})");
            _criterion.ThrowIfCancelled();
            foreach (var part in growing)
            {
                _reaction.ApplyR(part.V[^1], _applied);
                if (!part.Extend(_applied, _criterion, out var failure)) throw new NumericalFailureException(failure);
            }
        }
        double loss = 0, low = 0;
        var u = new Complex[Model.Unknowns];
        for (int k = 0; k < _parts.Length; k++)
        {
            var p = _parts[k];
            var y = projected[k].Y;
            double norm2 = y.Sum(z => z.Real * z.Real + z.Imaginary * z.Imaginary);
            loss += 0.5 * g * p.Beta * p.Beta * norm2;                              // <P> = (G/2) |u|_A^2, u = Beta V y (A-orthonormal V)
            low += 0.5 * g * p.Beta * p.Beta;
            var phase = k == 0 ? Complex.One : Complex.ImaginaryOne;                // u = u_in-phase + j u_quadrature
            for (int i = 0; i < y.Count; i++)
            {
                var f = phase * p.Beta * y[i];
                var v = p.V[i];
                for (int n = 0; n < u.Length; n++) u[n] += f * v[n];
            }
        }
        if (!double.IsFinite(loss)) throw new NumericalFailureException("the coupled loss is not finite");
        var notes = new List<string>();
        if (low == 0) notes.Add("the field does not reach the conducting part of the plate: zero loss");
        return new ReactionAcSolution(Model, u, g, Source.FrequencyHz, loss, low, _parts.Sum(p => p.V.Count - 1), projected.Max(p => p.RelativeError), notes);
    }
}
