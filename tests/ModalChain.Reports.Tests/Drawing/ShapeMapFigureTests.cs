using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;
using System.Xml.Linq;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Reports.Drawing;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Sections;
using ModalChain.TestSupport;
using SkiaSharp;
using Point = ModalChain.Reports.Drawing.Point;

namespace ModalChain.Reports.Tests.Drawing;

/// <summary>The shape maps of large and plan-laid-out models: colours follow the shape, extremes are where the modal result puts them, nothing overlaps.</summary>
public sealed class ShapeMapFigureTests
{
    private static readonly ReportOptions Options = new("test", new DateTimeOffset(2026, 1, 2, 3, 4, 5, TimeSpan.Zero));

    /// <summary>A grid written with 'repeat' (equal masses, spring to ground at every missing neighbour of an edge mass).</summary>
    private static string Grid(int rows, int columns, double spacing = 0.5) => string.Create(CultureInfo.InvariantCulture, $"""
        title: grid {rows} x {columns}
        repeat:
          g: {"{"}kind: grid, rows: {rows}, columns: {columns}, spacing: {spacing} m, mass: 45 kg, stiffness: 12 kN/mm, support: edges{"}"}
        """);

    /// <summary>A plan grid of unequal masses and stiffnesses (seeded), every mass placed with 'at', so no mode is degenerate.</summary>
    private static string RandomPlan(int rows, int columns, int seed)
    {
        var random = new Random(seed);
        var yaml = new StringBuilder("title: random plan\nmasses:\n");
        string Name(int r, int c) => $"n{r}x{c}";
        for (var r = 0; r < rows; r++)
            for (var c = 0; c < columns; c++)
                yaml.Append(CultureInfo.InvariantCulture, $"  {Name(r, c)}: {{mass: {30 + 40 * random.NextDouble():F3} kg, at: [{0.6 * c:F2}, {-0.6 * r:F2}]}}\n");
        yaml.Append("springs:\n");
        for (var r = 0; r < rows; r++)
            for (var c = 0; c < columns; c++)
            {
                string K() => (5 + 10 * random.NextDouble()).ToString("F3", CultureInfo.InvariantCulture) + " kN/mm";
                if (c + 1 < columns) yaml.Append(CultureInfo.InvariantCulture, $"  h{r}x{c}: {{between: [{Name(r, c)}, {Name(r, c + 1)}], stiffness: {K()}}}\n");
                if (r + 1 < rows) yaml.Append(CultureInfo.InvariantCulture, $"  v{r}x{c}: {{between: [{Name(r, c)}, {Name(r + 1, c)}], stiffness: {K()}}}\n");
                if (r == 0 || c == 0) yaml.Append(CultureInfo.InvariantCulture, $"  s{r}x{c}: {{between: [ground, {Name(r, c)}], stiffness: {K()}}}\n");
            }
        return yaml.ToString();
    }

    private static (ReportContext Context, ModesSection Section) Modes(string yaml)
    {
        var context = new ReportContext(Repository.Parse(yaml), Options);
        return (context, (ModesSection)ModesSection.Create(context)!);
    }

    /// <summary>The normalised shape (max |φ| = 1, positive there) by mass name.</summary>
    private static Dictionary<string, double> NormalisedByMass(ModalResult result, Mode mode)
    {
        var (shape, _) = ModesSection.Normalised(mode with { Shape = result.ShapeByMass(mode) });
        return result.Network.Masses.Select((m, i) => (m.Name, shape[i])).ToDictionary(p => p.Name, p => p.Item2);
    }

    private static double Data(XElement e, string key) => double.Parse(e.Attribute("data-" + key)!.Value, CultureInfo.InvariantCulture);

    /// <summary>The rectangles of a compound path written as "Mx yhWvHh-Wz…".</summary>
    private static IEnumerable<Rect> Rects(XElement path)
    {
        foreach (Match m in Regex.Matches(path.Attribute("d")!.Value, @"M(-?[\d.]+) (-?[\d.]+)h(-?[\d.]+)v(-?[\d.]+)h-(-?[\d.]+)z"))
        {
            double G(int i) => double.Parse(m.Groups[i].Value, CultureInfo.InvariantCulture);
            yield return new Rect(G(1), G(2), G(1) + G(3), G(2) + G(4));
        }
    }

