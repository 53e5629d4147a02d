using SlotOpt.Reports.Plots;
using System.Globalization;
using SlotOpt.Input;
using SlotOpt.Reports;
using SlotOpt.Runs;

namespace SlotOpt.Tests.Reports;

/// <summary>Issue 17: a part driven by a field map names its file in the report's inputs; a uniform field says so.</summary>
public sealed class FieldMapNamingTests : IDisposable
{
    private readonly string dir = Directory.CreateTempSubdirectory("slotopt-fieldmap-").FullName;

    public void Dispose() => Directory.Delete(dir, recursive: true);

    [Fact]
    public void The_inputs_name_the_field_map_file()
    {
        // a uniform 10 mT map over a 200 x 60 mm plate (invented demo data: the test checks wording, not a number)
        var csv = new System.Text.StringBuilder("x_m,y_m,peak_flux_density_t,phase_deg\n");
        foreach (var y in new[] { -0.01, 0.07 })
            foreach (var x in new[] { -0.01, 0.21 })
                csv.Append(CultureInfo.InvariantCulture, $"{x},{y},0.01,0\n");
        File.WriteAllText(Path.Combine(dir, "stray-field.csv"), csv.ToString());
        var problem = Path.Combine(dir, "p.toml");
        File.WriteAllText(problem, """
            [problem]
            name = "p"

            [[parts]]
            name = "shield"
            kind = "plate"
            width = "200 mm"
            height = "60 mm"
            thicknesses = ["5 mm"]
            materials = ["Al-6061-T6"]

            [parts.source]
            kind = "field_map"
            file = "stray-field.csv"
            frequency = "50 Hz"
            """);
        var r = DesignRun.Execute(ProblemReader.ReadFile(problem));
        var inputs = ReportContent.Build(r, new ReportFigures(null, null, [], [], [], []), "stamp").Blocks.OfType<Table>().SelectMany(t => t.Rows).SelectMany(row => row).ToList();
        Assert.Contains(inputs, cell => cell.Contains("AC field at 50 Hz from the field-map file stray-field.csv", StringComparison.Ordinal));
    }
}
