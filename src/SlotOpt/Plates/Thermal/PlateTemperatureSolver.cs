using System.Globalization;
using MathNet.Numerics.RootFinding;
using SlotOpt.Materials;
using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Thermal;

/// <summary>
/// Steady plate temperature from a loss map (W per cell): the <see cref="ThermalNetwork"/> solved for
/// the rise above ambient by CG preconditioned with the eddy-current solve's black-box multigrid
/// (<see cref="StructuredMultigrid.ForNodeStencil"/>: the same 5-point stencil, holes and held nodes as identity rows), applied on the
/// node lattice (<see cref="ThermalOperator"/>: between steps only its diagonal changes).
/// Natural convection gives one h for the whole plate from its mean rise, and radiation depends on the local
/// temperature, so the linear solve may be repeated:
/// <list type="bullet">
/// <item>h from the heat balance on the mean: each step takes the mean rise r where r h(r) + radiated(r) + into edges(r)
/// = Q / (2 A) per face (Q less the loss put on held nodes) (<see cref="NaturalConvection.AtHeatFlux"/>), h = h(r). The first step takes the radiation of a
/// uniform plate at r and no heat into edges (exact for insulated edges without radiation, where 2 h A r_mean = Q holds for
/// the discrete solution too, so one solve settles it); later steps scale the last solve's radiated heat by the uniform
/// law's change from its mean rise to r and its heat into held edges in proportion to r (a model of the outflows, so the
/// mean converges in a few steps; the fixed point is the same).</item>
/// <item>radiation linearised about the last rise (Newton, q_r' = 4 eps sigma T^3; the first step about the warm
/// start, or the mean rise the balance predicts).</item>
/// </list>
/// Each solve starts from the last rise (the first from the given start, scaled by the heat ratio, or the predicted mean).
/// Converged when the step's linear solve was tight (<see cref="LinearCriterion"/>; with radiation or held edges, steps
/// solve only to <see cref="FirstCriterion"/> (the first from a cold start) and <see cref="EarlyCriterion"/> until a step moves no node by more than 1e-1 of the largest rise), h at the solve's mean rise agrees
/// with the h it was solved with within <see cref="RelativeTolerance"/>, and, with radiation, the linearisation's error
/// is below <see cref="RelativeTolerance"/> of the largest rise: a node that moved by d from the rise it was linearised
/// about misses at most (1/2) q_r'' d^2 = 6 eps sigma T_max^2 d^2 of radiated flux, and the operator (an M-matrix whose
/// diagonal exceeds its off-diagonal row sum by at least 2 h A) turns a flux error e into a rise error of at most
/// e / h (the Newton step's error bound; below any reported digit). The heat balance is then checked: convected +
/// radiated + into held edges must equal the loss within <see cref="BalanceTolerance"/>.
/// </summary>
public static class PlateTemperatureSolver
{
    /// <summary>Stopping tolerance of the h and radiation iteration (relative; see the type's summary).</summary>
    public const double RelativeTolerance = 1e-6;
    public const int MaxIterations = 200;
    /// <summary>|heat out - heat in| / heat in above this is a failed solve (1e-4: far above CG's 1e-10, far below any reported digit).</summary>
    public const double BalanceTolerance = 1e-4;

    /// <summary>The linear solves: relative residual 1e-9 (the iteration and balance checks sit above it).</summary>
    public static ConvergenceCriterion LinearCriterion { get; } = new() { RelativeResidual = 1e-9, MaxIterations = 400 };

    /// <summary>The early steps of the iteration, while a step still moves the rise by more than 1e-1 of it: relative residual 1e-4.</summary>
    public static ConvergenceCriterion EarlyCriterion { get; } = new() { RelativeResidual = 1e-4, MaxIterations = 400 };

    /// <summary>The first early step from a cold start (a uniform rise): relative residual 1e-2. It linearises the radiation about the
    /// uniform mean rise, so its answer misses the final rise by tens of percent wherever the plate is uneven (measured on the thermal
    /// bench's plate: the next step moves the hottest rise by 1 K of 54); solving it tighter buys nothing.</summary>
    public static ConvergenceCriterion FirstCriterion { get; } = new() { RelativeResidual = 1e-2, MaxIterations = 400 };

    public static PlateTemperature Solve(PlateGrid grid, double[] cellLossW, double thermalConductivityWPerMK, double thicknessM, PlateCooling cooling) =>
        Solve(ThermalNetwork.Assemble(grid, thermalConductivityWPerMK, thicknessM, cooling.Edges), cellLossW, cooling);

