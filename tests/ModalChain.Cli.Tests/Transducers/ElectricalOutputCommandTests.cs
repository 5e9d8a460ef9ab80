using System.Globalization;
using System.Numerics;
using System.Text.Json;
using ModalChain.Cli.Tests.Schemas;

namespace ModalChain.Cli.Tests.Transducers;

/// <summary>The electrical side of a transducer model in the commands' outputs: volts and amperes, port and source currents.</summary>
public class ElectricalOutputCommandTests
{
    private static string Example => Path.Combine(CliRun.RepositoryRoot, "models", "floor-shaker-test.yaml");

    private static Complex[] Curve(JsonElement item)
    {
        var magnitude = item.GetProperty("magnitude").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        var phase = item.GetProperty("phase_deg").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        return [.. magnitude.Select((m, k) => Complex.FromPolarCoordinates(m, phase[k] * Math.PI / 180))];
    }

    [Fact]
    public void HarmonicJson_OfTheFloorTest_SpeaksVoltsAndAmperesOnTheElectricalSide()
    {
        // models/floor-shaker-test.yaml: amplifier-out (1 V) → 2 Ω → shaker-coil (branch [shaker-coil, ground]);
        // sensor-coil → 375 Ω → sensor-out → 10 kΩ → ground. Closed forms (Ohm's law, the divider), with the
        // conductances of the model's resistors: shaker port current i = (u − 1 V)·0.5 S, source current −i; the sensor's
        // i = u·G₁G₂/(G₁ + G₂) and V_out = u·G₁/(G₁ + G₂). 1e-9 of each value (JSON numbers round-trip their doubles;
        // magnitude and phase through polar form).
        var o = CliRun.Run("harmonic", Example, "--format", "json");
        Assert.True(o.ExitCode == 0, o.ToString());
        SchemaFiles.AssertValid("harmonic.schema.json", o.Stdout, "harmonic on floor-shaker-test.yaml");
        using var json = JsonDocument.Parse(o.Stdout);
        var root = json.RootElement;
        var responses = root.GetProperty("responses").EnumerateArray().ToArray();
        Assert.Equal(["flux_linkage", "voltage", "voltage_rate"], responses.Where(r => r.GetProperty("dof").GetString() == "sensor-out").Select(r => r.GetProperty("quantity").GetString()));
        Assert.Equal(["V*s", "V", "V/s"], responses.Where(r => r.GetProperty("dof").GetString() == "sensor-out").Select(r => r.GetProperty("unit").GetString()));
        Assert.Equal(["m", "m/s", "m/s^2"], responses.Where(r => r.GetProperty("dof").GetString() == "bay-a").Select(r => r.GetProperty("unit").GetString()));
        var units = root.GetProperty("element_forces").EnumerateArray().ToDictionary(e => e.GetProperty("element").GetString()!, e => e.GetProperty("unit").GetString());
        Assert.Equal("A", units["recorder-input"]);
        Assert.Equal("A", units["sensor-coil-resistance"]);
        Assert.Equal("N", units["bay-b-beams"]);
        Assert.Equal(["ground"], root.GetProperty("reactions").EnumerateArray().Select(r => r.GetProperty("support").GetString()));

        var source = Curve(root.GetProperty("source_currents").EnumerateArray().Single(s => s.GetProperty("support").GetString() == "amplifier-out"));
        var ports = root.GetProperty("transducer_ports").EnumerateArray().ToArray();
        Complex[] Port(string name, string quantity) => Curve(ports.Single(p => p.GetProperty("transducer").GetString() == name && p.GetProperty("quantity").GetString() == quantity));
        var (uShaker, iShaker, uSensor, iSensor) = (Port("shaker", "voltage"), Port("shaker", "current"), Port("sensor", "voltage"), Port("sensor", "current"));
        var vOut = Curve(responses.Single(r => r.GetProperty("dof").GetString() == "sensor-out" && r.GetProperty("quantity").GetString() == "voltage"));
        const double g1 = 1.0 / 375, g2 = 1.0 / 10e3;
        Assert.True(uShaker.Length > 100);
        for (var k = 0; k < uShaker.Length; k++)
        {
            static void Near(Complex expected, Complex actual, string what) =>
                Assert.True((expected - actual).Magnitude <= 1e-9 * expected.Magnitude, $"{what}: {actual} against {expected}");
            Near((uShaker[k] - 1) * 0.5, iShaker[k], "shaker port current");
            Near(-iShaker[k], source[k], "amplifier current");
            Near(uSensor[k] * g1 * g2 / (g1 + g2), iSensor[k], "sensor port current");
            Near(uSensor[k] * g1 / (g1 + g2), vOut[k], "sensor output voltage");
        }
    }

