using System.Collections.Immutable;
using System.Text;
using ModalChain.Core;
using ModalChain.Reports.Pdf;
using ModalChain.Reports.Sections;
using ModalChain.Reports.Writing;
using ModalChain.TestSupport;

namespace ModalChain.Reports.Tests.Pdf;

/// <summary>report.pdf: one A4 document of the whole report, every section in the HTML's order, tables and figures within the page.</summary>
public sealed class PdfReportTests
{
    private static readonly ReportOptions Options = new("test", new DateTimeOffset(2026, 12, 1, 12, 0, 0, TimeSpan.Zero));

    // Tolerance of the layout measurements: a hundredth of a point (rounding of float sums), far below anything visible.
    private const float Slack = 0.01f;

    public static IEnumerable<object[]> Models() => Repository.ModelFiles();

    private static byte[] Pdf(Report report)
    {
        using var buffer = new MemoryStream();
        PdfReport.Write(report.Document!, buffer);
        return buffer.ToArray();
    }

    [Theory]
    [MemberData(nameof(Models))]
    public void EveryExampleModel_GivesOnePdfWithEverySectionTheCautionAndPageNumbers_AllWithinThePage(string model)
    {
        var report = ReportBuilder.Build(Repository.Load(model), Options);
        var bytes = Pdf(report);
        var layout = PdfLayout.LayOut(report.Document!);

        Assert.Equal("%PDF-", Encoding.ASCII.GetString(bytes, 0, 5));
        var pages = PdfTextReader.Pages(bytes);
        Assert.Equal(layout.Pages.Length, pages.Count);
        // At least a page for the title and the model, at most a generous page per figure and per ten table rows.
        var figures = report.Figures.Length;
        var rows = report.Document!.Sections.SelectMany(s => s.Blocks).OfType<TableBlock>().Sum(t => t.Rows.Length + 3);
        Assert.InRange(pages.Count, 1, 2 + figures + rows / 10);

        var all = Squeeze(string.Concat(pages));
        foreach (var section in report.Sections) Assert.Contains(Squeeze(section.Title), all, StringComparison.Ordinal);
        Assert.Contains(Squeeze(Cautions.Text), Squeeze(pages[0]), StringComparison.Ordinal);
        Assert.Contains(Squeeze(Cautions.Text), Squeeze(pages[^1]), StringComparison.Ordinal);
        for (var p = 0; p < pages.Count; p++)
            Assert.Contains($"Page {p + 1} of {pages.Count}", pages[p], StringComparison.Ordinal);

        // Sections start on the pages the contents list gives, in the HTML's order.
        var starts = report.Sections.Select(s => layout.SectionPages[s.Key]).ToArray();
        Assert.Equal(starts.Order(), starts);
        foreach (var section in report.Sections)
            Assert.Contains(Squeeze(section.Title), Squeeze(pages[layout.SectionPages[section.Key] - 1]), StringComparison.Ordinal);

        // Everything within the margins; no figure crosses a page end; every table (the criteria tables too) fits the width.
        foreach (var page in layout.Pages)
            foreach (var item in page.Items)
            {
                Assert.True(item.Left >= PdfLayout.Margin - Slack, $"page {page.Number}: {item} starts left of the margin");
                Assert.True(item.Right <= PdfLayout.PageWidth - PdfLayout.Margin + Slack, $"page {page.Number}: {item} ends right of the margin");
                if (item is PdfText t) Assert.InRange(t.Baseline, PdfLayout.TopMargin, PdfLayout.ContentBottom + Slack);
                if (item is PdfFigure f) Assert.True(f.Y >= PdfLayout.TopMargin - Slack && f.Y + f.Height <= PdfLayout.ContentBottom + Slack, $"page {page.Number}: figure {f.Figure.Name} crosses the page end");
            }
        Assert.Equal(report.Figures.Count(f => f.Size is not null), layout.Pages.Sum(p => p.Items.OfType<PdfFigure>().Count()));
        foreach (var table in layout.Tables) Assert.True(table.Width <= PdfLayout.ContentWidth + Slack, $"table '{table.Caption}' is {table.Width} pt wide");
    }

