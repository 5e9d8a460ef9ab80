using System.Collections.Immutable;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Sections;

namespace ModalChain.Reports;

/// <summary>A report assembled in memory: the HTML, the numbers and the figures, ready to be written by <see cref="Writing.ReportWriter"/>.</summary>
/// <param name="Html">The self-contained report.html.</param>
/// <param name="Json">results.json as UTF-8 bytes.</param>
/// <param name="Sections">The sections present, in order.</param>
/// <param name="Figures">Every figure of every section, in order; names are unique.</param>
public sealed record Report(string Html, ImmutableArray<byte> Json, ImmutableArray<IReportSection> Sections, ImmutableArray<ReportFigure> Figures)
{
    /// <summary>The same content as blocks, laid out as report.pdf; null for a report assembled without it (report.pdf is then not written).</summary>
    public Pdf.ReportDocument? Document { get; init; }
}
