using System.Diagnostics;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests;

/// <summary>Hostile inputs end every command with exit 2 and a located message, never a crash or a hang (issue 12, items 2 and 5).</summary>
public sealed class InputLimitsTests : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("modalchain-cli-input-").FullName;

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    [Theory]
    [InlineData("validate")]
    [InlineData("modes")]
    [InlineData("report")]
    public void TwentyThousandNestedBrackets_ExitTwoWithTheLineAndColumn(string command)
    {
        var path = Path.Combine(_folder, "deep.yaml");
        File.WriteAllText(path, "masses:\n  deck: " + new string('[', 20_000) + "\n");
        string[] args = command == "report" ? [command, path, "-o", Path.Combine(_folder, "out")] : [command, path];
        var outcome = Run(args);
        Assert.True(outcome.ExitCode == 2, outcome.ToString());
        Assert.Contains($"{path}:2:39: error: lists and mappings are nested more than 32 levels deep", outcome.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public async Task NamedPipe_ExitsTwo_InsteadOfWaitingForAWriter()
    {
        var fifo = Path.Combine(_folder, "model.yaml");
        using (var mkfifo = Process.Start(new ProcessStartInfo("mkfifo", [fifo]) { UseShellExecute = false })!) mkfifo.WaitForExit();
        var run = Task.Run(() => Run("validate", fifo));
        // A guard against the old behaviour (waiting for ever), not a timing check: the run takes milliseconds.
        Assert.True(await Task.WhenAny(run, Task.Delay(TimeSpan.FromMinutes(1))) == run, "validate blocked on the named pipe");
        var outcome = await run;
        Assert.True(outcome.ExitCode == 2, outcome.ToString());
        Assert.Contains("is a named pipe (FIFO), not a regular file", outcome.Stderr, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("/dev/zero", "is a character device")]
    [InlineData("/tmp", "is a directory")]
    public void SpecialFiles_ExitTwo(string path, string message)
    {
        var outcome = Run("validate", path);
        Assert.True(outcome.ExitCode == 2, outcome.ToString());
        Assert.Contains(message, outcome.Stderr, StringComparison.Ordinal);
    }
}
