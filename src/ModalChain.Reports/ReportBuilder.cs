using System.Collections.Immutable;
using System.Globalization;
using System.Text.Json;
using ModalChain.Core;
using ModalChain.Io.Json;
using ModalChain.Io.Model;
using ModalChain.Io.Text;
using ModalChain.Reports.Html;
using ModalChain.Reports.Sections;
using ModalChain.Reports.Units;

namespace ModalChain.Reports;

/// <summary>Runs every section that applies to a model and assembles report.html and results.json in memory.</summary>
public static class ReportBuilder
{
    /// <summary>Builds the report of <paramref name="document"/>; nothing is written to disk.</summary>
    /// <param name="document">The model as read.</param>
    /// <param name="options">Run options (version, date, units, mode count).</param>
    /// <param name="sections">Section factories in order; when null, <see cref="ReportSections.For"/> the document (the circuit sections for a circuit model).</param>
    /// <exception cref="NumericalFailureException">An analysis failed; no report exists.</exception>
    public static Report Build(ModelDocument document, ReportOptions options, IReadOnlyList<ReportSectionFactory>? sections = null)
    {
        ArgumentNullException.ThrowIfNull(document);
        ArgumentNullException.ThrowIfNull(options);
        var context = new ReportContext(document, options);
        var present = (sections ?? ReportSections.For(document)).Select(f => f(context)).OfType<IReportSection>().ToImmutableArray();
        var figures = present.SelectMany(s => s.Figures).ToImmutableArray();
        var duplicate = figures.GroupBy(f => f.Name).FirstOrDefault(g => g.Count() > 1);
        if (duplicate is not null) throw new InvalidOperationException($"Two figures are named '{duplicate.Key}'; figure names must be unique in a report.");

        var html = HtmlReport.Render(context, present, out var blocks);
        var json = Json(context, present, figures.Select(f => f.Name));
        return new Report(html, json, present, figures) { Document = blocks };
    }

    private static ImmutableArray<byte> Json(ReportContext context, ImmutableArray<IReportSection> sections, IEnumerable<string> figures)
    {
        using var buffer = new MemoryStream();
        using (var json = new Utf8JsonWriter(buffer, ModesJson.WriterOptions))
        {
            json.WriteStartObject();
            json.WriteString("format_version", JsonFormat.Version);
            json.WriteStartObject("report");
            json.WriteString("tool_version", context.Options.ToolVersion);
            json.WriteString("generated_utc", context.Options.Generated.ToUniversalTime().ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture));
            json.WriteStartObject("source");
            json.WriteString("file", MarkupText.Clean(Path.GetFileName(context.Document.File)));
            json.WriteString("sha256", context.Document.Sha256);
            json.WriteEndObject();
            json.WriteString("display_units", context.Units.System == UnitSystem.Imperial ? "imperial" : "si");
            json.WriteString("units", context.Document.Circuit is null ? "SI throughout this file (kg, N/m, N*s/m, m, s, Hz)" : "SI throughout this file (V, A, ohm, H, F, s, Hz)");
            json.WriteStartArray("sections");
            foreach (var s in sections) json.WriteStringValue(s.Key);
            json.WriteEndArray();
            json.WriteStartArray("figures");
            foreach (var f in figures) json.WriteStringValue(f);
            json.WriteEndArray();
            json.WriteString("caution", Cautions.Text);
            json.WriteEndObject();
            foreach (var s in sections)
            {
                json.WritePropertyName(s.Key);
                s.WriteJson(json);
            }
            json.WriteEndObject();
        }
        return [.. buffer.ToArray()];
    }
}
