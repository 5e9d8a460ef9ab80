using System.Globalization;
using System.Text.Json;
using ModalChain.Cli.Tests.Schemas;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests.Circuits;

/// <summary>The commands on a circuit model: the example's outputs in electrical terms and valid JSON, and every bad
/// circuit a located error with exit code 2.</summary>
public class CircuitCommandTests
{
    private static string Example => Path.Combine(RepositoryRoot, "models", "series-circuit.yaml");

    [Fact]
    public void Example_IsValidAgainstTheModelSchema()
    {
        SchemaFiles.AssertValid("model.schema.json", SchemaFiles.YamlToJson(File.ReadAllText(Example)).GetRawText(), "series-circuit.yaml");
    }

    [Theory]
    [InlineData("modes", "circuit-modes.schema.json")]
    [InlineData("harmonic", "circuit-harmonic.schema.json")]
    [InlineData("transient", "circuit-transient.schema.json")]
    public void Example_JsonOutputs_AreValidAgainstTheCircuitSchemas(string command, string schema)
    {
        var o = Run(command, Example, "--format", "json");
        Assert.True(o.ExitCode == 0, o.ToString());
        SchemaFiles.AssertValid(schema, o.Stdout, $"{command} on series-circuit.yaml");
    }

    [Fact]
    public void Example_Modes_GivesTheSeriesRlcClosedForms()
    {
        // 2.2 Ω, 470 µH, 22 µF: f0 = 1/(2π√(LC)), ζ = (R/2)√(C/L), Q = 1/(2ζ) (series RLC, any circuits text [from memory]).
        double r = 2.2, l = 470e-6, c = 22e-6;
        var o = Run("modes", Example, "--format", "json");
        using var json = JsonDocument.Parse(o.Stdout);
        var roots = json.RootElement.GetProperty("roots").EnumerateArray().ToArray();
        // The two roots of the series RLC's second-order equation: no DC level (the flux level behind the resistor shows in no voltage).
        Assert.Equal(["oscillation"], roots.Select(x => x.GetProperty("kind").GetString()));
        var zeta = r / 2 * Math.Sqrt(c / l);
        Assert.Equal(1 / (2 * Math.PI * Math.Sqrt(l * c)), roots[0].GetProperty("natural_frequency_hz").GetDouble(), 1e-9);
        Assert.Equal(zeta, roots[0].GetProperty("damping_ratio").GetDouble(), 1e-12);
        Assert.Equal(1 / (2 * zeta), roots[0].GetProperty("q_factor").GetDouble(), 1e-11);
        var table = Run("modes", Example);
        Assert.DoesNotContain("DC level", table.Stdout);
        Assert.Contains((1 / (2 * zeta)).ToString("G6", CultureInfo.InvariantCulture), table.Stdout);
        Assert.Contains("Caution:", table.Stdout);
    }

    [Fact]
    public void Example_Transient_SettlesAtTheSourceVoltage()
    {
        // After a 24 V step the capacitor charges to 24 V (DC: no current in the steady state) [common practice].
        var o = Run("transient", Example, "--duration", "20 ms", "--step", "20 us", "--format", "json");
        using var json = JsonDocument.Parse(o.Stdout);
        var output = json.RootElement.GetProperty("node_voltages").EnumerateArray().Single(n => n.GetProperty("node").GetString() == "output");
        Assert.Equal(24, output.GetProperty("volts").EnumerateArray().Last().GetDouble(), 1e-6);
        Assert.Contains("v(output) (V)", Run("transient", Example).Stdout);
        Assert.Contains("|Z| (ohm)", Run("harmonic", Example).Stdout);
    }

    [Theory]
    [InlineData("modes")]
    [InlineData("harmonic")]
    [InlineData("transient")]
    public void Outputs_AreByteIdenticalUnderADecimalCommaCulture(string command)
    {
        // Rule of the project: output is the same under any locale (invariant culture everywhere).
        var invariant = Run(command, Example);
        var json = Run(command, Example, "--format", "json");
        using (new ModalChain.TestSupport.CultureScope("de-DE"))
        {
            Assert.Equal(invariant.Stdout, Run(command, Example).Stdout);
            Assert.Equal(json.Stdout, Run(command, Example, "--format", "json").Stdout);
        }
        Assert.Contains(".", invariant.Stdout);
    }

