using System.Collections.Immutable;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Transient;

/// <summary>The analysis facade: loads, support motion, outputs, reactions, peaks, RMS and warnings.</summary>
public class TransientAnalysisTests
{
    private static Network Sdof(double m, double k, double c = 0)
    {
        var b = new NetworkBuilder().AddMass("deck", m).AddSpring("columns", Network.Ground, "deck", k);
        if (c > 0) b.AddDamper("loss", Network.Ground, "deck", c);
        return b.Build();
    }

    private static Network RandomNetwork(int n, int seed)
    {
        var random = new Random(seed);
        var b = new NetworkBuilder();
        for (var i = 0; i < n; i++) b.AddMass($"m{i}", 50 + 100 * random.NextDouble());
        b.AddSpring("s0", Network.Ground, "m0", 2e5);
        for (var i = 1; i < n; i++) b.AddSpring($"s{i}", $"m{i - 1}", $"m{i}", 1e5 * (0.5 + random.NextDouble()));
        b.AddSpring("top", $"m{n - 1}", Network.Ground, 5e4);
        b.AddDamper("d0", Network.Ground, "m1", 300);
        b.AddDamper("d1", "m0", $"m{n - 1}", 150);
        return b.Build();
    }

    [Fact]
    public void FreeVibration_PeakAndRms_MatchTheCosine()
    {
        // x0 cos ωt over whole periods: peak x0 at t = 0, RMS x0/√2 (closed form; common practice).
        const double m = 100, k = 1e5, x0 = 3e-3;
        var network = Sdof(m, k);
        var period = 2 * Math.PI / Math.Sqrt(k / m);
        var settings = new TransientSettings(10 * period, period / 200, TransientMethod.Exact) { RmsFrom = 0, RmsTo = 10 * period - period / 400 };
        var result = TransientAnalysis.Run(network, Assembler.Assemble(network), [], [new InitialCondition("deck", x0, 0)], settings);
        var u = result.Get("deck", ResponseQuantity.Displacement);
        NumericAssert.Close(x0, u.Peak.Value, Tolerance.Rel(1e-12), "peak");
        NumericAssert.Close(0, u.Peak.Time, Tolerance.Abs(1e-12), "time of peak");
        NumericAssert.Close(x0 / Math.Sqrt(2), u.Rms, Tolerance.Rel(1e-9), "RMS");
        NumericAssert.Close(k * x0, result.Get("ground", ResponseQuantity.Reaction).Peak.Value, Tolerance.Rel(1e-12), "reaction = k x");
        NumericAssert.Close(-k * x0, result.Get("columns", ResponseQuantity.SpringForce).Values[0], Tolerance.Rel(1e-12), "k (u_A − u_B) with A = ground, B = deck");
    }

    [Fact]
    public void ModalMethodRatioList_OnAFreeFreePair_DampsTheElasticModeByTheFirstEntry()
    {
        // m–k–m with no support, released from ±a: the centre of mass stays put and the relative motion r = u_p − u_q is
        // a damped single-mode free vibration at ω² = 2k/m, r = e^(−ζωt)(r0 cos ω_d t + ζω r0/ω_d sin ω_d t) (closed
        // form, common practice). The ratio list [2 %, 5 %] gives the elastic mode 2 %: the rigid-body mode takes none.
        // The modal method solves each mode exactly, so the tolerance is 1e-9 of a.
        const double m = 5, k = 2e4, a = 1e-3, zeta = 0.02;
        var network = new NetworkBuilder().AddMass("p", m).AddMass("q", m).AddSpring("k", "p", "q", k).Build();
        var omega = Math.Sqrt(2 * k / m);
        var wd = omega * Math.Sqrt(1 - zeta * zeta);
        var period = 2 * Math.PI / omega;
        var settings = new TransientSettings(5 * period, period / 100, TransientMethod.Modal) { ModalDampingRatios = [0.02, 0.05] };
        var result = TransientAnalysis.Run(network, Assembler.Assemble(network), [],
            [new InitialCondition("p", a, 0), new InitialCondition("q", -a, 0)], settings);
        var u = result.Get("p", ResponseQuantity.Displacement).Values;
        for (var s = 0; s < result.Times.Length; s += 25)
        {
            var t = result.Times[s];
            var r = Math.Exp(-zeta * omega * t) * (2 * a * Math.Cos(wd * t) + zeta * omega * 2 * a / wd * Math.Sin(wd * t));
            NumericAssert.Close(r / 2, u[s], Tolerance.Abs(1e-9 * a), $"u_p at {t:G4} s");
        }
    }

    [Fact]
    public void RmsWindowOutsideTheRun_IsNotAvailableAndWarned()
    {
        // A window that holds no step has no RMS: reporting 0 would read as "no vibration" (common practice: say n/a).
        var network = Sdof(100, 1e5);
        var settings = new TransientSettings(1, 1e-3, TransientMethod.Exact) { RmsFrom = 8, RmsTo = 10 };
        var result = TransientAnalysis.Run(network, Assembler.Assemble(network), [], [new InitialCondition("deck", 1e-3, 0)], settings);
        Assert.All(result.Responses, r => Assert.True(double.IsNaN(r.Rms), $"{r.Name} {r.Quantity}: RMS {r.Rms}"));
        Assert.Contains(result.Warnings, w => w.Contains("RMS window 8 to 10 s holds no step", StringComparison.Ordinal));
    }

