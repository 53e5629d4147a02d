using SlotOpt.Tables;
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
        var t = h.Temperature;
        var cooling = e.Case.Thermal!.Cooling;
        string how = cooling.Medium switch
        {
            CoolingMedium.Fixed => $"h {Numbers.Sig(t.ConvectionCoefficientWPerM2K)} W/m2K given",
            var m => $"natural convection in {(m == CoolingMedium.Air ? "air" : "oil")}, h {Numbers.Sig(t.ConvectionCoefficientWPerM2K)} W/m2K at the mean rise (Churchill-Chu, height {Numbers.Of(cooling.VerticalLengthM * 1e3, "mm")})",
        };
        s.AppendLine($"  hottest point        {Numbers.Celsius(t.HottestK, "degC")} (rise {Numbers.Kelvin(t.MaxRiseK)}) at x {Numbers.Of(t.HottestXM * 1e3, "mm")}, y {Numbers.Of(t.HottestYM * 1e3, "mm")}");
        s.AppendLine($"  mean rise            {Numbers.Kelvin(t.MeanRiseK)} above ambient {Numbers.Celsius(t.AmbientK, "degC")}");
        s.AppendLine($"  resistivity at       the local temperature, {Numbers.Celsius(h.ResistivityMinK, "degC")} to {Numbers.Celsius(h.ResistivityMaxK, "degC")} (loss-weighted mean {Numbers.Celsius(h.LossWeightedTemperatureK, "degC")}), {h.CouplingIterations} coupling iterations");
        s.AppendLine($"  cooling              {how}; radiation {(cooling.Emissivity > 0 ? $"emissivity {Numbers.Sig(cooling.Emissivity)}" : "off")}; edges {(cooling.Edges == ThermalEdge.Ambient ? "held at ambient" : "insulated")}");
        s.AppendLine($"  heat out             convected {Numbers.Watts(t.ConvectedW)}, radiated {Numbers.Watts(t.RadiatedW)}, to edges {Numbers.Watts(t.EdgeW)}");
        s.AppendLine($"  material             {e.Case.Thermal.Material.Description}");
        var limit = e.Case.Thermal.Limit;
        if (limit.IsSet) s.AppendLine($"  temperature limit    {limit.Breach(t) ?? "met"}");
        foreach (var n in h.Notes) s.AppendLine($"  note: {n}");
    }
}
