using SlotOpt.Plates.Geometry;

namespace SlotOpt.Plates.OwnField;

public sealed partial class ReactionOperator
{
    /// <summary>
    /// y = M u with M = (P^T D R P + P^T R D P) / 2: the turned reaction flux of a disc spinning about axis, the
    /// discrete form of D_theta R with D_theta = x d/dy - y d/dx (x, y from the axis). P replicates an unknown onto its interior nodes
    /// (its transpose sums a node field per unknown), R is the node-level convolution of the reaction kernel, and D the central-difference
    /// D_theta on the interior nodes (node values beyond the interior taken as zero): x_n (f(n + row) - f(n - row)) / (2 hy) - y_n (f(n + 1) - f(n - 1)) / (2 hx).
    /// D is skew-symmetric exactly (x is constant along a column, y along a row) and R symmetric, so the average of the two orders is
    /// skew-symmetric and u^T M u = 0: the power balance T omega = P holds in the discrete model as it does for the sliding Dx R.
    /// In the continuum D_theta and R commute (R is |k|, invariant under rotation), so both orders are consistent and their average is too.
    /// Units: henry (D_theta is dimensionless: a rate per radian).
    /// </summary>
    internal void ApplyThetaR(ReadOnlySpan<double> u, Span<double> y, Vec2 axis)
    {
        var c = _convolution;
        var re = c.Re; var im = c.Im;
        int ix = c.Nx, iy = c.Ny, mx = c.PaddedX;
        var l = Model.Lattice;
        _thetaNode ??= new double[ix * iy];
        _thetaTurned ??= new double[ix * iy];
        var node = _thetaNode;
        for (int n = 0; n < _interiorUnknown.Length; n++) { int k = _interiorUnknown[n]; node[n] = k >= 0 ? u[k] : 0; }
        Turn(node, _thetaTurned, l, ix, iy, axis);
        for (int j = 0; j < iy; j++)
            for (int i = 0; i < ix; i++) { int n = j * ix + i, p = j * mx + i; re[p] = node[n]; im[p] = _thetaTurned[n]; }
        c.ConvolveComplex(_spectrumR);                   // R's kernel is real: Re -> R P u, Im -> R D P u
        for (int j = 0; j < iy; j++)
            for (int i = 0; i < ix; i++) node[j * ix + i] = re[j * mx + i];
        Turn(node, _thetaTurned, l, ix, iy, axis);       // D R P u
        y.Clear();
        for (int n = 0; n < _interiorUnknown.Length; n++)
        {
            int k = _interiorUnknown[n];
            if (k >= 0) y[k] += 0.5 * (_thetaTurned[n] + im[n / ix * mx + n % ix]);
        }
    }

    private double[]? _thetaNode, _thetaTurned;

    /// <summary>g = D_theta f on the interior nodes by central differences, f beyond the interior zero (interior node (i, j) is lattice node (i + 1, j + 1)).</summary>
    private static void Turn(double[] f, double[] g, Grid.CellLattice l, int ix, int iy, Vec2 axis)
    {
        double ax = 0.5 / l.Hx, ay = 0.5 / l.Hy;
        for (int j = 0; j < iy; j++)
        {
            double yj = l.NodeY(j + 1) - axis.Y;
            for (int i = 0; i < ix; i++)
            {
                int n = j * ix + i;
                double xi = l.NodeX(i + 1) - axis.X;
                double up = j + 1 < iy ? f[n + ix] : 0, down = j > 0 ? f[n - ix] : 0;
                double right = i + 1 < ix ? f[n + 1] : 0, left = i > 0 ? f[n - 1] : 0;
                g[n] = xi * (up - down) * ay - yj * (right - left) * ax;
            }
        }
    }
}
