using Complex = System.Numerics.Complex;
using MathNet.Numerics.LinearAlgebra;
using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Plates.ReducedBasis;

internal sealed record RealProjection(Vector<double> Y, double RelativeError);

internal sealed record ComplexProjection(Vector<Complex> Y, double RelativeError);


/// <summary>
/// One Krylov basis of M = A^-1 S from u0 in the A-inner product (Arnoldi, twice-orthogonalised classical Gram-Schmidt; Y. Saad, Iterative
/// Methods for Sparse Linear Systems, 2nd ed., SIAM 2003, Alg. 6.1): the A-orthonormal V (with A V kept for the inner products), the
/// Hessenberg matrix H of M in it, |u0|_A. Projection of (I - c M) u = u0 (moving, S = Dx R skew) or (I + j c M) u = u0 (AC, S = R symmetric)
/// with the exact residual |c h(m+1,m) y_m| |u0|_A, which bounds the A-norm error since both operators have singular values &gt;= 1 in the A-norm.
/// </summary>
internal sealed class ArnoldiPosition
{
    private readonly SheetModel _model;
    private readonly List<double[]> _av = [];
    private readonly List<double[]> _h = [];          // column j: h(0..j+1, j)
    private double[]? _liftGradient;
    private bool _exhausted;

    /// <summary>The Krylov space is invariant (or u0 = 0): the projection is exact and the basis does not grow.</summary>
    public bool Exhausted => _exhausted;

    public List<double[]> V { get; } = [];
    public double Beta { get; }
    public double EdgeLossPerSiemens { get; }

    public ArnoldiPosition(SheetModel model, double[] u0, double edgeLossPerSiemens)
    {
        _model = model;
        EdgeLossPerSiemens = edgeLossPerSiemens;
        var au0 = Multiply(u0);
        Beta = Math.Sqrt(Dot(u0, au0));                                          // |u0|_A, the resistance-limited loss per siemens is Beta^2
        if (Beta == 0) { _exhausted = true; V.Add(u0); _av.Add(au0); return; }
        Add(u0.Select(x => x / Beta).ToArray(), au0.Select(x => x / Beta).ToArray());
    }

    /// <summary>Takes w = S v_last, solves A z = w, A-orthogonalises z against V twice (classical Gram-Schmidt, reorthogonalised) and appends it.</summary>
    public bool Extend(double[] sv, ConvergenceCriterion criterion, out string failure)
    {
        var z = new double[sv.Length];
        if (!_model.TrySolve(sv, z, criterion, out var report))
        {
            failure = $"reduced basis step: {report.Description}";
            return false;
        }
        double before = Math.Sqrt(Math.Max(Dot(z, sv), 0));                     // |z|_A before orthogonalisation (A z = S v)
        var column = new double[V.Count + 1];
        for (int pass = 0; pass < 2; pass++)
            for (int i = 0; i < V.Count; i++)
            {
                double h = Dot(z, _av[i]);                                        // <z, v_i>_A = z^T A v_i
                column[i] += h;
                var v = V[i];
                for (int u = 0; u < z.Length; u++) z[u] -= h * v[u];
            }
        var az = Multiply(z);
        double norm = Math.Sqrt(Math.Max(Dot(z, az), 0));
        column[V.Count] = norm;
        _h.Add(column);
        // an invariant subspace (the new direction is rounding against the step's size): the projection is exact
        if (norm <= 1e-13 * before) { column[V.Count] = 0; _exhausted = true; failure = ""; return true; }
        for (int u = 0; u < z.Length; u++) { z[u] /= norm; az[u] /= norm; }   // in place: both are this step's own arrays
        Add(z, az);
        failure = "";
        return true;
    }

    /// <summary>y solving (I - c H_m) y = e1 (u = Beta V y) and its relative A-norm error bound |c h(m+1,m) y_m| / |y|.</summary>
    public RealProjection Project(double c)
    {
        int m = _h.Count;
        if (m == 0)
        {
            var y0 = Vector<double>.Build.Dense(1, 1.0);
            return new RealProjection(y0, _exhausted ? 0 : double.PositiveInfinity);
        }
        var h = Matrix<double>.Build.Dense(m, m, (i, j) => (i == j ? 1 : 0) - (i < _h[j].Length ? c * _h[j][i] : 0));
        var e1 = Vector<double>.Build.Dense(m);
        e1[0] = 1;
        var y = h.Solve(e1);
        double error = Math.Abs(c * _h[m - 1][m] * y[m - 1]) / y.L2Norm();   // zero once the space is invariant
        if (!double.IsFinite(error)) error = double.PositiveInfinity;
        return new RealProjection(y, error);
    }

