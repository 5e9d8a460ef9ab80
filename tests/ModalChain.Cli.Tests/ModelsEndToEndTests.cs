using System.Globalization;
using System.Text.Json;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Io.Model;
using ModalChain.TestSupport;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests;

/// <summary>Every mechanical model in models/ goes through the program end to end: validate, modes as table, JSON and CSV (circuit models: CircuitModelsEndToEndTests).</summary>
public class ModelsEndToEndTests
{
    private static Network Network(string model)
    {
        var r = ModelReader.ReadFile(ModelPath(model));
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
        return r.Model!.Network;
    }

    private static bool Grounded(Network n) => Topology.UnsupportedGroups(n).IsEmpty;

    [Fact]
    public void ThereAreAtLeastThreeExampleModels()
    {
        Assert.True(ModelNames().Length >= 3, "issue 2 asks for at least three example models");
    }

    [Theory]
    [MemberData(nameof(CliRun.MechanicalModels), MemberType = typeof(CliRun))]
    public void Validate_Succeeds(string model)
    {
        var path = ModelPath(model);
        var o = Run("validate", path);
        Assert.True(o.ExitCode == 0, o.ToString());
        Assert.StartsWith($"{path}: valid", o.Stdout, StringComparison.Ordinal);
        var n = Network(model);
        Assert.Contains(string.Create(CultureInfo.InvariantCulture, $"degrees of freedom:  {DofMap.For(n).Count}"), o.Stdout, StringComparison.Ordinal);
        Assert.Contains("sha256:", o.Stdout, StringComparison.Ordinal);
        Assert.DoesNotContain("error", o.Stderr, StringComparison.Ordinal);
    }

    [Theory]
    [MemberData(nameof(CliRun.MechanicalModels), MemberType = typeof(CliRun))]
    public void ModesTable_HasARowPerMode_AscendingInFrequency_AndTheCaution(string model)
    {
        var o = Run("modes", ModelPath(model));
        Assert.True(o.ExitCode == 0, o.ToString());
        var n = Network(model);
        var lines = o.Stdout.Split('\n').Select(l => l.TrimEnd('\r')).ToList();
        Assert.Equal(n.Title, lines[0]);
        var header = lines.FindIndex(l => l.StartsWith("mode ", StringComparison.Ordinal));
        Assert.True(header > 0, o.Stdout);
        Assert.StartsWith("----", lines[header + 1], StringComparison.Ordinal);
        var rows = lines.Skip(header + 2).TakeWhile(l => l.Length > 0).ToList();
        Assert.Equal(ModeCount(n), rows.Count);
        var frequencies = new List<double>();
        for (var i = 0; i < rows.Count; i++)
        {
            var cells = rows[i].Split(' ', StringSplitOptions.RemoveEmptyEntries);
            Assert.Equal((i + 1).ToString(CultureInfo.InvariantCulture), cells[0]);
            frequencies.Add(double.Parse(cells[1], CultureInfo.InvariantCulture));
        }
        Assert.Equal(frequencies.Order().ToList(), frequencies);
        Assert.Contains("Quality: max residual", o.Stdout, StringComparison.Ordinal);
        Assert.Contains("licensed engineer", Unwrapped(o.Stdout), StringComparison.Ordinal);
    }

    [Theory]
    [MemberData(nameof(CliRun.MechanicalModels), MemberType = typeof(CliRun))]
    public void ModesJson_IsOneObject_WithModesAscending_AndEffectiveMassesSummingToTheTotal(string model)
    {
        var o = Run("modes", ModelPath(model), "--format", "json");
        Assert.True(o.ExitCode == 0, o.ToString());
        // JsonDocument.Parse rejects anything after the first value, so this proves "exactly one object".
        using var json = JsonDocument.Parse(o.Stdout);
        var root = json.RootElement;
        Assert.Equal(JsonValueKind.Object, root.ValueKind);

        var n = Network(model);
        Assert.Equal(n.Title, root.GetProperty("title").GetString());
        var dofs = root.GetProperty("dofs").EnumerateArray().Select(d => d.GetString()!).ToArray();
        // One label per DOF: the mass name in a line model, name.z where a plane or 3d node has several DOFs.
        var map = DofMap.For(n);
        Assert.Equal(Enumerable.Range(0, map.Count).Select(map.Label).ToArray(), dofs);
        var total = root.GetProperty("total_mass_kg").GetDouble();
        NumericAssert.Close(n.TotalMass, total, Tolerance.Rel(1e-14), "total mass");

        var modes = root.GetProperty("modes").EnumerateArray().ToArray();
        Assert.Equal(ModeCount(n), modes.Length);
        // A transducer model's shapes also give each electrical node its constraint eliminates, in the order of the nodes.
        var shapeKeys = n.Transducers.IsEmpty ? dofs : [.. n.Masses.Select(m => m.Name)];
        var previous = -1.0;
        var fractionSum = 0.0;
        var massSum = 0.0;
        for (var i = 0; i < modes.Length; i++)
        {
            var m = modes[i];
            Assert.Equal(i + 1, m.GetProperty("number").GetInt32());
            var f = m.GetProperty("frequency_hz").GetDouble();
            Assert.True(f >= previous, $"mode {i + 1} at {f} Hz is below mode {i} at {previous} Hz");
            previous = f;
            Assert.Equal(shapeKeys, m.GetProperty("shape").EnumerateObject().Select(p => p.Name).ToArray());
            NumericAssert.Close(2 * Math.PI * f, m.GetProperty("omega_rad_s").GetDouble(), Tolerance.Rel(1e-14), $"ω = 2πf, mode {i + 1}");
            if (f > 0) NumericAssert.Close(1 / f, m.GetProperty("period_s").GetDouble(), Tolerance.Rel(1e-14), $"T = 1/f, mode {i + 1}");
            fractionSum += m.GetProperty("effective_mass_fraction").GetDouble();
            massSum += m.GetProperty("effective_mass_kg").GetDouble();
        }
        // Σ M*_n = total mass for a translation of every mass (REFERENCES.md §7; common practice).
        if (Grounded(n))
        {
            NumericAssert.Close(1, fractionSum, Tolerance.Abs(1e-9), "Σ effective-mass fractions");
            NumericAssert.Close(total, massSum, Tolerance.Rel(1e-9), "Σ effective masses");
        }
        NumericAssert.Small(root.GetProperty("quality").GetProperty("max_residual").GetDouble(), 1e-10, "max residual");
        NumericAssert.Small(root.GetProperty("quality").GetProperty("max_orthogonality_error").GetDouble(), 1e-10, "max orthogonality error");
    }

