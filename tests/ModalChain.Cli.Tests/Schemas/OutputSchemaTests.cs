using System.Globalization;
using System.Text.Json;
using System.Text.Json.Nodes;
using ModalChain.Core.Model;
using ModalChain.Io.Json;
using ModalChain.Io.Model;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests.Schemas;

/// <summary>Every command's <c>--format json</c> output, and a report's results.json, on every example model is valid
/// against its schema in docs/schema/; objects the writers own forbid undeclared fields, so a writer that gains a field
/// fails here until the schema declares it.</summary>
public class OutputSchemaTests
{
    /// <summary>The commands with a JSON output and the schema of each.</summary>
    public static readonly IReadOnlyDictionary<string, string> SchemaOf = new Dictionary<string, string>(StringComparer.Ordinal)
    {
        ["modes"] = "modes.schema.json",
        ["harmonic"] = "harmonic.schema.json",
        ["transient"] = "transient.schema.json",
        ["check"] = "check.schema.json",
        ["tune"] = "tune.schema.json",
        ["study"] = "study.schema.json",
        ["study-speed"] = "study.schema.json",
        ["report"] = "results.schema.json",
    };

    public static TheoryData<string, string> Runs()
    {
        var data = new TheoryData<string, string>();
        foreach (var model in ModelNames())
            foreach (var command in SchemaOf.Keys)
                data.Add(model, command);
        return data;
    }

    [Theory]
    [MemberData(nameof(Runs))]
    public void EveryJsonOutput_OnEveryExampleModel_IsValidAgainstItsSchema(string model, string command)
    {
        if (Output(model, command) is not { } json) return; // the command does not apply to this model (no section for it)
        SchemaFiles.AssertValid(SchemaOf[command], json, $"'{command}' on {model}");
        using var document = JsonDocument.Parse(json);
        Assert.Equal(JsonFormat.Version, document.RootElement.GetProperty("format_version").GetString());
    }

    [Fact]
    public void EveryCommand_IsExercisedByAtLeastOneExampleModel()
    {
        foreach (var command in SchemaOf.Keys)
            Assert.True(ModelNames().Any(m => Applies(Document(m), command)), $"no example model exercises '{command}'");
    }

    [Theory]
    [InlineData("modes")]
    [InlineData("check")]
    [InlineData("tune")]
    [InlineData("report")]
    public void AnUndeclaredField_FailsTheSchema(string command)
    {
        var json = Output("mezzanine-fan-absorber-check.yaml", command)!;
        var node = JsonNode.Parse(json)!.AsObject();
        node["a_field_no_schema_declares"] = 1;
        using var document = JsonDocument.Parse(node.ToJsonString());
        Assert.NotNull(SchemaFiles.Problems(SchemaOf[command], document.RootElement));
    }

    [Fact]
    public void EveryOutputSchema_StatesTheCurrentFormatVersion()
    {
        foreach (var file in SchemaOf.Values.Distinct())
        {
            using var schema = SchemaFiles.Document(file);
            var root = schema.RootElement;
            Assert.Contains("format_version", root.GetProperty("required").EnumerateArray().Select(e => e.GetString()));
            Assert.Equal(JsonFormat.Version, root.GetProperty("properties").GetProperty("format_version").GetProperty("const").GetString());
        }
    }

    private static ModelDocument Document(string model)
    {
        var r = ModelReader.ReadFile(ModelPath(model));
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
        return r.Model!;
    }

    private static bool Applies(ModelDocument d, string command) => d.Circuit is not null ? command == "report" : command switch
    {
        // A circuit's modes, harmonic and transient JSON have their own schemas (CircuitModelsEndToEndTests); check, tune
        // and study refuse circuits (exit 2).
        "harmonic" => d.Harmonic is not null,
        "transient" => d.Transient is not null,
        "check" => !d.Criteria.IsEmpty,
        // tune refuses plane and 3d models for now (exit 2, tested in SpatialOutputTests).
        "tune" => d.Network.Space == ModelSpace.Line,
        _ => true,
    };

    /// <summary>The JSON the command writes for the model, or null when the model has no section for the command.</summary>
    internal static string? Output(string model, string command)
    {
        var d = Document(model);
        if (!Applies(d, command)) return null;
        var path = ModelPath(model);
        var first = d.Network.Masses.FirstOrDefault() ?? new Mass("none", 1); // tune runs on line models only (Applies)
        // study varies the first mass, or in a model of rigid bodies only the first body's mass.
        var (varied, kilograms) = d.Network.Masses.IsEmpty && !d.Network.Bodies.IsEmpty
            ? ($"bodies.{d.Network.Bodies[0].Name}.mass", d.Network.Bodies[0].Kilograms)
            : ($"masses.{first.Name}.mass", first.Kilograms);
        string F(double v) => v.ToString("R", CultureInfo.InvariantCulture);
        string[] args = command switch
        {
            "modes" => ["modes", path, "--format", "json"],
            "harmonic" => ["harmonic", path, "--format", "json"],
            "transient" => ["transient", path, "--duration", "1 s", "--format", "json"],
            "check" => ["check", path, "--format", "json"],
            "tune" => ["tune", path, "--host", first.Name, "--mass-ratio", "5 %", "--format", "json"],
            "study" => ["study", path, "--vary", varied, "--from", F(0.8 * kilograms), "--to", F(1.2 * kilograms), "--steps", "3", "--format", "json"],
            "study-speed" => ["study", path, "--vary", "speed", "--from", "0", "--to", "1500 rpm", "--steps", "3", "--format", "json"],
            "report" => [],
            _ => throw new ArgumentOutOfRangeException(nameof(command), command, null),
        };
        if (command == "report") return Report(path);
        var o = Run(args);
        Assert.True(o.ExitCode is 0 or 1, o.ToString());
        return o.Stdout;
    }

    private static string Report(string path)
    {
        var folder = Path.Combine(Path.GetTempPath(), $"modalchain-schema-{Guid.NewGuid():N}");
        try
        {
            var o = Run("report", path, "-o", folder, "--format", "svg", "--modes", "2");
            Assert.True(o.ExitCode == 0, o.ToString());
            return File.ReadAllText(Path.Combine(folder, "results.json"));
        }
        finally
        {
            if (Directory.Exists(folder)) Directory.Delete(folder, recursive: true);
        }
    }
}
