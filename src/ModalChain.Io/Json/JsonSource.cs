using System.Text.Json;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Io.Json;

/// <summary>The "source" object and the format version for the hand-written JSON writers (the circuit outputs), as
/// <see cref="Records.SourceOutput"/> and <see cref="Records.CommandOutput"/> write them for the output records.</summary>
internal static class JsonSource
{
    /// <summary>Writes <c>"format_version"</c> (<see cref="JsonFormat.Version"/>) and <c>"source": {"file", "sha256", "tool_version"}</c>.</summary>
    public static void Source(this Utf8JsonWriter writer, ModelDocument document, string toolVersion)
    {
        writer.WriteString("format_version", JsonFormat.Version);
        writer.WriteStartObject("source");
        writer.WriteString("file", MarkupText.Clean(document.File));
        writer.WriteString("sha256", document.Sha256);
        writer.WriteString("tool_version", toolVersion);
        writer.WriteEndObject();
    }
}
