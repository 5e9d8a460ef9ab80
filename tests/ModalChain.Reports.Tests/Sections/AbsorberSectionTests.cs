using System.Text.Json;
using ModalChain.Core.Analyses.Absorbers;
using ModalChain.Io.Model;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Sections;
using ModalChain.TestSupport;
using OxyPlot.Annotations;
using OxyPlot.Series;

namespace ModalChain.Reports.Tests.Sections;

/// <summary>The absorber section: present only when asked for, Den Hartog's optimum on a 2-DOF primary, a well-formed response chart.</summary>
public sealed class AbsorberSectionTests
{
    private static readonly ReportOptions Plain = new("test", DateTimeOffset.UnixEpoch);

    // A 2-DOF undamped primary (deck on beams, fan on mounts); the absorber hangs on the deck and controls the mode
    // nearest 1470 rpm × {1, 2}.
    private const string Model = """
        title: absorber on a two-mass deck
        masses:
          deck: {mass: 2600 kg}
          fan: {mass: 400 kg}
        springs:
          beams: {between: [ground, deck], stiffness: 68 kN/mm}
          mounts: {between: [deck, fan], stiffness: 1.6 kN/mm}
        criteria:
          separation: {margin: 20 %, speeds: [1470 rpm], orders: [1, 2]}
        """;

    private static ReportOptions WithAbsorber(ModelDocument document, double massRatio = 0.05, bool optimal = false) => Plain with
    {
        Absorber = new AbsorberReportRequest(new AbsorberRequest("deck", massRatio, null, OperatingLoads.AbsorberExcitations(document)), optimal),
    };

    [Fact]
    public void DenHartogValues_AppearInTheSectionAndResultsJson()
    {
        // Den Hartog 1956 §3.3 [confirmed citation] (REFERENCES §3): μ = 0.05 → f = 1/(1+μ) = 0.952381,
        // ζ_a = √(3μ/(8(1+μ))) = 0.133631 referred to the absorber's own frequency. Tolerance 5e-7 absolute (printed digits).
        var document = Repository.Parse(Model);
        var report = ReportBuilder.Build(document, WithAbsorber(document));
        var section = Assert.Single(report.Sections.OfType<AbsorberSection>());
        var d = section.Tuned.Design;
        NumericAssert.Close(0.952381, d.FrequencyHz / d.ModeFrequencyHz, Tolerance.Abs(5e-7), "f = ω_a/ω_p");
        NumericAssert.Close(0.133631, d.DampingRatio, Tolerance.Abs(5e-7), "ζ_a");
        // Closed form of the 2-DOF primary (k1 = 68e6 N/m, k2 = 1.6e6 N/m, m1 = 2600 kg, m2 = 400 kg):
        // det(K − λM) = 0 gives m1 m2 λ² − (m1 k2 + m2 (k1 + k2)) λ + k1 k2 = 0. With the shape scaled to 1 at the deck,
        // x_fan = k2/(k2 − λ m2) and the modal mass at the deck is m1 + m2 x_fan² (= 1/φ_deck² with mass-normalised φ).
        const double k1 = 68e6, k2 = 1.6e6, m1 = 2600, m2 = 400;
        var b = m1 * k2 + m2 * (k1 + k2);
        var lambda = (b + Math.Sqrt(b * b - 4 * m1 * m2 * k1 * k2)) / (2 * m1 * m2);
        Assert.Equal(2, d.ModeNumber);
        NumericAssert.Close(Math.Sqrt(lambda) / (2 * Math.PI), d.ModeFrequencyHz, Tolerance.Rel(1e-9), "f_2 closed form");
        var xFan = k2 / (k2 - lambda * m2);
        NumericAssert.Close(m1 + m2 * xFan * xFan, d.ModalMass, Tolerance.Rel(1e-9), "modal mass at the deck");
        Assert.Contains("0.952381", report.Html, StringComparison.Ordinal);
        Assert.Contains("0.133631", report.Html, StringComparison.Ordinal);
        Assert.Contains("c/(2√(k·m))", System.Net.WebUtility.HtmlDecode(report.Html), StringComparison.Ordinal);
        Assert.Contains("absorber-mistuning", report.Html, StringComparison.Ordinal);
        Assert.Contains(AbsorberCaution.Text, System.Net.WebUtility.HtmlDecode(report.Html), StringComparison.Ordinal);

        using var json = JsonDocument.Parse(report.Json.ToArray());
        var absorber = json.RootElement.GetProperty("absorber");
        NumericAssert.Close(0.952381, absorber.GetProperty("absorber").GetProperty("frequency_ratio").GetDouble(), Tolerance.Abs(5e-7), "json f");
        NumericAssert.Close(0.133631, absorber.GetProperty("absorber").GetProperty("damping_ratio").GetDouble(), Tolerance.Abs(5e-7), "json ζ_a");
        Assert.Equal("den-hartog", absorber.GetProperty("method").GetString());
        Assert.Equal(4, absorber.GetProperty("mistuning").GetArrayLength());
        Assert.Contains("absorber", json.RootElement.GetProperty("report").GetProperty("sections").EnumerateArray().Select(e => e.GetString()));
    }

