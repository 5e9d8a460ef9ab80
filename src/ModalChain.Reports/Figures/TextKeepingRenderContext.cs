using OxyPlot;
using OxyPlot.SkiaSharp;

namespace ModalChain.Reports.Figures;

/// <summary>
/// OxyPlot's SkiaSharp render context, except that every text stays text in SVG and PDF output, whatever was drawn before it.
/// </summary>
/// <remarks>
/// <see cref="SkiaRenderContext"/> reuses one paint for strokes, fills and text, and only a fill clears the dash pattern a
/// dashed line left on it; Skia's SVG and PDF devices write text drawn with a dash pattern as glyph outlines. So any text
/// drawn after a dashed curve or marker (a curve label, the chart's title) used to come out as unlabelled paths: no longer
/// text for a reader, a search or a test. Before each text this context asks for a fill far outside the canvas, which
/// resets the paint and which Skia rejects before it reaches the output.
/// </remarks>
internal sealed class TextKeepingRenderContext(SkiaRenderContext inner) : IRenderContext
{
    private static readonly OxyRect Outside = new(-1e5, -1e5, 1, 1);

    public bool RendersToScreen => inner.RendersToScreen;

    public int ClipCount => inner.ClipCount;

    public void DrawText(ScreenPoint p, string text, OxyColor fill, string? fontFamily = null, double fontSize = 10, double fontWeight = 400,
        double rotation = 0, HorizontalAlignment horizontalAlignment = HorizontalAlignment.Left, VerticalAlignment verticalAlignment = VerticalAlignment.Top,
        OxySize? maxSize = null)
    {
        inner.DrawRectangle(Outside, OxyColors.Black, OxyColors.Undefined, 0, EdgeRenderingMode.Automatic);
        inner.DrawText(p, text, fill, fontFamily, fontSize, fontWeight, rotation, horizontalAlignment, verticalAlignment, maxSize);
    }

    public OxySize MeasureText(string text, string? fontFamily = null, double fontSize = 10, double fontWeight = 500) =>
        inner.MeasureText(text, fontFamily, fontSize, fontWeight);

    public void DrawEllipse(OxyRect extents, OxyColor fill, OxyColor stroke, double thickness, EdgeRenderingMode edgeRenderingMode) =>
        inner.DrawEllipse(extents, fill, stroke, thickness, edgeRenderingMode);

    public void DrawEllipses(IList<OxyRect> extents, OxyColor fill, OxyColor stroke, double thickness, EdgeRenderingMode edgeRenderingMode) =>
        inner.DrawEllipses(extents, fill, stroke, thickness, edgeRenderingMode);

    public void DrawLine(IList<ScreenPoint> points, OxyColor stroke, double thickness, EdgeRenderingMode edgeRenderingMode, double[]? dashArray = null, LineJoin lineJoin = LineJoin.Miter) =>
        inner.DrawLine(points, stroke, thickness, edgeRenderingMode, dashArray, lineJoin);

    public void DrawLineSegments(IList<ScreenPoint> points, OxyColor stroke, double thickness, EdgeRenderingMode edgeRenderingMode, double[]? dashArray = null, LineJoin lineJoin = LineJoin.Miter) =>
        inner.DrawLineSegments(points, stroke, thickness, edgeRenderingMode, dashArray, lineJoin);

    public void DrawPolygon(IList<ScreenPoint> points, OxyColor fill, OxyColor stroke, double thickness, EdgeRenderingMode edgeRenderingMode, double[]? dashArray = null, LineJoin lineJoin = LineJoin.Miter) =>
        inner.DrawPolygon(points, fill, stroke, thickness, edgeRenderingMode, dashArray, lineJoin);

    public void DrawPolygons(IList<IList<ScreenPoint>> polygons, OxyColor fill, OxyColor stroke, double thickness, EdgeRenderingMode edgeRenderingMode, double[]? dashArray = null, LineJoin lineJoin = LineJoin.Miter) =>
        inner.DrawPolygons(polygons, fill, stroke, thickness, edgeRenderingMode, dashArray, lineJoin);

    public void DrawRectangle(OxyRect rectangle, OxyColor fill, OxyColor stroke, double thickness, EdgeRenderingMode edgeRenderingMode) =>
        inner.DrawRectangle(rectangle, fill, stroke, thickness, edgeRenderingMode);

    public void DrawRectangles(IList<OxyRect> rectangles, OxyColor fill, OxyColor stroke, double thickness, EdgeRenderingMode edgeRenderingMode) =>
        inner.DrawRectangles(rectangles, fill, stroke, thickness, edgeRenderingMode);

    public void DrawImage(OxyImage source, double srcX, double srcY, double srcWidth, double srcHeight, double destX, double destY, double destWidth, double destHeight, double opacity, bool interpolate) =>
        inner.DrawImage(source, srcX, srcY, srcWidth, srcHeight, destX, destY, destWidth, destHeight, opacity, interpolate);

    public void SetToolTip(string text) => inner.SetToolTip(text);

    public void CleanUp() => inner.CleanUp();

    public void PushClip(OxyRect clippingRectangle) => inner.PushClip(clippingRectangle);

    public void PopClip() => inner.PopClip();
}
