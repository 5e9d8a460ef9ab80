using System.Text.Json;
using System.Text.RegularExpressions;

namespace ModalChain.Reports.Tests.Sections;

/// <summary>The criteria section: present only with criteria, reserves worked by hand, numbers as <c>modalchain check</c> writes them.</summary>
public sealed class CriteriaSectionTests
{
    private static readonly ReportOptions Options = new("test", DateTimeOffset.UnixEpoch);

    // f_n = √(k/m)/2π = 10 Hz (m = 100 kg, k = 394784.176 N/m). Speed 600 rpm = 10 Hz, margin 20 %:
    // order 1 excites 10 Hz, band 8–12 Hz: the mode sits at the centre and must move 20 % to reach an edge (reserve −20 %);
    // order 2 excites 20 Hz, band 16–24 Hz: separation |10 − 20|/20 = 50 %, reserve (16 − 10)/10 = +60 % (worked by hand).
    private const string Model = """
        title: separation worked by hand
        masses: {m: 100 kg}
        springs: {k: {between: [ground, m], stiffness: 394784.176 N/m}}
        criteria:
          separation: {margin: 20 %, speeds: [600 rpm], orders: [1, 2]}
        """;

    [Fact]
    public void Separation_ReservesMatchTheHandCalculation()
    {
        var html = ReportBuilder.Build(Repository.Parse(Model), Options).Html;
        var rows = Regex.Matches(html, "<tr><td class=\"num\">600.0</td><td class=\"num\">(\\d)</td>.*?</tr>").Select(m => m.Value).ToArray();
        Assert.Equal(2, rows.Length);
        Assert.Contains("<td class=\"num\">0.0</td><td class=\"num\">−20.0</td><td>FAIL</td>", rows[0], StringComparison.Ordinal);
        Assert.Contains("<td class=\"num\">50.0</td><td class=\"num\">+60.0</td><td>pass</td>", rows[1], StringComparison.Ordinal);
        Assert.Contains("verdict fail", html, StringComparison.Ordinal);
    }

    [Fact]
    public void ResultsJson_HoldsTheCheckObject()
    {
        using var json = JsonDocument.Parse(ReportBuilder.Build(Repository.Parse(Model), Options).Json.ToArray());
        var criteria = json.RootElement.GetProperty("criteria");
        Assert.False(criteria.GetProperty("passes").GetBoolean());
        Assert.True(criteria.TryGetProperty("separation", out _));
    }

    [Fact]
    public void ModelWithoutCriteria_HasNoCriteriaSection() =>
        Assert.DoesNotContain(ReportBuilder.Build(Repository.UniformChain(2, 1, 100), Options).Sections, s => s.Key == "criteria");

    [Fact]
    public void FloorCurveAndMachineZone_AreListedWithRmsVelocityAndReserve()
    {
        // m = 100 kg at f_n = 10 Hz with 5 % damping, 10 N at 20 Hz: |V| = ωF/|k − mω² + icω| (REFERENCES.md §4);
        // one component, in the 20 Hz band (17.8–22.4 Hz).
        const string model = """
            title: named velocity criteria
            masses: {m: 100 kg}
            springs: {k: {between: [ground, m], stiffness: 394784.176 N/m}}
            damping: {modal: 5 %}
            loads:
              shaker: {kind: force, at: m, amplitude: 10 N, speed: 20 Hz}
            criteria:
              machine-zones:
                - {at: m, class: medium-rigid, zone: A}
              floor-curves:
                - {at: m, curve: VC-A}
            """;
        var html = ReportBuilder.Build(Repository.Parse(model), Options).Html;
        Assert.Contains("Floor curve VC-A at m: one-third-octave r.m.s. velocity", html, StringComparison.Ordinal);
        Assert.Contains("Value (&#181;m/s r.m.s.)", html, StringComparison.Ordinal);
        Assert.Contains("Value (mm/s r.m.s.)", html, StringComparison.Ordinal);
        double k = 394784.176, m = 100, w = 2 * Math.PI * 20, c = 2 * 0.05 * Math.Sqrt(k * m);
        var vRms = w * 10 / Math.Sqrt(Math.Pow(k - m * w * w, 2) + Math.Pow(c * w, 2)) / Math.Sqrt(2);
        var reserve = (50e-6 - vRms) / 50e-6;
        Assert.True(reserve < 0, "the hand calculation gives a failing band");
        var row = Regex.Match(html, "<tr><td class=\"num\">20(?:\\.0*)?</td><td class=\"num\">([0-9.]+)</td>").Groups[1].Value;
        ModalChain.TestSupport.NumericAssert.Close(vRms * 1e6, double.Parse(row, System.Globalization.CultureInfo.InvariantCulture), ModalChain.TestSupport.Tolerance.Rel(1e-3), "band level (µm/s), printed digits");
        Assert.Contains("verdict fail", html, StringComparison.Ordinal);
    }
}
