using System.Text.Json;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Sections;
using ModalChain.TestSupport;

namespace ModalChain.Reports.Tests.Sections;

/// <summary>The speed-frequency chart: present with a running speed, crossings where order × speed equals a natural frequency.</summary>
public sealed class SpeedFrequencySectionTests
{
    private static readonly ReportOptions Options = new("test", DateTimeOffset.UnixEpoch);

    // f_n = 10 Hz (m = 100 kg, k = 394784.176 N/m); order h meets it at speed f_n / h: 600 rpm (1×) and 300 rpm (2×).
    private const string Model = """
        title: one mode, two orders
        masses: {m: 100 kg}
        springs: {k: {between: [ground, m], stiffness: 394784.176 N/m}}
        criteria:
          separation: {margin: 20 %, speeds: [600 rpm], orders: [1, 2]}
        """;

    [Fact]
    public void Crossings_AreAtNaturalFrequencyOverOrder()
    {
        var report = ReportBuilder.Build(Repository.Parse(Model), Options);
        var section = Assert.IsType<SpeedFrequencySection>(report.Sections.Single(s => s.Key == "speed_frequency"));
        var crossings = section.Data.Crossings.OrderBy(c => c.Order).ToArray();
        Assert.Equal(2, crossings.Length);
        NumericAssert.Close(10.0, crossings[0].SpeedHz, Tolerance.Rel(1e-9), "1× crossing speed (Hz)");
        NumericAssert.Close(5.0, crossings[1].SpeedHz, Tolerance.Rel(1e-9), "2× crossing speed (Hz)");
        var texts = SvgAssert.Texts(SvgAssert.WellFormedWithViewBox(report.Figures.OfType<ChartFigure>().Single(f => f.Name == "speed-frequency").Svg(true)));
        Assert.Contains("Running speed (rpm)", texts);
        Assert.Contains("Frequency (Hz)", texts);
        using var json = JsonDocument.Parse(report.Json.ToArray());
        Assert.Equal(2, json.RootElement.GetProperty("speed_frequency").GetProperty("crossings").GetArrayLength());
    }

    [Fact]
    public void In3dModels_CrossingsAndFrequencyLinesNameTheMotion()
    {
        // A point mass on a z spring only, in a 3d model: bounce at 10 Hz (f = √(k/m)/2π, closed form), met by 1× at 600 rpm.
        const string model = """
            title: one bounce mode in space
            space: 3d
            masses: {m: {mass: 100 kg, at: [0, 0, 1], directions: [z]}}
            springs: {k: {between: [ground, m], stiffness: {z: 394784.176 N/m}}}
            criteria:
              separation: {margin: 20 %, speeds: [600 rpm], orders: [1]}
            """;
        var report = ReportBuilder.Build(Repository.Parse(model), Options);
        var section = Assert.IsType<SpeedFrequencySection>(report.Sections.Single(s => s.Key == "speed_frequency"));
        NumericAssert.Close(10.0, section.Data.Crossings.Single().SpeedHz, Tolerance.Rel(1e-9), "1× crossing speed (Hz)");
        var texts = SvgAssert.Texts(SvgAssert.WellFormedWithViewBox(report.Figures.OfType<ChartFigure>().Single(f => f.Name == "speed-frequency").Svg(true)));
        Assert.Contains(texts, t => t.StartsWith("mode 1 (bounce): 10", StringComparison.Ordinal));
        Assert.Contains("1 (bounce)", report.Html, StringComparison.Ordinal);
    }

    [Fact]
    public void ModelWithoutRunningSpeed_HasNoChart() =>
        Assert.DoesNotContain(ReportBuilder.Build(Repository.UniformChain(2, 1, 100), Options).Sections, s => s.Key == "speed_frequency");
}
