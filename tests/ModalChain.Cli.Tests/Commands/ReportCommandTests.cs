using System.Text.Json;

namespace ModalChain.Cli.Tests.Commands;

/// <summary><c>modalchain report</c> end to end: files written, exit codes, and a failed run leaving the folder alone.</summary>
public sealed class ReportCommandTests
{
    private static string Root { get; } = FindRoot();

    private static (int Code, string Out, string Err) Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        var code = CliApp.Run(args, output, error);
        return (code, output.ToString(), error.ToString());
    }

    private static string Temp()
    {
        var path = Path.Combine(Path.GetTempPath(), "modalchain-cli-tests", Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(path);
        return path;
    }

    public static IEnumerable<object[]> Models() =>
        Directory.EnumerateFiles(Path.Combine(Root, "models"), "*.yaml").Order(StringComparer.Ordinal).Select(f => new object[] { f });

    [Theory]
    [MemberData(nameof(Models))]
    public void Report_OnEveryExample_ExitsZeroAndWritesHtmlJsonAndFigures(string model)
    {
        var dir = Path.Combine(Temp(), "out");
        var (code, stdout, stderr) = Run("report", model, "-o", dir);
        Assert.True(code == 0, stderr);
        Assert.Contains("report written", stdout, StringComparison.Ordinal);
        Assert.True(File.Exists(Path.Combine(dir, "report.html")));
        Assert.True(File.Exists(Path.Combine(dir, "network.svg")));
        Assert.True(File.Exists(Path.Combine(dir, "mode-01.svg")));
        using var json = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(dir, "results.json")));
        Assert.True(json.RootElement.GetProperty("modes").GetProperty("modes").GetArrayLength() >= 1);
    }

    [Fact]
    public void FormatPdf_AddsPdfFigures()
    {
        var dir = Path.Combine(Temp(), "out");
        var (code, _, stderr) = Run("report", Path.Combine(Root, "models", "chiller-deck.yaml"), "-o", dir, "--format", "pdf", "--units", "imperial");
        Assert.True(code == 0, stderr);
        Assert.True(File.Exists(Path.Combine(dir, "mode-01.pdf")));
        Assert.Contains("Mass (lb)", File.ReadAllText(Path.Combine(dir, "report.html")), StringComparison.Ordinal);
    }

    [Fact]
    public void ModelWithErrors_ExitsTwoAndWritesNothing()
    {
        var parent = Temp();
        var model = Path.Combine(parent, "bad.yaml");
        File.WriteAllText(model, "masses:\n  deck: {mass: -3 kg}\n");
        var dir = Path.Combine(parent, "out");
        var (code, _, stderr) = Run("report", model, "-o", dir);
        Assert.Equal(2, code);
        Assert.Contains("bad.yaml:2:", stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(dir));
    }

    [Fact]
    public void OutputIsAFile_ExitsTwoAndLeavesTheFile()
    {
        var parent = Temp();
        var target = Path.Combine(parent, "out");
        File.WriteAllText(target, "not a folder");
        var (code, _, stderr) = Run("report", Path.Combine(Root, "models", "chiller-deck.yaml"), "-o", target);
        Assert.Equal(2, code);
        Assert.Contains("is a file, not a folder", stderr, StringComparison.Ordinal);
        Assert.Equal("not a folder", File.ReadAllText(target));
    }

    [Fact]
    public void MissingOutputOption_IsAUsageError() => Assert.Equal(2, Run("report", Path.Combine(Root, "models", "chiller-deck.yaml")).Code);

    [Fact]
    public void AbsorberOptions_AddTheSection_AndResultsJsonHoldsExactlyTheTuneObject()
    {
        // Den Hartog 1956 §3.3 [confirmed citation] (REFERENCES §3): μ = 0.05 → f = 0.952381, ζ_a = 0.133631 (absorber-referenced).
        // Tolerance 5e-7 absolute on the printed digits. The 2-DOF primary is the deck-and-fan model of the tune tests.
        var model = CommandRun.Deck("68 kN/mm");
        var dir = Path.Combine(Temp(), "out");
        var (code, _, stderr) = Run("report", model, "-o", dir, "--absorber-host", "deck", "--mass-ratio", "5 %");
        Assert.True(code == 0, stderr);
        var tune = CommandRun.Of("tune", model, "--host", "deck", "--mass-ratio", "5 %", "--format", "json");
        Assert.Equal(0, tune.ExitCode);
        using var results = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(dir, "results.json")));
        var absorber = results.RootElement.GetProperty("absorber");
        Assert.True(JsonElement.DeepEquals(tune.Json(), absorber), $"report:\n{absorber}\ntune:\n{tune.Output}");
        ModalChain.TestSupport.NumericAssert.Close(0.952381, absorber.GetProperty("absorber").GetProperty("frequency_ratio").GetDouble(),
            ModalChain.TestSupport.Tolerance.Abs(5e-7), "f");
        ModalChain.TestSupport.NumericAssert.Close(0.133631, absorber.GetProperty("absorber").GetProperty("damping_ratio").GetDouble(),
            ModalChain.TestSupport.Tolerance.Abs(5e-7), "ζ_a");
        var html = File.ReadAllText(Path.Combine(dir, "report.html"));
        Assert.Contains("id=\"absorber\"", html, StringComparison.Ordinal);
        Assert.Contains("0.133631", html, StringComparison.Ordinal);
        var svg = System.Xml.Linq.XDocument.Load(Path.Combine(dir, "absorber-response.svg")).Root!;
        Assert.Equal("svg", svg.Name.LocalName);
        Assert.False(string.IsNullOrWhiteSpace(svg.Attribute("viewBox")?.Value));
    }

    [Fact]
    public void AbsorberMethodOptimal_MatchesTuneOptimal()
    {
        var model = CommandRun.Deck("68 kN/mm");
        var dir = Path.Combine(Temp(), "out");
        var (code, _, stderr) = Run("report", model, "-o", dir, "--absorber-host", "deck", "--mass-ratio", "0.05", "--absorber-mode", "2", "--absorber-method", "optimal");
        Assert.True(code == 0, stderr);
        var tune = CommandRun.Of("tune", model, "--host", "deck", "--mass-ratio", "0.05", "--mode", "2", "--method", "optimal", "--format", "json");
        using var results = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(dir, "results.json")));
        Assert.True(JsonElement.DeepEquals(tune.Json(), results.RootElement.GetProperty("absorber")));
        Assert.Equal("optimal", results.RootElement.GetProperty("absorber").GetProperty("method").GetString());
    }

    [Fact]
    public void WithoutAbsorberOptions_ResultsJsonHasNoAbsorber()
    {
        var dir = Path.Combine(Temp(), "out");
        var (code, _, stderr) = Run("report", CommandRun.Deck("68 kN/mm"), "-o", dir);
        Assert.True(code == 0, stderr);
        using var results = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(dir, "results.json")));
        Assert.False(results.RootElement.TryGetProperty("absorber", out _));
        Assert.False(File.Exists(Path.Combine(dir, "absorber-response.svg")));
    }

    [Theory]
    [InlineData("roof", "5 %", "'roof' is not a mass")]
    [InlineData("deck", "0 %", "must be positive")]
    [InlineData("deck", "-5 %", "must be positive")]
    [InlineData("deck", "five", "--mass-ratio")]
    public void BadAbsorberOptions_ExitTwoAndWriteNothing(string host, string ratio, string expected)
    {
        var dir = Path.Combine(Temp(), "out");
        var (code, _, stderr) = Run("report", CommandRun.Deck("68 kN/mm"), "-o", dir, "--absorber-host", host, "--mass-ratio", ratio);
        Assert.Equal(2, code);
        Assert.Contains(expected, stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(dir));
    }

    [Theory]
    [InlineData("--absorber-host", "deck")]
    [InlineData("--mass-ratio", "5 %")]
    public void HalfTheAbsorberOptions_ExitsTwo(string option, string value)
    {
        var dir = Path.Combine(Temp(), "out");
        var (code, _, stderr) = Run("report", CommandRun.Deck("68 kN/mm"), "-o", dir, option, value);
        Assert.Equal(2, code);
        Assert.Contains("go together", stderr, StringComparison.Ordinal);
    }

    private static string FindRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "ModalChain.sln"))) return dir.FullName;
        throw new InvalidOperationException("ModalChain.sln not found");
    }
}
