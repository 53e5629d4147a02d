using System.Text.Json.Serialization;

namespace SlotOpt.Reports.Json;

/// <summary>
/// A JSON document slotopt prints (result.json and every command's --json, errors included): its first key is
/// `schema_version`, raised whenever a key is renamed, removed or changes meaning.
/// </summary>
public abstract record VersionedJson
{
    /// <summary>
    /// The version of every document's keys. 2: one name per quantity across commands (issue 17). 3: result.json's
    /// `cp_sat_calls` and `cp_sat_deterministic_seconds` are `search_solver_calls` and `search_deterministic_seconds`
    /// (same meaning: the selection search's solver calls and its deterministic time).
    /// </summary>
    public const int CurrentSchemaVersion = 3;

    [JsonPropertyOrder(-1)]
    public int SchemaVersion => CurrentSchemaVersion;

    /// <summary>The document as text, one newline at the end.</summary>
    public string Serialize() => JsonFormat.Serialize(this, GetType());
}