    [Fact]
    public void RmsWindowPastTheEnd_IsWarnedAndCoversTheRunOnly()
    {
        // x0 cos ωt over whole periods: RMS x0/√2 (closed form); the window asks for more than the run has.
        const double m = 100, k = 1e5, x0 = 3e-3;
        var network = Sdof(m, k);
        var period = 2 * Math.PI / Math.Sqrt(k / m);
        var settings = new TransientSettings(10 * period, period / 200, TransientMethod.Exact) { RmsFrom = 0, RmsTo = 20 * period };
        var result = TransientAnalysis.Run(network, Assembler.Assemble(network), [], [new InitialCondition("deck", x0, 0)], settings);
        // N = 2000 steps over 10 periods, N + 1 samples with cos² = 1 at both ends: mean (N/2 + 1)/(N + 1) (closed form).
        const int n = 2000;
        Assert.Equal(n, result.StepCount);
        NumericAssert.Close(x0 * Math.Sqrt((n / 2.0 + 1) / (n + 1)), result.Get("deck", ResponseQuantity.Displacement).Rms, Tolerance.Rel(1e-9), "RMS over the run");
        Assert.Contains(result.Warnings, w => w.Contains("after the run", StringComparison.Ordinal));
    }

    [Fact]
    public void SupportAcceleration_GivesTheRelativeMotionClosedForm()
    {
        // A support accelerating by a0 from rest: the relative motion z = u − u_s obeys z̈ + ω² z = −a0, so
        // z = −(a0/ω²)(1 − cos ωt); the spring force k (u_slab − u_shelf) is −k z and the slab receives k z (Chopra, Dynamics of Structures, §1.7 and §4.3 — from memory).
        const double m = 80, k = 2e5, a0 = 0.8;
        var network = new NetworkBuilder().AddSupport("slab").AddMass("shelf", m).AddSpring("post", "slab", "shelf", k).Build();
        var omega = Math.Sqrt(k / m);
        var period = 2 * Math.PI / omega;
        var settings = new TransientSettings(3 * period, period / 400, TransientMethod.Exact);
        var result = TransientAnalysis.Run(network, Assembler.Assemble(network),
            [new SupportAccelerationHistory("quake", "slab", new StepFunction(a0, 0))], [], settings);
        var force = result.Get("post", ResponseQuantity.SpringForce);
        var reaction = result.Get("slab", ResponseQuantity.Reaction);
        var u = result.Get("shelf", ResponseQuantity.Displacement);
        for (var s = 0; s < result.Times.Length; s += 50)
        {
            var t = result.Times[s];
            var z = -(a0 / (omega * omega)) * (1 - Math.Cos(omega * t));
            NumericAssert.Close(-k * z, force.Values[s], Tolerance.Abs(1e-3 * m * a0), $"spring force at {t:F4}");
            NumericAssert.Close(k * z, reaction.Values[s], Tolerance.Abs(1e-3 * m * a0), $"reaction at {t:F4}");
            NumericAssert.Close(0.5 * a0 * t * t + z, u.Values[s], Tolerance.Abs(1e-3 * a0 / (omega * omega)), $"absolute u at {t:F4}");
        }
    }

    [Theory]
    [InlineData(TransientMethod.Newmark)]
    [InlineData(TransientMethod.Exact)]
    public void Reactions_BalanceLoadsAndInertia(TransientMethod method)
    {
        // Newton's second law for the whole network: Σ reactions = Σ f − Σ m ü at every instant (the equations of
        // motion hold at each step for both methods).
        var network = RandomNetwork(6, seed: 4);
        var matrices = Assembler.Assemble(network);
        TransientExcitation[] loads = [new ForceHistory("hit", "m3", 1, new HalfSinePulse(4000, 0.02, 0.01)), new ForceHistory("hum", "m5", 1, new SineFunction(500, 12))];
        var result = TransientAnalysis.Run(network, matrices, loads, [], new TransientSettings(0.5, 5e-4, method));
        for (var s = 0; s < result.Times.Length; s += 41)
        {
            var t = result.Times[s];
            var applied = 4000 * new HalfSinePulse(1, 0.02, 0.01).ValueAt(t) + 500 * Math.Sin(24 * Math.PI * t);
            var inertia = network.Masses.Sum(mass => mass.Kilograms * result.Get(mass.Name, ResponseQuantity.Acceleration).Values[s]);
            var reactions = result.Responses.Where(r => r.Quantity == ResponseQuantity.Reaction).Sum(r => r.Values[s]);
            NumericAssert.Close(applied - inertia, reactions, Tolerance.Abs(1e-7 * 4000), $"balance at {t:F4}");
        }
    }

