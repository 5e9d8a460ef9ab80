using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Massless;

/// <summary>Massless nodes that carry springs only: condensed statically, modes against series/star closed forms.</summary>
public class StaticCondensationTests
{
    [Theory]
    [InlineData(250.0, 4e5, 1.5e5)]
    [InlineData(1.0, 1.0, 1e6)]
    [InlineData(3200.0, 2.2e7, 2.2e7)]
    public void MassOnTwoSeriesSprings_HasTheSeriesStiffnessFrequency_AndTheDividerRatioAtTheNode(double m, double k1, double k2)
    {
        // Closed form (springs in series): k = k1·k2/(k1 + k2), f = √(k/m)/2π; the massless node between them moves
        // by the static divider ratio k1/(k1 + k2) of the mass's motion (force k1(x − y) = k2·y).
        var network = new NetworkBuilder { Title = "series springs" }
            .AddMass("m", m).AddNode("joint")
            .AddSpring("k1", "m", "joint", k1).AddSpring("k2", "joint", Network.Ground, k2)
            .Build();
        var result = ModalAnalysis.Solve(network);
        var mode = Assert.Single(result.Modes);
        var series = k1 * k2 / (k1 + k2);
        NumericAssert.Close(Math.Sqrt(series / m) / (2 * Math.PI), mode.NaturalFrequencyHz, Tolerance.Rel(1e-12), "frequency");
        var shape = result.ShapeByMass(mode);
        NumericAssert.Close(1 / Math.Sqrt(m), shape[0], Tolerance.Rel(1e-12), "mass-normalised shape at the mass");
        NumericAssert.Close(k1 / (k1 + k2), shape[1] / shape[0], Tolerance.Rel(1e-12), "divider ratio at the joint");
        Assert.Equal(new[] { 1 }, result.CondensedDofs.ToArray());
        NumericAssert.Close(0, mode.KineticEnergyShare[1], Tolerance.Abs(0), "no kinetic energy at the massless node");
        // Strain energy splits as the flexibilities: share of k1 = k2/(k1 + k2) (series springs carry one force).
        NumericAssert.Close(k2 / (k1 + k2), mode.StrainEnergyShare[0], Tolerance.Rel(1e-10), "strain share of k1");
    }

    [Fact]
    public void MasslessStarOfThreeSprings_EqualsTheDeltaOfTheStarMeshTransform()
    {
        // Star–mesh transform (Rosen 1924; common practice for spring and resistor networks): a node joined by
        // springs k_a, k_b, k_c to a, b, c is replaced by springs k_a·k_b/Σk between a and b, and so on.
        double ka = 3e5, kb = 1.2e5, kc = 7e4, m1 = 40, m2 = 95;
        var star = new NetworkBuilder { Title = "star" }
            .AddMass("a", m1).AddMass("b", m2).AddNode("hub")
            .AddSpring("ka", "a", "hub", ka).AddSpring("kb", "b", "hub", kb).AddSpring("kc", "hub", Network.Ground, kc)
            .AddSpring("ground-a", "a", Network.Ground, 2e4)
            .Build();
        var sum = ka + kb + kc;
        var delta = new NetworkBuilder { Title = "delta" }
            .AddMass("a", m1).AddMass("b", m2)
            .AddSpring("ab", "a", "b", ka * kb / sum).AddSpring("ag", "a", Network.Ground, ka * kc / sum)
            .AddSpring("bg", "b", Network.Ground, kb * kc / sum).AddSpring("ground-a", "a", Network.Ground, 2e4)
            .Build();
        var condensed = ModalAnalysis.Solve(star);
        var reference = ModalAnalysis.Solve(delta);
        Assert.Equal(2, condensed.Modes.Length);
        for (var j = 0; j < 2; j++)
        {
            NumericAssert.Close(reference.Modes[j].NaturalFrequencyHz, condensed.Modes[j].NaturalFrequencyHz, Tolerance.Rel(1e-12), $"mode {j + 1}");
            NumericAssert.Close(reference.Modes[j].EffectiveModalMass, condensed.Modes[j].EffectiveModalMass, Tolerance.Rel(1e-10), $"effective mass {j + 1}");
        }
    }

