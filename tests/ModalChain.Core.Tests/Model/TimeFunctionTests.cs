using System.Collections.Immutable;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Model;

public class TimeFunctionTests
{
    [Fact]
    public void Step_IsZeroBeforeAndValueFromItsTime()
    {
        var f = new StepFunction(2000, 0.1);
        Assert.Equal(0.0, f.ValueAt(0.0999));
        Assert.Equal(2000.0, f.ValueAt(0.1));
        Assert.Equal(2000.0, f.ValueAt(5));
    }

    [Fact]
    public void Ramp_IsLinearBetweenItsEndsAndHeldOutside()
    {
        var f = new RampFunction(From: 100, To: 300, Over: 2, Start: 1);
        NumericAssert.Close(100, f.ValueAt(0.5), Tolerance.Abs(1e-12), "before");
        NumericAssert.Close(200, f.ValueAt(2), Tolerance.Abs(1e-12), "middle");
        NumericAssert.Close(300, f.ValueAt(7), Tolerance.Abs(1e-12), "after");
        Assert.Throws<ArgumentOutOfRangeException>(() => new RampFunction(0, 1, Over: 0));
    }

    [Fact]
    public void Pulses_HaveTheirShapeOnlyDuringTheirDuration()
    {
        var rect = new RectangularPulse(5, Duration: 0.02, Start: 0.01);
        Assert.Equal(0.0, rect.ValueAt(0.005));
        Assert.Equal(5.0, rect.ValueAt(0.02));
        Assert.Equal(0.0, rect.ValueAt(0.031));

        var half = new HalfSinePulse(5, Duration: 0.02, Start: 0.01);
        NumericAssert.Close(5, half.ValueAt(0.02), Tolerance.Abs(1e-12), "crest");
        NumericAssert.Close(5 * Math.Sin(Math.PI / 4), half.ValueAt(0.015), Tolerance.Abs(1e-12), "quarter");
        Assert.Equal(0.0, half.ValueAt(0.04));
        Assert.Throws<ArgumentOutOfRangeException>(() => new HalfSinePulse(1, Duration: -1));
    }

    [Fact]
    public void Sine_MatchesItsFormula()
    {
        var f = new SineFunction(3, FrequencyHz: 2, PhaseRadians: 0.5);
        foreach (var t in new[] { 0.0, 0.1, 0.37, 2.5 })
            NumericAssert.Close(3 * Math.Sin(4 * Math.PI * t + 0.5), f.ValueAt(t), Tolerance.Abs(1e-12), $"t = {t}");
    }

    [Fact]
    public void Table_InterpolatesLinearlyAndIsZeroOutsideItsSpan()
    {
        var f = new TableFunction([0.0, 0.1, 0.3], [0.0, 10.0, -10.0]);
        NumericAssert.Close(5, f.ValueAt(0.05), Tolerance.Abs(1e-12), "first segment");
        NumericAssert.Close(10, f.ValueAt(0.1), Tolerance.Abs(1e-12), "on a sample");
        NumericAssert.Close(0, f.ValueAt(0.2), Tolerance.Abs(1e-12), "second segment");
        Assert.Equal(0.0, f.ValueAt(0.31));
        Assert.Equal(0.0, f.ValueAt(-0.01));
    }

    [Fact]
    public void Table_RejectsUnsortedTimesMismatchedLengthsAndNaN()
    {
        Assert.Throws<ArgumentException>(() => new TableFunction([0.0, 0.2, 0.1], [1.0, 2.0, 3.0]));
        Assert.Throws<ArgumentException>(() => new TableFunction([0.0, 0.1, 0.1], [1.0, 2.0, 3.0]));
        Assert.Throws<ArgumentException>(() => new TableFunction([0.0, 0.1], [1.0]));
        Assert.Throws<ArgumentException>(() => new TableFunction([0.0, 0.1], [1.0, double.NaN]));
    }

    [Fact]
    public void RunUp_AngleIsTheExactIntegralOfTheSpeed()
    {
        // θ' = ω(t): checked by a central difference, which is exact for the piecewise quadratic θ away from the kinks.
        var f = new UnbalanceSpeedRamp(FromRadPerSecond: 10, ToRadPerSecond: 150, Over: 8, Start: 1, PhaseRadians: 0.3);
        const double d = 1e-4;
        foreach (var t in new[] { 0.5, 1.5, 4.0, 8.9, 12.0 })
            NumericAssert.Close(f.SpeedAt(t), (f.AngleAt(t + d) - f.AngleAt(t - d)) / (2 * d), Tolerance.Rel(1e-9), $"θ'({t})");
        // Closed form at the end of the ramp: θ = θ0 + ω0 t0 + (ω0 + ω1)/2 · T.
        NumericAssert.Close(0.3 + 10 * 1 + 80 * 8, f.AngleAt(9), Tolerance.Rel(1e-14), "θ(t0 + T)");
    }

    [Fact]
    public void RunUp_AtConstantSpeedIsTheSteadyUnbalanceForce()
    {
        // After the ramp: ω²·cos(ω t + const); during the ramp the tangential term α sin θ is added.
        var f = new UnbalanceSpeedRamp(0, 100, Over: 2);
        foreach (var t in new[] { 2.5, 3.0, 7.1 })
            NumericAssert.Close(1e4 * Math.Cos(f.AngleAt(t)), f.ValueAt(t), Tolerance.Abs(1e-8), $"t = {t}");
        var during = 1.2;
        var omega = 60.0;
        NumericAssert.Close(omega * omega * Math.Cos(f.AngleAt(during)) + 50 * Math.Sin(f.AngleAt(during)), f.ValueAt(during),
            Tolerance.Abs(1e-9), "during the ramp");
    }

    [Fact]
    public void RunDown_SlowsFromItsStartSpeed()
    {
        var f = new UnbalanceSpeedRamp(FromRadPerSecond: 150, ToRadPerSecond: 0, Over: 10);
        NumericAssert.Close(75, f.SpeedAt(5), Tolerance.Abs(1e-12), "half way");
        NumericAssert.Close(0, f.SpeedAt(20), Tolerance.Abs(1e-12), "stopped");
        NumericAssert.Close(750, f.AngleAt(20), Tolerance.Rel(1e-14), "total angle");
    }

    [Fact]
    public void Evaluation_DoesNotAllocate()
    {
        TimeFunction[] all =
        [
            new StepFunction(1, 0), new RampFunction(0, 1, 1), new RectangularPulse(1, 1), new HalfSinePulse(1, 1),
            new SineFunction(1, 1), new TableFunction(ImmutableArray.Create(0.0, 1.0, 2.0), ImmutableArray.Create(0.0, 1.0, 0.0)),
            new UnbalanceSpeedRamp(0, 100, 1),
        ];
        foreach (var f in all) f.ValueAt(0.5);
        var before = GC.GetAllocatedBytesForCurrentThread();
        var sum = 0.0;
        for (var i = 0; i < 1000; i++)
            foreach (var f in all) sum += f.ValueAt(i * 0.001);
        var allocated = GC.GetAllocatedBytesForCurrentThread() - before;
        Assert.True(double.IsFinite(sum));
        Assert.Equal(0, allocated);
    }
}
