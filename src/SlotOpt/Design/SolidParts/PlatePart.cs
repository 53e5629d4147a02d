using System.Globalization;
using SlotOpt.Materials;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Thermal;
using SlotOpt.Tables;

namespace SlotOpt.Design.SolidParts;

/// <summary>
/// A solid conductive part (clamp or tie plate, rail, carrier plate, shield) in an AC field or past
/// moving poles, or a disc turning under magnets (Disc set, <see cref="PlateExcitation.Turning"/>, with its torque limits).
/// The choice is thickness x material x (solid, or one slot pattern of a family) x process.
/// </summary>
public sealed record PlatePart(
    string Name,
    int Line,
    double TemperatureK,
    double? MaxLossW,
    Polygon Outline,
    IReadOnlyList<double> ThicknessesM,
    IReadOnlyList<string> Materials,
    PlateExcitation Excitation,
    IReadOnlyList<SlotFamily> SlotFamilies,
    IReadOnlyList<string> Processes,
    double? MaxDragN,
    double MinLigamentM,
    double? CellSizeM,
    PlateChoice? Current,
    PartThermal? Thermal = null,
    DiscShape? Disc = null,
    double? MaxTorqueNm = null,
    BrakingMinimum? MinBraking = null) : Part(Name, Line, TemperatureK, MaxLossW)
{
    /// <summary>thickness x material x (solid x processes + every slot option).</summary>
    public long OptionCount => (long)ThicknessesM.Count * Materials.Count * (Processes.Count + SlotFamilies.Sum(f => f.OptionCount));

    protected override LossKind DefaultLossKind => LossKind.Load;
}

/// <summary>One fixed design of a plate: thickness, material, process, and its slots (null for a solid plate).</summary>
public sealed record PlateChoice(double ThicknessM, string Material, string Process, SlotChoice? Slots) : DesignChoice;

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
            string.Create(CultureInfo.InvariantCulture, $"{conductor.Name}: k {Numbers.Of(k, "W/(m K)")} (built-in table), resistivity following {conductor.Name}'s law from {referenceK - 273.15:0.#} degC"));
    }
}
