using SlotOpt.Tables;
using SlotOpt.Waveforms;

namespace SlotOpt.Input;

/// <summary>
/// Reads one period of a flux waveform from CSV: columns `phase,b_t` (phase as a fraction of the period,
/// 0 to 1) or `t_s,b_t` (time in seconds from the start of the period). A closing sample at phase 1 that
/// repeats the first value is dropped. Samples are joined by straight lines.
/// </summary>
public static class WaveformCsv
{
    /// <summary>Most samples read for one period (at 50 Hz, 100,000 samples are 5 million a second: far finer than any measured waveform).</summary>
    public const int MaxSamples = 100_000;

    public static PiecewiseLinearWaveform Read(string path, double frequencyHz)
    {
        var text = InputFile.ReadAllText(path, "waveform file", InputFile.MaxCsvBytes);
        return Parse(text, path, frequencyHz);
    }

    public static PiecewiseLinearWaveform Parse(string text, string sourceName, double frequencyHz)
    {
        var table = CsvTable.Parse(text, sourceName, MaxSamples + 1);   // + the closing sample that repeats the first
        var byPhase = table.Columns.Contains("phase");
        if (!byPhase && !table.Columns.Contains("t_s"))
            throw new InputException($"{sourceName}:1: the header must name phase,b_t or t_s,b_t");
        table.RequireColumns("b_t");
        var phases = new List<double>();
        var values = new List<double>();
        foreach (var row in table.Rows)
        {
            var phase = byPhase ? row.Number("phase") : row.Number("t_s") * frequencyHz;
            if (phase < 0 || phase > 1 + 1e-9)
                throw new InputException($"{sourceName}:{row.LineNumber}: {(byPhase ? "phase" : "t_s")} lies outside one period (phase {phase:0.####})");
            if (phases.Count > 0 && !(phase > phases[^1]))
                throw new InputException($"{sourceName}:{row.LineNumber}: times must increase");
            phases.Add(phase);
            values.Add(row.Number("b_t"));
        }
        if (phases.Count >= 2 && phases[^1] >= 1 - 1e-9)
        {
            var swing = values.Max() - values.Min();
            if (Math.Abs(values[^1] - values[0]) > 1e-6 * Math.Max(swing, 1e-12))
                throw new InputException($"{sourceName}: the sample at the end of the period must repeat the first value ({values[0]} T), got {values[^1]} T");
            phases.RemoveAt(phases.Count - 1);
            values.RemoveAt(values.Count - 1);
        }
        if (phases.Count < 2) throw new InputException($"{sourceName}: a waveform needs at least two samples in the period");
        return new PiecewiseLinearWaveform(frequencyHz, phases, values);
    }
}
