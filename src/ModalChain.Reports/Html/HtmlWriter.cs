using System.Collections.Immutable;
using System.Net;
using System.Text;
using ModalChain.Io.Text;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Pdf;

namespace ModalChain.Reports.Html;

/// <summary>Builds the HTML of report sections; every text passes through <see cref="Encode"/>, so section code never writes raw markup from data.</summary>
/// <remarks>Each call also records its content as a <see cref="Block"/> (<see cref="Blocks"/>), so report.pdf lays out the
/// same content without a section writing it twice.</remarks>
public sealed class HtmlWriter
{
    private readonly StringBuilder _html = new();
    private readonly List<Block> _blocks = [];

    /// <summary>What was written so far, as blocks in order (plain texts, cleaned of characters XML 1.0 forbids).</summary>
    public ImmutableArray<Block> Blocks => [.. _blocks];

    /// <summary>Text escaped for HTML content and attribute values, with characters XML 1.0 forbids replaced (<see cref="MarkupText.Clean"/>).</summary>
    public static string Encode(string text) => WebUtility.HtmlEncode(MarkupText.Clean(text));

    /// <summary>A sub-heading inside a section.</summary>
    public HtmlWriter Heading(string text)
    {
        _html.Append("<h3>").Append(Encode(text)).Append("</h3>\n");
        _blocks.Add(new HeadingBlock(MarkupText.Clean(text)));
        return this;
    }

    /// <summary>A paragraph of plain text, optionally with a CSS class.</summary>
    public HtmlWriter Paragraph(string text, string? cssClass = null)
    {
        _html.Append(cssClass is null ? "<p>" : $"<p class=\"{Encode(cssClass)}\">").Append(Encode(text)).Append("</p>\n");
        _blocks.Add(new ParagraphBlock(MarkupText.Clean(text), cssClass));
        return this;
    }

    /// <summary>A bulleted list of plain-text items.</summary>
    public HtmlWriter List(IEnumerable<string> items, string? cssClass = null)
    {
        _html.Append(cssClass is null ? "<ul>" : $"<ul class=\"{Encode(cssClass)}\">");
        var list = ImmutableArray.CreateBuilder<string>();
        foreach (var item in items)
        {
            _html.Append("<li>").Append(Encode(item)).Append("</li>");
            list.Add(MarkupText.Clean(item));
        }
        _blocks.Add(new ListBlock(list.ToImmutable(), cssClass));
        _html.Append("</ul>\n");
        return this;
    }

    /// <summary>A table; columns whose header is in <paramref name="numeric"/> are right-aligned.</summary>
    /// <param name="caption">Table caption (plain text), or null.</param>
    /// <param name="headers">Column headers; put units in brackets, e.g. "Frequency (Hz)".</param>
    /// <param name="rows">Cell texts, one array per row.</param>
    /// <param name="numeric">Indexes of numeric columns.</param>
    /// <param name="cssClass">CSS class of the table.</param>
    public HtmlWriter Table(string? caption, IReadOnlyList<string> headers, IEnumerable<IReadOnlyList<string>> rows, IReadOnlySet<int>? numeric = null, string? cssClass = null)
    {
        numeric ??= new HashSet<int>();
        _html.Append(cssClass is null ? "<table>" : $"<table class=\"{Encode(cssClass)}\">");
        if (caption is not null) _html.Append("<caption>").Append(Encode(caption)).Append("</caption>");
        _html.Append("<thead><tr>");
        for (var i = 0; i < headers.Count; i++)
            _html.Append(numeric.Contains(i) ? "<th class=\"num\">" : "<th>").Append(Encode(headers[i])).Append("</th>");
        _html.Append("</tr></thead><tbody>\n");
        var cells = ImmutableArray.CreateBuilder<ImmutableArray<string>>();
        foreach (var row in rows)
        {
            _html.Append("<tr>");
            for (var i = 0; i < row.Count; i++)
                _html.Append(numeric.Contains(i) ? "<td class=\"num\">" : "<td>").Append(Encode(row[i])).Append("</td>");
            _html.Append("</tr>\n");
            cells.Add([.. row.Select(MarkupText.Clean)]);
        }
        _html.Append("</tbody></table>\n");
        _blocks.Add(new TableBlock(caption is null ? null : MarkupText.Clean(caption), [.. headers.Select(MarkupText.Clean)], cells.ToImmutable(), [.. numeric]));
        return this;
    }

    /// <summary>A key-value table (two columns, keys as row headers).</summary>
    public HtmlWriter Facts(IEnumerable<(string Key, string Value)> facts, string cssClass = "facts")
    {
        _html.Append($"<table class=\"{Encode(cssClass)}\"><tbody>\n");
        var pairs = ImmutableArray.CreateBuilder<(string, string)>();
        foreach (var (key, value) in facts)
        {
            _html.Append("<tr><th scope=\"row\">").Append(Encode(key)).Append("</th><td>").Append(Encode(value)).Append("</td></tr>\n");
            pairs.Add((MarkupText.Clean(key), MarkupText.Clean(value)));
        }
        _blocks.Add(new FactsBlock(pairs.ToImmutable()));
        _html.Append("</tbody></table>\n");
        return this;
    }

    /// <summary>A figure with its inline SVG, the animated view when it has one (screen only) and its caption.</summary>
    public HtmlWriter Figure(ReportFigure figure)
    {
        ArgumentNullException.ThrowIfNull(figure);
        _html.Append($"<figure class=\"figure {Encode(figure.Kind)}-figure\" id=\"fig-{Encode(figure.Name)}\" data-file=\"{Encode(figure.Name)}.svg\">\n");
        _html.Append("<div class=\"figure-body\">").Append(figure.Svg(standalone: false)).Append("</div>\n");
        if (figure.AnimatedSvg() is { } animated)
            _html.Append("<div class=\"animation\" aria-hidden=\"true\"><div class=\"animation-label\">Animated (screen only)</div>")
                .Append(animated).Append("</div>\n");
        _html.Append("<figcaption>").Append(Encode(figure.Caption))
            .Append($" <span class=\"file\">File: {Encode(figure.Name)}.svg</span></figcaption>\n</figure>\n");
        _blocks.Add(new FigureBlock(figure));
        return this;
    }

    /// <inheritdoc />
    public override string ToString() => _html.ToString();
}
