using ModalChain.Core.Model;
using ModalChain.Io.Model;

namespace ModalChain.Io.Tests.Model;

/// <summary>The 'nodes' and 'mounts' sections: massless nodes and viscoelastic mounts, with located errors for every misuse.</summary>
public class MasslessReaderTests
{
    // Line 1..6; the section under test starts at line 7.
    private const string Network = """
        masses:
          fan: 180 kg
          frame: 40 kg
        springs:
          legs: {between: [frame, ground], stiffness: 900 kN/m}
          fan-on-frame: {between: [fan, frame], stiffness: 60 kN/m}

        """;

    private static LoadResult Read(string rest) => ModelReader.Read(Network + rest, "m.yaml");

    private static void AssertError(LoadResult result, int line, int column, string fragment)
    {
        Assert.False(result.Succeeded);
        Assert.True(result.Errors.Any(d => d.Position.Line == line && d.Position.Column == column && d.Message.Contains(fragment, StringComparison.Ordinal)),
            $"expected an error at {line}:{column} containing '{fragment}', got:\n" + string.Join("\n", result.Diagnostics));
    }

    [Fact]
    public void NodesAsAListOrAMapping_BecomeMassesOfZeroKilograms_AfterTheMasses()
    {
        // 'joint' has a damper to ground and nothing else: a valid first-order node (c·ẏ = 0 with y held by the damper).
        var list = Read("nodes: [joint]\ndampers:\n  d: {between: [joint, ground], coefficient: 1 kN*s/m}\n");
        Assert.True(list.Succeeded, string.Join("\n", list.Diagnostics));
        Assert.Equal(new[] { "fan", "frame", "joint" }, list.Model!.Network.Masses.Select(m => m.Name).ToArray());
        Assert.Equal(0, list.Model.Network.Masses[2].Kilograms);

        var map = Read("nodes:\n  joint: {at: [1, 0]}\ndampers:\n  d: {between: [joint, frame], coefficient: 1 kN*s/m}\n  e: {between: [joint, ground], coefficient: 1 kN*s/m}\n");
        Assert.True(map.Succeeded, string.Join("\n", map.Diagnostics));
        Assert.Equal(new DrawingPosition(1, 0), map.Model!.Network.Masses[2].Position);
    }

    [Fact]
    public void AMaxwellMount_ExpandsIntoAnInnerNodeASpringAndADamper()
    {
        // The expansion named in docs/model-format.md: 'M~inner' (0 kg), spring 'M~spring' (k, A to inner), damper
        // 'M~damper' (c, inner to B).
        var result = Read("mounts:\n  m1: {kind: maxwell, between: [fan, frame], stiffness: 80 kN/m, damping: 400 N*s/m}\n");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        var n = result.Model!.Network;
        Assert.Equal(0, n.Masses.Single(m => m.Name == "m1~inner").Kilograms);
        var spring = n.Springs.Single(s => s.Name == "m1~spring");
        Assert.Equal(("fan", "m1~inner", 80e3), (spring.NodeA, spring.NodeB, spring.Stiffness));
        var damper = n.Dampers.Single(d => d.Name == "m1~damper");
        Assert.Equal(("m1~inner", "frame"), (damper.NodeA, damper.NodeB));
        Assert.Equal(400, damper.Coefficient, 12);
    }

    [Fact]
    public void AStandardLinearSolid_FromALossFactor_HasThatLossFactorAtTheReferenceFrequency()
    {
        // Closed form: tan δ = Δu/(1 + (1+Δ)u²), u = ωτ (docs/methods.md); the expansion's K*(ω) at 'at' must give η.
        var result = Read("mounts:\n  m2: {kind: standard-linear-solid, between: [fan, frame], stiffness: 120 kN/m, relaxation-strength: 0.8, loss-factor: 0.2, at: 25 Hz}\n");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        var n = result.Model!.Network;
        var k1 = n.Springs.Single(s => s.Name == "m2~long-term").Stiffness;
        var k2 = n.Springs.Single(s => s.Name == "m2~series").Stiffness;
        var c = n.Dampers.Single(d => d.Name == "m2~damper").Coefficient;
        Assert.Equal(120e3, k1, 9);
        Assert.Equal(0.8 * 120e3, k2, 9);
        var omega = 2 * Math.PI * 25;
        var kStar = k1 + 1 / (1 / k2 + 1 / new System.Numerics.Complex(0, omega * c));
        Assert.Equal(0.2, kStar.Imaginary / kStar.Real, 12);
    }

