using ModalChain.TestSupport;

namespace ModalChain.Cli.Tests.Commands;

/// <summary>The commands on the example model with loads and damping: limits at the operating point, tuning assessed on the full model.</summary>
public class OperatingPointCommandTests
{
    private static string Example => Path.Combine(CommandRun.Models(), "mezzanine-fan-absorber-check.yaml");

    [Fact]
    public void Check_EvaluatesTheLimitsAtTheRunningSpeed()
    {
        var run = CommandRun.Of("check", Example, "--format", "json");
        Assert.Equal(1, run.ExitCode);
        var limits = run.Json().GetProperty("limits");
        Assert.Equal(2, limits.GetArrayLength());
        Assert.Equal(0, run.Json().GetProperty("not_evaluated").GetArrayLength());
        foreach (var l in limits.EnumerateArray())
        {
            var value = l.GetProperty("value").GetDouble();
            var limit = l.GetProperty("limit").GetDouble();
            NumericAssert.Close((limit - value) / limit, l.GetProperty("reserve").GetDouble(), Tolerance.Rel(1e-12), "reserve = (limit − value)/limit");
            Assert.Equal(value <= limit, l.GetProperty("passes").GetBoolean());
        }
    }

    [Fact]
    public void Tune_ReportsPeaksStrokeAndMistuning()
    {
        var run = CommandRun.Of("tune", Example, "--host", "deck", "--mass-ratio", "5 %", "--format", "json");
        Assert.Equal(0, run.ExitCode);
        var json = run.Json();
        var before = json.GetProperty("peak_before").GetDouble();
        var after = json.GetProperty("peak_after").GetDouble();
        Assert.True(after < before, $"the absorber should lower the peak: {before} → {after}");
        Assert.True(json.GetProperty("stroke_m").GetDouble() > 0);
        Assert.True(json.GetProperty("stroke_per_force_m_per_n").GetDouble() > 0);
        var mistuning = json.GetProperty("mistuning");
        Assert.Equal([-0.1, -0.05, 0.05, 0.1], mistuning.EnumerateArray().Select(p => p.GetProperty("frequency_error").GetDouble()).ToArray());
        Assert.All(mistuning.EnumerateArray(), p => Assert.True(p.GetProperty("peak").GetDouble() > after));
    }

    [Fact]
    public void TuneOptimal_IsNoWorseThanTheClosedForm_AndTheWrittenModelMeetsItsLimits()
    {
        var closed = CommandRun.Of("tune", Example, "--host", "deck", "--mass-ratio", "5 %", "--format", "json").Json();
        var output = CommandRun.TempPath();
        var run = CommandRun.Of("tune", Example, "--host", "deck", "--mass-ratio", "5 %", "--method", "optimal", "--format", "json", "--write", output);
        Assert.Equal(0, run.ExitCode);
        var json = run.Json();
        Assert.Equal("optimal", json.GetProperty("method").GetString());
        Assert.Contains("closed form", json.GetProperty("improvement").GetString());
        Assert.True(json.GetProperty("peak_after").GetDouble() <= closed.GetProperty("peak_after").GetDouble() * (1 + 1e-9));
        var check = CommandRun.Of("check", output, "--format", "json").Json();
        Assert.All(check.GetProperty("limits").EnumerateArray(), l => Assert.True(l.GetProperty("passes").GetBoolean(), l.ToString()));
    }

    [Fact]
    public void Study_FollowsTheLimitsAndFindsTheirThresholds()
    {
        var run = CommandRun.Of("study", Example, "--vary", "springs.beams.stiffness", "--from", "40 kN/mm", "--to", "140 kN/mm", "--steps", "11", "--format", "json");
        Assert.Equal(0, run.ExitCode);
        var json = run.Json();
        Assert.Equal(3, json.GetProperty("criteria").GetArrayLength()); // separation and two limits
        Assert.Contains(json.GetProperty("thresholds").EnumerateArray(), t => t.GetProperty("criterion").GetString()!.StartsWith("limit acceleration peak at deck"));
        // The operating-point response at the model's own stiffness (68 kN/mm is not a step, so compare the shape only):
        // response = limit·(1 − reserve) at every step, and it equals what 'check' finds at a step's value.
        var deck = json.GetProperty("criteria").EnumerateArray().Single(c => c.GetProperty("name").GetString() == "limit acceleration peak at deck");
        var limit = deck.GetProperty("limit").GetDouble();
        var reserves = deck.GetProperty("reserve").EnumerateArray().Select(r => r.GetDouble()).ToArray();
        var response = deck.GetProperty("response").EnumerateArray().Select(r => r.GetDouble()).ToArray();
        for (var i = 0; i < reserves.Length; i++) NumericAssert.Close(limit * (1 - reserves[i]), response[i], Tolerance.Rel(1e-12), $"step {i}");
        var atHundred = File.ReadAllText(Example).Replace("stiffness: 68 kN/mm", "stiffness: 100 kN/mm");
        var check = CommandRun.Of("check", CommandRun.ModelFile(atHundred), "--format", "json").Json();
        var deckLimit = check.GetProperty("limits").EnumerateArray().Single(l => l.GetProperty("at").GetString() == "deck");
        NumericAssert.Close(deckLimit.GetProperty("value").GetDouble(), response[6], Tolerance.Rel(1e-9), "study at 100 kN/mm vs check");
    }

    [Fact]
    public void ExampleComments_FollowFromItsValues()
    {
        // The comments of the example state: 1470 rpm = 24.5 Hz; four mounts of 0.4 kN/mm make 1.6 kN/mm; a 150 kg
        // impeller at grade G6.3 (e·ω = 6.3 mm/s) has m·e ≈ 6.1 kg·mm; the deck mode lies inside the ±20 % band.
        var model = ModalChain.Io.Model.ModelReader.ReadFile(Example).Model!;
        var speed = model.Criteria.Separation!.SpeedsHz.Single();
        NumericAssert.Close(24.5, speed, Tolerance.Rel(1e-15), "1470 rpm");
        NumericAssert.Close(4 * 0.4e6, model.Network.Springs.Single(s => s.Name == "mounts").Stiffness, Tolerance.Rel(1e-15), "mounts");
        var unbalance = (ModalChain.Core.Model.UnbalanceLoad)model.Structure.Loads.Single();
        NumericAssert.Close(150 * 6.3e-3 / (2 * Math.PI * speed), unbalance.MassRadius, Tolerance.Rel(0.01), "G6.3 unbalance");
        var modes = CommandRun.Of("modes", Example, "--format", "json").Json().GetProperty("modes");
        var deckMode = modes[1].GetProperty("frequency_hz").GetDouble();
        Assert.InRange(deckMode, 0.8 * speed, 1.2 * speed);
    }
}