    /// <summary>The band whose cells cover the figure point of each mass, read back from the SVG (null when no cell covers it).</summary>
    private static Dictionary<string, int?> BandsAtMasses(XElement root, IEnumerable<(string Name, double X, double Y)> masses)
    {
        var scale = Data(root, "px-per-m");
        var ox = Data(root, "origin-x");
        var oy = Data(root, "origin-y");
        var bands = root.Descendants(Repository.Svg + "path").Where(p => (string?)p.Attribute("class") == "map-band")
            .Select(p => ((int)Data(p, "band"), (string)p.Attribute("fill")!, Rects(p).ToArray())).ToArray();
        foreach (var (band, fill, _) in bands) Assert.Equal(DivergingScale.Colours[band], fill);
        return masses.ToDictionary(m => m.Name, m =>
        {
            var p = new Point(ox + m.X * scale, oy - m.Y * scale);
            var hits = bands.Where(b => b.Item3.Any(r => r.Left <= p.X && p.X <= r.Right && r.Top <= p.Y && p.Y <= r.Bottom)).Select(b => b.Item1).ToArray();
            Assert.True(hits.Length <= 1, $"{m.Name} lies in cells of {hits.Length} bands");
            return hits.Length == 1 ? hits[0] : (int?)null;
        });
    }

    /// <summary>Each mass's cell in the map <paramref name="root"/> has the colour step of its shape value (normalised to max |φ| = 1).</summary>
    internal static void AssertColoursFollowShape(XElement root, Core.Model.Network network, IReadOnlyList<double> shapeByMass, string what)
    {
        var reference = 0;
        for (var i = 1; i < shapeByMass.Count; i++)
            if (Math.Abs(shapeByMass[i]) > Math.Abs(shapeByMass[reference])) reference = i;
        var bands = BandsAtMasses(root, network.Masses.Select(m => (m.Name, m.Position!.Value.X, m.Position.Value.Y)));
        for (var i = 0; i < shapeByMass.Count; i++)
        {
            var value = shapeByMass[i] / shapeByMass[reference];
            Assert.True(bands[network.Masses[i].Name] == DivergingScale.Band(value), $"{what}, {network.Masses[i].Name}: φ = {value}, drawn band {bands[network.Masses[i].Name]}");
        }
    }

    [Fact]
    public void ColourScale_AValueOnABandEdge_KeepsItsBandUnderRoundOff()
    {
        // Identity: ½ is the lower edge of band 12 of 16; a solver's round-off (a few ulps either side) must not move it to
        // band 11, or nodes symmetry makes equal would be drawn in two colours depending on which eigen solver ran. A step
        // a reader could see (1e-6) still changes the band.
        var edge = DivergingScale.Band(0.5);
        Assert.Equal(12, edge);
        foreach (var ulps in new[] { -8, -1, 1, 8 })
            Assert.Equal(edge, DivergingScale.Band(0.5 + ulps * Math.BitIncrement(0.5) - ulps * 0.5));
        Assert.Equal(edge, DivergingScale.Band(0.5 - 1e-13));
        Assert.Equal(11, DivergingScale.Band(0.5 - 1e-6));
        Assert.Equal(DivergingScale.BandCount / 2, DivergingScale.Band(-1e-15));
    }

    [Fact]
    public void ColourScale_BandAndColourAreMonotoneInTheValue()
    {
        // Identity: a sweep over [−1, 1] never steps back a band; luminance falls from the centre outwards on both sides
        // and the hue tells the sign (blue channel dominant below zero, red above).
        var previous = -1;
        for (var k = 0; k <= 20000; k++)
        {
            var band = DivergingScale.Band(-1 + k / 10000.0);
            Assert.True(band >= previous, $"band steps back at {-1 + k / 10000.0}");
            previous = band;
        }
        Assert.Equal(0, DivergingScale.Band(-1));
        Assert.Equal(DivergingScale.BandCount - 1, DivergingScale.Band(1));
        Assert.Equal(DivergingScale.BandCount / 2, DivergingScale.Band(0));
        var half = DivergingScale.BandCount / 2;
        for (var b = 0; b < DivergingScale.BandCount; b++)
        {
            var colour = DivergingScale.Colours[b];
            var r = int.Parse(colour.AsSpan(1, 2), NumberStyles.HexNumber, CultureInfo.InvariantCulture);
            var bl = int.Parse(colour.AsSpan(5, 2), NumberStyles.HexNumber, CultureInfo.InvariantCulture);
            Assert.True(b < half ? bl > r : r > bl, $"band {b} ({colour}) has the hue of the other sign");
        }
        for (var b = half; b + 1 < DivergingScale.BandCount; b++)
            Assert.True(DivergingScale.Luminance(DivergingScale.Colours[b + 1]) < DivergingScale.Luminance(DivergingScale.Colours[b]), $"positive band {b + 1} not darker");
        for (var b = half - 1; b > 0; b--)
            Assert.True(DivergingScale.Luminance(DivergingScale.Colours[b - 1]) < DivergingScale.Luminance(DivergingScale.Colours[b]), $"negative band {b - 1} not darker");
    }

