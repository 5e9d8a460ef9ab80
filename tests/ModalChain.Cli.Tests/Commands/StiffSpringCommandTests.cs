using System.Text.Json;

namespace ModalChain.Cli.Tests.Commands;

/// <summary>
/// The model of issue 12, item 1: a "rigid" support modelled as a 1e14 N/m spring beside a 100 N/m one. Its real
/// 1.59 Hz mode (ω² ≈ 100 rad²/s², REFERENCES.md §1 two-DOF closed form) used to be reported as a
/// 0 Hz rigid-body mode, so every command below gave a wrong answer without a word.
/// </summary>
public class StiffSpringCommandTests
{
    private const string Model = """
        masses: {m0: 1 kg, m1: 1 kg}
        springs:
          k0: {between: [ground, m0], stiffness: 1e14 N/m}
          k1: {between: [m0, m1], stiffness: 100 N/m}
        damping: {modal: 2 %}
        criteria: {separation: {speeds: 1.6 Hz}}
        loads:
          shaker: {kind: force, at: m1, amplitude: 1 N, speed: 96 rpm}
        harmonic:
          frequencies: {from: 1.5 Hz, to: 1.7 Hz, points: 21}
        """;

    [Fact]
    public void Check_FailsTheSeparationCriterion()
    {
        // The mode at 1.5915 Hz lies inside 1.6 Hz ± 20 % (common practice band): the check must fail (exit 1).
        using var model = new CliRun.TempModel(Model);
        var outcome = CliRun.Run("check", model.Path);
        Assert.True(outcome.ExitCode == 1, outcome.ToString());
        Assert.Contains("FAIL", outcome.Stdout);
    }

    [Fact]
    public void ModalHarmonic_ShowsTheResonance()
    {
        // m1 on 100 N/m behind a practically fixed m0 is a single-DOF oscillator, ζ = 2 %: peak displacement
        // F/k · 1/(2ζ√(1−ζ²)) (REFERENCES.md §4; the other mode is 1e6 times higher, its share ~1e-12).
        // Tolerance 1e-6 relative (the sweep refines its peaks).
        using var model = new CliRun.TempModel(Model);
        var outcome = CliRun.Run("harmonic", model.Path, "--method", "modal", "--output", "m1", "--format", "json");
        Assert.True(outcome.ExitCode == 0, outcome.ToString());
        using var json = JsonDocument.Parse(outcome.Stdout);
        var peak = json.RootElement.GetProperty("peaks").EnumerateArray()
            .Single(p => p.GetProperty("dof").GetString() == "m1" && p.GetProperty("quantity").GetString() == "displacement");
        const double zeta = 0.02;
        var expected = 1.0 / 100 / (2 * zeta * Math.Sqrt(1 - zeta * zeta));
        Assert.InRange(peak.GetProperty("magnitude").GetDouble(), expected * (1 - 1e-6), expected * (1 + 1e-6));
        Assert.InRange(peak.GetProperty("frequency_hz").GetDouble(), 1.58, 1.60);
    }

    [Fact]
    public void Tune_AcceptsTheMode()
    {
        using var model = new CliRun.TempModel(Model);
        var outcome = CliRun.Run("tune", model.Path, "--host", "m1", "--mass-ratio", "0.05");
        Assert.True(outcome.ExitCode == 0, outcome.ToString());
        Assert.Contains("1.5915 Hz", outcome.Stdout);
    }

    [Fact]
    public void Modes_SaysWhichSpringsMakeTheSpreadAndOffersLinks()
    {
        using var model = new CliRun.TempModel(Model);
        var outcome = CliRun.Run("modes", model.Path, "--format", "json");
        Assert.True(outcome.ExitCode == 0, outcome.ToString());
        using var json = JsonDocument.Parse(outcome.Stdout);
        var warnings = json.RootElement.GetProperty("warnings").EnumerateArray().Select(w => w.GetString()!).ToArray();
        Assert.Contains(warnings, w => w.Contains("1e+12", StringComparison.Ordinal) && w.Contains("'k0'", StringComparison.Ordinal) && w.Contains("links:", StringComparison.Ordinal));
        Assert.All(json.RootElement.GetProperty("modes").EnumerateArray(), m => Assert.False(m.GetProperty("rigid_body").GetBoolean()));
    }
}

