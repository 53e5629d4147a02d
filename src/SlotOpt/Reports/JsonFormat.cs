using System.Text.Encodings.Web;
using System.Text.Json;
using System.Text.Json.Serialization;

namespace SlotOpt.Reports;

/// <summary>The one JSON configuration of slotopt (result.json and every command's --json): snake_case keys, kebab-case enum values, indented, nulls left out, invariant numbers.</summary>
public static class JsonFormat
{
    public static readonly JsonSerializerOptions Options = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        WriteIndented = true,
        Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
        DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
        Converters = { new JsonStringEnumConverter(JsonNamingPolicy.KebabCaseLower) },
    };

    /// <summary>The value as one JSON document ending in a newline.</summary>
    public static string Serialize<T>(T value) => JsonSerializer.Serialize(value, Options) + Environment.NewLine;
}