    [Fact]
    public void LargeGrid_ColourAtEachMassIsTheBandOfItsShapeValue_AndMonotoneInIt()
    {
        // 12 x 12 = 144 masses (> 60): drawn as maps. Identity: reading each mass's cell back from the SVG gives the band
        // of its normalised shape value, so sorting masses by value never lowers the colour step.
        var (context, section) = Modes(Grid(12, 12));
        Assert.Equal(ModeView.Map, section.View);
        var result = context.Modal;
        foreach (var mode in result.Modes.Take(6))
        {
            var values = NormalisedByMass(result, mode);
            var root = SvgAssert.WellFormedWithViewBox(section.Figures.Single(f => f.Name == ModesSection.FigureName(mode.Number)).Svg(standalone: true));
            var masses = result.Network.Masses.Select(m => (m.Name, m.Position!.Value.X, m.Position.Value.Y));
            var bands = BandsAtMasses(root, masses);
            foreach (var (name, value) in values)
                Assert.True(bands[name] == DivergingScale.Band(value), $"mode {mode.Number}, {name}: φ = {value}, drawn band {bands[name]}, expected {DivergingScale.Band(value)}");
            var ordered = values.OrderBy(p => p.Value).Select(p => bands[p.Key]!.Value).ToArray();
            for (var i = 1; i < ordered.Length; i++) Assert.True(ordered[i] >= ordered[i - 1], $"mode {mode.Number}: colour not monotone in φ");
        }
    }

    [Fact]
    public void RandomPlan_ExtremeRingsAndSignMatchTheModalResult()
    {
        // Identity: the ring marked "max" sits on the mass where the normalised shape is +1 (the solver's largest |φ|,
        // positive by its sign rule) and the one marked "min" on the most negative mass; both carry their values.
        var (context, section) = Modes(RandomPlan(8, 9, 20261202));
        Assert.Equal(ModeView.Map, section.View);
        var result = context.Modal;
        foreach (var mode in result.Modes)
        {
            var values = NormalisedByMass(result, mode);
            var root = SvgAssert.WellFormedWithViewBox(section.Figures.Single(f => f.Name == ModesSection.FigureName(mode.Number)).Svg(true));
            var rings = root.Descendants(Repository.Svg + "circle").ToDictionary(c => ((string)c.Attribute("class")!).Split(' ')[1], c => c);
            var max = values.MaxBy(p => p.Value);
            Assert.Equal(max.Key, (string)rings["max"].Attribute("data-mass")!);
            NumericAssert.Close(1.0, Data(rings["max"], "value"), Tolerance.Abs(1e-12), $"mode {mode.Number} max");
            var dofIndex = result.Matrices.Dofs.IndexOf(max.Key);
            var absMax = mode.Shape.Max(Math.Abs);
            NumericAssert.Close(absMax, mode.Shape[dofIndex], Tolerance.Rel(1e-12), $"mode {mode.Number}: the ringed mass has the solver's largest |φ|, positive");
            var min = values.MinBy(p => p.Value);
            if (min.Value < 0)
            {
                Assert.Equal(min.Key, (string)rings["min"].Attribute("data-mass")!);
                NumericAssert.Close(min.Value, Data(rings["min"], "value"), Tolerance.Abs(1e-12), $"mode {mode.Number} min");
                Assert.True(mode.Shape[result.Matrices.Dofs.IndexOf(min.Key)] < 0, "the min ring's mass moves against the max one in the modal result");
            }
            else Assert.False(rings.ContainsKey("min"), $"mode {mode.Number} has no negative value but a min ring");
            Assert.Equal(max.Key, (string)root.Attribute("data-reference-mass")!);
        }
    }

