using System.Globalization;
using System.Text.RegularExpressions;
using System.Xml.Linq;
using ModalChain.Reports.Drawing;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Sections;
using ModalChain.TestSupport;

namespace ModalChain.Reports.Tests.Sections;

/// <summary>The mode figures: labels, well-formed SVG, and drawn displacements that equal the mode shape at the stated scale.</summary>
public sealed class ModesSectionTests
{
    // Rao, Mechanical Vibrations, 5th ed., Example 5.3 (values recomputed; attribution from memory, see REFERENCES.md §1 case A):
    // m1 = 10 kg, m2 = 1 kg, k1 = 30 N/m (ground–m1), k2 = 5 N/m (m1–m2): ω = 1.581139, 2.449490 rad/s, X2/X1 = 2 and −5.
    private const string RaoExample = """
        title: two-mass example
        masses:
          m1: {mass: 10 kg, at: [0, 1]}
          m2: {mass: 1 kg, at: [0, 2]}
        springs:
          k1: {between: [ground, m1], stiffness: 30 N/m}
          k2: {between: [m1, m2], stiffness: 5 N/m}
        """;

    private static readonly ReportOptions Options = new("test", new DateTimeOffset(2026, 1, 2, 3, 4, 5, TimeSpan.Zero));

    [Fact]
    public void TwoMassExample_FiguresStateModeNumberAndPublishedFrequencyInHz()
    {
        var report = ReportBuilder.Build(Repository.Parse(RaoExample), Options);
        var expectedHz = new[] { 1.581139 / (2 * Math.PI), 2.449490 / (2 * Math.PI) };
        for (var j = 0; j < 2; j++)
        {
            var figure = report.Figures.Single(f => f.Name == $"mode-0{j + 1}");
            var root = SvgAssert.WellFormedWithViewBox(figure.Svg(standalone: true));
            var title = SvgAssert.Texts(root).Single(t => t.StartsWith("Mode ", StringComparison.Ordinal));
            var match = Regex.Match(title, @"^Mode (\d+): ([0-9.]+) Hz$");
            Assert.True(match.Success, $"title '{title}' does not read 'Mode N: F Hz'");
            Assert.Equal(j + 1, int.Parse(match.Groups[1].Value, CultureInfo.InvariantCulture));
            // Four significant digits are printed: tolerance half a unit of the last digit.
            NumericAssert.Close(expectedHz[j], double.Parse(match.Groups[2].Value, CultureInfo.InvariantCulture), Tolerance.Rel(5e-4), $"mode {j + 1} Hz");
            Assert.Contains(SvgAssert.Texts(root), t => t.StartsWith("Period ", StringComparison.Ordinal) && t.Contains(" s ", StringComparison.Ordinal) && t.Contains("effective mass", StringComparison.Ordinal));
        }
    }

    [Fact]
    public void TwoMassExample_DrawnDisplacementsMatchPublishedModeRatiosAtStatedScale()
    {
        var report = ReportBuilder.Build(Repository.Parse(RaoExample), Options);
        // Published ratios X2/X1 = 2 (mode 1) and −5 (mode 2); normalised to +1 at the largest entry (m2 in both).
        var expected = new[] { new[] { 0.5, 1.0 }, new[] { -0.2, 1.0 } };
        for (var j = 0; j < 2; j++)
        {
            var root = SvgAssert.WellFormedWithViewBox(report.Figures.Single(f => f.Name == $"mode-0{j + 1}").Svg(true));
            AssertDisplacements(root, ["m1", "m2"], expected[j], $"mode {j + 1}");
        }
    }

    [Fact]
    public void UniformFixedFreeChain_AutoLaidOut_DrawnDisplacementsMatchClosedFormShapes()
    {
        // Fixed–free chain of 3 equal masses and springs: φ_j(i) ∝ sin(i(2j−1)π/(2n+1)) (classical chain result, common
        // practice; REFERENCES.md §2 lists {1, 1.8019, 2.2470}, {1, 0.4450, −0.8019}, {1, −1.2470, 0.5550}).
        var document = Repository.UniformChain(3, 2.0, 500.0);
        var report = ReportBuilder.Build(document, Options);
        for (var j = 1; j <= 3; j++)
        {
            var shape = Enumerable.Range(1, 3).Select(i => Math.Sin(i * (2 * j - 1) * Math.PI / 7)).ToArray();
            var peak = shape.MaxBy(Math.Abs);
            var root = SvgAssert.WellFormedWithViewBox(report.Figures.Single(f => f.Name == $"mode-0{j}").Svg(true));
            AssertDisplacements(root, ["m1", "m2", "m3"], [.. shape.Select(v => v / peak)], $"mode {j}");
        }
    }

