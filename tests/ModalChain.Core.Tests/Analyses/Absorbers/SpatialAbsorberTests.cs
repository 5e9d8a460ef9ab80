using ModalChain.Core.Analyses.Absorbers;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Absorbers;

/// <summary>Absorber design on plane and 3d models: the host is a point and a translation.</summary>
public class SpatialAbsorberTests
{
    // A block on four equal mounts placed symmetrically about its centre of mass: bounce is a pure z motion, ω² = 4k_z/m
    // (REFERENCES.md §10, rigid block on four mounts; Harris' Shock and Vibration Handbook [from memory]).
    private const double BlockMass = 1200, Kz = 3.0e5, Kh = 1.0e5;

    private static Network Block() =>
        SpatialNetworks.Block(BlockMass, InertiaMatrix.OfBox(BlockMass, 1.6, 1.0, 0.8), a: 0.6, b: 0.4, h: 0.3, kh: Kh, kz: Kz);

    private static Network LineBlock() =>
        new NetworkBuilder().AddMass("block", BlockMass).AddSpring("mounts", Network.Ground, "block", 4 * Kz).Build();

    [Fact]
    public void BounceOfASymmetricBlock_GivesTheDesignOfTheLineModel()
    {
        // Identity: the bounce mode is an SDOF in z (m on 4k_z), so an absorber at the centre of mass in z must be sized and
        // perform exactly as on the line model of the same mass and spring sum; its design is Den Hartog's (1956 §3.3):
        // modal mass m, f_a = f_p/(1 + μ), ζ_a = √(3μ/(8(1 + μ))). Both models carry 2 % modal damping.
        const double mu = 0.05;
        var spatial = new StructuralModel(Block(), DampingModel.Modal(0.02), []);
        var line = new StructuralModel(LineBlock(), DampingModel.Modal(0.02), []);
        var spatialModes = ModalAnalysis.Solve(spatial.Network);
        var bounce = spatialModes.Modes.Single(m => m.Motion == "bounce");
        Assert.Equal(1.0, bounce.Decoupling, 9);

        var s = AbsorberStudy.Run(spatial, spatialModes, new AbsorberRequest("block.z", mu, bounce.Number, []), optimal: false, []);
        var l = AbsorberStudy.Run(line, ModalAnalysis.Solve(line.Network), new AbsorberRequest("block", mu, 1, []), optimal: false, []);

        var fp = Math.Sqrt(4 * Kz / BlockMass) / (2 * Math.PI);
        NumericAssert.Close(fp, s.Design.ModeFrequencyHz, Tolerance.Rel(1e-10), "bounce frequency √(4k_z/m)/2π");
        NumericAssert.Close(BlockMass, s.Design.ModalMass, Tolerance.Rel(1e-9), "modal mass at the centre of mass in z = m");
        NumericAssert.Close(fp / (1 + mu), s.Design.FrequencyHz, Tolerance.Rel(1e-9), "Den Hartog f_a = f_p/(1+μ)");
        NumericAssert.Close(Math.Sqrt(3 * mu / (8 * (1 + mu))), s.Design.DampingRatio, Tolerance.Rel(1e-9), "Den Hartog ζ_a");
        foreach (var (name, spatialValue, lineValue) in new[]
        {
            ("mass", s.Design.Mass, l.Design.Mass),
            ("stiffness", s.Design.Stiffness, l.Design.Stiffness),
            ("damping", s.Design.Damping, l.Design.Damping),
            ("peak before", s.Assessment.PeakBefore, l.Assessment.PeakBefore),
            ("peak after", s.Assessment.PeakAfter, l.Assessment.PeakAfter),
            ("peak frequency", s.Assessment.PeakFrequencyHz, l.Assessment.PeakFrequencyHz),
            ("stroke per force", s.Assessment.StrokePerForce, l.Assessment.StrokePerForce),
        })
            NumericAssert.Close(lineValue, spatialValue, Tolerance.Rel(1e-6), $"{name}: 3d block against the line model");
        for (var i = 0; i < l.Assessment.Mistuning.Length; i++)
            NumericAssert.Close(l.Assessment.Mistuning[i].Peak, s.Assessment.Mistuning[i].Peak, Tolerance.Rel(1e-6), $"mistuning {l.Assessment.Mistuning[i].FrequencyError}");
        Assert.Equal(bounce.Number, s.Assessment.PeakAfterMode);
    }

