using System.Globalization;
using System.Xml.Linq;
using ModalChain.TestSupport;

namespace ModalChain.Reports.Tests.Drawing;

/// <summary>The network drawing: blocks placed at the model's <c>at</c> positions to the stated scale, every mass named with its value.</summary>
public sealed class NetworkFigureTests
{
    private const string Model = """
        title: three masses drawn where the model puts them
        masses:
          base: {mass: 500 kg, at: [0, 0]}
          left: {mass: 120 kg, at: [-1.5, 1.2]}
          right: {mass: 80 kg, at: [1.5, 1.2]}
        springs:
          legs: {between: [ground, base], stiffness: 2 MN/m}
          mount-l: {between: [base, left], stiffness: 150 kN/m}
          mount-r: {between: [base, right], stiffness: 90 kN/m}
        dampers:
          pad: {between: [base, right], coefficient: 800 N*s/m}
        """;

    [Fact]
    public void Blocks_SitAtTheModelPositionsToTheStatedDrawingScale()
    {
        var report = ReportBuilder.Build(Repository.Parse(Model), new ReportOptions("t", DateTimeOffset.UnixEpoch));
        var root = SvgAssert.WellFormedWithViewBox(report.Figures.Single(f => f.Name == "network").Svg(true));
        var pxPerM = double.Parse((string)root.Attribute("data-px-per-m")!, CultureInfo.InvariantCulture);
        var centre = root.Descendants(Repository.Svg + "path")
            .Where(p => (string?)p.Attribute("class") == "mass")
            .ToDictionary(p => (string)p.Attribute("data-mass")!, SvgAssert.Centre);
        var at = new Dictionary<string, (double X, double Y)> { ["base"] = (0, 0), ["left"] = (-1.5, 1.2), ["right"] = (1.5, 1.2) };
        foreach (var (name, (x, y)) in at)
        {
            // Relative to 'base'; SVG y grows downwards. Three-decimal coordinates: 2e-3 px.
            NumericAssert.Close(x * pxPerM, centre[name].X - centre["base"].X, Tolerance.Abs(2e-3), $"{name} x (px)");
            NumericAssert.Close(-y * pxPerM, centre[name].Y - centre["base"].Y, Tolerance.Abs(2e-3), $"{name} y (px)");
        }
    }

    [Fact]
    public void Drawing_NamesEveryMassAndElementWithValuesAndUnits()
    {
        var report = ReportBuilder.Build(Repository.Parse(Model), new ReportOptions("t", DateTimeOffset.UnixEpoch));
        var texts = SvgAssert.Texts(XDocument.Parse(report.Figures.Single(f => f.Name == "network").Svg(true)).Root!);
        foreach (var name in new[] { "base", "left", "right", "legs", "mount-l", "mount-r", "pad" }) Assert.Contains(name, texts);
        Assert.Contains("500 kg", texts);
        Assert.Contains("2000 kN/m", texts);
        Assert.Contains("800 N·s/m", texts);
        Assert.Contains("Positions from the model's 'at' values.", texts);
    }

    [Fact]
    public void ParallelSpringAndDamper_AreDrawnSideBySide()
    {
        var report = ReportBuilder.Build(Repository.Parse(Model), new ReportOptions("t", DateTimeOffset.UnixEpoch));
        var root = XDocument.Parse(report.Figures.Single(f => f.Name == "network").Svg(true)).Root!;
        XElement Group(string element) => root.Descendants(Repository.Svg + "g").Single(g => (string?)g.Attribute("data-element") == element);
        var spring = SvgAssert.PathPoints(Group("mount-r").Elements(Repository.Svg + "path").First());
        var damperRod = SvgAssert.PathPoints(Group("pad").Elements(Repository.Svg + "path").First());
        // The two attach to the same blocks but are offset from each other, not drawn on top of one another.
        var gap = Math.Abs((spring[0] - damperRod[0]).Length);
        Assert.True(gap > 5, $"spring and damper between the same masses start only {gap:F2} px apart");
    }
}
