using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.TestSupport;
using ResponseQuantity = ModalChain.Core.Analyses.Transient.ResponseQuantity;

namespace ModalChain.Core.Tests.Inerters;

/// <summary>
/// Base motion of a support that carries an inerter: the support's acceleration a loads the free DOFs by −M_fp a, in
/// harmonic and transient runs, line and spatial, against the closed form of m ẍ + b (ẍ − a) + c (ẋ − u̇) + k (x − u) = 0.
/// </summary>
/// <remarks>
/// Derivation (by hand, written here): with u = U e^{iωt}, (k + iωc − ω²(m + b)) X = (k + iωc − ω² b) U, so the
/// transmissibility is X/U = (k + iωc − ω²b)/(k + iωc − ω²(m + b)) (zero at ω² = k/b when c = 0) and the relative motion
/// Z = X − U = ω² m U/(k + iωc − ω²(m + b)). The support receives r = (k + iωc − ω²b)(X − U). For a step of base
/// acceleration a₀ from rest with c = 0, z = x − u obeys (m + b) z̈ + k z = −m a₀, so z = −(m a₀/k)(1 − cos ωt),
/// ω² = k/(m + b), and r = k z + b z̈.
/// </remarks>
public class InerterBaseMotionTests
{
    private const double M = 240, K = 9.5e4, B = 90;

    private static Network Line(double c) =>
        WithDamper(new NetworkBuilder().AddMass("m", M).AddSupport("floor")
            .AddSpring("k", "floor", "m", K).AddInerter("b", "m", "floor", B), c).Build();

    private static NetworkBuilder WithDamper(NetworkBuilder builder, double c) => c > 0 ? builder.AddDamper("c", "floor", "m", c) : builder;

    /// <summary>The same oscillator in 3d along z, the support at a location, the inerter per direction.</summary>
    private static Network Spatial(double c)
    {
        var builder = new NetworkBuilder { Space = ModelSpace.ThreeD }
            .AddMass(new Mass("m", M) { Location = new Point3(0, 0, 1), Moves = [Direction.Z] })
            .AddSupport(new Support("floor") { Location = new Point3(0, 0, 0) })
            .AddSpring(new Spring("k", "floor", "m", K) { Components = [new DirectionalValue(Direction.Z, K)] })
            .AddInerter(new Inerter("b", "m", "floor", B) { Components = [new DirectionalValue(Direction.Z, B)] });
        if (c > 0) builder.AddDamper(new Damper("c", "floor", "m", c) { Components = [new DirectionalValue(Direction.Z, c)] });
        return builder.Build();
    }

    [Theory]
    [InlineData(false, HarmonicMethod.Direct, 0.0)]
    [InlineData(false, HarmonicMethod.Modal, 0.0)]
    [InlineData(false, HarmonicMethod.Direct, 600.0)]
    [InlineData(true, HarmonicMethod.Direct, 0.0)]
    [InlineData(true, HarmonicMethod.Modal, 600.0)]
    public void HarmonicBaseAcceleration_MatchesTheTransmissibilityWithInerter(bool spatial, HarmonicMethod method, double c)
    {
        // Closed form in the class remarks; a base acceleration A gives U = −A/ω². 1e-10 relative (one complex solve).
        var network = spatial ? Spatial(c) : Line(c);
        const double a = 0.7, phase = 0.4;
        var load = new BaseMotionLoad("shake", "floor", BaseMotionKind.Acceleration, a, phase) { Direction = spatial ? Direction.Z : Direction.Along };
        var system = DampedSystem.Build(new StructuralModel(network, DampingModel.None, [load]));
        const string output = "m"; // a mass that moves in one direction is labelled by its name
        double[] frequencies = [0.5, 1.9, 2.9, 3.3, 5.2, 11.0];
        var result = HarmonicAnalysis.Sweep(system, frequencies, [load], [output], method);
        for (var f = 0; f < frequencies.Length; f++)
        {
            var w = 2 * Math.PI * frequencies[f];
            var u = -Complex.FromPolarCoordinates(a, phase) / (w * w);
            var z = new Complex(K, w * c);
            var x = (z - w * w * B) / (z - w * w * (M + B)) * u;
            var got = result.Responses[0].Displacement[f];
            NumericAssert.Small((got - x).Magnitude, 1e-10 * x.Magnitude, $"X at {frequencies[f]} Hz");
            NumericAssert.Small((got - u - w * w * M * u / (z - w * w * (M + B))).Magnitude, 1e-9 * x.Magnitude, $"X − U at {frequencies[f]} Hz");
            var reactionName = spatial ? "floor.z" : "floor";
            var reaction = result.Reactions.Single(r => r.Support == reactionName).Force[f];
            var expected = (z - w * w * B) * (x - u);
            NumericAssert.Small((reaction - expected).Magnitude, 1e-9 * Math.Max(expected.Magnitude, K * u.Magnitude), $"reaction at {frequencies[f]} Hz");
        }
    }

