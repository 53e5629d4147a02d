using System.Reflection;

namespace SlotOpt.Tables;

/// <summary>Reads the data files shipped inside the engine assembly (Materials/Data/*.csv).</summary>
internal static class EmbeddedData
{
    public static CsvTable ReadCsv(string fileName)
    {
        var resource = "SlotOpt.Materials." + fileName;
        using var stream = Assembly.GetExecutingAssembly().GetManifestResourceStream(resource)
            ?? throw new InvalidOperationException($"embedded data file {resource} is missing from the build");
        using var reader = new StreamReader(stream);
        return CsvTable.Parse(reader.ReadToEnd(), "built-in " + fileName);
    }
}
