using System.Collections.Immutable;
using ModalChain.Reports.Figures;

namespace ModalChain.Reports.Pdf;

/// <summary>Something placed on a page of report.pdf, in points from the page's top-left corner.</summary>
public abstract record PdfItem
{
    /// <summary>Left edge in points.</summary>
    public abstract float Left { get; }

    /// <summary>Right edge in points (for text: the start plus its measured width).</summary>
    public abstract float Right { get; }
}

/// <summary>A single line of text; <paramref name="Baseline"/> is the y of its baseline, <paramref name="Width"/> its measured advance in points.</summary>
public sealed record PdfText(float X, float Baseline, float Width, string Text, float Size, bool Bold, string Color) : PdfItem
{
    /// <inheritdoc />
    public override float Left => X;

    /// <inheritdoc />
    public override float Right => X + Width;
}

/// <summary>A straight line.</summary>
public sealed record PdfLine(float X1, float Y1, float X2, float Y2, float Width, string Color) : PdfItem
{
    /// <inheritdoc />
    public override float Left => Math.Min(X1, X2);

    /// <inheritdoc />
    public override float Right => Math.Max(X1, X2);
}

/// <summary>A rectangle, filled and/or stroked.</summary>
public sealed record PdfBox(float X, float Y, float Width, float Height, string? Fill, string? Stroke, float StrokeWidth = 1) : PdfItem
{
    /// <inheritdoc />
    public override float Left => X;

    /// <inheritdoc />
    public override float Right => X + Width;
}

/// <summary>A figure drawn as vectors with its top-left corner at (<paramref name="X"/>, <paramref name="Y"/>), its user units scaled by <paramref name="Scale"/> points each.</summary>
public sealed record PdfFigure(ReportFigure Figure, float X, float Y, float Width, float Height, float Scale) : PdfItem
{
    /// <inheritdoc />
    public override float Left => X;

    /// <inheritdoc />
    public override float Right => X + Width;
}

/// <summary>One laid-out page: its number (from 1) and what is placed on it, in painting order.</summary>
public sealed record PdfPage(int Number, ImmutableArray<PdfItem> Items);

/// <summary>A table as laid out: where it starts, the column widths chosen and the font size used (shrunk when the table is wide).</summary>
/// <param name="Caption">The table's caption, or null.</param>
/// <param name="Page">Page of its first row.</param>
/// <param name="ColumnWidths">Width of each column in points, cell padding included.</param>
/// <param name="FontSize">Font size of its cells in points.</param>
public sealed record PdfTableLayout(string? Caption, int Page, ImmutableArray<float> ColumnWidths, float FontSize)
{
    /// <summary>Total width in points.</summary>
    public float Width => ColumnWidths.Sum();
}

/// <summary>report.pdf laid out: the pages, where each section starts and how each table was fitted.</summary>
public sealed record PdfLayoutResult(ImmutableArray<PdfPage> Pages, ImmutableDictionary<string, int> SectionPages, ImmutableArray<PdfTableLayout> Tables);
