using System.Globalization;
using System.Text.Json;
using System.Text.RegularExpressions;
using System.Xml.Linq;
using ModalChain.Core.Analyses.Circuits;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Pdf;
using ModalChain.Reports.Sections;
using ModalChain.Reports.Units;
using ModalChain.TestSupport;

namespace ModalChain.Reports.Tests.Sections;

/// <summary>The report of a circuit model: its sections, units in V, A and Ω, and its numbers against series R-L-C closed forms.</summary>
public sealed class CircuitReportTests
{
    private static readonly ReportOptions Options = new("test", new DateTimeOffset(2026, 12, 1, 12, 0, 0, TimeSpan.Zero));

    // Series R-L-C driven from ground: R = 10 Ω, L = 10 mH, C = 1 µF. Closed forms (common practice for the series resonant
    // circuit): ω₀ = 1/√(LC) = 10,000 rad/s, ζ = (R/2)√(C/L) = 0.05, Q = 1/(2ζ) = 10, and at ω₀ the reactances cancel, so the
    // impedance the source sees is Z = R = 10 Ω, purely resistive, its smallest magnitude. The sweep's 41 log-spaced points
    // (200 Hz to 20 kHz) do not include f₀ = 1591.549 Hz, so the table's minimum must be located between them.
    private const double R = 10, L = 10e-3, C = 1e-6;

    private const string SeriesRlc = """
        title: Series resonant test circuit
        circuit:
          nodes: [in, mid, out]
          resistors:
            series-r: {between: [in, mid], resistance: 10 ohm}
          inductors:
            series-l: {between: [mid, out], inductance: 10 mH}
          capacitors:
            shunt-c: {between: [out, ground], capacitance: 1 uF}
          voltage-sources:
            drive: {between: [in, ground], amplitude: 1 V, time: {kind: step, value: 1 V}}
        harmonic:
          frequencies: {from: 200 Hz, to: 20 kHz, points: 41, spacing: log}
        transient:
          duration: 10 ms
          step: 2 us

        """;

    private static Report Build() => ReportBuilder.Build(Repository.Parse(SeriesRlc, "series-rlc.yaml"), Options);

    private static DocumentSection Section(Report report, string key) => report.Document!.Sections.Single(s => s.Key == key);

    private static TableBlock Table(DocumentSection section, int index = 0) => section.Blocks.OfType<TableBlock>().ElementAt(index);

    private static double Cell(string text) =>
        double.Parse(Regex.Match(text, @"^[−-]?[0-9.]+([eE][+-]?[0-9]+)?").Value.Replace('−', '-'), CultureInfo.InvariantCulture);

    [Fact]
    public void CircuitModel_GetsTheCircuitSections_AndNoMechanicalOnes()
    {
        var report = Build();
        Assert.Equal(["circuit", "circuit_roots", "circuit_sweep", "circuit_transient"], report.Sections.Select(s => s.Key));
        Assert.Equal(["circuit", "impedance-drive", "transfer-drive", "circuit-voltages", "circuit-currents"], report.Figures.Select(f => f.Name));
        using var json = JsonDocument.Parse(report.Json.ToArray());
        var root = json.RootElement;
        Assert.Equal(["format_version", "report", "circuit", "circuit_roots", "circuit_sweep", "circuit_transient"], root.EnumerateObject().Select(p => p.Name));
        Assert.Equal("SI throughout this file (V, A, ohm, H, F, s, Hz)", root.GetProperty("report").GetProperty("units").GetString());
        Assert.Equal(10, root.GetProperty("circuit").GetProperty("resistors")[0].GetProperty("resistance_ohm").GetDouble());
        Assert.Contains("ModalChain circuit report", report.Html, StringComparison.Ordinal);
        // The tool's caution block stays, and the circuit's own caution is in the circuit section.
        Assert.Contains(System.Net.WebUtility.HtmlEncode(Core.Cautions.Text), report.Html, StringComparison.Ordinal);
        Assert.Contains(Section(report, "circuit").Blocks.OfType<ParagraphBlock>(), p => p.Text.Contains(CircuitSummarySection.CircuitCaution, StringComparison.Ordinal));
    }

    [Fact]
    public void SummaryAndSchematic_GiveValuesInOhmsHenriesFaradsAndVolts_WithPrefixes()
    {
        var report = Build();
        var elements = Table(Section(report, "circuit"), 1);
        Assert.Equal(["10 Ω", "10 mH", "1 µF", "1 V amplitude"], elements.Rows.Select(r => r[4]));
        Assert.Equal(["in", "mid", "out", "ground"], elements.Rows.Select(r => r[2]).Take(3).Append(elements.Rows[3][2]));
        var svg = SvgAssert.WellFormedWithViewBox(report.Figures.Single(f => f.Name == "circuit").Svg(true));
        var groups = svg.Descendants(Repository.Svg + "g").Where(g => ((string?)g.Attribute("class") ?? "").StartsWith("element ", StringComparison.Ordinal)).ToList();
        Assert.Equal(["series-r", "series-l", "shunt-c", "drive"], groups.Select(g => (string)g.Attribute("data-element")!));
        var texts = SvgAssert.Texts(svg);
        foreach (var value in new[] { "10 Ω", "10 mH", "1 µF", "1 V" }) Assert.Contains(value, texts);
    }

