using System.Collections.Immutable;
using System.Globalization;
using System.Text.Json;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Model;
using ModalChain.Reports.Sections;
using ModalChain.TestSupport;

namespace ModalChain.Reports.Tests.Sections;

/// <summary>The report pieces of a plane or 3d model: the network drawing in side and plan views, the tables of bodies and directional mounts.</summary>
public sealed class SpatialReportTests
{
    private static readonly ReportOptions Options = new("test", new DateTimeOffset(2026, 1, 2, 3, 4, 5, TimeSpan.Zero));

    /// <summary>A 1200 kg skid (a homogeneous 1.2 × 0.8 × 0.6 m box, centre of mass 0.4 m up) on four corner mounts, and a 5 kg gauge on an axial bracket.</summary>
    internal static ModelDocument Skid(ModelSpace space = ModelSpace.ThreeD)
    {
        var b = new NetworkBuilder { Title = "compressor skid", Space = space };
        var plane = space == ModelSpace.Plane;
        var feet = new[] { (-0.5, -0.3), (0.5, -0.3), (0.5, 0.3), (-0.5, 0.3) }.Take(plane ? 2 : 4)
            .Select((f, i) => new BodyPoint($"foot-{i + 1}", new Point3(f.Item1, plane ? 0 : f.Item2, 0))).ToImmutableArray();
        b.AddBody(new RigidBody("skid", 1200, new Point3(0, 0, 0.4), InertiaMatrix.OfBox(1200, 1.2, 0.8, 0.6), feet));
        b.AddMass(new Mass("gauge", 5) { Location = new Point3(0.9, 0, 0.7) });
        ImmutableArray<DirectionalValue> mount = plane
            ? [new(Direction.X, 6e4), new(Direction.Z, 2e5)]
            : [new(Direction.X, 6e4), new(Direction.Y, 6e4), new(Direction.Z, 2e5)];
        foreach (var f in feet) b.AddSpring(new Spring("mount-" + f.Name[^1], "skid." + f.Name, Network.Ground, 2e5) { Components = mount });
        b.AddSpring(new Spring("bracket", "skid", "gauge", 4e4) { Axial = true });
        b.AddDamper(new Damper("snubber", "skid.foot-1", Network.Ground, 900) { Components = [new(Direction.Z, 900)] });
        return new ModelDocument("skid.yaml", "0", b.Build(), [], new Dictionary<string, SourcePosition>());
    }

    [Fact]
    public void ModelSummary_DrawsTheModelInSideAndPlanViewsAndTablesItsBodiesAndMounts()
    {
        var report = ReportBuilder.Build(Skid(), Options, [ModelSummarySection.Create]);
        var root = SvgAssert.WellFormedWithViewBox(report.Figures.Single(f => f.Name == "network").Svg(standalone: true));
        var views = root.Descendants(Repository.Svg + "g").Select(g => (string?)g.Attribute("data-view")).Where(v => v is not null).ToList();
        Assert.Equal(["side", "plan"], views);
        var texts = SvgAssert.Texts(root);
        Assert.Contains("skid (1200 kg)", texts);
        Assert.Contains("gauge (5 kg)", texts);
        Assert.Contains(texts, t => t.StartsWith("Locations from the model, to scale. Bodies are drawn as the homogeneous box", StringComparison.Ordinal));
        Assert.Contains("Rigid bodies", report.Html, StringComparison.Ordinal);
        Assert.Contains("x 60 kN/m, y 60 kN/m, z 200 kN/m", report.Html, StringComparison.Ordinal);
        Assert.Contains("axial 40 kN/m", report.Html, StringComparison.Ordinal);
        // The drawing block of results.json gives each node's location [x, y, z].
        using var json = JsonDocument.Parse(report.Json.ToArray());
        var drawing = json.RootElement.GetProperty("model").GetProperty("drawing");
        Assert.Equal("side and plan views", drawing.GetProperty("axis").GetString());
        var gauge = drawing.GetProperty("positions_m").GetProperty("gauge").EnumerateArray().Select(e => e.GetDouble()).ToArray();
        Assert.Equal([0.9, 0, 0.7], gauge);
    }

    [Fact]
    public void ModelSummary_OfAPlaneModelHasTheSideViewOnly()
    {
        var report = ReportBuilder.Build(Skid(ModelSpace.Plane), Options, [ModelSummarySection.Create]);
        var root = SvgAssert.WellFormedWithViewBox(report.Figures.Single(f => f.Name == "network").Svg(standalone: true));
        Assert.Equal(["side"], root.Descendants(Repository.Svg + "g").Select(g => (string?)g.Attribute("data-view")).Where(v => v is not null).ToList());
        Assert.Contains("plane: x, z and rotation ry", report.Html, StringComparison.Ordinal);
    }
}