    [Fact]
    public void CriteriaTables_OfTheLabFloorModel_FitThePageWidth()
    {
        var report = ReportBuilder.Build(Repository.Load(Path.Combine("models", "lab-floor-analyser.yaml")), Options);
        var layout = PdfLayout.LayOut(report.Document!);
        var criteria = report.Document!.Sections.Single(s => s.Key == "criteria").Blocks.OfType<TableBlock>().Select(t => t.Caption).ToHashSet();
        var tables = layout.Tables.Where(t => criteria.Contains(t.Caption)).ToList();
        Assert.NotEmpty(tables);
        foreach (var table in tables)
        {
            Assert.True(table.Width <= PdfLayout.ContentWidth + Slack, $"'{table.Caption}': {table.Width} pt > {PdfLayout.ContentWidth} pt");
            Assert.InRange(table.FontSize, PdfLayout.MinTableFontSize, PdfLayout.TableFontSize);
        }
    }

    [Fact]
    public void WideTable_IsFittedToThePage_AndEveryCellLineFitsItsColumn()
    {
        // Twelve columns of long headers and long numbers: far wider than A4 on one line per cell.
        var headers = Enumerable.Range(1, 12).Select(i => $"Zone boundary number {i} (mm/s r.m.s.)").ToImmutableArray();
        var rows = Enumerable.Range(0, 5).Select(r => Enumerable.Range(0, 12).Select(c => $"{r * 1000 + c}.123456789e-3 pump-skid-{c}").ToImmutableArray()).ToImmutableArray();
        var table = new TableBlock("A wide table", headers, rows, [0, 1, 2]);
        using var layout = new PdfLayout();

        var (widths, size) = layout.FitTable(table);

        Assert.Equal(12, widths.Length);
        Assert.True(widths.Sum() <= PdfLayout.ContentWidth + Slack, $"{widths.Sum()} pt > {PdfLayout.ContentWidth} pt");
        Assert.InRange(size, PdfLayout.MinTableFontSize, PdfLayout.TableFontSize);
        foreach (var cells in rows.Prepend(headers))
            for (var c = 0; c < cells.Length; c++)
                foreach (var line in layout.Wrap(cells[c], widths[c] - 6, size, bold: cells == headers))
                    Assert.True(layout.Measure(line, size, cells == headers) <= widths[c] - 6 + Slack, $"'{line}' overflows column {c}");
    }

    [Fact]
    public void NarrowTable_KeepsItsFontAndSpansTheTextWidth()
    {
        var table = new TableBlock(null, ["Name", "Mass (kg)"], [["deck", "3200"], ["skid", "850"]], [1]);
        using var layout = new PdfLayout();
        var (widths, size) = layout.FitTable(table);
        Assert.Equal(PdfLayout.TableFontSize, size);
        NumericAssert.Close(PdfLayout.ContentWidth, widths.Sum(), Tolerance.Abs(Slack), "table width (pt), as HTML's width: 100%");
    }

    [Fact]
    public void LongTable_ContinuesOnTheNextPageWithItsHeaderRepeated_NoRowSplit()
    {
        var rows = Enumerable.Range(1, 150).Select(i => ImmutableArray.Create($"mass-{i}", $"{i * 10}")).ToImmutableArray();
        var document = new ReportDocument("long table", [], [new DocumentSection(1, "t", "Table", [new TableBlock("Masses", ["Name of the mass", "Mass (kg)"], rows, [1])])], "trace");
        var layout = PdfLayout.LayOut(document);

        var pagesWithRows = layout.Pages.Where(p => p.Items.OfType<PdfText>().Any(t => t.Text.StartsWith("mass-", StringComparison.Ordinal))).ToList();
        Assert.True(pagesWithRows.Count >= 2, "150 rows fill more than one page");
        foreach (var page in pagesWithRows)
            Assert.Contains(page.Items.OfType<PdfText>(), t => t.Text == "Name of the mass");
        // Each row's name and mass share a page and a baseline: no row is split.
        foreach (var page in pagesWithRows)
            foreach (var name in page.Items.OfType<PdfText>().Where(t => t.Text.StartsWith("mass-", StringComparison.Ordinal)))
            {
                var value = (int.Parse(name.Text[5..], System.Globalization.CultureInfo.InvariantCulture) * 10).ToString(System.Globalization.CultureInfo.InvariantCulture);
                Assert.Contains(page.Items.OfType<PdfText>(), t => t.Text == value && Math.Abs(t.Baseline - name.Baseline) < Slack);
            }
        Assert.Equal(150, layout.Pages.Sum(p => p.Items.OfType<PdfText>().Count(t => t.Text.StartsWith("mass-", StringComparison.Ordinal))));
    }