    [Theory]
    [InlineData("check")]
    [InlineData("tune", "--host", "output", "--mass-ratio", "5 %")]
    [InlineData("study", "--vary", "speed", "--from", "0", "--to", "10 Hz")]
    public void CommandsWithoutACircuitForm_RefuseACircuitWithExitCode2(string command, params string[] options)
    {
        var o = Run([command, Example, .. options]);
        Assert.True(o.ExitCode == 2, o.ToString());
        Assert.Contains("does not take circuit models yet", o.Stderr);
    }

    private const string Tank = """
        circuit:
          nodes: [a, b]
          resistors:
            R1: {between: [a, ground], resistance: 10 ohm}
          inductors:
            L1: {between: [a, b], inductance: 1 mH}
          capacitors:
            C1: {between: [b, ground], capacitance: 1 uF}
            C2: {between: [a, ground], capacitance: 1 uF}

        """;

    [Theory]
    [InlineData("unused node", 2, "node 'spare' has nothing attached")]
    [InlineData("voltage-source loop", 12, "voltage source 'V2' closes a loop of ideal voltage sources")]
    [InlineData("current-source cut set", 13, "which only current sources join to the rest")]
    [InlineData("negative inductance", 6, "inductance must be positive")]
    public void BadCircuit_IsALocatedErrorWithExitCode2(string problem, int line, string message)
    {
        var text = problem switch
        {
            "unused node" => Tank.Replace("nodes: [a, b]", "nodes: [a, b, spare]"),
            "voltage-source loop" => Tank + "  voltage-sources:\n    V1: {between: [a, ground]}\n    V2: {between: [a, ground]}\n",
            "current-source cut set" => Tank.Replace("nodes: [a, b]", "nodes: [a, b, c, d]")
                + "    C3: {between: [c, d], capacitance: 1 uF}\n  current-sources:\n    I1: {from: ground, to: a}\n    I2: {from: b, to: c}\n",
            "negative inductance" => Tank.Replace("inductance: 1 mH", "inductance: -1 mH"),
            _ => throw new ArgumentOutOfRangeException(nameof(problem)),
        };
        var path = Path.Combine(Path.GetTempPath(), $"modalchain-circuit-{Guid.NewGuid():N}.yaml");
        File.WriteAllText(path, text);
        try
        {
            foreach (var command in new[] { "validate", "modes", "harmonic", "transient" })
            {
                var o = Run(command, path);
                Assert.True(o.ExitCode == 2, o.ToString());
                Assert.Contains($"{path}:{line}:", o.Stderr);
                Assert.Contains(message, o.Stderr);
            }
        }
        finally
        {
            File.Delete(path);
        }
    }

    [Fact]
    public void Transient_RefusesACircuitAboveTheEnginesSize_WithExitCode2_WhileModesAndHarmonicRun()
    {
        // An RC ladder of 401 capacitor nodes behind a voltage source: 401 free nodes, one more than the dense driven
        // first-order form takes (TransientAnalysis.ExactMethodMaxDofs = 400). The sweep (sparse engine) has no such limit.
        const int count = 401;
        var text = new System.Text.StringBuilder();
        text.Append("circuit:\n  nodes: [in");
        for (var i = 1; i <= count; i++) text.Append(CultureInfo.InvariantCulture, $", n{i}");
        text.Append("]\n  resistors:\n");
        for (var i = 1; i <= count; i++) text.Append(CultureInfo.InvariantCulture, $"    R{i}: {{between: [{(i == 1 ? "in" : $"n{i - 1}")}, n{i}], resistance: 10 ohm}}\n");
        text.Append("  capacitors:\n");
        for (var i = 1; i <= count; i++) text.Append(CultureInfo.InvariantCulture, $"    C{i}: {{between: [n{i}, ground], capacitance: 1 uF}}\n");
        text.Append("  voltage-sources:\n    V1: {between: [in, ground], amplitude: 1 V, time: {kind: step, value: 1 V}}\n");
        text.Append("harmonic:\n  frequencies: [1 kHz]\ntransient:\n  duration: 1 ms\n  step: 0.5 ms\n");
        var path = Path.Combine(Path.GetTempPath(), $"modalchain-circuit-{Guid.NewGuid():N}.yaml");
        File.WriteAllText(path, text.ToString());
        try
        {
            var transient = Run("transient", path);
            Assert.True(transient.ExitCode == 2, transient.ToString());
            Assert.Contains("has 401 nodes not held by a voltage source; a transient run takes at most 400", transient.Stderr);
            var harmonic = Run("harmonic", path, "--format", "json");
            Assert.True(harmonic.ExitCode == 0, harmonic.ToString());
        }
        finally
        {
            File.Delete(path);
        }
    }
}
