using System.Globalization;
using System.Text.Json;
using System.Text.RegularExpressions;
using ModalChain.Reports.Sections;
using ModalChain.TestSupport;

namespace ModalChain.Reports.Tests.Sections;

/// <summary>The transient section: present only when asked for, the plotted peak is the closed-form one, long runs thinned without losing peaks.</summary>
public sealed class TransientSectionTests
{
    private static readonly ReportOptions Options = new("test", DateTimeOffset.UnixEpoch);

    // Undamped SDOF from rest under a suddenly applied constant force F: x(t) = (F/k)(1 − cos ωt), peak 2F/k at t = T/2
    // (dynamic load factor 2; standard result, e.g. Chopra, Dynamics of Structures, §4.3; attribution from memory).
    // m = 100 kg, k = 394784.176 N/m (f_n = 10 Hz, T = 0.1 s), F = 1 kN from t = 0: peak 5.0661 mm at 0.05 s.
    private const string Model = """
        title: step load on one mass
        masses: {m: 100 kg}
        springs: {k: {between: [ground, m], stiffness: 394784.176 N/m}}
        loads:
          drop: {kind: force, at: m, time: {kind: step, value: 1 kN, at: 0 s}}
        transient:
          duration: 0.3 s
          step: 0.5 ms
          method: newmark
        """;

    [Fact]
    public void StepLoad_ChartMarksThePeakOfTheDynamicLoadFactorTwo()
    {
        var report = ReportBuilder.Build(Repository.Parse(Model), Options);
        var chart = report.Figures.Single(f => f.Name == "transient-m");
        var texts = SvgAssert.Texts(SvgAssert.WellFormedWithViewBox(chart.Svg(true)));
        Assert.Contains("Time (s)", texts);
        Assert.Contains("Displacement (mm, instantaneous)", texts);
        var label = Regex.Match(texts.Single(t => t.StartsWith("peak ", StringComparison.Ordinal)), @"^peak ([0-9.]+) mm at ([0-9.]+) s$");
        Assert.True(label.Success);
        // Newmark average acceleration at Δt/T = 0.005: period error ~ 2e-4 (REFERENCES.md §5) and sampling of the crest: 0.1 %.
        NumericAssert.Close(2 * 1000 / 394784.176 * 1e3, double.Parse(label.Groups[1].Value, CultureInfo.InvariantCulture), Tolerance.Rel(1e-3), "peak (mm)");
        NumericAssert.Close(0.05, double.Parse(label.Groups[2].Value, CultureInfo.InvariantCulture), Tolerance.Abs(1e-3), "time of peak (s)");
        using var json = JsonDocument.Parse(report.Json.ToArray());
        Assert.True(json.RootElement.GetProperty("transient").TryGetProperty("time_s", out _));
    }

    [Fact]
    public void PlotIndices_ThinLongHistoriesButKeepTheExtremes()
    {
        var values = Enumerable.Range(0, 20000).Select(i => Math.Sin(i * 0.013) * (i == 12345 ? 3 : 1)).ToArray();
        var picked = TransientSection.PlotIndices(values);
        Assert.True(picked.Count <= TransientSection.MaxPlotPoints + 2, $"{picked.Count} points kept");
        Assert.Contains(12345, picked);
        Assert.Contains(0, picked);
        Assert.Contains(19999, picked);
    }