    [Fact]
    public void ClosingCautionAndTrace_ShareTheLastPage_WhereverTheBodyEnds()
    {
        // The body grows one short paragraph at a time, so the closing block (rule, caution, trace) starts at every height
        // of a page in turn; it must never be split, and the caution must be on the last page (product rule: first and last).
        var trace = "Model file instrument-cabinet-sway.yaml · SHA-256 " + new string('c', 64) + " · ModalChain test · generated 2026-12-01 12:00 UTC · "
            + string.Concat(Enumerable.Repeat("long trace words ", 20));
        var firstCautionWord = "Caution.";
        for (var n = 0; n < 120; n++)
        {
            var blocks = Enumerable.Range(0, n).Select(i => (Block)new ParagraphBlock($"filler paragraph {i}", null)).ToImmutableArray();
            var document = new ReportDocument("closing block", [], [new DocumentSection(1, "t", "Body", blocks)], trace);
            var layout = PdfLayout.LayOut(document);
            var texts = layout.Pages.SelectMany((p, i) => p.Items.OfType<PdfText>().Select(t => (Page: i, t.Text))).ToList();
            var cautions = texts.Where(t => t.Text.StartsWith(firstCautionWord, StringComparison.Ordinal)).ToList();
            Assert.Equal(2, cautions.Count); // boxed under the title, and closing the document
            var lastPage = layout.Pages.Length - 1;
            Assert.True(cautions[^1].Page == lastPage, $"{n} paragraphs: the closing caution starts on page {cautions[^1].Page + 1} of {lastPage + 1}");
            Assert.True(texts.Last(t => t.Text.Contains("licensed", StringComparison.Ordinal)).Page == lastPage, $"{n} paragraphs: the caution's end is not on the last page");
            Assert.True(texts.Single(t => t.Text.StartsWith("Model file", StringComparison.Ordinal)).Page == lastPage, $"{n} paragraphs: the trace line is split from the caution");
        }
    }

    [Fact]
    public void PageCount_GrowsWithTheSections()
    {
        var document = Repository.UniformChain(6, 1, 100);
        ImmutableArray<ReportSectionFactory> summary = [ModelSummarySection.Create];
        ImmutableArray<ReportSectionFactory> withModes = [ModelSummarySection.Create, ModesSection.Create];
        var few = PdfTextReader.Pages(Pdf(ReportBuilder.Build(document, Options, summary))).Count;
        var more = PdfTextReader.Pages(Pdf(ReportBuilder.Build(document, Options, withModes))).Count;
        Assert.True(more > few, $"{more} pages with the modes, {few} without");
    }

    [Fact]
    public void ReportPdf_IsTheSameBytesTwice()
    {
        // No date or random id in the file: a report can be reproduced byte for byte (reproducible-builds.org convention).
        var report = ReportBuilder.Build(Repository.UniformChain(3, 1, 100), Options);
        Assert.Equal(Pdf(report), Pdf(report));
    }

    [Fact]
    public void FormatPdf_WritesReportPdf_AndAReusedFolderKeepsNoStalePdf()
    {
        var dir = Path.Combine(Repository.TempDirectory(), "out");
        var files = ReportWriter.Write(ReportBuilder.Build(Repository.UniformChain(4, 1, 100), Options), dir, ReportFormat.Pdf);
        Assert.Contains(ReportWriter.PdfFile, files);
        Assert.True(File.Exists(Path.Combine(dir, "mode-04.pdf")));

        // Another model into the same folder, as PDF: report.pdf is the new model's, no figure of the old one is left.
        var other = Repository.Parse("title: a single mass on a spring\nmasses:\n  m: 2 kg\nsprings:\n  k: {between: [ground, m], stiffness: 800 N/m}\n", "single.yaml");
        ReportWriter.Write(ReportBuilder.Build(other, Options), dir, ReportFormat.Pdf);
        var text = string.Concat(PdfTextReader.Pages(File.ReadAllBytes(Path.Combine(dir, ReportWriter.PdfFile))));
        Assert.Contains("a single mass on a spring", text, StringComparison.Ordinal);
        Assert.DoesNotContain("uniform chain", text, StringComparison.Ordinal);
        Assert.False(File.Exists(Path.Combine(dir, "mode-02.pdf")));
        Assert.False(File.Exists(Path.Combine(dir, "mode-02.svg")));

        // Then as HTML: no PDF at all remains.
        ReportWriter.Write(ReportBuilder.Build(other, Options), dir, ReportFormat.Html);
        Assert.Empty(Directory.EnumerateFiles(dir, "*.pdf"));
    }

    /// <summary>Text with every space removed: the PDF's text is read line by line, so words may be split at line ends.</summary>
    private static string Squeeze(string text) => string.Concat(text.Where(c => !char.IsWhiteSpace(c)));
}
