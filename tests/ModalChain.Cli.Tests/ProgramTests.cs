using System.Diagnostics;
using System.Text.Json;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests;

/// <summary>The built executable, run as a child process: proves Program.cs passes the real streams and exit code.</summary>
public class ProgramTests
{
    private static (int ExitCode, string Stdout, string Stderr) Exec(params string[] args) => ExecWith(new Dictionary<string, string?>(), args);

    private static (int ExitCode, string Stdout, string Stderr) ExecWith(IReadOnlyDictionary<string, string?> environment, params string[] args)
    {
        // modalchain.dll is copied next to the test assembly by the project reference.
        var dll = Path.Combine(AppContext.BaseDirectory, "modalchain.dll");
        Assert.True(File.Exists(dll), $"{dll} not found");
        // The muxer that runs these tests (DOTNET_HOST_PATH is set by `dotnet test`); "dotnet" on PATH otherwise.
        var host = Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") is { Length: > 0 } h ? h : "dotnet";
        var start = new ProcessStartInfo(host)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        start.ArgumentList.Add("exec");
        start.ArgumentList.Add(dll);
        foreach (var a in args) start.ArgumentList.Add(a);
        start.Environment["DOTNET_CLI_TELEMETRY_OPTOUT"] = "1";
        foreach (var (key, value) in environment) start.Environment[key] = value;
        using var process = Process.Start(start)!;
        var stdout = process.StandardOutput.ReadToEndAsync();
        var stderr = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(TimeSpan.FromSeconds(60)))
        {
            process.Kill(entireProcessTree: true);
            Assert.Fail("modalchain did not finish within 60 s");
        }
        return (process.ExitCode, stdout.Result, stderr.Result);
    }

    [Fact]
    public void Executable_WritesJsonToStdout_AndExitsZero()
    {
        var (code, stdout, stderr) = Exec("modes", ModelPath("chiller-deck.yaml"), "--format", "json");
        Assert.True(code == 0, stderr);
        using var json = JsonDocument.Parse(stdout);
        Assert.Equal(2, json.RootElement.GetProperty("modes").GetArrayLength());
    }

    [Fact]
    public void Executable_ExitsTwo_OnABrokenModel_WithThePositionOnStderr()
    {
        using var model = new TempModel("masses:\n  deck: -1 kg\n");
        var (code, stdout, stderr) = Exec("validate", model.Path);
        Assert.Equal(ExitCodes.InputError, code);
        Assert.Equal("", stdout);
        Assert.StartsWith($"{model.Path}:2:9: error: ", stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Report_IsByteIdenticalUnderAGermanLocale()
    {
        // Invariant formatting (common practice): the report folder must not depend on the machine's language. The same
        // SOURCE_DATE_EPOCH (reproducible-builds.org convention) fixes the date line, so every byte can be compared.
        var parent = Path.Combine(Path.GetTempPath(), "modalchain-cli-locale-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(parent);
        try
        {
            var folders = new List<string>();
            foreach (var lang in new[] { "C.UTF-8", "de_DE.UTF-8" })
            {
                var dir = Path.Combine(parent, lang);
                var (code, _, stderr) = ExecWith(
                    new Dictionary<string, string?> { ["LANG"] = lang, ["LC_ALL"] = lang, ["SOURCE_DATE_EPOCH"] = "1764590400" },
                    "report", ModelPath("chiller-deck.yaml"), "-o", dir, "--format", "pdf");
                Assert.True(code == 0, stderr);
                folders.Add(dir);
            }
            Assert.Contains("2025-12-01 12:00 UTC", File.ReadAllText(Path.Combine(folders[0], "report.html")), StringComparison.Ordinal);
            var names = Directory.GetFiles(folders[0]).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToArray();
            Assert.Equal(names, Directory.GetFiles(folders[1]).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToArray());
            Assert.Contains("harmonic-deck.pdf", names);
            foreach (var name in names)
                Assert.True(File.ReadAllBytes(Path.Combine(folders[0], name!)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(folders[1], name!))),
                    $"{name} differs between LANG=C.UTF-8 and LANG=de_DE.UTF-8");
        }
        finally
        {
            Directory.Delete(parent, recursive: true);
        }
    }
}
