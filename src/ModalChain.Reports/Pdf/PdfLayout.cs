using System.Collections.Immutable;
using System.Globalization;
using ModalChain.Core;
using ModalChain.Reports.Drawing;
using SkiaSharp;

namespace ModalChain.Reports.Pdf;

/// <summary>Lays a <see cref="ReportDocument"/> out on A4 portrait pages: text wrapped to the margins, tables fitted to the width, figures scaled to fit.</summary>
/// <remarks>
/// A table row, a figure with its caption and a heading with the start of what follows are never split across pages; a
/// table continued on a new page repeats its header row. A table wider than the page first wraps its cells at word
/// boundaries, then shrinks its font down to <see cref="MinTableFontSize"/>, and only then breaks words, so every table
/// fits between the margins.
/// </remarks>
public sealed class PdfLayout : IDisposable
{
    /// <summary>A4 width in points (210 mm).</summary>
    public const float PageWidth = 595.28f;

    /// <summary>A4 height in points (297 mm).</summary>
    public const float PageHeight = 841.89f;

    /// <summary>Left and right margin in points (17 mm).</summary>
    public const float Margin = 48f;

    /// <summary>Top margin in points.</summary>
    public const float TopMargin = 48f;

    /// <summary>Lowest y content may reach; the running footer sits below it.</summary>
    public const float ContentBottom = PageHeight - 62f;

    /// <summary>Width between the margins in points.</summary>
    public const float ContentWidth = PageWidth - 2 * Margin;

    /// <summary>Font size of table cells in points, before shrinking.</summary>
    public const float TableFontSize = 8f;

    /// <summary>Smallest font size a wide table is shrunk to, in points.</summary>
    public const float MinTableFontSize = 6f;

    /// <summary>Points per user unit of a figure (96 units per inch, 72 points per inch).</summary>
    public const float PointsPerUnit = 72f / 96f;

    private const string Ink = "#1A1A1A";
    private const string Muted = "#555555";
    private const string Rule = "#C8C8C8";
    private const string Accent = "#0072B2";
    private const string Warn = "#D55E00";
    private const string Pass = "#009E73";
    private const float BodySize = 9.5f;
    private const float NoteSize = 8.5f;
    private const float CellPadding = 3f;

    private readonly SKTypeface _regular;
    private readonly SKTypeface _bold;
    private readonly SKPaint _measure = new() { IsAntialias = true };
    private readonly List<PdfPage> _pages = [];
    private readonly List<PdfTableLayout> _tables = [];
    private readonly Dictionary<string, int> _sectionPages = new(StringComparer.Ordinal);
    private List<PdfItem> _items = [];
    private float _y;

    /// <summary>Creates a layout engine with the report's fixed font family.</summary>
    public PdfLayout()
    {
        _regular = SKTypeface.FromFamilyName(Scene.FontFamily) ?? SKTypeface.Default;
        _bold = SKTypeface.FromFamilyName(Scene.FontFamily, SKFontStyle.Bold) ?? _regular;
    }

    /// <summary>The regular typeface used to measure and draw text.</summary>
    internal SKTypeface Regular => _regular;

    /// <summary>The bold typeface used to measure and draw text.</summary>
    internal SKTypeface Bold => _bold;

    /// <summary>Lays out <paramref name="document"/>; the contents list shows the page of each section.</summary>
    public static PdfLayoutResult LayOut(ReportDocument document)
    {
        ArgumentNullException.ThrowIfNull(document);
        using var layout = new PdfLayout();
        return layout.Run(document);
    }

    /// <summary>Lays out <paramref name="document"/> with this engine's fonts.</summary>
    internal PdfLayoutResult Run(ReportDocument document)
    {
        // The contents list's height does not depend on the page numbers it shows, so a second pass only fills them in.
        var first = Pass1(document, ImmutableDictionary<string, int>.Empty);
        return Pass1(document, first.SectionPages);
    }

    /// <summary>Width of <paramref name="text"/> in points at <paramref name="size"/>.</summary>
    public float Measure(string text, float size, bool bold = false)
    {
        _measure.Typeface = bold ? _bold : _regular;
        _measure.TextSize = size;
        return _measure.MeasureText(text);
    }

