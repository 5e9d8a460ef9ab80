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
        const double mu = 0.05;
        var run = CommandRun.Of("tune", Example, "--host", "deck", "--mass-ratio", "5 %", "--format", "json");
        Assert.Equal(0, run.ExitCode);
        var json = run.Json();

        // Den Hartog, Mechanical Vibrations, 4th ed., §3.3 (REFERENCES §3) [confirmed citation]: f = 1/(1+μ),
        // ζ = √(3μ/(8(1+μ))) referred to the absorber, √(3μ/(8(1+μ)³)) referred to the primary, fixed points √(1 + 2/μ).
        var absorber = json.GetProperty("absorber");
        NumericAssert.Close(1 / (1 + mu), absorber.GetProperty("frequency_ratio").GetDouble(), Tolerance.Rel(1e-12), "f_opt");
        NumericAssert.Close(Math.Sqrt(3 * mu / (8 * (1 + mu))), absorber.GetProperty("damping_ratio").GetDouble(), Tolerance.Rel(1e-12), "ζ (absorber)");
        NumericAssert.Close(Math.Sqrt(3 * mu / (8 * Math.Pow(1 + mu, 3))), absorber.GetProperty("damping_ratio_primary_referenced").GetDouble(), Tolerance.Rel(1e-12), "ζ (primary)");
        NumericAssert.Close(Math.Sqrt(1 + 2 / mu), json.GetProperty("fixed_point_peak").GetDouble(), Tolerance.Rel(1e-14), "√41");

        // The controlled mode and its modal mass at the deck from the closed-form two-mass solution: ω² from
        // m1·m2·ω⁴ − (m1·k2 + m2·(k1 + k2))·ω² + k1·k2 = 0; shape ratio r = φ_fan/φ_deck = (k1 + k2 − ω²m1)/k2; with
        // mass-normalised shapes 1/φ_deck² = m1 + m2·r² (Rao, Mechanical Vibrations, §5.3 [from memory]).
        double m1 = 2600, m2 = 420, k1 = 68e6, k2 = 1.6e6, c = 2200, zeta = 0.02;
        var (w1, w2) = TwoMassOmegas(m1, m2, k1, k2);
        var r2 = (k1 + k2 - w2 * w2 * m1) / k2;
        var modalMass = m1 + m2 * r2 * r2;
        Assert.Equal(2, json.GetProperty("mode").GetInt32());
        NumericAssert.Close(w2 / (2 * Math.PI), json.GetProperty("mode_frequency_hz").GetDouble(), Tolerance.Rel(1e-9), "f_2");
        NumericAssert.Close(modalMass, json.GetProperty("modal_mass_kg").GetDouble(), Tolerance.Rel(1e-9), "modal mass at the deck");
        var ma = absorber.GetProperty("mass_kg").GetDouble();
        NumericAssert.Close(mu * modalMass, ma, Tolerance.Rel(1e-9), "m_a = μM");
        var fa = w2 / (2 * Math.PI) / (1 + mu);
        NumericAssert.Close(fa, absorber.GetProperty("frequency_hz").GetDouble(), Tolerance.Rel(1e-9), "f_a = f_2/(1+μ)");
        NumericAssert.Close(ma * Math.Pow(2 * Math.PI * fa, 2), absorber.GetProperty("stiffness_n_per_m").GetDouble(), Tolerance.Rel(1e-9), "k_a = m_a ω_a²");

        // Peak before: an independent dense complex solve of the two-mass model, (K − ω²M + iωC) x = e_deck with
        // C = the mount damper + modal damping C_m = MΦ diag(2ζω)ΦᵀM (docs/methods.md), searched over [0.5, 1.5]·f_2
        // on a fine grid then golden-section refined. Measure |x_deck|·M_p·ω_2² (docs/methods.md, tune).
        var before = PeakBefore(m1, m2, k1, k2, c, zeta, w1, w2, modalMass);
        NumericAssert.Close(before, json.GetProperty("peak_before").GetDouble(), Tolerance.Rel(1e-9), "peak before, dense complex solve");

        // Peak after: the full model adds the deck's 2 % and the mount damper to Den Hartog's undamped one-mass primary,
        // so the worst peak stays below that design's FRF peak on an undamped primary, 6.4084 (REFERENCES §3).
        var after = json.GetProperty("peak_after").GetDouble();
        Assert.True(after < 6.4084, $"peak after {after} is above Den Hartog's undamped-primary value 6.4084");
        Assert.True(after < before / 3, $"the absorber should lower the peak several times: {before} → {after}");
        Assert.True(json.GetProperty("stroke_m").GetDouble() > 0);
        Assert.True(json.GetProperty("stroke_per_force_m_per_n").GetDouble() > 0);
        var mistuning = json.GetProperty("mistuning");
        Assert.Equal([-0.1, -0.05, 0.05, 0.1], mistuning.EnumerateArray().Select(p => p.GetProperty("frequency_error").GetDouble()).ToArray());
        Assert.All(mistuning.EnumerateArray(), p => Assert.True(p.GetProperty("peak").GetDouble() > after));
    }

    private static (double W1, double W2) TwoMassOmegas(double m1, double m2, double k1, double k2)
    {
        double a = m1 * m2, b = -(m1 * k2 + m2 * (k1 + k2)), c = k1 * k2;
        var disc = Math.Sqrt(b * b - 4 * a * c);
        return (Math.Sqrt((-b - disc) / (2 * a)), Math.Sqrt((-b + disc) / (2 * a)));
    }

    private static double PeakBefore(double m1, double m2, double k1, double k2, double cd, double zeta, double w1, double w2, double modalMass)
    {
        // Mass-normalised shapes φ_j = (1, r_j)/√(m1 + m2 r_j²).
        double[][] phi = [.. new[] { w1, w2 }.Select(w =>
        {
            var r = (k1 + k2 - w * w * m1) / k2;
            var norm = Math.Sqrt(m1 + m2 * r * r);
            return new[] { 1 / norm, r / norm };
        })];
        double[] m = [m1, m2], w = [w1, w2];
        var cm = new double[2, 2];
        for (var i = 0; i < 2; i++)
            for (var j = 0; j < 2; j++)
                for (var q = 0; q < 2; q++) cm[i, j] += m[i] * phi[q][i] * 2 * zeta * w[q] * phi[q][j] * m[j];
        double[,] c = { { cm[0, 0] + cd, cm[0, 1] - cd }, { cm[1, 0] - cd, cm[1, 1] + cd } };
        double[,] k = { { k1 + k2, -k2 }, { -k2, k2 } };
        double Amplification(double omega)
        {
            System.Numerics.Complex D(int i, int j) => new(k[i, j] - omega * omega * (i == j ? m[i] : 0), omega * c[i, j]);
            var x1 = D(1, 1) / (D(0, 0) * D(1, 1) - D(0, 1) * D(1, 0));
            return x1.Magnitude * modalMass * w2 * w2;
        }
        const int n = 40_000;
        var (lo, hi) = (0.5 * w2, 1.5 * w2);
        var best = Enumerable.Range(0, n + 1).Select(i => lo + (hi - lo) * i / n).MaxBy(Amplification);
        var (a, b) = (best - (hi - lo) / n, best + (hi - lo) / n);
        var g = (Math.Sqrt(5) - 1) / 2;
        for (var it = 0; it < 100; it++)
        {
            var (x1, x2) = (b - g * (b - a), a + g * (b - a));
            if (Amplification(x1) > Amplification(x2)) b = x2; else a = x1;
        }
        return Amplification((a + b) / 2);
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
