using System.Text.Json;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Io.Json;

/// <summary>The "source" object every JSON output carries, so a result can be traced back to its model file, and the format version.</summary>
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
