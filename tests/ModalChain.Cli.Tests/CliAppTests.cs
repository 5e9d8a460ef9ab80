using System.Text.Json;
using ModalChain.Core;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests;

/// <summary>The program's contract at its edges: help, version, exit codes, and errors that reach the user readable.</summary>
public class CliAppTests
{
    private static readonly string[] BrokenLines =
    [
        "title: Broken",                                                 // 1
        "masses:",                                                       // 2
        "  deck: {mass: -3200 kg}",                                      // 3  negative mass
        "  skid: 850 kg",                                                // 4
        "springs:",                                                      // 5
        "  columns: {between: [ground, dek], stiffness: 95 kN/mm}",      // 6  unknown node
        "  mounts: {between: [deck, skid], stiffness: 8.4 kg}",          // 7  wrong unit
    ];

    private static readonly string BrokenModel = string.Join("\n", BrokenLines) + "\n";

    private static int Col(int line, string token) => BrokenLines[line - 1].IndexOf(token, StringComparison.Ordinal) + 1;

    [Theory]
    [InlineData("validate")]
    [InlineData("modes")]
    [InlineData("modes", "--format", "json")]
    [InlineData("modes", "--format", "csv")]
    public void BrokenModel_ExitsTwo_WithEveryErrorAsFileLineColumn_AndNothingOnStdout(params string[] command)
    {
        using var model = new TempModel(BrokenModel);
        var o = Run([.. command.Take(1), model.Path, .. command.Skip(1)]);
        Assert.True(o.ExitCode == ExitCodes.InputError, o.ToString());
        Assert.Equal("", o.Stdout);
        Assert.DoesNotContain("   at ", o.Stderr, StringComparison.Ordinal);
        var lines = o.Stderr.Split('\n', StringSplitOptions.RemoveEmptyEntries).Select(l => l.TrimEnd('\r')).ToArray();
        Assert.Equal($"{model.Path}:3:{Col(3, "-3200")}: error: 'mass' of mass 'deck' is -3200 kg, but a mass must be positive", lines[0]);
        Assert.Equal($"{model.Path}:6:{Col(6, "dek")}: error: spring 'columns' refers to unknown node 'dek' (did you mean 'deck'?); declare it under 'masses' or 'supports', or use 'ground'", lines[1]);
        Assert.StartsWith($"{model.Path}:7:{Col(7, "8.4 kg")}: error: 'stiffness' of spring 'mounts': 'kg' is a unit of mass", lines[2], StringComparison.Ordinal);
        Assert.Equal($"{model.Path}: 3 errors; nothing was analysed.", lines[3]);
        Assert.Equal(4, lines.Length);
    }

    [Fact]
    public void MalformedYaml_ExitsTwo_WithAPosition()
    {
        using var model = new TempModel("masses:\n  deck: {mass: 3200 kg\nsprings: {}\n");
        var o = Run("modes", model.Path);
        Assert.Equal(ExitCodes.InputError, o.ExitCode);
        Assert.StartsWith($"{model.Path}:2:9: error: malformed YAML", o.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", o.Stderr, StringComparison.Ordinal);
        Assert.Equal("", o.Stdout);
    }

    [Theory]
    [InlineData("validate")]
    [InlineData("modes")]
    public void MissingFile_ExitsTwo(string command)
    {
        var path = Path.Combine(Path.GetTempPath(), $"modalchain-absent-{Guid.NewGuid():N}.yaml");
        var o = Run(command, path);
        Assert.Equal(ExitCodes.InputError, o.ExitCode);
        Assert.StartsWith($"{path}:1:1: error: file not found", o.Stderr, StringComparison.Ordinal);
        Assert.Equal("", o.Stdout);
    }

    [Theory]
    [InlineData("modes", "MODEL", "--format", "xml")]
    [InlineData("modes", "MODEL", "--format", "yaml")]
    [InlineData("modes", "MODEL", "--count", "0")]
    [InlineData("modes", "MODEL", "--count", "-2")]
    [InlineData("modes", "MODEL", "--count", "many")]
    [InlineData("modes", "MODEL", "--bogus")]
    [InlineData("validate", "MODEL", "--format", "json")]
    [InlineData("modes")]
    [InlineData("validate")]
    [InlineData("frobnicate")]
    [InlineData]
    public void BadCommandLine_ExitsTwo_WithAMessageAndNoOutput(params string[] args)
    {
        var model = ModelPath("chiller-deck.yaml");
        var o = Run([.. args.Select(a => a == "MODEL" ? model : a)]);
        Assert.True(o.ExitCode == ExitCodes.InputError, o.ToString());
        Assert.Equal("", o.Stdout);
        Assert.StartsWith("modalchain: error: ", o.Stderr, StringComparison.Ordinal);
        Assert.Contains("--help", o.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", o.Stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("ModalChain.Cli", o.Stderr, StringComparison.Ordinal); // no internal type names
    }

    [Theory]
    [InlineData("--help")]
    [InlineData("-h")]
    [InlineData("validate", "--help")]
    [InlineData("modes", "--help")]
    [InlineData("modes", "-?")]
    public void Help_ExitsZero_AndCarriesTheCaution(params string[] args)
    {
        var o = Run(args);
        Assert.True(o.ExitCode == 0, o.ToString());
        var text = Unwrapped(o.Stdout);
        Assert.Contains("licensed engineer", text, StringComparison.Ordinal);
        Assert.Contains(Unwrapped(Cautions.Text), text, StringComparison.Ordinal);
        Assert.Contains("Usage:", o.Stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void ModesHelp_ListsItsOptionsWithTheAcceptedFormats()
    {
        var text = Run("modes", "--help").Stdout;
        Assert.Contains("--count", text, StringComparison.Ordinal);
        Assert.Contains("--format <table|json|csv>", text, StringComparison.Ordinal);
    }

    [Fact]
    public void RootHelp_ListsTheCommandsAndExitCodes()
    {
        var text = Unwrapped(Run("--help").Stdout);
        Assert.Contains("validate", text, StringComparison.Ordinal);
        Assert.Contains("modes", text, StringComparison.Ordinal);
        Assert.Contains("2 input error", text, StringComparison.Ordinal);
    }

    [Fact]
    public void Version_PrintsTheVersion()
    {
        var o = Run("--version");
        Assert.Equal(0, o.ExitCode);
        Assert.Matches(@"^\d+\.\d+\.\d+", o.Stdout);
        Assert.Equal(CliApp.Version, o.Stdout.Trim());
    }

    [Fact]
    public void JsonRecordsTheToolVersion()
    {
        var o = Run("modes", ModelPath("chiller-deck.yaml"), "--format", "json");
        using var json = JsonDocument.Parse(o.Stdout);
        Assert.Equal(CliApp.Version, json.RootElement.GetProperty("source").GetProperty("tool_version").GetString());
    }
}
