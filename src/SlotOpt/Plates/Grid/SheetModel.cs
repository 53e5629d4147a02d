using System.Diagnostics;
using System.Runtime.CompilerServices;
using SlotOpt.Numerics;
using SlotOpt.Plates.Geometry;

namespace SlotOpt.Plates.Grid;

/// <summary>
/// One plate geometry made ready to solve: grid, merged regions, the structured multigrid
/// preconditioner and the sheet operator at unit reference sheet conductance (1 S) on its lattice;
/// the operator as a stored CSR matrix only when a caller asks for it (the plate's own field). Build it once per slot geometry; every source,
/// source position, thickness and material reuses it (loss and drag scale linearly with the
/// reference sheet conductance, see <see cref="UnitConductanceSolution"/>). A model serves one thread at a
/// time: its solves share the multigrid's buffers (parallel runs build one model per geometry and thread).
/// </summary>
public sealed class SheetModel
{
    public PlateGrid Grid { get; }
    public NodeRegions Regions { get; }
    private readonly Lazy<SheetOperator> _operator;
    /// <summary>The sheet operator as a CSR matrix, assembled on first use (the thin-plate solves use <see cref="StructuredMultigrid.Operator"/>).</summary>
    public SheetOperator Operator => _operator.Value;
    public StructuredMultigrid Multigrid { get; }
    public double SetupSeconds { get; }
    public int Unknowns => Regions.UnknownCount;
    public CellLattice Lattice => Grid.Lattice;

    private SheetModel(PlateGrid grid, NodeRegions regions, StructuredMultigrid mg, double setupSeconds)
    {
        Grid = grid;
        Regions = regions;
        _operator = new Lazy<SheetOperator>(() => SheetOperator.Assemble(grid, regions));
        Multigrid = mg;
        SetupSeconds = setupSeconds;
    }

    public static SheetModel Build(PlateGeometry geometry, GridOptions? options = null)
    {
        var clock = Stopwatch.StartNew();
        var grid = PlateGrid.Build(geometry, options);
        var regions = NodeRegions.Build(grid);
        var mg = StructuredMultigrid.Build(grid, regions);
        return new SheetModel(grid, regions, mg, clock.Elapsed.TotalSeconds);
    }

    /// <summary>Right-hand side b = -s of A psi = -s from node integrals s of dBz/dt; merged nodes add up (Faraday's law around the hole).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public double[] RightHandSide(double[] nodeIntegral)
    {
        var b = new double[Unknowns];
        var map = Regions.NodeUnknown;
        for (int n = 0; n < map.Length; n++)
            if (map[n] >= 0) b[map[n]] -= nodeIntegral[n];
        return b;
    }

    /// <summary>Solves A psi = b; psi holds the warm start on entry. False (with the report) when it does not converge.</summary>
    public bool TrySolve(double[] b, double[] psi, ConvergenceCriterion criterion, out SolveReport report) =>
        Multigrid.TrySolve(b, psi, criterion, out report);

    public SolveReport Solve(double[] b, double[] psi, ConvergenceCriterion criterion) =>
        TrySolve(b, psi, criterion, out var report) ? report : throw new NumericalFailureException($"sheet solver: {report.Description}");

    /// <summary>Loss at unit reference sheet conductance, P = psi^T A psi (W per S of reference conductance; instantaneous for this psi).</summary>
    public double LossPerSiemens(double[] psi)
    {
        var q = new double[Unknowns];
        Multigrid.Operator.Multiply(psi, q);
        return ConjugateGradient.Dot(psi, q);
    }
}
