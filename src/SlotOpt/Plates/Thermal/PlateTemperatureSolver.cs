using System.Globalization;
using SlotOpt.Materials;
using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Thermal;

/// <summary>
/// Steady plate temperature from a loss map (W per cell): the <see cref="ThermalNetwork"/> solved for
/// the rise above ambient by CG preconditioned with the eddy-current solve's black-box multigrid
/// (<see cref="StructuredMultigrid.ForNodeMatrix"/>: the same 5-point stencil, holes and held nodes as identity rows). Natural convection depends on the mean rise and radiation on the local
/// temperature, so the linear solve is repeated: h_conv at the last mean rise (Picard) and the
/// radiation linearised about the last temperature (Newton, q_r' = 4 eps sigma T^3), until no node
/// moves by more than <see cref="RelativeTolerance"/> of the largest rise. The heat balance is then checked:
/// convected + radiated + into held edges must equal the loss within <see cref="BalanceTolerance"/>.
/// </summary>
public static class PlateTemperatureSolver
{
    /// <summary>The iteration stops when max |change| &lt;= 1e-6 x the largest rise (below any reported digit; the fixed-point error is about the last change).</summary>
    public const double RelativeTolerance = 1e-6;
    public const int MaxIterations = 200;
    /// <summary>|heat out - heat in| / heat in above this is a failed solve (1e-4: far above CG's 1e-10, far below any reported digit).</summary>
    public const double BalanceTolerance = 1e-4;

    /// <summary>The linear solves: relative residual 1e-9 (the iteration and balance checks sit above it).</summary>
    public static ConvergenceCriterion LinearCriterion { get; } = new() { RelativeResidual = 1e-9, MaxIterations = 400 };

    /// <summary>The early steps of the iteration, while a step still moves the rise by more than 1e-3 of it: relative residual 1e-4.</summary>
    public static ConvergenceCriterion EarlyCriterion { get; } = new() { RelativeResidual = 1e-4, MaxIterations = 400 };

    public static PlateTemperature Solve(PlateGrid grid, double[] cellLossW, double thermalConductivityWPerMK, double thicknessM, PlateCooling cooling) =>
        Solve(ThermalNetwork.Assemble(grid, thermalConductivityWPerMK, thicknessM, cooling.Edges), cellLossW, cooling);

    public static PlateTemperature Solve(ThermalNetwork network, double[] cellLossW, PlateCooling cooling)
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

        var rise = new double[unknowns];
        var h = new double[unknowns];
        var rhs = new double[unknowns];
        // start: the rise the loss would give under 10 W/m^2K, a middle value for natural convection (common practice, no source)
        double meanRise = heatIn / (2 * 10 * totalArea);
        double hConv = 0;
        StructuredMultigrid? multigrid = null;
        int iterations = 0, linear = 0;
        double residual = 0, lastChange = double.PositiveInfinity, lastLargest = 0;
        bool dependsOnRise = fluid is not null || cooling.Emissivity > 0;
        var previous = new double[unknowns];
        while (unknowns > 0)   // none when every metal node is held at ambient (a plate a cell or two wide)
        {
            iterations++;
            hConv = fluid is null ? cooling.FixedCoefficientWPerM2K!.Value : NaturalConvection.AverageCoefficient(fluid, cooling.AmbientK, meanRise, cooling.VerticalLengthM);
            Array.Copy(b, rhs, unknowns);
            for (int n = 0; n < map.Length; n++)
            {
                int u = map[n];
                if (u < 0) continue;
                h[u] = hConv;
                if (cooling.Emissivity == 0) continue;
                // Newton step on the radiation of both faces: q_r(r) ~ q_r(r0) + q_r'(r0) (r - r0), q_r' = 4 eps sigma T0^3
                double r0 = Math.Max(iterations == 1 ? meanRise : rise[u], 0), t0 = cooling.AmbientK + r0;
                double slope = 4 * cooling.Emissivity * SurfaceRadiation.StefanBoltzmann * t0 * t0 * t0;
                h[u] += slope;
                rhs[u] -= 2 * network.NodeAreaM2[n] * (SurfaceRadiation.HeatFluxWPerM2(cooling.Emissivity, t0, cooling.AmbientK) - slope * r0);
            }
            var a = network.Matrix(h);
            // one hierarchy per solve: later Picard steps change only the diagonal a little, and it stays an SPD preconditioner
            multigrid ??= StructuredMultigrid.ForNodeMatrix(a, l.NodesX, l.NodesY, map);
            Array.Copy(rise, previous, unknowns);
            // early steps only need to point the way: the tight residual once the steps are small (an inexact fixed-point iteration)
            bool tight = !dependsOnRise || lastChange <= 1e-3 * lastLargest;
            if (!ConjugateGradient.TrySolve(a, rhs, rise, multigrid, tight ? LinearCriterion : EarlyCriterion, out var report))
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
            meanRise = weighted / totalArea;
            lastChange = change;
            lastLargest = largest;
            if (largest == 0 || (tight && (!dependsOnRise || change <= RelativeTolerance * largest))) break;
            if (iterations >= MaxIterations)
                throw new NumericalFailureException(string.Create(CultureInfo.InvariantCulture,
                    $"plate temperature: the surface coefficients did not settle in {MaxIterations} iterations (last change {lastChange:G3} K at a largest rise of {largest:G4} K)"));
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
        for (int u = 0; u < unknowns; u++) edge += network.ConductanceToHeld[u] * rise[u];
        double imbalance = Math.Abs(convected + radiated + edge - heatIn);
        if (heatIn > 0 && imbalance > BalanceTolerance * heatIn)
            throw new NumericalFailureException(string.Create(CultureInfo.InvariantCulture,
                $"plate temperature: the heat balance does not close (in {heatIn:G6} W, out {convected + radiated + edge:G6} W)"));
        return new PlateTemperature(network, temperature, cooling.AmbientK, hConv, heatIn, convected, radiated, edge, iterations, linear, residual);
    }
}
