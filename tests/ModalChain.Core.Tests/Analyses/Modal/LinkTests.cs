using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Modal;

/// <summary>Masses tied by a link move as one: one DOF, their masses added, the result reported at each of them.</summary>
public class LinkTests
{
    // ground –k1– (a ≡ b) –k2– c: a and b linked.
    private static Network LinkedChain(double ma, double mb, double mc, double k1, double k2) =>
        new NetworkBuilder()
            .AddMass("a", ma).AddMass("c", mc).AddMass("b", mb)
            .AddSpring("k1", Network.Ground, "a", k1).AddSpring("k2", "b", "c", k2)
            .AddLink("ab", "a", "b")
            .Build();

    [Fact]
    public void LinkedPair_EqualsOneMassOfTheSummedMass()
    {
        // A linked pair is one mass m1 = ma + mb; with m2 = mc the two-DOF frequency equation applies
        // (REFERENCES.md §1, k3 = 0): m1m2ω⁴ − [m1k2 + m2(k1+k2)]ω² + k1k2 = 0. Tolerance 1e-12 relative.
        const double ma = 300, mb = 500, mc = 100, k1 = 4e6, k2 = 9e5;
        var result = ModalAnalysis.Solve(LinkedChain(ma, mb, mc, k1, k2));
        const double m1 = ma + mb, m2 = mc;
        var b = m1 * k2 + m2 * (k1 + k2);
        var d = m1 * k2 - m2 * (k1 + k2);
        var high = (b + Math.Sqrt(d * d + 4 * m1 * m2 * k2 * k2)) / (2 * m1 * m2);
        var low = k1 * k2 / (m1 * m2 * high);
        Assert.Equal(2, result.Modes.Length);
        NumericAssert.Close(low, result.Modes[0].EigenValue, Tolerance.Rel(1e-12), "ω1²");
        NumericAssert.Close(high, result.Modes[1].EigenValue, Tolerance.Rel(1e-12), "ω2²");
        NumericAssert.Close(ma + mb + mc, result.TotalMass, Tolerance.Rel(1e-15), "total mass");
    }

    [Fact]
    public void LinkedMasses_ShareOneDofWhoseLabelNamesBoth()
    {
        var network = LinkedChain(1, 2, 3, 10, 10);
        var dofs = DofMap.ForScalarNetwork(network);
        Assert.Equal(2, dofs.Count);
        Assert.Equal(dofs.IndexOf("a"), dofs.IndexOf("b"));
        Assert.Equal("a+b", dofs.Dofs[dofs.IndexOf("a")].ToString());
        Assert.Equal(new[] { "a", "b" }, dofs.NodesAt(dofs.IndexOf("b")).ToArray());
        var m = Assembler.Assemble(network).Mass;
        Assert.Equal(3.0, m[dofs.IndexOf("a"), dofs.IndexOf("a")]);
    }

    [Fact]
    public void ChainedLinks_MergeIntoOneDof_AndAFreeLinkedGroupHasOneRigidBodyMode()
    {
        // Links a–b and b–c make one body; with no spring to ground it is free: one rigid-body mode carrying the
        // whole mass, and K of the single DOF is zero (springs inside the body carry no force; common practice).
        var network = new NetworkBuilder().AddMass("a", 1).AddMass("b", 2).AddMass("c", 3)
            .AddSpring("inside", "a", "c", 1e5)
            .AddLink("ab", "a", "b").AddLink("bc", "b", "c").Build();
        var result = ModalAnalysis.Solve(network);
        Assert.Equal(1, result.Matrices.Size);
        Assert.Equal(0.0, result.Matrices.Stiffness[0, 0]);
        var mode = Assert.Single(result.Modes);
        Assert.True(mode.IsRigidBody);
        NumericAssert.Close(6.0, mode.EffectiveModalMass, Tolerance.Rel(1e-14), "M*");
        Assert.Single(Topology.UnsupportedGroups(network));
        Assert.Empty(Topology.MassesWithoutSpring(new NetworkBuilder().AddMass("a", 1).AddMass("b", 1).AddMass("c", 1)
            .AddSpring("k", Network.Ground, "c", 1).AddLink("ab", "a", "b").AddLink("bc", "b", "c").Build()));
    }

    [Fact]
    public void ShapesAndHarmonicResponses_AreReportedAtEveryLinkedMass()
    {
        var network = LinkedChain(300, 500, 100, 4e6, 9e5);
        var result = ModalAnalysis.Solve(network);
        foreach (var mode in result.Modes)
        {
            var byMass = result.ShapeByMass(mode);
            Assert.Equal(3, byMass.Length);
            Assert.Equal(byMass[0], byMass[2]); // a and b (declared first and third)
        }
        // A unit force on b drives the linked body: at 0.1 Hz (quasi-static) both a and b move F/k1 (statics, common practice).
        var system = DampedSystem.Build(new StructuralModel(network, DampingModel.None, [new ForceLoad("push", "b", 1.0, 0)]));
        var response = HarmonicAnalysis.Solve(system,
            new HarmonicSpec(["push"], new FrequencyList([0.1]), false, ["a", "b"], HarmonicMethod.Direct));
        var a = response.ResponseOf("a")!.Displacement[0].Magnitude;
        var bResponse = response.ResponseOf("b")!.Displacement[0].Magnitude;
        NumericAssert.Close(1 / 4e6, a, Tolerance.Rel(1e-3), "a");
        Assert.Equal(a, bResponse);
    }
}
