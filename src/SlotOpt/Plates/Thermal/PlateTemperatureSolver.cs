using System.Globalization;
using System.Runtime.CompilerServices;
using MathNet.Numerics.RootFinding;
using SlotOpt.Materials;
using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Thermal;

/// <summary>
/// Steady plate temperature from a loss map (W per cell): the <see cref="ThermalNetwork"/> solved for
/// the rise above ambient by CG preconditioned with the eddy-current solve's black-box multigrid
/// (<see cref="StructuredMultigrid.ForNodeStencil"/>: the same 5-point stencil, holes and held nodes as identity rows), all on the
/// node lattice (<see cref="ThermalOperator"/>, <see cref="ThermalConjugateGradient"/>): between steps only the diagonal and the
/// right-hand side change, so each step starts from the last rise with the residual updated for the change, in the pass that sets them.
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
/// Converged when the step's linear solve was solved to <see cref="LinearCriterion"/> (with radiation or held edges, the first
/// steps from a cold start solve only to <see cref="EarlyCriteria"/>), h at the solve's mean rise agrees
/// with the h it was solved with closely enough that the rise moves by at most <see cref="RelativeTolerance"/> of the largest rise
/// (a fraction e of h moves it by at most e h / (h + 4 eps sigma T_inf^3), radiation taking its share), and, with radiation, the linearisation's error
/// is below <see cref="RelativeTolerance"/> of the largest rise: a node that moved by d from the rise it was linearised
/// about misses at most (1/2) q_r'' d^2 = 6 eps sigma T_max^2 d^2 of radiated flux, and the operator (an M-matrix whose
/// diagonal exceeds its off-diagonal row sum by at least 2 h A) turns a flux error e into a rise error of at most
/// e / h (the Newton step's error bound; below any reported digit). The heat balance is then checked: convected +
/// radiated + into held edges must equal the loss within <see cref="BalanceTolerance"/>.
/// What the solver promises: the rise of the network's exact solution within <see cref="RiseAccuracy"/> of the largest rise.
/// </summary>
public static class PlateTemperatureSolver
{
    /// <summary>Stopping tolerance of the h and radiation iteration (relative; see the type's summary).</summary>
    public const double RelativeTolerance = 1e-6;
    public const int MaxIterations = 200;
    /// <summary>|heat out - heat in| / heat in above this is a failed solve (1e-4: far below any reported digit, and above what the linear
    /// solves leave: the balance misses by the sum of the final residual, measured near 1e-11 of the heat on the thermal bench).</summary>
    public const double BalanceTolerance = 1e-4;

    /// <summary>The accuracy promised: every node's rise within this fraction of the largest rise of the network's exact solution (a
    /// hundredth of the last digit reported, 4 significant figures; the grid's own discretisation error is of order a percent).</summary>
    public const double RiseAccuracy = 1e-6;

    /// <summary>
    /// The linear solves: relative residual 1e-5 (the eddy-current solve stops at 1e-8 of its own residual). What the user needs is the
    /// rise to <see cref="RiseAccuracy"/>: against the converged solution (CG to 1e-11) the rise misses by at most 1.1e-7 of the largest
    /// rise on the thermal bench's plate (fixed h, N = 64 to 512; measured 2 Dec 2026: 1.0e-7, 1.8e-8, 8.2e-9, 2.8e-8 at N = 64, 128,
    /// 256, 512) and by less on the dense-solve test plates (ThermalMultigridTests): the residual that CG with a multigrid preconditioner
    /// leaves is rough, and a rough residual moves the smooth rise little. The a priori bound of an M-matrix (max |r_u| / (2 h A_u),
    /// A^-1 being non-negative) would ask for a residual some 1e2 smaller (measured), at two or three more iterations.
    /// </summary>
    public static ConvergenceCriterion LinearCriterion { get; } = new() { RelativeResidual = 1e-5, MaxIterations = 400 };

    /// <summary>
    /// The first steps of the iteration from a cold start (a uniform rise) when more steps are to follow (radiation or held edges): relative
    /// residual 3e-1, then 1e-3; later steps solve to <see cref="LinearCriterion"/>. Each is as tight as its linearisation is right (an inexact
    /// Newton iteration): the first linearises the radiation about the uniform mean rise and misses the final rise by a few percent where the
    /// plate is uneven (the thermal bench's plate: hottest rise 54 K over a mean of 24 K; the next step moves the hottest rise by 1 K), and
    /// 3e-1 leaves an algebraic error near 3e-3 of the rise, still below that (1e-1 cost the bench's plate one V-cycle more, 2 instead of 1,
    /// for the same later steps: measured 3 Dec 2026, 6 CG iterations in all at N = 64 to 512 instead of 6-7); the second is linearised about
    /// that answer, so it misses by about 6 eps sigma T^2 (1 K)^2 / h, 1e-4 of the rise, and 1e-3 leaves some 3e-5 (the residual-to-error
    /// ratios measured for <see cref="LinearCriterion"/>). Only the iteration count depends on these: the stopping test is on tight steps alone.
    /// </summary>
    public static IReadOnlyList<ConvergenceCriterion> EarlyCriteria { get; } =
        [new() { RelativeResidual = 3e-1, MaxIterations = 400 }, new() { RelativeResidual = 1e-3, MaxIterations = 400 }];