    /// <summary>Breaks <paramref name="text"/> into lines no wider than <paramref name="width"/>: at spaces, and inside a word only when the word alone is wider.</summary>
    public IReadOnlyList<string> Wrap(string text, float width, float size, bool bold = false)
    {
        var lines = new List<string>();
        foreach (var paragraph in text.Split('\n'))
        {
            var line = "";
            foreach (var word in paragraph.Split(' ', StringSplitOptions.RemoveEmptyEntries))
            {
                var candidate = line.Length == 0 ? word : line + " " + word;
                if (Measure(candidate, size, bold) <= width)
                {
                    line = candidate;
                    continue;
                }
                if (line.Length > 0) lines.Add(line);
                line = word;
                while (line.Length > 1 && Measure(line, size, bold) > width)
                {
                    var fit = LongestPrefix(line, width, size, bold);
                    lines.Add(line[..fit]);
                    line = line[fit..];
                }
            }
            lines.Add(line);
        }
        return lines;
    }

    /// <inheritdoc />
    public void Dispose()
    {
        _measure.Dispose();
        if (!ReferenceEquals(_bold, _regular)) _bold.Dispose();
        _regular.Dispose();
    }

    private PdfLayoutResult Pass1(ReportDocument document, ImmutableDictionary<string, int> sectionPages)
    {
        _pages.Clear();
        _tables.Clear();
        _sectionPages.Clear();
        _items = [];
        _y = TopMargin;

        Header(document, sectionPages);
        foreach (var section in document.Sections)
        {
            KeepSpace(90);
            if (_y > TopMargin) _y += 10;
            _sectionPages[section.Key] = _pages.Count + 1;
            var number = section.Number.ToString(CultureInfo.InvariantCulture);
            Text(Margin, _y + 13, number, 13, true, Accent);
            Lines(section.Title, Margin + 24, ContentWidth - 24, 13, true, Ink, 16);
            _y += 3;
            _items.Add(new PdfLine(Margin, _y, Margin + ContentWidth, _y, 1.1f, Ink));
            _y += 8;
            foreach (var block in section.Blocks) Block(block);
        }

        // The closing block (rule, caution, trace) stays on one page, so the caution is on the last page: its height is
        // measured from the wrapped lines, not guessed (a long trace line used to push itself alone onto a new page).
        var closingCaution = Wrap("Caution. " + Cautions.Text, ContentWidth, NoteSize).Count * NoteSize * 1.35f;
        var closingTrace = Wrap(document.TraceLine, ContentWidth, 7).Count * 9f;
        KeepSpace(12 + 6 + closingCaution + 4 + closingTrace);
        _y += 12;
        _items.Add(new PdfLine(Margin, _y, Margin + ContentWidth, _y, 1.1f, Ink));
        _y += 6;
        Lines("Caution. " + Cautions.Text, Margin, ContentWidth, NoteSize, false, Muted, NoteSize * 1.35f);
        _y += 4;
        Lines(document.TraceLine, Margin, ContentWidth, 7, false, Muted, 9);
        _pages.Add(new PdfPage(_pages.Count + 1, [.. _items]));
        return new PdfLayoutResult([.. _pages], _sectionPages.ToImmutableDictionary(StringComparer.Ordinal), [.. _tables]);
    }

