using System.Text.Json;

namespace ModalChain.Io.Json;

/// <summary>Number writing shared by the JSON writers: non-finite values become null, since JSON has no infinity.</summary>
internal static class JsonNumbers
{
    public static void Number(this Utf8JsonWriter writer, string name, double value)
    {
        if (double.IsFinite(value)) writer.WriteNumber(name, value);
        else writer.WriteNull(name);
    }

    public static void Number(this Utf8JsonWriter writer, double value)
    {
        if (double.IsFinite(value)) writer.WriteNumberValue(value);
        else writer.WriteNullValue();
    }

    /// <summary>A sentence saying why the number before it is null; written only when there is one.</summary>
    public static void Note(this Utf8JsonWriter writer, string name, string? note)
    {
        if (note is not null) writer.WriteString(name, note);
    }

    public static void Array(this Utf8JsonWriter writer, string name, IEnumerable<double> values)
    {
        writer.WriteStartArray(name);
        foreach (var v in values)
        {
            writer.Number(v);
            // Long arrays (time histories, sweeps) go to the stream as they are written: without this the writer keeps
            // the whole document in its buffer, several times the recorded data at peak while the buffer doubles.
            if (writer.BytesPending > 1 << 16) writer.Flush();
        }
        writer.WriteEndArray();
    }

    /// <summary>An object from names to numbers, e.g. a mode shape keyed by mass name.</summary>
    public static void Keyed(this Utf8JsonWriter writer, string name, IReadOnlyList<string> keys, IReadOnlyList<double> values)
    {
        writer.WriteStartObject(name);
        for (var i = 0; i < keys.Count; i++) writer.Number(keys[i], values[i]);
        writer.WriteEndObject();
    }

    /// <summary>As <see cref="Keyed(Utf8JsonWriter, string, IReadOnlyList{string}, IReadOnlyList{double})"/> with the keys encoded once (large outputs).</summary>
    public static void Keyed(this Utf8JsonWriter writer, string name, JsonEncodedText[] keys, ReadOnlySpan<double> values)
    {
        writer.WriteStartObject(name);
        for (var i = 0; i < keys.Length; i++)
        {
            if (double.IsFinite(values[i])) writer.WriteNumber(keys[i], values[i]);
            else writer.WriteNull(keys[i]);
        }
        writer.WriteEndObject();
    }
}
