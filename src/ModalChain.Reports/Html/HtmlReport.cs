using System.Collections.Immutable;
using System.Globalization;
using System.Text;
using ModalChain.Core;
using ModalChain.Io.Text;
using ModalChain.Reports.Pdf;
using ModalChain.Reports.Sections;
using ModalChain.Reports.Units;

namespace ModalChain.Reports.Html;

/// <summary>The frame of report.html: head with inline CSS, traceability block, caution, contents and the numbered sections.</summary>
/// <remarks>No script, no external resource: the file opens offline and prints the same anywhere.</remarks>
internal static class HtmlReport
{
    public static string Render(ReportContext context, IReadOnlyList<IReportSection> sections) => Render(context, sections, out _);

    /// <summary>Renders report.html and returns the same content as blocks in <paramref name="blocks"/> (for report.pdf), each section written once.</summary>
    public static string Render(ReportContext context, IReadOnlyList<IReportSection> sections, out ReportDocument blocks)
    {
        var document = context.Document;
        var title = document.Network.Title;
        var circuit = document.Circuit is not null;
        var generated = Generated(context);
        var e = (Func<string, string>)HtmlWriter.Encode;
        var html = new StringBuilder();
        html.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
        html.Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n");
        html.Append("<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; style-src 'unsafe-inline'; img-src data:\">\n");
        html.Append($"<meta name=\"generator\" content=\"ModalChain {e(context.Options.ToolVersion)}\">\n");
        html.Append($"<title>{e((circuit ? "Circuit report: " : "Vibration report: ") + title)}</title>\n<style>\n").Append(Css).Append("</style>\n</head>\n<body>\n");

        html.Append($"<header class=\"report-header\">\n<div class=\"kicker\">ModalChain {(circuit ? "circuit" : "vibration")} report</div>\n");
        html.Append($"<h1>{e(title)}</h1>\n");
        var traceFacts = Trace(context);
        var trace = new HtmlWriter().Facts(traceFacts, "facts trace");
        html.Append(trace).Append("</header>\n");
        html.Append($"<aside class=\"caution\" role=\"note\"><strong>Caution.</strong> {e(Cautions.Text)}</aside>\n");

        html.Append("<nav class=\"contents\"><h2>Contents</h2><ol>\n");
        foreach (var s in sections) html.Append($"<li><a href=\"#{e(s.Key)}\">{e(s.Title)}</a></li>\n");
        html.Append("</ol></nav>\n");

        var number = 0;
        var bodies = ImmutableArray.CreateBuilder<DocumentSection>();
        foreach (var s in sections)
        {
            number++;
            var body = new HtmlWriter();
            s.WriteHtml(body);
            html.Append($"<section id=\"{e(s.Key)}\" class=\"report-section\">\n<h2><span class=\"number\">{number}</span> {e(s.Title)}</h2>\n");
            html.Append(body).Append("</section>\n");
            bodies.Add(new DocumentSection(number, s.Key, MarkupText.Clean(s.Title), body.Blocks));
        }

        html.Append("<footer class=\"report-footer\">\n");
        html.Append($"<p><strong>Caution.</strong> {e(Cautions.Text)}</p>\n");
        var traceLine = $"{Path.GetFileName(document.File)} · SHA-256 {document.Sha256} · ModalChain {context.Options.ToolVersion} · {generated}";
        html.Append($"<p class=\"trace-line\">{e(Path.GetFileName(document.File))} · SHA-256 {e(document.Sha256)} · ModalChain {e(context.Options.ToolVersion)} · {e(generated)}</p>\n");
        html.Append("</footer>\n</body>\n</html>\n");
        blocks = new ReportDocument(MarkupText.Clean(title), [.. traceFacts.Select(f => (MarkupText.Clean(f.Key), MarkupText.Clean(f.Value)))], bodies.ToImmutable(), MarkupText.Clean(traceLine));
        return html.ToString();
    }

    private static string Generated(ReportContext context) =>
        context.Options.Generated.ToUniversalTime().ToString("yyyy-MM-dd HH:mm 'UTC'", CultureInfo.InvariantCulture);

    /// <summary>The traceability facts under the title: model file, its SHA-256, tool, date and the units shown.</summary>
    private static (string Key, string Value)[] Trace(ReportContext context) =>
    [
        ("Model file", Path.GetFileName(context.Document.File)),
        ("SHA-256 of the model file", context.Document.Sha256),
        ("Tool", "ModalChain " + context.Options.ToolVersion),
        ("Generated", Generated(context)),
        ("Units shown", context.Document.Circuit is null ? UnitsShown(context.Units) : CircuitUnitsShown),
    ];

