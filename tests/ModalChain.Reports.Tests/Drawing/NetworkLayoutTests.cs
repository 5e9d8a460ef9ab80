using ModalChain.Reports.Drawing;
using ModalChain.TestSupport;

namespace ModalChain.Reports.Tests.Drawing;

/// <summary>Where masses are drawn: the model's <c>at</c> positions when usable, otherwise stacked by distance from the supports.</summary>
public sealed class NetworkLayoutTests
{
    [Fact]
    public void GivenPositions_AreUsedAsWritten()
    {
        var document = Repository.Parse("""
            masses:
              a: {mass: 1 kg, at: [0.5, 1]}
              b: {mass: 1 kg, at: [2, 3]}
            springs:
              s1: {between: [ground, a], stiffness: 10 N/m}
              s2: {between: [a, b], stiffness: 10 N/m}
            """);
        var layout = NetworkLayout.For(document.Network);
        Assert.False(layout.Automatic);
        Assert.Equal(new Point(0.5, 1), layout.PositionOf("a"));
        Assert.Equal(new Point(2, 3), layout.PositionOf("b"));
    }

    [Fact]
    public void MissingPositions_StackMassesByDistanceFromGround()
    {
        // ground – a – b – c in a line, plus d hanging on a: levels 1, 2, 3 and 2.
        var document = Repository.Parse("""
            masses: {c: 1 kg, b: 1 kg, a: 1 kg, d: 1 kg}
            springs:
              s1: {between: [b, c], stiffness: 10 N/m}
              s2: {between: [a, b], stiffness: 10 N/m}
              s3: {between: [ground, a], stiffness: 10 N/m}
              s4: {between: [a, d], stiffness: 10 N/m}
            """);
        var layout = NetworkLayout.For(document.Network);
        Assert.True(layout.Automatic);
        Assert.Equal(ChainAxis.Vertical, layout.Axis);
        var y = layout.Masses.ToDictionary(m => m.Name, m => m.At.Y);
        Assert.True(y["a"] < y["b"] && y["b"] < y["c"], "masses further from ground are drawn higher");
        NumericAssert.Close(y["b"], y["d"], Tolerance.Abs(1e-12), "masses at the same distance share a level");
        Assert.NotEqual(layout.PositionOf("b").X, layout.PositionOf("d").X);
        // Every support end of an element is drawn below the lowest mass.
        var anchors = layout.Elements.SelectMany(e => new[] { e.A, e.B }).Where(end => end.Mass is null).ToArray();
        Assert.All(anchors, a => Assert.True(a.Anchor.Y < y["a"]));
    }

    [Fact]
    public void OverlappingPositions_FallBackToAutomaticLayout()
    {
        var document = Repository.Parse("""
            masses:
              a: {mass: 1 kg, at: [0, 0]}
              b: {mass: 1 kg, at: [0, 0]}
            springs:
              s1: {between: [ground, a], stiffness: 10 N/m}
              s2: {between: [a, b], stiffness: 10 N/m}
            """);
        Assert.True(NetworkLayout.For(document.Network).Automatic);
    }

    [Fact]
    public void UnsupportedGroup_GetsItsOwnColumn()
    {
        var document = Repository.Parse("""
            masses: {a: 1 kg, b: 1 kg, c: 1 kg}
            springs:
              s1: {between: [ground, a], stiffness: 10 N/m}
              s2: {between: [b, c], stiffness: 10 N/m}
            """);
        var layout = NetworkLayout.For(document.Network);
        Assert.True(layout.PositionOf("b").X > layout.PositionOf("a").X);
        Assert.Equal(layout.PositionOf("b").X, layout.PositionOf("c").X);
    }

    [Fact]
    public void ParallelSpringAndDamper_AreNumberedSideBySide()
    {
        var document = Repository.Parse("""
            masses: {deck: 3200 kg, skid: 850 kg}
            springs:
              columns: {between: [ground, deck], stiffness: 95 kN/mm}
              mounts: {between: [deck, skid], stiffness: 8.4 kN/mm}
            dampers:
              mount-loss: {between: [deck, skid], coefficient: 1.5 kN*s/m}
            """);
        var layout = NetworkLayout.For(document.Network);
        var mounts = layout.Elements.Single(e => e.Name == "mounts");
        var loss = layout.Elements.Single(e => e.Name == "mount-loss");
        Assert.Equal(2, mounts.ParallelCount);
        Assert.Equal(2, loss.ParallelCount);
        Assert.NotEqual(mounts.ParallelIndex, loss.ParallelIndex);
    }
}
