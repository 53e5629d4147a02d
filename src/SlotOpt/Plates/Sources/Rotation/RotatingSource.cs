using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Sources.Rotation;

/// <summary>
/// A field source fixed in space over a thin disc turning at AngularSpeedRadPerS (counter-clockwise about +z) about
/// <see cref="Axis"/>. The sheet equation and its source:
/// in the lab frame the fields are steady and Ohm's law in the moving conductor is K / G = E + v x B with v = omega z x r,
/// E = -grad(phi) (steady: curl E = 0; K = curl(psi z), G = sigma t). The in-plane part of v x B is Bz (v_y, -v_x) = omega Bz r
/// (radial), so taking the curl: -div(grad(psi) / G) = curl(omega Bz r)_z = omega (y dBz/dx - x dBz/dy) = -omega dBz/dtheta, that is
/// div(grad(psi) / G) = omega dBz/dtheta: the same sheet equation as for a sliding source, div(grad(psi) / G) = dBz/dt, with dBz/dt the
/// rate a point of the disc sees (in the disc's frame the field pattern turns at -omega: Bz(r, theta + omega t)). Resistance-limited:
/// the eddy currents' own field is neglected (W. R. Smythe, "On eddy currents in a rotating disk", Trans. AIEE 61 (1942) 681-684, solves
/// the same equation). A slotted disc is solved at several angles (the slots turn with it), each as a steady state.
/// The dual-cell integral of omega dBz/dtheta is exact on the cell's edges: dBz/dtheta = d(x Bz)/dy - d(y Bz)/dx (x, y from the axis),
/// so by Gauss's theorem it is omega (integral of x Bz dx along the top edge - along the bottom - integral of y Bz dy along the right
/// edge + along the left); neighbouring cells share their edges, so the integrals telescope as for the sliding sources.
/// The edge moments do not depend on the speed: the summed moments of a lattice and angle (the rate at 1 rad/s) are kept, up to
/// <see cref="KeptRates"/> of them, and shared with the copies <see cref="AtSpeed"/> makes, so a disc solved at many speeds, or several
/// slot geometries on one lattice at the same angles, integrate the source once (each rate is omega times the kept sum, bit for bit).
/// </summary>
public abstract class RotatingSource
{
    protected RotatingSource(Vec2 axis, double angularSpeedRadPerS)
    {
        if (!(angularSpeedRadPerS > 0) || !double.IsFinite(angularSpeedRadPerS)) throw new InputException($"the angular speed must be positive (got {angularSpeedRadPerS} rad/s)");
        if (!double.IsFinite(axis.X) || !double.IsFinite(axis.Y)) throw new InputException("the disc's axis is not finite");
        Axis = axis;
        AngularSpeedRadPerS = angularSpeedRadPerS;
    }

    /// <summary>How many lattice-and-angle rates a source and its speed copies keep (a bound on the memory: one double per lattice node each).</summary>
    public const int KeptRates = 32;

    /// <summary>The summed edge moments per node (the rate at 1 rad/s) by lattice and angle, shared with the AtSpeed copies; thread-safe.</summary>
    private System.Collections.Concurrent.ConcurrentDictionary<(CellLattice Lattice, double AngleRad), Lazy<double[]>> _unitRates = new();

    /// <summary>For <see cref="AtSpeed"/>: the copy at another speed shares this source's kept rates (the same field, so the same moments).</summary>
    protected T SharingRates<T>(T copy) where T : RotatingSource
    {
        copy._unitRates = _unitRates;
        return copy;
    }

    /// <summary>The disc's centre in the plate's plane (metres).</summary>
    public Vec2 Axis { get; }
    public double AngularSpeedRadPerS { get; }

    /// <summary>The radius of the source's centre (the lever arm of its drag), metres.</summary>
    public abstract double SourceRadiusM { get; }
    /// <summary>The source's smallest size along its path (the loop length of the magnetic Reynolds number), metres.</summary>
    public abstract double LoopLengthM { get; }
    public abstract IReadOnlyList<GridFeature> GridFeatures { get; }
    public abstract RotatingSource AtSpeed(double angularSpeedRadPerS);
    public abstract string Words { get; }