    [Fact]
    public void ThreeByThreeGrid_FirstModeIsSymmetricWithTheCentreLargest()
    {
        // Closed form (common practice): with a spring k to ground at every missing neighbour, K = (k/m)(L ⊗ I + I ⊗ L)
        // with L = tridiag(−1, 2, −1) of order 3; mode (1, 1) has ω² = 2 (2 − 2 cos π/4) k/m and the shape
        // sin(πr/4) sin(πc/4): corners 1/2, edge midpoints 1/√2, centre 1.
        var (context, section) = Modes(Grid(3, 3, 1.0));
        Assert.Equal(ModeView.Map, section.View);
        var mode = context.Modal.Modes[0];
        NumericAssert.Close(Math.Sqrt(2 * (2 - 2 * Math.Cos(Math.PI / 4)) * 12e6 / 45), mode.AngularFrequency, Tolerance.Rel(1e-10), "ω1");
        var root = SvgAssert.WellFormedWithViewBox(section.Figures[1].Svg(true));
        var ring = root.Descendants(Repository.Svg + "circle").Single();
        Assert.Equal("extreme max", (string)ring.Attribute("class")!);
        Assert.Equal("g-2-2", (string)ring.Attribute("data-mass")!);
        var expected = new Dictionary<string, double>();
        for (var r = 1; r <= 3; r++)
            for (var c = 1; c <= 3; c++)
                expected[$"g-{r}-{c}"] = Math.Sin(Math.PI * r / 4) * Math.Sin(Math.PI * c / 4) / (Math.Sin(Math.PI / 2) * Math.Sin(Math.PI / 2));
        var bands = BandsAtMasses(root, context.Modal.Network.Masses.Select(m => (m.Name, m.Position!.Value.X, m.Position.Value.Y)));
        foreach (var (name, value) in expected)
            Assert.Equal(DivergingScale.Band(value), bands[name]);
        // Cells this large carry their value (two decimals): the closed form, rounded.
        var labels = root.Descendants(Repository.Svg + "text").Where(t => (string?)t.Attribute("class") == "map-value")
            .ToDictionary(t => (string)t.Attribute("data-mass")!, t => t.Value);
        foreach (var (name, value) in expected)
            Assert.Equal(ShapeMapFigure.Signed(value, 2), labels[name]);
        // Symmetry: the four corners and the four edge midpoints share one colour each.
        Assert.Single(new[] { "g-1-1", "g-1-3", "g-3-1", "g-3-3" }.Select(n => bands[n]).Distinct());
        Assert.Single(new[] { "g-1-2", "g-2-1", "g-2-3", "g-3-2" }.Select(n => bands[n]).Distinct());
    }

    [Fact]
    public void Maps_AreWellFormed_AndNoTwoLabelsOverlap()
    {
        var models = new[] { Grid(3, 3, 1.0), Grid(12, 12), RandomPlan(8, 9, 7) };
        foreach (var yaml in models)
        {
            var (_, section) = Modes(yaml);
            foreach (var figure in section.Figures.OfType<SchematicFigure>())
            {
                SvgAssert.WellFormedWithViewBox(figure.Svg(true));
                AssertNoOverlap(figure);
            }
        }
        var mezzanine = new ReportContext(Repository.Load("models/archive-mezzanine-grid.yaml"), Options);
        var mezzanineModes = (ModesSection)ModesSection.Create(mezzanine)!;
        Assert.Equal(ModeView.Map, mezzanineModes.View);
        foreach (var figure in mezzanineModes.Figures.OfType<SchematicFigure>())
        {
            SvgAssert.WellFormedWithViewBox(figure.Svg(true));
            AssertNoOverlap(figure);
        }
    }

    /// <summary>The box a text really occupies in the figures' font: its advance width, and the font's ascent and descent around the baseline.</summary>
    private static Rect Measured(TextShape text)
    {
        var typeface = SKTypeface.FromFamilyName(Scene.FontFamily, text.Bold ? SKFontStyle.Bold : SKFontStyle.Normal);
        Assert.True(typeface is not null && typeface.FamilyName == Scene.FontFamily, $"the font '{Scene.FontFamily}' is not installed (Debian: fonts-dejavu-core)");
        using var paint = new SKPaint { Typeface = typeface, TextSize = (float)text.Size };
        var width = paint.MeasureText(text.Text);
        var metrics = paint.FontMetrics;
        var left = text.Anchor switch
        {
            TextAnchor.Middle => text.At.X - width / 2,
            TextAnchor.End => text.At.X - width,
            _ => text.At.X,
        };
        return new Rect(left, text.At.Y + metrics.Ascent, left + width, text.At.Y + metrics.Descent);
    }

    /// <summary>Every text of the figure lies inside it and no two overlap, measured with the figures' font (DejaVu Sans) through SkiaSharp.</summary>
    internal static void AssertNoOverlap(SchematicFigure figure)
    {
        var boxes = Texts(figure.Scene.Shapes).Select(t => (t.Text, Box: Measured(t))).ToArray();
        for (var i = 0; i < boxes.Length; i++)
        {
            Assert.True(boxes[i].Box.Left >= 0 && boxes[i].Box.Right <= figure.Scene.Width && boxes[i].Box.Top >= 0 && boxes[i].Box.Bottom <= figure.Scene.Height,
                $"{figure.Name}: '{boxes[i].Text}' leaves the figure");
            for (var j = i + 1; j < boxes.Length; j++)
                Assert.False(boxes[i].Box.Intersects(boxes[j].Box), $"{figure.Name}: '{boxes[i].Text}' overlaps '{boxes[j].Text}'");
        }
    }

    private static IEnumerable<TextShape> Texts(IEnumerable<Shape> shapes)
    {
        foreach (var s in shapes)
        {
            if (s is TextShape t) yield return t;
            if (s is GroupShape g)
                foreach (var c in Texts(g.Children)) yield return c;
        }
    }
}
