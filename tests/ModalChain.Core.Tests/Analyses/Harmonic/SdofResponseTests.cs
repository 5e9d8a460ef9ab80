using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Harmonic;

/// <summary>Single-mass responses against the closed forms of the damped oscillator.</summary>
/// <remarks>
/// D = 1/√((1−r²)² + (2ζr)²), phase lag atan2(2ζr, 1−r²), TR = D√(1+(2ζr)²), unbalance M X/(m e) = r²D, peak
/// 1/(2ζ√(1−ζ²)) at r = √(1−2ζ²): Rao, Mechanical Vibrations, ch. 3; Thomson &amp; Dahleh ch. 3; Chopra ch. 3
/// (standard results; printed values recomputed, attributions from memory, /work/shared/REFERENCES.md §4).
/// </remarks>
public class SdofResponseTests
{
    private const double M = 250, K = 4.0e6;
    private static readonly double OmegaN = Math.Sqrt(K / M);

    private static Complex Receptance(double zeta, double r, HarmonicMethod method = HarmonicMethod.Direct)
    {
        var system = HarmonicModels.System(HarmonicModels.Sdof(M, K, zeta), null, new ForceLoad("f", "m", 1, 0));
        var result = HarmonicAnalysis.Sweep(system, [r * OmegaN / (2 * Math.PI)], system.Model.Loads, ["m"], method);
        return result.Responses[0].Displacement[0];
    }

    private static double D(double zeta, double r) => 1 / Math.Sqrt(Math.Pow(1 - r * r, 2) + Math.Pow(2 * zeta * r, 2));

    [Theory]
    [InlineData(0.05, 0.5, 1.330380, 3.8141)]
    [InlineData(0.05, 2.0, 0.332595, 176.1859)]
    public void AmplificationAndPhase_MatchPrintedValues(double zeta, double r, double d, double lagDeg)
    {
        // REFERENCES.md §4 (values recomputed; standard SDOF result, e.g. Rao ch. 3 [from memory]); tolerance 1e-6 abs on the 6/4-decimal figures.
        var x = Receptance(zeta, r);
        NumericAssert.Close(d, x.Magnitude * K, Tolerance.Abs(1e-6), "D");
        NumericAssert.Close(lagDeg, -x.Phase * 180 / Math.PI, Tolerance.Abs(1e-4), "phase lag [deg]");
    }

    [Fact]
    public void AmplificationAndPhase_MatchClosedFormAtManyRatios()
    {
        // Closed form D(r, ζ) and lag atan2(2ζr, 1 − r²) (standard SDOF result; Chopra, Dynamics of Structures, §3.2 [from memory]); tolerance 1e-9 rel.
        foreach (var zeta in new[] { 0.005, 0.02, 0.05, 0.1, 0.3, 0.7 })
            foreach (var r in new[] { 0.1, 0.5, 0.9, 0.99, 1.0, 1.01, 1.2, 2, 5, 10 })
                foreach (var method in new[] { HarmonicMethod.Direct, HarmonicMethod.Modal })
                {
                    var x = Receptance(zeta, r, method);
                    NumericAssert.Close(D(zeta, r), x.Magnitude * K, Tolerance.Rel(1e-9), $"D at ζ={zeta}, r={r}, {method}");
                    NumericAssert.Close(Math.Atan2(2 * zeta * r, 1 - r * r), -x.Phase, Tolerance.Abs(1e-9), $"lag at ζ={zeta}, r={r}, {method}");
                }
    }

    [Theory]
    [InlineData(0.1, 5.025189, 0.989949)]
    [InlineData(0.05, 10.012523, 0.997497)]
    public void Peak_IsAtDampedResonanceRatio(double zeta, double peak, double rPeak)
    {
        // Peak 1/(2ζ√(1−ζ²)) at r = √(1−2ζ²) (REFERENCES.md §4; the ζ = 0.05 row recomputed from the same formulas); tolerance 1e-6.
        var system = HarmonicModels.System(HarmonicModels.Sdof(M, K, zeta), null, new ForceLoad("f", "m", 1, 0));
        var fn = OmegaN / (2 * Math.PI);
        var p = HarmonicAnalysis.PeakResponse(system, system.Model.Loads, "m", 0.2 * fn, 3 * fn);
        NumericAssert.Close(1 / (2 * zeta * Math.Sqrt(1 - zeta * zeta)), p.Magnitude * K, Tolerance.Rel(1e-9), "peak formula");
        NumericAssert.Close(peak, p.Magnitude * K, Tolerance.Abs(1e-6), "peak D");
        NumericAssert.Close(rPeak, p.FrequencyHz / fn, Tolerance.Abs(1e-6), "peak ratio");
    }

