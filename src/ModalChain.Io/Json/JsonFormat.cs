using System.Text.Encodings.Web;

namespace ModalChain.Io.Json;

/// <summary>The version of every JSON output's layout, written as <c>format_version</c> at the top of each object, and
/// the escaping every output shares.</summary>
/// <remarks>
/// The layouts are published as JSON Schemas in docs/schema/ (one per command). Adding a field keeps the version and
/// goes into the schema in the same commit; renaming or removing one would need a new version, and is not done.
/// </remarks>
public static class JsonFormat
{
    /// <summary>The current layout version, a string so that it can never be read as a quantity.</summary>
    public const string Version = "1";

    /// <summary>How every output escapes strings: only what JSON requires, so that names and units stay readable (µ, ², ·).</summary>
    public static JavaScriptEncoder Encoder => JavaScriptEncoder.UnsafeRelaxedJsonEscaping;
}
