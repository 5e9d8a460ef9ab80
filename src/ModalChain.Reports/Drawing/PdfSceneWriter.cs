using SkiaSharp;

namespace ModalChain.Reports.Drawing;

/// <summary>Renders a <see cref="Scene"/> as a one-page PDF with SkiaSharp (vector output, fonts embedded), or onto a page of a longer PDF.</summary>
public static class PdfSceneWriter
{
    /// <summary>Writes <paramref name="scene"/> to <paramref name="stream"/>; the page is the scene's size at 72 points per 96 user units.</summary>
    public static void Write(Scene scene, Stream stream)
    {
        ArgumentNullException.ThrowIfNull(scene);
        ArgumentNullException.ThrowIfNull(stream);
        const float pointsPerUnit = 72f / 96f;
        using var document = SKDocument.CreatePdf(stream);
        using var canvas = document.BeginPage((float)scene.Width * pointsPerUnit, (float)scene.Height * pointsPerUnit);
        canvas.Scale(pointsPerUnit);
        Draw(canvas, scene);
        document.EndPage();
        document.Close();
    }

    /// <summary>Paints <paramref name="scene"/> onto <paramref name="canvas"/> in user units, its top-left corner at the canvas origin (a page of report.pdf or a page of its own).</summary>
    public static void Draw(SKCanvas canvas, Scene scene)
    {
        ArgumentNullException.ThrowIfNull(canvas);
        ArgumentNullException.ThrowIfNull(scene);
        using var typeface = SKTypeface.FromFamilyName(Scene.FontFamily) ?? SKTypeface.Default;
        using var bold = SKTypeface.FromFamilyName(Scene.FontFamily, SKFontStyle.Bold) ?? typeface;
        foreach (var shape in scene.Shapes) Draw(canvas, shape, typeface, bold);
    }

    private static void Draw(SKCanvas canvas, Shape shape, SKTypeface typeface, SKTypeface bold)
    {
        switch (shape)
        {
            case GroupShape group:
                foreach (var child in group.Children) Draw(canvas, child, typeface, bold);
                break;
            case PathShape p:
                using (var path = new SKPath())
                {
                    var points = p.Points;
                    path.MoveTo((float)points[0].X, (float)points[0].Y);
                    for (var i = 1; i < points.Length; i++) path.LineTo((float)points[i].X, (float)points[i].Y);
                    if (p.Closed) path.Close();
                    if (p.Fill is not null)
                        using (var fill = FillPaint(p.Fill, p.FillOpacity)) canvas.DrawPath(path, fill);
                    if (p.Stroke is not null)
                        using (var stroke = StrokePaint(p.Stroke)) canvas.DrawPath(path, stroke);
                }
                break;
            case RectSetShape set:
                using (var path = new SKPath())
                {
                    foreach (var r in set.Rects) path.AddRect(new SKRect((float)r.Left, (float)r.Top, (float)r.Right, (float)r.Bottom));
                    if (set.Fill is not null)
                        using (var fill = FillPaint(set.Fill, 1)) canvas.DrawPath(path, fill);
                    if (set.Stroke is not null)
                        using (var stroke = StrokePaint(set.Stroke)) canvas.DrawPath(path, stroke);
                }
                break;
            case CircleShape c:
                if (c.Fill is not null)
                    using (var fill = FillPaint(c.Fill, 1)) canvas.DrawCircle((float)c.Center.X, (float)c.Center.Y, (float)c.Radius, fill);
                if (c.Stroke is not null)
                    using (var stroke = StrokePaint(c.Stroke)) canvas.DrawCircle((float)c.Center.X, (float)c.Center.Y, (float)c.Radius, stroke);
                break;
            case TextShape t:
                using (var paint = new SKPaint
                {
                    Color = SKColor.Parse(t.Color),
                    IsAntialias = true,
                    Typeface = t.Bold ? bold : typeface,
                    TextSize = (float)t.Size,
                    TextAlign = t.Anchor switch { TextAnchor.Middle => SKTextAlign.Center, TextAnchor.End => SKTextAlign.Right, _ => SKTextAlign.Left },
                })
                {
                    if (t.Halo)
                        using (var halo = paint.Clone())
                        {
                            halo.Color = SKColors.White;
                            halo.Style = SKPaintStyle.Stroke;
                            halo.StrokeWidth = 3;
                            halo.StrokeJoin = SKStrokeJoin.Round;
                            canvas.DrawText(t.Text, (float)t.At.X, (float)t.At.Y, halo);
                        }
                    canvas.DrawText(t.Text, (float)t.At.X, (float)t.At.Y, paint);
                }
                break;
        }
    }

    private static SKPaint StrokePaint(Pen pen)
    {
        var paint = new SKPaint
        {
            Style = SKPaintStyle.Stroke,
            Color = SKColor.Parse(pen.Color).WithAlpha((byte)Math.Round(255 * pen.Opacity)),
            StrokeWidth = (float)pen.Width,
            StrokeJoin = SKStrokeJoin.Round,
            IsAntialias = true,
        };
        if (pen.Dash is { } dash) paint.PathEffect = SKPathEffect.CreateDash([.. dash.Select(d => (float)d)], 0);
        return paint;
    }

    private static SKPaint FillPaint(string color, double opacity) => new()
    {
        Style = SKPaintStyle.Fill,
        Color = SKColor.Parse(color).WithAlpha((byte)Math.Round(255 * opacity)),
        IsAntialias = true,
    };
}
