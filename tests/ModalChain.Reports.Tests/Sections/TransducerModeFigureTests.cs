using System.Globalization;
using System.Xml.Linq;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Reports.Drawing;
using ModalChain.Reports.Sections;
using ModalChain.TestSupport;

namespace ModalChain.Reports.Tests.Sections;

/// <summary>Mode figures of a transducer model: the drawing is scaled by the mechanical nodes only; the electrical nodes are drawn at rest with their values.</summary>
public sealed class TransducerModeFigureTests
{
    private static readonly ReportOptions Options = new("test", new DateTimeOffset(2026, 12, 1, 12, 0, 0, TimeSpan.Zero));

    private const string Example = "models/floor-shaker-test.yaml";

    // The example's four masses are its mechanical nodes; its electrical side is the two coils' branch nodes and the
    // recorder's input node (as the file's comments say). The transducers are shaker: [reaction-mass, bay-a], branch
    // [shaker-coil, ground], Bl = 20 T·m; sensor: [geophone-mass, bay-b], branch [sensor-coil, ground], Bl = 28 T·m.
    private static readonly string[] Mechanical = ["bay-a", "bay-b", "reaction-mass", "geophone-mass"];
    private static readonly string[] Electrical = ["shaker-coil", "sensor-coil", "sensor-out"];

    [Fact]
    public void ElectricalSide_IsTheCoilsAndTheRecorderInput()
    {
        var network = Repository.Load(Example).Network;
        Assert.Equal(Electrical.Order(StringComparer.Ordinal), ModesSection.ElectricalNodes(network).Select(i => network.Masses[i].Name).Order(StringComparer.Ordinal));
        Assert.Empty(ModesSection.ElectricalNodes(Repository.UniformChain(3, 1, 100).Network));
    }

    [Fact]
    public void FloorTestModes_DrawingScaleComesFromTheMechanicalNodesOnly()
    {
        var document = Repository.Load(Example);
        var report = ReportBuilder.Build(document, Options);
        var modal = ModalAnalysis.Solve(document.Network, new ModalOptions(Options.MaxModes));
        var masses = document.Network.Masses.Select(m => m.Name).ToArray();
        Assert.Equal(Mechanical.Concat(Electrical).Order(StringComparer.Ordinal), masses.Order(StringComparer.Ordinal));
        Assert.NotEmpty(modal.Modes);
        foreach (var mode in modal.Modes)
        {
            // Independent of the report's normalisation: the mechanical values straight from the mode's DOF vector, the
            // eliminated coils' flux from the transducer constraint λ = Bl·(x_a − x_b), the recorder input from its DOF.
            double Dof(string name) => mode.Shape[modal.Matrices.Dofs.IndexOf(name)];
            var reference = Mechanical.MaxBy(n => Math.Abs(Dof(n)))!;
            var peak = Dof(reference);
            var flux = new Dictionary<string, double>
            {
                ["shaker-coil"] = 20 * (Dof("reaction-mass") - Dof("bay-a")),
                ["sensor-coil"] = 28 * (Dof("geophone-mass") - Dof("bay-b")),
                ["sensor-out"] = Dof("sensor-out"),
            };
            var root = XDocument.Parse(report.Figures.Single(f => f.Name == ModesSection.FigureName(mode.Number)).Svg(true)).Root!;
            Assert.Equal(reference, (string)root.Attribute("data-reference-mass")!);
            // Mechanical blocks move by φ/φ_ref at the stated scale; electrical blocks stay at rest.
            var expected = masses.Select(n => Electrical.Contains(n) ? 0 : Dof(n) / peak).ToArray();
            ModesSectionTests.AssertDisplacements(root, masses, expected, $"mode {mode.Number}");
            var labels = root.Descendants(Repository.Svg + "text").Where(t => ((string?)t.Attribute("class") ?? "").StartsWith("amplitude", StringComparison.Ordinal))
                .ToDictionary(t => (string)t.Attribute("data-mass")!, t => t.Value);
            foreach (var n in Mechanical) Assert.Equal(NetworkFigure.Signed(Dof(n) / peak), labels[n]);
            foreach (var n in Electrical) Assert.Equal("electrical " + NetworkFigure.Signed(flux[n] / peak), labels[n]);
            Assert.Contains(SvgAssert.Texts(root), t => t.StartsWith("Electrical nodes, drawn at rest and left out of the scale:", StringComparison.Ordinal));
        }
        // The reason for the change: in the lowest mode the sensor coil's flux is far above every mechanical value, so a
        // scale over every node would have shrunk the floor's motion to nothing.
        var first = modal.Modes[0];
        var coil = 28 * (first.Shape[modal.Matrices.Dofs.IndexOf("geophone-mass")] - first.Shape[modal.Matrices.Dofs.IndexOf("bay-b")]);
        Assert.True(Math.Abs(coil) > 10 * Mechanical.Max(n => Math.Abs(first.Shape[modal.Matrices.Dofs.IndexOf(n)])),
            string.Create(CultureInfo.InvariantCulture, $"sensor-coil flux {coil} against the mechanical values"));
    }

    [Fact]
    public void NormalisedOverMechanical_DividesEveryEntryByTheLargestMechanicalOne()
    {
        var (shape, reference) = ModesSection.NormalisedOverMechanical([0.5, -2, 40, 1], new HashSet<int> { 2 });
        Assert.Equal(1, reference);
        NumericAssert.Close([-0.25, 1, -20, -0.5], shape, Tolerance.Abs(0), "normalised by −2 (definition)");
    }
}
