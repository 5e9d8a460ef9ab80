using ModalChain.Reports.Figures;

namespace ModalChain.Reports.Tests.Sections;

/// <summary>
/// Every label of the harmonic, transient, speed-frequency and effective-mass charts of every example model is text, lies inside the
/// figure and the clip rectangle it is drawn in, and overlaps no other text of the chart (measured with the font that draws
/// it); a label left out for want of room is named in the caption. The same properties the absorber chart's test checks.
/// </summary>
public sealed class ChartLabelPlacementTests
{
    private static readonly ReportOptions Plain = new("test", DateTimeOffset.UnixEpoch);

    public static IEnumerable<object[]> Models() => Repository.ModelFiles();

    [Theory]
    [MemberData(nameof(Models))]
    public void HarmonicCharts_LabelsAreTextInsideThePlotAndApart(string model) =>
        Check(model, "harmonic-", "harmonic", "peak ");

    [Theory]
    [MemberData(nameof(Models))]
    public void TransientCharts_LabelsAreTextInsideThePlotAndApart(string model) =>
        Check(model, "transient-", "transient", "peak ");

    [Theory]
    [MemberData(nameof(Models))]
    public void SpeedFrequencyChart_LabelsAreTextInsideThePlotAndApart(string model) =>
        Check(model, "speed-frequency", "speed_frequency", " rpm");

    [Theory]
    [MemberData(nameof(Models))]
    public void EffectiveMassChart_LabelsAreTextInsideThePlotAndApart(string model) =>
        Check(model, "effective-mass", "modes", "90 % cumulative");

    private static void Check(string model, string figurePrefix, string sectionKey, string expected)
    {
        var report = ReportBuilder.Build(Repository.Load(model), Plain);
        var charts = report.Figures.OfType<ChartFigure>().Where(f => f.Name.StartsWith(figurePrefix, StringComparison.Ordinal)).ToList();
        if (charts.Count == 0)
        {
            // No chart of this kind: then the model asks for no such analysis either.
            Assert.DoesNotContain(report.Sections, s => s.Key == sectionKey);
            return;
        }
        foreach (var figure in charts)
        {
            var labels = figure.Model.Annotations.OfType<CurveLabel>().ToList();
            Assert.All(labels, l => Assert.True(l.Placed, $"{figure.Name}: '{l.Text}' not placed but still on the chart"));
            // The kind's main label is there, or the caption says a label was left out.
            Assert.True(labels.Any(l => (l.Text ?? "").Contains(expected, StringComparison.Ordinal)) || figure.Caption.Contains("left out", StringComparison.Ordinal),
                $"{figure.Name}: no label containing '{expected}' and the caption names none left out; labels: {string.Join(" | ", labels.Select(l => l.Text))}");
            var root = SvgAssert.WellFormedWithViewBox(figure.Svg(standalone: true));
            SvgAssert.LabelsInsideAndApart(root, figure.Width, figure.Height, [.. labels.Select(l => l.Text ?? "")]);
        }
    }
}