    [Theory]
    [MemberData(nameof(CliRun.MechanicalModels), MemberType = typeof(CliRun))]
    public void ModesCsv_ParsesWithOneRowPerMode(string model)
    {
        var o = Run("modes", ModelPath(model), "--format", "csv");
        Assert.True(o.ExitCode == 0, o.ToString());
        var n = Network(model);
        var lines = o.Stdout.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        var header = lines[0].Split(',');
        Assert.Equal("frequency [Hz]", header[1]);
        Assert.Equal(ModeCount(n) + 1, lines.Length);
        foreach (var row in lines.Skip(1))
        {
            var fields = row.Split(',');
            Assert.Equal(header.Length, fields.Length);
            foreach (var f in fields.Where(f => f.Length > 0))
                Assert.True(double.TryParse(f, NumberStyles.Float, CultureInfo.InvariantCulture, out _), $"'{f}' in '{row}' is not an invariant number");
        }
    }

    [Theory]
    [MemberData(nameof(CliRun.MechanicalModels), MemberType = typeof(CliRun))]
    public void CountOne_LimitsEveryFormatToTheFundamental(string model)
    {
        var path = ModelPath(model);
        var all = JsonDocument.Parse(Run("modes", path, "--format", "json").Stdout).RootElement.GetProperty("modes");
        var json = Run("modes", path, "--format", "json", "--count", "1");
        Assert.Equal(0, json.ExitCode);
        var one = Assert.Single(JsonDocument.Parse(json.Stdout).RootElement.GetProperty("modes").EnumerateArray());
        NumericAssert.Close(all[0].GetProperty("frequency_hz").GetDouble(), one.GetProperty("frequency_hz").GetDouble(), Tolerance.Rel(1e-10), "fundamental");

        var csv = Run("modes", path, "--format", "csv", "--count", "1");
        Assert.Equal(2, csv.Stdout.Split('\n', StringSplitOptions.RemoveEmptyEntries).Length);
        var table = Run("modes", path, "--count", "1");
        Assert.Contains(" 1 mode", table.Stdout, StringComparison.Ordinal);
    }

    [Theory]
    [MemberData(nameof(CliRun.MechanicalModels), MemberType = typeof(CliRun))]
    public void Study_FollowsEveryMode_AndItsFirstValueGivesTheModesOfTheModel(string model)
    {
        // Line, plane and 3d models alike: vary the first spring with a stiffness (its scale in space, every direction
        // in proportion) from its own value up 20 %. The first value is the model itself, so its frequencies must be
        // those of 'modes' (identity); every DOF's mode is tracked, and named by its motion exactly in plane and 3d models.
        var n = Network(model);
        var spring = n.Springs.FirstOrDefault(s => s.Stiffness > 0);
        if (spring is null) return; // nothing to vary by this rule
        string F(double v) => v.ToString("R", CultureInfo.InvariantCulture);
        var o = Run("study", ModelPath(model), "--vary", $"springs.{spring.Name}.stiffness", "--from", F(spring.Stiffness), "--to", F(1.2 * spring.Stiffness),
            "--steps", "3", "--format", "json");
        Assert.True(o.ExitCode is 0 or 1, o.ToString());
        using var json = JsonDocument.Parse(o.Stdout);
        var tracked = json.RootElement.GetProperty("modes").EnumerateArray().ToArray();
        Assert.Equal(ModeCount(n), tracked.Length);
        using var modes = JsonDocument.Parse(Run("modes", ModelPath(model), "--format", "json").Stdout);
        var expected = modes.RootElement.GetProperty("modes").EnumerateArray().Select(m => m.GetProperty("frequency_hz").GetDouble()).ToArray();
        var first = tracked.Select(m => m.GetProperty("frequency_hz")[0].GetDouble()).ToArray();
        NumericAssert.Close(expected, first, Tolerance.Rel(1e-12), "the study's first value against modes");
        Assert.All(tracked, m => Assert.Equal(n.Space != ModelSpace.Line, m.TryGetProperty("motion", out _)));
    }

    /// <summary>
    /// How many undamped modes a model has: one per DOF, less its massless nodes, which the undamped modes condense
    /// out (docs/methods.md, "Massless nodes and mounts"; a massless node is one DOF of a line model).
    /// </summary>
    // A transducer's eliminated electrical node is no DOF to begin with (ConstraintElimination), so only the massless nodes
    // that remain DOFs are condensed out.
    private static int ModeCount(Network n) =>
        DofMap.For(n).Count - n.Masses.Count(m => m.Kilograms == 0 && !ModalChain.Core.Assembly.ConstraintElimination.IsEliminated(n, m.Name));
}
