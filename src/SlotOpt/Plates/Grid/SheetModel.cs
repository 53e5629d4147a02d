using System.Diagnostics;
using SlotOpt.Numerics;
using SlotOpt.Plates.Geometry;

namespace SlotOpt.Plates.Grid;

/// <summary>
/// One plate geometry made ready to solve: grid, merged regions, operator at unit reference sheet
/// conductance (1 S), and the structured multigrid preconditioner. Build it once per slot geometry; every source,
/// source position, thickness and material reuses it (loss and drag scale linearly with the
/// reference sheet conductance, see <see cref="UnitConductanceSolution"/>).
/// </summary>
public sealed class SheetModel
{
    public PlateGrid Grid { get; }
    public NodeRegions Regions { get; }
    public SheetOperator Operator { get; }
    public StructuredMultigrid Multigrid { get; }
    public double SetupSeconds { get; }
    public int Unknowns => Regions.UnknownCount;
    public CellLattice Lattice => Grid.Lattice;

    private SheetModel(PlateGrid grid, NodeRegions regions, SheetOperator op, StructuredMultigrid mg, double setupSeconds)
    {
        Grid = grid;
        Regions = regions;
        Operator = op;
        Multigrid = mg;
        SetupSeconds = setupSeconds;
    }

    public static SheetModel Build(PlateGeometry geometry, GridOptions? options = null)
    {
        var clock = Stopwatch.StartNew();
        var grid = PlateGrid.Build(geometry, options);
        var regions = NodeRegions.Build(grid);
        var op = SheetOperator.Assemble(grid, regions);
        var mg = StructuredMultigrid.Build(grid, regions);
        return new SheetModel(grid, regions, op, mg, clock.Elapsed.TotalSeconds);
    }

    /// <summary>Right-hand side b = -s of A psi = -s from node integrals s of dBz/dt; merged nodes add up (Faraday's law around the hole).</summary>
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
        ConjugateGradient.TrySolve(Operator.Matrix, b, psi, Multigrid, criterion, out report);

    public SolveReport Solve(double[] b, double[] psi, ConvergenceCriterion criterion) =>
        ConjugateGradient.Solve(Operator.Matrix, b, psi, Multigrid, criterion);

    /// <summary>Loss at unit reference sheet conductance, P = psi^T A psi (W per S of reference conductance; instantaneous for this psi).</summary>
    public double LossPerSiemens(double[] psi)
    {
        var q = new double[Unknowns];
        Operator.Matrix.Multiply(psi, q);
        return ConjugateGradient.Dot(psi, q);
    }
}
