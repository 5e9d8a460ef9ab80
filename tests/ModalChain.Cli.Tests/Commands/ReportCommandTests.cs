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

    private static string FindRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "ModalChain.sln"))) return dir.FullName;
        throw new InvalidOperationException("ModalChain.sln not found");
    }
}