    /// <summary>
    /// Bound of the loss error of the projected solution, (|u|_A^2 - |u_m|_A^2) / |u_m|_A^2, for (I - c M) u = u0 with M skew-adjoint in the A-inner
    /// product: &lt;T x, x&gt;_A = |x|_A^2 for T = I - c M, so |u|^2 = &lt;u0, u&gt; and (Galerkin) |u_m|^2 = &lt;u0, u_m&gt;; with T e = -r (e = u - u_m, r the
    /// projection's residual, A-orthogonal to V) and z = T^-* u0, |u|^2 - |u_m|^2 = &lt;u0, e&gt; = -&lt;z - z_m, r&gt; for the projection z_m of the adjoint
    /// problem (I + c M) z = u0 in the same space, whose error is at most its residual r* (T* = I + c M has singular values &gt;= 1). So the bound
    /// |r|_A |r*|_A / |u_m|_A^2 = c^2 h(m+1,m)^2 |y_m| |y*_m| / |y|^2 with (I + c H_m) y* = e1: the product of the solution's and the adjoint's bounds,
    /// the adjoint-weighted estimate of a quadratic output (R. Becker and R. Rannacher, "An optimal control approach to a posteriori error estimation
    /// in finite element methods", Acta Numerica 10 (2001) 1-102, section 2). Exact inner solves assumed, as for <see cref="Project"/>'s bound.
    /// </summary>
    public double RelativeLossError(double c, RealProjection projection)
    {
        int m = _h.Count;
        if (m == 0) return _exhausted ? 0 : double.PositiveInfinity;
        var h = Matrix<double>.Build.Dense(m, m, (i, j) => (i == j ? 1 : 0) + (i < _h[j].Length ? c * _h[j][i] : 0));
        var e1 = Vector<double>.Build.Dense(m);
        e1[0] = 1;
        var adjoint = h.Solve(e1);
        var y = projection.Y;
        double next = c * _h[m - 1][m];
        double bound = next * next * Math.Abs(y[m - 1]) * Math.Abs(adjoint[m - 1]) / y.DotProduct(y);   // zero once the space is invariant
        return double.IsFinite(bound) ? bound : double.PositiveInfinity;
    }

    /// <summary>y solving (I + j c H_m) y = e1 (AC) and its relative A-norm error bound |c h(m+1,m) y_m| / |y|.</summary>
    public ComplexProjection ProjectImaginary(double c)
    {
        int m = _h.Count;
        if (m == 0) return new ComplexProjection(Vector<Complex>.Build.Dense(1, Complex.One), _exhausted ? 0 : double.PositiveInfinity);
        var h = Matrix<Complex>.Build.Dense(m, m, (i, j) => (i == j ? Complex.One : Complex.Zero) + (i < _h[j].Length ? new Complex(0, c * _h[j][i]) : Complex.Zero));
        var e1 = Vector<Complex>.Build.Dense(m);
        e1[0] = Complex.One;
        var y = h.Solve(e1);
        double error = c * Math.Abs(_h[m - 1][m]) * y[m - 1].Magnitude / y.L2Norm();
        if (!double.IsFinite(error)) error = double.PositiveInfinity;
        return new ComplexProjection(y, error);
    }

    /// <summary>h(j+2, j+1) (1-based): the norm of the j-th step's new direction; 0 where the space was exhausted before it.</summary>
    public double Subdiagonal(int j) => j < _h.Count ? _h[j][j + 1] : 0;

    /// <summary>(V^T g) for the first m basis vectors: the lift's projection (g, the lift gradient, computed the first time it is asked for).</summary>
    public Vector<double> LiftProjection(ReactionOperator reaction, IMovingSheetSource source, double offsetXM, int m)
    {
        _liftGradient ??= MovingReducedBasis.LiftGradient(reaction, source, offsetXM);
        return Vector<double>.Build.Dense(m, i => Dot(V[i], _liftGradient));
    }

    /// <summary>u = scale Beta V y on the unknowns.</summary>
    public double[] Expand(Vector<double> y, double scale)
    {
        var u = new double[_model.Unknowns];
        for (int i = 0; i < y.Count; i++)
        {
            var v = V[i];
            double f = scale * Beta * y[i];
            for (int k = 0; k < u.Length; k++) u[k] += f * v[k];
        }
        return u;
    }

    private void Add(double[] v, double[] av)
    {
        V.Add(v);
        _av.Add(av);
    }

    private double[] Multiply(double[] x)
    {
        var y = new double[x.Length];
        _model.Multigrid.Operator.Multiply(x, y);
        return y;
    }

    private static double Dot(double[] a, double[] b)
    {
        double s = 0;
        for (int i = 0; i < a.Length; i++) s += a[i] * b[i];
        return s;
    }
}