    [Fact]
    public void CsvAndConsole_HeadTheElectricalColumnsInVoltsAndAmperes()
    {
        // Common practice: a table's heading carries the unit of its column.
        var csv = CliRun.Run("harmonic", Example, "--format", "csv");
        Assert.True(csv.ExitCode == 0, csv.ToString());
        var header = csv.Stdout.Split('\n')[0].Split(',');
        Assert.Contains("sensor-out voltage magnitude [V]", header);
        Assert.Contains("recorder-input resistor current magnitude [A]", header);
        Assert.Contains("source current amplifier-out magnitude [A]", header);
        Assert.Contains("port shaker current magnitude [A]", header);
        Assert.Contains("port sensor voltage magnitude [V]", header);
        Assert.DoesNotContain(header, h => h.StartsWith("sensor-out velocity", StringComparison.Ordinal));
        Assert.DoesNotContain(header, h => h.StartsWith("reaction amplifier-out", StringComparison.Ordinal));

        var text = CliRun.Run("harmonic", Example);
        Assert.True(text.ExitCode == 0, text.ToString());
        Assert.Contains("amplifier (source voltage 1 V at amplifier-out)", text.Stdout);
        Assert.Matches(@"port of shaker\s+current\s+0\.4998\s+A", text.Stdout); // 1 V over 2 Ω where the coil barely moves
        Assert.Matches(@"node sensor-out\s+voltage\s+\S+\s+V", text.Stdout);
    }