    [Theory]
    [InlineData(0.05, 0.5, 1.332042)]
    [InlineData(0.05, 2.0, 0.339182)]
    [InlineData(0.1, 3.0, 0.145366)]
    public void ForceTransmissibility_MatchesPrintedValues(double zeta, double r, double tr)
    {
        // TR = D√(1+(2ζr)²) for a force on a mass held by a spring and a damper in parallel (REFERENCES.md §4, values recomputed); tolerance 1e-6.
        var system = HarmonicModels.System(HarmonicModels.Sdof(M, K, zeta), null, new ForceLoad("f", "m", 1, 0));
        var result = HarmonicAnalysis.Sweep(system, [r * OmegaN / (2 * Math.PI)], system.Model.Loads, ["m"], HarmonicMethod.Direct);
        NumericAssert.Close(tr, result.Reactions.Single(x => x.Support == Network.Ground).Force[0].Magnitude, Tolerance.Abs(1e-6), "ground reaction / F");
        NumericAssert.Close(tr, result.Transmissibilities.Single(t => t.Kind == "force").Ratio[0], Tolerance.Abs(1e-6), "force transmissibility");
    }

    [Theory]
    [InlineData(BaseMotionKind.Displacement)]
    [InlineData(BaseMotionKind.Velocity)]
    [InlineData(BaseMotionKind.Acceleration)]
    public void BaseExcitation_MotionTransmissibilityMatchesClosedForm(BaseMotionKind kind)
    {
        // |X/U| = √(1+(2ζr)²)/√((1−r²)²+(2ζr)²) for base excitation through a spring and damper (REFERENCES.md §4); tolerance 1e-9 rel.
        const double zeta = 0.05;
        var system = HarmonicModels.System(HarmonicModels.Sdof(M, K, zeta, "plinth"), null,
            new BaseMotionLoad("shake", "plinth", kind, 0.002, 0.3));
        foreach (var r in new[] { 0.5, 1.0, Math.Sqrt(2), 2.0 })
        {
            var result = HarmonicAnalysis.Sweep(system, [r * OmegaN / (2 * Math.PI)], system.Model.Loads, ["m"], HarmonicMethod.Direct);
            var expected = D(zeta, r) * Math.Sqrt(1 + Math.Pow(2 * zeta * r, 2));
            NumericAssert.Close(expected, result.Transmissibilities.Single(t => t.Kind == "motion").Ratio[0], Tolerance.Rel(1e-9), $"TR at r={r}");
        }
    }

    [Fact]
    public void BaseExcitation_WithModalDamping_HasClassicalTransmissibility()
    {
        // Modal damping acts on motion relative to the support (Chopra §13.5 [from memory]), so the SDOF transmissibility is the
        // same closed form as with a parallel damper (REFERENCES.md §4); tolerance 1e-9 rel, direct and modal alike.
        const double zeta = 0.05;
        var system = HarmonicModels.System(HarmonicModels.Sdof(M, K, 0, "plinth"), DampingModel.Modal(zeta),
            new BaseMotionLoad("shake", "plinth", BaseMotionKind.Acceleration, 1.0, 0));
        foreach (var method in new[] { HarmonicMethod.Direct, HarmonicMethod.Modal })
            foreach (var r in new[] { 0.5, 2.0 })
            {
                var result = HarmonicAnalysis.Sweep(system, [r * OmegaN / (2 * Math.PI)], system.Model.Loads, ["m"], method);
                var expected = D(zeta, r) * Math.Sqrt(1 + Math.Pow(2 * zeta * r, 2));
                NumericAssert.Close(expected, result.Transmissibilities.Single().Ratio[0], Tolerance.Rel(1e-9), $"TR at r={r}, {method}");
                NumericAssert.Close(expected, result.Reactions.Single(x => x.Support == "plinth").Force[0].Magnitude /
                    (M * 1.0), Tolerance.Rel(1e-9), $"plinth force / (m·a) at r={r}, {method}");
            }
    }

