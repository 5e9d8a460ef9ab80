using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Io.Model;

namespace ModalChain.Io.Tests.Model;

/// <summary>'nodes' and 'mounts' in plane and 3d models: locations, translations, per-direction mounts and located errors.</summary>
public class SpatialMasslessReaderTests
{
    // Lines 1..5; the section under test starts at line 6, and the springs follow it.
    private const string Skid = """
        space: 3d
        bodies:
          skid: {mass: 400 kg, centre-of-mass: [0, 0, 0.5], box: [1.6 m, 1.0 m, 0.8 m], points: {f1: [0.6, 0.4, 0], f2: [-0.6, -0.4, 0]}}
        masses:
          deck: {mass: 900 kg, at: [0, 0, -0.5], directions: [z]}

        """;

    private const string Springs = """
        springs:
          hold: {between: [skid.f2, ground], stiffness: {x: 100 kN/m, y: 100 kN/m, z: 200 kN/m}}

        """;

    private static LoadResult Read(string rest, string springs = "  deck-a: {between: [deck, ground], stiffness: {z: 2 MN/m}}\n") =>
        ModelReader.Read(Skid + rest + Springs + springs, "m.yaml");

    private static void AssertError(LoadResult result, int line, int column, string fragment)
    {
        Assert.False(result.Succeeded);
        Assert.True(result.Errors.Any(d => d.Position.Line == line && d.Position.Column == column && d.Message.Contains(fragment, StringComparison.Ordinal)),
            $"expected an error at {line}:{column} containing '{fragment}', got:\n" + string.Join("\n", result.Diagnostics));
    }

    [Fact]
    public void NodeWithLocationAndDirections_IsAMassOfZeroKilograms_MovingInThoseTranslations()
    {
        var full = Read("""
            nodes:
              joint: {at: [0, 0, -0.2], directions: [z]}
              corner: {at: [0.6, 0.4, -0.1]}
            mounts:
              m1: {kind: maxwell, between: [skid.f1, corner], stiffness: {x: 0.3 kN/mm, y: 0.3 kN/mm, z: 0.9 kN/mm}, relaxation-time: 5 ms}
            dampers:
              slow: {between: [corner, ground], coefficient: {x: 1 kN*s/m, y: 1 kN*s/m}}

            """, """
              deck-a: {between: [deck, joint], stiffness: {z: 2 MN/m}}
              deck-b: {between: [joint, ground], stiffness: {z: 6 MN/m}}
              corner-k: {between: [corner, ground], stiffness: {z: 1 MN/m}}

            """);
        Assert.True(full.Succeeded, string.Join("\n", full.Diagnostics));
        var network = full.Model!.Network;
        // Masses first, then the nodes in the order written, then the mounts' inner nodes.
        Assert.Equal(new[] { "deck", "joint", "corner", "m1~inner" }, network.Masses.Select(m => m.Name).ToArray());
        var joint = network.Masses[1];
        Assert.Equal(0, joint.Kilograms);
        Assert.Equal(new Point3(0, 0, -0.2), joint.Location);
        Assert.Equal(new[] { Direction.Z }, joint.Moves.ToArray());
        Assert.True(network.Masses[2].Moves.IsDefaultOrEmpty); // every translation of the space
        var inner = network.Masses[3];
        Assert.Equal(0, inner.Kilograms);
        Assert.Equal(new Point3(0.6, 0.4, 0), inner.Location); // at the mount's first end, skid.f1
        Assert.Equal(new[] { Direction.X, Direction.Y, Direction.Z }, inner.Moves.ToArray());

        // The Maxwell expansion per direction: spring k_d from the first end to the inner node, damper k_d·τ to the second.
        var spring = network.Springs.Single(s => s.Name == "m1~spring");
        var damper = network.Dampers.Single(d => d.Name == "m1~damper");
        Assert.Equal(("skid.f1", "m1~inner"), (spring.NodeA, spring.NodeB));
        Assert.Equal(("m1~inner", "corner"), (damper.NodeA, damper.NodeB));
        Assert.Equal(new[] { 3e5, 3e5, 9e5 }, spring.Components.Select(c => c.Value).ToArray());
        var c = damper.Components.Select(c => c.Value).ToArray();
        Assert.Equal(3, c.Length);
        Assert.Equal(3e5 * 5e-3, c[0], 1e-9);
        Assert.Equal(9e5 * 5e-3, c[2], 1e-9);
    }

