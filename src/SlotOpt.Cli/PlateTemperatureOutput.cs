using System.Globalization;
using System.Text;
using SlotOpt.Plates.Thermal;
using SlotOpt.Runs;

namespace SlotOpt.Cli;

/// <summary>The temperature lines of `slotopt plate` for a plate file with [thermal].</summary>
internal static class PlateTemperatureOutput
{
    public static void AppendText(StringBuilder s, PlateFileEvaluation e)
    {
        if (e.Heating is not { } h) return;
        var c = CultureInfo.InvariantCulture;
        var t = h.Temperature;
        var cooling = e.Case.Thermal!.Cooling;
        string how = cooling.Medium switch
        {
            CoolingMedium.Fixed => string.Create(c, $"h {t.ConvectionCoefficientWPerM2K:G3} W/m2K given"),
            var m => string.Create(c, $"natural convection in {(m == CoolingMedium.Air ? "air" : "oil")}, h {t.ConvectionCoefficientWPerM2K:G3} W/m2K at the mean rise (Churchill-Chu, height {cooling.VerticalLengthM * 1e3:G4} mm)"),
        };
        s.AppendLine(c, $"  hottest point        {t.HottestK - 273.15:0.#} degC (rise {t.MaxRiseK:G3} K) at x {t.HottestXM * 1e3:G4} mm, y {t.HottestYM * 1e3:G4} mm");
        s.AppendLine(c, $"  mean rise            {t.MeanRiseK:G3} K above ambient {t.AmbientK - 273.15:0.#} degC");
        s.AppendLine(c, $"  resistivity at       the local temperature, {h.ResistivityMinK - 273.15:0.#} to {h.ResistivityMaxK - 273.15:0.#} degC (loss-weighted mean {h.LossWeightedTemperatureK - 273.15:0.#} degC), {h.CouplingIterations} coupling iterations");
        s.AppendLine(c, $"  cooling              {how}; radiation {(cooling.Emissivity > 0 ? string.Create(c, $"emissivity {cooling.Emissivity:G3}") : "off")}; edges {(cooling.Edges == ThermalEdge.Ambient ? "held at ambient" : "insulated")}");
        s.AppendLine(c, $"  heat out             convected {t.ConvectedW:G4} W, radiated {t.RadiatedW:G4} W, to edges {t.EdgeW:G4} W");
        s.AppendLine($"  material             {e.Case.Thermal.Material.Description}");
        var limit = e.Case.Thermal.Limit;
        if (limit.IsSet) s.AppendLine($"  temperature limit    {limit.Breach(t) ?? "met"}");
        foreach (var n in h.Notes) s.AppendLine($"  note: {n}");
    }
}
