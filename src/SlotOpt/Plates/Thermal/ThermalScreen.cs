using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Thermal;

/// <summary>
/// The temperature solves of one plate geometry across the thicknesses and materials of the screen: one
/// <see cref="ThermalNetwork"/> for the grid, rescaled to each k t, so one multigrid preconditioner serves them
/// (<see cref="ThermalNetwork.Preconditioner"/>), and each solve starts from the last temperature found, scaled by the
/// heat ratio (<see cref="PlateTemperatureSolver.Solve(ThermalNetwork, double[], PlateCooling, PlateTemperature?)"/>).
/// The starts change only how many iterations a solve takes, never its answer (the same convergence criteria hold).
/// One screen per geometry and thread: it holds the V-cycle's vectors.
/// </summary>
public sealed class ThermalScreen(PlateGrid grid, ThermalEdge edges)
{
    private ThermalNetwork? _network;
    private PlateTemperature? _last;

    public PlateGrid Grid { get; } = grid;

    public PlateTemperature Solve(double[] cellLossW, double thermalConductivityWPerMK, double thicknessM, PlateCooling cooling)
    {
        if (cooling.Edges != edges) throw new ArgumentException($"the screen was built for {edges} edges", nameof(cooling));
        _network = _network is null
            ? ThermalNetwork.Assemble(Grid, thermalConductivityWPerMK, thicknessM, edges)
            : _network.WithConductivity(thermalConductivityWPerMK, thicknessM);
        _last = PlateTemperatureSolver.Solve(_network, cellLossW, cooling, _last);
        return _last;
    }
}
