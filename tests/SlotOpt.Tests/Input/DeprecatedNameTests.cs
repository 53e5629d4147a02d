using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Input;

namespace SlotOpt.Tests.Input;

/// <summary>
/// Issue 17: the old spellings of renamed keys and flags still work for one release, with a deprecation
/// warning, and give the same numbers as the new names (exact equality: the same value is read).
/// </summary>
public class DeprecatedNameTests
{
    private static string Core(string fluxKey, string widthKey) => $"""
        [problem]
        name = "t"

        [[parts]]
        name = "core"
        kind = "core"
        grades = ["M270-35A"]
        lamination_area = "0.01 m2"
        stack_height = "50 mm"
        {fluxKey} = "1.2 T"
        frequency = "50 Hz"
        {widthKey} = "4 mm"
        """;

    [Fact]
    public void Old_core_keys_read_as_the_new_ones_with_a_warning()
    {
        var old = ProblemReader.Read(Core("flux", "feature_width"), "old.toml");
        var renamed = ProblemReader.Read(Core("peak_flux_density", "tooth_or_limb_width"), "new.toml");
        Assert.Contains(old.Warnings, w => w.StartsWith("old.toml:10: parts[1].flux: deprecated name, read as peak_flux_density", StringComparison.Ordinal));
        Assert.Contains(old.Warnings, w => w.StartsWith("old.toml:12: parts[1].feature_width: deprecated name, read as tooth_or_limb_width", StringComparison.Ordinal));
        Assert.DoesNotContain(renamed.Warnings, w => w.Contains("deprecated", StringComparison.Ordinal));
        var a = Assert.IsType<CorePart>(Assert.Single(old.Parts));
        var b = Assert.IsType<CorePart>(Assert.Single(renamed.Parts));
        Assert.Equal(b.Flux.PeakT, a.Flux.PeakT);
    }

    [Fact]
    public void Old_and_new_name_together_is_an_error()
    {
        var text = Core("peak_flux_density", "tooth_or_limb_width").Replace("frequency = ", "flux = \"1.0 T\"\nfrequency = ");
        var e = Assert.Throws<InputException>(() => ProblemReader.Read(text, "both.toml"));
        Assert.Contains("both.toml:11: parts[1].flux: give peak_flux_density only", e.Message);
    }

    [Fact]
    public void The_old_flag_works_and_warns()
    {
        var old = SlotOpt.Tests.Cli.SlotOptInProcess.Run("core-loss", "--grade", "M270-35A", "--peak", "1.5T", "--frequency", "50Hz", "--json");
        var renamed = SlotOpt.Tests.Cli.SlotOptInProcess.Run("core-loss", "--grade", "M270-35A", "--peak-flux-density", "1.5T", "--frequency", "50Hz", "--json");
        Assert.Equal(0, old.ExitCode);
        Assert.Equal(renamed.Stdout, old.Stdout);
        Assert.Contains("warning: --peak is deprecated; write --peak-flux-density", old.Stderr);
        Assert.DoesNotContain("deprecated", renamed.Stderr);
    }
}
