using System.Globalization;
using System.Text;
using System.Xml;
using ModalChain.Io.Text;

namespace ModalChain.Reports.Drawing;

/// <summary>Writes a <see cref="Scene"/> as SVG 1.1 with <see cref="XmlWriter"/>, so the markup is well-formed by construction.</summary>
/// <remarks>Every text from the scene passes through <see cref="MarkupText.Clean"/>, so no input string can make the file ill-formed.</remarks>
public static class SvgSceneWriter
{
    private const string SvgNamespace = "http://www.w3.org/2000/svg";

    /// <summary>The scene as SVG text; a standalone file gets an XML declaration, an inline one (for HTML) does not.</summary>
    /// <param name="scene">The drawing.</param>
    /// <param name="standalone">True for a file of its own.</param>
    /// <param name="animate">False to drop animation frames (standalone figures are stills, for pasting into documents).</param>
    public static string Write(Scene scene, bool standalone, bool animate)
    {
        ArgumentNullException.ThrowIfNull(scene);
        var text = new StringBuilder();
        var settings = new XmlWriterSettings { OmitXmlDeclaration = !standalone, Indent = true, IndentChars = " ", Encoding = new UTF8Encoding(false) };
        using (var xml = XmlWriter.Create(new Utf8StringWriter(text), settings))
        {
            if (standalone) xml.WriteStartDocument();
            xml.WriteStartElement("svg", SvgNamespace);
            xml.WriteAttributeString("version", "1.1");
            xml.WriteAttributeString("width", F(scene.Width));
            xml.WriteAttributeString("height", F(scene.Height));
            xml.WriteAttributeString("viewBox", $"0 0 {F(scene.Width)} {F(scene.Height)}");
            xml.WriteAttributeString("font-family", Scene.FontStack);
            xml.WriteAttributeString("role", "img");
            foreach (var (key, value) in scene.Data.OrderBy(p => p.Key, StringComparer.Ordinal))
                xml.WriteAttributeString("data-" + key, MarkupText.Clean(value));
            xml.WriteElementString("title", SvgNamespace, MarkupText.Clean(scene.Title));
            xml.WriteStartElement("rect", SvgNamespace);
            xml.WriteAttributeString("width", "100%");
            xml.WriteAttributeString("height", "100%");
            xml.WriteAttributeString("fill", "#ffffff");
            xml.WriteEndElement();
            foreach (var shape in scene.Shapes) WriteShape(xml, shape, animate);
            xml.WriteEndElement();
            if (standalone) xml.WriteEndDocument();
        }
        return text.ToString();
    }

    /// <summary>A coordinate with at most three decimals, invariant culture.</summary>
    public static string F(double value) => Math.Round(value, 3).ToString("0.###", CultureInfo.InvariantCulture);