    [Fact]
    public void ResponseChart_IsWellFormedSvg_AndItsCurveStaysBelowTheRefinedPeak()
    {
        var document = Repository.Parse(Model);
        var report = ReportBuilder.Build(document, WithAbsorber(document));
        var section = Assert.Single(report.Sections.OfType<AbsorberSection>());
        var figure = Assert.IsType<ChartFigure>(Assert.Single(section.Figures));
        Assert.Equal(AbsorberSection.FigureName, figure.Name);
        var root = SvgAssert.WellFormedWithViewBox(figure.Svg(standalone: true));
        var texts = SvgAssert.Texts(root);
        Assert.Contains(texts, t => t.Contains("Frequency (Hz)", StringComparison.Ordinal));
        Assert.Contains(texts, t => t.Contains("with absorber", StringComparison.Ordinal));
        Assert.Contains(texts, t => t.Contains("without absorber", StringComparison.Ordinal));

        // Identity: the sampled curve with the absorber never exceeds the refined worst peak over the same band, and the
        // 400-point grid comes within 1 % of it (the peaks are broad). The undamped curve without the absorber rises higher.
        var with = figure.Model.Series.OfType<LineSeries>().Single(s => s.Title == "with absorber").Points.Select(p => p.Y).Where(double.IsFinite).Max();
        var without = figure.Model.Series.OfType<LineSeries>().Single(s => s.Title == "without absorber").Points.Select(p => p.Y).Where(double.IsFinite).Max();
        var peakAfter = section.Tuned.Assessment.PeakAfter;
        Assert.True(with <= peakAfter * (1 + 1e-9), $"sampled {with} above the refined peak {peakAfter}");
        NumericAssert.Close(peakAfter, with, Tolerance.Rel(0.01), "grid max vs refined peak");
        Assert.True(without > 2 * peakAfter, $"without absorber {without}, with {peakAfter}");
        var dashed = figure.Model.Series.OfType<LineSeries>().Single(s => s.Title == "without absorber");
        Assert.NotNull(dashed.Dashes);
        Assert.Contains(report.Figures, f => f.Name == "absorber-response");
    }

    [Fact]
    public void ResponseChart_MarksTheRunningSpeedInTheBand_AndItsLabelsAreTextInsideThePlotAndApart()
    {
        // 1470 rpm = 24.5 Hz (common practice: f = n/60), near mode 2 (26.1 Hz by the closed form above), so inside the band.
        var document = Repository.Parse(Model);
        var report = ReportBuilder.Build(document, WithAbsorber(document));
        var section = Assert.Single(report.Sections.OfType<AbsorberSection>());
        var figure = Assert.IsType<ChartFigure>(Assert.Single(section.Figures));
        var (lo, hi) = section.Tuned.Assessment.BandHz;
        Assert.InRange(24.5, lo, hi);
        var markers = figure.Model.Annotations.OfType<LineAnnotation>().Where(a => a.Type == LineAnnotationType.Vertical).Select(a => a.X).ToList();
        Assert.Equal(section.Tuned.Design.ExcitationsHz.Where(f => f >= lo && f <= hi).Order(), markers.Order());
        Assert.Contains(markers, x => Math.Abs(x - 24.5) < 1e-9);
        var root = SvgAssert.WellFormedWithViewBox(figure.Svg(standalone: true));
        Assert.Contains("running speed 24.50 Hz (1470 rpm)", SvgAssert.Texts(root), StringComparer.Ordinal);
        SvgAssert.LabelsInsideAndApart(root, figure.Width, figure.Height, "with absorber", "without absorber", "running speed 24.50 Hz");
        Assert.All(figure.Model.Annotations.OfType<CurveLabel>(), l => Assert.True(l.Placed));
    }

