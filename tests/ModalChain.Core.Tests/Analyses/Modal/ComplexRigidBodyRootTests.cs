using System.Numerics;
using MathNet.Numerics;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;
using ModalChain.Core.Tests.Analyses.Harmonic;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Modal;

/// <summary>
/// Roots of the damped system that belong to parts no spring ties to a support are identified from the topology and
/// labelled, never listed as round-off "modes" (oscillating at 1e-7 Hz, negative damping, Re λ &gt; 0; issue 12, item 7).
/// </summary>
public class ComplexRigidBodyRootTests
{
    [Fact]
    public void FreeMassOnADamperToGround_HasTheRootsZeroAndMinusCOverM()
    {
        // m ẍ + c ẋ = 0: λ(mλ + c) = 0, so λ = 0 and λ = −c/m exactly (derived by hand). A held, damped single-DOF
        // beside it makes the system non-classical (its damping is not that of the free mass). Tolerance 1e-14 rel.
        const double m = 4, c = 10;
        var network = new NetworkBuilder().AddMass("free", m).AddDamper("dashpot", Network.Ground, "free", c)
            .AddMass("held", 1).AddSpring("k", Network.Ground, "held", 100).AddDamper("ch", Network.Ground, "held", 1).Build();
        var modes = ComplexModes.Solve(HarmonicModels.System(network));

        var zero = Assert.Single(modes, r => r.Kind == ComplexModeKind.RigidBody);
        Assert.Equal(Complex.Zero, zero.EigenValue);
        var relaxation = Assert.Single(modes, r => r.Kind == ComplexModeKind.RigidBodyRelaxation);
        NumericAssert.Close(-c / m, relaxation.EigenValue.Real, Tolerance.Rel(1e-14), "relaxation root");
        Assert.Equal(0.0, relaxation.EigenValue.Imaginary);
        Assert.False(relaxation.IsOscillatory);
        // The held mass: λ² + λ + 100 = 0, ζ = 1/(2·10) (single-DOF, REFERENCES.md §4); tolerance 1e-12 relative.
        var elastic = Assert.Single(modes, r => r.Kind == ComplexModeKind.Elastic);
        NumericAssert.Close(0.05, elastic.DampingRatio, Tolerance.Rel(1e-12), "ζ of the held mass");
    }

    [Fact]
    public void FreeMassWithoutDamper_HasADoubleZeroRootAndNothingElse()
    {
        // m ẍ = 0: λ² = 0 (free drift x = a + b t). Next to a damped held mass (classical or not, the zero roots are exact).
        var network = new NetworkBuilder().AddMass("loose", 2)
            .AddMass("held", 1).AddSpring("k", Network.Ground, "held", 100).AddDamper("ch", Network.Ground, "held", 3).Build();
        var modes = ComplexModes.Solve(HarmonicModels.System(network));
        Assert.Equal(2, modes.Count(r => r.Kind == ComplexModeKind.RigidBody));
        Assert.DoesNotContain(modes, r => r.Kind == ComplexModeKind.RigidBodyRelaxation);
        Assert.Single(modes, r => r.Kind == ComplexModeKind.Elastic);
    }

    [Fact]
    public void FreeTwoMassGroupDampedToGround_HasOneZeroRootOneRelaxationAndOneOscillatoryPair()
    {
        // a –k– b, no spring to ground, a damper c from ground to a (non-classical: it couples the rigid and the
        // flexible mode). By hand, det(λ²M + λC + K) = (m1λ² + cλ + k)(m2λ² + k) − k²
        //   = λ·(m1m2λ³ + c·m2λ² + k(m1+m2)λ + c·k).
        // The cubic's roots, found independently by Math.NET's companion-matrix root finder, are the relaxation (real)
        // and the oscillatory pair. Tolerance 1e-10 absolute (roots of size ~10).
        const double m1 = 2, m2 = 3, k = 300, c = 7;
        var network = new NetworkBuilder().AddMass("a", m1).AddMass("b", m2)
            .AddSpring("k", "a", "b", k).AddDamper("c", Network.Ground, "a", c).Build();
        var system = HarmonicModels.System(network);
        Assert.False(system.IsClassical);
        var modes = ComplexModes.Solve(system);

        var cubic = FindRoots.Polynomial([c * k, k * (m1 + m2), c * m2, m1 * m2]);
        var real = cubic.Single(r => Math.Abs(r.Imaginary) < 1e-9);
        var pair = cubic.Single(r => r.Imaginary > 1e-9);

        Assert.Equal(3, modes.Length);
        Assert.Equal(ComplexModeKind.RigidBody, modes[0].Kind);
        Assert.Equal(Complex.Zero, modes[0].EigenValue);
        var relaxation = Assert.Single(modes, r => r.Kind == ComplexModeKind.RigidBodyRelaxation);
        NumericAssert.Close(real.Real, relaxation.EigenValue.Real, Tolerance.Abs(1e-10), "relaxation root");
        var oscillatory = Assert.Single(modes, r => r.IsOscillatory);
        NumericAssert.Close(pair.Real, oscillatory.EigenValue.Real, Tolerance.Abs(1e-10), "Re λ of the pair");
        NumericAssert.Close(pair.Imaginary, oscillatory.EigenValue.Imaginary, Tolerance.Abs(1e-10), "Im λ of the pair");
    }