    /// <summary>The source turned by angleRad about the axis, as its edge moments (what depends only on the angle computed once).</summary>
    protected abstract IEdgeMoments TurnedBy(double angleRad);

    /// <summary>The edge moments of the source at one angle; read-only, so one instance may serve several threads.</summary>
    protected interface IEdgeMoments
    {
        /// <summary>Integral of x Bz dx along y = yM from x0 to x1 (x, y from the axis; tesla m^2).</summary>
        double MomentAlongX(double yM, double x0M, double x1M);
        /// <summary>Integral of y Bz dy along x = xM from y0 to y1 (x, y from the axis; tesla m^2).</summary>
        double MomentAlongY(double xM, double y0M, double y1M);
    }

    /// <summary>
    /// Per lattice node, the dual-cell integral of dBz/dt = omega dBz/dtheta (volts) with the source turned by angleRad about the axis.
    /// threads: workers for the edge moments where the caller solves one disc at a time (each edge is independent: the same bits for any count).
    /// </summary>
    public void IntegrateRate(CellLattice l, double angleRad, double[] node, int threads = 1)
    {
        if (threads < 1) throw new ArgumentOutOfRangeException(nameof(threads), "at least one thread");
        var key = (l, angleRad);
        // kept while there is room; Lazy so that two solves wanting the same rate at once integrate it once
        var unit = _unitRates.Count < KeptRates || _unitRates.ContainsKey(key)
            ? _unitRates.GetOrAdd(key, _ => new Lazy<double[]>(() => UnitRate(l, angleRad, threads))).Value
            : UnitRate(l, angleRad, threads);
        double w = AngularSpeedRadPerS;
        for (int n = 0; n < unit.Length; n++) node[n] = w * unit[n];
    }

    /// <summary>Per lattice node, the summed edge moments of its dual cell (the rate at 1 rad/s, tesla m^2 per radian); rows of edges on up to threads workers.</summary>
    private double[] UnitRate(CellLattice l, double angleRad, int threads)
    {
        var turned = TurnedBy(angleRad);
        int nx = l.NodesX, ny = l.NodesY;
        var vertical = new double[(nx + 1) * ny];     // along x = x_k - hx/2, for node row j
        var horizontal = new double[nx * (ny + 1)];   // along y = y_k - hy/2, for node column i
        // a field that cannot be evaluated (NumericalFailureException) reaches the caller as itself, the first row's, whatever the thread count
        var failures = new NumericalFailureException?[ny + 1];
        Parallel.For(0, ny + 1, new ParallelOptions { MaxDegreeOfParallelism = threads }, j =>
        {
            try { EdgeRow(j); }
            catch (NumericalFailureException e) { failures[j] = e; }
        });
        if (Array.Find(failures, f => f is not null) is { } failure) throw failure;
        var unit = new double[nx * ny];
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
                unit[j * nx + i] = horizontal[(j + 1) * nx + i] - horizontal[j * nx + i] - vertical[j * (nx + 1) + i + 1] + vertical[j * (nx + 1) + i];
        return unit;

        // row j's vertical edges (j < NodesY) and its lower horizontal edges: each entry written by one worker
        void EdgeRow(int j)
        {
            double y0 = l.NodeY(j) - l.Hy / 2 - Axis.Y;    // row j's lower horizontal edge line, and the start of its vertical edges
            if (j < ny)
                for (int k = 0; k <= nx; k++) vertical[j * (nx + 1) + k] = turned.MomentAlongY(l.NodeX(k) - l.Hx / 2 - Axis.X, y0, y0 + l.Hy);
            for (int i = 0; i < nx; i++)
            {
                double x0 = l.NodeX(i) - l.Hx / 2 - Axis.X;
                horizontal[j * nx + i] = turned.MomentAlongX(y0, x0, x0 + l.Hx);
            }
        }
    }
}
