using ModalChain.Core.Analyses.Absorbers;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;
using ModalChain.Io.Model;

namespace ModalChain.Io.Tests.Model;

public class ModelWriterTests
{
    private const string Original = """
        # A comment that is carried over.
        title: "Fan deck: bay 3"
        masses:
          deck: {mass: 2600 kg, at: [0, 0]}
          fan-base: 420 kg
        springs:
          beams:  {between: [ground, deck], stiffness: 68 kN/mm}
          mounts: {between: [deck, fan-base], stiffness: 1.6 kN/mm}
        criteria:
          separation: {margin: 20 %, speeds: [1470 rpm], orders: [1, 2]}
          limits:
            - {at: fan-base, quantity: velocity, rms: 4.5 mm/s}
        """;

    private static (ModelDocument Before, Network Expected, ModelDocument After, string Text) RoundTrip(string original)
    {
        var before = ModelReader.Read(original, "in.yaml").Model!;
        var modal = ModalAnalysis.Solve(before.Network);
        var design = AbsorberTuning.Design(modal, new AbsorberRequest("deck", 0.05, 2, []));
        var expected = AbsorberTuning.Attach(before.Network, design, AbsorberTuning.FreeNames(before.Network, "deck"));
        var text = ModelWriter.WithAdditions(original, "in.yaml", expected, ["written by a test"]);
        var read = ModelReader.Read(text, "out.yaml");
        Assert.True(read.Succeeded, string.Join("\n", read.Diagnostics) + "\n" + text);
        return (before, expected, read.Model!, text);
    }

    [Fact]
    public void WrittenModel_ReadsBackAsTheSameNetwork()
    {
        var (before, expected, after, text) = RoundTrip(Original);
        Assert.Equal(expected.Title, after.Network.Title);
        Assert.Equal(expected.Masses.ToArray(), after.Network.Masses.ToArray());
        Assert.Equal(expected.Springs.ToArray(), after.Network.Springs.ToArray());
        Assert.Equal(expected.Dampers.ToArray(), after.Network.Dampers.ToArray());
        Assert.Equal(expected.Supports.ToArray(), after.Network.Supports.ToArray());
        // Criteria are carried over unchanged.
        Assert.Equal(before.Criteria.Separation!.SpeedsHz.ToArray(), after.Criteria.Separation!.SpeedsHz.ToArray());
        Assert.Equal(before.Criteria.Limits.ToArray(), after.Criteria.Limits.ToArray());
        Assert.StartsWith("# written by a test\n", text);
        Assert.Contains("stiffness: 68 kN/mm", text); // original entries keep their units
    }

    [Fact]
    public void ModelWithARepeatSection_IsWrittenWithoutItsGeneratedElements_AndReadsBack()
    {
        // The corruption guard found `tune --write` copying the masses a 'repeat' section generates into 'masses',
        // so the written file clashed with itself. Only the absorber may be added.
        const string withRepeat = """
            title: Rack with a fan on level 3
            repeat:
              rack: {kind: chain, count: 4, mass: 120 kg, stiffness: 2.5 kN/mm, from: ground, prefix: level}
            """;
        var before = ModelReader.Read(withRepeat, "in.yaml").Model!;
        var design = AbsorberTuning.Design(ModalAnalysis.Solve(before.Network), new AbsorberRequest("level-3", 0.05, 1, []));
        var expected = AbsorberTuning.Attach(before.Network, design, AbsorberTuning.FreeNames(before.Network, "level-3"));

        var text = ModelWriter.WithAdditions(withRepeat, "in.yaml", expected, ["written by a test"]);
        var read = ModelReader.Read(text, "out.yaml");

        Assert.True(read.Succeeded, string.Join("\n", read.Diagnostics) + "\n" + text);
        Assert.DoesNotContain("level-1:", text, StringComparison.Ordinal);
        Assert.Equal(expected.Masses.OrderBy(m => m.Name, StringComparer.Ordinal), read.Model!.Network.Masses.OrderBy(m => m.Name, StringComparer.Ordinal));
        Assert.Equal(expected.Springs.OrderBy(x => x.Name, StringComparer.Ordinal), read.Model.Network.Springs.OrderBy(x => x.Name, StringComparer.Ordinal));
        Assert.Equal(expected.Dampers.ToArray(), read.Model.Network.Dampers.ToArray());
    }