    /// <summary>A step after the first reduces the residual it starts from at least by this factor (and to <see cref="LinearCriterion"/>).</summary>
    public const double StepReduction = 0.1;

    /// <summary>No step is asked for a relative residual below this: the products' rounding leaves about 1e-14 (measured on a uniform plate).</summary>
    public const double RoundingResidual = 1e-11;

    public static PlateTemperature Solve(PlateGrid grid, double[] cellLossW, double thermalConductivityWPerMK, double thicknessM, PlateCooling cooling) =>
        Solve(ThermalNetwork.Assemble(grid, thermalConductivityWPerMK, thicknessM, cooling.Edges), cellLossW, cooling);

    /// <param name="start">A temperature of a similar plate on the same grid (another thickness or material, another loss): its
    /// rise, scaled by the ratio of the heat inputs, starts the iteration. Only the number of iterations depends on it.</param>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]   // a few calls a run, each with long loops: optimised from the first
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
        double totalArea = network.TotalAreaM2;
        var fluid = cooling.Medium switch { CoolingMedium.Air => CoolingFluid.Air, CoolingMedium.Oil => CoolingFluid.MineralOil, _ => null };
        bool radiates = cooling.Emissivity > 0;
        double ambient = cooling.AmbientK;   // a local, not the field the outflow model's closure holds
        var radiation = new GreyFaces(cooling.Emissivity, ambient);