    [Fact]
    public void RotatingUnbalance_MatchesClosedForm()
    {
        // M X/(m e) = r² D (rotating unbalance; Rao, Mechanical Vibrations, §3.7 [from memory]; REFERENCES.md §4); tolerance 1e-9 rel.
        const double zeta = 0.08, me = 0.015;
        var system = HarmonicModels.System(HarmonicModels.Sdof(M, K, zeta), null, new UnbalanceLoad("rotor", "m", me));
        foreach (var r in new[] { 0.3, 0.9, 1.0, 1.5, 4.0 })
        {
            var x = HarmonicAnalysis.Sweep(system, [r * OmegaN / (2 * Math.PI)], system.Model.Loads, ["m"], HarmonicMethod.Direct).Responses[0].Displacement[0];
            NumericAssert.Close(r * r * D(zeta, r), M * x.Magnitude / me, Tolerance.Rel(1e-9), $"MX/(me) at r={r}");
        }
    }

    [Fact]
    public void HalfPowerPoints_OfComputedFrf_GiveDampingRatio()
    {
        // ζ = 0.1. With the level |X(ω_n)|/√2 (Q/√2, Q = 1/(2ζ): the half-power definition of Rao, Mechanical Vibrations, §3.4
        // [from memory]) the points are r² = 1 − 2ζ² ∓ 2ζ√(1+ζ²) → r = 0.882611 and 1.086737 (REFERENCES.md §4, recomputed).
        // With the level (true peak)/√2 they are r² = 1 − 2ζ² ∓ 2ζ√(1−ζ²) (derived by hand from D(r)). The bandwidth estimate
        // ζ ≈ (r2 − r1)/2 is the common practice check. Tolerance 1e-5 on r (linear interpolation on a 2001-point sweep).
        const double zeta = 0.1;
        var system = HarmonicModels.System(HarmonicModels.Sdof(M, K, zeta), null, new ForceLoad("f", "m", 1, 0));
        var fn = OmegaN / (2 * Math.PI);
        var spec = new HarmonicSpec([], new FrequencyRange(0.5 * fn, 1.5 * fn, 2001, FrequencySpacing.Linear), true, [], HarmonicMethod.Modal);
        var result = HarmonicAnalysis.Solve(system, spec);
        var mag = result.Magnitudes(result.Responses[0], ResponseQuantity.Displacement);
        var f = result.FrequenciesHz;
        var atResonance = mag[f.IndexOf(fn)];
        NumericAssert.Close(1 / (2 * zeta), atResonance * K, Tolerance.Rel(1e-9), "Q = D(r = 1)");
        (double, double) Points(double level)
        {
            double Crossing(bool rising)
            {
                for (var i = 1; i < mag.Length; i++)
                    if (rising ? mag[i - 1] < level && mag[i] >= level : mag[i - 1] >= level && mag[i] < level)
                        return f[i - 1] + (level - mag[i - 1]) / (mag[i] - mag[i - 1]) * (f[i] - f[i - 1]);
                throw new InvalidOperationException("no crossing");
            }
            return (Crossing(true) / fn, Crossing(false) / fn);
        }
        var (r1, r2) = Points(atResonance / Math.Sqrt(2));
        NumericAssert.Close(0.882611, r1, Tolerance.Abs(1e-5), "lower half-power ratio (Q/√2)");
        NumericAssert.Close(1.086737, r2, Tolerance.Abs(1e-5), "upper half-power ratio (Q/√2)");
        NumericAssert.Close(zeta, (r2 - r1) / 2, Tolerance.Rel(0.03), "bandwidth estimate of ζ");
        var (p1, p2) = Points(mag.Max() / Math.Sqrt(2));
        var root = 2 * zeta * Math.Sqrt(1 - zeta * zeta);
        NumericAssert.Close(Math.Sqrt(1 - 2 * zeta * zeta - root), p1, Tolerance.Abs(1e-5), "lower half-power ratio (peak/√2)");
        NumericAssert.Close(Math.Sqrt(1 - 2 * zeta * zeta + root), p2, Tolerance.Abs(1e-5), "upper half-power ratio (peak/√2)");
    }
}
