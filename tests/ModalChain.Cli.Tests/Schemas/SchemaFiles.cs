using System.Globalization;
using System.Text.Json;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using Json.Schema;
using YamlDotNet.RepresentationModel;

namespace ModalChain.Cli.Tests.Schemas;

/// <summary>The published JSON Schemas in docs/schema/, loaded once each, and the checks the schema tests share.</summary>
internal static partial class SchemaFiles
{
    public static string Folder => Path.Combine(CliRun.RepositoryRoot, "docs", "schema");

    // Every schema file, built once into one registry of its own (not the library's global one), each at its file's
    // address, so that a reference to a sibling file ("modes.schema.json") resolves as it does in an editor.
    private static readonly Lazy<IReadOnlyDictionary<string, JsonSchema>> All = new(() =>
    {
        var options = new BuildOptions { SchemaRegistry = new SchemaRegistry() };
        return Directory.GetFiles(Folder, "*.schema.json").ToDictionary(
            f => Path.GetFileName(f),
            f => JsonSchema.FromText(File.ReadAllText(f), options, new Uri(Path.GetFullPath(f))),
            StringComparer.Ordinal);
    });

    /// <summary>The schema in docs/schema/<paramref name="file"/>.</summary>
    public static JsonSchema Get(string file) => All.Value[file];

    /// <summary>The schema file's own JSON, to read what it declares.</summary>
    public static JsonDocument Document(string file) => JsonDocument.Parse(File.ReadAllText(Path.Combine(Folder, file)));

    /// <summary>Null when <paramref name="instance"/> is valid, else every failing location and message.</summary>
    public static string? Problems(string file, JsonElement instance)
    {
        var result = Get(file).Evaluate(instance, new EvaluationOptions { OutputFormat = OutputFormat.List });
        if (result.IsValid) return null;
        var lines = (result.Details ?? [])
            .Where(d => d.Errors is { Count: > 0 })
            .SelectMany(d => d.Errors!.Select(e => $"{d.InstanceLocation} ({d.EvaluationPath}): {e.Key}: {e.Value}"));
        return string.Join("\n", lines.Take(20));
    }

    /// <summary>Asserts <paramref name="json"/> is valid against docs/schema/<paramref name="file"/>.</summary>
    public static void AssertValid(string file, string json, string what)
    {
        using var document = JsonDocument.Parse(json);
        var problems = Problems(file, document.RootElement);
        Assert.True(problems is null, $"{what} does not match {file}:\n{problems}");
    }

    /// <summary>A YAML document as JSON, the way an editor's YAML support sees it: plain scalars that read as numbers,
    /// booleans or null become those; every other scalar is a string.</summary>
    public static JsonElement YamlToJson(string yaml)
    {
        var stream = new YamlStream();
        stream.Load(new StringReader(yaml));
        var node = Convert(stream.Documents[0].RootNode);
        return JsonSerializer.SerializeToElement(node);
    }

    private static JsonNode? Convert(YamlNode node) => node switch
    {
        YamlMappingNode m => new JsonObject(m.Children.Select(kv =>
            KeyValuePair.Create(((YamlScalarNode)kv.Key).Value ?? "", Convert(kv.Value)))),
        YamlSequenceNode s => new JsonArray([.. s.Children.Select(Convert)]),
        YamlScalarNode s => Scalar(s),
        _ => throw new InvalidOperationException($"unexpected YAML node {node.GetType().Name}"),
    };

    private static JsonNode? Scalar(YamlScalarNode s)
    {
        var text = s.Value ?? "";
        if (s.Style != YamlDotNet.Core.ScalarStyle.Plain) return JsonValue.Create(text);
        if (text is "" or "~" or "null" or "Null" or "NULL") return null;
        if (text is "true" or "True" or "TRUE") return JsonValue.Create(true);
        if (text is "false" or "False" or "FALSE") return JsonValue.Create(false);
        if (PlainNumber().IsMatch(text)) return JsonValue.Create(double.Parse(text, CultureInfo.InvariantCulture));
        return JsonValue.Create(text);
    }

    [GeneratedRegex(@"^[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?$")]
    private static partial Regex PlainNumber();
}
