using System.Reflection;
using ModalChain.Io.Model;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests.Schemas;

/// <summary>docs/schema/model.schema.json accepts every example model, rejects models the reader rejects, and lists
/// exactly the reader's top-level keys.</summary>
public class ModelSchemaTests
{
    private const string Schema = "model.schema.json";

    [Theory]
    [MemberData(nameof(CliRun.Models), MemberType = typeof(CliRun))]
    public void EveryExampleModel_IsValidAgainstTheModelSchema(string model)
    {
        var json = SchemaFiles.YamlToJson(File.ReadAllText(ModelPath(model)));
        var problems = SchemaFiles.Problems(Schema, json);
        Assert.True(problems is null, $"{model} does not match {Schema}:\n{problems}");
    }

    [Fact]
    public void TheSchemasTopLevelKeys_AreTheReadersTopLevelKeys()
    {
        var field = typeof(ModelReader).GetField("TopLevelKeys", BindingFlags.NonPublic | BindingFlags.Static);
        Assert.NotNull(field);
        var readerKeys = (string[])field.GetValue(null)!;
        using var schema = SchemaFiles.Document(Schema);
        var schemaKeys = schema.RootElement.GetProperty("properties").EnumerateObject().Select(p => p.Name);
        Assert.Equal(readerKeys.Order(StringComparer.Ordinal), schemaKeys.Order(StringComparer.Ordinal));
        Assert.False(schema.RootElement.GetProperty("additionalProperties").GetBoolean());
    }

    private const string Good = """
        masses:
          deck: {mass: 3200 kg, at: [0, 0]}
          skid: 850 kg
        springs:
          columns: {between: [ground, deck], stiffness: 95 kN/mm}
          mounts: {between: [deck, skid], stiffness: 8400000}
        """;

    [Fact]
    public void ASmallModel_IsValid_ForTheSchemaAndTheReader()
    {
        Assert.True(ModelReader.Read(Good, "good.yaml").Succeeded);
        Assert.Null(SchemaFiles.Problems(Schema, SchemaFiles.YamlToJson(Good)));
    }

    // Each bad model is rejected by the reader as well, so the schema never flags what ModalChain accepts here.
    [Theory]
    [InlineData("an unknown top-level key", "sprngs:\n  a: {between: [ground, deck], stiffness: 1 kN/mm}\n")]
    [InlineData("a spring without its stiffness", "springs:\n  a: {between: [ground, deck]}\n")]
    [InlineData("a spring with one end", "springs:\n  a: {between: [deck], stiffness: 1 kN/mm}\n")]
    [InlineData("a stiffness that is not a number", "springs:\n  a: {between: [ground, deck], stiffness: stiff}\n")]
    [InlineData("a sweep of no points", "loads:\n  f: {kind: force, at: deck, amplitude: 1 kN}\nharmonic:\n  frequencies: {from: 1 Hz, to: 10 Hz, points: 0}\n")]
    [InlineData("an unknown load kind", "loads:\n  f: {kind: torque, at: deck, amplitude: 1 kN}\n")]
    [InlineData("a limit with both peak and rms", "criteria:\n  limits:\n    - {at: deck, quantity: velocity, peak: 4 mm/s, rms: 3 mm/s}\n")]
    [InlineData("an unknown harmonic method", "loads:\n  f: {kind: force, at: deck, amplitude: 1 kN}\nharmonic:\n  frequencies: [10 Hz]\n  method: fast\n")]
    [InlineData("machine zone D, which has no upper boundary", "criteria:\n  machine-zones:\n    - {at: deck, class: medium-rigid, zone: D}\n")]
    [InlineData("an unknown space", "space: 4d\n")]
    [InlineData("a body without a centre of mass", "space: 3d\nbodies:\n  skid: {mass: 1 kg, box: [1, 1, 1]}\n")]
    [InlineData("a body with two inertia forms", "space: 3d\nbodies:\n  skid: {mass: 1 kg, centre-of-mass: [0, 0, 0], box: [1, 1, 1], inertia: {xx: 1, yy: 1, zz: 1}}\n")]
    [InlineData("an unknown direction of a stiffness", "space: 3d\nsprings:\n  a: {between: [ground, deck], stiffness: {w: 1 kN/mm}}\n")]
    public void ABadModel_FailsTheSchema_AsItFailsTheReader(string what, string extra)
    {
        var text = "masses:\n  deck: {mass: 3200 kg}\n" + extra;
        Assert.False(ModelReader.Read(text, "bad.yaml").Succeeded, $"the reader accepted {what}");
        Assert.NotNull(SchemaFiles.Problems(Schema, SchemaFiles.YamlToJson(text)));
    }

    [Fact]
    public void AModelWithoutMasses_FailsTheSchema()
    {
        Assert.NotNull(SchemaFiles.Problems(Schema, SchemaFiles.YamlToJson("title: empty\n")));
    }
}
