using System.Text;
using ModalChain.Io.Json;
using ModalChain.Io.Json.Records;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests.Schemas;

/// <summary>The output schemas in docs/schema/ are the ones derived from the output records (Io/Json/Records), and every
/// output of those records reads back into its record and writes the same bytes again.</summary>
/// <remarks>
/// Regenerate the schema files after changing a record:
/// <c>MODALCHAIN_WRITE_SCHEMAS=1 dotnet test tests/ModalChain.Cli.Tests --filter "FullyQualifiedName~DerivedSchemaTests"</c>.
/// </remarks>
public class DerivedSchemaTests
{
    private const string Regenerate =
        "MODALCHAIN_WRITE_SCHEMAS=1 dotnet test tests/ModalChain.Cli.Tests --filter \"FullyQualifiedName~DerivedSchemaTests\"";

    /// <summary>The commands whose output is written from a record, and the record.</summary>
    private static readonly IReadOnlyDictionary<string, Type> RecordOf = new Dictionary<string, Type>(StringComparer.Ordinal)
    {
        ["modes"] = typeof(ModesOutput),
        ["tune"] = typeof(TuneOutput),
        ["check"] = typeof(CheckOutput),
        ["study"] = typeof(ParameterStudyOutput),
        ["study-speed"] = typeof(SpeedChartOutput),
        ["transient"] = typeof(TransientOutput),
        ["harmonic"] = typeof(HarmonicOutput),
    };

    public static TheoryData<string> SchemaFilesDerived() => [.. OutputJson.Schemas.Select(s => s.File)];

    [Theory]
    [MemberData(nameof(SchemaFilesDerived))]
    public void CommittedSchema_IsTheOneDerivedFromItsRecord(string file)
    {
        var schema = OutputJson.Schemas.Single(s => s.File == file);
        var derived = OutputJson.Schema(schema);
        var path = Path.Combine(SchemaFiles.Folder, file);
        if (Environment.GetEnvironmentVariable("MODALCHAIN_WRITE_SCHEMAS") == "1") File.WriteAllText(path, derived, new UTF8Encoding(false));
        var committed = File.ReadAllText(path);
        Assert.True(committed == derived,
            $"docs/schema/{file} is not the schema derived from {schema.Type.Name}; regenerate it with\n  {Regenerate}\nand commit the result.");
    }

    [Fact]
    public void EveryCommandWrittenFromARecord_HasItsSchemaDerived()
    {
        foreach (var (command, type) in RecordOf)
            Assert.Contains(OutputJson.Schemas, s => s.File == OutputSchemaTests.SchemaOf[command]
                && (s.Definitions.IsDefaultOrEmpty ? s.Type == type : s.Definitions.Any(d => d.Type == type)));
    }

    public static TheoryData<string, string> Runs()
    {
        var data = new TheoryData<string, string>();
        foreach (var model in ModelNames())
            foreach (var command in RecordOf.Keys)
                data.Add(model, command);
        return data;
    }

    /// <summary>Identity: reading an output into its record loses nothing the output says (fields, order, nulls, numbers).</summary>
    [Theory]
    [MemberData(nameof(Runs))]
    public void EveryOutput_ReadIntoItsRecordAndWrittenAgain_IsTheSameBytes(string model, string command)
    {
        if (OutputSchemaTests.Output(model, command) is not { } json) return; // the command does not apply to this model
        json = json.TrimEnd('\n');
        var again = Encoding.UTF8.GetString(OutputJson.Rewrite(RecordOf[command], Encoding.UTF8.GetBytes(json)));
        Assert.Equal(json, again);
    }
}
