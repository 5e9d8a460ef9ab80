using ModalChain.Reports.Drawing;

namespace ModalChain.Reports.Figures;

/// <summary>A figure drawn as a <see cref="Scene"/>: the network schematic and the mode shapes.</summary>
/// <remarks>
/// These are written as SVG directly (<see cref="SvgSceneWriter"/>) rather than through a chart library, so each mass
/// and element is one element with a class and a <c>data-</c> name: a reader (or a test) can find a mass in the file and
/// measure its drawn displacement, and animation frames can be added for the HTML view.
/// </remarks>
public sealed class SchematicFigure(string name, string caption, string kind, Scene scene, bool animated) : ReportFigure(name, caption, kind)
{
    /// <summary>The drawing.</summary>
    public Scene Scene { get; } = scene;

    /// <inheritdoc />
    public override string Svg(bool standalone) => SvgSceneWriter.Write(Scene, standalone, animate: false);

    /// <inheritdoc />
    public override string? AnimatedSvg() => animated ? SvgSceneWriter.Write(Scene, standalone: false, animate: true) : null;

    /// <inheritdoc />
    public override void WritePdf(Stream stream) => PdfSceneWriter.Write(Scene, stream);

    /// <inheritdoc />
    public override (double Width, double Height)? Size => (Scene.Width, Scene.Height);

    /// <inheritdoc />
    public override void Draw(SkiaSharp.SKCanvas canvas) => PdfSceneWriter.Draw(canvas, Scene);
}