    [Fact]
    public void FreeGroupWithInternalNonClassicalDamping_HasADoubleZeroAndOnlyStableElasticRoots()
    {
        // a –k1– b –k2– c, no support, one damper between a and b only (not proportional to K: non-classical). No damper
        // reaches a support, so the group drifts: a double zero root. The 2n = 6 roots are the 2 zeros and the 4 of
        // two damped elastic modes (identity: the roots of det(λ²M + λC + K), a degree-2n polynomial). Every elastic
        // root satisfies the quadratic eigenproblem to 1e-9 of ‖K‖ and none has Re λ > 0 or a frequency below 1 Hz.
        var network = new NetworkBuilder().AddMass("a", 5).AddMass("b", 1).AddMass("c", 3)
            .AddSpring("k1", "a", "b", 4e4).AddSpring("k2", "b", "c", 9e4).AddDamper("d", "a", "b", 60).Build();
        var system = HarmonicModels.System(network);
        Assert.False(system.IsClassical);
        var modes = ComplexModes.Solve(system);

        Assert.Equal(2, modes.Count(r => r.Kind == ComplexModeKind.RigidBody));
        Assert.DoesNotContain(modes, r => r.Kind == ComplexModeKind.RigidBodyRelaxation);
        var elastic = modes.Where(r => r.Kind == ComplexModeKind.Elastic).ToArray();
        Assert.Equal(4, elastic.Sum(r => r.IsOscillatory ? 2 : 1));
        var p = system.Partition;
        var scale = p.StiffnessFF.L2Norm();
        foreach (var mode in elastic)
        {
            Assert.True(mode.EigenValue.Real < 0, $"mode {mode.Number}: Re λ = {mode.EigenValue.Real}");
            Assert.True(mode.UndampedFrequencyHz > 1, $"mode {mode.Number}: {mode.UndampedFrequencyHz} Hz");
            var l = mode.EigenValue;
            var q = p.Mass.ToComplex() * (l * l) + system.Damping.FF.ToComplex() * l + p.StiffnessFF.ToComplex();
            NumericAssert.Small(q.Svd(false).S.Select(s => s.Magnitude).Min(), 1e-9 * scale, $"mode {mode.Number}");
        }
    }

    [Fact]
    public void RandomNetworksWithAFreePart_ListNoSpuriousRoots()
    {
        // Seeded random held networks with dampers, plus a free three-mass group damped only internally: every
        // elastic root must be stable and satisfy the quadratic eigenproblem to 1e-8 of ‖K‖ (identity); the root
        // count is 2n (zeros and real roots once, oscillatory pairs twice).
        for (var seed = 1; seed <= 8; seed++)
        {
            var held = HarmonicModels.Random(seed, 5, dampers: true);
            var b = new NetworkBuilder();
            foreach (var m in held.Masses) b.AddMass(m.Name, m.Kilograms);
            foreach (var s in held.Springs) b.AddSpring(s.Name, s.NodeA, s.NodeB, s.Stiffness);
            foreach (var d in held.Dampers) b.AddDamper(d.Name, d.NodeA, d.NodeB, d.Coefficient);
            b.AddMass("f1", 20).AddMass("f2", 35).AddMass("f3", 15)
                .AddSpring("f12", "f1", "f2", 3e4).AddSpring("f23", "f2", "f3", 5e4).AddDamper("fd", "f1", "f2", 200);
            var system = HarmonicModels.System(b.Build());
            var modes = ComplexModes.Solve(system);
            Assert.Equal(2 * 8, modes.Sum(r => r.IsOscillatory ? 2 : 1));
            Assert.Equal(2, modes.Count(r => r.Kind == ComplexModeKind.RigidBody));
            var p = system.Partition;
            var scale = p.StiffnessFF.L2Norm();
            foreach (var mode in modes.Where(r => r.Kind != ComplexModeKind.RigidBody))
            {
                Assert.True(mode.EigenValue.Real < 0, $"seed {seed}, mode {mode.Number}: Re λ = {mode.EigenValue.Real}");
                var l = mode.EigenValue;
                var q = p.Mass.ToComplex() * (l * l) + system.Damping.FF.ToComplex() * l + p.StiffnessFF.ToComplex();
                NumericAssert.Small(q.Svd(false).S.Select(s => s.Magnitude).Min(), 1e-8 * scale, $"seed {seed}, mode {mode.Number}");
            }
        }
    }
}
