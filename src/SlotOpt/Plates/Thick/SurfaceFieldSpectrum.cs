using System.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Sources.Magnets;

namespace SlotOpt.Plates.Thick;

/// <summary>
/// The two-dimensional Fourier transform b(kx, ky) = integral of Bz(x, y, 0) e^{-i (kx x + ky y)} dx dy of the
/// sources' normal flux density on the plate's top surface (z = 0, the plate below, the sources above).
/// Below every source the field is a potential field, so each mode continues into z &lt; 0 as b e^{k z}, k = |(kx, ky)|.
/// A magnet magnetised along z is two sheets of magnetic charge, +M on its far face and -M on its near face
/// (M = Br / mu0; the surface-charge model of Akoun and Yonnet 1984, Furlani 2001 ch. 4); a charge sheet f(x, y)
/// at height a gives, below it, Hz = -(f^(k) / 2) e^{-k (a - z)} per mode (the potential f^ e^{-k |z - a|} / (2 k)), so
/// b = sum over magnets of s (Br / 2) F(k) (e^{-k g} - e^{-k (g + h)}) e^{-i k . c}, with F the footprint's transform:
/// L W sinc(kx L / 2) sinc(ky W / 2) for a cuboid, pi D^2 / 4 * 2 J1(k D / 2) / (k D / 2) for a cylinder.
/// A point dipole m along z at height h: b = (mu0 m / 2) k e^{-k h} (the small-magnet limit of the same).
/// </summary>
public sealed class SurfaceFieldSpectrum
{
    private readonly Func<double, double, Complex> transform;

    private SurfaceFieldSpectrum(Func<double, double, Complex> transform, double nearestSourceHeightM, double spanXM, double spanYM)
    {
        this.transform = transform;
        NearestSourceHeightM = nearestSourceHeightM;
        SpanXM = spanXM;
        SpanYM = spanYM;
    }

    /// <summary>Height of the nearest source above the plate's top surface: every mode decays at least as e^{-k h} (sets the wavenumbers needed).</summary>
    public double NearestSourceHeightM { get; }
    /// <summary>The sources' span along x (sets how finely the spectrum oscillates in kx).</summary>
    public double SpanXM { get; }
    /// <summary>The sources' span along y.</summary>
    public double SpanYM { get; }

    /// <summary>b(kx, ky) in tesla square metres.</summary>
    public Complex At(double kx, double ky) => transform(kx, ky);

    /// <summary>A point dipole of moment m (A m^2) along +z at height h above the top surface, over the origin.</summary>
    public static SurfaceFieldSpectrum OfNormalDipole(double momentAm2, double heightM)
    {
        if (!double.IsFinite(momentAm2) || momentAm2 == 0) throw new InputException($"a dipole's moment must be finite and non-zero (got {momentAm2} A m^2)");
        if (!(heightM > 0) || !double.IsFinite(heightM)) throw new InputException($"a dipole's height must be positive (got {heightM} m)");
        return new SurfaceFieldSpectrum((kx, ky) =>
        {
            double k = Math.Sqrt(kx * kx + ky * ky);
            return Validity.Mu0 * momentAm2 / 2 * k * Math.Exp(-k * heightM);   // b = (mu0 m / 2) k e^{-k h}
        }, heightM, heightM, heightM);
    }

    /// <summary>The magnets of an array, their near faces at the array's gap.</summary>
    public static SurfaceFieldSpectrum Of(MagnetArray magnets)
    {
        var terms = magnets.Magnets.Select(p => (Footprint: Footprint(p.Magnet), Amplitude: p.Sign * p.Magnet.RemanenceT / 2, p.Magnet.HeightM, p.Centre)).ToArray();
        double gap = magnets.GapM;
        var (minX, maxX) = magnets.ExtentX;
        double minY = magnets.Magnets.Min(p => p.Centre.Y - p.Magnet.HalfWidthYM), maxY = magnets.Magnets.Max(p => p.Centre.Y + p.Magnet.HalfWidthYM);
        return new SurfaceFieldSpectrum((kx, ky) =>
        {
            double k = Math.Sqrt(kx * kx + ky * ky);
            double nearFace = Math.Exp(-k * gap);
            var sum = Complex.Zero;
            foreach (var t in terms)
            {
                double depthFactor = nearFace * -double.ExpM1(-k * t.HeightM);           // e^{-k g} - e^{-k (g + h)}
                double phase = -(kx * t.Centre.X + ky * t.Centre.Y);                     // e^{-i k . c}
                sum += t.Amplitude * t.Footprint(kx, ky) * depthFactor * new Complex(Math.Cos(phase), Math.Sin(phase));
            }
            return sum;
        }, gap, maxX - minX, maxY - minY);
    }

    /// <summary>The Fourier transform of a magnet's footprint (its indicator function in the x-y plane, centred).</summary>
    private static Func<double, double, double> Footprint(IPermanentMagnet magnet) => magnet switch
    {
        CuboidMagnet c => (kx, ky) => c.LengthXM * c.WidthYM * Sinc(kx * c.LengthXM / 2) * Sinc(ky * c.WidthYM / 2),
        CylinderMagnet c => (kx, ky) =>
        {
            double radius = c.DiameterM / 2, x = Math.Sqrt(kx * kx + ky * ky) * radius;
            return Math.PI * radius * radius * (x < 1e-8 ? 1 : 2 * MathNet.Numerics.SpecialFunctions.BesselJ(1, x) / x);   // 2 J1(x) / x -> 1
        },
        _ => throw new InputException($"no Fourier transform for the magnet shape {magnet.GetType().Name}"),
    };

    private static double Sinc(double x) => Math.Abs(x) < 1e-4 ? 1 - x * x / 6 : Math.Sin(x) / x;
}
