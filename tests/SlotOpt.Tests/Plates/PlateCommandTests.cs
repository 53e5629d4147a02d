using System.Text.Json;
using SlotOpt.Cli;

namespace SlotOpt.Tests.Plates;

/// <summary>End to end through the command line: SlotOptCommand.Build().Parse(args).Invoke() with the console redirected.</summary>
[Collection("Console")]
public class PlateCommandTests
{
    private static (int Code, string Out, string Err) Run(params string[] args)
    {
        var oldOut = Console.Out; var oldErr = Console.Error;
        var o = new StringWriter(); var e = new StringWriter();
        Console.SetOut(o); Console.SetError(e);
        try { return (SlotOptCommand.Build().Parse(args).Invoke(), o.ToString(), e.ToString()); }
        finally { Console.SetOut(oldOut); Console.SetError(oldErr); }
    }

    /// <summary>
    /// The example plate: in the output folder when the test project copies Plates/Data there, else found
    /// by walking up from the output folder to the source tree.
    /// </summary>
    private static string ExamplePlate()
    {
        var copied = Path.Combine(AppContext.BaseDirectory, "Plates", "Data", "example-plate.toml");
        if (File.Exists(copied)) return copied;
        for (var d = new DirectoryInfo(AppContext.BaseDirectory); d is not null; d = d.Parent)
        {
            var source = Path.Combine(d.FullName, "tests", "SlotOpt.Tests", "Plates", "Data", "example-plate.toml");
            if (File.Exists(source)) return source;
        }
        throw new FileNotFoundException("example-plate.toml not found in the output folder or above it");
    }