    [Fact]
    public void RootsTable_NaturalFrequencyDampingRatioAndQ_AreTheSeriesRlcClosedForms()
    {
        var report = Build();
        var w0 = 1 / Math.Sqrt(L * C);
        var zeta = R / 2 * Math.Sqrt(C / L);
        var q = 1 / (2 * zeta);
        var section = (CircuitRootsSection)report.Sections.Single(s => s.Key == "circuit_roots");
        var oscillation = section.Roots.Single(r => r.Kind == CircuitRootKind.Oscillation);
        NumericAssert.Close(w0 / (2 * Math.PI), oscillation.NaturalFrequencyHz, Tolerance.Rel(1e-9), "f0 (Hz)");
        NumericAssert.Close(zeta, oscillation.DampingRatio, Tolerance.Rel(1e-9), "damping ratio");
        NumericAssert.Close(q, oscillation.QualityFactor, Tolerance.Rel(1e-9), "Q");

        // The printed table: four significant digits, so half a unit of the fourth digit.
        var table = Table(Section(report, "circuit_roots"));
        Assert.Equal(CircuitRootsSection.Headers.ToArray(), table.Headers.ToArray());
        var row = table.Rows.Single(r => r[1] == "oscillation");
        NumericAssert.Close(w0 / (2 * Math.PI), Cell(row[2]), Tolerance.Rel(5e-4), "f0 cell");
        NumericAssert.Close(w0, Cell(row[3]), Tolerance.Rel(5e-4), "ω0 cell");
        NumericAssert.Close(zeta, Cell(row[4]), Tolerance.Rel(5e-4), "ζ cell");
        NumericAssert.Close(q, Cell(row[5]), Tolerance.Rel(5e-4), "Q cell");
        NumericAssert.Close(w0 * Math.Sqrt(1 - zeta * zeta) / (2 * Math.PI), Cell(row[6]), Tolerance.Rel(5e-4), "damped frequency cell: ω₀√(1−ζ²)");
    }

    [Fact]
    public void ImpedanceTable_SmallestMagnitudeIsR_AtTheNaturalFrequency_AndPhaseCrossesZeroThere()
    {
        var report = Build();
        var f0 = 1 / (2 * Math.PI * Math.Sqrt(L * C));
        var section = (CircuitSweepSection)report.Sections.Single(s => s.Key == "circuit_sweep");
        Assert.DoesNotContain(section.Responses[0].FrequenciesHz, f => Math.Abs(f - f0) < 1e-3 * f0);
        var smallest = section.Points[0][0];
        Assert.True(smallest.Located, "located between sweep points");
        // |Z(ω)| = √(R² + (ωL − 1/(ωC))²) is flat at its minimum: |Z| to 1e-9, the frequency to √(1e-9)-ish.
        NumericAssert.Close(R, smallest.Impedance.Magnitude, Tolerance.Rel(1e-9), "smallest |Z| = R");
        NumericAssert.Close(f0, smallest.FrequencyHz, Tolerance.Rel(1e-5), "at f0");
        var crossing = section.Points[0].Single(p => p.What.StartsWith("arg Z = 0°", StringComparison.Ordinal));
        NumericAssert.Close(f0, crossing.FrequencyHz, Tolerance.Rel(1e-9), "arg Z = 0 at f0");
        NumericAssert.Close(R, crossing.Impedance.Real, Tolerance.Rel(1e-9), "Z = R there");

        var table = Table(Section(report, "circuit_sweep"));
        Assert.Equal(["Point", "Frequency (Hz)", "|Z|", "arg Z (°)", "Located"], table.Headers.ToArray());
        var row = table.Rows[0];
        Assert.Equal("smallest |Z|", row[0]);
        NumericAssert.Close(f0, Cell(row[1]), Tolerance.Rel(5e-6), "frequency cell (six digits)");
        Assert.Equal("10.00 Ω", row[2]);
        NumericAssert.Close(0, Cell(row[3]), Tolerance.Abs(1e-3), "phase cell (°)");
    }

