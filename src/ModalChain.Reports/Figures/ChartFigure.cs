using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;
using System.Xml.Linq;
using ModalChain.Io.Text;
using ModalChain.Reports.Drawing;
using OxyPlot;
using OxyPlot.Annotations;

namespace ModalChain.Reports.Figures;

/// <summary>An x-y chart drawn with OxyPlot and exported through SkiaSharp (SVG and PDF).</summary>
/// <remarks>
/// The SVG that SkiaSharp writes has no viewBox, numbers its clip paths from 1 in every file (so two charts inline in
/// one HTML page would share ids) and leaves a trailing separator in per-glyph position lists; <see cref="Svg"/> fixes
/// all three so the chart scales with the page and renders the same in every browser. Its <see cref="CurveLabel"/>s are
/// placed once, at the chart's size, by <see cref="ChartLabels.Place"/>: inside the plot area and clear of each other.
/// </remarks>
public sealed partial class ChartFigure : ReportFigure
{
    private readonly Lazy<string> _svg;

    /// <summary>Creates a chart figure of <paramref name="width"/> × <paramref name="height"/> user units.</summary>
    public ChartFigure(string name, string caption, PlotModel model, double width = NetworkFigure.Width, double height = 380)
        : base(name, Prepare(model, caption, width, height), "chart")
    {
        Model = model;
        Width = width;
        Height = height;
        _svg = new Lazy<string>(Export);
    }

    /// <summary>
    /// Sets the chart's font, cleans its texts and places its <see cref="CurveLabel"/>s at the final size; returns
    /// <paramref name="caption"/>, with a note when a label found no room and was left out rather than drawn cut off.
    /// </summary>
    private static string Prepare(PlotModel model, string caption, double width, double height)
    {
        ArgumentNullException.ThrowIfNull(model);
        Charts.ApplyFont(model);
        CleanTexts(model);
        var omitted = ChartLabels.Place(model, width, height);
        return omitted == 0
            ? caption
            : caption + string.Create(CultureInfo.InvariantCulture,
                $" {omitted} chart label{(omitted == 1 ? " was" : "s were")} left out where the plot had no free room for {(omitted == 1 ? "it" : "them")}; the tables give every value.");
    }

    /// <summary>The chart.</summary>
    public PlotModel Model { get; }

    /// <summary>Width in user units.</summary>
    public double Width { get; }

    /// <summary>Height in user units.</summary>
    public double Height { get; }

    /// <inheritdoc />
    public override string Svg(bool standalone) =>
        standalone ? "<?xml version=\"1.0\" encoding=\"utf-8\"?>\n" + _svg.Value : _svg.Value;

    /// <inheritdoc />
    public override void WritePdf(Stream stream)
    {
        // A page of the chart's size at 72 points per inch (0.75 point per user unit), laid out exactly as the SVG.
        const float pointsPerUnit = 0.75f;
        using var document = SkiaSharp.SKDocument.CreatePdf(stream);
        using var canvas = document.BeginPage((float)Width * pointsPerUnit, (float)Height * pointsPerUnit);
        canvas.Clear(Background);
        canvas.Scale(pointsPerUnit);
        Draw(canvas);
        document.EndPage();
        document.Close();
    }

    /// <inheritdoc />
    public override (double Width, double Height)? Size => (Width, Height);

    /// <inheritdoc />
    public override void Draw(SkiaSharp.SKCanvas canvas)
    {
        ArgumentNullException.ThrowIfNull(canvas);
        // The same render context the PDF exporter uses, on a canvas the caller placed; DpiScale 1 keeps user units.
        Render(canvas);
    }

    /// <summary>Renders the chart onto <paramref name="canvas"/> in user units, every text kept as text (see <see cref="TextKeepingRenderContext"/>).</summary>
    private void Render(SkiaSharp.SKCanvas canvas)
    {
        // Text shaping needs HarfBuzz's native library, which the Linux no-dependency assets do not ship; plain glyph runs suffice for labels.
        using var skia = new OxyPlot.SkiaSharp.SkiaRenderContext
        {
            RenderTarget = OxyPlot.SkiaSharp.RenderTarget.VectorGraphic, SkCanvas = canvas, UseTextShaping = false, DpiScale = 1,
        };
        var context = new TextKeepingRenderContext(skia);
        lock (Model.SyncRoot)
        {
            ((IPlotModel)Model).Update(true);
            ((IPlotModel)Model).Render(context, new OxyRect(0, 0, Width, Height));
        }
    }

