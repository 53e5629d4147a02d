using System.Diagnostics;
using System.Reflection;
using SlotOpt.Cli;

namespace SlotOpt.Tests.Cli;

/// <summary>
/// The command ships as a .NET tool: the package packs from the built command, installs into a tool path
/// from a local folder only (no registry is asked), and the installed `slotopt` runs.
/// </summary>
[Trait("Category", "Slow")]
public sealed class ToolPackageTests : IDisposable
{
    private readonly string _scratch = Directory.CreateTempSubdirectory("slotopt-tool-tests-").FullName;

    public void Dispose()
    {
        try { Directory.Delete(_scratch, recursive: true); } catch (IOException) { } catch (UnauthorizedAccessException) { }
    }

    [Fact]
    public void Packed_tool_installs_into_a_tool_path_and_checks_a_demo()
    {
        var root = RepositoryRoot();
        var configuration = AppContext.BaseDirectory.Contains($"{Path.DirectorySeparatorChar}Debug{Path.DirectorySeparatorChar}") ? "Debug" : "Release";
        var packages = Path.Combine(_scratch, "packages");
        var tools = Path.Combine(_scratch, "tools");
        var config = Path.Combine(_scratch, "nuget.config");
        File.WriteAllText(config, $"""
            <?xml version="1.0" encoding="utf-8"?>
            <configuration>
              <packageSources>
                <clear />
                <add key="local" value="{packages}" />
              </packageSources>
            </configuration>
            """);

        var pack = Run("dotnet", root, "pack", Path.Combine(root, "src", "SlotOpt.Cli"), "-c", configuration, "--no-build", "-nologo", "-o", packages);
        Assert.True(pack.ExitCode == 0, $"dotnet pack failed:\n{pack.Output}");
        var install = Run("dotnet", _scratch, "tool", "install", "--tool-path", tools, "--configfile", config, "SlotOpt");
        Assert.True(install.ExitCode == 0, $"dotnet tool install failed:\n{install.Output}");

        var slotopt = Path.Combine(tools, "slotopt");
        var version = Run(slotopt, _scratch, "--version");
        Assert.Equal(0, version.ExitCode);
        var expected = typeof(SlotOpt.Cli.Program).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()!.InformationalVersion;
        Assert.Equal(expected, version.Output.Trim());

        var check = Run(slotopt, _scratch, "check", Path.Combine(root, "problems", "tie-plate-50hz.toml"));
        Assert.True(check.ExitCode == 0, check.Output);
        Assert.Contains("is valid", check.Output);
    }

    private static string RepositoryRoot()
    {
        for (var d = new DirectoryInfo(AppContext.BaseDirectory); d is not null; d = d.Parent)
            if (File.Exists(Path.Combine(d.FullName, "SlotOpt.sln"))) return d.FullName;
        throw new DirectoryNotFoundException("SlotOpt.sln not found above the test output folder");
    }

    private sealed record Outcome(int ExitCode, string Output);

    /// <summary>Runs a process to its end; the 15-minute guard only keeps a hung install from hanging the suite, it is no pass criterion.</summary>
    private static Outcome Run(string file, string workingDirectory, params string[] args)
    {
        var start = new ProcessStartInfo(file) { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false, WorkingDirectory = workingDirectory };
        foreach (var a in args) start.ArgumentList.Add(a);
        start.Environment["DOTNET_CLI_TELEMETRY_OPTOUT"] = "1";
        start.Environment["DOTNET_NOLOGO"] = "1";
        using var process = Process.Start(start)!;
        var stdout = process.StandardOutput.ReadToEndAsync();
        var stderr = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(TimeSpan.FromMinutes(15)))
        {
            process.Kill(entireProcessTree: true);
            throw new TimeoutException($"{file} {string.Join(' ', args)} was still running after 15 minutes");
        }
        return new Outcome(process.ExitCode, stdout.Result + stderr.Result);
    }
}
