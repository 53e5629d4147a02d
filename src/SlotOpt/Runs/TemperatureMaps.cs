using SlotOpt.Design;

namespace SlotOpt.Runs;

/// <summary>
/// The temperature of a part's chosen plate beside its reference (current design or baseline), from the run's coupled
/// solves (<see cref="PlateHeat"/>): per panel the node temperatures (degC) on true coordinates (mm), NaN off the metal,
/// the hottest point, and one colour range shared by the panels (ambient to the hotter plate's hottest point).
/// </summary>
public sealed record TemperatureMaps(string PartName, IReadOnlyList<TemperatureMaps.Panel> Panels, double ScaleMinC, double ScaleMaxC, double? LimitC)
{
    /// <summary>One plate: node x and y (mm), temperature [j, i] (degC), hottest point (degC, mm), and the drawing.</summary>
    public sealed record Panel(EvaluatedOption Option, DesignRole Role, double[] XMm, double[] YMm, double[,] TemperatureC, double HottestC, double HottestXMm, double HottestYMm, double MeanRiseK, PlateDrawing Drawing);

    public const double CelsiusOffsetK = 273.15;

    /// <summary>The panels of one part, reference first; null when neither plate's coupled solve succeeded.</summary>
    public static TemperatureMaps? Of(string partName, IReadOnlyList<PlateHeat> heat)
    {
        var panels = new List<Panel>();
        foreach (var role in new[] { DesignRole.Reference, DesignRole.Chosen })
        {
            if (heat.FirstOrDefault(h => h.PartName == partName && h.Role == role) is not { Heating: { } heated } h) continue;
            var t = heated.Temperature;
            var l = t.Lattice;
            var x = Enumerable.Range(0, l.NodesX).Select(i => l.NodeX(i) * 1e3).ToArray();
            var y = Enumerable.Range(0, l.Ny + 1).Select(j => l.NodeY(j) * 1e3).ToArray();
            var map = new double[y.Length, x.Length];
            for (var j = 0; j < y.Length; j++)
                for (var i = 0; i < x.Length; i++)
                    map[j, i] = t.NodeTemperatureK[j * l.NodesX + i] - CelsiusOffsetK;   // NaN stays NaN off the metal
            panels.Add(new Panel(h.Option, role, x, y, map, t.HottestK - CelsiusOffsetK, t.HottestXM * 1e3, t.HottestYM * 1e3, t.MeanRiseK, h.Drawing));
        }
        if (panels.Count == 0) return null;
        var first = heat.First(h => h.PartName == partName && h.Heating is not null);
        var ambientC = first.Heating!.Temperature.AmbientK - CelsiusOffsetK;
        var limit = first.Limit;
        double? limitC = limit.MaxTemperatureK is { } mk ? mk - CelsiusOffsetK : limit.MaxRiseK is { } rise ? ambientC + rise : null;
        return new TemperatureMaps(partName, panels, ambientC, panels.Max(p => p.HottestC), limitC);
    }
}
