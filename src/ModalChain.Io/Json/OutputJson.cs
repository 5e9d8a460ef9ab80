using System.ComponentModel;
using System.Reflection;
using System.Text.Encodings.Web;
using System.Text.Json;
using System.Text.Json.Nodes;
using System.Text.Json.Schema;
using System.Text.Json.Serialization;
using System.Text.Json.Serialization.Metadata;
using ModalChain.Io.Json.Records;

namespace ModalChain.Io.Json;

/// <summary>The one serializer of the output records (Records/*Output.cs) and the schemas derived from the same types.</summary>
/// <remarks>
/// Rules every output shares, set once here: snake_case field names from the property names (or
/// <see cref="JsonPropertyNameAttribute"/>), fields in declaration order, indented, strings with the relaxed escaping;
/// a null property is left out unless it is marked <c>[JsonIgnore(Condition = JsonIgnoreCondition.Never)]</c>; doubles
/// through <see cref="FiniteNumberConverter"/> (non-finite → null). A property declared <c>required</c> is required in
/// the schema; every object forbids undeclared fields.
/// </remarks>
public static class OutputJson
{
    private static readonly JsonSerializerOptions Options = CreateOptions();

    /// <summary>Every output schema file in docs/schema/ derived from the records: its title and its record, or for a file
    /// that describes several outputs, one record per definition in <c>$defs</c> (the file then says which in its
    /// description).</summary>
    public static IReadOnlyList<OutputSchemaFile> Schemas { get; } =
    [
        new("modes.schema.json", "modalchain modes --format json", typeof(ModesOutput)),
        new("tune.schema.json", "modalchain tune --format json", typeof(TuneOutput)),
        new("check.schema.json", "modalchain check --format json", typeof(CheckOutput)),
        new("harmonic.schema.json", "modalchain harmonic --format json", typeof(HarmonicOutput)),
        new("transient.schema.json", "modalchain transient --format json", typeof(TransientOutput)),
        new("study.schema.json", "modalchain study --format json", typeof(ParameterStudyOutput))
        {
            Description = "A parameter study (--vary PATH: frequencies, mode tracking and criteria per value) or a speed-frequency chart (--vary speed).",
            Definitions = [("parameter", typeof(ParameterStudyOutput)), ("speed", typeof(SpeedChartOutput))],
        },
    ];

    /// <summary>Writes <paramref name="value"/> to <paramref name="stream"/> as one JSON document.</summary>
    public static void Write<T>(Stream stream, T value) where T : class =>
        JsonSerializer.Serialize(stream, value, TypeInfo<T>());

    /// <summary>Writes <paramref name="value"/> as the next value of <paramref name="writer"/> (a document embedded in another).</summary>
    public static void Write<T>(Utf8JsonWriter writer, T value) where T : class =>
        JsonSerializer.Serialize(writer, value, TypeInfo<T>());

    /// <summary>Reads one output back into its record (round-trip tests; a reader of the outputs).</summary>
    /// <exception cref="JsonException">The JSON is not a document of this record.</exception>
    public static T Read<T>(ReadOnlySpan<byte> json) where T : class =>
        JsonSerializer.Deserialize(json, TypeInfo<T>()) ?? throw new JsonException($"null is not a {typeof(T).Name}");

    /// <summary>Reads one output back into the record of <paramref name="type"/> and writes it again.</summary>
    public static byte[] Rewrite(Type type, ReadOnlySpan<byte> json)
    {
        var info = Options.GetTypeInfo(type);
        var value = JsonSerializer.Deserialize(json, info);
        return JsonSerializer.SerializeToUtf8Bytes(value, info);
    }

    /// <summary>The text of <paramref name="file"/>'s schema (JSON Schema draft 2020-12), as committed in docs/schema/.</summary>
    public static string Schema(OutputSchemaFile file)
    {
        ArgumentNullException.ThrowIfNull(file);
        JsonObject schema;
        if (file.Definitions.IsDefaultOrEmpty) schema = Schema(file.Type);
        else
        {
            // One output of several: each is a definition, and the document is exactly one of them.
            schema = new JsonObject
            {
                ["description"] = file.Description,
                ["oneOf"] = new JsonArray([.. file.Definitions.Select(d => (JsonNode)new JsonObject { ["$ref"] = "#/$defs/" + d.Name })]),
                ["required"] = new JsonArray("format_version"),
                ["properties"] = new JsonObject { ["format_version"] = Schema(file.Type)["properties"]!["format_version"]!.DeepClone() },
                ["$defs"] = new JsonObject(file.Definitions.Select(d => KeyValuePair.Create(d.Name, (JsonNode?)Schema(d.Type)))),
            };
        }
        schema.Insert(0, "$schema", "https://json-schema.org/draft/2020-12/schema");
        schema.Insert(1, "title", file.Title);
        return schema.ToJsonString(new JsonSerializerOptions { WriteIndented = true, Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping }) + "\n";
    }

    /// <summary>The schema of one output record.</summary>
    private static JsonObject Schema(Type type)
    {
        var exporter = new JsonSchemaExporterOptions { TreatNullObliviousAsNonNullable = true, TransformSchemaNode = Transform };
        return Options.GetTypeInfo(type).GetJsonSchemaAsNode(exporter).AsObject();
    }

    private static JsonTypeInfo<T> TypeInfo<T>() => (JsonTypeInfo<T>)Options.GetTypeInfo(typeof(T));

