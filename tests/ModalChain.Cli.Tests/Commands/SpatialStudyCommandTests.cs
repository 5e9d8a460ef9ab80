using System.Globalization;
using ModalChain.Cli.Tests.Schemas;
using ModalChain.TestSupport;

namespace ModalChain.Cli.Tests.Commands;

/// <summary><c>study</c> on a 3d model: per-direction and body paths, motion names, thresholds, bad paths.</summary>
/// <remarks>
/// The block on four mounts of REFERENCES.md §10 (Harris, theory of vibration isolation [from memory]) with the mounts
/// in the plane of the centre of mass, so the six motions decouple: bounce ω² = 4k_z/m, pitch 4k_z a²/J_y, surge
/// 4k_x/m, sway 4k_y/m, yaw 4(k_x b² + k_y a²)/J_z (closed forms).
/// </remarks>
public class SpatialStudyCommandTests
{
    private const double Mass = 1200, Jy = 400, A = 0.8, Kx = 3e5, Ky = 2e5, Kz = 9e5;

    private static readonly string Block = CommandRun.ModelFile("""
        title: Block on four mounts
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
        dampers:
          pad: {between: [block.foot-1, ground], coefficient: {z: 2 kN*s/m}}
        criteria:
          separation: {margin: 5 %, speeds: [420 rpm], orders: [1]}
        """);

    private static double Hz(double omega2) => Math.Sqrt(omega2) / (2 * Math.PI);

    [Fact]
    public void BodyMassStudy_Json_FollowsBounceByNameAndFindsTheClosedFormThresholds()
    {
        var run = CommandRun.Of("study", Block, "--vary", "bodies.block.mass", "--from", "1.5 t", "--to", "2400 kg", "--steps", "10", "--format", "json");
        Assert.True(run.ExitCode == 0, run.Error);
        SchemaFiles.AssertValid("study.schema.json", run.Output, "study on a 3d model");
        var json = run.Json();
        Assert.Equal("bodies.block.mass", json.GetProperty("parameter").GetString());
        var values = json.GetProperty("values").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        var bounce = json.GetProperty("modes").EnumerateArray().Single(m => m.GetProperty("motion")[0].GetString() == "bounce");
        Assert.All(bounce.GetProperty("motion").EnumerateArray(), m => Assert.Equal("bounce", m.GetString()));
        var frequencies = bounce.GetProperty("frequency_hz").EnumerateArray().Select(f => f.GetDouble()).ToArray();
        for (var s = 0; s < values.Length; s++)
            NumericAssert.Close(Hz(4 * Kz / values[s]), frequencies[s], Tolerance.Rel(1e-10), $"bounce at {values[s]} kg");
        // Over 1.5–2.4 t bounce (7.8 to 6.2 Hz) crosses yaw (6.29 Hz, at 2305 kg), so its rank changes while its name stays;
        // pitch keeps its frequency, since the body's inertia is kept.
        var numbers = bounce.GetProperty("mode_number").EnumerateArray().Select(n => n.GetInt32()).ToArray();
        Assert.NotEqual(numbers[0], numbers[^1]);
        var pitch = json.GetProperty("modes").EnumerateArray().Single(m => m.GetProperty("motion")[0].GetString() == "pitch");
        Assert.All(pitch.GetProperty("frequency_hz").EnumerateArray(), f => NumericAssert.Close(Hz(4 * Kz * A * A / Jy), f.GetDouble(), Tolerance.Rel(1e-10), "pitch"));
        // Separation ±5 % of 420 rpm = 7 Hz: bounce is in (6.65, 7.35) Hz between the two masses where 4k_z/m = (2π f)².
        var thresholds = json.GetProperty("thresholds").EnumerateArray().Select(t => t.GetProperty("value").GetDouble()).ToArray();
        NumericAssert.Close(new[] { 4 * Kz / Math.Pow(2 * Math.PI * 7.35, 2), 4 * Kz / Math.Pow(2 * Math.PI * 6.65, 2) }, thresholds, Tolerance.Rel(1e-8), "thresholds");
    }

