using System.Numerics;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Sources;

/// <summary>
/// A normal AC field given on a rectangular grid of points (x_i, y_j) as complex peak amplitudes
/// (tesla), interpolated bilinearly and zero outside the map. Each node's dual-cell integral uses
/// 3 x 3 Gauss–Legendre points (exact for the bilinear interpolant inside one map cell, and
/// second-order accurate where a dual cell straddles map cells).
/// </summary>
public sealed class FieldMap : IAcFieldSource
{
    private readonly double[] _x;
    private readonly double[] _y;
    private readonly Complex[] _b;   // _b[j * nx + i]

    public FieldMap(double[] xM, double[] yM, Complex[] amplitudeT, double frequencyHz)
    {
        if (xM.Length < 2 || yM.Length < 2) throw new InputException("a field map needs at least 2 distinct x and 2 distinct y values");
        if (amplitudeT.Length != xM.Length * yM.Length) throw new InputException($"a field map of {xM.Length} x {yM.Length} points needs {xM.Length * yM.Length} values (got {amplitudeT.Length})");
        for (int i = 1; i < xM.Length; i++) if (!(xM[i] > xM[i - 1])) throw new InputException("field-map x values must increase");
        for (int j = 1; j < yM.Length; j++) if (!(yM[j] > yM[j - 1])) throw new InputException("field-map y values must increase");
        foreach (var b in amplitudeT) if (!double.IsFinite(b.Real) || !double.IsFinite(b.Imaginary)) throw new InputException("a field-map value is not finite");
        if (!(frequencyHz > 0)) throw new InputException($"the field map's frequency must be positive (got {frequencyHz} Hz)");
        _x = xM; _y = yM; _b = amplitudeT;
        FrequencyHz = frequencyHz;
    }

    public double FrequencyHz { get; }

    /// <summary>Bilinear interpolation; zero outside the map.</summary>
    public Complex At(double x, double y)
    {
        if (x < _x[0] || x > _x[^1] || y < _y[0] || y > _y[^1]) return Complex.Zero;
        int i = Segment(_x, x), j = Segment(_y, y);
        double tx = (x - _x[i]) / (_x[i + 1] - _x[i]), ty = (y - _y[j]) / (_y[j + 1] - _y[j]);
        int nx = _x.Length;
        return (1 - tx) * (1 - ty) * _b[j * nx + i] + tx * (1 - ty) * _b[j * nx + i + 1]
             + (1 - tx) * ty * _b[(j + 1) * nx + i] + tx * ty * _b[(j + 1) * nx + i + 1];
    }

    public void Integrate(CellLattice lattice, double[] nodeRe, double[] nodeIm)
    {
        double omega = 2 * Math.PI * FrequencyHz;
        // 3-point Gauss–Legendre on [-1/2, 1/2]: nodes 0, ±sqrt(3/5)/2, weights 4/9, 5/18, 5/18 (Abramowitz & Stegun 25.4.29)
        double g = Math.Sqrt(0.6) / 2;
        ReadOnlySpan<double> s = stackalloc double[] { -g, 0, g };
        ReadOnlySpan<double> w = stackalloc double[] { 5.0 / 18, 4.0 / 9, 5.0 / 18 };
        for (int j = 0; j < lattice.NodesY; j++)
            for (int i = 0; i < lattice.NodesX; i++)
            {
                Complex sum = Complex.Zero;
                for (int a = 0; a < 3; a++)
                    for (int b = 0; b < 3; b++)
                        sum += w[a] * w[b] * At(lattice.NodeX(i) + s[a] * lattice.Hx, lattice.NodeY(j) + s[b] * lattice.Hy);
                var rate = Complex.ImaginaryOne * omega * sum * lattice.CellAreaM2;   // j omega B̂ integrated
                nodeRe[j * lattice.NodesX + i] = rate.Real;
                nodeIm[j * lattice.NodesX + i] = rate.Imaginary;
            }
    }

    private static int Segment(double[] v, double t)
    {
        int k = Array.BinarySearch(v, t);
        if (k < 0) k = ~k - 1;
        return Math.Clamp(k, 0, v.Length - 2);
    }
}
