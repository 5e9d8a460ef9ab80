using System.Globalization;
using ModalChain.Cli.Tests.Schemas;

namespace ModalChain.Cli.Tests.Transducers;

/// <summary>Transducer models through the commands: analysed end to end, and bad input is a located error with exit 2.</summary>
public class TransducerCommandTests
{
    private const string Shaker = """
        title: Bench shaker driving a test table
        masses:
          table: 2 kg
          coil-plus: 1e-6 kg
        supports:
          amplifier:
        springs:
          flexure: {between: [ground, table], stiffness: 40 kN/m}
        dampers:
          flexure-loss: {between: [ground, table], coefficient: 15 N*s/m}
          coil-resistance: {between: [amplifier, coil-plus], coefficient: 0.25 N*s/m}
        transducers:
          coil: {between: [table, ground], branch: [coil-plus, ground], force-factor: 12 T*m}
        loads:
          drive: {kind: base-motion, support: amplifier, velocity: 1 m/s}
          step: {kind: base-motion, support: amplifier, time: {kind: half-sine, amplitude: 31.4159 m/s^2, duration: 50 ms}}
        harmonic:
          loads: [drive]
          frequencies: {from: 1 Hz, to: 100 Hz, points: 20}
        transient:
          duration: 0.2 s
          step: 0.1 ms
          loads: [step]

        """;

