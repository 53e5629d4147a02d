using SlotOpt.Design.Limits;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Thermal;
using Xunit.Abstractions;

namespace SlotOpt.Tests.Plates.Thermal;

/// <summary>
/// The memory model's thermal terms (<see cref="MemoryModel.ThermalKeptBytesPerCell"/>, <see cref="MemoryModel.ThermalSolveBytesPerCell"/>,
/// <see cref="MemoryModel.ThermalOptionBytesPerCell"/>) against the managed heap measured on a slotted plate of 21.6 k cells (the tie-plate
/// demo's grid size). Measured with the garbage collector's own counters: bytes allocated by this thread while solving
/// (GC.GetAllocatedBytesForCurrentThread, exact: every byte the solve could hold at its peak was allocated during it; the solve runs
/// on the calling thread) and bytes still reachable after a full collection (GC.GetTotalMemory: the whole process, so these tests run
/// alone, <see cref="ThermalMemoryCollection"/>). Not timed; the counts do not depend on the machine.
/// </summary>
[Collection(ThermalMemoryCollection.Name)]
public class ThermalMemoryTests(ITestOutputHelper output)
{
    private static PlateGrid TiePlateGrid()
    {
        var g = PlateGeometry.Rectangle(0.9, 0.15);
        g.AddPattern(SlotPatterns.Comb(g.Outline, PlateEdge.Bottom, 0.03, 0.115, 0.003));
        return PlateGrid.Build(g, new GridOptions { CellSizeM = 0.0025 });
    }

    private static double[] Loss(PlateGrid grid) =>
        Enumerable.Range(0, grid.Lattice.CellCount).Select(c => grid.Conductance[c] > 0 ? 1e-3 * grid.AreaFraction[c] : 0).ToArray();

    // What a geometry's screen allocates for its first solve (network, multigrid, the iteration's vectors, the answer) bounds what it
    // holds at its peak; the model's ThermalSolveBytesPerCell must cover it.
    [Fact]
    public void Solve_allocates_within_the_model()
    {
        var grid = TiePlateGrid();
        var loss = Loss(grid);
        var oil = new PlateCooling(CoolingMedium.Oil, 368.15, 0, ThermalEdge.Insulated, verticalLengthM: 0.15);
        new ThermalScreen(grid, ThermalEdge.Insulated).Solve(loss, 16.2, 0.01, oil);   // JIT and static tables first
        long before = GC.GetAllocatedBytesForCurrentThread();
        new ThermalScreen(grid, ThermalEdge.Insulated).Solve(loss, 16.2, 0.01, oil);
        double perCell = (double)(GC.GetAllocatedBytesForCurrentThread() - before) / grid.Lattice.CellCount;
        output.WriteLine($"allocated per cell: {perCell:F0} B");
        Assert.InRange(perCell, 1, MemoryModel.ThermalSolveBytesPerCell);
    }

    // What stays reachable: the screen's network with its cached multigrid (one per geometry), and each option's temperatures.
    [Fact]
    public void Kept_screen_and_temperatures_stay_within_the_model()
    {
        var grid = TiePlateGrid();
        var loss = Loss(grid);
        var oil = new PlateCooling(CoolingMedium.Oil, 368.15, 0, ThermalEdge.Insulated, verticalLengthM: 0.15);
        new ThermalScreen(grid, ThermalEdge.Insulated).Solve(loss, 16.2, 0.01, oil);
        long start = GC.GetTotalMemory(forceFullCollection: true);
        var screen = new ThermalScreen(grid, ThermalEdge.Insulated);
        var kept = new List<PlateTemperature> { screen.Solve(loss, 16.2, 0.01, oil) };
        long first = GC.GetTotalMemory(forceFullCollection: true);
        foreach (var (k, t) in new[] { (16.2, 0.008), (16.3, 0.012), (16.3, 0.01), (16.3, 0.008), (16.2, 0.012) }) kept.Add(screen.Solve(loss, k, t, oil));
        long all = GC.GetTotalMemory(forceFullCollection: true);
        double cells = grid.Lattice.CellCount;
        double keptPerCell = (first - start) / cells, perOption = (all - first) / cells / 5;
        output.WriteLine($"kept per cell: {keptPerCell:F0} B, per further option: {perOption:F0} B");
        GC.KeepAlive(kept);
        Assert.InRange(keptPerCell, 1, MemoryModel.ThermalKeptBytesPerCell + MemoryModel.ThermalOptionBytesPerCell);
        Assert.InRange(perOption, 1, MemoryModel.ThermalOptionBytesPerCell);
    }
}

/// <summary>The heap measurements run with no other test at work (GC.GetTotalMemory counts the whole process).</summary>
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class ThermalMemoryCollection
{
    public const string Name = "thermal memory measurements";
}
