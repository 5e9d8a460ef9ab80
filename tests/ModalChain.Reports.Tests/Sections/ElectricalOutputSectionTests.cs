using System.Text.RegularExpressions;
using ModalChain.Reports.Sections;

namespace ModalChain.Reports.Tests.Sections;

/// <summary>The report's harmonic and transient sections give the electrical side in volts and amperes.</summary>
public sealed class ElectricalOutputSectionTests
{
    private static readonly ReportOptions Options = new("test", new DateTimeOffset(2026, 12, 1, 12, 0, 0, TimeSpan.Zero));

    private static string Row(string html, string caption, string first) =>
        Regex.Match(html, Regex.Escape(caption) + ".*?<tr><td>" + Regex.Escape(first) + "</td>(.*?)</tr>", RegexOptions.Singleline) is { Success: true } m
            ? m.Groups[1].Value
            : throw new Xunit.Sdk.XunitException($"no row '{first}' under '{caption}'");

    [Fact]
    public void FloorTestModes_CountTheModesTheModelHas()
    {
        // Hand count from models/floor-shaker-test.yaml: 4 masses and the massless circuit node sensor-out are the 5
        // coordinates (the coil nodes are eliminated by their transducers, amplifier-out is held by its source); the
        // massless node is condensed, so the undamped problem has 4 modes, all shown (the report's limit is 20).
        var report = ReportBuilder.Build(Repository.Load("models/floor-shaker-test.yaml"), Options);
        Assert.Contains("lowest first: 4 of 4 modes.", report.Html);
        Assert.DoesNotContain("the report shows at most", report.Html);
    }

    [Fact]
    public void FloorTestSummary_NamesTheSourceNodeAndFindsNoLoosePart()
    {
        // From models/floor-shaker-test.yaml: ground is the one fixed support and amplifier-out the node its voltage source
        // holds; every bay is held by its beams, and the circuit nodes no inductor holds set a flux level (no rigid-body
        // mode), so no part is listed as loose.
        var report = ReportBuilder.Build(Repository.Load("models/floor-shaker-test.yaml"), Options);
        Assert.Contains("Supports</th><td>ground (fixed); amplifier-out (circuit nodes held by voltage sources)</td>", report.Html);
        Assert.Contains("Parts not held by a spring to a support</th><td>none</td>", report.Html);
    }

    [Fact]
    public void FloorTestHarmonic_HasAnElectricalTableInVoltsAndAmperes()
    {
        // models/floor-shaker-test.yaml: 1 V behind the shaker's 2 Ω coil resistance; above the shaker's suspension
        // resonance the coil barely moves, so the source current approaches 1 V / 2 Ω = 0.5 A (Ohm's law; the largest
        // amplitude over the sweep is printed to four digits, 499.8 mA at 40 Hz). The sensor's output node is not a motion row.
        var report = ReportBuilder.Build(Repository.Load("models/floor-shaker-test.yaml"), Options);
        Assert.Contains(ElectricalTables.HarmonicCaption, report.Html);
        Assert.Matches(@"<td[^>]*>current</td><td[^>]*>499\.8 mA</td>", Row(report.Html, ElectricalTables.HarmonicCaption, "source at amplifier-out"));
        Assert.Matches(@"<td[^>]*>voltage</td><td[^>]*>[0-9.]+ mV</td>", Row(report.Html, ElectricalTables.HarmonicCaption, "node sensor-out"));
        Assert.Matches(@"<td[^>]*>current</td><td[^>]*>[0-9.]+ (µ|&#181;)A</td>", Row(report.Html, ElectricalTables.HarmonicCaption, "resistor recorder-input"));
        Assert.DoesNotMatch(@"Largest response over the sweep.*?<tr><td>sensor-out</td>.*?Electrical side", report.Html.Replace("\n", " "));
        Assert.Contains("electrical nodes carry no effective mass", report.Html);
    }

    [Fact]
    public void ShakerTransient_HasAnElectricalTable_AndNamesCapacitorAndInductorEnergy()
    {
        // Common practice: a table column states its unit; in the node flux form the "kinetic" energy of the circuit is
        // its capacitors' ½Cv² and the "strain" energy its inductors' ½λ²/L, which the energy balance names.
        var document = Repository.Parse("""
            title: Bench shaker under a voltage pulse
            masses:
              table: 2 kg
            nodes: [coil-plus]
            supports:
              amplifier:
            springs:
              flexure: {between: [ground, table], stiffness: 40 kN/m}
            dampers:
              flexure-loss: {between: [ground, table], coefficient: 15 N*s/m}
              coil-resistance: {between: [amplifier, coil-plus], coefficient: 0.25 N*s/m}
            transducers:
              coil: {between: [table, ground], branch: [coil-plus, ground], force-factor: 12 T*m}
            loads:
              step: {kind: base-motion, support: amplifier, time: {kind: half-sine, amplitude: 31.4159 m/s^2, duration: 50 ms}}
            transient:
              duration: 0.2 s
              step: 0.1 ms
              loads: [step]
            """);
        var report = ReportBuilder.Build(document, Options);
        Assert.Contains(ElectricalTables.TransientCaption, report.Html);
        Assert.Matches(@"<td[^>]*>voltage</td><td[^>]*>-?[0-9.]+ m?V</td>", Row(report.Html, ElectricalTables.TransientCaption, "port of coil"));
        Assert.Matches(@"<td[^>]*>current</td><td[^>]*>-?[0-9.]+ m?A</td>", Row(report.Html, ElectricalTables.TransientCaption, "source at amplifier"));
        Assert.Matches(@"<td[^>]*>current</td><td[^>]*>-?[0-9.]+ m?A</td>", Row(report.Html, ElectricalTables.TransientCaption, "resistor coil-resistance"));
        Assert.Contains("kinetic and capacitor", report.Html);
        Assert.Contains("strain and inductor", report.Html);
    }
}