    [Fact]
    public void Outputs_LimitTheRecordedMassesAndElements()
    {
        var network = RandomNetwork(5, seed: 2);
        var settings = new TransientSettings(0.1, 1e-3) { Outputs = ["m2"] };
        var result = TransientAnalysis.Run(network, Assembler.Assemble(network), [new ForceHistory("f", "m2", 1, new StepFunction(10, 0))], [], settings);
        Assert.Equal(["m2"], result.Responses.Where(r => r.Quantity == ResponseQuantity.Displacement).Select(r => r.Name));
        Assert.Equal(["s0", "s2", "s3", "top"], result.Responses.Where(r => r.Quantity == ResponseQuantity.SpringForce).Select(r => r.Name));
        Assert.Equal(101, result.Times.Length);
        Assert.All(result.Responses, r => Assert.Equal(101, r.Values.Length));
    }

    [Fact]
    public void CoarseStepAndShortDuration_AreWarned()
    {
        // 10 steps per period of the highest significant mode and a few periods of the lowest are common practice.
        var network = RandomNetwork(4, seed: 1);
        var result = TransientAnalysis.Run(network, Assembler.Assemble(network), [new ForceHistory("f", "m0", 1, new StepFunction(10, 0))], [],
            new TransientSettings(0.05, 0.01));
        Assert.Contains(result.Warnings, w => w.Contains("steps per period"));
        Assert.Contains(result.Warnings, w => w.Contains("periods of the lowest mode"));

        var fine = TransientAnalysis.Run(network, Assembler.Assemble(network), [new ForceHistory("f", "m0", 1, new StepFunction(10, 0))], [],
            new TransientSettings(5, 1e-4));
        Assert.Empty(fine.Warnings);
    }

    [Fact]
    public void Warnings_UseInvariantNumbers_UnderADecimalCommaCulture()
    {
        using var culture = new CultureScope("de-DE");
        var network = RandomNetwork(4, seed: 1);
        var result = TransientAnalysis.Run(network, Assembler.Assemble(network), [], [new InitialCondition("m1", 1e-3, 0)],
            new TransientSettings(0.05, 0.0125));
        var warning = Assert.Single(result.Warnings, w => w.Contains("steps per period"));
        Assert.Contains("0.0125 s", warning);
    }

    [Fact]
    public void ModalTruncation_IsWarnedBelowNinetyPercentMass()
    {
        var network = RandomNetwork(8, seed: 3);
        var settings = new TransientSettings(1, 1e-3, TransientMethod.Modal) { ModeCount = 1, ModalDampingRatios = [0.02] };
        var result = TransientAnalysis.Run(network, Assembler.Assemble(network), [new ForceHistory("f", "m7", 1, new StepFunction(10, 0))], [], settings);
        Assert.Contains(result.Warnings, w => w.Contains("effective mass"));
        Assert.Contains("1 of 8 modes", result.MethodDescription);
    }

    [Fact]
    public void CallerBugs_AreArgumentExceptions()
    {
        var network = RandomNetwork(3, seed: 1);
        var matrices = Assembler.Assemble(network);
        var ok = new TransientSettings(1, 1e-3);
        Assert.Throws<ArgumentException>(() => TransientAnalysis.Run(network, matrices, [new ForceHistory("f", "nowhere", 1, new StepFunction(1, 0))], [], ok));
        Assert.Throws<ArgumentException>(() => TransientAnalysis.Run(network, matrices, [new SupportAccelerationHistory("b", Network.Ground, new StepFunction(1, 0))], [], ok));
        Assert.Throws<ArgumentException>(() => TransientAnalysis.Run(network, matrices, [], [new InitialCondition("nobody", 1, 0)], ok));
        Assert.Throws<ArgumentOutOfRangeException>(() => TransientAnalysis.Run(network, matrices, [], [], new TransientSettings(1, -1e-3)));
        Assert.Throws<ArgumentOutOfRangeException>(() => TransientAnalysis.Run(network, matrices, [], [], new TransientSettings(1, 2)));
        var large = RandomNetwork(TransientAnalysis.ExactMethodMaxDofs + 1, seed: 1);
        Assert.Throws<ArgumentOutOfRangeException>(() => TransientAnalysis.Run(large, Assembler.Assemble(large), [], [],
            new TransientSettings(1, 1e-3, TransientMethod.Exact)));
    }

    [Fact]
    public void Progress_IsReportedUpToCompletion()
    {
        var network = RandomNetwork(3, seed: 1);
        var seen = new List<double>();
        TransientAnalysis.Run(network, Assembler.Assemble(network), [], [], new TransientSettings(1, 1e-3), progress: new SyncProgress(seen));
        Assert.True(seen.Count > 10);
        Assert.Equal(1.0, seen[^1]);
    }

    private sealed class SyncProgress(List<double> seen) : IProgress<double>
    {
        public void Report(double value) => seen.Add(value);
    }
}