    /// <param name="start">A temperature of a similar plate on the same grid (another thickness or material, another loss): its
    /// rise, scaled by the ratio of the heat inputs, starts the iteration. Only the number of iterations depends on it.</param>
    public static PlateTemperature Solve(ThermalNetwork network, double[] cellLossW, PlateCooling cooling, PlateTemperature? start = null)
    {
        var l = network.Lattice;
        if (cellLossW.Length != l.CellCount) throw new ArgumentException("one loss per cell", nameof(cellLossW));
        double heatIn = 0;
        foreach (double p in cellLossW)
        {
            if (!double.IsFinite(p) || p < 0) throw new NumericalFailureException($"the loss map holds {p} W in a cell: a loss must be finite and >= 0");
            heatIn += p;
        }
        var nodeHeat = network.NodeHeat(cellLossW);
        var map = network.NodeUnknown;
        int unknowns = network.Unknowns;
        var b = new double[unknowns];
        for (int n = 0; n < map.Length; n++) if (map[n] >= 0) b[map[n]] = nodeHeat[n];
        double totalArea = network.NodeAreaM2.Sum();
        var fluid = cooling.Medium switch { CoolingMedium.Air => CoolingFluid.Air, CoolingMedium.Oil => CoolingFluid.MineralOil, _ => null };
        bool radiates = cooling.Emissivity > 0;

        var op = new ThermalOperator(network);
        var rise = new double[unknowns];
        var h = new double[unknowns];
        var rhs = new double[unknowns];
        var previous = new double[unknowns];
        double heldHeat = 0;   // the loss put on nodes held at ambient goes straight into the edge
        for (int n = 0; n < map.Length; n++) if (network.HeldNode[n]) heldHeat += nodeHeat[n];
        double perFace = Math.Max(heatIn - heldHeat, 0) / (2 * totalArea);   // W/m^2 each face would shed with no other heat into edges
        double lastMean = 0, lastRadiated = 0, lastEdge = 0, lastChange = double.PositiveInfinity, lastLargest = 0;   // the last solve's mean rise and its radiated and edge heat per face (W/m^2)
        double hConv = 0;
        bool warm = start is not null && start.NodeTemperatureK.Length == map.Length && start.HeatInW > 0;
        if (warm)
        {
            double scale = heatIn / start!.HeatInW;
            for (int n = 0; n < map.Length; n++)
                if (map[n] >= 0 && double.IsFinite(start.NodeTemperatureK[n])) rise[map[n]] = scale * (start.NodeTemperatureK[n] - start.AmbientK);
        }
        // radiation of a face at a uniform rise r, and the model of the outflows other than convection at a mean rise r (W/m^2)
        double Uniform(double r) => SurfaceRadiation.HeatFluxWPerM2(cooling.Emissivity, cooling.AmbientK + r, cooling.AmbientK);
        double Other(double r) =>
            (lastMean > 0 && Uniform(lastMean) > 0 ? lastRadiated * Uniform(r) / Uniform(lastMean) : Uniform(r))
            + (lastMean > 0 ? lastEdge * r / lastMean : 0);
        bool iterates = radiates || (fluid is not null && network.HeldNode.Contains(true));   // more than one step is to be expected
        int iterations = 0, linear = 0;
        double residual = 0;
        while (unknowns > 0)   // none when every metal node is held at ambient (a plate a cell or two wide)
        {
            iterations++;
            double predictedMean;
            if (fluid is not null) (hConv, predictedMean) = NaturalConvection.AtHeatFlux(fluid, cooling.AmbientK, perFace, cooling.VerticalLengthM, Other);
            else
            {
                hConv = cooling.FixedCoefficientWPerM2K!.Value;
                predictedMean = perFace > 0 && (radiates || lastEdge > 0) ? Brent.FindRoot(r => (hConv * r + Other(r)) / perFace - 1, 0, perFace / hConv, 1e-13, 200) : perFace / hConv;
            }
            if (iterations == 1 && !warm) Array.Fill(rise, predictedMean);
            Array.Copy(b, rhs, unknowns);
            Array.Copy(rise, previous, unknowns);
            for (int n = 0; n < map.Length; n++)
            {
                int u = map[n];
                if (u < 0) continue;
                h[u] = hConv;
                if (!radiates) continue;
                // Newton step on the radiation of both faces: q_r(r) ~ q_r(r0) + q_r'(r0) (r - r0), q_r' = 4 eps sigma T0^3
                double r0 = Math.Max(rise[u], 0), t0 = cooling.AmbientK + r0;
                double slope = 4 * cooling.Emissivity * SurfaceRadiation.StefanBoltzmann * t0 * t0 * t0;
                h[u] += slope;
                rhs[u] -= 2 * network.NodeAreaM2[n] * (SurfaceRadiation.HeatFluxWPerM2(cooling.Emissivity, t0, cooling.AmbientK) - slope * r0);
            }
            op.SetSurfaceCoefficients(h);   // the conduction stays; only the diagonal moves with h and the radiation's linearisation
            var multigrid = network.Preconditioner(op, h.Average());   // kept while h / (k t) moves little: an SPD preconditioner either way
            // early steps only point the way: tight once a step moves the rise by at most 1e-1 of it (an inexact fixed-point iteration)
            bool tight = !iterates || lastChange <= 1e-1 * lastLargest;
            if (!ConjugateGradient.TrySolve(op, rhs, rise, multigrid, tight ? LinearCriterion : iterations == 1 && !warm ? FirstCriterion : EarlyCriterion, out var report))
                throw new NumericalFailureException($"plate temperature: {report.Reason} (relative residual {report.RelativeResidual:E2} after {report.Iterations} iterations)");
            linear += report.Iterations;
            residual = report.RelativeResidual;
            double largest = 0, change = 0, weighted = 0, radiatedNow = 0, edgeNow = 0;
            for (int n = 0; n < map.Length; n++)
            {
                int u = map[n];
                if (u < 0) continue;
                if (!double.IsFinite(rise[u])) throw new NumericalFailureException("plate temperature: the solution is not finite");
                largest = Math.Max(largest, Math.Abs(rise[u]));
                change = Math.Max(change, Math.Abs(rise[u] - previous[u]));
                weighted += network.NodeAreaM2[n] * rise[u];
                if (radiates) radiatedNow += network.NodeAreaM2[n] * Uniform(rise[u]);
                edgeNow += network.ConductanceToHeld(u) * rise[u];
            }
            double meanRise = weighted / totalArea;
            double hMismatch = fluid is null ? 0 : Math.Abs(NaturalConvection.AverageCoefficient(fluid, cooling.AmbientK, meanRise, cooling.VerticalLengthM) - hConv) / hConv;
            double hottest = cooling.AmbientK + largest + change;   // the hottest a node was between its linearisation point and now
            bool radiationSettled = !radiates || 6 * cooling.Emissivity * SurfaceRadiation.StefanBoltzmann * hottest * hottest * change * change / hConv <= RelativeTolerance * largest;
            if (largest == 0 || (tight && hMismatch <= RelativeTolerance && radiationSettled)) break;
            if (iterations >= MaxIterations)
                throw new NumericalFailureException(string.Create(CultureInfo.InvariantCulture,
                    $"plate temperature: the surface coefficients did not settle in {MaxIterations} iterations (h mismatch {hMismatch:G3}, last change {change:G3} K at a largest rise of {largest:G4} K)"));
            lastChange = change;
            lastLargest = largest;
            lastMean = Math.Max(meanRise, 0);
            lastRadiated = radiatedNow / totalArea;
            lastEdge = edgeNow / (2 * totalArea);
        }

        var temperature = new double[map.Length];
        double convected = 0, radiated = 0, edge = 0;
        for (int n = 0; n < map.Length; n++)
        {
            int u = map[n];
            if (u >= 0) temperature[n] = cooling.AmbientK + rise[u];
            else if (network.HeldNode[n]) { temperature[n] = cooling.AmbientK; edge += nodeHeat[n]; }
            else { temperature[n] = double.NaN; continue; }
            double r = temperature[n] - cooling.AmbientK;
            convected += 2 * hConv * network.NodeAreaM2[n] * r;
            radiated += 2 * network.NodeAreaM2[n] * SurfaceRadiation.HeatFluxWPerM2(cooling.Emissivity, temperature[n], cooling.AmbientK);
        }
        for (int u = 0; u < unknowns; u++) edge += network.ConductanceToHeld(u) * rise[u];
        double imbalance = Math.Abs(convected + radiated + edge - heatIn);
        if (heatIn > 0 && imbalance > BalanceTolerance * heatIn)
            throw new NumericalFailureException(string.Create(CultureInfo.InvariantCulture,
                $"plate temperature: the heat balance does not close (in {heatIn:G6} W, out {convected + radiated + edge:G6} W)"));
        return new PlateTemperature(network, temperature, cooling.AmbientK, hConv, heatIn, convected, radiated, edge, iterations, linear, residual);
    }
}
