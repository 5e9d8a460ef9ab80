using System.Buffers;
using System.Collections.Immutable;
using System.Text.Json;
using System.Text.Json.Serialization;

namespace ModalChain.Io.Json.Records;

/// <summary>Numbers keyed by name, written as one JSON object on one line: a mode shape by mass or DOF label, energy
/// shares by DOF or spring.</summary>
/// <remarks>A large model writes thousands of these numbers per mode; the names are encoded once per output
/// (<see cref="NameKeys"/>) and the object is formatted straight into bytes by <see cref="NumbersByNameConverter"/>.</remarks>
[JsonConverter(typeof(NumbersByNameConverter))]
public sealed class NumbersByName
{
    /// <summary>One number per name.</summary>
    /// <exception cref="ArgumentException">The counts differ.</exception>
    public NumbersByName(NameKeys keys, ImmutableArray<double> values)
    {
        ArgumentNullException.ThrowIfNull(keys);
        if (values.Length != keys.Names.Length)
            throw new ArgumentException($"{values.Length} values for {keys.Names.Length} names", nameof(values));
        Keys = keys;
        Values = values;
    }

    /// <summary>The names, in the order written.</summary>
    public NameKeys Keys { get; }

    /// <summary>The number of each name (non-finite ones are written as null).</summary>
    public ImmutableArray<double> Values { get; }
}

/// <summary>The names of a <see cref="NumbersByName"/>, encoded once for every object that shares them.</summary>
public sealed class NameKeys
{
    private NameKeys(ImmutableArray<string> names, byte[][] line)
    {
        Names = names;
        Line = line;
    }

    /// <summary>The names, in the order written.</summary>
    public ImmutableArray<string> Names { get; }

    /// <summary>Each name as written before its number: UTF-8, escaped as every output escapes, quoted, with the colon.</summary>
    internal byte[][] Line { get; }

    /// <summary>The keys of <paramref name="names"/>.</summary>
    public static NameKeys Of(IEnumerable<string> names)
    {
        ImmutableArray<string> all = [.. names];
        return new(all, JsonNumbers.LineKeys([.. all.Select(n => JsonEncodedText.Encode(n, JsonFormat.Encoder))]));
    }
}

/// <summary>Writes a <see cref="NumbersByName"/> as one line (<see cref="JsonNumbers.KeyedLine"/>) and reads it back.</summary>
public sealed class NumbersByNameConverter : JsonConverter<NumbersByName>
{
    /// <inheritdoc />
    public override NumbersByName Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options)
    {
        if (reader.TokenType != JsonTokenType.StartObject) throw new JsonException($"expected an object of numbers, found {reader.TokenType}");
        var names = new List<string>();
        var values = ImmutableArray.CreateBuilder<double>();
        while (reader.Read() && reader.TokenType == JsonTokenType.PropertyName)
        {
            names.Add(reader.GetString()!);
            reader.Read();
            values.Add(reader.TokenType == JsonTokenType.Null ? double.NaN : reader.GetDouble());
        }
        if (reader.TokenType != JsonTokenType.EndObject) throw new JsonException($"expected a name or the object's end, found {reader.TokenType}");
        return new(NameKeys.Of(names), values.ToImmutable());
    }

    /// <inheritdoc />
    public override void Write(Utf8JsonWriter writer, NumbersByName value, JsonSerializerOptions options)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(value);
        var keys = value.Keys.Line;
        var buffer = ArrayPool<byte>.Shared.Rent(JsonNumbers.KeyedLineLength(keys));
        try
        {
            writer.KeyedLine(keys, value.Values.AsSpan(), buffer);
        }
        finally
        {
            ArrayPool<byte>.Shared.Return(buffer);
        }
    }
}