    private void Header(ReportDocument document, ImmutableDictionary<string, int> sectionPages)
    {
        Text(Margin, _y + 8, "MODALCHAIN VIBRATION REPORT", 8, false, Muted);
        _y += 14;
        Lines(document.Title, Margin, ContentWidth, 18, true, Ink, 22);
        _y += 4;
        Facts(document.Trace, 8);
        _y += 2;
        _items.Add(new PdfLine(Margin, _y, Margin + ContentWidth, _y, 0.8f, Ink));
        _items.Add(new PdfLine(Margin, _y + 2.5f, Margin + ContentWidth, _y + 2.5f, 0.8f, Ink));
        _y += 12;

        // The caution, boxed as on the HTML page.
        var caution = Wrap("Caution. " + Cautions.Text, ContentWidth - 20, 9);
        var boxHeight = caution.Count * 12f + 10;
        _items.Add(new PdfBox(Margin, _y, ContentWidth, boxHeight, "#FDF3EC", Warn, 1.2f));
        _items.Add(new PdfBox(Margin, _y, 4, boxHeight, Warn, null));
        var y = _y + 5;
        foreach (var line in caution) Text(Margin + 12, (y += 12) - 3, line, 9, false, Ink);
        _y += boxHeight + 14;

        Text(Margin, _y + 11, "Contents", 11, true, Ink);
        _y += 17;
        foreach (var section in document.Sections)
        {
            var label = $"{section.Number.ToString(CultureInfo.InvariantCulture)}  {section.Title}";
            var page = sectionPages.TryGetValue(section.Key, out var p) ? p.ToString(CultureInfo.InvariantCulture) : "";
            var pageWidth = Measure(page, BodySize);
            Text(Margin + 8, _y + BodySize, Fit(label, ContentWidth - 60, BodySize), BodySize, false, Ink);
            Text(Margin + ContentWidth - pageWidth, _y + BodySize, page, BodySize, false, Ink);
            _y += BodySize * 1.5f;
        }
        _y += 6;
    }

    private void Block(Block block)
    {
        switch (block)
        {
            case HeadingBlock h:
                KeepSpace(70);
                _y += 8;
                Lines(h.Text, Margin, ContentWidth, 11, true, Ink, 14);
                _y += 4;
                break;
            case ParagraphBlock p:
                Paragraph(p);
                break;
            case ListBlock l:
                var listColor = l.Style == "warnings" ? Warn : Ink;
                var listSize = l.Style == "warnings" ? NoteSize : BodySize;
                foreach (var item in l.Items)
                {
                    var lines = Wrap(item, ContentWidth - 14, listSize);
                    KeepSpace(listSize * 1.35f);
                    Text(Margin + 3, _y + listSize, "•", listSize, false, listColor);
                    foreach (var line in lines)
                    {
                        KeepSpace(listSize * 1.35f);
                        Text(Margin + 14, _y + listSize, line, listSize, false, listColor);
                        _y += listSize * 1.35f;
                    }
                }
                _y += 6;
                break;
            case TableBlock t:
                Table(t);
                break;
            case FactsBlock f:
                Facts(f.Facts, BodySize - 0.5f);
                _y += 6;
                break;
            case FigureBlock f:
                Figure(f);
                break;
        }
    }

    private void Paragraph(ParagraphBlock p)
    {
        var style = p.Style ?? "";
        var note = style is "note" or "quality";
        var verdict = style.StartsWith("verdict", StringComparison.Ordinal);
        var fail = style.Contains("fail", StringComparison.Ordinal);
        var size = note ? NoteSize : BodySize;
        var color = note ? Muted : verdict && fail ? Warn : Ink;
        var indent = verdict ? 10f : 0f;
        var lines = Wrap(p.Text, ContentWidth - indent, size, verdict);
        var lead = size * 1.38f;
        _y += 2;
        var top = _y;
        foreach (var line in lines)
        {
            if (KeepSpace(lead)) top = _y;
            Text(Margin + indent, _y + size, line, size, verdict, color);
            _y += lead;
        }
        if (verdict) _items.Add(new PdfBox(Margin, top, 4, _y - top, fail ? Warn : Pass, null));
        _y += 5;
    }

    private void Facts(IReadOnlyList<(string Key, string Value)> facts, float size)
    {
        if (facts.Count == 0) return;
        var keyWidth = Math.Min(facts.Max(f => Measure(f.Key, size)) + 12, ContentWidth * 0.4f);
        var lead = size * 1.4f;
        foreach (var (key, value) in facts)
        {
            var keys = Wrap(key, keyWidth - 12, size);
            var values = Wrap(value, ContentWidth - keyWidth, size);
            var height = Math.Max(keys.Count, values.Count) * lead + 2;
            KeepSpace(height);
            for (var i = 0; i < keys.Count; i++) Text(Margin, _y + size + i * lead, keys[i], size, false, Muted);
            for (var i = 0; i < values.Count; i++) Text(Margin + keyWidth, _y + size + i * lead, values[i], size, false, Ink);
            _y += height;
            _items.Add(new PdfLine(Margin, _y, Margin + ContentWidth, _y, 0.5f, Rule));
            _y += 1;
        }
    }

