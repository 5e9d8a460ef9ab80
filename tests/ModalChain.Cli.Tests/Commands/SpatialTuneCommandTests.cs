using System.Text.Json;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Io.Model;
using ModalChain.TestSupport;

namespace ModalChain.Cli.Tests.Commands;

/// <summary><c>modalchain tune</c> and the report's absorber section on plane and 3d models: a host is a point and a translation.</summary>
public class SpatialTuneCommandTests
{
    // The rigid bar on two springs of REFERENCES.md §10 (m = 1000 kg, J = 810 kg·m², 18 kN/m at 1.0 m ahead of the centre
    // of mass, 22 kN/m at 1.5 m behind), with horizontal springs that keep surge apart and 2 % modal damping.
    private const string Bar = """
        # A rigid bar on two springs (comment kept by tune --write).
        title: Rigid bar on two springs
        space: plane
        bodies:
          bar:
            mass: 1000 kg
            centre-of-mass: [0, 0]
            inertia: {yy: 810 kg*m^2}
            points:
              front: [1.0, 0]
              rear: [-1.5, 0]
        springs:
          front-spring: {between: [bar.front, ground], stiffness: {x: 50 kN/m, z: 18 kN/m}}
          rear-spring: {between: [bar.rear, ground], stiffness: {x: 50 kN/m, z: 22 kN/m}}
        damping:
          modal: 2 %
        """;

    /// <summary>Mode 2 of the bar (x/θ = 0.30611 m, REFERENCES.md §10) seen at the front point (x = 1.0 m) in z: (m r² + J)/(r − 1)² kg.</summary>
    private static double FrontModalMassOfMode2()
    {
        const double r = 0.30611;
        return (1000 * r * r + 810) / ((r - 1) * (r - 1));
    }

    [Fact]
    public void BodyPointHost_SizesFromTheModalMassThere()
    {
        // Hand value from the bar's published mode ratio (5 significant digits, so 1e-4 relative).
        var run = CommandRun.Of("tune", CommandRun.ModelFile(Bar), "--host", "bar.front.z", "--mode", "2", "--mass-ratio", "5 %", "--format", "json");
        Assert.True(run.ExitCode == 0, run.Error);
        var json = run.Json();
        Assert.Equal("bar.front.z", json.GetProperty("host").GetString());
        var modalMass = json.GetProperty("modal_mass_kg").GetDouble();
        NumericAssert.Close(FrontModalMassOfMode2(), modalMass, Tolerance.Rel(1e-4), "1/(a·φ)² at bar.front in z, mode 2");
        NumericAssert.Close(0.05 * modalMass, json.GetProperty("absorber").GetProperty("mass_kg").GetDouble(), Tolerance.Rel(1e-14), "m_a = μM");
        // Den Hartog 1956 §3.3 (REFERENCES §3): f = 1/(1 + μ) = 0.952381 at μ = 5 %.
        NumericAssert.Close(0.952381, json.GetProperty("absorber").GetProperty("frequency_ratio").GetDouble(), Tolerance.Abs(5e-7), "f");
        Assert.True(json.GetProperty("peak_after").GetDouble() < json.GetProperty("peak_before").GetDouble());
    }

    [Fact]
    public void Write_OnAPlaneModel_ReadsBackToTheSameAbsorber_AndKeepsTheComments()
    {
        var model = CommandRun.ModelFile(Bar);
        var output = CommandRun.TempPath();
        var json = CommandRun.Of("tune", model, "--host", "bar.front.z", "--mode", "2", "--mass-ratio", "5 %", "--format", "json");
        var run = CommandRun.Of("tune", model, "--host", "bar.front.z", "--mode", "2", "--mass-ratio", "5 %", "--write", output);
        Assert.True(run.ExitCode == 0, run.Error);
        var text = File.ReadAllText(output);
        Assert.Contains("# A rigid bar on two springs (comment kept by tune --write).", text, StringComparison.Ordinal);
        Assert.DoesNotContain(ModelWriter.CommentsLostNote, text, StringComparison.Ordinal);

        var read = ModelReader.ReadFile(output);
        Assert.True(read.Succeeded, string.Join("\n", read.Diagnostics));
        var network = read.Model!.Network;
        var design = json.Json().GetProperty("absorber");
        var mass = network.Masses.Single(m => m.Name == "bar-front-z-absorber");
        Assert.Equal(design.GetProperty("mass_kg").GetDouble(), mass.Kilograms);
        Assert.Equal(new Point3(1.0, 0, 0), mass.Location);
        Assert.Equal([Direction.Z], mass.Moves.ToArray());
        var spring = network.Springs.Single(s => s.Name == "bar-front-z-absorber-spring");
        Assert.Equal(("bar.front", mass.Name), (spring.NodeA, spring.NodeB));
        Assert.Equal([new DirectionalValue(Direction.Z, design.GetProperty("stiffness_n_per_m").GetDouble())], spring.Components.ToArray());
        var damper = network.Dampers.Single(d => d.Name == "bar-front-z-absorber-damper");
        Assert.Equal([new DirectionalValue(Direction.Z, design.GetProperty("damping_n_s_per_m").GetDouble())], damper.Components.ToArray());

        // The tuned model runs: one DOF more, and the controlled mode split either side of the absorber's frequency (Den Hartog 1956 §3.2).
        var modes = CommandRun.Of("modes", output, "--format", "json");
        Assert.Equal(0, modes.ExitCode);
        var frequencies = modes.Json().GetProperty("modes").EnumerateArray().Select(m => m.GetProperty("frequency_hz").GetDouble()).ToArray();
        Assert.Equal(4, frequencies.Length);
        var fa = design.GetProperty("frequency_hz").GetDouble();
        Assert.Contains(frequencies, f => f < fa);
        Assert.Contains(frequencies, f => f > fa);
    }

