using System.Text.Json;
using ModalChain.Reports.Sections;

namespace ModalChain.Reports.Tests.Sections;

/// <summary>The harmonic section of a model with load cases: a chart per case and output, the combination with its rule.</summary>
public sealed class HarmonicCaseSectionTests
{
    private static readonly ReportOptions Options = new("test", DateTimeOffset.UnixEpoch);

    private const string TwoMachines = """
        title: two machines on one deck
        masses:
          deck: {mass: 2000 kg}
          fan: {mass: 300 kg}
        springs:
          legs: {between: [ground, deck], stiffness: 40 kN/mm}
          mounts: {between: [deck, fan], stiffness: 1.5 kN/mm}
        damping: {modal: 3 %}
        loads:
          fan-unbalance: {kind: unbalance, at: fan, mass-radius: 2 kg*mm, speed: 1480 rpm}
          pump-force: {kind: force, at: deck, amplitude: 120 N, speed: 49 Hz}
        load-cases:
          fan: [fan-unbalance]
          pump: [pump-force]
        harmonic:
          combine: rms
          frequencies: {from: 1 Hz, to: 80 Hz, points: 200}
        """;

    [Fact]
    public void EachCase_IsChartedOnItsOwn_AndTheCombinationNamesItsRule()
    {
        var report = ReportBuilder.Build(Repository.Parse(TwoMachines), Options);
        var section = Assert.Single(report.Sections, s => s.Key == "harmonic");
        Assert.IsType<HarmonicCaseSection>(section);
        var names = report.Figures.Select(f => f.Name).ToArray();
        foreach (var expected in new[] { "harmonic-fan-deck", "harmonic-fan-fan", "harmonic-pump-deck", "harmonic-pump-fan" })
            Assert.Contains(expected, names);
        Assert.Equal(names.Length, names.Distinct().Count());

        var html = new ModalChain.Reports.Html.HtmlWriter();
        section.WriteHtml(html);
        var text = html.ToString();
        Assert.Contains("Load case fan", text);
        Assert.Contains("Load case pump", text);
        Assert.Contains("combined at their running speeds (rms rule)", text);

        using var json = JsonDocument.Parse(report.Json.ToArray());
        var harmonic = json.RootElement.GetProperty("harmonic");
        Assert.Equal(2, harmonic.GetProperty("cases").GetArrayLength());
        Assert.Equal("rms", harmonic.GetProperty("combination").GetProperty("rule").GetString());
    }
}