    /// <summary>Chooses the column widths and font size of <paramref name="table"/> so it fits <see cref="ContentWidth"/>.</summary>
    /// <returns>The widths (cell padding included) and the font size.</returns>
    public (float[] Widths, float FontSize) FitTable(TableBlock table)
    {
        ArgumentNullException.ThrowIfNull(table);
        var columns = Math.Max(table.Headers.Length, table.Rows.IsEmpty ? 0 : table.Rows.Max(r => r.Length));
        if (columns == 0) return ([], TableFontSize);
        for (var size = TableFontSize; ; size -= 0.5f)
        {
            // Natural width: every cell on one line; least width: the longest word of the column (headers bold).
            var natural = new float[columns];
            var least = new float[columns];
            foreach (var (cells, bold) in table.Rows.Select(r => (r, false)).Prepend((table.Headers, true)))
                for (var c = 0; c < cells.Length; c++)
                {
                    natural[c] = Math.Max(natural[c], Measure(cells[c], size, bold) + 2 * CellPadding);
                    foreach (var word in cells[c].Split(' ', StringSplitOptions.RemoveEmptyEntries))
                        least[c] = Math.Max(least[c], Measure(word, size, bold) + 2 * CellPadding);
                }
            var naturalSum = natural.Sum();
            if (naturalSum <= ContentWidth)
            {
                // Spread the spare width evenly so the table spans the text width, as in the HTML.
                var spare = (ContentWidth - naturalSum) / columns;
                return ([.. natural.Select(w => w + spare)], size);
            }
            var leastSum = least.Sum();
            if (leastSum <= ContentWidth)
            {
                var extra = naturalSum - leastSum;
                var share = (ContentWidth - leastSum) / extra;
                return ([.. least.Select((w, c) => w + (natural[c] - w) * share)], size);
            }
            if (size - 0.5f < MinTableFontSize)
            {
                // Still too wide at the smallest font: scale the least widths to the page; long words then break inside.
                var scale = ContentWidth / leastSum;
                return ([.. least.Select(w => w * scale)], size);
            }
        }
    }

    private void Table(TableBlock table)
    {
        var (widths, size) = FitTable(table);
        if (widths.Length == 0) return;
        var lead = size * 1.3f;
        var headerLines = Cells(table.Headers, widths, size, true);
        var headerHeight = headerLines.Max(l => l.Count) * lead + 2 * CellPadding;
        var rows = table.Rows.Select(r => Cells(r, widths, size, false)).ToList();
        var rowHeights = rows.Select(r => (r.Count == 0 ? 1 : r.Max(l => l.Count)) * lead + 2 * CellPadding).ToList();
        var captionLines = table.Caption is null ? [] : Wrap(table.Caption, ContentWidth, BodySize - 0.5f, true);
        var captionHeight = captionLines.Count * (BodySize + 2) + (captionLines.Count > 0 ? 3 : 0);

        _y += 4;
        KeepSpace(captionHeight + headerHeight + (rowHeights.Count > 0 ? rowHeights[0] : 0));
        _tables.Add(new PdfTableLayout(table.Caption, _pages.Count + 1, [.. widths], size));
        foreach (var line in captionLines)
        {
            Text(Margin, _y + BodySize - 0.5f, line, BodySize - 0.5f, true, Ink);
            _y += BodySize + 2;
        }
        if (captionLines.Count > 0) _y += 3;
        HeaderRow(table, headerLines, widths, size, headerHeight);
        for (var r = 0; r < rows.Count; r++)
        {
            if (KeepSpace(rowHeights[r])) HeaderRow(table, headerLines, widths, size, headerHeight);
            Row(table, rows[r], widths, size, rowHeights[r], false, Ink);
            _items.Add(new PdfLine(Margin, _y, Margin + widths.Sum(), _y, 0.5f, Rule));
        }
        _y += 8;
    }

    private void HeaderRow(TableBlock table, List<IReadOnlyList<string>> lines, float[] widths, float size, float height)
    {
        _items.Add(new PdfBox(Margin, _y, widths.Sum(), height, "#F2F2F2", null));
        Row(table, lines, widths, size, height, true, Ink);
        _items.Add(new PdfLine(Margin, _y, Margin + widths.Sum(), _y, 1f, Ink));
    }