    [Theory]
    [InlineData("bar", "host 'bar' needs the direction the absorber acts along in a plane model; hosts: bar.x, bar.z")]
    [InlineData("bar.ry", "host 'bar.ry' is a rotation; a tuned mass acts along a line")]
    [InlineData("bar.front.rx", "host 'bar.front.rx' is a rotation")]
    [InlineData("bar.front.y", "'y' is not a direction of a plane model (x, z)")]
    [InlineData("bar.middle.z", "host 'bar.middle.z' is not a DOF label or a body point with a direction")]
    [InlineData("ground", "host 'ground' is a support")]
    public void BadHosts_ExitTwoNamingTheChoices(string host, string expected)
    {
        var run = CommandRun.Of("tune", CommandRun.ModelFile(Bar), "--host", host, "--mass-ratio", "5 %");
        Assert.Equal(2, run.ExitCode);
        Assert.Contains(expected, run.Error, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", run.Error);
    }

    [Fact]
    public void Report_OnAPlaneModel_HasTheAbsorberSectionOfTune()
    {
        var model = CommandRun.ModelFile(Bar);
        var dir = Path.Combine(Path.GetTempPath(), "modalchain-cli-tests", Guid.NewGuid().ToString("N"), "out");
        var report = CommandRun.Of("report", model, "-o", dir, "--absorber-host", "bar.front.z", "--absorber-mode", "2", "--mass-ratio", "5 %");
        Assert.True(report.ExitCode == 0, report.Error);
        var tune = CommandRun.Of("tune", model, "--host", "bar.front.z", "--mode", "2", "--mass-ratio", "5 %", "--format", "json");
        using var results = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(dir, "results.json")));
        var absorber = results.RootElement.GetProperty("absorber");
        Assert.True(JsonElement.DeepEquals(tune.Json(), absorber), $"report:\n{absorber}\ntune:\n{tune.Output}");
        Assert.Contains("id=\"absorber\"", File.ReadAllText(Path.Combine(dir, "report.html")), StringComparison.Ordinal);
        // The chart has both curves: the host's amplification without and with the absorber.
        var svg = File.ReadAllText(Path.Combine(dir, "absorber-response.svg"));
        Assert.Contains("without absorber", svg, StringComparison.Ordinal);
        Assert.Contains("with absorber", svg, StringComparison.Ordinal);
    }

    [Fact]
    public void ThreeDModel_TunesWithTheHostTheEveryModelTestsUse()
    {
        // A deck in z under a machine block on mounts (invented): the generic host choice (CliRun.TuneHost) picks a
        // translation DOF label from DofMap and a mode it moves in; tune must then run, and --write must read back.
        const string text = """
            title: Machine block on a deck
            space: 3d
            masses:
              deck: {mass: 2600 kg, at: [0, 0, 0], directions: [z]}
            bodies:
              block:
                mass: 900 kg
                centre-of-mass: [0, 0, 0.5]
                box: [1.6 m, 1.0 m, 0.8 m]
                points:
                  foot-1: [0.6, 0.4, 0.1]
                  foot-2: [0.6, -0.4, 0.1]
                  foot-3: [-0.6, 0.4, 0.1]
                  foot-4: [-0.6, -0.4, 0.1]
            springs:
              deck-beams: {between: [ground, deck], stiffness: {z: 40 kN/mm}}
              mount-1: {between: [block.foot-1, deck], stiffness: {x: 0.8 kN/mm, y: 0.8 kN/mm, z: 2.4 kN/mm}}
              mount-2: {between: [block.foot-2, deck], stiffness: {x: 0.8 kN/mm, y: 0.8 kN/mm, z: 2.4 kN/mm}}
              mount-3: {between: [block.foot-3, deck], stiffness: {x: 0.8 kN/mm, y: 0.8 kN/mm, z: 2.4 kN/mm}}
              mount-4: {between: [block.foot-4, deck], stiffness: {x: 0.8 kN/mm, y: 0.8 kN/mm, z: 2.4 kN/mm}}
            damping:
              modal: 3 %
            """;
        var model = CommandRun.ModelFile(text);
        var network = ModelReader.ReadFile(model).Model!.Network;
        var host = CliRun.TuneHost(network);
        Assert.Contains(host[1], DofMap.For(network).Dofs.Select(d => d.ToString()));
        var output = CommandRun.TempPath();
        var run = CommandRun.Of(["tune", model, .. host, "--mass-ratio", "5 %", "--write", output]);
        Assert.True(run.ExitCode == 0, run.Error);
        Assert.True(ModelReader.ReadFile(output).Succeeded);
        Assert.Equal(0, CommandRun.Of("validate", output).ExitCode);
        // The deck's own DOF as host: the deck mode's modal mass there is at least the deck's mass share (identity: 1/φ² ≥ m_deck
        // for a mass-normalised shape, since m_deck φ_deck² ≤ φᵀMφ = 1).
        var deck = CommandRun.Of("tune", model, "--host", "deck.z", "--mass-ratio", "5 %", "--format", "json");
        Assert.True(deck.ExitCode == 0, deck.Error);
        Assert.True(deck.Json().GetProperty("modal_mass_kg").GetDouble() >= 2600 * (1 - 1e-12));
    }
}
