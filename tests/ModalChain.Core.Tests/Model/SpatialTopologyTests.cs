using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using static ModalChain.Core.Tests.SpatialNetworks;

namespace ModalChain.Core.Tests.Model;

/// <summary>Connectivity facts about plane and 3d models, whose element ends may be points of rigid bodies.</summary>
public class SpatialTopologyTests
{
    private static Network TwoBodies(double stiff)
    {
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddBody(new RigidBody("skid", 500, new Point3(0, 0, 1), new InertiaMatrix(50, 60, 70), [new BodyPoint("foot", new Point3(0, 0, 0))]));
        b.AddBody(new RigidBody("loose", 20, new Point3(3, 0, 1), new InertiaMatrix(1, 1, 1), [new BodyPoint("lug", new Point3(3, 0, 0))]));
        b.AddMass(new Mass("sensor", 2) { Location = new Point3(3, 0, 2) });
        b.AddMass(new Mass("alone", 1) { Location = new Point3(9, 0, 0) });
        b.AddSpring(new Spring("mount", "skid.foot", Network.Ground, 1e5) { Components = [K(Direction.Z, 1e5)] });
        b.AddSpring(new Spring("tie", "loose.lug", "sensor", stiff) { Axial = true });
        b.AddSpring(new Spring("brace", "skid", Network.Ground, stiff) { Components = [K(Direction.X, stiff)] });
        return b.Build();
    }

    [Fact]
    public void UnsupportedGroups_FollowBodyPointsToTheirBodies()
    {
        var groups = Topology.UnsupportedGroups(TwoBodies(1e5));
        Assert.Equal(2, groups.Length);
        Assert.Contains(groups, g => g.Order().SequenceEqual(["loose", "sensor"]));
        Assert.Contains(groups, g => g.SequenceEqual(["alone"]));
        Assert.Equal(["alone"], Topology.MassesWithoutSpring(TwoBodies(1e5)).ToArray());
    }

    [Fact]
    public void StiffnessSpread_UsesEachSpringsScaleAndWarnsWithoutPromisingAFlexibilitySolve()
    {
        var network = TwoBodies(1e15);
        var (ratio, softest, stiff) = Topology.StiffnessSpread(network);
        Assert.Equal(1e10, ratio);
        Assert.Equal("mount", softest!.Name);
        Assert.Equal(["brace", "tie"], stiff.Select(s => s.Name).Order().ToArray());
        var warning = Topology.StiffnessRatioWarning(network)!;
        Assert.Contains("plane or 3d model", warning);
        Assert.DoesNotContain("solved from the flexibility to keep", warning);
        Assert.Contains(warning, ModalAnalysis.Solve(network).Warnings);
    }
}
