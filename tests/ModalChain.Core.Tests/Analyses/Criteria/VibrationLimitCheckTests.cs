using System.Numerics;
using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Criteria;

// Harmonic kinematics: for x = Re(X e^{iωt}), |v| = ω|X|, |a| = ω²|X|, r.m.s. = peak/√2 (any vibration textbook
// [common practice]); the r.m.s. of a sum of harmonics at different frequencies is the root of the sum of squares
// (Parseval's theorem [common practice]), also checked here by sampling.
public class VibrationLimitCheckTests
{
    [Fact]
    public void OneComponent_PeakAndRmsOfEachQuantity()
    {
        var x = new HarmonicComponent(10, Complex.FromPolarCoordinates(2e-4, 0.7));
        var w = 2 * Math.PI * 10;
        NumericAssert.Close(2e-4, VibrationLimitCheck.Amplitude([x], ResponseQuantity.Displacement, AmplitudeMeasure.Peak), Tolerance.Rel(1e-14));
        NumericAssert.Close(2e-4 * w, VibrationLimitCheck.Amplitude([x], ResponseQuantity.Velocity, AmplitudeMeasure.Peak), Tolerance.Rel(1e-14));
        NumericAssert.Close(2e-4 * w * w / Math.Sqrt(2), VibrationLimitCheck.Amplitude([x], ResponseQuantity.Acceleration, AmplitudeMeasure.Rms), Tolerance.Rel(1e-14));
    }

    [Fact]
    public void TwoFrequencies_RmsIsRootSumOfSquares_PeakIsTheSumBound()
    {
        var parts = new[] { new HarmonicComponent(10, new Complex(3e-4, 0)), new HarmonicComponent(20, new Complex(0, 1e-4)) };
        var v1 = 3e-4 * 2 * Math.PI * 10;
        var v2 = 1e-4 * 2 * Math.PI * 20;
        NumericAssert.Close(Math.Sqrt((v1 * v1 + v2 * v2) / 2), VibrationLimitCheck.Amplitude(parts, ResponseQuantity.Velocity, AmplitudeMeasure.Rms), Tolerance.Rel(1e-14));
        NumericAssert.Close(v1 + v2, VibrationLimitCheck.Amplitude(parts, ResponseQuantity.Velocity, AmplitudeMeasure.Peak), Tolerance.Rel(1e-14));

        // Sampled check of the r.m.s. over the common period 0.1 s, 1e-9 relative.
        const int n = 100000;
        var sum = 0.0;
        for (var i = 0; i < n; i++)
        {
            var t = 0.1 * i / n;
            var v = parts.Sum(p => (p.Displacement * Complex.ImaginaryOne * 2 * Math.PI * p.FrequencyHz * Complex.Exp(Complex.ImaginaryOne * 2 * Math.PI * p.FrequencyHz * t)).Real);
            sum += v * v;
        }
        NumericAssert.Close(Math.Sqrt(sum / n), VibrationLimitCheck.Amplitude(parts, ResponseQuantity.Velocity, AmplitudeMeasure.Rms), Tolerance.Rel(1e-9), "sampled r.m.s.");
    }

    [Fact]
    public void Reserve_IsTheFractionBelowTheLimit()
    {
        var limit = new VibrationLimit("skid", ResponseQuantity.Velocity, AmplitudeMeasure.Peak, 4e-3);
        var x = new HarmonicComponent(25, new Complex(3e-3 / (2 * Math.PI * 25), 0)); // 3 mm/s
        var result = VibrationLimitCheck.Evaluate(limit, [x]);
        Assert.True(result.Passes);
        NumericAssert.Close(0.25, result.Reserve, Tolerance.Rel(1e-12), "(4 − 3)/4");
        var over = VibrationLimitCheck.Evaluate(limit, [x with { Displacement = x.Displacement * 2 }]);
        Assert.False(over.Passes);
        NumericAssert.Close(-0.5, over.Reserve, Tolerance.Rel(1e-12), "(4 − 6)/4");
    }
}