    [Fact]
    public void ExpandedShapes_SatisfyTheFullEigenproblem_AndAreMassNormalised()
    {
        // Identity: the expanded φ solves K φ = ω² M φ on every DOF (massless rows: K_s φ = 0) and φᵀMφ = 1.
        var network = new NetworkBuilder { Title = "chain with two massless joints" }
            .AddMass("m1", 120).AddNode("j1").AddMass("m2", 60).AddNode("j2")
            .AddSpring("s1", Network.Ground, "m1", 5e5).AddSpring("s2", "m1", "j1", 2e5).AddSpring("s3", "j1", "m2", 3e5)
            .AddSpring("s4", "j1", "j2", 1e5).AddSpring("s5", "j2", Network.Ground, 4e5).AddSpring("s6", "j2", "m2", 6e4)
            .Build();
        var result = ModalAnalysis.Solve(network);
        Assert.Equal(2, result.Modes.Length);
        var k = result.Matrices.DenseStiffness();
        var mm = result.Matrices.DenseMass();
        foreach (var mode in result.Modes)
        {
            var phi = MathNet.Numerics.LinearAlgebra.Vector<double>.Build.DenseOfEnumerable(mode.Shape);
            var residual = k * phi - mode.EigenValue * (mm * phi);
            NumericAssert.Small(residual.InfinityNorm(), 1e-9 * (k * phi).InfinityNorm() + 1e-9, $"residual of mode {mode.Number}");
            NumericAssert.Close(1, phi * (mm * phi), Tolerance.Rel(1e-12), $"φᵀMφ of mode {mode.Number}");
        }
    }

    [Fact]
    public void ModalAndDirectHarmonic_Agree_WhenMasslessNodesCarrySpringsOnly()
    {
        // Consistency with an independent reference: the dense complex solve written in the test (MasslessTestKit).
        var network = new NetworkBuilder { Title = "host on a spring pair" }
            .AddMass("host", 500).AddNode("joint").AddMass("top", 50)
            .AddSpring("lower", Network.Ground, "joint", 8e5).AddSpring("upper", "joint", "host", 1.2e6)
            .AddSpring("top-spring", "host", "top", 9e4).AddDamper("top-damper", "host", "top", 300)
            .Build();
        var force = new ForceLoad("f", "host", 1000, 0);
        var system = DampedSystem.Build(new StructuralModel(network, DampingModel.None, [force]));
        double[] frequencies = [2, 5.5, 7, 11, 30];
        var names = network.Masses.Select(m => m.Name).ToArray();
        var direct = HarmonicAnalysis.Sweep(system, frequencies, [force], names, HarmonicMethod.Direct);
        var modal = HarmonicAnalysis.Sweep(system, frequencies, [force], names, HarmonicMethod.Modal, modeCount: 2);
        for (var f = 0; f < frequencies.Length; f++)
        {
            var reference = MasslessTestKit.DenseSolve(network, 2 * Math.PI * frequencies[f], new Dictionary<string, System.Numerics.Complex> { ["host"] = 1000 });
            var scale = reference.Max(x => x.Magnitude);
            for (var i = 0; i < names.Length; i++)
            {
                NumericAssert.Small((direct.ResponseOf(names[i])!.Displacement[f] - reference[i]).Magnitude, 1e-10 * scale, $"direct, {names[i]} at {frequencies[f]} Hz");
                NumericAssert.Small((modal.ResponseOf(names[i])!.Displacement[f] - reference[i]).Magnitude, 1e-9 * scale, $"modal, {names[i]} at {frequencies[f]} Hz");
            }
        }
    }

    [Fact]
    public void ModalDampingRatio_OnSeriesSpringsThroughAJoint_GivesTheSingleDegreeOfFreedomResponse()
    {
        // Closed form (common practice): one mode of ω_n² = k/m with k = k1k2/(k1 + k2) and modal damping ratio ζ gives
        // X = F / (k − ω²m + 2iζω_nωm). Modal damping is built from every mode there is (one per inertial DOF): the
        // condensed joint has none of its own, and the direct solve's support blocks must accept that.
        double m = 250, k1 = 4e5, k2 = 6e5, zeta = 0.02;
        var k = k1 * k2 / (k1 + k2);
        var wn = Math.Sqrt(k / m);
        var network = new NetworkBuilder { Title = "series springs, modal damping" }
            .AddMass("m", m).AddNode("joint")
            .AddSpring("k1", "m", "joint", k1).AddSpring("k2", "joint", Network.Ground, k2)
            .Build();
        var force = new ForceLoad("f", "m", 1, 0);
        var system = DampedSystem.Build(new StructuralModel(network, DampingModel.Modal(zeta), [force]));
        double[] frequencies = [0.5 * wn / (2 * Math.PI), wn / (2 * Math.PI), 2 * wn / (2 * Math.PI)];
        var result = HarmonicAnalysis.Sweep(system, frequencies, [force], ["m", "joint"], HarmonicMethod.Direct);
        for (var i = 0; i < frequencies.Length; i++)
        {
            var w = 2 * Math.PI * frequencies[i];
            var expected = 1 / new System.Numerics.Complex(k - w * w * m, 2 * zeta * wn * w * m);
            var x = result.ResponseOf("m")!.Displacement[i];
            NumericAssert.Small((x - expected).Magnitude, 1e-10 * expected.Magnitude, $"m at ω/ω_n = {w / wn}");
            NumericAssert.Small((result.ResponseOf("joint")!.Displacement[i] - x * k1 / (k1 + k2)).Magnitude, 1e-10 * expected.Magnitude, $"joint at ω/ω_n = {w / wn}");
        }
    }
}
