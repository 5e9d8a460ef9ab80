using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;
using ModalChain.Core.Model;
using ModalChain.Reports.Drawing;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Html;
using ModalChain.Reports.Pdf;
using ModalChain.Reports.Sections;
using ModalChain.TestSupport;

namespace ModalChain.Reports.Tests.Sections;

/// <summary>Large models: which view the modes section picks, the top-N contributor tables, and the bar charts of models without positions.</summary>
public sealed class LargeModelModesTests
{
    private static readonly ReportOptions Options = new("test", new DateTimeOffset(2026, 1, 2, 3, 4, 5, TimeSpan.Zero));

    /// <summary>A fixed-free chain of <paramref name="n"/> masses and springs with a seeded ±30 % spread, without drawing positions.</summary>
    private static string RandomChain(int n, int seed)
    {
        var random = new Random(seed);
        var yaml = new StringBuilder("title: random chain\nmasses:\n");
        for (var i = 1; i <= n; i++) yaml.Append(CultureInfo.InvariantCulture, $"  m{i}: {100 * (0.7 + 0.6 * random.NextDouble()):F4} kg\n");
        yaml.Append("springs:\n");
        for (var i = 1; i <= n; i++)
            yaml.Append(CultureInfo.InvariantCulture, $"  k{i}: {{between: [{(i == 1 ? "ground" : "m" + (i - 1))}, m{i}], stiffness: {2e5 * (0.7 + 0.6 * random.NextDouble()):F4} N/m}}\n");
        return yaml.ToString();
    }

    private static (ReportContext Context, ModesSection Section, HtmlWriter Html) Written(string yaml)
    {
        var context = new ReportContext(Repository.Parse(yaml), Options);
        var section = (ModesSection)ModesSection.Create(context)!;
        var html = new HtmlWriter();
        section.WriteHtml(html);
        return (context, section, html);
    }

    [Fact]
    public void View_FollowsTheSizeAndTheLayoutOfTheModel()
    {
        Assert.Equal(ModeView.Schematic, ModesSection.ViewOf(Repository.UniformChain(5, 10, 1000).Network));
        Assert.Equal(ModeView.Schematic, ModesSection.ViewOf(Repository.UniformChain(ModesSection.LargeModelMasses, 10, 1000).Network));
        Assert.Equal(ModeView.LargestMotions, ModesSection.ViewOf(Repository.UniformChain(ModesSection.LargeModelMasses + 1, 10, 1000).Network));
        Assert.Equal(ModeView.Map, ModesSection.ViewOf(Repository.Load("models/archive-mezzanine-grid.yaml").Network));
        Assert.Equal(ModeView.Schematic, ModesSection.ViewOf(Repository.Load("models/chiller-deck.yaml").Network));
        var chain = Repository.Parse("title: c\nrepeat:\n  r: {kind: chain, count: 80, mass: 10 kg, stiffness: 1 kN/mm, from: ground, spacing: 1 m}\n");
        Assert.Equal(ModeView.Map, ModesSection.ViewOf(chain.Network));
    }

    [Fact]
    public void Largest_ListsTheNLargestInOrder_AsAFullSortDoes()
    {
        // Identity against a full sort (ties broken by the lower index, as the stable sort below does).
        var random = new Random(20261202);
        for (var trial = 0; trial < 50; trial++)
        {
            var keys = Enumerable.Range(0, 1 + random.Next(300)).Select(_ => Math.Round(random.NextDouble(), 2)).ToArray();
            var count = random.Next(1, 15);
            var sorted = keys.Select((k, i) => (k, i)).ToList();
            sorted.Sort((a, b) => b.k != a.k ? b.k.CompareTo(a.k) : a.i.CompareTo(b.i));
            Assert.Equal(sorted.Take(count).Select(p => p.i), ModesSection.Largest(keys, count));
        }
    }

