using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;
using ModalChain.TestSupport;
using static ModalChain.Io.Tests.Model.ModelText;

namespace ModalChain.Io.Tests.Model;

/// <summary>The 'repeat' section writes chains and grids of equal masses in one line each (issue 13, item 5).</summary>
public class RepeatSectionTests
{
    [Fact]
    public void Chain_FromGround_MatchesTheFixedFreeClosedForm()
    {
        // REFERENCES.md §2, uniform fixed-free chain [common practice]: ω_j = 2√(k/m)·sin((2j−1)π/(2(2n+1))).
        const int n = 12;
        const double m = 120, k = 2.5e6;
        var r = Read("repeat:", $"  rack: {{kind: chain, count: {n}, mass: {m} kg, stiffness: 2.5 kN/mm, from: ground, prefix: level}}");
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
        var network = r.Model!.Network;
        Assert.Equal(Enumerable.Range(1, n).Select(i => $"level-{i}"), network.Masses.Select(x => x.Name));
        Assert.Equal(("level-k1", "ground", "level-1"), (network.Springs[0].Name, network.Springs[0].NodeA, network.Springs[0].NodeB));
        Assert.Equal(("level-k12", "level-11", "level-12"), (network.Springs[^1].Name, network.Springs[^1].NodeA, network.Springs[^1].NodeB));
        var expected = Enumerable.Range(1, n).Select(j => 2 * Math.Sqrt(k / m) * Math.Sin((2 * j - 1) * Math.PI / (2 * (2 * n + 1)))).ToArray();
        var modes = ModalAnalysis.Solve(network).Modes;
        NumericAssert.Close(expected, [.. modes.Select(x => x.AngularFrequency)], Tolerance.Rel(1e-9), "ω of the chain");
    }

    [Fact]
    public void GridWithEdgesSupported_MatchesTheFixedFixedLatticeClosedForm()
    {
        // Closed form, derived in docs/methods.md ("Repeated structures"): with a spring to ground for every missing
        // neighbour, K = k(T_R ⊗ I_C + I_R ⊗ T_C), T_n = tridiag(−1, 2, −1) of the fixed-fixed chain, so
        // ω²_pq = (4k/m)[sin²(pπ/(2(R+1))) + sin²(qπ/(2(C+1)))], p = 1..R, q = 1..C.
        const int rows = 4, columns = 5;
        const double m = 45, k = 12e6;
        var r = Read("repeat:", $"  slab: {{kind: grid, rows: {rows}, columns: {columns}, spacing: 0.5 m, mass: {m} kg, stiffness: 12 kN/mm, support: edges, prefix: s}}");
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
        var network = r.Model!.Network;
        Assert.Equal(rows * columns, network.Masses.Length);
        // R(C−1) + (R−1)C neighbour springs and 2(R + C) to ground (a corner has two).
        Assert.Equal(rows * (columns - 1) + (rows - 1) * columns + 2 * (rows + columns), network.Springs.Length);
        var expected = (from p in Enumerable.Range(1, rows)
                        from q in Enumerable.Range(1, columns)
                        select Math.Sqrt(4 * k / m * (Sq(Math.Sin(p * Math.PI / (2 * (rows + 1)))) + Sq(Math.Sin(q * Math.PI / (2 * (columns + 1)))))))
                       .Order().ToArray();
        var modes = ModalAnalysis.Solve(network).Modes;
        NumericAssert.Close(expected, [.. modes.Select(x => x.AngularFrequency)], Tolerance.Rel(1e-9), "ω of the lattice");
    }

    [Fact]
    public void GeneratedNames_AreUsableByTheRestOfTheFile_AndPlacedOnTheDrawing()
    {
        var r = Read(
            "masses:",
            "  machine: {mass: 300 kg, at: [1, 1]}",
            "repeat:",
            "  slab: {kind: grid, rows: 2, columns: 3, spacing: 0.5 m, mass: 45 kg, stiffness: 12 kN/mm, prefix: s}",
            "  rack: {kind: chain, count: 3, mass: 20 kg, stiffness: 1 kN/mm, from: s-2-2, spacing: 0.4 m}",
            "springs:",
            "  feet: {between: [s-1-2, machine], stiffness: 5 kN/mm}",
            "dampers:",
            "  pads: {between: [s-1-2, machine], coefficient: 1 kN*s/m}",
            "loads:",
            "  motor: {kind: force, at: s-1-3, amplitude: 100 N}",
            "criteria:",
            "  limits:",
            "    - {at: rack-3, quantity: velocity, peak: 4 mm/s}");
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
        var network = r.Model!.Network;
        // Declared masses first, then the structures in the order written; the chain's prefix defaults to its name.
        Assert.Equal(["machine", "s-1-1", "s-1-2", "s-1-3", "s-2-1", "s-2-2", "s-2-3", "rack-1", "rack-2", "rack-3"], network.Masses.Select(x => x.Name));
        Assert.Equal(new DrawingPosition(1.0, -0.5), network.Masses.Single(x => x.Name == "s-2-3").Position);
        var top = network.Masses.Single(x => x.Name == "rack-3").Position!.Value;
        NumericAssert.Close([0, 1.2], [top.X, top.Y], Tolerance.Abs(1e-12), "drawing position of rack-3 (3 × 0.4 m)");
        var rackBase = network.Springs.Single(s => s.Name == "rack-k1");
        Assert.Equal(("s-2-2", "rack-1", 1e6), (rackBase.NodeA, rackBase.NodeB, rackBase.Stiffness));
        // support: edges is the default of a grid.
        Assert.Contains(network.Springs, s => s.Name == "s-top-1");
        Assert.Equal(new Diagnostics.SourcePosition(4, 3), r.Model.Positions["masses.s-2-3"]);
    }

