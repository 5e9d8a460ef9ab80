using System.Text.Json;
using ModalChain.Cli.Tests.Schemas;
using ModalChain.TestSupport;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests.Inerters;

/// <summary>Every command on a 3d model with inerters (per direction, rotational, axial) and a moving support that carries them.</summary>
public class SpatialInerterCommandTests
{
    // Invented scenario: a pump skid braced to a shaking floor by inerters, beside a deck on beams.
    private const string Model =
        "title: Pump skid braced to the floor by inerters\n" +
        "space: 3d\n" +
        "masses:\n" +
        "  deck: {mass: 2600 kg, at: [0, 0, 0], directions: [z]}\n" +
        "supports:\n" +
        "  floor: {at: [1.5, 0, -0.5]}\n" +
        "bodies:\n" +
        "  skid:\n" +
        "    mass: 1850 kg\n" +
        "    centre-of-mass: [0, 0, 0.6]\n" +
        "    box: [2.4 m, 1.2 m, 1.1 m]\n" +
        "    points: {foot-1: [1.1, 0.55, 0.1], foot-2: [-1.1, -0.55, 0.1]}\n" +
        "springs:\n" +
        "  mount: {between: [skid, floor], stiffness: {x: 0.9 kN/mm, y: 0.9 kN/mm, z: 2.6 kN/mm}, rotational-stiffness: {rx: 900 kN*m/rad, ry: 900 kN*m/rad, rz: 900 kN*m/rad}}\n" +
        "  deck-beams: {between: [floor, deck], stiffness: {z: 48 kN/mm}}\n" +
        "dampers:\n" +
        "  pads: {between: [skid, floor], coefficient: {x: 2 kN*s/m, y: 2 kN*s/m, z: 3 kN*s/m}}\n" +
        "inerters:\n" +
        "  brace: {between: [skid.foot-1, floor], inertance: {x: 150 kg, y: 150 kg}, rotational-inertance: {rz: 12 kg*m^2}}\n" +
        "  strut: {between: [skid.foot-2, floor], axial: 80 kg}\n" +
        "  coupler: {between: [deck, skid], inertance: {z: 40 kg}}\n" +
        "damping:\n" +
        "  modal: 2 %\n" +
        "loads:\n" +
        "  shake: {kind: base-motion, support: floor, direction: z, acceleration: 0.1 g, speed: 12 Hz}\n" +
        "  quake: {kind: base-motion, support: floor, direction: x, time: {kind: sine, amplitude: 0.1 g, frequency: 3 Hz}}\n" +
        "harmonic:\n" +
        "  frequencies: {from: 1 Hz, to: 40 Hz, points: 120}\n" +
        "transient:\n" +
        "  duration: 1 s\n" +
        "  step: 1 ms\n";

    [Fact]
    public void TheModel_MatchesTheModelSchema()
    {
        var problems = SchemaFiles.Problems("model.schema.json", SchemaFiles.YamlToJson(Model));
        Assert.True(problems is null, problems);
    }

    [Fact]
    public void Modes_CountTheGroundedInertersInEachDirectionsTotal()
    {
        // ι_dᵀMι_d = physical mass + the grounded inerters' components in d: x and y gain 150 kg (brace) and the axial
        // strut's b n_d²; the coupler between two moving nodes cancels (docs/methods.md; hand sum here).
        using var model = new TempModel(Model);
        var o = Run("modes", model.Path, "--format", "json");
        Assert.True(o.ExitCode == 0, o.ToString());
        SchemaFiles.AssertValid("modes.schema.json", o.Stdout, "modes of a 3d model with inerters");
        using var json = JsonDocument.Parse(o.Stdout);
        NumericAssert.Close(4450.0, json.RootElement.GetProperty("physical_mass_kg").GetDouble(), Tolerance.Rel(1e-14), "physical mass");
        // The strut runs from foot-2 (−1.1, −0.55, 0.1) to floor (1.5, 0, −0.5): n_z² = 0.6²/|d|².
        double dx = 2.6, dy = 0.55, dz = -0.6;
        var nz2 = dz * dz / (dx * dx + dy * dy + dz * dz);
        NumericAssert.Close(4450.0 + 80 * nz2, json.RootElement.GetProperty("total_mass_kg").GetDouble(), Tolerance.Rel(1e-12), "ι_zᵀMι_z");
    }

    [Theory]
    [InlineData("harmonic", "harmonic.schema.json")]
    [InlineData("transient", "transient.schema.json")]
    public void ResponsesToTheMovingSupport_MatchTheirSchemas(string command, string schema)
    {
        using var model = new TempModel(Model);
        var o = Run(command, model.Path, "--format", "json");
        Assert.True(o.ExitCode == 0, o.ToString());
        Assert.DoesNotContain("NaN", o.Stdout, StringComparison.Ordinal);
        SchemaFiles.AssertValid(schema, o.Stdout, $"{command} of a 3d model with inerters on a moving support");
    }

    [Theory]
    [InlineData("validate")]
    [InlineData("harmonic", "--method", "modal")]
    [InlineData("transient", "--method", "modal")]
    [InlineData("study", "--vary", "springs.mount.stiffness.z", "--from", "1 kN/mm", "--to", "4 kN/mm", "--steps", "3")]
    public void EveryCommand_RunsOnA3dModelWithInerters(string command, params string[] options)
    {
        using var model = new TempModel(Model);
        var o = Run([command, model.Path, .. options]);
        Assert.True(o.ExitCode == 0, o.ToString());
        Assert.DoesNotContain("NaN", o.Stdout, StringComparison.Ordinal);
    }
}
