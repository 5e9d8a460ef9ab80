using ModalChain.Cli.Tests.Schemas;
using ModalChain.TestSupport;

namespace ModalChain.Cli.Tests.Commands;

/// <summary><c>study --vary</c> on an inertance (line and 3d) and on a transducer's force factor, and the bad paths.</summary>
public class InerterAndTransducerStudyCommandTests
{
    private static double Hz(double omega2) => Math.Sqrt(omega2) / (2 * Math.PI);

    // A 40 kg mass on 250 kN/m with an inerter to ground: ω = √(k/(m + b)) (closed form).
    private static readonly string Grounded = CommandRun.ModelFile("""
        title: Mass with a grounded flywheel
        masses:
          m: 40 kg
        springs:
          k: {between: [ground, m], stiffness: 250 kN/m}
        inerters:
          flywheel: {between: [m, ground], inertance: 15 kg}
        """);

    // A 2 kg table on 40 kN/m whose coil drives a tank node: capacitance 2 mF (2 g in the node flux form) and an
    // inductor of 50 mH (a spring 1/L = 20 N/m) to ground; ω² = (k + Bl²/L)/(m + Bl²C) (closed form).
    private static readonly string Coil = CommandRun.ModelFile("""
        title: Coil on a tank circuit
        masses:
          table: 2 kg
          tank: 2 g
        springs:
          flexure: {between: [ground, table], stiffness: 40 kN/m}
          inductor: {between: [tank, ground], stiffness: 20 N/m}
        dampers:
          resistor: {between: [tank, ground], coefficient: 0.01 N*s/m}
        transducers:
          coil: {between: [table, ground], branch: [tank, ground], force-factor: 12 T*m}
        """);

    private static readonly string Block = CommandRun.ModelFile("""
        title: Block with a flywheel brake
        space: 3d
        bodies:
          block:
            mass: 1200 kg
            centre-of-mass: [0, 0, 0]
            inertia: {xx: 250 kg*m^2, yy: 400 kg*m^2, zz: 520 kg*m^2}
            points: {foot-1: [0.8, 0.5, 0], foot-2: [0.8, -0.5, 0], foot-3: [-0.8, 0.5, 0], foot-4: [-0.8, -0.5, 0]}
        springs:
          mount-1: {between: [block.foot-1, ground], stiffness: {x: 300 kN/m, y: 200 kN/m, z: 900 kN/m}}
          mount-2: {between: [block.foot-2, ground], stiffness: {x: 300 kN/m, y: 200 kN/m, z: 900 kN/m}}
          mount-3: {between: [block.foot-3, ground], stiffness: {x: 300 kN/m, y: 200 kN/m, z: 900 kN/m}}
          mount-4: {between: [block.foot-4, ground], stiffness: {x: 300 kN/m, y: 200 kN/m, z: 900 kN/m}}
        inerters:
          brake: {between: [block, ground], inertance: {x: 100 kg, z: 300 kg}, rotational-inertance: {rz: 60 kg*m^2}}
        """);

    [Fact]
    public void InertanceStudy_Json_FollowsTheGroundedClosedForm()
    {
        var run = CommandRun.Of("study", Grounded, "--vary", "inerters.flywheel.inertance", "--from", "0 kg", "--to", "120 kg", "--steps", "7", "--format", "json");
        Assert.True(run.ExitCode == 0, run.Error);
        SchemaFiles.AssertValid("study.schema.json", run.Output, "inertance study");
        var json = run.Json();
        Assert.Equal("inerters.flywheel.inertance", json.GetProperty("parameter").GetString());
        Assert.Equal("kg", json.GetProperty("unit").GetString());
        var values = json.GetProperty("values").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        var mode = Assert.Single(json.GetProperty("modes").EnumerateArray());
        var f = mode.GetProperty("frequency_hz").EnumerateArray().Select(x => x.GetDouble()).ToArray();
        Assert.Equal(7, values.Length);
        for (var s = 0; s < values.Length; s++)
            NumericAssert.Close(Hz(2.5e5 / (40 + values[s])), f[s], Tolerance.Rel(1e-10), $"b = {values[s]} kg (closed form √(k/(m + b)))");
    }

    [Fact]
    public void ForceFactorStudy_Table_FollowsTheCoupledClosedForm_AndSaysWhatTheTableLeavesOut()
    {
        var run = CommandRun.Of("study", Coil, "--vary", "transducers.coil.force-factor", "--from", "1 N/A", "--to", "21 T*m", "--steps", "5");
        Assert.True(run.ExitCode == 0, run.Error);
        Assert.Contains("Study of transducers.coil.force-factor from 1 T*m to 21 T*m", run.Output);
        Assert.Contains("note: the force factor couples", run.Error);
        Assert.Contains("resistances (dampers) do not", run.Error);
        Assert.Contains("licensed engineer", run.Output);
        var json = CommandRun.Of("study", Coil, "--vary", "transducers.coil.force-factor", "--from", "1 N/A", "--to", "21 T*m", "--steps", "5", "--format", "json").Json();
        Assert.Equal("T*m", json.GetProperty("unit").GetString());
        var values = json.GetProperty("values").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        var f = Assert.Single(json.GetProperty("modes").EnumerateArray()).GetProperty("frequency_hz").EnumerateArray().Select(x => x.GetDouble()).ToArray();
        for (var s = 0; s < values.Length; s++)
        {
            var bl = values[s];
            NumericAssert.Close(Hz((4e4 + bl * bl * 20) / (2 + bl * bl * 2e-3)), f[s], Tolerance.Rel(1e-10), $"Bl = {bl} (closed form)");
        }
    }

