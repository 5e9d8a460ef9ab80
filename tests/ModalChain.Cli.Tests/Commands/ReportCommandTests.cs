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
        Directory.EnumerateFiles(Path.Combine(Root, "models"), "*.yaml").Order(StringComparer.Ordinal)
            .Where(f => !CliRun.IsCircuit(Path.GetFileName(f))) // circuit models: CircuitReportCommandTests
            .Select(f => new object[] { f });

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
    public void FormatPdf_AddsTheWholeReportAsOnePdfAndPdfFigures()
    {
        var dir = Path.Combine(Temp(), "out");
        var (code, _, stderr) = Run("report", Path.Combine(Root, "models", "chiller-deck.yaml"), "-o", dir, "--format", "pdf", "--units", "imperial");
        Assert.True(code == 0, stderr);
        Assert.True(File.Exists(Path.Combine(dir, "mode-01.pdf")));
        Assert.Equal("%PDF-", System.Text.Encoding.ASCII.GetString(File.ReadAllBytes(Path.Combine(dir, "report.pdf")), 0, 5));
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

    [Theory]
    [InlineData("")]
    [InlineData("   ")]
    [InlineData("out\0put")]
    public void EmptyOrImpossibleOutputFolder_ExitsTwoWithAMessage(string output)
    {
        var (code, _, stderr) = Run("report", Path.Combine(Root, "models", "chiller-deck.yaml"), "-o", output);
        Assert.True(code == 2, stderr);
        Assert.Contains("--output", stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("internal error", stderr, StringComparison.Ordinal);
    }

    public static TheoryData<string> HostileTitles() => ["\\x1b[31mred", "nul\\0here", "not a character \\uFFFE", "\\uFFFF \\x07 \\x08 \\v \\f", "emoji \\U0001F600 kept", "tab\\tand newline\\n"];

    /// <summary>A one-mass model with a harmonic sweep (so the report has charts that carry the title) and <paramref name="escaped"/> as its title.</summary>
    private static string HostileModel(string escaped) =>
        $"title: \"{escaped}\"\nmasses: {{deck: 1000 kg}}\nsprings: {{k: {{between: [ground, deck], stiffness: 1 kN/mm}}}}\n" +
        "damping: {modal: 2 %}\nloads: {f: {at: deck, kind: unbalance, mass-radius: 12000 g*mm, speed: 1480 rpm}}\n" +
        "harmonic: {loads: [f], frequencies: {from: 1 Hz, to: 60 Hz, points: 40}}\ncriteria: {separation: {speeds: 1480 rpm}}\n";

    [Theory]
    [MemberData(nameof(HostileTitles))]
    public void TitleWithControlCharacters_GivesAWellFormedReport(string escaped)
    {
        // YAML 1.2 §5.7 double-quoted escapes put the raw characters into the title. XML 1.0 §2.2 (W3C) forbids C0 controls
        // other than tab, newline and return, and U+FFFE/U+FFFF: each must come out as U+FFFD, never as an internal error.
        var parent = Temp();
        var model = Path.Combine(parent, "hostile.yaml");
        File.WriteAllText(model, HostileModel(escaped));
        var dir = Path.Combine(parent, "out");
        var (code, _, stderr) = Run("report", model, "-o", dir, "--format", "pdf");
        Assert.True(code == 0, stderr);
        foreach (var svg in Directory.GetFiles(dir, "*.svg"))
        {
            using var reader = System.Xml.XmlReader.Create(File.OpenRead(svg));
            while (reader.Read()) { }
        }
        var html = File.ReadAllText(Path.Combine(dir, "report.html"));
        Assert.DoesNotContain(html, c => c is < ' ' and not ('\t' or '\n' or '\r') or '\uFFFE' or '\uFFFF');
        using var json = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(dir, "results.json")));
        var title = json.RootElement.GetProperty("modes").GetProperty("title").GetString()!;
        Assert.DoesNotContain(title, c => c is < ' ' and not ('\t' or '\n' or '\r') or '\uFFFE' or '\uFFFF');
        if (escaped.StartsWith("emoji", StringComparison.Ordinal)) Assert.Contains("\U0001F600", title, StringComparison.Ordinal);
        else if (!escaped.StartsWith("tab", StringComparison.Ordinal)) Assert.Contains('\uFFFD', title);
    }

    [Theory]
    [MemberData(nameof(HostileTitles))]
    public void TitleWithControlCharacters_EveryJsonCommandStillWritesJson(string escaped)
    {
        var parent = Temp();
        var model = Path.Combine(parent, "hostile.yaml");
        File.WriteAllText(model, HostileModel(escaped));
        foreach (var args in new[] { new[] { "modes" }, ["check"], ["harmonic"], ["tune", "--host", "deck", "--mass-ratio", "5 %"] })
        {
            var (code, stdout, stderr) = Run([.. args.Take(1), model, .. args.Skip(1), "--format", "json"]);
            Assert.True(code is 0 or 1, $"{args[0]}: exit {code}: {stderr}");
            using var json = JsonDocument.Parse(stdout);
            Assert.Equal(JsonValueKind.Object, json.RootElement.ValueKind);
        }
    }

    [Fact]
    public void FolderHoldingOtherFiles_ExitsTwoAndKeepsThem()
    {
        // A report replaces its whole folder, so a folder that is not a report (no marker file) is refused, not overwritten.
        var dir = Path.Combine(Temp(), "mine");
        Directory.CreateDirectory(dir);
        // (A folder of report files only counts as a report written before the marker existed, so the file here is another.)
        File.WriteAllText(Path.Combine(dir, "notes.txt"), "my own notes");
        var (code, _, stderr) = Run("report", Path.Combine(Root, "models", "chiller-deck.yaml"), "-o", dir);
        Assert.Equal(2, code);
        Assert.Contains("not a ModalChain report folder", stderr, StringComparison.Ordinal);
        Assert.Equal("my own notes", File.ReadAllText(Path.Combine(dir, "notes.txt")));
        Assert.Equal(["notes.txt"], Directory.GetFileSystemEntries(dir).Select(Path.GetFileName));

        // A folder a report was written into is replaced by the next report.
        var again = Path.Combine(Temp(), "report");
        Assert.Equal(0, Run("report", Path.Combine(Root, "models", "chiller-deck.yaml"), "-o", again).Code);
        Assert.Equal(0, Run("report", Path.Combine(Root, "models", "mezzanine-absorber.yaml"), "-o", again).Code);
        Assert.Contains("mezzanine-absorber.yaml", File.ReadAllText(Path.Combine(again, "report.html")), StringComparison.Ordinal);
    }
}
