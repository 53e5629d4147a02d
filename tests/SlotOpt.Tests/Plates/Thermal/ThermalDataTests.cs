using SlotOpt.Materials;

namespace SlotOpt.Tests.Plates.Thermal;

public class ThermalDataTests
{
    // Every built-in conductor has a thermal conductivity, so any plate material can be given [thermal].
    [Fact]
    public void Every_conductor_has_a_thermal_conductivity()
    {
        foreach (var c in MaterialLibrary.BuiltIn.Conductors)
            Assert.True(ThermalConductivityTable.TryGet(c.Name, out var k, out var source) && k > 0 && source.Length > 0, c.Name);
    }

    // Cross-check of the table against the resistivity data by the Wiedemann-Franz law, k rho / T = L0 with the
    // Sommerfeld value L0 = (pi^2 / 3)(k_B / e)^2 = 2.443e-8 W Ohm/K^2 (C. Kittel, Introduction to Solid State
    // Physics, 8th ed., 2005, ch. 6, eq. 6.58); for copper, aluminium and their alloys and brass, where electrons
    // carry the heat. Tolerance 15 %: measured Lorenz numbers of these metals near room temperature lie between
    // about 2.1e-8 and 2.5e-8 (Kittel Table 6.5, from memory). Stainless and carbon steel are left out: lattice
    // conduction is a large share there.
    [Theory]
    [InlineData("Cu-IACS")]
    [InlineData("Cu-ETP")]
    [InlineData("Al-99.99")]
    [InlineData("Al-1350")]
    [InlineData("Al-6061-T6")]
    [InlineData("Al-6063-T6")]
    [InlineData("Brass-C26000")]
    public void Conductivity_agrees_with_Wiedemann_Franz(string name)
    {
        const double lorenz = 2.443e-8;
        var conductor = MaterialLibrary.BuiltIn.GetConductor(name, "test");
        Assert.True(ThermalConductivityTable.TryGet(name, out var k, out _));
        double ratio = k * conductor.ResistivityAt(293.15) / 293.15 / lorenz;
        Assert.InRange(ratio, 0.85, 1.15);
    }
}
