using System.Text.Json;

namespace ModalChain.Cli.Tests.Commands;

/// <summary>Commands on a model of more than 2,000 masses solve only the modes they need and say so.</summary>
public class LargeModelCommandTests
{
    // An invented 2,100-mass chain with one damper at the grounded end (non-classical damping) and a running machine.
    private const string Model = """
        title: Long gallery of 2100 masses
        repeat:
          c: {kind: chain, count: 2100, mass: 20 kg, stiffness: 5 MN/m, from: ground}
        dampers:
          base-damper: {between: [ground, c-1], coefficient: 20 kN*s/m}
        damping: {rayleigh: {ratio: 2 %, at: [0.5 Hz, 5 Hz]}}
        loads:
          fan: {kind: force, at: c-2000, amplitude: 100 N, speed: 90 rpm}
          knock: {kind: force, at: c-2000, time: {kind: half-sine, amplitude: 100 N, duration: 20 ms}}
        """;

    [Fact]
    public void Modes_SkipTheDenseComplexModesAndSaySo()
    {
        using var model = new CliRun.TempModel(Model);
        var outcome = CliRun.Run("modes", model.Path, "--count", "5");
        Assert.True(outcome.ExitCode == 0, outcome.ToString());
        Assert.Contains("complex modes are not computed above 2000 masses", outcome.Stdout);
    }

    [Fact]
    public void ModalHarmonic_SolvesOnlyTheModesItKeeps()
    {
        using var model = new CliRun.TempModel(Model);
        var outcome = CliRun.Run("harmonic", model.Path, "--method", "modal", "--count", "6", "--output", "c-2000",
            "--from", "1 Hz", "--to", "2 Hz", "--points", "10", "--format", "json");
        Assert.True(outcome.ExitCode == 0, outcome.ToString());
        using var json = JsonDocument.Parse(outcome.Stdout);
        var notes = json.RootElement.GetProperty("notes").EnumerateArray().Select(n => n.GetString()).ToList();
        Assert.Contains(notes, n => n!.StartsWith("only the lowest 6 of 2100 modes were solved", StringComparison.Ordinal));
    }

    [Fact]
    public void ModalTransient_StatesTheAutomaticModeCount()
    {
        using var model = new CliRun.TempModel(Model);
        var outcome = CliRun.Run("transient", model.Path, "--method", "modal", "--duration", "0.2 s", "--step", "1 ms",
            "--output", "c-2000", "--format", "json");
        Assert.True(outcome.ExitCode == 0, outcome.ToString());
        using var json = JsonDocument.Parse(outcome.Stdout);
        var warnings = json.RootElement.GetProperty("warnings").EnumerateArray().Select(n => n.GetString()).ToList();
        Assert.Contains(warnings, w => w!.Contains("kept the lowest 30 of 2100 modes, chosen automatically", StringComparison.Ordinal));
    }
}
