using System.Runtime.CompilerServices;
using SlotOpt.Numerics;

namespace SlotOpt.Plates.Thermal;

/// <summary>
/// The matrix of a <see cref="ThermalNetwork"/> applied on the node lattice instead of from a stored matrix: row u of node p is
/// d_u x_u - k t (w_p x_(p-1) + w_(p+1) x_(p+1) + s_p x_(p-NodesX) + s_(p+NodesX) x_(p+NodesX)), the network's unit conduction
/// stencil (w, s) and a diagonal d that the solver sets for each step of its iteration (<see cref="SetSurfaceCoefficients"/>):
/// the conduction stays, only the surface term 2 h A on the diagonal changes with h and the radiation's linearisation.
/// Same matrix as <see cref="ThermalNetwork.Matrix"/> (each row summed in another order), without storing it. Not for
/// concurrent products (it holds a lattice vector).
/// </summary>
public sealed class ThermalOperator : ILinearOperator
{
    private readonly ThermalNetwork _network;
    /// <summary>x spread on the lattice, padded with NodesX + 1 zeros on both sides (node p at Pad + p).</summary>
    private readonly double[] _lattice;

    public ThermalOperator(ThermalNetwork network)
    {
        _network = network;
        DiagonalWPerK = new double[network.Unknowns];
        _lattice = new double[network.Lattice.NodeCount + 2 * (network.Lattice.NodesX + 1)];
    }

    public int Rows => _network.Unknowns;

    /// <summary>The diagonal by unknown (W/K): conduction plus 2 h A.</summary>
    public double[] DiagonalWPerK { get; }

    /// <summary>Sets the diagonal for surface coefficients h by unknown (W/m^2K).</summary>
    public void SetSurfaceCoefficients(double[] surfaceCoefficientWPerM2K) => _network.Diagonal(surfaceCoefficientWPerM2K, DiagonalWPerK);

    /// <summary>y = A x.</summary>
    public void Multiply(ReadOnlySpan<double> x, Span<double> y) => Apply(default, x, y, residual: false);

    /// <summary>r = b - A x.</summary>
    public void Residual(ReadOnlySpan<double> b, ReadOnlySpan<double> x, Span<double> r) => Apply(b, x, r, residual: true);

    /// <summary>Each row's terms in the order of the matrix's row (down, left, diagonal, right, up), so the products are those of
    /// <see cref="ThermalNetwork.Matrix"/> to the last bit.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void Apply(ReadOnlySpan<double> b, ReadOnlySpan<double> x, Span<double> y, bool residual)
    {
        var map = _network.NodeUnknown;
        var w = _network.UnitWest;
        var s = _network.UnitSouth;
        var d = DiagonalWPerK;
        var v = _lattice;
        int nx = _network.Lattice.NodesX, pad = nx + 1, n = map.Length;
        double kt = _network.ConductanceScaleWPerK;
        for (int p = 0; p < n; p++) { int u = map[p]; v[pad + p] = u >= 0 ? x[u] : 0; }
        for (int p = 0; p < n; p++)
        {
            int u = map[p];
            if (u < 0) continue;
            int q = pad + p;
            double down = -(kt * s[p]) * v[q - nx], left = -(kt * w[p]) * v[q - 1], centre = d[u] * v[q],
                right = -(kt * w[p + 1]) * v[q + 1], up = -(kt * s[p + nx]) * v[q + nx];
            y[u] = residual ? b[u] - down - left - centre - right - up : down + left + centre + right + up;
        }
    }
}
