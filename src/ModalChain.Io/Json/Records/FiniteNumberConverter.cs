using System.Text.Json;
using System.Text.Json.Serialization;

namespace ModalChain.Io.Json.Records;

/// <summary>Writes every double of an output record: finite values as the shortest invariant text that reads back to the
/// same double, non-finite ones as null (JSON has no infinity; the record carries a <c>*_note</c> beside such a value).</summary>
/// <remarks>Reading takes null back as NaN, so that an output read into its record writes the same bytes again.</remarks>
public sealed class FiniteNumberConverter : JsonConverter<double>
{
    /// <inheritdoc />
    public override bool HandleNull => true;

    /// <inheritdoc />
    public override double Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options) =>
        reader.TokenType == JsonTokenType.Null ? double.NaN : reader.GetDouble();

    /// <inheritdoc />
    public override void Write(Utf8JsonWriter writer, double value, JsonSerializerOptions options)
    {
        ArgumentNullException.ThrowIfNull(writer);
        if (double.IsFinite(value)) writer.WriteNumberValue(value);
        else writer.WriteNullValue();
    }
}