    [Fact]
    public void TransientJsonAndCsv_RecordPortsAndSourceCurrents()
    {
        // A shaker on a table driven by a half-sine voltage pulse (the source support's acceleration history). Kirchhoff's
        // current law at the coil's node: the port current leaves it through the meter (u·G_m) and the coil resistance,
        // whose current is the source's, so i + I_source = u·G_m at every written instant (1e-9 of the largest current).
        // Ohm's law through the coil resistance then gives the source voltage back, V = u + I_source/G_R, against the
        // integral of the half-sine, a·T/π·(1 − cos(πt/T)) (closed form; 1e-5 V of the 1 V pulse: the program integrates the
        // acceleration as linear between steps, off by at most h²/12·(ȧ(0) − ȧ(T)) = 3.3e-6 V here).
        var dir = Path.Combine(Path.GetTempPath(), "modalchain-electrical-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(dir);
        var path = Path.Combine(dir, "shaker.yaml");
        File.WriteAllText(path, """
            title: Bench shaker under a voltage pulse
            masses:
              table: 2 kg
            nodes: [coil-plus]
            supports:
              amplifier:
            springs:
              flexure: {between: [ground, table], stiffness: 40 kN/m}
            dampers:
              flexure-loss: {between: [ground, table], coefficient: 15 N*s/m}
              coil-resistance: {between: [amplifier, coil-plus], coefficient: 0.25 N*s/m}
              meter: {between: [coil-plus, ground], coefficient: 1e-3 N*s/m}
            transducers:
              coil: {between: [table, ground], branch: [coil-plus, ground], force-factor: 12 T*m}
            loads:
              step: {kind: base-motion, support: amplifier, time: {kind: half-sine, amplitude: 31.4159 m/s^2, duration: 50 ms}}
            transient:
              duration: 0.2 s
              step: 0.1 ms
              loads: [step]
            """); // test input, not a product output
        var o = CliRun.Run("transient", path, "--format", "json");
        Assert.True(o.ExitCode == 0, o.ToString());
        SchemaFiles.AssertValid("transient.schema.json", o.Stdout, "transient of the shaker");
        using var json = JsonDocument.Parse(o.Stdout);
        var root = json.RootElement;
        double[] Values(JsonElement e) => [.. e.GetProperty("values").EnumerateArray().Select(v => v.GetDouble())];
        var ports = root.GetProperty("transducer_ports").EnumerateArray().ToArray();
        var u = Values(ports.Single(p => p.GetProperty("quantity").GetString() == "voltage"));
        var i = Values(ports.Single(p => p.GetProperty("quantity").GetString() == "current"));
        Assert.Equal(["V", "A"], ports.Select(p => p.GetProperty("unit").GetString()));
        var source = Values(root.GetProperty("source_currents").EnumerateArray().Single());
        Assert.DoesNotContain(root.GetProperty("reactions").EnumerateArray(), r => r.GetProperty("support").GetString() == "amplifier");
        var elements = root.GetProperty("element_forces").EnumerateArray().ToDictionary(e => e.GetProperty("element").GetString()!, e => e.GetProperty("unit").GetString());
        Assert.Equal("A", elements["coil-resistance"]);
        Assert.Equal("N", elements["flexure"]);
        var t = root.GetProperty("time_s").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        var largest = i.Max(Math.Abs);
        Assert.True(largest > 0, "the pulse drives a current");
        for (var k = 0; k < t.Length; k++)
        {
            const double a = 31.4159, duration = 0.05, gR = 0.25, gM = 1e-3;
            Assert.True(Math.Abs(u[k] * gM - source[k] - i[k]) <= 1e-9 * largest, string.Create(CultureInfo.InvariantCulture, $"Kirchhoff at coil-plus at {t[k]} s"));
            var volts = a * duration / Math.PI * (1 - Math.Cos(Math.PI * Math.Min(t[k], duration) / duration));
            Assert.True(Math.Abs(u[k] + source[k] / gR - volts) <= 1e-5, string.Create(CultureInfo.InvariantCulture, $"source voltage at {t[k]} s: {u[k] + source[k] / gR} against {volts}"));
        }

        var csv = CliRun.Run("transient", path, "--format", "csv");
        Assert.True(csv.ExitCode == 0, csv.ToString());
        var header = csv.Stdout.Split('\n')[0].Split(',');
        Assert.Contains("coil port voltage [V]", header);
        Assert.Contains("coil port current [A]", header);
        Assert.Contains("amplifier source current [A]", header);
        Assert.Contains("coil-resistance resistor current [A]", header);
    }

    [Fact]
    public void OperatingPoint_CarriesPortAndSourceCurrents()
    {
        // A blocked coil (its pair held: [frame, ground], both supports) behind R = 4 Ω from a 1 V source running at
        // 50 Hz: at the operating point the source delivers I = V/R = 0.25 A in phase with the source, the port current
        // (out of n1 into the circuit) is −0.25 A and the port voltage 0 (Ohm's law; 1e-12 relative).
        var dir = Path.Combine(Path.GetTempPath(), "modalchain-electrical-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(dir);
        var path = Path.Combine(dir, "blocked.yaml");
        File.WriteAllText(path, """
            title: Blocked coil on a bench
            masses:
              bench: 50 kg
            nodes: [coil-plus]
            supports:
              frame: {}
              amplifier: {}
            springs:
              bench-feet: {between: [ground, bench], stiffness: 200 kN/m}
            dampers:
              bench-loss: {between: [ground, bench], coefficient: 300 N*s/m}
              coil-resistance: {between: [amplifier, coil-plus], coefficient: 0.25 N*s/m}
            transducers:
              coil: {between: [frame, ground], branch: [coil-plus, ground], force-factor: 12 T*m}
            loads:
              drive: {kind: base-motion, support: amplifier, velocity: 1 m/s, speed: 50 Hz}
            harmonic:
              loads: [drive]
              frequencies: {from: 10 Hz, to: 100 Hz, points: 10}
            """); // test input, not a product output
        var o = CliRun.Run("harmonic", path, "--format", "json");
        Assert.True(o.ExitCode == 0, o.ToString());
        SchemaFiles.AssertValid("harmonic.schema.json", o.Stdout, "harmonic of the blocked coil");
        using var json = JsonDocument.Parse(o.Stdout);
        var point = Assert.Single(json.RootElement.GetProperty("operating_points").EnumerateArray());
        var source = Assert.Single(point.GetProperty("source_currents").EnumerateArray());
        Assert.Equal("amplifier", source.GetProperty("name").GetString());
        Assert.Equal("A", source.GetProperty("unit").GetString());
        Assert.True(Math.Abs(source.GetProperty("magnitude").GetDouble() - 0.25) <= 1e-12 * 0.25, "source current");
        Assert.True(Math.Abs(source.GetProperty("phase_deg").GetDouble()) <= 1e-9, "in phase with the source");
        var ports = point.GetProperty("transducer_ports").EnumerateArray().ToDictionary(p => p.GetProperty("quantity").GetString()!);
        Assert.Equal(0, ports["voltage"].GetProperty("magnitude").GetDouble());
        Assert.True(Math.Abs(ports["current"].GetProperty("magnitude").GetDouble() - 0.25) <= 1e-12 * 0.25, "port current");
        Assert.True(Math.Abs(Math.Abs(ports["current"].GetProperty("phase_deg").GetDouble()) - 180) <= 1e-9, "opposite to the source current");
    }
}
