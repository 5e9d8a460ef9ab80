using System.Text.Json;
using System.Text.RegularExpressions;
using System.Xml.Linq;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Dofs;
using ModalChain.Reports.Writing;
using ModalChain.TestSupport;

namespace ModalChain.Reports.Tests;

/// <summary>The full report for every model in models/ (found at run time), written to disk and read back.</summary>
public sealed class ModelFilesReportTests
{
    private static readonly ReportOptions Options = new("test", new DateTimeOffset(2026, 12, 1, 12, 0, 0, TimeSpan.Zero));

    public static IEnumerable<object[]> Models() => Repository.MechanicalModelFiles();

    public static IEnumerable<object[]> CircuitModels() => Repository.CircuitModelFiles();

    [Fact]
    public void ModelsFolder_HasAtLeastOneModel() => Assert.NotEmpty(Repository.ModelFiles());

    [Theory]
    [MemberData(nameof(CircuitModels))]
    public void CircuitReport_IsWrittenWithWellFormedFigures_AndTheCircuitCommandsNumbers(string model)
    {
        var document = Repository.Load(model);
        var dir = Path.Combine(Repository.TempDirectory(), "report");
        var files = ReportWriter.Write(ReportBuilder.Build(document, Options), dir, ReportFormat.Html);
        foreach (var svg in files.Where(f => f.EndsWith(".svg", StringComparison.Ordinal)))
            SvgAssert.WellFormedWithViewBox(File.ReadAllText(Path.Combine(dir, svg)));
        Assert.Contains("circuit.svg", files);
        Assert.DoesNotContain(files, f => f.StartsWith("mode-", StringComparison.Ordinal));
        // The roots in results.json are those of the circuit's own solve (identity with `modalchain modes` on it).
        var roots = ModalChain.Core.Analyses.Circuits.CircuitModes.Solve(
            ModalChain.Core.Model.CircuitAnalogy.Of(document.Circuit!.Circuit));
        using var json = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(dir, "results.json")));
        var jsonRoots = json.RootElement.GetProperty("circuit_roots").GetProperty("roots").EnumerateArray().ToArray();
        Assert.Equal(roots.Length, jsonRoots.Length);
        for (var j = 0; j < roots.Length; j++)
            NumericAssert.Close(roots[j].NaturalFrequencyHz, jsonRoots[j].GetProperty("natural_frequency_hz").GetDouble(), Tolerance.Rel(1e-12), $"root {j + 1} Hz");
        Assert.False(json.RootElement.TryGetProperty("model", out _));
        var html = File.ReadAllText(Path.Combine(dir, "report.html"));
        Assert.Contains(System.Net.WebUtility.HtmlEncode(ModalChain.Core.Cautions.Text), html, StringComparison.Ordinal);
        Assert.Contains(document.Sha256, html, StringComparison.Ordinal);
        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotMatch(@"(src|href)\s*=\s*""(https?:|//)", html);
    }

    [Theory]
    [MemberData(nameof(Models))]
    public void Report_IsWrittenWithWellFormedFiguresAndConsistentNumbers(string model)
    {
        var document = Repository.Load(model);
        var dir = Path.Combine(Repository.TempDirectory(), "report");
        var files = ReportWriter.Write(ReportBuilder.Build(document, Options), dir, ReportFormat.Html);
        // The report shows one mode per degree of freedom up to its limit: one per mass in a line model, one per DOF of each
        // mass and body in plane and 3d models (a rigid body in 3d has six), since the DOFs, not the nodes, count the modes.
        var modal = ModalAnalysis.Solve(document.Network, new ModalOptions(Math.Min(Options.MaxModes, DofMap.For(document.Network).Count)));

        // Every SVG file: well-formed, viewBox; every mode figure names its mode and frequency with the unit.
        foreach (var svg in files.Where(f => f.EndsWith(".svg", StringComparison.Ordinal)))
            SvgAssert.WellFormedWithViewBox(File.ReadAllText(Path.Combine(dir, svg)));
        foreach (var mode in modal.Modes)
        {
            var root = XDocument.Parse(File.ReadAllText(Path.Combine(dir, $"mode-{mode.Number:00}.svg"))).Root!;
            var title = SvgAssert.Texts(root).First();
            Assert.StartsWith($"Mode {mode.Number}: ", title, StringComparison.Ordinal);
            Assert.Matches(@" Hz( \(rigid-body mode\))?$", title);
            var shape = ModalChain.Reports.Sections.ModesSection.Normalised(mode).Shape;
            // Line models: each mass's block is displaced by its shape value. Plane and 3d mode figures are drawn in views and
            // checked by SpatialReportTests (pure lift of a bounce, equal turn of a yaw, the centre of mass moved by the shape).
            // Large or plan-laid-out line models are drawn as colour maps: each mass's cell has the colour step of its value.
            var view = ModalChain.Reports.Sections.ModesSection.ViewOf(document.Network);
            // Transducer models: the electrical nodes (the examples' are massless nodes) are drawn at rest and the drawing is
            // scaled by the mechanical masses only (TransducerModeFigureTests checks the floor test against its constraint).
            if (!document.Network.Transducers.IsEmpty)
            {
                var byMass = modal.ShapeByMass(mode);
                var masses = document.Network.Masses;
                var peak = byMass[Enumerable.Range(0, masses.Length).Where(i => masses[i].Kilograms > 0).MaxBy(i => Math.Abs(byMass[i]))];
                shape = [.. byMass.Select((v, i) => masses[i].Kilograms > 0 ? v / peak : 0)];
            }
            if (view == ModalChain.Reports.Sections.ModeView.Schematic)
                Sections.ModesSectionTests.AssertDisplacements(root, [.. document.Network.Masses.Select(m => m.Name)], shape, $"{model} mode {mode.Number}");
            else if (view == ModalChain.Reports.Sections.ModeView.Map)
                Drawing.ShapeMapFigureTests.AssertColoursFollowShape(root, document.Network, modal.ShapeByMass(mode), $"{model} mode {mode.Number}");
        }

        // results.json holds the modes object of `modalchain modes --format json` under "modes", plus the report's own keys.
        using var json = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(dir, "results.json")));
        var root2 = json.RootElement;
        Assert.Equal(document.Sha256, root2.GetProperty("report").GetProperty("source").GetProperty("sha256").GetString());
        var modes = root2.GetProperty("modes");
        NumericAssert.Close(document.Network.TotalMass, modes.GetProperty("total_mass_kg").GetDouble(), Tolerance.Rel(1e-12), "total mass");
        var jsonModes = modes.GetProperty("modes").EnumerateArray().ToArray();
        Assert.Equal(modal.Modes.Length, jsonModes.Length);
        for (var j = 0; j < jsonModes.Length; j++)
            NumericAssert.Close(modal.Modes[j].NaturalFrequencyHz, jsonModes[j].GetProperty("frequency_hz").GetDouble(), Tolerance.Rel(1e-12), $"mode {j + 1} Hz");
        Assert.Equal(document.Network.Masses.Length, root2.GetProperty("model").GetProperty("masses").GetArrayLength());

        // The HTML: one figure per mode, the caution, the trace of the input, and nothing fetched from elsewhere.
        var html = File.ReadAllText(Path.Combine(dir, "report.html"));
        Assert.Equal(modal.Modes.Length, Regex.Matches(html, "<figure class=\"figure mode-figure\"").Count);
        Assert.Contains(System.Net.WebUtility.HtmlEncode(ModalChain.Core.Cautions.Text), html, StringComparison.Ordinal);
        Assert.Contains(document.Sha256, html, StringComparison.Ordinal);
        Assert.Contains(Path.GetFileName(model), html, StringComparison.Ordinal);
        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotMatch(@"(src|href)\s*=\s*""(https?:|//)", html);
        Assert.DoesNotMatch(@"url\((https?:|//)", html);
    }
}
