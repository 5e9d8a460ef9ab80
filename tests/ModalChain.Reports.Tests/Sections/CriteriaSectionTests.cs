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
}