    private static string Write(string text)
    {
        var dir = Path.Combine(Path.GetTempPath(), "modalchain-transducer-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(dir);
        var path = Path.Combine(dir, "shaker.yaml");
        File.WriteAllText(path, text); // test input, not a product output
        return path;
    }

    [Fact]
    public void VelocitySensor_ReadAcrossALoadThroughAMasslessNode_HasTheShuntDampingOfTheSeriesResistance()
    {
        // A moving-coil velocity sensor on a fixed base, its coil resistance and the recorder's input resistance in
        // series: the node between them is massless and touched by dampers only (a first-order state), the coil's
        // own node is eliminated by the transducer. The electrical side is then a damper (Bl)²/(R_coil + R_load) on the
        // seismic mass, so ζ = c/(2mω₀) + (Bl)²/(2mω₀(R_coil + R_load)) with ω₀ = √(k/m) unchanged (common practice for
        // moving-coil sensors; derived in docs/methods.md, "Transducers"). The undamped modes carry no damping ratio
        // here (docs/methods.md, "Massless nodes and mounts"): the complex root does.
        const double m = 0.011, k = 8.8, c = 0.19, bl = 28, rCoil = 375, rLoad = 10_000;
        var path = Write(string.Create(CultureInfo.InvariantCulture, $$"""
            title: Velocity sensor read across a recorder input
            masses:
              seismic: {{m}} kg
            nodes: [coil-plus, out]
            springs:
              suspension: {between: [ground, seismic], stiffness: {{k}} N/m}
            dampers:
              open-circuit: {between: [ground, seismic], coefficient: {{c}} N*s/m}
              coil-resistance: {between: [coil-plus, out], coefficient: {{1 / rCoil}} N*s/m}
              recorder: {between: [out, ground], coefficient: {{1 / rLoad}} N*s/m}
            transducers:
              sensor: {between: [seismic, ground], branch: [coil-plus, ground], force-factor: {{bl}} T*m}

            """));
        var modes = CliRun.Run("modes", path, "--format", "json");
        Assert.True(modes.ExitCode == 0, modes.ToString());
        using var json = System.Text.Json.JsonDocument.Parse(modes.Stdout);
        var w0 = Math.Sqrt(k / m);
        var undamped = json.RootElement.GetProperty("modes")[0];
        Assert.True(Math.Abs(undamped.GetProperty("frequency_hz").GetDouble() - w0 / (2 * Math.PI)) <= 1e-10 * w0, undamped.ToString());
        Assert.Equal(System.Text.Json.JsonValueKind.Null, undamped.GetProperty("damping_ratio").ValueKind);
        var roots = json.RootElement.GetProperty("complex_modes").EnumerateArray().Where(r => r.GetProperty("oscillatory").GetBoolean()).ToList();
        var root = Assert.Single(roots);
        var expected = c / (2 * m * w0) + bl * bl / (2 * m * w0 * (rCoil + rLoad));
        var zeta = root.GetProperty("damping_ratio").GetDouble();
        Assert.True(Math.Abs(zeta - expected) <= 1e-9 * expected, $"ζ {zeta} against {expected}");
        Assert.True(Math.Abs(root.GetProperty("undamped_frequency_hz").GetDouble() - w0 / (2 * Math.PI)) <= 1e-9 * w0, root.ToString());
    }

    [Fact]
    public void FloorTestExample_SensorVoltageFollowsTheFloorVelocityAsAMovingCoilSensorOnAMovingBase()
    {
        // models/floor-shaker-test.yaml: the sensor on bay B, read across a 10 kΩ recorder input through its
        // 375 Ω coil. Per unit base velocity its output is Bl·R_load/(R_coil + R_load)·ω²/|ω₀² − ω² + 2iζω₀ω| with
        // ζ = c/(2mω₀) + (Bl)²/(2mω₀(R_coil + R_load)) (common practice for moving-coil sensors, the open-circuit
        // sensitivity of docs/methods.md "Transducers" with the load divider). The closed form neglects the sensor's
        // reaction on the 5,000 kg bay (mass ratio 2e-6), hence 1e-4 relative (4.5e-6 seen).
        var example = Path.Combine(CliRun.RepositoryRoot, "models", "floor-shaker-test.yaml");
        SchemaFiles.AssertValid("model.schema.json", SchemaFiles.YamlToJson(File.ReadAllText(example)).GetRawText(), "floor-shaker-test.yaml");
        var o = CliRun.Run("harmonic", example, "--format", "json");
        Assert.True(o.ExitCode == 0, o.ToString());
        SchemaFiles.AssertValid("harmonic.schema.json", o.Stdout, "harmonic on floor-shaker-test.yaml");
        using var json = System.Text.Json.JsonDocument.Parse(o.Stdout);
        // An electrical node's velocity is written as its voltage (docs/model-format.md, outputs on the electrical side).
        double[] Velocity(string dof) => [.. json.RootElement.GetProperty("responses").EnumerateArray()
            .Single(r => r.GetProperty("dof").GetString() == dof && r.GetProperty("quantity").GetString() == (dof == "sensor-out" ? "voltage" : "velocity"))
            .GetProperty("magnitude").EnumerateArray().Select(v => v.GetDouble())];
        var f = json.RootElement.GetProperty("frequencies_hz").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        var floor = Velocity("bay-b");
        var output = Velocity("sensor-out");
        const double m = 0.011, k = 8.8, c = 0.19, bl = 28, rCoil = 375, rLoad = 10_000;
        var w0 = Math.Sqrt(k / m);
        var zeta = c / (2 * m * w0) + bl * bl / (2 * m * w0 * (rCoil + rLoad));
        Assert.True(f.Length > 100, "the sweep");
        for (var i = 0; i < f.Length; i++)
        {
            var w = 2 * Math.PI * f[i];
            var expected = bl * rLoad / (rCoil + rLoad) * w * w / new System.Numerics.Complex(w0 * w0 - w * w, 2 * zeta * w0 * w).Magnitude;
            var ratio = output[i] / floor[i];
            Assert.True(Math.Abs(ratio - expected) <= 1e-4 * expected, $"{f[i]} Hz: {ratio} V per m/s against {expected}");
        }
    }

    [Fact]
    public void Shaker_RunsThroughModesHarmonicAndTransient()
    {
        // The table's frequency with the coil: √(k/m') with m' = m + C·Bl² = 2 + 1e-6·144 kg (closed form).
        var path = Write(Shaker);
        var modes = CliRun.Run("modes", path, "--format", "json");
        Assert.True(modes.ExitCode == 0, modes.ToString());
        var expected = Math.Sqrt(4e4 / (2 + 1e-6 * 144)) / (2 * Math.PI);
        using (var json = System.Text.Json.JsonDocument.Parse(modes.Stdout))
        {
            var f = json.RootElement.GetProperty("modes")[0].GetProperty("frequency_hz").GetDouble();
            Assert.True(Math.Abs(f - expected) <= 1e-9 * expected, $"{f} against {expected}");
        }
        Assert.DoesNotContain("no spring", modes.Stderr, StringComparison.Ordinal);
        foreach (var command in new[] { "harmonic", "transient", "validate" })
        {
            var run = CliRun.Run(command, path);
            Assert.True(run.ExitCode == 0, run.ToString());
        }
    }

    [Theory]
    [InlineData("  t2: {between: [table, ground], branch: [coil-plus, ground], force-factor: 0 T*m}\n", 13, 77, "force factor")]
    [InlineData("  t2: {between: [table, ground], branch: [coil-plus, ground], force-factor: 1 T*m}\n", 14, 3, "already eliminates")]
    [InlineData("  t2: {between: [table, ground], branch: [amplifier, ground], force-factor: 1 T*m}\n", 13, 3, "both branch terminals on supports")]
    [InlineData("  t2: {between: [table, ground], branch: [nowhere, ground], force-factor: 1 T*m}\n", 13, 43, "unknown node 'nowhere'")]
    public void BadTransducers_ExitTwo_WithALocatedMessage(string entry, int line, int column, string fragment)
    {
        // The bad entry goes first in the existing section (line 13), before 'coil' (then line 14).
        var path = Write(Shaker.Replace("transducers:\n", "transducers:\n" + entry, StringComparison.Ordinal));
        foreach (var command in new[] { "validate", "harmonic" })
        {
            var run = CliRun.Run(command, path);
            Assert.True(run.ExitCode == 2, run.ToString());
            Assert.Contains(string.Create(CultureInfo.InvariantCulture, $"shaker.yaml:{line}:{column}: error: "), run.Stderr, StringComparison.Ordinal);
            Assert.Contains(fragment, run.Stderr, StringComparison.Ordinal);
        }
    }
}