    [Fact]
    public void ModelWithoutDampers_GainsADampersSection()
    {
        var (_, expected, after, text) = RoundTrip(Original);
        Assert.Single(after.Network.Dampers);
        Assert.Equal("deck-absorber-damper", after.Network.Dampers[0].Name);
        Assert.True(text.IndexOf("dampers:", StringComparison.Ordinal) < text.IndexOf("criteria:", StringComparison.Ordinal));
        Assert.Equal(expected.Dampers[0].Coefficient, after.Network.Dampers[0].Coefficient);
    }

    [Fact]
    public void WrittenModel_HasTheSameModesAsTheNetworkInMemory()
    {
        var (_, expected, after, _) = RoundTrip(Original);
        var a = ModalAnalysis.Solve(expected).Modes.Select(m => m.NaturalFrequencyHz).ToArray();
        var b = ModalAnalysis.Solve(after.Network).Modes.Select(m => m.NaturalFrequencyHz).ToArray();
        Assert.Equal(a, b);
    }

    [Fact]
    public void UnderADecimalCommaCulture_NumbersStayInvariant()
    {
        using var culture = new ModalChain.TestSupport.CultureScope("de-DE");
        var (_, expected, after, text) = RoundTrip(Original);
        Assert.Equal(expected.Masses.ToArray(), after.Network.Masses.ToArray());
        Assert.Contains("at: [0, 0.5]", text);
    }

    [Fact]
    public void DampingLoadsAndSweep_AreCarriedOverUnchanged()
    {
        const string withHarmonic = """
            title: Chiller skid on a steel deck
            masses:
              deck: {mass: 3200 kg}
              skid: {mass: 850 kg}
            springs:
              columns: {between: [ground, deck], stiffness: 95 kN/mm}
              mounts:  {between: [deck, skid], stiffness: 8.4 kN/mm}
            damping:
              modal: [2 %, 3 %]
            loads:
              unbalance: {kind: unbalance, at: skid, mass-radius: 12000 g*mm, speed: 1480 rpm}
            harmonic:
              loads: [unbalance]
              frequencies: {from: 1 Hz, to: 60 Hz, points: 600, spacing: log}
              outputs: [deck, skid]
            """;
        var (before, _, after, _) = RoundTrip(withHarmonic);
        Assert.Equal(before.Structure.Damping.ModalRatios.ToArray(), after.Structure.Damping.ModalRatios.ToArray());
        Assert.Equal(before.Structure.Loads.ToArray(), after.Structure.Loads.ToArray());
        Assert.Equal(before.Harmonic!.Outputs.ToArray(), after.Harmonic!.Outputs.ToArray());
        Assert.Equal(before.Harmonic.Frequencies, after.Harmonic.Frequencies);
    }