    [Fact]
    public void ContributorTables_ListTheTopTenOfEachMode_WithTopNOfMInTheCaption()
    {
        // 80 masses without positions (> 60): one table per mode under its figure. Identity against a full sort of the
        // modal result: |φ| and kinetic-energy share per mass, strain-energy share per spring.
        var (context, _, html) = Written(RandomChain(80, 11));
        var result = context.Modal;
        var names = result.Network.Masses.Select(m => m.Name).ToArray();
        var springs = result.Network.Springs.Select(s => s.Name).ToArray();
        var tables = html.Blocks.OfType<TableBlock>().Where(t => t.Caption?.StartsWith("Mode ", StringComparison.Ordinal) == true).ToArray();
        Assert.Equal(result.Modes.Length, tables.Length);
        foreach (var (mode, table) in result.Modes.Zip(tables))
        {
            Assert.StartsWith(string.Create(CultureInfo.InvariantCulture, $"Mode {mode.Number} ("), table.Caption);
            Assert.Contains("top 10 of 80 masses", table.Caption, StringComparison.Ordinal);
            Assert.Contains("top 10 of 80 springs", table.Caption, StringComparison.Ordinal);
            Assert.Equal(10, table.Rows.Length);
            string[] Top(IEnumerable<double> values, string[] labels) =>
                [.. values.Select((v, i) => (v, i)).OrderByDescending(p => p.v).Take(10).Select(p => labels[p.i])];
            Assert.Equal(Top(mode.Shape.Select(Math.Abs), names), table.Rows.Select(r => r[1]));
            Assert.Equal(Top(mode.KineticEnergyShare, names), table.Rows.Select(r => r[3]));
            Assert.Equal(Top(mode.StrainEnergyShare, springs), table.Rows.Select(r => r[5]));
            var peak = mode.Shape.Max(Math.Abs);
            foreach (var row in table.Rows)
                NumericAssert.Close(mode.Shape[Array.IndexOf(names, row[1])] / peak, double.Parse(row[2].Replace('−', '-'), CultureInfo.InvariantCulture), Tolerance.Abs(5e-4), row[1]);
            // The table follows the mode's own figure.
            var blocks = html.Blocks;
            var at = blocks.IndexOf(table);
            Assert.Equal(ModesSection.FigureName(mode.Number), Assert.IsType<FigureBlock>(blocks[at - 1]).Figure.Name);
        }
    }

    [Fact]
    public void SmallChain_KeepsItsSchematicsAndHasNoContributorTables()
    {
        var (_, section, html) = Written(RandomChain(8, 3));
        Assert.Equal(ModeView.Schematic, section.View);
        Assert.DoesNotContain(html.Blocks.OfType<TableBlock>(), t => t.Caption?.Contains("top 10", StringComparison.Ordinal) == true);
    }

    [Fact]
    public void ModelWithoutPositions_BarsShowTheTwentyLargestMotionsToScale()
    {
        // Identity: the bars name the 20 masses of largest |φ| (a full sort of the modal result), largest first, each as
        // long as its normalised value times the stated half-bar length, to the side of its sign.
        var (context, section, _) = Written(RandomChain(150, 5));
        Assert.Equal(ModeView.LargestMotions, section.View);
        var result = context.Modal;
        foreach (var mode in result.Modes.Take(5))
        {
            var figure = (SchematicFigure)section.Figures.Single(f => f.Name == ModesSection.FigureName(mode.Number));
            var root = SvgAssert.WellFormedWithViewBox(figure.Svg(true));
            Assert.Equal("largest-motions", (string)root.Attribute("data-view")!);
            var halfBar = double.Parse((string)root.Attribute("data-half-bar-px")!, CultureInfo.InvariantCulture);
            var shape = result.ShapeByMass(mode);
            var peak = shape.Max(Math.Abs);
            var expected = shape.Select((v, i) => (v, i)).OrderByDescending(p => Math.Abs(p.v)).Take(20).ToArray();
            var bars = root.Descendants(Repository.Svg + "path").Where(p => (string?)p.Attribute("class") == "motion-bar").ToArray();
            Assert.Equal(expected.Select(p => result.Network.Masses[p.i].Name), bars.Select(b => (string)b.Attribute("data-mass")!));
            foreach (var (bar, (v, _)) in bars.Zip(expected))
            {
                var m = Regex.Match((string)bar.Attribute("d")!, @"^M(-?[\d.]+) (-?[\d.]+)h([\d.]+)");
                var width = double.Parse(m.Groups[3].Value, CultureInfo.InvariantCulture);
                NumericAssert.Close(Math.Abs(v / peak) * halfBar, width, Tolerance.Abs(2e-3), $"bar of mode {mode.Number}");
                Assert.Equal(DivergingScale.ColourOf(v / peak), (string)bar.Attribute("fill")!);
            }
            Drawing.ShapeMapFigureTests.AssertNoOverlap(figure);
        }
    }

