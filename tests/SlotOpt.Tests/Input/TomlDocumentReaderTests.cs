using SlotOpt.Input;
using SlotOpt.Input.Toml;

namespace SlotOpt.Tests.Input;

/// <summary>Nesting beyond the limit and numbers that are not finite end as errors with file, line and key (TOML v1.0.0 allows inf and nan; problem files do not).</summary>
public class TomlDocumentReaderTests
{
    private static IReadOnlyList<string> Errors(string text)
    {
        var errors = new InputErrors();
        TomlDocumentReader.Read(text, "p.toml", errors);
        return errors.Messages;
    }

    [Theory]
    [InlineData("[", "]")]
    [InlineData("{ b = ", "}")]
    public void Nesting_deeper_than_the_limit_is_an_error_on_its_line(string open, string close)
    {
        foreach (var depth in new[] { TomlDocumentReader.MaxDepth + 1, 64, 65, 100_000 })
        {
            var text = "x = 1\n\n# [[[[ in a comment\ns = \"[[[[[[\"\na = " + string.Concat(Enumerable.Repeat(open, depth)) + "1" + string.Concat(Enumerable.Repeat(close, depth)) + "\n";
            var message = Assert.Single(Errors(text));
            Assert.StartsWith("p.toml:5: ", message);
            Assert.Contains($"deeper than {TomlDocumentReader.MaxDepth}", message);
        }
    }

    [Fact]
    public void Nesting_up_to_the_limit_is_read()
    {
        var depth = TomlDocumentReader.MaxDepth;
        var text = "a = " + new string('[', depth) + "1" + new string(']', depth) + "\n";
        Assert.Empty(Errors(text));
    }

    [Theory]
    [InlineData("a = inf", "p.toml:1: a: inf is not a finite number")]
    [InlineData("a = -inf", "p.toml:1: a: -inf is not a finite number")]
    [InlineData("a = nan", "p.toml:1: a: nan is not a finite number")]
    [InlineData("a = 1e400", "p.toml:1: a: 1e400 is not a finite number")]
    [InlineData("[t]\nx = 2\nb = [1.0, -1e999]", "p.toml:3: t.b[2]: -1e999 is not a finite number")]
    [InlineData("c = { d = +inf }", "p.toml:1: c.d: +inf is not a finite number")]
    public void A_number_that_is_not_finite_is_an_error_naming_its_key(string text, string expected)
    {
        Assert.Equal([expected], Errors(text));
    }

    // A quantity that overflows when its unit is applied: 1e308 km is 1e311 m, beyond the largest double
    // (about 1.8e308, IEEE 754-2019 binary64).
    [Fact]
    public void A_quantity_that_overflows_in_its_unit_is_an_error_naming_its_key()
    {
        var errors = new InputErrors();
        var root = new TomlSection(TomlDocumentReader.Read("[plate]\nthickness = \"1e308 km\"\n", "p.toml", errors), "", "p.toml", errors);
        var plate = root.OptionalTable("plate")!;
        Assert.Null(plate.OptionalQuantity("thickness", QuantityKind.Length));
        var message = Assert.Single(errors.Messages);
        Assert.StartsWith("p.toml:2: plate.thickness: ", message);
        Assert.Contains("not a finite length", message);
    }
}