    private List<IReadOnlyList<string>> Cells(ImmutableArray<string> cells, float[] widths, float size, bool bold) =>
        [.. cells.Select((text, c) => c < widths.Length ? Wrap(text, widths[c] - 2 * CellPadding, size, bold) : (IReadOnlyList<string>)[])];

    private void Row(TableBlock table, List<IReadOnlyList<string>> cells, float[] widths, float size, float height, bool bold, string color)
    {
        var lead = size * 1.3f;
        var x = Margin;
        for (var c = 0; c < widths.Length; c++)
        {
            if (c < cells.Count)
                for (var i = 0; i < cells[c].Count; i++)
                {
                    var text = cells[c][i];
                    var width = Measure(text, size, bold);
                    var left = table.Numeric.Contains(c) ? x + widths[c] - CellPadding - width : x + CellPadding;
                    _items.Add(new PdfText(left, _y + CellPadding + size + i * lead - 1, width, text, size, bold, color));
                }
            x += widths[c];
        }
        _y += height;
    }

    private void Figure(FigureBlock block)
    {
        var figure = block.Figure;
        if (figure.Size is not { } size) return;
        var caption = Wrap($"{figure.Caption} File: {figure.Name}.svg", ContentWidth, NoteSize);
        var captionHeight = caption.Count * NoteSize * 1.35f + 4;
        var room = ContentBottom - TopMargin - captionHeight - 12;
        var scale = (float)Math.Min(Math.Min(ContentWidth / size.Width, room / size.Height), PointsPerUnit);
        var width = (float)size.Width * scale;
        var height = (float)size.Height * scale;
        _y += 6;
        KeepSpace(height + captionHeight);
        var x = Margin + (ContentWidth - width) / 2;
        _items.Add(new PdfFigure(figure, x, _y, width, height, scale));
        _items.Add(new PdfBox(x, _y, width, height, null, Rule, 0.5f));
        _y += height + 4;
        foreach (var line in caption)
        {
            Text(Margin, _y + NoteSize, line, NoteSize, false, Muted);
            _y += NoteSize * 1.35f;
        }
        _y += 8;
    }

    /// <summary>Starts a new page when <paramref name="height"/> points do not fit below the current position; true when it did.</summary>
    private bool KeepSpace(float height)
    {
        if (_y + height <= ContentBottom || _y <= TopMargin + 0.5f) return false;
        _pages.Add(new PdfPage(_pages.Count + 1, [.. _items]));
        _items = [];
        _y = TopMargin;
        return true;
    }

    private void Lines(string text, float x, float width, float size, bool bold, string color, float lead)
    {
        foreach (var line in Wrap(text, width, size, bold))
        {
            KeepSpace(lead);
            Text(x, _y + size, line, size, bold, color);
            _y += lead;
        }
    }

    private void Text(float x, float baseline, string text, float size, bool bold, string color)
    {
        if (text.Length == 0) return;
        _items.Add(new PdfText(x, baseline, Measure(text, size, bold), text, size, bold, color));
    }

    /// <summary><paramref name="text"/> shortened with an ellipsis to fit <paramref name="width"/>.</summary>
    internal string Fit(string text, float width, float size, bool bold = false)
    {
        if (Measure(text, size, bold) <= width) return text;
        var n = LongestPrefix(text, width - Measure("…", size, bold), size, bold);
        return text[..n] + "…";
    }

    /// <summary>Length of the longest prefix of <paramref name="text"/> (at least 1) no wider than <paramref name="width"/>, by bisection.</summary>
    /// <remarks>Only a prefix a line could hold is ever measured (a glyph is at least a tenth of the font size wide), so a
    /// hostile title of a million characters without a space costs a few short measurements per line.</remarks>
    private int LongestPrefix(string text, float width, float size, bool bold)
    {
        var low = 1;
        var high = (int)Math.Min(text.Length, Math.Max(1, 10 * width / size) + 1);
        while (low < high)
        {
            var mid = (low + high + 1) / 2;
            if (Measure(text[..mid], size, bold) <= width) low = mid;
            else high = mid - 1;
        }
        return low;
    }
}
