using CsCheck;
using SlotOpt.Input;
using SlotOpt.Input.Toml;

namespace SlotOpt.Tests.Input;

/// <summary>
/// The TOML reader and the problem reader on generated text (CsCheck; a failure prints the seed that
/// reproduces it): arbitrary strings, and strings built from TOML's own tokens so that most lines parse and
/// the deeper checks (tables, arrays, nesting, numbers, units) are reached. Nothing but an
/// <see cref="InputException"/> may leave the reader, and each of its lines names file:line.
/// </summary>
public class TomlReaderPropertyTests
{
    private static readonly string[] Tokens =
    [
        "a", "b", "problem", "parts", "name", "objective", "kind", "thickness", "grades", "frequency", ".", " = ", "=", "\n", "\n", "\n", " ",
        "[", "]", "[[", "]]", "{", "}", ",", "\"", "'", "\"\"\"", "'''", "#", "\\", "\"0.35 mm\"", "\"24.9 MS/m\"", "\"1e308 km\"",
        "1", "-0", "1e400", "inf", "nan", "-inf", "0x1F", "1_000", "true", "false", "1979-05-27", "07:32:00", "\"x\"", "é", "\u0000", "\r",
    ];

    private static readonly Gen<string> TomlLike = Gen.OneOfConst(Tokens).Array[0, 120].Select(parts => string.Concat(parts));

    [Fact]
    public void The_document_reader_collects_errors_and_never_throws()
    {
        Gen.OneOf(TomlLike, Gen.String).Sample(text =>
        {
            var errors = new InputErrors();
            try { TomlDocumentReader.Read(text, "p.toml", errors); }
            catch (Exception e) { throw new Xunit.Sdk.XunitException($"threw {e}\n--- text ---\n{text}"); }
            Assert.All(errors.Messages, m => Assert.StartsWith("p.toml:", m));
        }, iter: 20_000, threads: 1);
    }

    [Fact]
    public void The_problem_reader_raises_only_input_errors_with_a_line()
    {
        Gen.OneOf(TomlLike, Gen.String).Sample(text =>
        {
            try { ProblemReader.Read(text, "p.toml"); }
            catch (InputException e)
            {
                foreach (var line in e.Message.Split(Environment.NewLine))
                    Assert.Matches(@"^p\.toml:\d+: ", line);
            }
            catch (Exception e) { throw new Xunit.Sdk.XunitException($"threw {e}\n--- text ---\n{text}"); }
        }, iter: 10_000, threads: 1);
    }
}
