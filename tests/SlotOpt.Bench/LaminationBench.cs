using System.Diagnostics;
using System.Text.Json;
using SlotOpt.Lamination;
using SlotOpt.Materials;
using SlotOpt.Waveforms;

namespace SlotOpt.Bench;

/// <summary>
/// Lamination evaluations per second on one thread: a sine, and a 200-sample PWM-like waveform
/// (a 400 Hz sine with a switching ripple, invented for the bench). Wall clock and, beside it, the rate per second
/// of the process's CPU time (on a machine shared with other work the second is what one core delivers).
/// </summary>
public static class LaminationBench
{
    public static int Run(string[] args)
    {
        var json = args.Contains("--json");
        var steel = MaterialLibrary.BuiltIn.GetSteel("M270-35A", "bench");
        var pwm = PwmLikeWaveform(400, 1.2, samples: 200);

        var rows = new[]
        {
            Measure("sine", i => new SineWaveform(1.0 + 1e-9 * (i & 1023), 400), steel, reuseWaveform: false),
            Measure("pwm-like, 200 samples (spectrum cached)", _ => pwm, steel, reuseWaveform: true),
        };
        if (json)
        {
            foreach (var r in rows) Console.WriteLine(JsonSerializer.Serialize(new { case_name = r.Name, evaluations = r.Count, seconds = r.Seconds, per_second = r.Count / r.Seconds, per_cpu_second = r.Count / r.CpuSeconds }));
            return 0;
        }
        Console.WriteLine($"| waveform | evaluations | seconds | evaluations/s (one thread) | per CPU second |");
        Console.WriteLine($"|---|---:|---:|---:|---:|");
        foreach (var r in rows) Console.WriteLine($"| {r.Name} | {r.Count:N0} | {r.Seconds:0.000} | {r.Count / r.Seconds:N0} | {r.Count / r.CpuSeconds:N0} |");
        return 0;
    }

    private sealed record Row(string Name, long Count, double Seconds, double CpuSeconds);

    private static Row Measure(string name, Func<int, IFluxWaveform> waveform, ElectricalSteel steel, bool reuseWaveform)
    {
        double sink = 0;
        for (var i = 0; i < 2000; i++) sink += LaminationLossModel.Evaluate(steel, waveform(i)).TotalWPerKg; // warm-up
        var cpu = Process.GetCurrentProcess().TotalProcessorTime;
        var watch = Stopwatch.StartNew();
        long count = 0;
        while (watch.Elapsed.TotalSeconds < 2)
        {
            for (var i = 0; i < 1000; i++) sink += LaminationLossModel.Evaluate(steel, waveform(i)).TotalWPerKg;
            count += 1000;
        }
        var seconds = watch.Elapsed.TotalSeconds;
        var cpuSeconds = (Process.GetCurrentProcess().TotalProcessorTime - cpu).TotalSeconds;
        if (!double.IsFinite(sink)) throw new InvalidOperationException("non-finite loss in bench");
        return new Row(name, count, seconds, cpuSeconds);
    }

    /// <summary>B(t): a sine of the given peak plus a triangular ripple of 5 % at samples/2 times the fundamental.</summary>
    private static PiecewiseLinearWaveform PwmLikeWaveform(double frequencyHz, double peakT, int samples)
    {
        var phases = new double[samples];
        var values = new double[samples];
        for (var k = 0; k < samples; k++)
        {
            phases[k] = (double)k / samples;
            values[k] = peakT * (Math.Sin(2 * Math.PI * phases[k]) + (k % 2 == 0 ? 0.05 : -0.05));
        }
        return new PiecewiseLinearWaveform(frequencyHz, phases, values);
    }
}
