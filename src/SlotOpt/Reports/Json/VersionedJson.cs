using System.Text.Json.Serialization;

namespace SlotOpt.Reports.Json;

/// <summary>
/// A JSON document slotopt prints (result.json and every command's --json, errors included): its first key is
/// `schema_version`, raised whenever a key is renamed, removed or changes meaning.
/// </summary>
public abstract record VersionedJson
{
    /// <summary>The version of every document's keys; 2: one name per quantity across commands (issue 17).</summary>
    public const int CurrentSchemaVersion = 2;

    [JsonPropertyOrder(-1)]
    public int SchemaVersion => CurrentSchemaVersion;

    /// <summary>The document as text, one newline at the end.</summary>
    public string Serialize() => JsonFormat.Serialize(this, GetType());
}
