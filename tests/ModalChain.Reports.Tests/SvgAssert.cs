using System.Globalization;
using System.Xml.Linq;
using ModalChain.Reports.Drawing;

namespace ModalChain.Reports.Tests;

/// <summary>Parses SVG text and checks what every figure must have: well-formed XML, an svg root with a viewBox.</summary>
internal static class SvgAssert
{
    public static XElement WellFormedWithViewBox(string svg)
    {
        var document = XDocument.Parse(svg); // throws on malformed XML
        var root = document.Root!;
        Assert.Equal(Repository.Svg + "svg", root.Name);
        var viewBox = root.Attribute("viewBox")?.Value;
        Assert.False(string.IsNullOrWhiteSpace(viewBox), "the svg root has no viewBox");
        var parts = viewBox!.Split(' ', StringSplitOptions.RemoveEmptyEntries).Select(p => double.Parse(p, CultureInfo.InvariantCulture)).ToArray();
        Assert.Equal(4, parts.Length);
        Assert.True(parts[2] > 0 && parts[3] > 0, $"viewBox '{viewBox}' has no area");
        return root;
    }

    public static IReadOnlyList<string> Texts(XElement root) =>
        [.. root.Descendants(Repository.Svg + "text").Select(t => t.Value.Trim())];

    /// <summary>The points of an SVG path written as "M x y L x y ... [Z]".</summary>
    public static IReadOnlyList<Point> PathPoints(XElement path)
    {
        var d = path.Attribute("d")!.Value.Replace("M", " ").Replace("L", " ").Replace("Z", " ");
        var numbers = d.Split(' ', StringSplitOptions.RemoveEmptyEntries).Select(s => double.Parse(s, CultureInfo.InvariantCulture)).ToArray();
        return [.. Enumerable.Range(0, numbers.Length / 2).Select(i => new Point(numbers[2 * i], numbers[2 * i + 1]))];
    }

    public static Point Centre(XElement path)
    {
        var points = PathPoints(path);
        return new Point(points.Average(p => p.X), points.Average(p => p.Y));
    }
}