    // Print layout: the page box is left to the print dialogue (A4 or Letter) and content is sized for the smaller of the
    // two printable areas (A4 width 210 mm, Letter height 279 mm, minus the margins below), so either paper works.
    private const string Css = """
        :root { --ink: #1a1a1a; --muted: #555; --rule: #c8c8c8; --accent: #0072B2; --warn: #D55E00; }
        * { box-sizing: border-box; }
        html { font-family: 'DejaVu Sans', 'Liberation Sans', Arial, sans-serif; font-size: 10.5pt; color: var(--ink); background: #f4f4f2; }
        body { max-width: 186mm; margin: 0 auto; padding: 12mm 10mm 16mm; background: #fff; line-height: 1.42; }
        h1 { font-size: 19pt; margin: 0.1em 0 0.4em; font-weight: bold; }
        h2 { font-size: 13.5pt; margin: 1.6em 0 0.5em; padding-bottom: 0.2em; border-bottom: 1.5px solid var(--ink); break-after: avoid; }
        h2 .number { display: inline-block; min-width: 1.6em; color: var(--accent); }
        h3 { font-size: 11pt; margin: 1.2em 0 0.4em; break-after: avoid; }
        p { margin: 0.4em 0 0.7em; }
        .kicker { text-transform: uppercase; letter-spacing: 0.08em; font-size: 8.5pt; color: var(--muted); }
        .report-header { border-bottom: 3px double var(--ink); padding-bottom: 0.6em; }
        table { border-collapse: collapse; margin: 0.6em 0 1em; width: 100%; font-size: 9pt; break-inside: auto; }
        caption { text-align: left; font-weight: bold; padding: 0 0 0.3em; font-size: 9.5pt; }
        th, td { border-bottom: 1px solid var(--rule); padding: 0.22em 0.5em; text-align: left; vertical-align: top; }
        thead th { border-bottom: 1.5px solid var(--ink); font-weight: bold; background: #f2f2f2; }
        tr { break-inside: avoid; }
        .num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
        table.facts { width: auto; min-width: 60%; }
        table.facts th { font-weight: normal; color: var(--muted); padding-right: 1.5em; white-space: nowrap; }
        table.trace td { font-family: 'DejaVu Sans Mono', 'Liberation Mono', monospace; font-size: 8.5pt; word-break: break-all; }
        .caution { border: 1.5px solid var(--warn); border-left-width: 6px; padding: 0.6em 0.9em; margin: 1em 0; background: #fdf3ec; font-size: 9.5pt; break-inside: avoid; }
        .contents ol { margin: 0.2em 0 0; padding-left: 1.6em; columns: 2; }
        .contents h2 { font-size: 11pt; border: 0; margin: 1em 0 0.2em; }
        .contents a { color: var(--ink); text-decoration: none; }
        figure { margin: 1em 0 1.4em; break-inside: avoid; page-break-inside: avoid; }
        .figure-body svg { display: block; width: 100%; height: auto; max-height: 225mm; border: 1px solid var(--rule); }
        figcaption { font-size: 9pt; color: var(--muted); margin-top: 0.35em; }
        figcaption .file { font-family: 'DejaVu Sans Mono', 'Liberation Mono', monospace; font-size: 8pt; color: #777; margin-left: 0.4em; }
        .mode-figure { display: grid; grid-template-columns: 1fr 27%; gap: 0 3mm; align-items: start; }
        .mode-figure .figure-body { grid-column: 1; }
        .mode-figure figcaption { grid-column: 1 / span 2; }
        .mode-figure:not(:has(.animation)) .figure-body { grid-column: 1 / span 2; }
        .animation { grid-column: 2; }
        .animation svg { display: block; width: 100%; height: auto; border: 1px dashed var(--rule); }
        .animation-label { font-size: 7.5pt; color: var(--muted); text-transform: uppercase; letter-spacing: 0.05em; margin-bottom: 0.2em; }
        .quality, .note { font-size: 9pt; color: var(--muted); }
        ul.warnings { color: var(--warn); font-size: 9pt; }
        .verdict { font-weight: bold; padding: 0.3em 0.6em; border-left: 5px solid; }
        .verdict.pass { border-color: #009E73; }
        .verdict.fail { border-color: var(--warn); color: var(--warn); }
        .report-footer { margin-top: 2em; border-top: 1.5px solid var(--ink); padding-top: 0.5em; font-size: 8.5pt; color: var(--muted); }
        .trace-line { font-family: 'DejaVu Sans Mono', 'Liberation Mono', monospace; font-size: 7.5pt; word-break: break-all; }
        @media (prefers-reduced-motion: reduce) { .animation { display: none; } }
        @page { margin: 14mm 12mm 16mm; }
        @media print {
          html { background: #fff; font-size: 10pt; }
          body { max-width: none; padding: 0; }
          .animation { display: none; }
          .mode-figure { display: block; }
          .figure-body svg { border: 0; max-height: 200mm; }
          a { color: inherit; text-decoration: none; }
          h2 { break-before: auto; }
          section#modes h3 { break-before: page; }
        }

        """;

    private const string CircuitUnitsShown = "SI with the usual prefixes (voltage V, current A, resistance and impedance Ω, inductance H, capacitance F, time s, frequency Hz); results.json in SI without prefixes";

    private static string UnitsShown(DisplayUnits u) =>
        (u.System == UnitSystem.Imperial ? "US customary" : "SI") +
        $" (mass {u.MassSymbol}, stiffness {u.StiffnessSymbol}, damping {u.DampingSymbol}, displacement {u.Displacement.Symbol}, velocity {u.Velocity.Symbol}, " +
        $"acceleration {u.Acceleration.Symbol}, force {u.Force.Symbol}); results.json in SI";
}