    [Fact]
    public void LargeGrid_ModelTablesGroupEqualValues_AndTheCountsAddUpToTheModel()
    {
        // Identity: a 12 x 12 grid with one heavier mass has two mass groups (143 + 1) and one spring group of
        // 2·12·11 + 4·12 = 312 springs; the counts in the tables add up to the model's.
        var yaml = "title: g\nrepeat:\n  g: {kind: grid, rows: 12, columns: 12, spacing: 0.5 m, mass: 45 kg, stiffness: 12 kN/mm, support: edges}\n"
            + "masses:\n  pump: {mass: 300 kg, at: [2.6, -2.4]}\nsprings:\n  pump-mounts: {between: [g-5-6, pump], stiffness: 2 kN/mm}\n";
        var context = new ReportContext(Repository.Parse(yaml), Options);
        var html = new HtmlWriter();
        ModelSummarySection.Create(context)!.WriteHtml(html);
        var tables = html.Blocks.OfType<TableBlock>().ToArray();
        var masses = tables.Single(t => t.Caption!.StartsWith("Masses: 145 in 2 groups", StringComparison.Ordinal));
        Assert.Equal(["144", "1"], masses.Rows.Select(r => r[1]));
        var springs = tables.Single(t => t.Caption!.StartsWith("Springs: 313 in 2 groups", StringComparison.Ordinal));
        Assert.Equal(["312", "1"], springs.Rows.Select(r => r[1]));
        Assert.Equal("pump-mounts", springs.Rows[1][2]);
    }

    [Fact]
    public void HundredByHundredGrid_WritesMapsOfAFewHundredKilobytes()
    {
        // 10,000 masses, the lowest 3 modes: the maps stay compact (compound paths per colour step, touching cells merged).
        var document = Repository.Parse("title: slab\nrepeat:\n  s: {kind: grid, rows: 100, columns: 100, spacing: 0.5 m, mass: 45 kg, stiffness: 12 kN/mm, support: edges}\n");
        var context = new ReportContext(document, Options with { MaxModes = 3 });
        var section = (ModesSection)ModesSection.Create(context)!;
        Assert.Equal(ModeView.Map, section.View);
        foreach (var figure in section.Figures.Skip(1))
        {
            var svg = figure.Svg(true);
            Assert.True(svg.Length < 400_000, $"{figure.Name} is {svg.Length} characters");
            var root = SvgAssert.WellFormedWithViewBox(svg);
            Assert.Equal("10000", (string)root.Attribute("data-masses")!);
        }
        // The first mode of a uniform square grid held at its edges is largest at the middle (common practice):
        // with 100 x 100 masses the four middle ones tie.
        var ring = SvgAssert.WellFormedWithViewBox(section.Figures[1].Svg(true)).Descendants(Repository.Svg + "circle").Single();
        Assert.Contains((string)ring.Attribute("data-mass")!, new[] { "s-50-50", "s-50-51", "s-51-50", "s-51-51" });
    }
}
