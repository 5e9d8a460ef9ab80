using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Transient;

/// <summary>Harmonic loads as time histories: each one's steady sinusoid at its running speed, Re(P e^{iΩt}).</summary>
public sealed class SteadyLoadHistoriesTests
{
    private const double Hz = 12.5;
    private static readonly double Omega = 2 * Math.PI * Hz;
    private static readonly double[] Times = [0, 0.003, 0.017, 0.05, 0.2113];

    [Fact]
    public void Force_IsFCosOmegaTPlusPhi()
    {
        // F cos(Ωt + φ), the harmonic force of the model format (docs/model-format.md, 'force'), sampled at five instants.
        var history = Assert.IsType<ForceHistory>(Assert.Single(SteadyLoadHistories.Of(new ForceLoad("f", "m", 250, 0.7, Hz))));
        Assert.Equal("m", history.Mass);
        foreach (var t in Times)
            NumericAssert.Close(250 * Math.Cos(Omega * t + 0.7), history.Scale * history.Time.ValueAt(t), Tolerance.Abs(1e-9), $"F({t})");
    }

    [Fact]
    public void Unbalance_IsMeOmegaSquared_AndInAPlaneItsSecondComponentIsAQuarterTurnLater()
    {
        // Rotating unbalance m·e·Ω² (REFERENCES §4, common practice): cos along the first direction of the plane, sin along the second.
        const double me = 0.002, phase = -0.4;
        var line = Assert.IsType<ForceHistory>(Assert.Single(SteadyLoadHistories.Of(new UnbalanceLoad("u", "rotor", me, Hz, phase))));
        var planar = SteadyLoadHistories.Of(new UnbalanceLoad("u", "rotor", me, Hz, phase) { Plane = [Direction.X, Direction.Z] }).Cast<ForceHistory>().ToArray();
        Assert.Equal([Direction.X, Direction.Z], planar.Select(h => h.Direction).ToArray());
        foreach (var t in Times)
        {
            var amplitude = me * Omega * Omega;
            NumericAssert.Close(amplitude * Math.Cos(Omega * t + phase), line.Time.ValueAt(t), Tolerance.Abs(1e-9), $"line {t}");
            NumericAssert.Close(amplitude * Math.Cos(Omega * t + phase), planar[0].Time.ValueAt(t), Tolerance.Abs(1e-9), $"first {t}");
            NumericAssert.Close(amplitude * Math.Sin(Omega * t + phase), planar[1].Time.ValueAt(t), Tolerance.Abs(1e-9), $"second {t}");
        }
    }

    [Theory]
    [InlineData(BaseMotionKind.Displacement)]
    [InlineData(BaseMotionKind.Velocity)]
    [InlineData(BaseMotionKind.Acceleration)]
    public void BaseMotion_IsTheSecondDerivativeOfTheSupportsMotion(BaseMotionKind kind)
    {
        // u = A cos(Ωt + φ) → ü = −Ω²A cos(Ωt + φ); v = A cos(Ωt + φ) → ü = −ΩA sin(Ωt + φ); a = A cos(Ωt + φ) itself
        // (derivatives of a sinusoid, common practice).
        const double a = 0.003, phase = 1.1;
        var history = Assert.IsType<SupportAccelerationHistory>(Assert.Single(SteadyLoadHistories.Of(new BaseMotionLoad("b", "slab", kind, a, phase, Hz))));
        Assert.Equal("slab", history.Support);
        foreach (var t in Times)
        {
            var expected = kind switch
            {
                BaseMotionKind.Displacement => -Omega * Omega * a * Math.Cos(Omega * t + phase),
                BaseMotionKind.Velocity => -Omega * a * Math.Sin(Omega * t + phase),
                _ => a * Math.Cos(Omega * t + phase),
            };
            NumericAssert.Close(expected, history.Acceleration.ValueAt(t), Tolerance.Abs(1e-9 * Omega * Omega * a + 1e-15), $"ü({t})");
        }
    }

    [Fact]
    public void ALoadWithoutASpeed_IsRefused() =>
        Assert.Throws<ArgumentException>(() => SteadyLoadHistories.Of(new ForceLoad("f", "m", 1, 0)));
}