    [Fact]
    public void ElementsAddedToA3dModel_AreWrittenWithLocationsAndDirections_AndReadBack()
    {
        var original = File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "models", "compressor-skid-deck.yaml"));
        var before = ModelReader.Read(original, "in.yaml").Model!.Network;
        var absorber = new Mass("absorber", 92.5, null) { Location = new Point3(0.35, 0.2, 1.05), Moves = [Core.Dofs.Direction.Z] };
        var springs = new[]
        {
            new Spring("absorber-spring", "skid.crank", "absorber", 1.25e5) { Components = [new(Core.Dofs.Direction.Z, 1.25e5)] },
            new Spring("absorber-tie", "skid", "absorber", 3e4) { Axial = true },
            new Spring("skid-torsion", "skid", "ground", 0) { Components = [new(Core.Dofs.Direction.Rz, 4.5e3)] },
        };
        var dampers = new[] { new Damper("absorber-damper", "skid.crank", "absorber", 310) { Components = [new(Core.Dofs.Direction.Z, 310)] } };
        var expected = before.WithAdded([absorber], springs, dampers);
        var text = ModelWriter.WithAdditions(original, "in.yaml", expected, ["written by a test"]);
        var read = ModelReader.Read(text, "out.yaml");
        Assert.True(read.Succeeded, string.Join("\n", read.Diagnostics) + "\n" + text);
        var after = read.Model!.Network;
        Assert.Equal(ModelSpace.ThreeD, after.Space);
        var mass = after.Masses.Single(m => m.Name == "absorber");
        Assert.Equal((92.5, absorber.Location), (mass.Kilograms, mass.Location));
        Assert.Equal(absorber.Moves.ToArray(), mass.Moves.ToArray());
        foreach (var s in springs)
        {
            var back = after.Springs.Single(x => x.Name == s.Name);
            Assert.Equal((s.NodeA, s.NodeB, s.Axial, s.Stiffness), (back.NodeA, back.NodeB, back.Axial, back.Stiffness));
            Assert.Equal(s.Components.ToArray(), back.Components.ToArray());
        }
        var damper = after.Dampers.Single(d => d.Name == "absorber-damper");
        Assert.Equal(dampers[0].Components.ToArray(), damper.Components.ToArray());
        Assert.Equal(before.Bodies.Single().Inertia, after.Bodies.Single().Inertia);
    }

    [Fact]
    public void AbsorberOnABodyPoint_OfAModelWithoutMassesOrDampers_IsWrittenInPlace_AndReadsBack()
    {
        // A plane model of a body only: the absorber's spring joins the springs, and new 'masses' and 'dampers' sections
        // follow them (the spring once landed under the new 'masses' header and the file was re-emitted without comments).
        const string original = """
            # A rigid bar on two springs.
            title: Rigid bar
            space: plane
            bodies:
              bar: {mass: 1000 kg, centre-of-mass: [0, 0], inertia: {yy: 810 kg*m^2}, points: {front: [1.0, 0], rear: [-1.5, 0]}}
            springs:
              front-spring: {between: [bar.front, ground], stiffness: {x: 50 kN/m, z: 18 kN/m}}
              rear-spring: {between: [bar.rear, ground], stiffness: {x: 50 kN/m, z: 22 kN/m}}
            damping:
              modal: 2 %
            """;
        var before = ModelReader.Read(original, "in.yaml").Model!.Network;
        var design = AbsorberTuning.Design(ModalAnalysis.Solve(before), new AbsorberRequest("bar.front.z", 0.05, 2, []));
        var names = AbsorberTuning.FreeNames(before, design.Host);
        var expected = AbsorberTuning.Attach(before, design, names);
        var text = ModelWriter.WithAdditions(original, "in.yaml", expected, ["written by a test"]);
        Assert.DoesNotContain(ModelWriter.CommentsLostNote, text, StringComparison.Ordinal);
        Assert.Contains("# A rigid bar on two springs.", text, StringComparison.Ordinal);
        var read = ModelReader.Read(text, "out.yaml");
        Assert.True(read.Succeeded, string.Join("\n", read.Diagnostics) + "\n" + text);
        var after = read.Model!.Network;
        var mass = after.Masses.Single();
        Assert.Equal((names.Mass, design.Mass, new Point3(1.0, 0, 0)), (mass.Name, mass.Kilograms, mass.Location));
        Assert.Equal([Core.Dofs.Direction.Z], mass.Moves.ToArray());
        Assert.Equal([new DirectionalValue(Core.Dofs.Direction.Z, design.Stiffness)], after.Springs.Single(x => x.Name == names.Spring).Components.ToArray());
        Assert.Equal([new DirectionalValue(Core.Dofs.Direction.Z, design.Damping)], after.Dampers.Single().Components.ToArray());
    }
}

