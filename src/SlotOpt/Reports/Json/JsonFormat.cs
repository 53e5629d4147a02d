using System.Text.Encodings.Web;
using System.Text.Json;
using System.Text.Json.Nodes;
using System.Text.Json.Serialization;

namespace SlotOpt.Reports.Json;

/// <summary>
/// The one JSON configuration of slotopt (result.json and every command's --json): snake_case keys, kebab-case
/// enum values, indented, nulls left out, invariant numbers. A number that is not finite (NaN, an overflow to
/// infinity) is never written: it is a <see cref="NumericalFailureException"/> (exit 4) naming the key, and
/// nothing is printed.
/// </summary>
public static class JsonFormat
{
    public static readonly JsonSerializerOptions Options = Create(new FiniteOnly());

    /// <summary>The options with non-finite numbers written as a marked string, used only to find the key of one.</summary>
    private static readonly JsonSerializerOptions LocatingOptions = Create(new MarkNonFinite());

    private const string NonFiniteMarker = "\u0001slotopt-non-finite:";

    /// <summary>The value as one indented JSON document ending in a newline (an object, or a <see cref="JsonNode"/> built by hand).</summary>
    /// <exception cref="NumericalFailureException">A number in the value is NaN or infinite; the message names its key.</exception>
    public static string Serialize<T>(T value)
    {
        if (value is JsonNode node)
        {
            ThrowIfNonFinite(node);
            return node.ToJsonString(Options) + Environment.NewLine;
        }
        try
        {
            return JsonSerializer.Serialize(value, Options) + Environment.NewLine;
        }
        catch (Exception e) when (e is NumericalFailureException or ArgumentException)   // ArgumentException: a non-finite double inside a JsonNode member
        {
            ThrowIfNonFinite(JsonSerializer.SerializeToNode(value, LocatingOptions));
            throw;
        }
    }

    /// <summary>The value, as its runtime type, as one indented JSON document ending in a newline.</summary>
    /// <exception cref="NumericalFailureException">A number in the value is NaN or infinite; the message names its key.</exception>
    public static string Serialize(object value, Type type)
    {
        try
        {
            return JsonSerializer.Serialize(value, type, Options) + Environment.NewLine;
        }
        catch (Exception e) when (e is NumericalFailureException or ArgumentException)
        {
            ThrowIfNonFinite(JsonSerializer.SerializeToNode(value, type, LocatingOptions));
            throw;
        }
    }

    private static void ThrowIfNonFinite(JsonNode? node)
    {
        if (FirstNonFinite(node) is var (path, number))
            throw new NumericalFailureException($"the result's {path} is {number}, not a finite number; nothing was printed");
    }

    private static JsonSerializerOptions Create(JsonConverter<double> doubles) => new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        WriteIndented = true,
        Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
        DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
        Converters = { new JsonStringEnumConverter(JsonNamingPolicy.KebabCaseLower), doubles, new FiniteSingle() },
    };

    /// <summary>The JSON path ("parts[0].loss_w") and value of the first non-finite or marked number, depth first in document order.</summary>
    private static (string Path, string Number)? FirstNonFinite(JsonNode? node)
    {
        switch (node)
        {
            case JsonValue value when value.TryGetValue<string>(out var text) && text.StartsWith(NonFiniteMarker, StringComparison.Ordinal):
                return (PathOf(value), text[NonFiniteMarker.Length..]);
            case JsonValue value when value.TryGetValue<double>(out var number) && !double.IsFinite(number):
                return (PathOf(value), number.ToString(System.Globalization.CultureInfo.InvariantCulture));
            case JsonObject obj:
                foreach (var (_, child) in obj)
                    if (FirstNonFinite(child) is { } found) return found;
                return null;
            case JsonArray array:
                foreach (var child in array)
                    if (FirstNonFinite(child) is { } found) return found;
                return null;
            default:
                return null;
        }
    }

    private static string PathOf(JsonNode node) => node.GetPath().TrimStart('$').TrimStart('.');

    /// <summary>Writes finite doubles as numbers; throws on NaN and infinities.</summary>
    private sealed class FiniteOnly : JsonConverter<double>
    {
        public override double Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options) => reader.GetDouble();

        public override void Write(Utf8JsonWriter writer, double value, JsonSerializerOptions options)
        {
            if (!double.IsFinite(value)) throw new NumericalFailureException($"a result is {value}, not a finite number");
            writer.WriteNumberValue(value);
        }
    }

    /// <summary>Writes NaN and infinities as a marked string so that their place can be found.</summary>
    private sealed class MarkNonFinite : JsonConverter<double>
    {
        public override double Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options) => reader.GetDouble();

        public override void Write(Utf8JsonWriter writer, double value, JsonSerializerOptions options)
        {
            if (double.IsFinite(value)) writer.WriteNumberValue(value);
            else writer.WriteStringValue(NonFiniteMarker + value.ToString(System.Globalization.CultureInfo.InvariantCulture));
        }
    }

    /// <summary>Finite floats are written as floats; a non-finite one goes to the double converter, so the same rule holds.</summary>
    private sealed class FiniteSingle : JsonConverter<float>
    {
        public override float Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options) => reader.GetSingle();

        public override void Write(Utf8JsonWriter writer, float value, JsonSerializerOptions options)
        {
            if (float.IsFinite(value)) writer.WriteNumberValue(value);
            else ((JsonConverter<double>)options.GetConverter(typeof(double))).Write(writer, value, options);
        }
    }
}
