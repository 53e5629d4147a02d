using System.Runtime.CompilerServices;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Thermal;

/// <summary>
/// The plate's steady temperature on the grid nodes with the heat balance that produced it: heat in
/// (the loss map), heat out by convection and radiation from both faces and into held edges.
/// </summary>
public sealed class PlateTemperature
{
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]   // a few calls a run, each with long loops: optimised from the first
    internal PlateTemperature(ThermalNetwork network, double[] nodeTemperatureK, double ambientK, double convectionCoefficientWPerM2K,
        double heatInW, double convectedW, double radiatedW, double edgeW, int iterations, int linearIterations, double relativeResidual)
    {
        Network = network;
        NodeTemperatureK = nodeTemperatureK;
        AmbientK = ambientK;
        ConvectionCoefficientWPerM2K = convectionCoefficientWPerM2K;
        HeatInW = heatInW;
        ConvectedW = convectedW;
        RadiatedW = radiatedW;
        EdgeW = edgeW;
        Iterations = iterations;
        LinearIterations = linearIterations;
        RelativeResidual = relativeResidual;
        double weighted = 0, area = 0;
        int hottest = -1;
        for (int n = 0; n < nodeTemperatureK.Length; n++)
        {
            if (double.IsNaN(nodeTemperatureK[n])) continue;
            weighted += network.NodeAreaM2[n] * (nodeTemperatureK[n] - ambientK);
            area += network.NodeAreaM2[n];
            if (hottest < 0 || nodeTemperatureK[n] > nodeTemperatureK[hottest]) hottest = n;
        }
        MeanRiseK = weighted / area;
        var l = network.Lattice;
        HottestK = nodeTemperatureK[hottest];
        HottestXM = l.NodeX(hottest % l.NodesX);
        HottestYM = l.NodeY(hottest / l.NodesX);
    }

    public ThermalNetwork Network { get; }
    public CellLattice Lattice => Network.Lattice;
    /// <summary>Temperature (K) per lattice node, row-major (j * (nx + 1) + i); NaN where the node has no metal.</summary>
    public double[] NodeTemperatureK { get; }
    public double AmbientK { get; }
    /// <summary>The convective coefficient of each face (W/m^2K): the given one, or the correlation's at the converged mean rise.</summary>
    public double ConvectionCoefficientWPerM2K { get; }
    public double HeatInW { get; }
    public double ConvectedW { get; }
    /// <summary>eps sigma (T^4 - T_inf^4) summed over both faces (the exact law, not its linearisation).</summary>
    public double RadiatedW { get; }
    /// <summary>Heat into the outer edge held at ambient (0 for insulated edges).</summary>
    public double EdgeW { get; }
    public int Iterations { get; }
    public int LinearIterations { get; }
    public double RelativeResidual { get; }

    public double HottestK { get; }
    public double HottestXM { get; }
    public double HottestYM { get; }
    public double MaxRiseK => HottestK - AmbientK;
    /// <summary>Rise above ambient averaged over the plate's face area.</summary>
    public double MeanRiseK { get; }

    /// <summary>Temperature per cell (K, row-major j * nx + i): the mean of its four corners; NaN for empty cells.</summary>
    public double[] CellTemperatureK()
    {
        var l = Lattice;
        var t = new double[l.CellCount];
        var g = Network.Grid.Conductance;
        for (int j = 0; j < l.Ny; j++)
            for (int i = 0; i < l.Nx; i++)
            {
                int c = j * l.Nx + i, n = j * l.NodesX + i;
                t[c] = g[c] > 0
                    ? (NodeTemperatureK[n] + NodeTemperatureK[n + 1] + NodeTemperatureK[n + l.NodesX] + NodeTemperatureK[n + l.NodesX + 1]) / 4
                    : double.NaN;
            }
        return t;
    }
}
