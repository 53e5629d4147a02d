namespace SlotOpt.Lamination;

/// <summary>
/// A reason to read a result with care: where the model leaves its ground. The message is worded when first read
/// (an evaluation in the hot path of a search raises flags far more often than anyone reads them); its text does
/// not depend on when that is.
/// </summary>
public sealed class ValidityFlag
{
    private readonly Func<string>? _describe;
    private string? _message;

    public ValidityFlag(string code, string message)
    {
        Code = code;
        _message = message;
    }

    /// <summary>A flag whose message <paramref name="describe"/> words on first read (it must depend only on values captured at the flag's creation).</summary>
    public ValidityFlag(string code, Func<string> describe)
    {
        Code = code;
        _describe = describe;
    }

    public string Code { get; }
    public string Message => _message ??= _describe!();

    /// <summary>As the record this once was printed: "ValidityFlag { Code = ..., Message = ... }".</summary>
    public override string ToString() => $"ValidityFlag {{ Code = {Code}, Message = {Message} }}";
}