    private SkiaSharp.SKColor Background => new(Model.Background.R, Model.Background.G, Model.Background.B, Model.Background.A);

    private string Export()
    {
        using var buffer = new MemoryStream();
        using (var canvas = SkiaSharp.SKSvgCanvas.Create(new SkiaSharp.SKRect(0, 0, (float)Width, (float)Height), buffer))
        {
            canvas.Clear(Background);
            Render(canvas);
        }
        var document = XDocument.Parse(Encoding.UTF8.GetString(buffer.ToArray()));
        var root = document.Root ?? throw new InvalidOperationException("The chart exporter wrote an empty SVG.");
        XNamespace svg = "http://www.w3.org/2000/svg";
        var w = Width.ToString(CultureInfo.InvariantCulture);
        var h = Height.ToString(CultureInfo.InvariantCulture);
        root.SetAttributeValue("viewBox", $"0 0 {w} {h}");
        root.SetAttributeValue("width", w);
        root.SetAttributeValue("height", h);
        root.SetAttributeValue("font-family", Scene.FontStack);
        root.SetAttributeValue("role", "img");
        root.SetAttributeValue("data-figure", Name);
        root.AddFirst(new XElement(svg + "title", Model.Title ?? Name));

        // SkiaSharp numbers ids from a process-wide counter; renumber them in document order so output is reproducible.
        var ids = root.DescendantsAndSelf().Attributes("id").Select(a => a.Value).Distinct(StringComparer.Ordinal)
            .Select((id, i) => (id, i)).ToDictionary(p => p.id, p => $"{Name}-clip{p.i + 1}", StringComparer.Ordinal);
        foreach (var element in root.DescendantsAndSelf())
            foreach (var attribute in element.Attributes().ToArray())
            {
                if (attribute.Name == "id") attribute.Value = ids[attribute.Value];
                else if (attribute.Value.Contains("url(#", StringComparison.Ordinal))
                    attribute.Value = UrlReference().Replace(attribute.Value, m => ids.TryGetValue(m.Groups[1].Value, out var id) ? $"url(#{id})" : m.Value);
                else if (attribute.Name.LocalName == "href" && attribute.Value.StartsWith('#') && ids.TryGetValue(attribute.Value[1..], out var target))
                    attribute.Value = "#" + target;
                else if (element.Name.LocalName == "text" && attribute.Name.LocalName is "x" or "y")
                    attribute.Value = attribute.Value.Trim().TrimEnd(',').Trim();
            }
        foreach (var text in root.Descendants(svg + "text"))
            if (text.Nodes().OfType<XText>().ToArray() is [var only]) only.Value = only.Value.Trim();
        return root.ToString(SaveOptions.DisableFormatting);
    }

    /// <summary>Replaces characters XML 1.0 forbids in every text of the chart, so the exported SVG is well-formed whatever the model's title.</summary>
    private static void CleanTexts(PlotModel model)
    {
        model.Title = model.Title is null ? null : MarkupText.Clean(model.Title);
        model.Subtitle = model.Subtitle is null ? null : MarkupText.Clean(model.Subtitle);
        foreach (var axis in model.Axes) axis.Title = axis.Title is null ? null : MarkupText.Clean(axis.Title);
        foreach (var series in model.Series) series.Title = series.Title is null ? null : MarkupText.Clean(series.Title);
        foreach (var annotation in model.Annotations.OfType<TextualAnnotation>())
            annotation.Text = annotation.Text is null ? null : MarkupText.Clean(annotation.Text);
    }

    [GeneratedRegex(@"url\(#([^)]+)\)")]
    private static partial Regex UrlReference();
}
