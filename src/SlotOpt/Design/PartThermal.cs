using System.Globalization;
using SlotOpt.Materials;
using SlotOpt.Plates.Thermal;

namespace SlotOpt.Design;

/// <summary>A plate part's cooling and temperature limit ([parts.thermal] in a problem file), validated and in SI.</summary>
public sealed record PartThermal(PlateCooling Cooling, TemperatureLimit Limit)
{
    /// <summary>
    /// The thermal side of one candidate material: k from the built-in table, and the conductivity at a temperature
    /// relative to the one at <paramref name="referenceK"/> (the temperature the sheet is given at), rho(T_ref)/rho(T) by the conductor's own law.
    /// </summary>
    public static ThermalMaterial MaterialOf(Conductor conductor, double referenceK, string where)
    {
        var k = ThermalConductivityTable.Of(conductor.Name, where);
        var rhoReference = conductor.ResistivityAt(referenceK);
        return new ThermalMaterial(k, t => rhoReference / conductor.ResistivityAt(t),
            string.Create(CultureInfo.InvariantCulture, $"{conductor.Name}: k {k:G4} W/(m K) (built-in table), resistivity following {conductor.Name}'s law from {referenceK - 273.15:0.#} degC"));
    }
}