    public static IEnumerable<object[]> LineModels() => Repository.MechanicalModelFiles()
        .Where(m => Repository.Load((string)m[0]).Network.Space == ModalChain.Core.Model.ModelSpace.Line);

    [Theory]
    [MemberData(nameof(LineModels))]
    public void EveryExampleModel_AbsorberChartLabelsAreTextInsideThePlotAndApart(string model)
    {
        // The absorber on the heaviest mass of each example (the host an engineer would try first; common practice), 5 %.
        var document = Repository.Load(model);
        var host = document.Network.Masses.MaxBy(m => m.Kilograms)!.Name;
        var options = Plain with { Absorber = new AbsorberReportRequest(new AbsorberRequest(host, 0.05, null, OperatingLoads.AbsorberExcitations(document)), false) };
        var section = Assert.Single(ReportBuilder.Build(document, options).Sections.OfType<AbsorberSection>());
        var figure = Assert.IsType<ChartFigure>(Assert.Single(section.Figures));
        var root = SvgAssert.WellFormedWithViewBox(figure.Svg(standalone: true));
        var (lo, hi) = section.Tuned.Assessment.BandHz;
        var speeds = section.Tuned.Design.ExcitationsHz.Where(f => f >= lo && f <= hi).Select(_ => "running speed").Take(1);
        SvgAssert.LabelsInsideAndApart(root, figure.Width, figure.Height, ["with absorber", "without absorber", .. speeds]);
    }

    [Fact]
    public void ChartTexts_StayTextAfterADashedLine()
    {
        // Skia's SVG device writes text drawn with a dash pattern as glyph outlines; the title is drawn after the dashed
        // curve and marker and must still be a <text> element, with no glyph outline (a path placed by a translate) left.
        var model = Charts.Create("Title after dashes", "subtitle");
        model.Axes.Add(Charts.Linear(OxyPlot.Axes.AxisPosition.Bottom, "x (–)", 0, 10));
        model.Axes.Add(Charts.Linear(OxyPlot.Axes.AxisPosition.Left, "y (–)", 0, 10));
        var dashed = new LineSeries { Title = "dashed" };
        Charts.Style(dashed, 1);
        dashed.Points.Add(new OxyPlot.DataPoint(0, 1));
        dashed.Points.Add(new OxyPlot.DataPoint(10, 9));
        model.Series.Add(dashed);
        model.Annotations.Add(new LineAnnotation { Type = LineAnnotationType.Vertical, X = 5, LineStyle = OxyPlot.LineStyle.DashDot, Text = "marker" });
        var figure = new ChartFigure("dashes", "caption", model);
        var root = SvgAssert.WellFormedWithViewBox(figure.Svg(standalone: true));
        var texts = SvgAssert.Texts(root);
        Assert.Contains("Title after dashes", texts);
        Assert.Contains("subtitle", texts);
        Assert.Contains("marker", texts);
        Assert.DoesNotContain(root.Descendants(Repository.Svg + "path"), p => (p.Attribute("transform")?.Value ?? "").StartsWith("translate(", StringComparison.Ordinal));
    }

    [Fact]
    public void WithoutTheOption_HasNoAbsorberSection()
    {
        var report = ReportBuilder.Build(Repository.Parse(Model), Plain);
        Assert.DoesNotContain(report.Sections, s => s.Key == "absorber");
        Assert.DoesNotContain(report.Figures, f => f.Name == AbsorberSection.FigureName);
        using var json = JsonDocument.Parse(report.Json.ToArray());
        Assert.False(json.RootElement.TryGetProperty("absorber", out _));
    }

    [Fact]
    public void Section_RendersUnderADecimalCommaCulture()
    {
        using var culture = new CultureScope("de-DE");
        var document = Repository.Parse(Model);
        var html = ReportBuilder.Build(document, WithAbsorber(document)).Html;
        Assert.Contains("0.133631", html, StringComparison.Ordinal);
        Assert.DoesNotContain("0,133631", html, StringComparison.Ordinal);
    }
}
