using System.Globalization;
using System.Text.Json;
using System.Text.RegularExpressions;
using ModalChain.Reports.Sections;
using ModalChain.TestSupport;

namespace ModalChain.Reports.Tests.Sections;

/// <summary>The harmonic-response section: present only when asked for, charts with units and markers, peak against the SDOF closed form.</summary>
public sealed class HarmonicSectionTests
{
    private static readonly ReportOptions Options = new("test", DateTimeOffset.UnixEpoch);

    // SDOF: m = 100 kg, k = 3.947842e5 N/m (f_n = 10 Hz), ζ = 5 % modal, F = 1 kN at 12 Hz running speed.
    // Peak dynamic amplification 1/(2ζ√(1−ζ²)) = 10.01252 at r = √(1−2ζ²) (standard SDOF result, e.g. Rao, Mechanical
    // Vibrations, ch. 3; values recomputed, attribution from memory: REFERENCES.md §4).
    private const string Sdof = """
        title: single mass under a harmonic force
        masses: {m: 100 kg}
        springs: {k: {between: [ground, m], stiffness: 394784.176 N/m}}
        damping: {modal: 5 %}
        loads:
          shaker: {kind: force, at: m, amplitude: 1 kN, speed: 12 Hz}
        harmonic:
          frequencies: {from: 1 Hz, to: 40 Hz, points: 400, spacing: log}
          refine: true
        """;

    [Fact]
    public void ModelWithoutHarmonicSection_HasNoHarmonicSectionOrKey()
    {
        var report = ReportBuilder.Build(Repository.UniformChain(2, 1, 100), Options);
        Assert.DoesNotContain(report.Sections, s => s.Key == "harmonic");
        using var json = JsonDocument.Parse(report.Json.ToArray());
        Assert.False(json.RootElement.TryGetProperty("harmonic", out _));
    }

    [Fact]
    public void SdofSweep_ChartHasUnitsMarkersAndTheClosedFormPeak()
    {
        var report = ReportBuilder.Build(Repository.Parse(Sdof), Options);
        Assert.Contains(report.Sections, s => s.Key == "harmonic");
        var chart = report.Figures.Single(f => f.Name == "harmonic-m");
        var texts = SvgAssert.Texts(SvgAssert.WellFormedWithViewBox(chart.Svg(true)));
        Assert.Contains("Frequency (Hz)", texts);
        Assert.Contains("Displacement amplitude (mm peak)", texts);
        Assert.Contains("Phase (°)", texts);
        // Natural frequency and running speed are marked by vertical lines, each named by a label placed beside it (text in the SVG).
        var markers = ((ModalChain.Reports.Figures.ChartFigure)chart).Model.Annotations.OfType<OxyPlot.Annotations.LineAnnotation>().ToArray();
        Assert.Contains(markers, a => Math.Abs(a.X - 10.0) < 1e-6);
        Assert.Contains(markers, a => a.X == 12.0);
        Assert.Contains("f1 10.00 Hz", texts);
        Assert.Contains("720.0 rpm", texts);

        var label = texts.Single(t => t.StartsWith("peak ", StringComparison.Ordinal));
        var match = Regex.Match(label, @"^peak ([0-9.]+) mm at ([0-9.]+) Hz$");
        Assert.True(match.Success, label);
        var staticMm = 1000.0 / 394784.176 * 1e3;
        // The sweep is refined around f_n; half-a-percent covers the grid and the four printed digits.
        NumericAssert.Close(10.01252 * staticMm, double.Parse(match.Groups[1].Value, CultureInfo.InvariantCulture), Tolerance.Rel(5e-3), "peak displacement (mm)");
        NumericAssert.Close(10 * Math.Sqrt(1 - 2 * 0.05 * 0.05), double.Parse(match.Groups[2].Value, CultureInfo.InvariantCulture), Tolerance.Rel(5e-3), "peak frequency (Hz)");
    }