    [Fact]
    public void ResultsJson_ThinsLongHistoriesToABoundedSize_AndKeepsEveryHistorysLargestValue()
    {
        // Three masses in a chain, 10 s at 0.5 ms: 20001 recorded samples of 9 motions, 3 spring forces and a reaction.
        // The peaks block is over every step and the run records every step, so the largest |value| of each written
        // history must equal its peak exactly (an identity of the thinning rule: each bucket keeps its min and max).
        const string chain = """
            title: long run on a three-mass chain
            masses: {a: 100 kg, b: 50 kg, c: 20 kg}
            springs:
              ka: {between: [ground, a], stiffness: 400 kN/m}
              kb: {between: [a, b], stiffness: 150 kN/m}
              kc: {between: [b, c], stiffness: 60 kN/m}
            loads:
              drop: {kind: force, at: c, time: {kind: step, value: 1 kN, at: 0 s}}
            transient:
              duration: 10 s
              step: 0.5 ms
              method: newmark
            """;
        var report = ReportBuilder.Build(Repository.Parse(chain), Options);
        using var json = JsonDocument.Parse(report.Json.ToArray());
        var t = json.RootElement.GetProperty("transient");
        Assert.Equal(1, t.GetProperty("record_every").GetInt32());
        var samples = t.GetProperty("history_samples");
        Assert.Equal(20001, samples.GetProperty("recorded").GetInt32());
        var written = samples.GetProperty("written").GetInt32();
        Assert.InRange(written, 100, TransientSection.MaxJsonSamples);
        Assert.Equal(written, t.GetProperty("time_s").GetArrayLength());
        // Each written history, keyed as the peaks block names it (name, quantity).
        var histories = new Dictionary<string, JsonElement>(StringComparer.Ordinal);
        foreach (var h in t.GetProperty("responses").EnumerateArray())
            histories.Add(h.GetProperty("dof").GetString() + "/" + h.GetProperty("quantity").GetString(), h);
        foreach (var h in t.GetProperty("element_forces").EnumerateArray())
            histories.Add(h.GetProperty("element").GetString() + "/" + h.GetProperty("kind").GetString() + "_force", h);
        foreach (var h in t.GetProperty("reactions").EnumerateArray())
            histories.Add(h.GetProperty("support").GetString() + "/reaction", h);
        Assert.Equal(t.GetProperty("peaks").GetArrayLength(), histories.Count);
        foreach (var peak in t.GetProperty("peaks").EnumerateArray())
        {
            var history = histories[peak.GetProperty("name").GetString() + "/" + peak.GetProperty("quantity").GetString()];
            var values = history.GetProperty("values").EnumerateArray().Select(v => v.GetDouble()).ToArray();
            Assert.Equal(written, values.Length);
            Assert.Equal(Math.Abs(peak.GetProperty("value").GetDouble()), values.Max(Math.Abs));
        }
        // Size bound: 13 histories of at most MaxJsonSamples numbers of about 25 characters, plus the rest of the report.
        Assert.True(report.Json.Length < 1_500_000, $"results.json is {report.Json.Length} bytes");
    }

    [Fact]
    public void ModelWithoutTransientSection_HasNoTransientSection() =>
        Assert.DoesNotContain(ReportBuilder.Build(Repository.UniformChain(2, 1, 100), Options).Sections, s => s.Key == "transient");

    [Fact]
    public void WithAVelocityLimit_TheVelocityHistoryIsDrawn_WithTheClosedFormPeak()
    {
        // v(t) = (F/k)·ω·sin ωt for the suddenly applied force: peak F/√(km) = 159.15 mm/s at T/4 = 0.025 s (same source).
        var model = Model + "\ncriteria:\n  limits:\n    - {at: m, quantity: velocity, peak: 200 mm/s}\n";
        var chart = ReportBuilder.Build(Repository.Parse(model), Options).Figures.Single(f => f.Name == "transient-m-velocity");
        var texts = SvgAssert.Texts(SvgAssert.WellFormedWithViewBox(chart.Svg(true)));
        Assert.Contains("Velocity (mm/s, instantaneous)", texts);
        var label = Regex.Match(texts.Single(t => t.StartsWith("peak ", StringComparison.Ordinal)), @"^peak ([0-9.]+) mm/s at ([0-9.]+) s$");
        Assert.True(label.Success);
        NumericAssert.Close(1000 / Math.Sqrt(394784.176 * 100) * 1e3, double.Parse(label.Groups[1].Value, CultureInfo.InvariantCulture), Tolerance.Rel(1e-3), "peak velocity (mm/s)");
    }
}