    private static JsonSerializerOptions CreateOptions()
    {
        var options = new JsonSerializerOptions(OutputJsonContext.Default.Options) { Encoder = JsonFormat.Encoder };
        options.MakeReadOnly();
        return options;
    }

    // Adds what the exporter cannot know from the types alone: descriptions, const and enum values, numbers that may be
    // null (non-finite), and fields that are left out rather than written as null.
    private static JsonNode Transform(JsonSchemaExporterContext context, JsonNode schema)
    {
        var node = schema as JsonObject ?? [];
        var property = context.PropertyInfo;
        var attributes = property?.AttributeProvider;
        var type = context.TypeInfo.Type;
        if (type == typeof(double) || type == typeof(double?))
            node = new JsonObject { ["type"] = new JsonArray("number", "null") };
        // Written by its own converter, which the exporter cannot see into: an object of numbers keyed by name.
        else if (type == typeof(NumbersByName))
            node = new JsonObject { ["type"] = "object", ["additionalProperties"] = new JsonObject { ["type"] = new JsonArray("number", "null") } };
        else if (property is { IsRequired: false } && node["type"] is JsonArray types)
        {
            // An optional field is left out when null, so where it appears it has a value.
            var kept = types.Select(t => t!.GetValue<string>()).Where(t => t != "null").ToArray();
            node["type"] = kept.Length == 1 ? kept[0] : new JsonArray([.. kept.Select(k => (JsonNode)k)]);
        }
        // The exporter leaves out the items of an array of doubles and the values of an object of doubles (their
        // converter is not one it knows).
        if (context.TypeInfo is { Kind: JsonTypeInfoKind.Enumerable, ElementType: { } element } && !node.ContainsKey("items")
            && (element == typeof(double) || element == typeof(double?)))
            node["items"] = new JsonObject { ["type"] = new JsonArray("number", "null") };
        if (context.TypeInfo is { Kind: JsonTypeInfoKind.Dictionary, ElementType: { } value } && !node.ContainsKey("additionalProperties")
            && (value == typeof(double) || value == typeof(double?)))
            node["additionalProperties"] = new JsonObject { ["type"] = new JsonArray("number", "null") };
        // A list of nullable strings (IReadOnlyList<string?>): the exporter cannot see the item's annotation.
        if (attributes is PropertyInfo member && node["items"] is JsonObject { } items && items["type"] is JsonValue
            && new NullabilityInfoContext().Create(member).GenericTypeArguments is [{ ReadState: NullabilityState.Nullable }])
            items["type"] = new JsonArray(items["type"]!.GetValue<string>(), "null");
        if (Attribute<SchemaConstAttribute>(attributes) is { } constant)
            node = new JsonObject { ["const"] = constant.Value };
        if (Attribute<SchemaEnumAttribute>(attributes) is { } allowed)
        {
            var nullable = node["type"] is JsonArray t && t.Any(x => x!.GetValue<string>() == "null");
            node.Remove("type");
            node["enum"] = new JsonArray([.. allowed.Values.Select(v => (JsonNode)v), .. nullable ? new JsonNode?[] { null } : []]);
        }
        var description = Attribute<DescriptionAttribute>(attributes)?.Description
            ?? (property is null ? context.TypeInfo.Type.GetCustomAttribute<DescriptionAttribute>()?.Description : null);
        if (description is not null)
        {
            node.Remove("description");
            node.Insert(0, "description", description);
        }
        return node;
    }

    private static T? Attribute<T>(ICustomAttributeProvider? provider) where T : Attribute =>
        provider?.GetCustomAttributes(typeof(T), inherit: false).OfType<T>().FirstOrDefault();
}

/// <summary>Source-generated metadata of the output records; options as in <see cref="OutputJson"/>.</summary>
[JsonSourceGenerationOptions(
    WriteIndented = true,
    PropertyNamingPolicy = JsonKnownNamingPolicy.SnakeCaseLower,
    DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
    UnmappedMemberHandling = JsonUnmappedMemberHandling.Disallow,
    RespectNullableAnnotations = true,
    Converters = [typeof(FiniteNumberConverter)])]
[JsonSerializable(typeof(ModesOutput))]
[JsonSerializable(typeof(TuneOutput))]
[JsonSerializable(typeof(CheckOutput))]
[JsonSerializable(typeof(ParameterStudyOutput))]
[JsonSerializable(typeof(SpeedChartOutput))]
[JsonSerializable(typeof(TransientOutput))]
[JsonSerializable(typeof(HarmonicOutput))]
internal sealed partial class OutputJsonContext : JsonSerializerContext;

/// <summary>One schema file of <see cref="OutputJson.Schemas"/>.</summary>
/// <param name="File">The file's name in docs/schema/.</param>
/// <param name="Title">The schema's title.</param>
/// <param name="Type">The output record; with <see cref="Definitions"/>, the one whose format_version the file states.</param>
public sealed record OutputSchemaFile(string File, string Title, Type Type)
{
    /// <summary>The file's description when it has <see cref="Definitions"/>; else the record's [Description].</summary>
    public string? Description { get; init; }

    /// <summary>For a file describing several outputs: each definition's name in <c>$defs</c> and its record.</summary>
    public System.Collections.Immutable.ImmutableArray<(string Name, Type Type)> Definitions { get; init; } = [];
}