    [Fact]
    public void OneDirectionStudy_Table_NamesEachModesMotion_AndKeepsTheHorizontalModes()
    {
        var run = CommandRun.Of("study", Block, "--vary", "springs.mount-1.stiffness.z", "--from", "0.2 kN/mm", "--to", "2 kN/mm", "--steps", "5");
        Assert.True(run.ExitCode == 0, run.Error);
        Assert.Contains("Study of springs.mount-1.stiffness.z from 200 kN/m to 2000 kN/m", run.Output); // shown in the unit the file writes stiffness in
        Assert.Contains("Motion of each mode", run.Output);
        Assert.Contains("licensed engineer", run.Output);
        var lines = run.Output.Split('\n');
        foreach (var motion in new[] { "surge", "sway", "yaw" })
            Assert.Contains(lines, l => l.Trim().EndsWith($": {motion}", StringComparison.Ordinal));
        // Surge, sway and yaw do not see the vertical stiffness (closed forms above; h = 0): their columns are constant.
        var json = CommandRun.Of("study", Block, "--vary", "springs.mount-1.stiffness.z", "--from", "0.2 kN/mm", "--to", "2 kN/mm", "--steps", "5", "--format", "json").Json();
        var expected = new Dictionary<string, double> { ["surge"] = Hz(4 * Kx / Mass), ["sway"] = Hz(4 * Ky / Mass), ["yaw"] = Hz(4 * (Kx * 0.25 + Ky * 0.64) / 520) };
        foreach (var mode in json.GetProperty("modes").EnumerateArray())
            if (expected.TryGetValue(mode.GetProperty("motion")[0].GetString()!, out var f))
                Assert.All(mode.GetProperty("frequency_hz").EnumerateArray(), x => NumericAssert.Close(f, x.GetDouble(), Tolerance.Rel(1e-10), "horizontal mode"));
    }

    [Fact]
    public void DamperComponent_ReadsItsUnit_AndABareNumberInSi()
    {
        var run = CommandRun.Of("study", Block, "--vary", "dampers.pad.coefficient.z", "--from", "1", "--to", "3 kN*s/m", "--steps", "2", "--format", "csv");
        Assert.True(run.ExitCode == 0, run.Error);
        Assert.StartsWith("dampers.pad.coefficient.z [N*s/m]", run.Output, StringComparison.Ordinal);
        Assert.Contains("(the SI unit of dampers.pad.coefficient.z)", run.Error);
        Assert.Equal(3000.0, double.Parse(run.Output.Split('\n')[2].Split(',')[0], CultureInfo.InvariantCulture));
    }

    [Theory]
    [InlineData("springs.mount-1.stiffness.w", "1 kN/mm", "'w' is not a translation (x, y, z)")]
    [InlineData("springs.mount-1.rotational-stiffness.rx", "1 kN*m/rad", "spring 'mount-1' has no rotational-stiffness in 'rx'; spring 'mount-1' has: springs.mount-1.stiffness (every direction in proportion), springs.mount-1.stiffness.x")]
    [InlineData("springs.mount-1.axial", "1 kN/mm", "spring 'mount-1' is not axial")]
    [InlineData("bodies.crate.mass", "1 t", "no entry 'crate' under 'bodies' (it has: block)")]
    [InlineData("bodies.block.inertia", "1 t", "'inertia' of bodies is not a numeric field")]
    [InlineData("dampers.pad.coefficient.x", "1 kN*s/m", "damper 'pad' has no coefficient in 'x'")]
    [InlineData("springs.mount-1.stiffness.z", "1 kg", "--from")]
    public void BadPaths_ExitTwoWithAClearMessage(string vary, string from, string expected)
    {
        var run = CommandRun.Of("study", Block, "--vary", vary, "--from", from, "--to", "3 kN/mm", "--steps", "3");
        Assert.Equal(2, run.ExitCode);
        Assert.Contains(expected, run.Error);
        Assert.Equal("", run.Output);
    }

    [Fact]
    public void SpeedChart_RunsOnA3dModel()
    {
        // Crossings at s = f_n / h (closed form of the chart): pitch at 12.08 Hz meets order 1 at 724.8 rpm.
        var run = CommandRun.Of("study", Block, "--vary", "speed", "--from", "0 rpm", "--to", "900 rpm", "--steps", "5", "--format", "json");
        Assert.True(run.ExitCode == 0, run.Error);
        SchemaFiles.AssertValid("study.schema.json", run.Output, "speed chart on a 3d model");
        var crossings = run.Json().GetProperty("crossings").EnumerateArray().Select(c => c.GetProperty("speed_hz").GetDouble()).ToArray();
        Assert.Contains(crossings, s => Math.Abs(s - Hz(4 * Kz * A * A / Jy)) < 1e-9 * s);
    }

    [Fact]
    public void RotationalStiffnessStudy_Table_ShowsTheValuesInNewtonMetresPerRadian()
    {
        // Rotational stiffness has no display unit of its own: the varied value is shown in SI (N*m/rad), never in a
        // stiffness or damping unit.
        var model = CommandRun.ModelFile(File.ReadAllText(Block).Replace(
            "dampers:", "  twist: {between: [block.foot-1, ground], rotational-stiffness: {rz: 50 kN*m/rad}}\ndampers:", StringComparison.Ordinal));
        var run = CommandRun.Of("study", model, "--vary", "springs.twist.rotational-stiffness.rz", "--from", "20 kN*m/rad", "--to", "80 kN*m/rad", "--steps", "3");
        Assert.True(run.ExitCode == 0, run.Error);
        Assert.Contains("Study of springs.twist.rotational-stiffness.rz from 20000 N*m/rad to 80000 N*m/rad", run.Output);
        Assert.Contains("springs.twist.rotational-stiffness.rz [N*m/rad]", run.Output);
    }
}