    private static void WriteShape(XmlWriter xml, Shape shape, bool animate)
    {
        switch (shape)
        {
            case GroupShape group:
                xml.WriteStartElement("g", SvgNamespace);
                Common(xml, shape);
                foreach (var child in group.Children) WriteShape(xml, child, animate);
                xml.WriteEndElement();
                break;
            case PathShape path:
                xml.WriteStartElement("path", SvgNamespace);
                Common(xml, shape);
                xml.WriteAttributeString("d", PathData(path.Frames[0], path.Closed));
                Stroke(xml, path.Stroke);
                xml.WriteAttributeString("fill", path.Fill ?? "none");
                if (path.Fill is not null && path.FillOpacity < 1) xml.WriteAttributeString("fill-opacity", F(path.FillOpacity));
                if (animate && path.Frames.Length > 1)
                {
                    xml.WriteStartElement("animate", SvgNamespace);
                    xml.WriteAttributeString("attributeName", "d");
                    xml.WriteAttributeString("dur", "2.4s");
                    xml.WriteAttributeString("repeatCount", "indefinite");
                    xml.WriteAttributeString("values", string.Join(";", path.Frames.Select(f => PathData(f, path.Closed))));
                    xml.WriteEndElement();
                }
                xml.WriteEndElement();
                break;
            case RectSetShape set:
                xml.WriteStartElement("path", SvgNamespace);
                Common(xml, shape);
                xml.WriteAttributeString("d", RectsData(set.Rects));
                Stroke(xml, set.Stroke);
                xml.WriteAttributeString("fill", set.Fill ?? "none");
                xml.WriteEndElement();
                break;
            case CircleShape circle:
                xml.WriteStartElement("circle", SvgNamespace);
                Common(xml, shape);
                xml.WriteAttributeString("cx", F(circle.Center.X));
                xml.WriteAttributeString("cy", F(circle.Center.Y));
                xml.WriteAttributeString("r", F(circle.Radius));
                Stroke(xml, circle.Stroke);
                xml.WriteAttributeString("fill", circle.Fill ?? "none");
                xml.WriteEndElement();
                break;
            case TextShape label:
                xml.WriteStartElement("text", SvgNamespace);
                Common(xml, shape);
                xml.WriteAttributeString("x", F(label.At.X));
                xml.WriteAttributeString("y", F(label.At.Y));
                xml.WriteAttributeString("font-size", F(label.Size));
                if (label.Anchor != TextAnchor.Start) xml.WriteAttributeString("text-anchor", label.Anchor == TextAnchor.Middle ? "middle" : "end");
                if (label.Bold) xml.WriteAttributeString("font-weight", "bold");
                xml.WriteAttributeString("fill", label.Color);
                if (label.Halo)
                {
                    xml.WriteAttributeString("stroke", "#ffffff");
                    xml.WriteAttributeString("stroke-width", "3");
                    xml.WriteAttributeString("stroke-linejoin", "round");
                    xml.WriteAttributeString("paint-order", "stroke");
                }
                xml.WriteString(MarkupText.Clean(label.Text));
                xml.WriteEndElement();
                break;
            default:
                throw new ArgumentException($"Unknown shape type {shape.GetType().Name}.", nameof(shape));
        }
    }

    private static void Common(XmlWriter xml, Shape shape)
    {
        if (shape.Class is not null) xml.WriteAttributeString("class", MarkupText.Clean(shape.Class));
        foreach (var (key, value) in shape.Data.OrderBy(p => p.Key, StringComparer.Ordinal))
            xml.WriteAttributeString("data-" + key, MarkupText.Clean(value));
    }

    private static void Stroke(XmlWriter xml, Pen? pen)
    {
        if (pen is null)
        {
            xml.WriteAttributeString("stroke", "none");
            return;
        }
        xml.WriteAttributeString("stroke", pen.Color);
        xml.WriteAttributeString("stroke-width", F(pen.Width));
        xml.WriteAttributeString("stroke-linejoin", "round");
        if (pen.Dash is { } dash) xml.WriteAttributeString("stroke-dasharray", string.Join(" ", dash.Select(F)));
        if (pen.Opacity < 1) xml.WriteAttributeString("stroke-opacity", F(pen.Opacity));
    }

    /// <summary>A string writer that reports UTF-8, so the XML declaration names the encoding the file is written in (UTF-8, not UTF-16).</summary>
    private sealed class Utf8StringWriter(StringBuilder text) : StringWriter(text, CultureInfo.InvariantCulture)
    {
        public override Encoding Encoding { get; } = new UTF8Encoding(false);
    }

    /// <summary>Each rectangle as "Mx yhWvHh-Wz" (about 25 characters), so a map of 10,000 cells stays a few hundred kilobytes.</summary>
    private static string RectsData(IReadOnlyList<Rect> rects)
    {
        var d = new StringBuilder(rects.Count * 28);
        foreach (var r in rects)
        {
            var w = F(r.Right - r.Left);
            d.Append('M').Append(F(r.Left)).Append(' ').Append(F(r.Top)).Append('h').Append(w)
                .Append('v').Append(F(r.Bottom - r.Top)).Append("h-").Append(w).Append('z');
        }
        return d.ToString();
    }

    private static string PathData(IReadOnlyList<Point> points, bool closed)
    {
        var d = new StringBuilder();
        for (var i = 0; i < points.Count; i++)
            d.Append(i == 0 ? "M" : " L").Append(F(points[i].X)).Append(' ').Append(F(points[i].Y));
        if (closed) d.Append(" Z");
        return d.ToString();
    }
}
