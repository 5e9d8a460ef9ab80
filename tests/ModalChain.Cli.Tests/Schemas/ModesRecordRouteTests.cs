using System.Text;
using System.Text.Json;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Io.Json;
using ModalChain.Io.Model;

namespace ModalChain.Cli.Tests.Schemas;

/// <summary>The <c>modes</c> JSON written through its output record (<c>ModesOutput</c>) is byte for byte the JSON of the
/// hand-written writer it replaces (<see cref="LegacyModesJson"/>), on every example model, the documentation's examples
/// and the accepted-input corpus, with every energy-share setting, and embedded in another object as a report embeds it.</summary>
/// <remarks>An identity check between two implementations of the same layout (common practice for a refactoring).</remarks>
public class ModesRecordRouteTests
{
    public static TheoryData<string> Files()
    {
        var root = CliRun.RepositoryRoot;
        string[] folders = ["models", Path.Combine("docs", "examples"), Path.Combine("tests", "ModalChain.Cli.Tests", "Corpus", "accepted")];
        var data = new TheoryData<string>();
        foreach (var folder in folders)
            foreach (var file in Directory.GetFiles(Path.Combine(root, folder), "*.yaml").Order(StringComparer.Ordinal))
                data.Add(Path.GetRelativePath(root, file));
        return data;
    }

    [Theory]
    [MemberData(nameof(Files))]
    public void RecordRoute_WritesTheBytesOfTheHandWrittenWriter(string file)
    {
        var read = ModelReader.ReadFile(Path.Combine(CliRun.RepositoryRoot, file));
        Assert.True(read.Succeeded, string.Join("\n", read.Diagnostics));
        var document = read.Model!;
        if (document.Circuit is not null) return; // circuits have their own writer (CircuitJson)
        // As the modes command builds them: the damped system from the same modes, complex roots where they apply.
        var result = ModalAnalysis.Solve(document.Network);
        var damped = DampedSystem.Build(document.Structure, result);
        var complex = (damped.IsClassical && !damped.HasFirstOrderStates) || damped.Partition.FreeCount > 2000 ? [] : ComplexModes.Solve(damped);
        foreach (var shares in new[] { ModesJson.DefaultEnergyShareModes, int.MaxValue, 0, 1 })
        {
            var legacy = Bytes(s => LegacyModesJson.Write(s, document, result, "9.9.9-test", damped, complex, shares));
            var record = Bytes(s => ModesJson.Write(s, document, result, "9.9.9-test", damped, complex, shares));
            AssertSame(legacy, record, $"{file}, energy shares for {shares} modes");
        }
        var undampedLegacy = Bytes(s => LegacyModesJson.Write(s, document, result, "t"));
        var undampedRecord = Bytes(s => ModesJson.Write(s, document, result, "t"));
        AssertSame(undampedLegacy, undampedRecord, $"{file}, no damped system");

        // Embedded as the modes section of a report's results.json: one level deeper, after another property.
        var embeddedLegacy = Bytes(s => Embedded(s, w =>
        {
            w.WriteStartObject();
            LegacyModesJson.WriteBody(w, document, result, "t", damped, complex);
            w.WriteEndObject();
        }));
        var embeddedRecord = Bytes(s => Embedded(s, w => ModesJson.Write(w, document, result, "t", damped, complex)));
        AssertSame(embeddedLegacy, embeddedRecord, $"{file}, embedded");
    }

    private static void Embedded(Stream stream, Action<Utf8JsonWriter> modes)
    {
        using var writer = new Utf8JsonWriter(stream, ModesJson.WriterOptions);
        writer.WriteStartObject();
        writer.WriteString("format_version", JsonFormat.Version);
        writer.WritePropertyName("modes");
        modes(writer);
        writer.WriteEndObject();
    }

    private static byte[] Bytes(Action<Stream> write)
    {
        using var stream = new MemoryStream();
        write(stream);
        return stream.ToArray();
    }

    private static void AssertSame(byte[] expected, byte[] actual, string what)
    {
        if (expected.AsSpan().SequenceEqual(actual)) return;
        var at = expected.AsSpan().CommonPrefixLength(actual);
        string Around(byte[] b) => Encoding.UTF8.GetString(b, Math.Max(0, at - 120), Math.Min(b.Length, at + 120) - Math.Max(0, at - 120));
        Assert.Fail($"{what}: the bytes differ from byte {at} of {expected.Length} (record route: {actual.Length}).\nexpected: …{Around(expected)}…\nactual:   …{Around(actual)}…");
    }
}
