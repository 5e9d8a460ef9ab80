using System.Text;
using System.Text.Json;
using ModalChain.Io.Json;

namespace ModalChain.Io.Tests.Json;

/// <summary>The one-line keyed objects of the modes JSON write the same numbers, in the same text, as the writer's own keyed objects.</summary>
public class KeyedLineTests
{
    private static readonly double[] Values =
        [0.1, -0.0, 1e-300, double.Epsilon, double.MaxValue, 1.0 / 3, 1.2345678901234568e20, -7.5e-5, 42, double.NaN, double.PositiveInfinity];

    private static readonly string[] Names = [.. Values.Select((_, i) => i == 3 ? "bühne \"3\"" : $"m{i}")];

    private static string Write(bool line)
    {
        var keys = Names.Select(n => JsonEncodedText.Encode(n, ModesJson.WriterOptions.Encoder)).ToArray();
        using var stream = new MemoryStream();
        using (var writer = new Utf8JsonWriter(stream, ModesJson.WriterOptions))
        {
            writer.WriteStartObject();
            if (line)
            {
                var lineKeys = JsonNumbers.LineKeys(keys);
                writer.WritePropertyName("shape");
                writer.KeyedLine(lineKeys, Values, new byte[JsonNumbers.KeyedLineLength(lineKeys)]);
            }
            else writer.Keyed("shape", keys, Values);
            writer.WriteEndObject();
        }
        return Encoding.UTF8.GetString(stream.ToArray());
    }

    [Fact]
    public void Numbers_AndNames_AreThoseOfTheWritersKeyedObject()
    {
        // Identity: the same document model whatever the layout; every number round-trips to the same double.
        using var indented = JsonDocument.Parse(Write(line: false));
        using var oneLine = JsonDocument.Parse(Write(line: true));
        var expected = indented.RootElement.GetProperty("shape").EnumerateObject().ToArray();
        var actual = oneLine.RootElement.GetProperty("shape").EnumerateObject().ToArray();
        Assert.Equal(expected.Select(p => p.Name), actual.Select(p => p.Name));
        Assert.Equal(Names, actual.Select(p => p.Name));
        for (var i = 0; i < expected.Length; i++)
        {
            // The same text for each number (shortest round-trip, invariant culture), null for NaN and infinity.
            Assert.Equal(expected[i].Value.GetRawText(), actual[i].Value.GetRawText());
            if (double.IsFinite(Values[i])) Assert.Equal(Values[i], actual[i].Value.GetDouble());
            else Assert.Equal(JsonValueKind.Null, actual[i].Value.ValueKind);
        }
    }

    [Fact]
    public void TheObject_IsOneLine()
    {
        var text = Write(line: true);
        var shapeLine = text.Split('\n').Single(l => l.Contains("\"shape\"", StringComparison.Ordinal));
        Assert.EndsWith("}", shapeLine.TrimEnd(), StringComparison.Ordinal);
        Assert.Contains("\"m0\":0.1,", shapeLine, StringComparison.Ordinal);
    }
}