        var op = new ThermalOperator(network);
        var cg = new ThermalConjugateGradient(op);
        var rise = cg.X;   // the rise by node on the padded lattice: node n at pad + n
        int pad = op.Pad;
        var temperature = new double[map.Length];   // the answer; with radiation, until then each node's rise at the step's linearisation
        var previous = radiates ? temperature : null;
        double heldHeat = 0;   // the loss put on nodes held at ambient goes straight into the edge
        bool anyHeld = network.HeldNodes > 0;
        if (anyHeld) for (int n = 0; n < map.Length; n++) if (network.HeldNode[n]) heldHeat += nodeHeat[n];
        double perFace = Math.Max(heatIn - heldHeat, 0) / (2 * totalArea);   // W/m^2 each face would shed with no other heat into edges
        double lastMean = 0, lastRadiated = 0, lastEdge = 0;   // the last solve's mean rise and its radiated and edge heat per face (W/m^2)
        double hConv = 0;
        bool warm = start is not null && start.NodeTemperatureK.Length == map.Length && start.HeatInW > 0;
        if (warm)
        {
            double scale = heatIn / start!.HeatInW;
            for (int n = 0; n < map.Length; n++)
                if (map[n] >= 0 && double.IsFinite(start.NodeTemperatureK[n])) rise[pad + n] = scale * (start.NodeTemperatureK[n] - start.AmbientK);
        }
        // radiation of a face at a uniform rise r, and the model of the outflows other than convection at a mean rise r (W/m^2)
        double Uniform(double r) => SurfaceRadiation.HeatFluxWPerM2(cooling.Emissivity, cooling.AmbientK + r, cooling.AmbientK);
        double Other(double r) =>
            (lastMean > 0 && Uniform(lastMean) > 0 ? lastRadiated * Uniform(r) / Uniform(lastMean) : Uniform(r))
            + (lastMean > 0 ? lastEdge * r / lastMean : 0);
        bool iterates = radiates || (fluid is not null && anyHeld);   // more than one step is to be expected
        int iterations = 0, linear = 0;
        double residual = 0;
        double weighted = 0, radiatedNow = 0, edgeNow = 0;   // the last solve's sums of A r, A q_r(r) and the heat into held edges (W)
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
            bool first = iterations == 1;
            bool coldStart = first && !warm;
            // the first steps from a cold start only point the way when more steps are to follow; only a tight step can end the iteration
            bool tight = !iterates || warm || iterations > EarlyCriteria.Count;
            var (sumH, norms) = SetStep(network, op, cg, nodeHeat, hConv, radiation, first, coldStart ? predictedMean : null, tight ? previous : null);
            var multigrid = network.Preconditioner(op, sumH / unknowns);   // kept while h / (k t) moves little: an SPD preconditioner either way
            // a later step reduces its starting residual at least tenfold, so that a small move of h or of the radiation's linearisation is
            // still resolved (an inexact fixed-point iteration)
            var criterion = tight ? LinearCriterion : EarlyCriteria[iterations - 1];
            if (!first)
            {
                double target = Math.Max(StepReduction * norms.Residual / norms.RightHandSide, RoundingResidual);
                if (target < criterion.RelativeResidual) criterion = criterion with { RelativeResidual = target };
            }
            // only a tight step can end the iteration: it confirms its residual against a fresh b - A x
            if (!cg.TrySolve(multigrid, criterion, confirm: tight, out var report, norms))
                throw new NumericalFailureException($"plate temperature: {report.Description}");
            linear += report.Iterations;
            residual = report.RelativeResidual;
            var sums = SumRise(network, rise, pad, radiation, tight ? previous : null);
            double largest = sums.Largest, moved = sums.Moved;
            weighted = sums.Weighted; radiatedNow = sums.Radiated; edgeNow = sums.Edge;
            // a NaN or an infinite rise at any node makes these sums so (every node with an unknown has an area)
            if (!double.IsFinite(weighted) || !double.IsFinite(largest)) throw new NumericalFailureException("plate temperature: the solution is not finite");
            double meanRise = weighted / totalArea;
            // h off by a fraction e moves the rise by at most e h / (h + q_r'(T_inf)) of the largest rise: d rise = -A^-1 (2 A rise) dh, and the
            // M-matrix bound max |A^-1 v| <= max |v_n| / (2 A_n (h + q_r'(T_n))) with q_r' = 4 eps sigma T^3 no smaller than at ambient
            double riseFromH = fluid is null ? 0 : Math.Abs(NaturalConvection.AverageCoefficient(fluid, cooling.AmbientK, meanRise, cooling.VerticalLengthM) - hConv) / hConv
                * hConv / (hConv + 4 * cooling.Emissivity * SurfaceRadiation.StefanBoltzmann * Math.Pow(cooling.AmbientK, 3));
            double hottest = cooling.AmbientK + largest + moved;   // the hottest a node was between its linearisation point and now
            bool radiationSettled = !radiates || 6 * cooling.Emissivity * SurfaceRadiation.StefanBoltzmann * hottest * hottest * moved * moved / hConv <= RelativeTolerance * largest;
            if (largest == 0 || (tight && riseFromH <= RelativeTolerance && radiationSettled)) break;
            if (iterations >= MaxIterations)
                throw new NumericalFailureException(string.Create(CultureInfo.InvariantCulture,
                    $"plate temperature: the surface coefficients did not settle in {MaxIterations} iterations (h moves the rise by up to {riseFromH:G3} of the largest{(radiates ? $", last change {moved:G3} K" : "")} at a largest rise of {largest:G4} K)"));
            lastMean = Math.Max(meanRise, 0);
            lastRadiated = radiatedNow / totalArea;
            lastEdge = edgeNow / (2 * totalArea);
        }

        // the balance from the last solve's sums: convection 2 h A r and radiation 2 A q_r(r) from both faces (the exact law, not its
        // linearisation), the loss on held nodes and the heat their links take
        double convected = 2 * hConv * weighted, radiated = 2 * radiatedNow, edge = heldHeat + edgeNow;
        for (int n = 0; n < map.Length; n++)
            temperature[n] = map[n] >= 0 ? ambient + rise[pad + n] : network.HeldNode[n] ? ambient : double.NaN;
        double imbalance = Math.Abs(convected + radiated + edge - heatIn);
        if (heatIn > 0 && imbalance > BalanceTolerance * heatIn)
            throw new NumericalFailureException(string.Create(CultureInfo.InvariantCulture,
                $"plate temperature: the heat balance does not close (in {heatIn:G6} W, out {convected + radiated + edge:G6} W)"));
        return new PlateTemperature(network, temperature, cooling.AmbientK, hConv, heatIn, convected, radiated, edge, iterations, linear, residual);
    }

    /// <summary>
    /// The step's pass over the nodes: each unknown's diagonal (conduction plus 2 h A, with radiation h + q_r'(r0), the Newton step
    /// q_r(r) ~ q_r(r0) + q_r'(r0) (r - r0) about the node's rise r0) and right-hand side (the loss, less 2 A (q_r(r0) - q_r'(r0) r0) with
    /// radiation). The first step sets them (and the rise to <paramref name="uniformStart"/> from a cold start) and forms R = B - A X after;
    /// later steps change them in place with the residual following the change (<see cref="ThermalConjugateGradient.Update"/>). Returns the
    /// sum of the surface coefficients (for the preconditioner) and |r|, |b| and max |r| for the solve (as
    /// <see cref="ThermalConjugateGradient.Norms"/> gives them; the first step's |r| and max |r| from the residual pass). <paramref name="previous"/>: where to keep each rise the step starts from.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static (double SumH, (double Residual, double RightHandSide, double Largest) Norms) SetStep(ThermalNetwork network, ThermalOperator op,
        ThermalConjugateGradient cg, double[] nodeHeat, double hConv, GreyFaces radiation, bool first, double? uniformStart, double[]? previous)
    {
        var map = network.NodeUnknown;
        var area = network.NodeAreaM2;
        var unitDiagonal = network.UnitDiagonal;
        double kt = network.ConductanceScaleWPerK;
        var rise = cg.X; var residual = cg.R; var rightHandSide = cg.B; var diagonalByNode = op.DiagonalWPerK;
        int pad = op.Pad;
        bool radiates = radiation.Radiates, coldStart = uniformStart.HasValue;
        double start = uniformStart.GetValueOrDefault();
        double sumH = 0, residualSquared = 0, rightHandSideSquared = 0, largestResidual = 0;
        for (int n = 0; n < map.Length; n++)
        {
            int u = map[n];
            if (u < 0) continue;
            int q = pad + n;
            if (coldStart) rise[q] = start;
            double h = hConv, heat = nodeHeat[n], a = area[n];
            if (radiates)
            {
                double r0 = rise[q];
                if (previous is not null) previous[n] = r0;
                if (r0 < 0) r0 = 0;
                var (flux, slope) = radiation.FluxAndSlope(r0);
                h += slope;
                heat -= 2 * a * (flux - slope * r0);
            }
            sumH += h;
            double diagonal = kt * unitDiagonal[u] + 2 * h * a;   // ThermalNetwork.DiagonalAt
            if (first) { diagonalByNode[n] = diagonal; rightHandSide[q] = heat; }
            else
            {
                cg.Update(n, diagonal, heat);
                double r = residual[q];
                residualSquared += r * r;
                largestResidual = Math.Max(largestResidual, Math.Abs(r));
            }
            rightHandSideSquared += heat * heat;
        }
        if (first) (residualSquared, largestResidual) = cg.StartResidual();
        return (sumH, (Math.Sqrt(residualSquared), Math.Sqrt(rightHandSideSquared), largestResidual));
    }

    /// <summary>A solve's sums over the unknowns: the largest |rise| (K), sum of A r (m^2 K), sum of A q_r(r) (W, the exact law, one face),
    /// heat into held edges (W) and the largest move from <paramref name="previous"/> (K; 0 without).</summary>
    private readonly record struct RiseSums(double Largest, double Weighted, double Radiated, double Edge, double Moved);

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static RiseSums SumRise(ThermalNetwork network, double[] rise, int pad, GreyFaces radiation, double[]? previous)
    {
        var map = network.NodeUnknown;
        var area = network.NodeAreaM2;
        bool radiates = radiation.Radiates, anyHeld = network.HeldNodes > 0;
        double largest = 0, weighted = 0, radiated = 0, edge = 0, moved = 0;
        for (int n = 0; n < map.Length; n++)
        {
            int u = map[n];
            if (u < 0) continue;
            double value = rise[pad + n], a = area[n];
            largest = Math.Max(largest, Math.Abs(value));
            weighted += a * value;
            if (radiates)
            {
                if (previous is not null) moved = Math.Max(moved, Math.Abs(value - previous[n]));
                radiated += a * radiation.Flux(value);
            }
            if (anyHeld) edge += network.ConductanceToHeld(u) * value;
        }
        return new RiseSums(largest, weighted, radiated, edge, moved);
    }

    /// <summary>Grey-body radiation of a face at ambient + rise to surroundings at ambient (<see cref="SurfaceRadiation"/>), the rise
    /// being what the solver carries.</summary>
    private readonly struct GreyFaces(double emissivity, double ambientK)
    {
        public bool Radiates => emissivity > 0;

        /// <summary>q_r (W/m^2) at the given rise (K).</summary>
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public double Flux(double rise) => SurfaceRadiation.HeatFluxWPerM2(emissivity, ambientK + rise, ambientK);

        /// <summary>q_r (W/m^2) and q_r' (W/m^2K) at the given rise (K).</summary>
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public (double Flux, double Slope) FluxAndSlope(double rise) => SurfaceRadiation.HeatFluxAndSlope(emissivity, ambientK + rise, ambientK);
    }
}