/// <summary>The writer edits the file in place: comments, blank lines and layout of the original survive.</summary>
public class ModelWriterInPlaceTests
{
    private static string Root()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "ModalChain.sln"))) return dir.FullName;
        throw new InvalidOperationException("ModalChain.sln not found");
    }

    // The mechanical example models: an absorber is added to each (a circuit model has no mass to host one).
    public static TheoryData<string> ExampleModels() =>
        [.. Directory.GetFiles(Path.Combine(Root(), "models"), "*.yaml")
            .Where(f => ModelReader.Read(File.ReadAllText(f), f).Model is { Circuit: null })
            .Select(f => Path.GetFileName(f)).Order(StringComparer.Ordinal)];

    /// <summary>Adds an absorber on the heaviest mass of <paramref name="original"/> and writes the file; returns the expected network and the text.</summary>
    private static (Network Expected, string Text) WithAbsorber(string original, string file = "in.yaml")
    {
        var read = ModelReader.Read(original, file);
        Assert.True(read.Succeeded, string.Join("\n", read.Diagnostics));
        var before = read.Model!.Network;
        var modal = ModalAnalysis.Solve(before);
        // Plane and 3d models: the translation DOF label that moves most in the first flexible mode, with that mode.
        var (host, mode) = before.Space == ModelSpace.Line
            ? (before.Masses.MaxBy(m => m.Kilograms)!.Name, (int?)null)
            : SpatialHost(modal);
        var design = AbsorberTuning.Design(modal, new AbsorberRequest(host, 0.05, mode, []));
        var expected = AbsorberTuning.Attach(before, design, AbsorberTuning.FreeNames(before, host));
        return (expected, ModelWriter.WithAdditions(original, file, expected, ["written by a test"]));
    }

    private static (string Host, int? Mode) SpatialHost(ModalResult modal)
    {
        var dofs = modal.Matrices.Dofs;
        var mode = modal.Modes.First(m => !m.IsRigidBody);
        var host = Enumerable.Range(0, dofs.Count).Where(i => !dofs.Dofs[i].Direction.IsRotation()).MaxBy(i => Math.Abs(mode.Shape[i]));
        return (dofs.Label(host), mode.Number);
    }

    private static void AssertReadsBackAs(Network expected, string text, string file = "out.yaml")
    {
        var read = ModelReader.Read(text, file);
        Assert.True(read.Succeeded, string.Join("\n", read.Diagnostics) + "\n" + text);
        var n = read.Model!.Network;
        // Directions and components are immutable arrays, which records compare by reference: they are compared apart.
        Assert.Equal(expected.Masses.OrderBy(m => m.Name, StringComparer.Ordinal).Select(m => (m with { Moves = [] }, string.Join(",", m.Moves))),
            n.Masses.OrderBy(m => m.Name, StringComparer.Ordinal).Select(m => (m with { Moves = [] }, string.Join(",", m.Moves))));
        Assert.Equal(expected.Springs.OrderBy(s => s.Name, StringComparer.Ordinal).Select(s => (s with { Components = [] }, string.Join(",", s.Components))),
            n.Springs.OrderBy(s => s.Name, StringComparer.Ordinal).Select(s => (s with { Components = [] }, string.Join(",", s.Components))));
        Assert.Equal(expected.Dampers.OrderBy(d => d.Name, StringComparer.Ordinal).Select(d => (d with { Components = [] }, string.Join(",", d.Components))),
            n.Dampers.OrderBy(d => d.Name, StringComparer.Ordinal).Select(d => (d with { Components = [] }, string.Join(",", d.Components))));
    }

    [Theory]
    [MemberData(nameof(ExampleModels))]
    public void EveryLineOfAnExampleModel_SurvivesInOrder_AndTheFileReadsBack(string model)
    {
        var path = Path.Combine(Root(), "models", model);
        var original = File.ReadAllText(path);
        var (expected, text) = WithAbsorber(original, path);
        AssertReadsBackAs(expected, text, path);
        Assert.DoesNotContain(ModelWriter.CommentsLostNote, text, StringComparison.Ordinal);
        // The original's lines (comments, blank lines, entries) are a subsequence of the written file's lines.
        var written = text.Split('\n');
        var k = 0;
        foreach (var line in original.Split('\n'))
        {
            while (k < written.Length && written[k] != line) k++;
            Assert.True(k < written.Length, $"{model}: the line '{line}' is missing or out of order in\n{text}");
            k++;
        }
        var comments = original.Split('\n').Count(l => l.TrimStart().StartsWith('#'));
        Assert.True(comments > 0, $"{model} has no comment line to keep");
    }

    [Fact]
    public void FlowStyleSections_GainTheirEntriesInsideTheBraces()
    {
        const string flow = """
            # deck and skid, written compactly
            masses: {deck: 3200 kg, skid: {mass: 850 kg}}   # two masses
            springs: {columns: {between: [ground, deck], stiffness: 95 kN/mm}, mounts: {between: [deck, skid], stiffness: 8.4 kN/mm}}
            dampers: {}
            """;
        var (expected, text) = WithAbsorber(flow);
        AssertReadsBackAs(expected, text);
        Assert.Contains("# deck and skid, written compactly", text, StringComparison.Ordinal);
        Assert.Contains("}}   # two masses", text, StringComparison.Ordinal);
        Assert.DoesNotContain(ModelWriter.CommentsLostNote, text, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("dampers:\n")]
    [InlineData("dampers: ~\n")]
    [InlineData("")]
    public void EmptyOrMissingDampers_AreFilledWhereTheyStand(string dampers)
    {
        var original = "masses:\n  deck: 3200 kg   # the deck\nsprings:\n  columns: {between: [ground, deck], stiffness: 95 kN/mm}\n" + dampers + "# last words\n";
        var (expected, text) = WithAbsorber(original);
        AssertReadsBackAs(expected, text);
        Assert.Contains("  deck: 3200 kg   # the deck\n", text, StringComparison.Ordinal);
        Assert.EndsWith("# last words\n", text, StringComparison.Ordinal);
        Assert.DoesNotContain(ModelWriter.CommentsLostNote, text, StringComparison.Ordinal);
    }

    [Fact]
    public void WindowsLineEnds_AndAMissingFinalNewline_AreKept()
    {
        const string original = "# CRLF file\r\nmasses:\r\n  deck: 3200 kg\r\nsprings:\r\n  columns: {between: [ground, deck], stiffness: 95 kN/mm}";
        var (expected, text) = WithAbsorber(original);
        AssertReadsBackAs(expected, text);
        Assert.DoesNotContain("\r\r", text, StringComparison.Ordinal);
        Assert.Equal(text.Split('\n').Length - 1, text.Split("\r\n").Length - 1); // every line ends in CRLF
        Assert.Contains("# CRLF file\r\n", text, StringComparison.Ordinal);
    }

    [Fact]
    public void AFileWithAnchors_IsReEmitted_AndSaysItsCommentsWereLost()
    {
        const string anchored = """
            # shared mount stiffness
            masses:
              deck: 3200 kg
              skid: 850 kg
            springs:
              columns: {between: [ground, deck], stiffness: &k 95 kN/mm}
              mounts: {between: [deck, skid], stiffness: *k}
            """;
        var (expected, text) = WithAbsorber(anchored);
        AssertReadsBackAs(expected, text);
        Assert.Contains(ModelWriter.CommentsLostNote, text, StringComparison.Ordinal);
    }
}
