using System.Globalization;
using System.Text.Json;

namespace ModalChain.Io.Json;

/// <summary>Number writing of the hand-written JSON writers (the circuit outputs; the commands' output records go through
/// <see cref="OutputJson"/>) and the one-line keyed objects of <see cref="Records.NumbersByName"/>: non-finite values become null, since JSON has no infinity.</summary>
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

    /// <summary>An object from names to numbers with the keys encoded once, e.g. a mode shape keyed by DOF label (the reference the one-line form is tested against).</summary>
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

    /// <summary>Keys made once for <see cref="KeyedLine"/>: each key's UTF-8 bytes with its quotes and the colon.</summary>
    public static byte[][] LineKeys(IReadOnlyList<JsonEncodedText> keys)
    {
        var result = new byte[keys.Count][];
        for (var i = 0; i < keys.Count; i++)
        {
            var encoded = keys[i].EncodedUtf8Bytes;
            var bytes = new byte[encoded.Length + 3];
            bytes[0] = (byte)'"';
            encoded.CopyTo(bytes.AsSpan(1));
            bytes[^2] = (byte)'"';
            bytes[^1] = (byte)':';
            result[i] = bytes;
        }
        return result;
    }

    /// <summary>Bytes enough for any <see cref="KeyedLine"/> object with these keys.</summary>
    public static int KeyedLineLength(byte[][] keys)
    {
        ArgumentNullException.ThrowIfNull(keys);
        long length = 2;
        foreach (var key in keys) length += key.Length + 1 + LongestNumber;
        return checked((int)length);
    }

    // The longest shortest-round-trip double is 24 characters ("-2.2250738585072014E-308"); "null" is 4.
    private const int LongestNumber = 32;

    /// <summary>
    /// As <see cref="Keyed(Utf8JsonWriter, string, JsonEncodedText[], ReadOnlySpan{double})"/>, the object written as a
    /// value on one line without spaces: a mode shape of thousands of masses is one line of the file, not thousands, and
    /// it is formatted straight into bytes. Numbers are the writer's own (shortest round-trip, invariant); non-finite ones null.
    /// </summary>
    /// <param name="writer">The writer, positioned where the value goes (after its property name).</param>
    /// <param name="keys">From <see cref="LineKeys"/>.</param>
    /// <param name="values">One per key.</param>
    /// <param name="buffer">Scratch bytes, at least <see cref="KeyedLineLength"/> long.</param>
    public static void KeyedLine(this Utf8JsonWriter writer, byte[][] keys, ReadOnlySpan<double> values, Span<byte> buffer)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(keys);
        if (values.Length != keys.Length) throw new ArgumentException($"{values.Length} values for {keys.Length} keys", nameof(values));
        var at = 0;
        buffer[at++] = (byte)'{';
        for (var i = 0; i < keys.Length; i++)
        {
            if (i > 0) buffer[at++] = (byte)',';
            var key = keys[i];
            key.CopyTo(buffer[at..]);
            at += key.Length;
            if (double.IsFinite(values[i]))
            {
                values[i].TryFormat(buffer[at..], out var written, default, CultureInfo.InvariantCulture);
                at += written;
            }
            else
            {
                "null"u8.CopyTo(buffer[at..]);
                at += 4;
            }
        }
        buffer[at++] = (byte)'}';
        writer.WriteRawValue(buffer[..at], skipInputValidation: true);
    }
}
