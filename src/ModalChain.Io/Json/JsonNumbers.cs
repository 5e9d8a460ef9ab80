using System.Globalization;
using System.Text.Json;

namespace ModalChain.Io.Json;

/// <summary>Number writing of the hand-written JSON writer of <c>modes</c> (the other outputs go through <see cref="OutputJson"/>): non-finite values become null, since JSON has no infinity.</summary>
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

    /// <summary>
    /// As <see cref="Keyed(Utf8JsonWriter, string, JsonEncodedText[], ReadOnlySpan{double})"/>, the object written on one
    /// line without spaces: a mode shape of thousands of masses is one line of the file, not thousands, and it is
    /// formatted straight into bytes. Numbers are the writer's own (shortest round-trip, invariant); non-finite ones null.
    /// </summary>
    /// <param name="writer">The writer, positioned where the property goes.</param>
    /// <param name="name">The property name.</param>
    /// <param name="keys">From <see cref="LineKeys"/>.</param>
    /// <param name="values">One per key.</param>
    /// <param name="buffer">Scratch bytes, grown as needed and kept by the caller for the next object.</param>
    public static void KeyedLine(this Utf8JsonWriter writer, JsonEncodedText name, byte[][] keys, ReadOnlySpan<double> values, ref byte[] buffer)
    {
        var at = 0;
        Put(ref buffer, ref at, (byte)'{');
        for (var i = 0; i < keys.Length; i++)
        {
            if (i > 0) Put(ref buffer, ref at, (byte)',');
            var key = keys[i];
            Reserve(ref buffer, at, key.Length + 32);
            key.CopyTo(buffer.AsSpan(at));
            at += key.Length;
            if (double.IsFinite(values[i]))
            {
                values[i].TryFormat(buffer.AsSpan(at), out var written, default, CultureInfo.InvariantCulture);
                at += written;
            }
            else
            {
                "null"u8.CopyTo(buffer.AsSpan(at));
                at += 4;
            }
        }
        Put(ref buffer, ref at, (byte)'}');
        writer.WritePropertyName(name);
        writer.WriteRawValue(buffer.AsSpan(0, at), skipInputValidation: true);
    }

    private static void Put(ref byte[] buffer, ref int at, byte value)
    {
        Reserve(ref buffer, at, 1);
        buffer[at++] = value;
    }

    private static void Reserve(ref byte[] buffer, int at, int more)
    {
        if (at + more <= buffer.Length) return;
        System.Array.Resize(ref buffer, Math.Max(2 * buffer.Length, at + more));
    }
}
