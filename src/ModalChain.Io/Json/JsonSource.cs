using System.Text.Json;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Io.Json;

/// <summary>The "source" object every JSON output carries, so a result can be traced back to its model file.</summary>
internal static class JsonSource
{
    /// <summary>Writes <c>"source": {"file", "sha256", "tool_version"}</c>.</summary>
    public static void Source(this Utf8JsonWriter writer, ModelDocument document, string toolVersion)
    {
        writer.WriteStartObject("source");
        writer.WriteString("file", MarkupText.Clean(document.File));
        writer.WriteString("sha256", document.Sha256);
        writer.WriteString("tool_version", toolVersion);
        writer.WriteEndObject();
    }
}