    [Fact]
    public void ALossFactorBeyondTheReachOfTheStandardLinearSolid_IsALocatedErrorStatingTheMaximum()
    {
        // Δ = 0.8: the largest loss factor is Δ/(2√(1+Δ)) = 0.2981 (closed form, docs/methods.md).
        var line = "  m2: {kind: standard-linear-solid, between: [fan, frame], stiffness: 120 kN/m, relaxation-strength: 0.8, loss-factor: 0.35, at: 25 Hz}";
        AssertError(Read("mounts:\n" + line + "\n"), 8, line.IndexOf("0.35", StringComparison.Ordinal) + 1, "its largest loss factor is k2/(2√(k1(k1+k2))) = Δ/(2√(1+Δ)) = 0.2981");
    }

    [Theory]
    [InlineData("  m: {kind: maxwell, between: [fan, frame], stiffness: -80 kN/m, damping: 400 N*s/m}", "-80", "must be positive")]
    [InlineData("  m: {kind: maxwell, between: [fan, frame], stiffness: 80 kN/m, relaxation-time: 0 s}", "0 s", "must be positive")]
    [InlineData("  m: {kind: maxwell, between: [fan, frame], stiffness: 80 kN/m, damping: 400 N*s/m, relaxation-time: 5 ms}", "400", "exactly one of 'damping'")]
    [InlineData("  m: {kind: kelvin, between: [fan, frame], stiffness: 80 kN/m}", "kelvin", "accepted kinds: maxwell, standard-linear-solid")]
    [InlineData("  m: {kind: standard-linear-solid, between: [fan, frame], stiffness: 80 kN/m, relaxation-strength: 0.5, loss-factor: 0.1}", "0.1", "needs 'at'")]
    [InlineData("  m: {kind: maxwell, between: [fan, fram], stiffness: 80 kN/m, damping: 1 N*s/m}", "fram", "unknown node 'fram'")]
    public void BadMountValues_AreLocatedErrors(string line, string at, string fragment)
    {
        AssertError(Read("mounts:\n" + line + "\n"), 8, line.IndexOf(at, StringComparison.Ordinal) + 1, fragment);
    }

    [Fact]
    public void ANodeWithNothingAttached_IsALocatedError()
    {
        AssertError(Read("nodes:\n  loose:\n"), 8, 3, "node 'loose' has nothing attached");
    }

    [Fact]
    public void MasslessNodesJoinedOnlyToEachOther_AreALocatedError()
    {
        AssertError(Read("nodes: [p, q]\ndampers:\n  pq: {between: [p, q], coefficient: 1 kN*s/m}\n"),
            7, 9, "massless node(s) 'p', 'q' are joined to no mass or support");
    }

    [Fact]
    public void DampersAmongMasslessNodesThatReachNoMassOrSupport_AreALocatedError()
    {
        // p is held by a spring, but q hangs on p through a damper only: q's position is undefined (C_dd singular).
        var text = "nodes: [p, q]\ndampers:\n  pq: {between: [p, q], coefficient: 1 kN*s/m}\n";
        var result = ModelReader.Read(Network.Replace("  fan-on-frame:", "  fan-p: {between: [fan, p], stiffness: 1 kN/m}\n  fan-on-frame:") + text, "m.yaml");
        AssertError(result, 8, 9, "the dampers at massless node(s) 'p', 'q' lead to no mass or support");
    }

    [Fact]
    public void ZeroUnderMasses_StaysAnErrorAndPointsToNodes()
    {
        var result = ModelReader.Read("masses:\n  fan: 0 kg\nsprings:\n  s: {between: [fan, ground], stiffness: 1 kN/m}\n", "m.yaml");
        AssertError(result, 2, 8, "declared under 'nodes:'");
    }

    [Fact]
    public void NodesAsAList_InAPlaneModel_AreRefused_ForWantOfALocation()
    {
        // Plane and 3d models take nodes with their locations (SpatialMasslessReaderTests); a bare list has none.
        var result = ModelReader.Read("space: plane\nmasses:\n  fan: {mass: 180 kg, at: [0, 1]}\nnodes: [joint]\n", "m.yaml");
        AssertError(result, 4, 9, "node 'joint' needs its location in a plane model");
    }
}
