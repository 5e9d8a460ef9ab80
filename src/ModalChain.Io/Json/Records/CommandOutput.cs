using System.ComponentModel;
using System.Text.Json.Serialization;

namespace ModalChain.Io.Json.Records;

/// <summary>The fields every command's output record shares, declared once: it opens with <c>title</c>,
/// <c>format_version</c> and <c>source</c> and closes with <c>caution</c>, the derived record's own fields in between.</summary>
/// <remarks>
/// The order is fixed with <see cref="JsonPropertyOrderAttribute"/> so that a derived record's fields (order 0, in
/// declaration order) come between the opening three and the caution. <see cref="HarmonicOutput"/> derives from the
/// sweep fields it shares with each load case instead, so it declares the same four itself with the same orders.
/// </remarks>
public abstract record CommandOutput
{
    /// <summary>The order of <see cref="Caution"/>: after every field of a derived record.</summary>
    internal const int Last = 1000;

    [Description(Describe.Title), JsonPropertyOrder(-3)]
    public required string Title { get; init; }

    [Description(Describe.FormatVersion), SchemaConst(JsonFormat.Version), JsonPropertyOrder(-2)]
    public required string FormatVersion { get; init; }

    [Description("The model file this result comes from."), JsonPropertyOrder(-1)]
    public required SourceOutput Source { get; init; }

    [Description(Describe.Caution), JsonPropertyOrder(Last)]
    public required string Caution { get; init; }
}