    [Theory]
    [InlineData("bar.front.z", SpatialNetworks.LFront)]
    [InlineData("bar.rear.z", -SpatialNetworks.LRear)]
    public void OffCentrePointOfThePitchingBar_HasModalMassOneOverAPhiSquared(string host, double x)
    {
        // Rigid bar on two springs (REFERENCES.md §10: m = 1000 kg, J = 810 kg·m², k1 = 18 kN/m at l1 = 1.0 m ahead,
        // k2 = 22 kN/m at l2 = 1.5 m behind; x/θ = −2.6461 m and 0.30611 m). Hand value: with θ the pitch and r = z/θ the
        // mode's ratio, the mass-normalised shape has θ² (m r² + J) = 1, and a point at x moves z − x θ = θ (r − x), so
        // the modal mass there is 1/(a·φ)² = (m r² + J)/(r − x)².
        const double m = SpatialNetworks.BarMass, j = SpatialNetworks.BarInertia;
        const double k11 = SpatialNetworks.KFront + SpatialNetworks.KRear;
        const double k12 = SpatialNetworks.KRear * SpatialNetworks.LRear - SpatialNetworks.KFront * SpatialNetworks.LFront;
        const double k22 = SpatialNetworks.KFront * SpatialNetworks.LFront * SpatialNetworks.LFront + SpatialNetworks.KRear * SpatialNetworks.LRear * SpatialNetworks.LRear;
        var (low, high) = SpatialNetworks.TwoByTwo(k11, k12, k22, m, j);
        double Ratio(double lambda) => -k12 / (k11 - lambda * m);
        NumericAssert.Close(-2.6461, Ratio(low), Tolerance.Abs(1e-4), "x/θ of mode 1 (REFERENCES.md §10)");
        NumericAssert.Close(0.30611, Ratio(high), Tolerance.Abs(1e-5), "x/θ of mode 2 (REFERENCES.md §10)");

        var network = SpatialNetworks.Bar();
        var modal = ModalAnalysis.Solve(network);
        foreach (var lambda in new[] { low, high })
        {
            var mode = modal.Modes.MinBy(md => Math.Abs(md.EigenValue - lambda))!;
            NumericAssert.Close(lambda, mode.EigenValue, Tolerance.Rel(1e-9), "ω² of the bar");
            var r = Ratio(lambda);
            var hand = (m * r * r + j) / ((r - x) * (r - x));
            var design = AbsorberTuning.Design(modal, new AbsorberRequest(host, 0.05, mode.Number, []));
            NumericAssert.Close(hand, design.ModalMass, Tolerance.Rel(1e-8), $"modal mass at {host} in mode {mode.Number}");
            NumericAssert.Close(0.05 * hand, design.Mass, Tolerance.Rel(1e-8), "m_a = μ M");
        }
    }

    [Fact]
    public void Attach_PutsAMassAtTheHostPointMovingAlongTheHostsDirection()
    {
        var network = SpatialNetworks.Bar();
        var modal = ModalAnalysis.Solve(network);
        var design = AbsorberTuning.Design(modal, new AbsorberRequest("bar.front.z", 0.05, 2, []));
        var names = AbsorberTuning.FreeNames(network, design.Host);
        Assert.Equal("bar-front-z-absorber", names.Mass);
        var attached = AbsorberTuning.Attach(network, design, names);
        var mass = attached.Masses.Single(mm => mm.Name == names.Mass);
        Assert.Equal(new Point3(SpatialNetworks.LFront, 0, 0), mass.Location);
        Assert.Equal([Direction.Z], mass.Moves.ToArray());
        var spring = attached.Springs.Single(s => s.Name == names.Spring);
        Assert.Equal(("bar.front", names.Mass), (spring.NodeA, spring.NodeB));
        Assert.Equal([new DirectionalValue(Direction.Z, design.Stiffness)], spring.Components.ToArray());
        var damper = attached.Dampers.Single(d => d.Name == names.Damper);
        Assert.Equal([new DirectionalValue(Direction.Z, design.Damping)], damper.Components.ToArray());

        // The absorber adds one DOF, and the controlled mode splits into a pair either side of the absorber's frequency
        // (Den Hartog 1956 §3.2, the two natural frequencies of the primary with an absorber).
        var withModes = ModalAnalysis.Solve(attached);
        Assert.Equal(modal.Modes.Length + 1, withModes.Modes.Length);
        Assert.Contains(withModes.Modes, md => md.NaturalFrequencyHz < design.FrequencyHz);
        Assert.Contains(withModes.Modes, md => md.NaturalFrequencyHz > design.FrequencyHz && md.NaturalFrequencyHz < design.ModeFrequencyHz * 1.5);
    }

    [Theory]
    [InlineData("bar", "needs the direction the absorber acts along")]
    [InlineData("bar.ry", "is a rotation; a tuned mass acts along a line")]
    [InlineData("bar.front.ry", "is a rotation; a tuned mass acts along a line")]
    [InlineData("bar.front.y", "'y' is not a direction of a plane model (x, z)")]
    [InlineData("bar.back.z", "is not a DOF label or a body point with a direction")]
    [InlineData("ground", "is a support")]
    [InlineData("ground.z", "is on a support")]
    public void BadHosts_AreProblemsNamingTheChoices(string host, string expected)
    {
        var modal = ModalAnalysis.Solve(SpatialNetworks.Bar());
        var problems = AbsorberTuning.Problems(modal, new AbsorberRequest(host, 0.05, 1, []));
        var problem = Assert.Single(problems);
        Assert.Contains(expected, problem);
        if (expected.StartsWith("needs", StringComparison.Ordinal) || expected.StartsWith("is a rotation", StringComparison.Ordinal))
            Assert.Contains("bar.x, bar.z, or a body point with a direction such as 'bar.front.z'", problem);
    }

    [Fact]
    public void AMassThatDoesNotMoveInTheDirection_IsAProblem()
    {
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddMass(new Mass("deck", 500) { Location = new Point3(0, 0, 0), Moves = [Direction.Z] });
        b.AddSpring(new Spring("legs", Network.Ground, "deck", 1e6) { Components = [new DirectionalValue(Direction.Z, 1e6)] });
        var modal = ModalAnalysis.Solve(b.Build());
        var problem = Assert.Single(AbsorberTuning.Problems(modal, new AbsorberRequest("deck.x", 0.05, 1, [])));
        Assert.Contains("mass 'deck' does not move in x; its DOFs: deck", problem);
        // Its one DOF is labelled by its bare name, which is then a host, as is the name with the direction.
        Assert.Empty(AbsorberTuning.Problems(modal, new AbsorberRequest("deck", 0.05, 1, [])));
        Assert.Empty(AbsorberTuning.Problems(modal, new AbsorberRequest("deck.z", 0.05, 1, [])));
        NumericAssert.Close(500, AbsorberTuning.Design(modal, new AbsorberRequest("deck.z", 0.05, 1, [])).ModalMass, Tolerance.Rel(1e-12), "SDOF modal mass = m");
    }
}