    [Fact]
    public void StandardLinearSolidMount_WithALossFactor_ExpandsPerDirectionWithOneRelaxationTime()
    {
        // One τ for every direction, from the loss factor at 'at' (MountExpansion.RelaxationTimeForLossFactor, checked
        // against the loss-factor closed form in the line tests).
        var result = Read("mounts:\n  m4: {kind: standard-linear-solid, between: [skid.f1, ground], stiffness: {x: 0.3 kN/mm, z: 0.9 kN/mm}, relaxation-strength: 0.5, loss-factor: 0.2, at: 20 Hz}\n");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        var network = result.Model!.Network;
        var tau = MountExpansion.RelaxationTimeForLossFactor(0.5, 0.2, 2 * Math.PI * 20)!.Value;
        var longTerm = network.Springs.Single(s => s.Name == "m4~long-term");
        var series = network.Springs.Single(s => s.Name == "m4~series");
        var damper = network.Dampers.Single(d => d.Name == "m4~damper");
        Assert.Equal(new[] { (Direction.X, 3e5), (Direction.Z, 9e5) }, longTerm.Components.Select(c => (c.Direction, c.Value)).ToArray());
        Assert.Equal(new[] { (Direction.X, 1.5e5), (Direction.Z, 4.5e5) }, series.Components.Select(c => (c.Direction, c.Value)).ToArray());
        Assert.Equal(1.5e5 * tau, damper.Components[0].Value, 1e-9);
        Assert.Equal(4.5e5 * tau, damper.Components[1].Value, 1e-9);
        Assert.Equal(new[] { Direction.X, Direction.Z }, network.Masses.Single(m => m.Name == "m4~inner").Moves.ToArray());
    }

    [Fact]
    public void NodeWithoutLocation_IsALocatedError()
    {
        AssertError(Read("nodes:\n  joint: {directions: [z]}\n"), 7, 3, "node 'joint' needs 'at: [x, y, z]'");
        AssertError(Read("nodes:\n  joint:\n"), 7, 3, "node 'joint' needs 'at: [x, y, z]'");
        AssertError(Read("nodes: [joint]\n"), 6, 9, "node 'joint' needs its location in a 3d model");
    }

    [Fact]
    public void RotationDirectionOnAMasslessNode_IsALocatedError()
    {
        var result = Read("nodes:\n  joint: {at: [0, 0, -0.2], directions: [z, ry]}\n", "  j: {between: [deck, joint], stiffness: {z: 1 MN/m}}\n");
        AssertError(result, 7, 45, "names the rotation 'ry': a massless node is a point");
    }

    [Fact]
    public void MountWithAnUnknownOrRotationalDirection_IsALocatedError()
    {
        AssertError(Read("mounts:\n  m1: {kind: maxwell, between: [skid.f1, ground], stiffness: {x: 1 kN/mm, q: 2 kN/mm}, relaxation-time: 5 ms}\n"),
            7, 75, "a direction of 'stiffness' of mount 'm1' is 'q'");
        AssertError(Read("mounts:\n  m1: {kind: maxwell, between: [skid.f1, ground], stiffness: {z: 1 kN/mm, rx: 2 kN*m/rad}, relaxation-time: 5 ms}\n"),
            7, 75, "names the rotation 'rx': a mount's inner node is a point");
    }

    [Fact]
    public void MountErrors_ScalarStiffnessDampingAndADirectionNoEndMovesIn_AreLocated()
    {
        AssertError(Read("mounts:\n  m1: {kind: maxwell, between: [skid.f1, ground], stiffness: 1 kN/mm, relaxation-time: 5 ms}\n"),
            7, 62, "'stiffness' of mount 'm1' is given per translation");
        AssertError(Read("mounts:\n  m1: {kind: maxwell, between: [skid.f1, ground], stiffness: {z: 1 kN/mm}, damping: 2 kN*s/m}\n"),
            7, 85, "a Maxwell mount takes 'relaxation-time'");
        AssertError(Read("mounts:\n  m1: {kind: maxwell, between: [deck, ground], stiffness: {x: 1 kN/mm, z: 1 kN/mm}, relaxation-time: 5 ms}\n"),
            7, 60, "mount 'm1' acts in 'x', but neither mass 'deck'");
    }

    [Fact]
    public void MasslessNodeMovingInADirectionNoElementActsIn_IsALocatedError()
    {
        // joint moves in x, y and z (the default) but its springs act in z only: its x and y are undefined.
        var result = Read("nodes:\n  joint: {at: [0, 0, -0.2]}\n", "  j: {between: [deck, joint], stiffness: {z: 1 MN/m}}\n  g: {between: [joint, ground], stiffness: {z: 1 MN/m}}\n");
        AssertError(result, 7, 3, "node 'joint' moves in x, y, but no spring, damper or inerter acts on it there");
    }

    [Fact]
    public void LoadAtAMasslessNode_IsALocatedError()
    {
        var result = Read("nodes:\n  joint: {at: [0, 0, -0.2], directions: [z]}\nloads:\n  push: {kind: force, at: joint, direction: z, amplitude: 1 kN}\n", "  j: {between: [deck, joint], stiffness: {z: 1 MN/m}}\n  g: {between: [joint, ground], stiffness: {z: 1 MN/m}}\n");
        AssertError(result, 9, 27, "acts at massless node 'joint'");
    }
}
