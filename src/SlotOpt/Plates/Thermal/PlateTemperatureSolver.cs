using System.Globalization;
using SlotOpt.Materials;
using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Thermal;

/// <summary>
/// Steady plate temperature from a loss map (W per cell): the <see cref="ThermalNetwork"/> solved for
/// the rise above ambient by CG preconditioned with the eddy-current solve's black-box multigrid
/// (<see cref="StructuredMultigrid.ForNodeMatrix"/>: the same 5-point stencil, holes and held nodes as identity rows).
/// Natural convection gives one h for the whole plate from its mean rise, and radiation depends on the local
/// temperature, so the linear solve may be repeated:
/// <list type="bullet">
/// <item>h from the heat balance on the mean: each step takes h where r h(r) = c (<see cref="NaturalConvection.AtHeatFlux"/>),
/// c = Q / (2 A) at the first step (all the heat convected: exact for insulated edges without radiation, where
/// 2 h A r_mean = Q holds for the discrete solution too, so one solve settles it) and then c = r_mean h of the last
/// solve (its rise taken as inversely proportional to h, which held edges and radiation alter only a little);</item>
/// <item>radiation linearised about the last rise (Newton, q_r' = 4 eps sigma T^3; the first step about the warm
/// start, or the mean rise the balance predicts).</item>
/// </list>
/// Each solve starts from the last rise (the first from the given start, scaled by the heat ratio, or the predicted mean).
/// Converged when h at the solve's mean rise agrees with the h it was solved with within <see cref="RelativeTolerance"/>
/// and, with radiation, no node moved by more than <see cref="RelativeTolerance"/> of the largest rise from the rise
/// it was linearised about (below any reported digit). The heat balance is then checked: convected + radiated + into
/// held edges must equal the loss within <see cref="BalanceTolerance"/>.
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

        var rise = new double[unknowns];
        var h = new double[unknowns];
        var rhs = new double[unknowns];
        var previous = new double[unknowns];
        double shed = heatIn / (2 * totalArea);   // c = r_mean h: per face, all the heat convected
        double hConv = 0;
        bool warm = start is not null && start.NodeTemperatureK.Length == map.Length && start.HeatInW > 0;
        if (warm)
        {
            double scale = heatIn / start!.HeatInW;
            for (int n = 0; n < map.Length; n++)
                if (map[n] >= 0 && double.IsFinite(start.NodeTemperatureK[n])) rise[map[n]] = scale * (start.NodeTemperatureK[n] - start.AmbientK);
        }
        int iterations = 0, linear = 0;
        double residual = 0;
        while (unknowns > 0)   // none when every metal node is held at ambient (a plate a cell or two wide)
        {
            iterations++;
            double predictedMean;
            if (fluid is null) { hConv = cooling.FixedCoefficientWPerM2K!.Value; predictedMean = shed / hConv; }
            else (hConv, predictedMean) = NaturalConvection.AtHeatFlux(fluid, cooling.AmbientK, shed, cooling.VerticalLengthM);
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
            var a = network.Matrix(h);
            var multigrid = network.Preconditioner(a, h.Average());   // kept while h / (k t) moves little: an SPD preconditioner either way
            if (!ConjugateGradient.TrySolve(a, rhs, rise, multigrid, LinearCriterion, out var report))
                throw new NumericalFailureException($"plate temperature: {report.Reason} (relative residual {report.RelativeResidual:E2} after {report.Iterations} iterations)");
            linear += report.Iterations;
            residual = report.RelativeResidual;
            double largest = 0, change = 0, weighted = 0;
            for (int n = 0; n < map.Length; n++)
            {
                int u = map[n];
                if (u < 0) continue;
                if (!double.IsFinite(rise[u])) throw new NumericalFailureException("plate temperature: the solution is not finite");
                largest = Math.Max(largest, Math.Abs(rise[u]));
                change = Math.Max(change, Math.Abs(rise[u] - previous[u]));
                weighted += network.NodeAreaM2[n] * rise[u];
            }
            double meanRise = weighted / totalArea;
            double hMismatch = fluid is null ? 0 : Math.Abs(NaturalConvection.AverageCoefficient(fluid, cooling.AmbientK, meanRise, cooling.VerticalLengthM) - hConv) / hConv;
            bool radiationSettled = !radiates || change <= RelativeTolerance * largest;
            if (largest == 0 || (hMismatch <= RelativeTolerance && radiationSettled)) break;
            if (iterations >= MaxIterations)
                throw new NumericalFailureException(string.Create(CultureInfo.InvariantCulture,
                    $"plate temperature: the surface coefficients did not settle in {MaxIterations} iterations (h mismatch {hMismatch:G3}, last change {change:G3} K at a largest rise of {largest:G4} K)"));
            shed = Math.Max(meanRise, 0) * hConv;
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