    [Fact]
    public void SdofSweep_OperatingPointTableMatchesClosedForm()
    {
        var report = ReportBuilder.Build(Repository.Parse(Sdof), Options);
        // r = 1.2: D = 1/√((1 − 1.44)² + (2·0.05·1.2)²) = 2.191 (closed form above).
        var r = 1.2;
        var d = 1 / Math.Sqrt(Math.Pow(1 - r * r, 2) + Math.Pow(2 * 0.05 * r, 2));
        var expectedMm = d * 1000.0 / 394784.176 * 1e3;
        var row = Regex.Match(report.Html, "At the running speed 720.0 rpm.*?<tr><td>m</td><td class=\"num\">([0-9.]+)</td>", RegexOptions.Singleline);
        Assert.True(row.Success, "operating-point table not found");
        NumericAssert.Close(expectedMm, double.Parse(row.Groups[1].Value, CultureInfo.InvariantCulture), Tolerance.Rel(5e-4), "displacement at 12 Hz (mm)");
    }

    [Fact]
    public void ResultsJson_HoldsTheHarmonicCommandObject()
    {
        var report = ReportBuilder.Build(Repository.Parse(Sdof), Options);
        using var json = JsonDocument.Parse(report.Json.ToArray());
        var harmonic = json.RootElement.GetProperty("harmonic");
        foreach (var key in new[] { "frequencies_hz", "responses", "reactions", "peaks", "operating_points" })
            Assert.True(harmonic.TryGetProperty(key, out _), $"results.json harmonic object lacks '{key}'");
        Assert.Equal(harmonic.GetProperty("frequencies_hz").GetArrayLength(), harmonic.GetProperty("responses")[0].GetProperty("magnitude").GetArrayLength());
    }

    [Fact]
    public void FigureName_IsAPlainFileStem() => Assert.Equal("harmonic-deck-2", HarmonicSection.FigureName("deck.2"));

    [Fact]
    public void WithAFloorCriterion_AVelocityChartIsDrawn_WithTheClosedFormVelocityPeak()
    {
        // Velocity resonance of a viscously damped SDOF: |V| = ωF/|k − mω² + icω| is largest at ω = ω_n, where it is F/c
        // (REFERENCES.md §4 closed form; c = 2ζ√(km) = 628.32 N·s/m, so 1591.5 mm/s at 10 Hz).
        var withCriterion = Sdof + "\ncriteria:\n  floor-curves:\n    - {at: m, curve: VC-A}\n";
        var report = ReportBuilder.Build(Repository.Parse(withCriterion), Options);
        Assert.Contains(report.Figures, f => f.Name == "harmonic-m");
        var chart = report.Figures.Single(f => f.Name == "harmonic-m-velocity");
        var texts = SvgAssert.Texts(SvgAssert.WellFormedWithViewBox(chart.Svg(true)));
        Assert.Contains("Velocity amplitude (mm/s peak)", texts);
        var match = Regex.Match(texts.Single(t => t.StartsWith("peak ", StringComparison.Ordinal)), @"^peak ([0-9.]+) mm/s at ([0-9.]+) Hz$");
        Assert.True(match.Success);
        var c = 2 * 0.05 * Math.Sqrt(394784.176 * 100);
        NumericAssert.Close(1000 / c * 1e3, double.Parse(match.Groups[1].Value, CultureInfo.InvariantCulture), Tolerance.Rel(2e-3), "peak velocity (mm/s), F/c");
        NumericAssert.Close(10, double.Parse(match.Groups[2].Value, CultureInfo.InvariantCulture), Tolerance.Rel(5e-3), "at f_n (Hz)");
        // The curve is drawn as √2 × 50 µm/s = 0.0707 mm/s in every band from 8 to 40 Hz (REFERENCES.md §8).
        var series = ((ModalChain.Reports.Figures.ChartFigure)chart).Model.Series.OfType<OxyPlot.Series.LineSeries>().Single(l => l.Title.StartsWith("VC-A", StringComparison.Ordinal));
        Assert.Contains(series.Points, p => Math.Abs(p.X - 20) < 3 && Math.Abs(p.Y - 50e-3 * Math.Sqrt(2)) < 1e-12);
    }

    [Fact]
    public void WithoutVelocityCriteria_OnlyDisplacementIsCharted()
    {
        var report = ReportBuilder.Build(Repository.Parse(Sdof), Options);
        Assert.DoesNotContain(report.Figures, f => f.Name.EndsWith("-velocity", StringComparison.Ordinal));
    }
}
