using System.Text.Json;
using ModalChain.Cli.Tests.Schemas;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests.Circuits;

/// <summary>Every circuit model in models/ end to end: validate, the circuit commands' tables and JSON (against their schemas), the report, and the commands that refuse circuits.</summary>
public class CircuitModelsEndToEndTests
{
    [Fact]
    public void ThereIsAtLeastOneCircuitExample() => Assert.NotEmpty(CircuitModels());

    [Theory]
    [MemberData(nameof(CliRun.CircuitModels), MemberType = typeof(CliRun))]
    public void Validate_SaysItIsACircuit(string model)
    {
        var o = Run("validate", ModelPath(model));
        Assert.True(o.ExitCode == 0, o.ToString());
        Assert.Contains("(a circuit)", o.Stdout, StringComparison.Ordinal);
        Assert.Contains("sha256:", o.Stdout, StringComparison.Ordinal);
    }

    [Theory]
    [MemberData(nameof(CliRun.CircuitModels), MemberType = typeof(CliRun))]
    public void CircuitCommands_TablesCarryTheCautions_AndJsonIsValidAgainstItsSchema(string model)
    {
        var path = ModelPath(model);
        var document = ModalChain.Io.Model.ModelReader.ReadFile(path).Model!.Circuit!;
        var runs = new List<(string Command, string Schema)> { ("modes", "circuit-modes.schema.json") };
        if (document.Sweep is not null && document.Circuit.VoltageSources.Length + document.Circuit.CurrentSources.Length > 0)
            runs.Add(("harmonic", "circuit-harmonic.schema.json"));
        if (document.Duration is not null) runs.Add(("transient", "circuit-transient.schema.json"));
        foreach (var (command, schema) in runs)
        {
            var table = Run(command, path);
            Assert.True(table.ExitCode == 0, table.ToString());
            Assert.Contains("licensed engineer", Unwrapped(table.Stdout), StringComparison.Ordinal);
            Assert.Contains("qualified person", Unwrapped(table.Stdout), StringComparison.Ordinal);
            var json = Run(command, path, "--format", "json");
            Assert.True(json.ExitCode == 0, json.ToString());
            SchemaFiles.AssertValid(schema, json.Stdout, $"{command} on {model}");
            using var parsed = JsonDocument.Parse(json.Stdout);
            Assert.Equal("circuit", parsed.RootElement.GetProperty("model_kind").GetString());
        }
    }

    [Theory]
    [MemberData(nameof(CliRun.CircuitModels), MemberType = typeof(CliRun))]
    public void Report_IsWritten_AndItsResultsJsonIsValid(string model)
    {
        var dir = Path.Combine(Path.GetTempPath(), "modalchain-cli-tests", Guid.NewGuid().ToString("N"), "out");
        var o = Run("report", ModelPath(model), "-o", dir);
        Assert.True(o.ExitCode == 0, o.ToString());
        Assert.True(File.Exists(Path.Combine(dir, "circuit.svg")));
        SchemaFiles.AssertValid("results.schema.json", File.ReadAllText(Path.Combine(dir, "results.json")), $"report of {model}");
        Assert.Contains("ModalChain circuit report", File.ReadAllText(Path.Combine(dir, "report.html")), StringComparison.Ordinal);
    }

    [Theory]
    [MemberData(nameof(CliRun.CircuitModels), MemberType = typeof(CliRun))]
    public void CommandsWithoutACircuitForm_ExitTwo(string model)
    {
        foreach (var command in new[] { new[] { "check" }, ["tune", "--host", "x", "--mass-ratio", "5 %"], ["study", "--vary", "speed", "--from", "0", "--to", "10 Hz"] })
        {
            var o = Run([command[0], ModelPath(model), .. command.Skip(1)]);
            Assert.True(o.ExitCode == 2, o.ToString());
            Assert.Contains("does not take circuit models yet", o.Stderr, StringComparison.Ordinal);
        }
    }
}
