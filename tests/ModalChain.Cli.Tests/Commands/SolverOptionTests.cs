using System.Text;
using System.Text.Json;
using ModalChain.Core.Solvers;
using ModalChain.TestSupport;

namespace ModalChain.Cli.Tests.Commands;

/// <summary>The --solver option of the commands that solve modes, and JSON streamed to a byte stream.</summary>
public class SolverOptionTests
{
    private static string Model() => Path.Combine(CommandRun.Models(), "storage-rack-centrifuge.yaml");

    [Theory]
    [InlineData("modes")]
    [InlineData("check")]
    [InlineData("harmonic")]
    [InlineData("transient")]
    [InlineData("report")]
    public void Help_OffersTheSolverChoices(string command)
    {
        var run = CommandRun.Of(command, "--help");
        Assert.Equal(0, run.ExitCode);
        Assert.Contains("--solver <auto|managed|native|sparse>", run.Output, StringComparison.Ordinal);
    }

    [Fact]
    public void Managed_IsNamedInTheQualityBlock()
    {
        var run = CommandRun.Of("modes", Model(), "--solver", "managed", "--format", "json");
        Assert.True(run.ExitCode == 0, run.Error);
        var quality = run.Json().GetProperty("quality");
        Assert.Equal(new DenseGeneralizedEigen().Name, quality.GetProperty("solver").GetString());
    }

    [Fact]
    public void EverySolver_GivesTheSameFrequencies()
    {
        // Same model, every solver available here: frequencies equal to 1e-8 relative (identity across algorithms).
        double[] Frequencies(string solver)
        {
            var run = CommandRun.Of("modes", Model(), "--solver", solver, "--format", "json");
            Assert.True(run.ExitCode == 0, run.Error);
            return [.. run.Json().GetProperty("modes").EnumerateArray().Select(m => m.GetProperty("frequency_hz").GetDouble())];
        }
        var reference = Frequencies("managed");
        var solvers = NativeLapack.IsAvailable ? new[] { "auto", "native", "sparse" } : ["auto", "sparse"];
        foreach (var s in solvers) NumericAssert.Close(reference, Frequencies(s), Tolerance.Rel(1e-8), $"f with --solver {s}");
    }

    [Fact]
    public void UnknownSolver_IsAnInputError()
    {
        var run = CommandRun.Of("modes", Model(), "--solver", "fastest");
        Assert.Equal(2, run.ExitCode);
        Assert.Contains("'fastest'", run.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void NativeWithoutTheLibrary_IsAnInputErrorNamingThePackage()
    {
        var run = CommandRun.Of("modes", Model(), "--solver", "native");
        if (NativeLapack.IsAvailable)
            Assert.Equal(0, run.ExitCode);
        else
        {
            Assert.Equal(2, run.ExitCode);
            Assert.Contains("libopenblas0-pthread", run.Error, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Json_IsStreamedToTheRawOutput_AsOneObjectAndANewline()
    {
        var text = new StringWriter();
        var error = new StringWriter();
        using var raw = new MemoryStream();
        var code = CliApp.Run(["modes", Model(), "--format", "json"], text, error, raw);
        Assert.True(code == 0, error.ToString());
        Assert.Equal("", text.ToString());
        var bytes = raw.ToArray();
        Assert.Equal((byte)'\n', bytes[^1]);
        using var json = JsonDocument.Parse(bytes.AsMemory(0, bytes.Length - 1));
        Assert.True(json.RootElement.GetProperty("modes").GetArrayLength() > 0);
        // The same document as written through the text writer.
        Assert.Equal(CommandRun.Of("modes", Model(), "--format", "json").Output.ReplaceLineEndings("\n"), Encoding.UTF8.GetString(bytes).ReplaceLineEndings("\n"));
    }
}
