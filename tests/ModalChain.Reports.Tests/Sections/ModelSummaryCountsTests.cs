using System.Xml.Linq;
using ModalChain.Core.Model;
using ModalChain.Reports.Pdf;
using ModalChain.Reports.Sections;

namespace ModalChain.Reports.Tests.Sections;

/// <summary>The model summary counts inerters, mounts and transducers, in the drawing's header and the facts, and lists inerters and transducers.</summary>
public sealed class ModelSummaryCountsTests
{
    private static readonly ReportOptions Options = new("test", new DateTimeOffset(2026, 12, 1, 12, 0, 0, TimeSpan.Zero));

    // Counted by hand from the YAML below: 3 masses (deck, tuned and the mount's inner node pad~inner) and 1 circuit
    // node (coil-node, the transducer's branch terminal, so electrical: its 1e-6 "kg" is a capacitance of 1 µF and it
    // is counted apart from the masses since the electrical side is counted in its own terms), 3 springs (deck-columns, and the mount's pad~long-term and pad~series), 1 damper
    // (pad~damper), 2 inerters, 1 mount, 1 transducer.
    private const string Yaml = """
        title: Deck with a flywheel absorber and a shaker coil
        masses:
          deck: 3.2 t
          tuned: 160 kg
          coil-node: 1e-6 kg
        springs:
          deck-columns: {between: [ground, deck], stiffness: 95 kN/mm}
        mounts:
          pad: {kind: standard-linear-solid, between: [tuned, deck], stiffness: 400 kN/m, relaxation-strength: 0.5, relaxation-time: 2 ms}
        inerters:
          grounded: {between: [tuned, ground], inertance: 360 kg}
          across: {between: [deck, tuned], inertance: 60 kg}
        transducers:
          coil: {between: [deck, ground], branch: [coil-node, ground], force-factor: 15 T*m}
        """;

    private static DocumentSection Summary(Report report) => report.Document!.Sections.Single(s => s.Key == "model");

    [Fact]
    public void Counts_AreTheElementsOfEachKind()
    {
        var network = Repository.Parse(Yaml).Network;
        Assert.Equal(new ModelCounts(Bodies: 0, Masses: 3, Springs: 3, Dampers: 1, Inerters: 2, Mounts: 1, Transducers: 1) { CircuitNodes = 1 }, ModelCounts.Of(network));
        Assert.Equal("3 masses, 1 circuit node, 3 springs, 1 damper, 2 inerters, 1 mount, 1 transducer", ModelCounts.Of(network).Phrase(withBodies: false));
        // Kinds the model lacks are left out; a chain of masses and springs reads as before.
        Assert.Equal("3 masses, 3 springs, 0 dampers", ModelCounts.Of(Repository.UniformChain(3, 1, 100).Network).Phrase(withBodies: false));
        Assert.Null(ModelCounts.Of(Repository.UniformChain(3, 1, 100).Network).ExtraFact());
    }

    [Fact]
    public void ReportSummary_StatesTheCounts_AndListsInertersAndTransducers()
    {
        var report = ReportBuilder.Build(Repository.Parse(Yaml), Options);
        var summary = Summary(report);
        var facts = summary.Blocks.OfType<FactsBlock>().Single().Facts.ToDictionary(f => f.Key, f => f.Value);
        Assert.StartsWith("2, 1, 1 ", facts["Inerters, mounts, transducers"], StringComparison.Ordinal);
        Assert.Contains("each mount is also counted", facts["Inerters, mounts, transducers"]);
        var inerters = summary.Blocks.OfType<TableBlock>().Single(t => t.Caption == "Inerters");
        Assert.Equal(["grounded", "across"], inerters.Rows.Select(r => r[0]));
        Assert.Equal(["tuned – ground", "deck – tuned"], inerters.Rows.Select(r => r[1]));
        Assert.Equal(["360", "60"], inerters.Rows.Select(r => r[2])); // in kg, the file's unit
        var transducers = summary.Blocks.OfType<TableBlock>().Single(t => t.Caption == "Transducers");
        Assert.Equal<string>(["coil", "deck – ground", "coil-node – ground", "15"], transducers.Rows.Single());
        var drawing = XDocument.Parse(report.Figures.Single(f => f.Name == "network").Svg(true)).Root!;
        Assert.Contains(SvgAssert.Texts(drawing), t => t.StartsWith("3 masses, 1 circuit node, 3 springs, 1 damper, 2 inerters, 1 mount, 1 transducer; total mass", StringComparison.Ordinal));
    }

    [Fact]
    public void A3dSummary_CountsItsInerters_AndListsTheirComponents()
    {
        var report = ReportBuilder.Build(Repository.Parse("""
            title: Skid with a flywheel brace
            space: 3d
            bodies:
              skid: {mass: 900 kg, centre-of-mass: [0, 0, 0.5], box: [1.2, 0.8, 1.0], points: {foot: [0.5, 0.3, 0]}}
            springs:
              mount: {between: [skid.foot, ground], stiffness: {x: 200 kN/m, y: 300 kN/m, z: 800 kN/m}}
              pivot: {between: [skid, ground], rotational-stiffness: {rx: 40 kN*m/rad, ry: 40 kN*m/rad, rz: 50 kN*m/rad}}
            inerters:
              brace: {between: [skid, ground], inertance: {x: 150 kg}, rotational-inertance: {rz: 12 kg*m^2}}
            """), Options);
        var summary = Summary(report);
        var facts = summary.Blocks.OfType<FactsBlock>().Single().Facts.ToDictionary(f => f.Key, f => f.Value);
        Assert.Equal("1, 0, 0", facts["Inerters, mounts, transducers"]);
        var row = summary.Blocks.OfType<TableBlock>().Single(t => t.Caption == "Inerters").Rows.Single();
        Assert.Equal<string>(["brace", "skid – ground", "x 150 kg, rz 12.00 kg·m²/rad"], row);
        var drawing = XDocument.Parse(report.Figures.Single(f => f.Name == "network").Svg(true)).Root!;
        Assert.Contains(SvgAssert.Texts(drawing), t => t.StartsWith("1 body, 0 masses, 2 springs, 0 dampers, 1 inerter;", StringComparison.Ordinal));
    }
}
