using System.Text.Json;
using System.Text.Json.Nodes;
using ModalChain.Cli.Tests.Schemas;

namespace ModalChain.Cli.Tests.Commands;

/// <summary><c>modalchain report</c> on a circuit model: exit code, files, results.json against its schema and against the circuit commands' own JSON.</summary>
public sealed class CircuitReportCommandTests
{
    private static string Example => Path.Combine(CliRun.RepositoryRoot, "models", "series-circuit.yaml");

    private static string Temp()
    {
        var path = Path.Combine(Path.GetTempPath(), "modalchain-cli-tests", Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(path);
        return path;
    }

    private static (string Dir, CliOutcome Outcome) Report(params string[] options)
    {
        var dir = Path.Combine(Temp(), "out");
        return (dir, CliRun.Run(["report", Example, "-o", dir, .. options]));
    }

    [Fact]
    public void CircuitReport_ExitsZero_WritesTheCircuitFigures_AndResultsJsonIsValidAgainstItsSchema()
    {
        var (dir, o) = Report();
        Assert.True(o.ExitCode == 0, o.ToString());
        foreach (var file in new[] { "report.html", "results.json", "circuit.svg", "impedance-stage.svg", "transfer-stage.svg", "circuit-voltages.svg", "circuit-currents.svg" })
            Assert.True(File.Exists(Path.Combine(dir, file)), file);
        Assert.False(File.Exists(Path.Combine(dir, "mode-01.svg")), "no mode figures for a circuit");
        var json = File.ReadAllText(Path.Combine(dir, "results.json"));
        SchemaFiles.AssertValid("results.schema.json", json, "report results.json of series-circuit.yaml");
        // The schema's objects forbid undeclared fields, the circuit's too.
        var node = JsonNode.Parse(json)!.AsObject();
        node["circuit"]!.AsObject()["a_field_no_schema_declares"] = 1;
        using var changed = JsonDocument.Parse(node.ToJsonString());
        Assert.NotNull(SchemaFiles.Problems("results.schema.json", changed.RootElement));
    }

    [Theory]
    [InlineData("circuit_roots", "modes")]
    [InlineData("circuit_sweep", "harmonic")]
    public void ResultsJson_HoldsExactlyTheCircuitCommandsObject(string key, string command)
    {
        var (dir, o) = Report();
        Assert.True(o.ExitCode == 0, o.ToString());
        var direct = CliRun.Run(command, Example, "--format", "json");
        Assert.True(direct.ExitCode == 0, direct.ToString());
        using var expected = JsonDocument.Parse(direct.Stdout);
        using var results = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(dir, "results.json")));
        Assert.True(JsonElement.DeepEquals(expected.RootElement, results.RootElement.GetProperty(key)), $"{key} differs from '{command} --format json'");
    }

    [Fact]
    public void AbsorberOptions_OnACircuit_ExitTwoAndWriteNothing()
    {
        var (dir, o) = Report("--absorber-host", "output", "--mass-ratio", "5 %");
        Assert.True(o.ExitCode == 2, o.ToString());
        Assert.Contains("a circuit's report takes neither", o.Stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(dir));
    }

    [Fact]
    public void CircuitReport_IsByteIdenticalUnderADecimalCommaCulture()
    {
        var (a, first) = Report();
        string[] files;
        using (new ModalChain.TestSupport.CultureScope("de-DE"))
        {
            var (b, second) = Report();
            Assert.True(first.ExitCode == 0 && second.ExitCode == 0, first + "\n" + second);
            files = [.. Directory.GetFiles(a).Select(Path.GetFileName).Where(f => f!.EndsWith(".svg", StringComparison.Ordinal)).Select(f => f!)];
            foreach (var f in files) Assert.Equal(File.ReadAllText(Path.Combine(a, f)), File.ReadAllText(Path.Combine(b, f)));
        }
        Assert.NotEmpty(files);
    }
}