    [Fact]
    public void HarmonicBaseMotion_HasItsAntiResonanceAtKOverB()
    {
        // Undamped: X/U = (k − ω²b)/(k − ω²(m + b)) vanishes at ω² = k/b (closed form; the inerter's force cancels the spring's).
        var network = Line(0);
        var load = new BaseMotionLoad("shake", "floor", BaseMotionKind.Displacement, 1e-3, 0);
        var system = DampedSystem.Build(new StructuralModel(network, DampingModel.None, [load]));
        var f0 = Math.Sqrt(K / B) / (2 * Math.PI);
        var result = HarmonicAnalysis.Sweep(system, [f0], [load], ["m"], HarmonicMethod.Direct);
        NumericAssert.Small(result.Responses[0].Displacement[0].Magnitude, 1e-12 * 1e-3, "X at ω² = k/b");
    }

    [Theory]
    [InlineData(false, TransientMethod.Exact, false)]
    [InlineData(false, TransientMethod.Newmark, false)]
    [InlineData(false, TransientMethod.Exact, true)]
    [InlineData(true, TransientMethod.Exact, false)]
    [InlineData(true, TransientMethod.Modal, false)]
    [InlineData(true, TransientMethod.Newmark, true)]
    public void TransientStepOfBaseAcceleration_MatchesTheClosedForm(bool spatial, TransientMethod method, bool viaDampedSystem)
    {
        // z = −(m a₀/k)(1 − cos ωt), ω² = k/(m + b); r = k z + b z̈ (class remarks). Newmark's average acceleration has a
        // period error of order (ωh)²/12 (Chopra, Dynamics of Structures, §5.5, from memory): 400 steps per period keep it
        // below 1e-3 of the amplitude over three periods.
        const double a0 = 0.8;
        var network = spatial ? Spatial(0) : Line(0);
        var omega = Math.Sqrt(K / (M + B));
        var period = 2 * Math.PI / omega;
        var settings = new TransientSettings(3 * period, period / 400, method);
        var quake = new SupportAccelerationHistory("quake", "floor", new StepFunction(a0, 0)) { Direction = spatial ? Direction.Z : Direction.Along };
        // Two entry points: the network's own elements (line: assembled coupling; spatial: the partition), and an
        // assembled damped system (its partition's M_fp), as the command line runs it.
        var result = viaDampedSystem
            ? TransientAnalysis.Run(DampedSystem.Build(StructuralModel.Of(network)), [quake], [], settings)
            : TransientAnalysis.Run(network, Assembler.Assemble(network, referencePoint: null), [quake], [], settings);
        const string output = "m"; // a mass that moves in one direction is labelled by its name
        var x = result.Get(output, ResponseQuantity.Displacement);
        var reaction = result.Get(spatial ? "floor.z" : "floor", ResponseQuantity.Reaction);
        // The run's own energy balance (work of the loads, −M_fp a included, against kinetic, strain and dissipated
        // energy of the free DOFs) closes: no warning (identity).
        Assert.DoesNotContain(result.Warnings, w => w.Contains("energy balance", StringComparison.Ordinal));
        var amplitude = M * a0 / K;
        for (var s = 0; s < result.Times.Length; s += 37)
        {
            var t = result.Times[s];
            var z = -amplitude * (1 - Math.Cos(omega * t));
            var zdd = -amplitude * omega * omega * Math.Cos(omega * t);
            NumericAssert.Close(0.5 * a0 * t * t + z, x.Values[s], Tolerance.Abs(2e-3 * amplitude), $"absolute x at {t:F4} s");
            NumericAssert.Close(K * z + B * zdd, reaction.Values[s], Tolerance.Abs(2e-3 * M * a0), $"reaction at {t:F4} s");
        }
    }

    [Fact]
    public void ThePartition_CarriesTheInertersSupportColumns()
    {
        // M_fp = −b and M_pp = b for an inerter from a free DOF to a support (the two-terminal element matrix, identity).
        var p = SupportPartition.Assemble(Line(0));
        var floor = p.SupportIndex("floor");
        NumericAssert.Close(-B, p.MassFP[0, floor], Tolerance.Abs(0), "M_fp");
        NumericAssert.Close(B, p.MassPP[floor, floor], Tolerance.Abs(0), "M_pp");
        NumericAssert.Close(M + B, p.Mass[0, 0], Tolerance.Abs(0), "M_ff");
        Assert.True(p.HasInertialCoupling);
    }
}
