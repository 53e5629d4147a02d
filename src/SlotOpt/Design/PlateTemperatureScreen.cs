using System.Globalization;
using SlotOpt.Materials;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Thermal;

namespace SlotOpt.Design;

/// <summary>
/// The temperature of plate options with [parts.thermal], cheap where the answer is clear and coupled where it is not.
/// In the resistance-limited regime the loss of an EMF-driven sheet falls when every cell's conductance falls (the
/// dissipated power is the maximum of 2 EMF.I - I.R.I over the currents, which falls as R rises: Rayleigh's
/// monotonicity, common practice, no source), and a plate never drops below ambient. So, per geometry, thickness and material:
/// <list type="number">
/// <item>Upper bound: the geometry's unit loss map scaled by sigma(ambient) t, one thermal solve. Within the limit: kept.</item>
/// <item>Lower bound: the same map scaled by sigma(T_upper hottest) t. Still above the limit: dropped.</item>
/// <item>Between the two: the coupled solve (<see cref="PlateHeating"/>) decides.</item>
/// </list>
/// The bounds are exact for the total loss and, as the loss redistributes only a little when the conductivity varies over
/// the plate, bound the hottest point in practice (tested: the coupled hottest lies between them). The run solves the
/// chosen and the reference plates coupled as well, and drops a chosen plate whose coupled temperature breaks the limit.
/// A plate so hot that the screen leaves the cooling fluid's or the resistivity's data breaks any limit set.
/// </summary>
public static class PlateTemperatureScreen
{
    /// <summary>The option's temperature and the rule it breaks (null if it keeps the limit or the part sets none).</summary>
    public sealed record Verdict(OptionTemperature? Temperature, RuleBreak? Breach, string? Flag);

    public static Verdict Check(PlatePart part, PlateOptions.SolvedGeometry solved, double thicknessM, Conductor material, EvaluationLimits limits)
    {
        var thermal = part.Thermal ?? throw new InvalidOperationException($"{part.Name} has no [parts.thermal]");
        var ci = CultureInfo.InvariantCulture;
        var limit = thermal.Limit;
        var ambientK = thermal.Cooling.AmbientK;
        PlateTemperature upper;
        try { upper = Uncoupled(part, solved, thicknessM, material, ambientK); }
        catch (Exception e) when (e is NumericalFailureException or InputException) { return TooHot(e.Message); }
        var upperT = OptionTemperature.Of(upper, ambientK, TemperatureMethod.UpperBound);
        if (!limit.IsSet || limit.Breach(upper) is null) return new Verdict(upperT, null, null);

        PlateTemperature lower;
        try { lower = Uncoupled(part, solved, thicknessM, material, upper.HottestK); }
        catch (Exception e) when (e is NumericalFailureException or InputException) { return TooHot(e.Message); }
        if (limit.Breach(lower) is { } lowerBreach)
            return new Verdict(OptionTemperature.Of(lower, upper.HottestK, TemperatureMethod.LowerBound), new RuleBreak(RuleKind.HotterThanLimit, $"{lowerBreach} even at the lower bound"), null);

        HeatedPlate coupled;
        try { coupled = Coupled(part, solved.Slots, thicknessM, material, limits); }
        catch (NumericalFailureException e) { return TooHot(e.Message); }
        var coupledT = OptionTemperature.Of(coupled.Temperature, coupled.LossWeightedTemperatureK, TemperatureMethod.Coupled);
        return new Verdict(coupledT, limit.Breach(coupled.Temperature) is { } b ? new RuleBreak(RuleKind.HotterThanLimit, b) : null, null);

        Verdict TooHot(string why) => limit.IsSet
            ? new Verdict(null, new RuleBreak(RuleKind.HotterThanLimit, $"too hot to compute, beyond the limit: {why}"), null)
            : new Verdict(null, null, $"temperature not computed: {why}");
    }

    /// <summary>The geometry's unit loss map scaled by the sheet conductance at one temperature, and the plate's temperature under it.</summary>
    public static PlateTemperature Uncoupled(PlatePart part, PlateOptions.SolvedGeometry solved, double thicknessM, Conductor material, double resistivityK)
    {
        var cooling = part.Thermal!.Cooling;
        var model = solved.Peak?.Model ?? throw new InvalidOperationException($"{part.Name}: no solved geometry to heat");
        var g = material.ConductivityAt(resistivityK) * thicknessM;
        var network = ThermalNetwork.Assemble(model.Grid, ThermalConductivityTable.Of(material.Name, part.Name), thicknessM, cooling.Edges);
        return PlateTemperatureSolver.Solve(network, solved.UnitCellLossW!.Select(p => p * g).ToArray(), cooling);
    }

    /// <summary>
    /// One plate design solved coupled on the grid the screen used, its resistivity referred to the part's temperature
    /// (the sheet the selection prices), so the `slotopt plate` command gives the same answer on the same plate.
    /// </summary>
    public static HeatedPlate Coupled(PlatePart part, SlotChoice? slots, double thicknessM, Conductor material, EvaluationLimits limits)
    {
        var (geometry, _) = PlateGeometryFactory.Build(part.Outline, slots);
        var thermal = part.Thermal!;
        var sheet = new ConductingSheet(material.ConductivityAt(part.TemperatureK), thicknessM, material.RelativePermeability);
        var thermalMaterial = PartThermal.MaterialOf(material, part.TemperatureK, part.Name);
        var grid = PlateOptions.GridOf(part, limits);
        return part.Excitation switch
        {
            PlateExcitation.AcField ac => PlateHeating.SolveAc(geometry, grid, ac.Source, sheet, thermalMaterial, thermal.Cooling),
            PlateExcitation.Moving moving => PlateHeating.SolveMoving(geometry, grid, moving.Poles, PlateOptions.TravelOffsets(part, slots), sheet, thermalMaterial, thermal.Cooling),
            _ => throw new ArgumentOutOfRangeException(nameof(part), part.Excitation.GetType().Name, "unknown plate excitation"),
        };
    }
}
