using ModalChain.Cli.Tests.Commands;
using ModalChain.Io.Text;

namespace ModalChain.Cli.Tests.Formatting;

/// <summary>
/// Text from the model never reaches the terminal as control characters (an ESC or a C1 CSI would be obeyed by the
/// terminal; a CR would overwrite the line): every command that prints the title, and every diagnostic, cleans it.
/// </summary>
public sealed class TerminalTextTests
{
    // YAML double-quoted escapes: ESC, C1 CSI (U+009B), CR, BEL, DEL.
    private const string HostileTitle = "\"\\x1b[2Jcleared \\u009b31m red\\rover \\x07 bell \\x7f del\"";

    private static string Model() => CommandRun.ModelFile($"""
        title: {HostileTitle}
        masses: {"{"}deck: 2600 kg, fan: 400 kg{"}"}
        springs:
          k1: {"{"}between: [ground, deck], stiffness: 40 MN/m{"}"}
          k2: {"{"}between: [deck, fan], stiffness: 4 MN/m{"}"}
        damping: {"{"}modal: 2 %{"}"}
        loads:
          u: {"{"}kind: unbalance, at: fan, mass-radius: 1 kg*m, speed: 1470 rpm{"}"}
        harmonic: {"{"}loads: [u], frequencies: {"{"}from: 1 Hz, to: 50 Hz, points: 20{"}"}, outputs: [fan]{"}"}
        criteria: {"{"}separation: {"{"}speeds: 1470 rpm{"}"}{"}"}
        """);

    [Theory]
    [InlineData("validate")]
    [InlineData("modes")]
    [InlineData("harmonic")]
    [InlineData("check")]
    public void TablesPrintNoControlCharacters(string command)
    {
        var run = CommandRun.Of(command, Model());
        Assert.InRange(run.ExitCode, 0, 1);
        Assert.Contains("cleared", run.Output); // the title is printed, cleaned
        AssertNoControl(run.Output);
        AssertNoControl(run.Error);
    }

    [Fact]
    public void DiagnosticsQuotingABadKeyPrintNoControlCharacters()
    {
        var file = CommandRun.ModelFile("masses: {\"bad\\x1b[31mname\": 1 kg}\nsprings: {}\n");
        var run = CommandRun.Of("validate", file);
        Assert.Equal(2, run.ExitCode);
        Assert.Contains("bad", run.Error);
        AssertNoControl(run.Error);
    }

    [Fact]
    public void LineReplacesEveryControlCharacterAndKeepsTheRest()
    {
        Assert.Equal("a\uFFFDb\uFFFDc\uFFFDd\uFFFDe", TerminalText.Line("a\u001bb\u009bc\rd\u007fe"));
        var clean = "tab-free title, ünïcödé and \U0001F600";
        Assert.Same(clean, TerminalText.Line(clean));
    }

    private static void AssertNoControl(string text)
    {
        foreach (var c in text)
            Assert.True(c == '\n' || !char.IsControl(c), $"control character U+{(int)c:X4} printed");
    }
}
