using System.Text.Json;
using ModalChain.Cli.Tests.Schemas;
using ModalChain.Core.Model;

namespace ModalChain.Cli.Tests.Commands;

/// <summary>docs/examples/fan-skid-elastomer-mounts-3d.yaml, a 3d model with mounts and a massless node, through every command's JSON.</summary>
public class SpatialMountCommandTests
{
    private static string Example => Path.Combine(CliRun.RepositoryRoot, "docs", "examples", "fan-skid-elastomer-mounts-3d.yaml");

    private static JsonDocument Json(string command, string schema)
    {
        var o = CliRun.Run(command, Example, "--format", "json");
        Assert.True(o.ExitCode == 0, o.ToString());
        SchemaFiles.AssertValid(schema, o.Stdout, $"{command} on fan-skid-elastomer-mounts-3d.yaml");
        return JsonDocument.Parse(o.Stdout);
    }

    [Fact]
    public void Example_IsAValidModel()
    {
        SchemaFiles.AssertValid("model.schema.json", SchemaFiles.YamlToJson(File.ReadAllText(Example)).GetRawText(), "fan-skid-elastomer-mounts-3d.yaml");
        var o = CliRun.Run("validate", Example);
        Assert.True(o.ExitCode == 0, o.ToString());
    }

    [Fact]
    public void Modes_ListTheMountsRelaxation_AtOneOverTau_WhereTheBranchEndsStandStill()
    {
        // Closed form: a spring k2 and a damper c in series whose outer ends stand still relax with c·ẏ + k2·y = 0,
        // λ = −k2/c = −1/τ (docs/methods.md). Four mounts' inner nodes move in 12 translations, the fan and the roof frame
        // in 7: at least 12 − 7 = 5 combinations of the inner nodes load neither, so their roots are exactly −1/τ, with
        // τ the one relaxation time fitted to η = 0.15 at 24.2 Hz (MountExpansion, checked in the line tests).
        using var json = Json("modes", "modes.schema.json");
        var tau = MountExpansion.RelaxationTimeForLossFactor(0.6, 0.15, 2 * Math.PI * 24.2)!.Value;
        var relaxations = json.RootElement.GetProperty("complex_modes").EnumerateArray()
            .Where(r => r.GetProperty("kind").GetString() == "relaxation")
            .Select(r => r.GetProperty("eigenvalue_real").GetDouble()).ToArray();
        Assert.True(relaxations.Count(l => Math.Abs(l + 1 / tau) <= 1e-9 / tau) >= 5,
            $"roots at −1/τ = {-1 / tau}: {string.Join(", ", relaxations)}");
        Assert.Equal(7, json.RootElement.GetProperty("modes").GetArrayLength()); // one mode per inertial DOF (6 + 1)
    }

    [Fact]
    public void Harmonic_TheSeriesSpringAndTheDamperOfEachMount_PassOnOneForcePerDirection()
    {
        // Force balance at the massless inner node (identity): the branch spring k2(u_foot − u_inner) on the node equals
        // the damper's iωc(u_inner − u_frame), per direction and frequency.
        using var json = Json("harmonic", "harmonic.schema.json");
        var forces = json.RootElement.GetProperty("mount_forces").EnumerateArray().ToArray();
        double[] Magnitude(string element, string direction) => [.. forces
            .Single(f => f.GetProperty("element").GetString() == element && f.GetProperty("direction").GetString() == direction)
            .GetProperty("magnitude").EnumerateArray().Select(v => v.GetDouble())];
        foreach (var mount in new[] { "fan-1", "fan-4" })
            foreach (var d in new[] { "x", "y", "z" })
            {
                var spring = Magnitude($"{mount}~series", d);
                var damper = Magnitude($"{mount}~damper", d);
                var largest = spring.Max();
                Assert.True(largest > 0, $"{mount} {d} carries force");
                for (var i = 0; i < spring.Length; i++)
                    Assert.True(Math.Abs(spring[i] - damper[i]) <= 1e-9 * largest, $"{mount} {d} point {i}: {spring[i]} against {damper[i]}");
            }
    }

    [Fact]
    public void Transient_IntegratesTheFirstOrderForm_AndTheBranchForcesBalanceAtEveryStep()
    {
        // Identity of the first-order row at the inner node: c·(v_inner − v_frame) = k2·(u_foot − u_inner) at every step.
        using var json = Json("transient", "transient.schema.json");
        Assert.Contains("first-order form", json.RootElement.GetProperty("method_description").GetString(), StringComparison.Ordinal);
        var forces = json.RootElement.GetProperty("mount_forces").EnumerateArray().ToArray();
        double[] Values(string element, string direction) => [.. forces
            .Single(f => f.GetProperty("element").GetString() == element && f.GetProperty("direction").GetString() == direction)
            .GetProperty("values").EnumerateArray().Select(v => v.GetDouble())];
        var spring = Values("fan-2~series", "y");
        var damper = Values("fan-2~damper", "y");
        var largest = spring.Max(Math.Abs);
        Assert.True(largest > 0, "the knock reaches the mount");
        for (var i = 0; i < spring.Length; i++)
            Assert.True(Math.Abs(spring[i] - damper[i]) <= 1e-8 * largest, $"step {i}: {spring[i]} against {damper[i]}");
        // The knock's energy is ½ m v² = ½ · 420 kg · (20 mm/s)² = 0.084 J (closed form); the balance E₀ + W = T + V + D over
        // every DOF, the massless ones included, closes (common practice: the library warns at 1 %).
        var energy = json.RootElement.GetProperty("energy");
        Assert.True(Math.Abs(energy.GetProperty("initial_j").GetDouble() - 0.5 * 420 * 0.02 * 0.02) <= 1e-12, energy.ToString());
        Assert.True(energy.GetProperty("max_relative_error").GetDouble() < 5e-3, energy.ToString());
    }
}
