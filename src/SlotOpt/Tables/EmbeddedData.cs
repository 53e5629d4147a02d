using System.Reflection;

namespace SlotOpt.Tables;

/// <summary>
/// Reads the data files shipped inside the engine assembly (Materials/Data/*.csv, Design/Data/*.csv): the one
/// loader of built-in tables. The project file names each resource "SlotOpt.{room}.{file}".
/// </summary>
internal static class EmbeddedData
{
    /// <param name="room">The folder whose Data/ holds the file ("Materials", "Design").</param>
    public static CsvTable ReadCsv(string room, string fileName)
    {
        var resource = $"SlotOpt.{room}.{fileName}";
        using var stream = Assembly.GetExecutingAssembly().GetManifestResourceStream(resource)
            ?? throw new InvalidOperationException($"embedded data file {resource} is missing from the build");
        using var reader = new StreamReader(stream);
        return CsvTable.Parse(reader.ReadToEnd(), "built-in " + fileName);
    }
}