    [Fact]
    public void GridWithoutSupport_HasNoSpringToGround()
    {
        var r = Read("repeat:", "  slab: {kind: grid, rows: 3, columns: 3, mass: 45 kg, stiffness: 12 kN/mm, support: none}");
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
        Assert.DoesNotContain(r.Model!.Network.Springs, s => s.NodeA == Network.Ground || s.NodeB == Network.Ground);
        Assert.Equal(12, r.Model.Network.Springs.Length);
    }

    [Fact]
    public void UnknownKind_IsReportedAtTheKind_WithASuggestion()
    {
        const string line2 = "  rack: {kind: chian, count: 4, mass: 20 kg, stiffness: 1 kN/mm}";
        SingleError(Read("repeat:", line2), 2, ColumnOf(line2, "chian"), "unknown kind 'chian'", "did you mean 'chain'?");
    }

    [Theory]
    [InlineData("0")]
    [InlineData("-3")]
    [InlineData("2.5")]
    [InlineData("many")]
    public void CountThatIsNotAPositiveWholeNumber_IsReportedAtTheCount(string count)
    {
        var line2 = $"  rack: {{kind: chain, count: {count}, mass: 20 kg, stiffness: 1 kN/mm}}";
        SingleError(Read("repeat:", line2), 2, ColumnOf(line2, count + ","), "'count' of repeated structure 'rack' must be a whole number from 1");
    }

    [Fact]
    public void GeneratedNameClashingWithADeclaredMass_IsReportedAtTheStructure()
    {
        const string line4 = "  rack: {kind: chain, count: 4, mass: 20 kg, stiffness: 1 kN/mm, from: ground, prefix: level}";
        var r = Read("masses:", "  level-3: 50 kg", "repeat:", line4);
        SingleError(r, 4, 3, "would make mass 'level-3', which is also declared under 'masses'", "another 'prefix'");
    }

    [Fact]
    public void TwoStructuresWithOnePrefix_AreReportedAtTheSecond()
    {
        var r = Read("repeat:",
            "  a: {kind: chain, count: 2, mass: 20 kg, stiffness: 1 kN/mm, prefix: p}",
            "  b: {kind: chain, count: 3, mass: 20 kg, stiffness: 1 kN/mm, prefix: p}");
        SingleError(r, 3, 3, "would make mass 'p-1', which an earlier repeated structure also makes");
    }

    [Fact]
    public void DeclaredSpringWithAGeneratedName_IsReportedAtTheDeclaredSpring()
    {
        var r = Read("masses:", "  top: 5 kg",
            "repeat:", "  rack: {kind: chain, count: 2, mass: 20 kg, stiffness: 1 kN/mm, from: ground}",
            "springs:", "  rack-k2: {between: [rack-2, top], stiffness: 1 kN/mm}");
        SingleError(r, 6, 3, "spring 'rack-k2' has the name of a spring made by the 'repeat' section");
    }

    [Fact]
    public void UnknownFromNode_AndUnknownKey_AreEachReported()
    {
        const string line2 = "  rack: {kind: chain, count: 2, mass: 20 kg, stiffness: 1 kN/mm, from: slab, colour: red}";
        var r = Read("repeat:", line2);
        ErrorAt(r, 2, ColumnOf(line2, "slab"), "'from' of repeated structure 'rack' is 'slab', which is not a node");
        ErrorAt(r, 2, ColumnOf(line2, "colour"), "unknown key 'colour'");
    }

    [Fact]
    public void BadSupportWord_IsReportedAtIt()
    {
        const string line2 = "  slab: {kind: grid, rows: 2, columns: 2, mass: 1 kg, stiffness: 1 kN/mm, support: edge}";
        SingleError(Read("repeat:", line2), 2, ColumnOf(line2, "edge}"), "'support' of repeated structure 'slab' is 'edge'", "did you mean 'edges'?");
    }

    private static double Sq(double x) => x * x;
}
