using System.Text.Json;
using ModalChain.Cli.Tests.Schemas;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests.Commands;

/// <summary>Every command on a line model with massless nodes and viscoelastic mounts; JSON outputs against their schemas.</summary>
public class MasslessCommandTests
{
    // Invented scenario: a fan on a light frame, on one Maxwell and one standard-linear-solid mount, the frame's legs
    // meeting a base plate (a massless joint) that sits on a stiff pad.
    private const string Model =
        "title: Fan on viscoelastic mounts\n" +
        "masses:\n" +
        "  fan: 180 kg\n" +
        "  frame: {mass: 40 kg}\n" +
        "nodes: [base-plate]\n" +
        "springs:\n" +
        "  frame-legs: {between: [frame, base-plate], stiffness: 900 kN/m}\n" +
        "  pad: {between: [base-plate, ground], stiffness: 1.8 MN/m}\n" +
        "mounts:\n" +
        "  mount-a: {kind: maxwell, between: [fan, frame], stiffness: 80 kN/m, damping: 400 N*s/m}\n" +
        "  mount-b: {kind: standard-linear-solid, between: [fan, frame], stiffness: 120 kN/m, relaxation-strength: 0.8, loss-factor: 0.2, at: 25 Hz}\n" +
        "loads:\n" +
        "  unbalance: {kind: unbalance, at: fan, mass-radius: 0.02 kg*m, speed: 1480 rpm}\n" +
        "  bump: {kind: force, at: fan, time: {kind: step, value: 100 N, at: 0 s}}\n" +
        "harmonic:\n" +
        "  loads: [unbalance]\n" +
        "  frequencies: {from: 2 Hz, to: 60 Hz, points: 80}\n" +
        "  outputs: [fan, frame, base-plate, mount-a~inner]\n" +
        "criteria:\n" +
        "  separation: {margin: 20 %, speeds: [1480 rpm], orders: [1]}\n" +
        "transient:\n" +
        "  duration: 0.3 s\n" +
        "  step: 1 ms\n" +
        "  loads: [bump]\n" +
        "  outputs: [fan, base-plate, mount-a~inner]\n";

    [Fact]
    public void Modes_ListTheRelaxationRoots_WithTheirTimeConstants()
    {
        // The mounts' inner nodes are first-order states: the table says so and lists relaxation roots with τ; the
        // JSON names their kind 'relaxation' and matches modes.schema.json.
        using var model = new TempModel(Model);
        var table = Run("modes", model.Path);
        Assert.True(table.ExitCode == 0, table.ToString());
        Assert.Contains("Massless nodes with damping are first-order states", table.Stdout, StringComparison.Ordinal);
        Assert.Contains("relaxation, τ = ", table.Stdout, StringComparison.Ordinal);
        var json = Run("modes", model.Path, "--format", "json");
        Assert.True(json.ExitCode == 0, json.ToString());
        SchemaFiles.AssertValid("modes.schema.json", json.Stdout, "modes on the massless model");
        using var document = JsonDocument.Parse(json.Stdout);
        var kinds = document.RootElement.GetProperty("complex_modes").EnumerateArray().Select(c => c.GetProperty("kind").GetString()).ToArray();
        Assert.Contains("relaxation", kinds);
        // Two inertial DOFs: two undamped modes, although the model has five DOFs (three massless).
        Assert.Equal(2, document.RootElement.GetProperty("modes").GetArrayLength());
    }

    [Theory]
    [InlineData("harmonic", "harmonic.schema.json")]
    [InlineData("transient", "transient.schema.json")]
    public void JsonOutputs_MatchTheirSchemas_AndReportTheMasslessNodes(string command, string schema)
    {
        using var model = new TempModel(Model);
        var o = Run(command, model.Path, "--format", "json");
        Assert.True(o.ExitCode == 0, o.ToString());
        SchemaFiles.AssertValid(schema, o.Stdout, $"{command} on the massless model");
        Assert.Contains("\"mount-a~inner\"", o.Stdout, StringComparison.Ordinal);
        Assert.Contains("\"base-plate\"", o.Stdout, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("validate")]
    [InlineData("harmonic")]
    [InlineData("harmonic", "--method", "modal")]
    [InlineData("transient")]
    [InlineData("transient", "--method", "modal")]
    [InlineData("tune", "--host", "fan", "--mass-ratio", "5%", "--mode", "1")]
    [InlineData("study", "--vary", "springs.frame-legs.stiffness", "--from", "400 kN/m", "--to", "2000 kN/m", "--steps", "3")]
    public void EveryCommand_RunsOnAModelWithMasslessNodesAndMounts(string command, params string[] options)
    {
        using var model = new TempModel(Model);
        var o = Run([command, model.Path, .. options]);
        Assert.True(o.ExitCode == 0, o.ToString());
        Assert.DoesNotContain("NaN", o.Stdout, StringComparison.Ordinal);
        Assert.DoesNotContain("Exception", o.Stdout + o.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Report_IsWrittenForAModelWithMasslessNodes()
    {
        using var model = new TempModel(Model);
        var dir = Path.Combine(Path.GetTempPath(), "modalchain-massless-report-" + Guid.NewGuid().ToString("N"));
        try
        {
            var o = Run("report", model.Path, "-o", dir);
            Assert.True(o.ExitCode == 0, o.ToString());
            Assert.Contains("relaxation, τ = ", File.ReadAllText(Path.Combine(dir, "report.html")), StringComparison.Ordinal);
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }
}