/// <summary>
/// A free two-mass group with a damper to ground (issue 12, item 7): its rigid-body roots are listed as such, never as
/// an unstable or a 1e-7 Hz "mode".
/// </summary>
public class FreeGroupComplexModesCommandTests
{
    [Fact]
    public void Modes_LabelsTheZeroRootAndTheRelaxationRoot()
    {
        // det(λ²M + λC + K) = λ(m1m2λ³ + c·m2λ² + k(m1+m2)λ + c·k) (derived by hand): one zero root, one real
        // relaxation root and one oscillatory pair.
        const string model = """
            masses: {a: 2 kg, b: 3 kg}
            springs:
              k: {between: [a, b], stiffness: 300 N/m}
            dampers:
              c: {between: [ground, a], coefficient: 7 N*s/m}
            """;
        using var file = new CliRun.TempModel(model);
        var outcome = CliRun.Run("modes", file.Path, "--format", "json");
        Assert.True(outcome.ExitCode == 0, outcome.ToString());
        using var json = JsonDocument.Parse(outcome.Stdout);
        var roots = json.RootElement.GetProperty("complex_modes").EnumerateArray().ToArray();
        Assert.Equal(["rigid-body", "rigid-body-relaxation", "elastic"], roots.Select(r => r.GetProperty("kind").GetString()));
        Assert.All(roots, r => Assert.True(r.GetProperty("eigenvalue_real").GetDouble() <= 0));
        Assert.True(roots[2].GetProperty("oscillatory").GetBoolean());

        var table = CliRun.Run("modes", file.Path);
        Assert.Contains("rigid body (zero root)", table.Stdout);
        Assert.Contains("rigid-body relaxation", table.Stdout);
    }
}

/// <summary>A model with 'links:' end to end: one DOF for the linked masses, results reported at each of them.</summary>
public class LinksCommandTests
{
    private const string Model = """
        masses:
          deck: 3200 kg
          frame: 400 kg
          skid: 850 kg
        springs:
          columns: {between: [ground, deck], stiffness: 95 kN/mm}
          mounts:  {between: [deck, frame], stiffness: 8.4 kN/mm}
        links:
          bolted: [frame, skid]
        damping: {modal: 2 %}
        loads:
          unbalance: {kind: force, at: skid, amplitude: 1 kN, speed: 1480 rpm}
        harmonic:
          frequencies: {from: 1 Hz, to: 60 Hz, points: 100}
        """;

    [Fact]
    public void ModesAndHarmonic_ReportEveryLinkedMass()
    {
        using var file = new CliRun.TempModel(Model);
        var modes = CliRun.Run("modes", file.Path, "--format", "json");
        Assert.True(modes.ExitCode == 0, modes.ToString());
        using var json = JsonDocument.Parse(modes.Stdout);
        Assert.Equal(["deck", "frame+skid"], json.RootElement.GetProperty("dofs").EnumerateArray().Select(d => d.GetString()));
        foreach (var mode in json.RootElement.GetProperty("modes").EnumerateArray())
        {
            var shape = mode.GetProperty("shape");
            Assert.Equal(shape.GetProperty("frame").GetDouble(), shape.GetProperty("skid").GetDouble());
        }

        var harmonic = CliRun.Run("harmonic", file.Path);
        Assert.True(harmonic.ExitCode == 0, harmonic.ToString());
        Assert.Contains(" frame ", harmonic.Stdout);
        Assert.Contains(" skid ", harmonic.Stdout);
    }
}
