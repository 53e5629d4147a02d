using System.Globalization;
using System.Text.Json;

namespace SlotOpt.Tests.Cli;

public class LaminationCommandTests
{
    // IEC 60404-8-4: M270-35A is guaranteed at most 2.70 W/kg at 1.5 T 50 Hz; the acceptance band
    // is 2.0-2.70 W/kg (delivered material sits below the guarantee; common practice, no source).
    [Fact]
    public void Core_loss_of_M270_35A_at_its_specification_point()
    {
        var run = SlotOptInProcess.Run("core-loss", "--grade", "M270-35A", "--peak-flux-density", "1.5T", "--frequency", "50Hz", "--json");
        Assert.Equal(0, run.ExitCode);
        using var doc = JsonDocument.Parse(run.Stdout);
        var root = doc.RootElement;
        Assert.InRange(root.GetProperty("total_w_per_kg").GetDouble(), 2.0, 2.70);
        foreach (var key in new[] { "hysteresis_w_per_kg", "classical_w_per_kg", "excess_w_per_kg", "skin_factor", "width_factor" })
            Assert.True(root.TryGetProperty(key, out _), key);
        var sum = root.GetProperty("hysteresis_w_per_kg").GetDouble() + root.GetProperty("classical_w_per_kg").GetDouble() + root.GetProperty("excess_w_per_kg").GetDouble();
        Assert.Equal(root.GetProperty("total_w_per_kg").GetDouble(), sum, 1e-12);
    }

    [Theory]
    [InlineData("--grade", "M999-35Z", "--peak-flux-density", "1.5T", "--frequency", "50Hz")]
    [InlineData("--grade", "M270-35A", "--peak-flux-density", "1.5 furlongs", "--frequency", "50Hz")]
    [InlineData("--grade", "M270-35A", "--peak-flux-density", "1.5T", "--frequency", "-50Hz")]
    [InlineData("--grade", "M270-35A", "--peak-flux-density", "1.5T")]
    [InlineData("--grade", "M270-35A", "--peak-flux-density", "1.5T", "--frequency", "50Hz", "--temperature", "-400degC")]
    [InlineData("--grade", "M270-35A", "--peak-flux-density", "1.5T", "--frequency", "50Hz", "--waveform", "no-such-file.csv")]
    public void Bad_flags_give_one_clear_line_and_exit_code_2(params string[] flags)
    {
        var run = SlotOptInProcess.Run(["core-loss", .. flags]);
        Assert.Equal(2, run.ExitCode);
        Assert.StartsWith("error:", run.Stderr);
        Assert.DoesNotContain("   at ", run.Stderr);   // no stack trace
        Assert.Equal("", run.Stdout);
    }

    [Fact]
    public void Waveform_file_is_scaled_to_the_peak()
    {
        var dir = Directory.CreateTempSubdirectory("slotopt-wave-").FullName;
        try
        {
            // a trapezoid: ramps of a quarter period each, flat tops (an invented demo shape)
            File.WriteAllText(Path.Combine(dir, "trap.csv"), "phase,b_t\n0,-1\n0.25,1\n0.5,1\n0.75,-1\n");
            var run = SlotOptInProcess.Run("core-loss", "--grade", "M270-35A", "--peak-flux-density", "1.2T", "--frequency", "400Hz", "--waveform", Path.Combine(dir, "trap.csv"), "--json");
            Assert.Equal(0, run.ExitCode);
            using var doc = JsonDocument.Parse(run.Stdout);
            Assert.Equal(1.2, doc.RootElement.GetProperty("peak_flux_density_t").GetDouble(), 1e-12);
            // the classical term of this trapezoid: <(dB/dt)^2> = (2 Bp / (T/4))^2 / 2 = 32 Bp^2 f^2 (derived),
            // i.e. 16/pi^2 of the sine's; the skin factor multiplies it
            var sine = SlotOptInProcess.Run("core-loss", "--grade", "M270-35A", "--peak-flux-density", "1.2T", "--frequency", "400Hz", "--json");
            using var sineDoc = JsonDocument.Parse(sine.Stdout);
            var ratio = doc.RootElement.GetProperty("classical_w_per_kg").GetDouble() / doc.RootElement.GetProperty("skin_factor").GetDouble()
                        / (sineDoc.RootElement.GetProperty("classical_w_per_kg").GetDouble() / sineDoc.RootElement.GetProperty("skin_factor").GetDouble());
            Assert.Equal(16 / (Math.PI * Math.PI), ratio, 1e-9);
        }
        finally { Directory.Delete(dir, true); }
    }

    [Fact]
    public void Materials_lists_grades_and_conductors()
    {
        var run = SlotOptInProcess.Run("materials", "--json");
        Assert.Equal(0, run.ExitCode);
        using var doc = JsonDocument.Parse(run.Stdout);
        Assert.True(doc.RootElement.GetProperty("grades").GetArrayLength() >= 17);
        Assert.Contains(doc.RootElement.GetProperty("conductors").EnumerateArray(), c => c.GetProperty("name").GetString() == "Al-6061-T6");
    }

    // Recovery of known coefficients through the command (self-consistency, see LossCoefficientFitTests).
    [Fact]
    public void Fit_command_recovers_coefficients()
    {
        var dir = Directory.CreateTempSubdirectory("slotopt-fit-").FullName;
        try
        {
            const double kh = 0.018, alpha = 2.0, ke = 9e-4, d = 0.5e-3, rho = 0.42e-6, rhoM = 7700;
            var kc = Math.PI * Math.PI * d * d / (6 * rho * rhoM);
            var lines = new List<string> { "b_t,f_hz,w_per_kg" };
            foreach (var f in new[] { 50.0, 100, 400 })
            foreach (var b in new[] { 0.5, 1.0, 1.5 })
                lines.Add(string.Create(CultureInfo.InvariantCulture, $"{b},{f},{kh * f * Math.Pow(b, alpha) + kc * f * f * b * b + ke * Math.Pow(f * b, 1.5):R}"));
            File.WriteAllLines(Path.Combine(dir, "m.csv"), lines);
            var run = SlotOptInProcess.Run("fit", Path.Combine(dir, "m.csv"), "--thickness", "0.5mm", "--resistivity", "0.42 uOhm m", "--density", "7700 kg/m3", "--json");
            Assert.Equal(0, run.ExitCode);
            using var doc = JsonDocument.Parse(run.Stdout);
            Assert.Equal(kh, doc.RootElement.GetProperty("kh").GetDouble(), kh * 1e-6);
            Assert.Equal(alpha, doc.RootElement.GetProperty("alpha").GetDouble(), 1e-6);
            var bad = SlotOptInProcess.Run("fit", Path.Combine(dir, "m.csv"), "--thickness", "0.5", "--resistivity", "fast", "--density", "7700");
            Assert.Equal(2, bad.ExitCode);
            Assert.Contains("--resistivity", bad.Stderr);
        }
        finally { Directory.Delete(dir, true); }
    }
}
