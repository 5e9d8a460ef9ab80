using System.Globalization;
using SkiaSharp;

namespace ModalChain.Reports.Pdf;

/// <summary>Writes the whole report as one multi-page vector PDF (report.pdf): A4 portrait, every section in the order of report.html.</summary>
/// <remarks>
/// Text is drawn as glyphs of the embedded DejaVu Sans subset, figures as vectors (charts through OxyPlot's SkiaSharp
/// render context, schematics through <see cref="Drawing.PdfSceneWriter"/>) on the same page canvas. Every page carries a
/// running footer with the model's title and "Page n of N"; the caution is on the first page and at the end.
/// </remarks>
public static class PdfReport
{
    /// <summary>File name of the PDF report.</summary>
    public const string FileName = "report.pdf";

    /// <summary>Lays out <paramref name="document"/> and writes it to <paramref name="stream"/>.</summary>
    public static void Write(ReportDocument document, Stream stream)
    {
        ArgumentNullException.ThrowIfNull(document);
        ArgumentNullException.ThrowIfNull(stream);
        using var layout = new PdfLayout();
        var result = layout.Run(document);
        var metadata = SKDocumentPdfMetadata.Default;
        metadata.Title = document.Title;
        metadata.Creator = "ModalChain";
        metadata.Creation = null;
        metadata.Modified = null;
        using var pdf = SKDocument.CreatePdf(stream, metadata);
        using var paint = new SKPaint { IsAntialias = true };
        var footerTitle = layout.Fit(document.Title, PdfLayout.ContentWidth * 0.7f, 7.5f);
        foreach (var page in result.Pages)
        {
            var canvas = pdf.BeginPage(PdfLayout.PageWidth, PdfLayout.PageHeight);
            foreach (var item in page.Items) Draw(canvas, item, layout, paint);
            Footer(canvas, layout, paint, footerTitle, page.Number, result.Pages.Length);
            pdf.EndPage();
        }
        pdf.Close();
    }

    private static void Footer(SKCanvas canvas, PdfLayout layout, SKPaint paint, string title, int number, int count)
    {
        const float y = PdfLayout.PageHeight - 40;
        Draw(canvas, new PdfLine(PdfLayout.Margin, y, PdfLayout.PageWidth - PdfLayout.Margin, y, 0.5f, "#C8C8C8"), layout, paint);
        Draw(canvas, new PdfText(PdfLayout.Margin, y + 11, layout.Measure(title, 7.5f), title, 7.5f, false, "#555555"), layout, paint);
        var label = string.Create(CultureInfo.InvariantCulture, $"Page {number} of {count}");
        var width = layout.Measure(label, 7.5f);
        Draw(canvas, new PdfText(PdfLayout.PageWidth - PdfLayout.Margin - width, y + 11, width, label, 7.5f, false, "#555555"), layout, paint);
    }

    private static void Draw(SKCanvas canvas, PdfItem item, PdfLayout layout, SKPaint paint)
    {
        paint.PathEffect = null;
        switch (item)
        {
            case PdfText t:
                paint.Style = SKPaintStyle.Fill;
                paint.Color = SKColor.Parse(t.Color);
                paint.Typeface = t.Bold ? layout.Bold : layout.Regular;
                paint.TextSize = t.Size;
                paint.TextAlign = SKTextAlign.Left;
                canvas.DrawText(t.Text, t.X, t.Baseline, paint);
                break;
            case PdfLine l:
                paint.Style = SKPaintStyle.Stroke;
                paint.Color = SKColor.Parse(l.Color);
                paint.StrokeWidth = l.Width;
                canvas.DrawLine(l.X1, l.Y1, l.X2, l.Y2, paint);
                break;
            case PdfBox b:
                var rect = SKRect.Create(b.X, b.Y, b.Width, b.Height);
                if (b.Fill is not null)
                {
                    paint.Style = SKPaintStyle.Fill;
                    paint.Color = SKColor.Parse(b.Fill);
                    canvas.DrawRect(rect, paint);
                }
                if (b.Stroke is not null)
                {
                    paint.Style = SKPaintStyle.Stroke;
                    paint.Color = SKColor.Parse(b.Stroke);
                    paint.StrokeWidth = b.StrokeWidth;
                    canvas.DrawRect(rect, paint);
                }
                break;
            case PdfFigure f:
                canvas.Save();
                canvas.ClipRect(SKRect.Create(f.X, f.Y, f.Width, f.Height));
                canvas.Translate(f.X, f.Y);
                canvas.Scale(f.Scale);
                f.Figure.Draw(canvas);
                canvas.Restore();
                break;
        }
    }
}
