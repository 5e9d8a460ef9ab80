using System.Collections.Immutable;
using ModalChain.Reports.Figures;

namespace ModalChain.Reports.Pdf;

/// <summary>One block of a report section's body, as the section wrote it through <see cref="Html.HtmlWriter"/>: the same content laid out as HTML and as PDF pages.</summary>
/// <remarks>Texts are plain (not escaped); the PDF draws them as they are.</remarks>
public abstract record Block;

/// <summary>A sub-heading inside a section.</summary>
public sealed record HeadingBlock(string Text) : Block;

/// <summary>A paragraph; <paramref name="Style"/> is the HTML class ("note", "verdict pass", "verdict fail", "quality") or null.</summary>
public sealed record ParagraphBlock(string Text, string? Style) : Block;

/// <summary>A bulleted list; <paramref name="Style"/> is the HTML class ("warnings") or null.</summary>
public sealed record ListBlock(ImmutableArray<string> Items, string? Style) : Block;

/// <summary>A table with a header row; columns listed in <paramref name="Numeric"/> are right-aligned.</summary>
public sealed record TableBlock(string? Caption, ImmutableArray<string> Headers, ImmutableArray<ImmutableArray<string>> Rows, ImmutableHashSet<int> Numeric) : Block;

/// <summary>A two-column key-value table without a header row.</summary>
public sealed record FactsBlock(ImmutableArray<(string Key, string Value)> Facts) : Block;

/// <summary>A figure with its caption.</summary>
public sealed record FigureBlock(ReportFigure Figure) : Block;

/// <summary>One numbered section of the report with the blocks of its body.</summary>
public sealed record DocumentSection(int Number, string Key, string Title, ImmutableArray<Block> Blocks);

/// <summary>The whole report as blocks: what report.pdf lays out page by page, in the order of report.html.</summary>
/// <param name="Title">The model's title (cleaned of characters markup forbids).</param>
/// <param name="Trace">The traceability facts printed under the title (model file, SHA-256, tool, date, units).</param>
/// <param name="Sections">The numbered sections in order.</param>
/// <param name="TraceLine">One line naming the model file, its SHA-256, the tool and the date (end of the document).</param>
public sealed record ReportDocument(string Title, ImmutableArray<(string Key, string Value)> Trace, ImmutableArray<DocumentSection> Sections, string TraceLine);