    [Fact]
    public void ModeFigure_AmplitudeLabelsAreTheNormalisedShape()
    {
        var report = ReportBuilder.Build(Repository.Parse(RaoExample), Options);
        var root = XDocument.Parse(report.Figures.Single(f => f.Name == "mode-02").Svg(true)).Root!;
        var labels = root.Descendants(Repository.Svg + "text").Where(t => (string?)t.Attribute("class") == "amplitude")
            .ToDictionary(t => (string)t.Attribute("data-mass")!, t => t.Value);
        Assert.Equal("−0.200", labels["m1"]);
        Assert.Equal("+1.000", labels["m2"]);
    }

    [Fact]
    public void ReportHasOneFigurePerModeNamedAfterTheMode()
    {
        var report = ReportBuilder.Build(Repository.UniformChain(5, 1, 1000), Options);
        Assert.Equal(["mode-01", "mode-02", "mode-03", "mode-04", "mode-05"], report.Figures.Where(f => f.Kind == "mode").Select(f => f.Name));
        Assert.Equal(5, Regex.Matches(report.Html, "<figure class=\"figure mode-figure\"").Count);
    }

    [Fact]
    public void MaxModes_LimitsTableFiguresAndJson()
    {
        var report = ReportBuilder.Build(Repository.UniformChain(30, 1, 1000), Options with { MaxModes = 4 });
        Assert.Equal(4, report.Figures.Count(f => f.Kind == "mode"));
        using var json = System.Text.Json.JsonDocument.Parse(report.Json.ToArray());
        Assert.Equal(4, json.RootElement.GetProperty("modes").GetProperty("modes").GetArrayLength());
    }

    [Fact]
    public void EffectiveMassChart_IsWellFormedWithUniqueIdsAndUnitLabels()
    {
        var report = ReportBuilder.Build(Repository.Parse(RaoExample), Options);
        var chart = report.Figures.OfType<ChartFigure>().Single();
        var root = SvgAssert.WellFormedWithViewBox(chart.Svg(true));
        var texts = SvgAssert.Texts(root);
        Assert.Contains("Mode number (–)", texts);
        Assert.Contains("Effective modal mass (% of total)", texts);
        // Ids are prefixed with the figure name so several charts can share one HTML page.
        Assert.All(root.DescendantsAndSelf().Attributes("id"), a => Assert.StartsWith("effective-mass-", a.Value, StringComparison.Ordinal));
        Assert.DoesNotContain(root.Descendants(Repository.Svg + "text").Attributes("x"), a => a.Value.TrimEnd().EndsWith(',')); // a trailing separator breaks some browsers
    }

    /// <summary>Deformed minus undeformed block centre of every mass equals shape × (stated shape scale) × (drawing scale), across the chain.</summary>
    internal static void AssertDisplacements(XElement root, IReadOnlyList<string> masses, IReadOnlyList<double> normalisedShape, string what)
    {
        var pxPerM = double.Parse((string)root.Attribute("data-px-per-m")!, CultureInfo.InvariantCulture);
        var scale = double.Parse((string)root.Attribute("data-shape-scale-m")!, CultureInfo.InvariantCulture);
        var vertical = (string)root.Attribute("data-axis")! == "vertical";

        // The scale written for the reader is the one the drawing uses.
        var note = SvgAssert.Texts(root).Single(t => t.StartsWith("Shape scale:", StringComparison.Ordinal));
        var stated = Regex.Match(note, @"1 is drawn as ([0-9.eE+-]+) m of the drawing");
        Assert.True(stated.Success, note);
        NumericAssert.Close(scale, double.Parse(stated.Groups[1].Value, CultureInfo.InvariantCulture), Tolerance.Rel(1e-12), $"{what}: stated scale");
        var bar = SvgAssert.PathPoints(root.Descendants(Repository.Svg + "path").Single(p => (string?)p.Attribute("class") == "scale-bar"));
        NumericAssert.Close(scale * pxPerM, bar[2].X - bar[1].X, Tolerance.Abs(2e-3), $"{what}: scale bar length (px)");

        XElement Block(string mass, string state) => root.Descendants(Repository.Svg + "path")
            .Single(p => (string?)p.Attribute("class") == "mass " + state && (string?)p.Attribute("data-mass") == mass);
        for (var i = 0; i < masses.Count; i++)
        {
            var rest = SvgAssert.Centre(Block(masses[i], "undeformed"));
            var moved = SvgAssert.Centre(Block(masses[i], "deformed"));
            var expected = normalisedShape[i] * scale * pxPerM;
            // Coordinates are written with three decimals: 2e-3 px covers the rounding of a centre.
            var across = vertical ? moved.X - rest.X : rest.Y - moved.Y;
            var along = vertical ? moved.Y - rest.Y : moved.X - rest.X;
            NumericAssert.Close(expected, across, Tolerance.Abs(2e-3), $"{what}: {masses[i]} displacement across the chain (px)");
            NumericAssert.Close(0, along, Tolerance.Abs(2e-3), $"{what}: {masses[i]} displacement along the chain (px)");
        }
    }
}
