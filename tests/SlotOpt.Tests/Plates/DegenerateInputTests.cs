using SlotOpt.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Tests.Plates;

/// <summary>Impossible or extreme input gives a clear InputException or a zero with a note: never a crash or a hang.</summary>
public class DegenerateInputTests
{
    [Fact]
    public void Slot_wider_than_the_plate_is_refused()
    {
        var plate = PlateGeometry.Rectangle(0.1, 0.05);
        var e = Assert.Throws<InputException>(() => SlotPatterns.Comb(plate.Outline, PlateEdge.Bottom, 0.3, 0.02, 0.2));
        Assert.Contains("wider than the plate edge", e.Message);
    }

    [Fact]
    public void Slot_deeper_than_the_plate_is_refused()
    {
        var plate = PlateGeometry.Rectangle(0.1, 0.05);
        var e = Assert.Throws<InputException>(() => SlotPatterns.Comb(plate.Outline, PlateEdge.Bottom, 0.02, 0.06, 0.002));
        Assert.Contains("cuts right through", e.Message);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(-1e-3)]
    [InlineData(double.NaN)]
    public void Zero_or_negative_thickness_is_refused(double thicknessM)
    {
        var e = Assert.Throws<InputException>(() => new ConductingSheet(3.5e7, thicknessM));
        Assert.Contains("thickness must be positive", e.Message);
    }

    // 1 m x 1 m at 0.1 mm cells is 1e8 cells; at GridOptions.BytesPerCellEstimate = 240 B (measured by the
    // bench) that is 24.0 GB, far above the 4.2 M-cell limit. The message must carry that estimate.
    [Fact]
    public void Grid_beyond_the_memory_limit_is_refused_with_the_estimate()
    {
        var e = Assert.Throws<InputException>(() => SheetModel.Build(PlateGeometry.Rectangle(1, 1), new GridOptions { CellSizeM = 1e-4 }));
        Assert.Contains("100000000 cells", e.Message);   // 1 m / 0.1 mm = 1e4 cells each way; the number rule keeps every integer digit
        Assert.Contains("24 GB", e.Message);
    }

    // Automatic sizing wants 8 cells across the narrowest strip (0.1 mm strips on a 1 m plate would need
    // 6.4e9 cells): it is capped at MaxAutoCells with a note saying how many cells the strip gets.
    [Fact]
    public void Automatic_grid_is_capped_with_a_note()
    {
        var plate = PlateGeometry.Rectangle(1, 1);
        plate.AddPattern(SlotPatterns.Comb(plate.Outline, PlateEdge.Bottom, 0.0101, 0.5, 0.01));
        var grid = PlateGrid.Build(plate, new GridOptions { MaxAutoCells = 10_000 });
        Assert.True(grid.Lattice.CellCount <= 10_000, $"{grid.Lattice.CellCount} cells");
        Assert.Contains(grid.Notes, n => n.Contains("grid capped"));
    }

    [Fact]
    public void Plate_with_nothing_conducting_is_refused()
    {
        var plate = PlateGeometry.Rectangle(0.1, 0.1).AddZone(new ConductivityZone(Polygon.Rectangle(-1, -1, 1, 1), 0));
        var e = Assert.Throws<InputException>(() => SheetModel.Build(plate, new GridOptions { CellSizeM = 0.01 }));
        Assert.Contains("no conducting area", e.Message);
    }

    // A solve that cannot meet its target within the iteration limit reports failure: TrySolve returns
    // false with the residual reached, Solve throws NumericalFailureException. Target 1e-15 is below
    // double rounding for this system and 1 iteration is too few; the residual must stay above the target.
    [Fact]
    public void Non_convergence_is_a_failure_not_a_number()
    {
        var model = SheetModel.Build(PlateGeometry.Rectangle(0.2, 0.1), new GridOptions { CellSizeM = 0.002 });
        var strict = new ConvergenceCriterion { RelativeResidual = 1e-15, MaxIterations = 1 };
        Assert.False(ResistanceLimitedSolver.TrySolveAc(model, new UniformAcField(0.1, 50), strict, out var solution, out var failure));
        Assert.Null(solution);
        Assert.Contains("no convergence", failure);
        Assert.Throws<NumericalFailureException>(() => ResistanceLimitedSolver.SolveAc(model, new UniformAcField(0.1, 50), strict));
    }
}