    private static string TempDir()
    {
        var d = Path.Combine(Path.GetTempPath(), "slotopt-sheets-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(d);
        return d;
    }

    // A plain 200 x 100 mm plate, G = sigma t = 1e7 S/m x 1 mm = 1e4 S, in 10 mT at 50 Hz:
    // P = G omega^2 Bp^2 k1 a^3 b / 8 with k1(b/a = 2) from the T&G series (Timoshenko & Goodier 1970, ch. 10; see TorsionReference).
    // Tolerance 1 %: 100 cells across the short side (grid error ~2e-4, see TorsionAnalogyTests).
    [Fact]
    public void Plate_json_loss_matches_torsion_closed_form()
    {
        var dir = TempDir();
        var file = Path.Combine(dir, "plain.toml");
        File.WriteAllText(file, """
            [plate]
            width = "200 mm"
            height = "100 mm"
            thickness = "1 mm"
            conductivity = "1e7"
            [grid]
            cell = "1 mm"
            [source]
            kind = "uniform_ac"
            peak = "10 mT"
            frequency = "50 Hz"
            """);
        var (code, output, error) = Run("plate", file, "--json");
        Assert.True(code == 0, error);
        using var doc = JsonDocument.Parse(output);
        double loss = doc.RootElement.GetProperty("loss_w").GetDouble();
        double expected = TorsionReference.AcLossW(1e4, 0.01, 50, TorsionReference.Rectangle(0.1, 0.2));
        Assert.InRange(loss / expected - 1, -0.01, 0.01);
        Assert.True(doc.RootElement.GetProperty("unknowns").GetInt32() > 0);
        Assert.True(doc.RootElement.GetProperty("iterations").GetInt32() > 0);
        // the grid error and its method (the 4 mm grid leaves 25 cells across: three grids, DiscretisationError)
        Assert.True(doc.RootElement.GetProperty("discretisation_error").GetDouble() > 0);
        Assert.Equal("three-grid", doc.RootElement.GetProperty("grid_error_method").GetString());
        // Rm = mu0 sigma t omega L / 2 with L = 0.1 m (the smaller side): 1.2566e-6 * 1e7 * 1e-3 * 314.16 * 0.1 / 2 = 0.19739 [D]
        Assert.Equal(0.19739, doc.RootElement.GetProperty("reynolds_number").GetDouble(), 4e-5);
    }

    // Heald, Am. J. Phys. 56(6):521-522, 1988: F = 1/2 sigma t v B^2 pi R^2 for a circular
    // pole of radius R on a large sheet at low speed. Here R = 10 mm at the centre of a 200 mm square plate
    // (half-side 10 R; the finite plate lowers F by about (R/a)^2 = 1 %, see MovingPoleTests), 20 cells per R.
    // Tolerance 3 % (the brief): measured -1.6 % (finite plate plus first-order cut cells on the pole's circle).
    [Fact]
    public void Moving_pole_drag_through_the_command_matches_Heald()
    {
        var dir = TempDir();
        var file = Path.Combine(dir, "pole.toml");
        File.WriteAllText(file, """
            [plate]
            width = "200 mm"
            height = "200 mm"
            thickness = "1 mm"
            conductivity = "3.5e7"
            [grid]
            cell = "0.5 mm"
            [source]
            kind = "moving_poles"
            pole = "circle"
            radius = "10 mm"
            flux_density = "0.5 T"
            speed = "1 m/s"
            x = "100 mm"
            y = "100 mm"
            positions = 1
            average = "pass"
            """);
        var (code, output, error) = Run("plate", file, "--json");
        Assert.True(code == 0, error);
        using var doc = JsonDocument.Parse(output);
        double drag = doc.RootElement.GetProperty("drag_n").GetDouble();
        double heald = 0.5 * 3.5e7 * 1e-3 * 1 * 0.25 * Math.PI * 1e-4;
        Assert.InRange(drag / heald - 1, -0.03, 0.03);
        // Rm = mu0 sigma t v / 2 = 1.2566e-6 * 3.5e7 * 1e-3 * 1 / 2 = 0.021991 [D]
        Assert.Equal(0.021991, doc.RootElement.GetProperty("reynolds_number").GetDouble(), 2e-6);
        // Rm = 0.022 <= sqrt(0.01) = 0.1: the command ran the same model choice as `run` and kept the low-speed model
        Assert.Equal("resistance-limited", doc.RootElement.GetProperty("model").GetString());
    }

    // The same pole at 20 m/s (Rm = mu0 sigma t v / 2 = 0.44 > 0.1): the command must switch to the thin sheet with its
    // own field, as `run` does, and the drag must fall below the low-speed value of Heald (1988), F = 1/2 sigma t v B^2 pi R^2:
    // the eddy currents' own field screens the pole (Reitz, J. Appl. Phys. 41:2067, 1970: F/F_low < 1 for every Rm > 0;
    // about 1 - (3/4) Rm^2 = 0.85 for an axisymmetric source). Bound: below 0.97 F_low, above the 3 % discretisation
    // tolerance of the low-speed check and far from the expected 10-20 % reduction; and above 0.5 F_low (not screened away).
    [Fact]
    public void Fast_pole_runs_the_thin_sheet_model_with_its_own_field()
    {
        var dir = TempDir();
        var file = Path.Combine(dir, "fast.toml");
        File.WriteAllText(file, """
            [plate]
            width = "320 mm"
            height = "160 mm"
            thickness = "1 mm"
            conductivity = "3.5e7"
            [grid]
            cell = "2 mm"
            [source]
            kind = "moving_poles"
            pole = "circle"
            radius = "20 mm"
            flux_density = "0.5 T"
            speed = "20 m/s"
            x = "220 mm"
            y = "80 mm"
            positions = 1
            average = "pass"
            """);
        var (code, output, error) = Run("plate", file, "--json");
        Assert.True(code == 0, error);
        using var doc = JsonDocument.Parse(output);
        Assert.Equal("own-field", doc.RootElement.GetProperty("model").GetString());
        Assert.Contains("Rm = ", doc.RootElement.GetProperty("model_reason").GetString());
        double drag = doc.RootElement.GetProperty("drag_n").GetDouble();
        double low = 0.5 * 3.5e7 * 1e-3 * 20 * 0.25 * Math.PI * 0.02 * 0.02;
        Assert.InRange(drag / low, 0.5, 0.97);
    }

    // A field map that is uniform over the plate (10 mT at any phase, here 30 degrees) must give the uniform-field
    // loss: P = G omega^2 Bp^2 k1 a^3 b / 8 (Timoshenko & Goodier, Theory of Elasticity, 3rd ed., 1970, ch. 10, rectangle series). Tolerance 1 % as above.
    [Fact]
    public void Uniform_field_map_matches_torsion_closed_form()
    {
        var dir = TempDir();
        var csv = new System.Text.StringBuilder("x_m,y_m,amplitude_t,phase_deg\n");
        foreach (var y in new[] { -0.01, 0.05, 0.11 })
            foreach (var x in new[] { -0.01, 0.1, 0.21 })
                csv.Append(System.FormattableString.Invariant($"{x},{y},0.01,30\n"));
        File.WriteAllText(Path.Combine(dir, "field.csv"), csv.ToString());
        var file = Path.Combine(dir, "map.toml");
        File.WriteAllText(file, """
            [plate]
            width = "200 mm"
            height = "100 mm"
            thickness = "1 mm"
            conductivity = "1e7"
            [grid]
            cell = "1 mm"
            [source]
            kind = "field_map"
            file = "field.csv"
            frequency = "50 Hz"
            """);
        var (code, output, error) = Run("plate", file, "--json");
        Assert.True(code == 0, error);
        using var doc = JsonDocument.Parse(output);
        double expected = TorsionReference.AcLossW(1e4, 0.01, 50, TorsionReference.Rectangle(0.1, 0.2));
        Assert.InRange(doc.RootElement.GetProperty("loss_w").GetDouble() / expected - 1, -0.01, 0.01);
    }

    // The example file (invented scenario) end to end: text output, and a map with one row per cell
    // (400 mm x 200 mm at 2 mm: 200 x 100 cells) whose largest value is the reported peak current density.
    // Tolerance 1e-5 relative: the CSV stores 6 significant digits.
    [Fact]
    public void Example_plate_runs_and_writes_its_map()
    {
        var dir = TempDir();
        var mapFile = Path.Combine(dir, "map.csv");
        var example = ExamplePlate();
        var (code, output, error) = Run("plate", example, "--json", "--map", mapFile);
        Assert.True(code == 0, error);
        using var doc = JsonDocument.Parse(output);
        var lines = File.ReadAllLines(mapFile);
        Assert.Equal("x_m,y_m,j_a_per_m2", lines[0]);
        Assert.Equal(200 * 100, lines.Length - 1);
        double peak = lines.Skip(1).Max(l => double.Parse(l.Split(',')[2], System.Globalization.CultureInfo.InvariantCulture));
        double reported = doc.RootElement.GetProperty("peak_current_density_a_per_m2").GetDouble();
        Assert.InRange(peak / reported - 1, -1e-5, 1e-5);
        var (textCode, text, _) = Run("plate", example);
        Assert.Equal(0, textCode);
        Assert.Contains("loss", text);
    }

    // A user mistake exits with code 2 (ExitCodes.InvalidInput) and names file:line and key; nothing is written.
    [Fact]
    public void Bad_file_exits_2_with_file_line_and_key_and_writes_no_map()
    {
        var dir = TempDir();
        var file = Path.Combine(dir, "bad.toml");
        var mapFile = Path.Combine(dir, "map.csv");
        File.WriteAllText(file, "[plate]\nwidth = \"200 mm\"\nheight = \"100 mm\"\nthickness = \"0 mm\"\nconductivity = \"1e7\"\n[source]\nkind = \"uniform_ac\"\npeak = \"10 mT\"\nfrequency = \"50 Hz\"\n");
        var (code, _, error) = Run("plate", file, "--map", mapFile);
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains("bad.toml:4: plate.thickness: ", error);
        Assert.False(File.Exists(mapFile));
    }
}
