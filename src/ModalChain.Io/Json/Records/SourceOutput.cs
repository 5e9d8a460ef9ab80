using System.ComponentModel;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Io.Json.Records;

/// <summary>The "source" object of every output: where the result comes from.</summary>
[Description("The model file this result comes from.")]
public sealed record SourceOutput
{
    [Description("The model file's path as given.")]
    public required string File { get; init; }

    [Description("SHA-256 of the model file's bytes (hex).")]
    public required string Sha256 { get; init; }

    [Description("ModalChain version that wrote this.")]
    public required string ToolVersion { get; init; }

    /// <summary>The source object of a model read from a file.</summary>
    public static SourceOutput Of(ModelDocument document, string toolVersion)
    {
        ArgumentNullException.ThrowIfNull(document);
        return new() { File = MarkupText.Clean(document.File), Sha256 = document.Sha256, ToolVersion = toolVersion };
    }
}

/// <summary>Descriptions shared by several records' properties, so that the same field reads the same in every schema.</summary>
internal static class Describe
{
    public const string Title = "The model's title.";
    public const string FormatVersion = "Version of this JSON layout (ModalChain.Io.Json.JsonFormat.Version); fields are added, never renamed, within a version.";
    public const string Caution = "The caution every output carries.";
    public const string Note = "Why the number beside it is null.";
    public const string Hz = "In Hz.";
    public const string Mode = "1-based mode number.";
    public const string Passes = "Whether the criterion is met.";
    public const string Reserve = "Reserve as a fraction; null when it has no finite value (see reserve_note).";
}