    [Fact]
    public void TransferFunctionOfTheCapacitorVoltage_IsTheSeriesRlcClosedForm_OverTheSweep()
    {
        // H(iω) = (1/(iωC)) / (R + iωL + 1/(iωC)) = 1/(1 − ω²LC + iωRC), the voltage divider (closed form).
        var report = Build();
        var section = (CircuitSweepSection)report.Sections.Single(s => s.Key == "circuit_sweep");
        var r = section.Responses[0];
        var output = r.Nodes.IndexOf("out");
        for (var k = 0; k < r.FrequenciesHz.Length; k++)
        {
            var w = 2 * Math.PI * r.FrequenciesHz[k];
            var expected = 1 / new System.Numerics.Complex(1 - w * w * L * C, w * R * C);
            NumericAssert.Close(0, (r.Transfer[k][output] - expected).Magnitude, Tolerance.Abs(1e-9 * expected.Magnitude), $"H at {r.FrequenciesHz[k]} Hz");
        }
        var chart = SvgAssert.WellFormedWithViewBox(report.Figures.Single(f => f.Name == "transfer-drive").Svg(true));
        Assert.Contains("|H| (V/V)", SvgAssert.Texts(chart));
        Assert.Contains("|Z| (Ω)", SvgAssert.Texts(SvgAssert.WellFormedWithViewBox(report.Figures.Single(f => f.Name == "impedance-drive").Svg(true))));
    }

    [Fact]
    public void StepResponse_CapacitorVoltagePeak_IsTheUnderdampedOvershoot()
    {
        // Unit step into a series R-L-C: the capacitor voltage peaks at 1 + exp(−ζπ/√(1−ζ²)) at t = π/ω_d (second-order
        // step response, closed form, common practice). The run is exact; the 2 µs recording step misses the peak
        // instant by at most 1 µs, 1e-5 of the peak at this curvature, hence 1e-4.
        var report = Build();
        var zeta = R / 2 * Math.Sqrt(C / L);
        var wd = Math.Sqrt(1 - zeta * zeta) / Math.Sqrt(L * C);
        var section = (CircuitTransientSection)report.Sections.Single(s => s.Key == "circuit_transient");
        var volts = section.Result.Volts[section.Result.Nodes.IndexOf("out")];
        var peak = volts.Max();
        NumericAssert.Close(1 + Math.Exp(-zeta * Math.PI / Math.Sqrt(1 - zeta * zeta)), peak, Tolerance.Rel(1e-4), "peak (V)");
        NumericAssert.Close(Math.PI / wd, section.Result.Times[volts.IndexOf(peak)], Tolerance.Abs(1.01e-6), "peak time (s)");
        var row = Table(Section(report, "circuit_transient")).Rows.Single(r => r[0] == "v(out)");
        Assert.EndsWith(" V", row[1], StringComparison.Ordinal);
        NumericAssert.Close(peak, Cell(row[1]), Tolerance.Rel(5e-4), "largest v(out) cell");
        Assert.Contains(Table(Section(report, "circuit_transient")).Rows, r => r[0] == "i(series-l), inductor" && Regex.IsMatch(r[1], " [mµ]?A$"));
        // results.json carries the run thinned to at most 2,000 instants (5,001 recorded).
        using var json = JsonDocument.Parse(report.Json.ToArray());
        var times = json.RootElement.GetProperty("circuit_transient").GetProperty("times_s");
        Assert.InRange(times.GetArrayLength(), 2, CircuitTransientSection.MaxJsonSamples);
        Assert.Equal(section.Result.Times[^1], times[times.GetArrayLength() - 1].GetDouble());
    }

    [Fact]
    public void CircuitSections_SpeakVoltsAmperesAndOhms_AndNoMechanicalWords()
    {
        var report = Build();
        string[] mechanical = ["kg", "N/m", "N·s/m", "mass", "stiffness", "spring", "damper", "displacement", "mode shape", "inerter", "support", "vibration", " mm", "(m)", "lbf"];
        var texts = new List<string>();
        foreach (var section in report.Document!.Sections)
        {
            texts.Add(section.Title);
            foreach (var block in section.Blocks)
                texts.AddRange(block switch
                {
                    ParagraphBlock p => [p.Text],
                    HeadingBlock h => [h.Text],
                    ListBlock l => l.Items,
                    TableBlock t => [.. t.Headers, .. t.Rows.SelectMany(r => r), t.Caption ?? ""],
                    FigureBlock f => [f.Figure.Caption, .. SvgAssert.Texts(XDocument.Parse(f.Figure.Svg(true)).Root!)],
                    _ => [],
                });
        }
        var all = string.Join("\n", texts);
        foreach (var word in mechanical) Assert.DoesNotContain(word, all, StringComparison.OrdinalIgnoreCase);
        foreach (var unit in new[] { " V", " A", " Ω", "(V/V)", "(Ω)", "Voltage (V)", "Current (A)" }) Assert.Contains(unit, all, StringComparison.Ordinal);
    }

