using System.Text.Json;
using ModalChain.Cli.Tests.Schemas;

namespace ModalChain.Cli.Tests.Commands;

/// <summary><c>check</c>, <c>transient</c> and <c>report</c> on a 3d model with criteria at points and directions and with timed loads.</summary>
public class SpatialCriteriaCommandTests
{
    // A skid on four mounts on a deck that moves in z only (invented scenario), a crank unbalance at 980 rpm, a timed kick.
    private const string Model = """
        title: Skid on four mounts on a deck
        space: 3d
        masses:
          deck: {mass: 2600 kg, at: [0, 0, 0], directions: [z]}
        bodies:
          skid:
            mass: 1850 kg
            centre-of-mass: [0.08, 0, 0.62]
            box: [2.4 m, 1.2 m, 1.1 m]
            points: {foot-1: [1.1, 0.55, 0.1], foot-2: [1.1, -0.55, 0.1], foot-3: [-1.1, 0.55, 0.1], foot-4: [-1.1, -0.55, 0.1], crank: [0.35, 0, 0.85]}
        springs:
          deck-beams: {between: [ground, deck], stiffness: {z: 48 kN/mm}}
          mount-1: {between: [skid.foot-1, deck], stiffness: {x: 0.9 kN/mm, y: 0.9 kN/mm, z: 2.6 kN/mm}}
          mount-2: {between: [skid.foot-2, deck], stiffness: {x: 0.9 kN/mm, y: 0.9 kN/mm, z: 2.6 kN/mm}}
          mount-3: {between: [skid.foot-3, deck], stiffness: {x: 0.9 kN/mm, y: 0.9 kN/mm, z: 2.6 kN/mm}}
          mount-4: {between: [skid.foot-4, deck], stiffness: {x: 0.9 kN/mm, y: 0.9 kN/mm, z: 2.6 kN/mm}}
        damping:
          modal: 3 %
        loads:
          crank-unbalance: {kind: unbalance, at: skid.crank, plane: [x, z], mass-radius: 25 kg*mm, speed: 980 rpm}
          kick: {kind: force, at: skid.crank, direction: z, time: {kind: half-sine, amplitude: 2 kN, duration: 10 ms}}
        transient:
          duration: 0.3 s
          step: 1 ms
          outputs: [deck]
        criteria:
          limits:
            - {at: deck.z, quantity: velocity, peak: 2 mm/s}
            - {at: skid.crank, quantity: velocity, rms: 4 mm/s}
          machine-zones:
            - {at: [skid.foot-1], class: medium-rigid, zone: B}
          floor-curves:
            - {at: deck, curve: VC-A}
        """;

    [Fact]
    public void Check_NamesTheLargestDirection_AndItsJsonFollowsTheSchema()
    {
        var path = CommandRun.ModelFile(Model);
        var table = CommandRun.Of("check", path);
        Assert.True(table.ExitCode == 1, table.Error); // the floor curve fails (a deck under a compressor is no laboratory floor)
        Assert.Contains("skid.crank (largest: skid.crank.", table.Output, StringComparison.Ordinal);
        Assert.Contains("skid.foot-1 (largest: skid.foot-1.", table.Output, StringComparison.Ordinal);
        Assert.Contains("Floor curve VC-A at deck:", table.Output, StringComparison.Ordinal);
        Assert.Contains("Caution:", table.Output, StringComparison.Ordinal);

        var run = CommandRun.Of("check", path, "--format", "json");
        SchemaFiles.AssertValid("check.schema.json", run.Output, "check of a 3d model");
        var limits = run.Json().GetProperty("limits").EnumerateArray().ToArray();
        Assert.False(limits[0].TryGetProperty("measured_at", out _)); // deck.z names one motion
        Assert.StartsWith("skid.crank.", limits[1].GetProperty("measured_at").GetString(), StringComparison.Ordinal);
        Assert.True(limits.All(l => l.GetProperty("passes").GetBoolean()));
    }

    [Fact]
    public void Transient_RunsTheTimedLoadWithItsDirection_AndReportsMountForces()
    {
        var run = CommandRun.Of("transient", CommandRun.ModelFile(Model));
        Assert.True(run.ExitCode == 0, run.Error);
        Assert.Contains("kick (half-sine", run.Output, StringComparison.Ordinal);
        Assert.Contains("force in z at skid.crank", run.Output, StringComparison.Ordinal);
        Assert.Contains("Mount forces: peak", run.Output, StringComparison.Ordinal);
        Assert.Contains("spring mount-1", run.Output, StringComparison.Ordinal);
    }

    [Fact]
    public void Report_HasTheCriteriaSectionOfTheSpatialModel()
    {
        var dir = Path.Combine(Path.GetTempPath(), "modalchain-cli-tests", Guid.NewGuid().ToString("N"), "out");
        var run = CommandRun.Of("report", CommandRun.ModelFile(Model), "-o", dir);
        Assert.True(run.ExitCode == 0, run.Error);
        using var json = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(dir, "results.json")));
        var criteria = json.RootElement.GetProperty("criteria");
        Assert.StartsWith("skid.crank.", criteria.GetProperty("limits")[1].GetProperty("measured_at").GetString(), StringComparison.Ordinal);
        var html = File.ReadAllText(Path.Combine(dir, "report.html"));
        Assert.Contains("at skid.crank (largest: skid.crank.", html, StringComparison.Ordinal);
        Assert.Contains("transient", json.RootElement.EnumerateObject().Select(p => p.Name));
    }
}