    [Fact]
    public void RotationalInertanceStudy_OnA3dModel_MovesYawAlone()
    {
        // REFERENCES.md §10 block (mounts in the plane of the centre of mass): yaw ω² = 4(k_x b² + k_y a²)/(J_z + b_rz),
        // closed form; the other motions keep their frequency at every value.
        var run = CommandRun.Of("study", Block, "--vary", "inerters.brake.rotational-inertance.rz", "--from", "0", "--to", "400", "--steps", "5", "--format", "json");
        Assert.True(run.ExitCode == 0, run.Error);
        Assert.Contains("read as 0 kg*m^2", run.Error); // a bare number is in the field's SI unit
        var json = run.Json();
        var values = json.GetProperty("values").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        var yaw = json.GetProperty("modes").EnumerateArray().Single(m => m.GetProperty("motion")[0].GetString() == "yaw");
        var f = yaw.GetProperty("frequency_hz").EnumerateArray().Select(x => x.GetDouble()).ToArray();
        for (var s = 0; s < values.Length; s++)
            NumericAssert.Close(Hz(4 * (3e5 * 0.25 + 2e5 * 0.64) / (520 + values[s])), f[s], Tolerance.Rel(1e-10), $"yaw at b_rz = {values[s]}");
        var bounce = json.GetProperty("modes").EnumerateArray().Single(m => m.GetProperty("motion")[0].GetString() == "bounce");
        Assert.All(bounce.GetProperty("frequency_hz").EnumerateArray(), x => NumericAssert.Close(Hz(4 * 9e5 / 1500), x.GetDouble(), Tolerance.Rel(1e-10), "bounce, m + b_z"));
    }

    [Theory]
    [InlineData("inerters.brake.inertance.y", "inerter 'brake' has: inerters.brake.inertance (every direction in proportion), inerters.brake.inertance.x, inerters.brake.inertance.z, inerters.brake.rotational-inertance.rz")]
    [InlineData("inerters.pad.inertance", "no entry 'pad' under 'inerters' (it has: brake)")]
    [InlineData("transducers.coil.force-factor", "a 3d model has no transducers (line models only)")]
    public void BadPathsOnA3dModel_ExitTwo_NamingWhatExists(string path, string expected)
    {
        var run = CommandRun.Of("study", Block, "--vary", path, "--from", "1", "--to", "2");
        Assert.Equal(2, run.ExitCode);
        Assert.Contains("--vary: ", run.Error);
        Assert.Contains(expected, run.Error);
    }

    [Theory]
    [InlineData("transducers.coil.branch", "'branch' of transducers is not a numeric field; the numeric field is 'force-factor' (transducers.coil.force-factor)")]
    [InlineData("transducers.speaker.force-factor", "no entry 'speaker' under 'transducers' (it has: coil)")]
    [InlineData("inerters.coil.inertance", "the model has no inerters")]
    [InlineData("wires.coil.force-factor", "inerters.NAME.inertance, transducers.NAME.force-factor")]
    public void BadPathsOnATransducerModel_ExitTwo_NamingWhatExists(string path, string expected)
    {
        var run = CommandRun.Of("study", Coil, "--vary", path, "--from", "1", "--to", "2");
        Assert.Equal(2, run.ExitCode);
        Assert.Contains(expected, run.Error);
    }

    [Fact]
    public void AForceFactorOfZero_IsRefused_AsAreWrongUnits()
    {
        var zero = CommandRun.Of("study", Coil, "--vary", "transducers.coil.force-factor", "--from", "0 T*m", "--to", "5 T*m");
        Assert.Equal(2, zero.ExitCode);
        Assert.Contains("--from 0 is not a valid value of transducers.coil.force-factor (above 0 up to 1E+06, SI)", zero.Error);
        var unit = CommandRun.Of("study", Grounded, "--vary", "inerters.flywheel.inertance", "--from", "1 N/m", "--to", "5 kg");
        Assert.Equal(2, unit.ExitCode);
        Assert.Contains("mass", unit.Error);
    }

    [Fact]
    public void AnInertanceOfZeroOnAMasslessNode_IsAnInputError()
    {
        // It was an internal error (exit 4): the node lost its coordinate part-way through the study.
        var model = CommandRun.ModelFile("""
            title: Node carried by an inerter
            masses:
              m: 40 kg
            nodes: [j]
            springs:
              k1: {between: [ground, j], stiffness: 100 kN/m}
              k2: {between: [j, m], stiffness: 50 kN/m}
            inerters:
              b: {between: [j, ground], inertance: 10 kg}
            """);
        var run = CommandRun.Of("study", model, "--vary", "inerters.b.inertance", "--from", "0 kg", "--to", "20 kg", "--steps", "3");
        Assert.Equal(2, run.ExitCode);
        Assert.Contains("the inerter carries the massless node 'j', which has no inertia without it", run.Error);
        Assert.Equal(0, CommandRun.Of("study", model, "--vary", "inerters.b.inertance", "--from", "1 kg", "--to", "20 kg", "--steps", "3").ExitCode);
    }
}
