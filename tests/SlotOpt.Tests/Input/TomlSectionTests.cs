using SlotOpt.Input;
using SlotOpt.Input.Toml;

namespace SlotOpt.Tests.Input;

public class TomlSectionTests
{
    private static (TomlSection Root, InputErrors Errors) Read(string text)
    {
        var errors = new InputErrors();
        var table = TomlDocumentReader.Read(text, "p.toml", errors);
        return (new TomlSection(table, "", "p.toml", errors), errors);
    }

    [Fact]
    public void Reads_quantities_with_units_and_their_lines()
    {
        var (root, errors) = Read("[[parts]]\nname = \"stator\"\nflux = \"1.3 T\"\nthicknesses = [\"6 mm\", 0.008]\n");
        var part = Assert.Single(root.TableArray("parts", required: true));
        Assert.Equal("stator", part.RequiredString("name"));
        Assert.Equal(1.3, part.RequiredQuantity("flux", QuantityKind.FluxDensity));
        Assert.Equal([0.006, 0.008], part.QuantityList("thicknesses", QuantityKind.Length, required: true)!);
        Assert.Equal(3, part.LineOf("flux"));
        part.RejectUnknownKeys();
        root.RejectUnknownKeys();
        Assert.False(errors.Any);
    }

    [Fact]
    public void Reports_every_mistake_with_file_line_and_key()
    {
        var (root, errors) = Read("[problem]\nnmae = \"x\"\n[[parts]]\nflux = \"1.3 furlongs\"\nfrequency = -5\n");
        var problem = root.OptionalTable("problem")!;
        problem.OptionalString("name");
        problem.RejectUnknownKeys();
        var part = root.TableArray("parts", required: true)[0];
        part.RequiredString("name");
        part.RequiredQuantity("flux", QuantityKind.FluxDensity);
        part.PositiveQuantity("frequency", QuantityKind.Frequency, required: true);
        part.RejectUnknownKeys();
        Assert.Equal(4, errors.Messages.Count);
        Assert.Contains(errors.Messages, m => m.StartsWith("p.toml:2: problem.nmae: unknown key (did you mean name?)"));
        Assert.Contains(errors.Messages, m => m.StartsWith("p.toml:3: parts[1].name: missing"));
        Assert.Contains(errors.Messages, m => m.StartsWith("p.toml:4: parts[1].flux:"));
        Assert.Contains(errors.Messages, m => m.StartsWith("p.toml:5: parts[1].frequency: must be positive"));
    }

    [Fact]
    public void Syntax_errors_and_duplicates_name_their_line()
    {
        var (_, syntax) = Read("a = 1\nb = \n");
        Assert.True(syntax.Messages.Any(m => m.StartsWith("p.toml:2:")), string.Join(" / ", syntax.Messages));
        var (_, duplicate) = Read("a = 1\nb = 2\na = 3\n");
        Assert.True(duplicate.Messages.Any(m => m.StartsWith("p.toml:3:") && m.Contains("`a`")), string.Join(" / ", duplicate.Messages));
    }

    [Fact]
    public void Sub_tables_of_an_array_of_tables_attach_to_its_last_item()
    {
        var (root, errors) = Read("[[parts]]\nname = \"a\"\n[[parts]]\nname = \"b\"\n[[parts.slots]]\npattern = \"comb\"\n");
        var parts = root.TableArray("parts", required: true);
        Assert.Equal(2, parts.Count);
        Assert.Empty(parts[0].TableArray("slots", required: false));
        Assert.Equal("comb", Assert.Single(parts[1].TableArray("slots", required: false)).RequiredString("pattern"));
        Assert.False(errors.Any);
    }
}
