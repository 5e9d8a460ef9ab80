using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

using HarmonicQuantity = ModalChain.Core.Analyses.Harmonic.ResponseQuantity;
using ResponseQuantity = ModalChain.Core.Analyses.Transient.ResponseQuantity;

namespace ModalChain.Core.Tests.Analyses.Transient;

/// <summary>A rotating unbalance accelerated through the resonance of the mass it sits on.</summary>
public class RunUpThroughResonanceTests
{
    private const double Mass = 500, Zeta = 0.02, MassRadius = 0.5;
    private static readonly double OmegaN = 2 * Math.PI * 5;

    private static (Peak Peak, double SpeedAtPeak) RunUp(double sweepRate, double step)
    {
        // sweepRate η = α/ωn² (dimensionless angular acceleration), the parameter of passage through resonance.
        var k = Mass * OmegaN * OmegaN;
        var network = new NetworkBuilder().AddMass("rotor", Mass).AddSpring("mount", Network.Ground, "rotor", k)
            .AddDamper("loss", Network.Ground, "rotor", 2 * Zeta * Math.Sqrt(k * Mass)).Build();
        var alpha = sweepRate * OmegaN * OmegaN;
        var over = OmegaN / alpha;
        var ramp = new UnbalanceSpeedRamp(0.5 * OmegaN, 1.5 * OmegaN, over);
        var settings = new TransientSettings(over, step, TransientMethod.Modal) { RecordEvery = 100 };
        var result = TransientAnalysis.Run(network, Assembler.Assemble(network), [new ForceHistory("start-up", "rotor", MassRadius, ramp)], [], settings);
        var peak = result.Get("rotor", ResponseQuantity.Displacement).Peak;
        return (peak, ramp.SpeedAt(peak.Time));
    }

    /// <summary>Steady-state peak of a rotating-unbalance response: M X/(m e) = r² D, largest value 1/(2ζ√(1 − ζ²))
    /// at r = 1/√(1 − 2ζ²) (REFERENCES §4; Rao, Mechanical Vibrations, §3.7 — from memory; re-derived).</summary>
    private static double SteadyStatePeak => MassRadius / Mass / (2 * Zeta * Math.Sqrt(1 - Zeta * Zeta));

    [Fact]
    public void SlowRunUp_PeakApproachesSteadyStateResonantAmplitude()
    {
        // η = 2e-5 ≪ ζ² = 4e-4: the half-power band is crossed in ~60 s, far longer than the build-up time 1/(ζωn) = 1.6 s,
        // so the response follows the steady state (quasi-stationary passage; common practice).
        var (peak, speed) = RunUp(2e-5, 0.005);
        NumericAssert.Close(SteadyStatePeak, Math.Abs(peak.Value), Tolerance.Rel(0.02), "slow run-up peak");
        NumericAssert.Close(OmegaN, speed, Tolerance.Rel(0.01), "speed at the peak");
    }

    [Fact]
    public void SlowRunUp_PeakApproachesTheHarmonicAnalysisResonantAmplitude()
    {
        // The same model through the harmonic analysis: a fine sweep of the unbalance response around resonance gives
        // the steady-state peak the slow run-up must approach (quasi-stationary passage; common practice).
        var k = Mass * OmegaN * OmegaN;
        var network = new NetworkBuilder().AddMass("rotor", Mass).AddSpring("mount", Network.Ground, "rotor", k)
            .AddDamper("loss", Network.Ground, "rotor", 2 * Zeta * Math.Sqrt(k * Mass)).Build();
        var system = DampedSystem.Build(StructuralModel.Of(network));
        var fn = OmegaN / (2 * Math.PI);
        var frequencies = Enumerable.Range(0, 2001).Select(i => fn * (0.9 + 0.2 * i / 2000)).ToArray();
        var sweep = HarmonicAnalysis.Sweep(system, frequencies, [new UnbalanceLoad("u", "rotor", MassRadius)], ["rotor"], HarmonicMethod.Direct);
        var steady = sweep.Peaks().Single(p => p.Dof == "rotor" && p.Quantity == HarmonicQuantity.Displacement).Magnitude;
        NumericAssert.Close(SteadyStatePeak, steady, Tolerance.Rel(1e-5), "harmonic peak against the closed form");
        var (peak, _) = RunUp(2e-5, 0.005);
        NumericAssert.Close(steady, Math.Abs(peak.Value), Tolerance.Rel(0.02), "slow run-up peak against the harmonic peak");
    }

    [Fact]
    public void FastRunUp_GivesALowerPeakAtAHigherSpeed()
    {
        // Passage through resonance (Lewis, "Vibration during acceleration through a critical speed", Trans. ASME 54,
        // 1932 — from memory; also Genta, Dynamics of Rotating Systems, 2005, §23 — from memory): the faster the run-up,
        // the lower the peak and the later (at a higher speed) it occurs.
        var slow = RunUp(2e-5, 0.005);
        var fast = RunUp(1e-3, 0.005);
        var faster = RunUp(4e-3, 0.005);
        Assert.True(Math.Abs(fast.Peak.Value) < 0.9 * Math.Abs(slow.Peak.Value), $"fast peak {fast.Peak.Value} vs slow {slow.Peak.Value}");
        Assert.True(Math.Abs(faster.Peak.Value) < Math.Abs(fast.Peak.Value), $"faster peak {faster.Peak.Value} vs fast {fast.Peak.Value}");
        Assert.True(fast.SpeedAtPeak > slow.SpeedAtPeak, $"fast peak at {fast.SpeedAtPeak} rad/s vs slow {slow.SpeedAtPeak}");
        Assert.True(faster.SpeedAtPeak > fast.SpeedAtPeak, $"faster peak at {faster.SpeedAtPeak} rad/s vs fast {fast.SpeedAtPeak}");
    }

    [Fact]
    public void RunUp_NewmarkAgreesWithModal()
    {
        // Two independent integrators on the same fast run-up: the peaks agree to the Newmark phase error at ~40 steps/period.
        var k = Mass * OmegaN * OmegaN;
        var network = new NetworkBuilder().AddMass("rotor", Mass).AddSpring("mount", Network.Ground, "rotor", k)
            .AddDamper("loss", Network.Ground, "rotor", 2 * Zeta * Math.Sqrt(k * Mass)).Build();
        var ramp = new UnbalanceSpeedRamp(0, 1.5 * OmegaN, 15);
        TransientExcitation[] load = [new ForceHistory("start-up", "rotor", MassRadius, ramp)];
        var matrices = Assembler.Assemble(network);
        var modal = TransientAnalysis.Run(network, matrices, load, [], new TransientSettings(15, 0.002, TransientMethod.Modal));
        var newmark = TransientAnalysis.Run(network, matrices, load, [], new TransientSettings(15, 0.002, TransientMethod.Newmark));
        NumericAssert.Close(Math.Abs(modal.Get("rotor", ResponseQuantity.Displacement).Peak.Value),
            Math.Abs(newmark.Get("rotor", ResponseQuantity.Displacement).Peak.Value), Tolerance.Rel(0.01), "peak");
    }
}