    [Fact]
    public void ParallelTankDrivenByACurrentSource_LargestImpedanceIsR_AtTheNaturalFrequency()
    {
        // Parallel R-L-C from one node to ground, fed by a current source: Z = 1/(1/R + iωC + 1/(iωL)) peaks at
        // |Z| = R, purely resistive, at ω₀ = 1/√(LC) (parallel resonant circuit, closed form, common practice):
        // R = 100 Ω, L = 1 mH, C = 10 µF give f₀ = 1591.549 Hz, ζ = 1/(2R)·√(L/C) = 0.05. The transfer is in V/A.
        const string tank = """
            title: Parallel tank
            circuit:
              nodes: [top]
              resistors:
                load: {between: [top, ground], resistance: 100 ohm}
              inductors:
                coil: {between: [top, ground], inductance: 1 mH}
              capacitors:
                cap: {between: [top, ground], capacitance: 10 uF}
              current-sources:
                feed: {from: ground, to: top, amplitude: 1 A}
            harmonic:
              frequencies: {from: 100 Hz, to: 30 kHz, points: 53, spacing: log}

            """;
        var report = ReportBuilder.Build(Repository.Parse(tank, "tank.yaml"), Options);
        Assert.Equal(["circuit", "circuit_roots", "circuit_sweep"], report.Sections.Select(s => s.Key));
        var f0 = 1 / (2 * Math.PI * Math.Sqrt(1e-3 * 10e-6));
        var section = (CircuitSweepSection)report.Sections.Single(s => s.Key == "circuit_sweep");
        Assert.False(section.Responses[0].IsVoltageSource);
        var largest = section.Points[0].Single(p => p.What == "largest |Z|");
        Assert.True(largest.Located, "located between sweep points");
        NumericAssert.Close(100, largest.Impedance.Magnitude, Tolerance.Rel(1e-9), "largest |Z| = R");
        NumericAssert.Close(f0, largest.FrequencyHz, Tolerance.Rel(1e-5), "at f0");
        NumericAssert.Close(f0, section.Points[0].Single(p => p.What.StartsWith("arg Z = 0°", StringComparison.Ordinal)).FrequencyHz, Tolerance.Rel(1e-9), "arg Z = 0 at f0");
        var roots = ((CircuitRootsSection)report.Sections.Single(s => s.Key == "circuit_roots")).Roots;
        NumericAssert.Close(0.05, roots.Single(r => r.Kind == CircuitRootKind.Oscillation).DampingRatio, Tolerance.Rel(1e-9), "ζ = (1/2R)√(L/C)");
        Assert.Contains("|H| (V/A)", SvgAssert.Texts(SvgAssert.WellFormedWithViewBox(report.Figures.Single(f => f.Name == "transfer-feed").Svg(true))));
        var groups = SvgAssert.WellFormedWithViewBox(report.Figures.Single(f => f.Name == "circuit").Svg(true))
            .Descendants(Repository.Svg + "g").Select(g => (string?)g.Attribute("class")).Where(c => c?.StartsWith("element ", StringComparison.Ordinal) == true);
        Assert.Equal(["element resistor", "element inductor", "element capacitor", "element current-source"], groups);
    }

    [Fact]
    public void ElectricalUnits_PickThePrefixOfTheMagnitude()
    {
        // SI prefixes (BIPM, The International System of Units, 9th ed., table 7): the value shown is between 1 and 1000.
        Assert.Equal("470 µH", ElectricalUnits.Format(470e-6, ElectricalUnits.Henry, given: true));
        Assert.Equal("2.2 Ω", ElectricalUnits.Format(2.2, ElectricalUnits.Ohm, given: true));
        Assert.Equal("10 kΩ", ElectricalUnits.Format(1e4, ElectricalUnits.Ohm, given: true));
        Assert.Equal("22 pF", ElectricalUnits.Format(22e-12, ElectricalUnits.Farad, given: true));
        Assert.Equal("1.000 mA", ElectricalUnits.Format(0.99996e-3, ElectricalUnits.Ampere));
        Assert.Equal("−3.300 V", ElectricalUnits.Format(-3.3, ElectricalUnits.Volt).Replace('-', '−'));
        Assert.Equal("0 V", ElectricalUnits.Format(0, ElectricalUnits.Volt));
    }

    [Fact]
    public void CircuitReport_IsByteIdenticalUnderADecimalCommaCulture()
    {
        var invariant = Build();
        using (new CultureScope("de-DE"))
        {
            var german = Build();
            Assert.Equal(invariant.Html, german.Html);
            Assert.Equal(invariant.Json.ToArray(), german.Json.ToArray());
        }
    }
}
