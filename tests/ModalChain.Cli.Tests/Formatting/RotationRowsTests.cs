using System.Globalization;
using System.Text.Json;
using ModalChain.TestSupport;

namespace ModalChain.Cli.Tests.Formatting;

/// <summary>
/// Rotations of plane and 3d models are angles: the harmonic and transient tables show them in a table of their own in
/// mrad, never under a length column (they were printed as "mm" before: the radian value × 1000 under a length header).
/// </summary>
public class RotationRowsTests
{
    private static readonly string Cabinet = CliRun.ModelPath("instrument-cabinet-sway.yaml");

    [Theory]
    [InlineData("si")]
    [InlineData("imperial")]
    public void HarmonicPeaks_ShowTheRotationInMilliradians_InBothUnitSystems(string units)
    {
        var table = CliRun.Run("harmonic", Cabinet, "--units", units);
        Assert.True(table.ExitCode == 0, table.ToString());
        var json = CliRun.Run("harmonic", Cabinet, "--format", "json");
        Assert.True(json.ExitCode == 0, json.ToString());
        using var doc = JsonDocument.Parse(json.Stdout);
        var radians = doc.RootElement.GetProperty("peaks").EnumerateArray()
            .Single(p => p.GetProperty("dof").GetString() == "cabinet.ry" && p.GetProperty("quantity").GetString() == "displacement")
            .GetProperty("magnitude").GetDouble();

        var lines = table.Stdout.Split('\n');
        var header = Array.FindIndex(lines, l => l.Contains("rotation [mrad peak]", StringComparison.Ordinal));
        Assert.True(header > 0, table.Stdout);
        var lengthHeader = Array.FindIndex(lines, l => l.Contains("displacement [", StringComparison.Ordinal));
        Assert.True(lengthHeader >= 0 && lengthHeader < header, table.Stdout);
        // Not in the length table: the row sits under the rotation header.
        Assert.DoesNotContain(lines[lengthHeader..header], l => l.TrimStart().StartsWith("cabinet.ry", StringComparison.Ordinal));
        var row = lines[header..].First(l => l.TrimStart().StartsWith("cabinet.ry", StringComparison.Ordinal));
        var shown = double.Parse(row.Split(' ', StringSplitOptions.RemoveEmptyEntries)[1], CultureInfo.InvariantCulture);
        // 1 mrad = 1e-3 rad (SI definition); the table prints four significant digits.
        NumericAssert.Close(radians * 1e3, shown, Tolerance.Rel(5e-4), "cabinet.ry peak rotation in mrad");
    }

    [Fact]
    public void TransientPeaks_ShowTheRotationInMilliradians()
    {
        var run = CliRun.Run("transient", Cabinet);
        Assert.True(run.ExitCode == 0, run.ToString());
        var lines = run.Stdout.Split('\n');
        var header = Array.FindIndex(lines, l => l.Contains("rotation [mrad peak]", StringComparison.Ordinal) && l.Contains("angular velocity [mrad/s peak]", StringComparison.Ordinal));
        Assert.True(header > 0, run.Stdout);
        Assert.Contains(lines[header..], l => l.TrimStart().StartsWith("cabinet.ry", StringComparison.Ordinal));
        var lengthHeader = Array.FindIndex(lines, l => l.Contains("displacement [mm peak]", StringComparison.Ordinal));
        Assert.DoesNotContain(lines[lengthHeader..header], l => l.TrimStart().StartsWith("cabinet.ry", StringComparison.Ordinal));
    }

    [Fact]
    public void Json_GivesTheRotationsUnitAsRadians()
    {
        // The JSON is SI: a rotation DOF's motion is in rad, rad/s, rad/s^2 (it said m, m/s, m/s^2 before).
        var harmonic = CliRun.Run("harmonic", Cabinet, "--format", "json");
        Assert.True(harmonic.ExitCode == 0, harmonic.ToString());
        using (var doc = JsonDocument.Parse(harmonic.Stdout))
        {
            var units = doc.RootElement.GetProperty("peaks").EnumerateArray().Where(p => p.GetProperty("dof").GetString() == "cabinet.ry")
                .ToDictionary(p => p.GetProperty("quantity").GetString()!, p => p.GetProperty("unit").GetString());
            Assert.Equal("rad", units["displacement"]);
            Assert.Equal("rad/s", units["velocity"]);
            Assert.Equal("rad/s^2", units["acceleration"]);
            Assert.All(doc.RootElement.GetProperty("peaks").EnumerateArray().Where(p => p.GetProperty("dof").GetString() == "cabinet.x"),
                p => Assert.StartsWith("m", p.GetProperty("unit").GetString(), StringComparison.Ordinal));
        }
        var transient = CliRun.Run("transient", Cabinet, "--format", "json");
        Assert.True(transient.ExitCode == 0, transient.ToString());
        using (var doc = JsonDocument.Parse(transient.Stdout))
        {
            var units = doc.RootElement.GetProperty("responses").EnumerateArray().Where(p => p.GetProperty("dof").GetString() == "cabinet.ry")
                .Select(p => p.GetProperty("unit").GetString()!).ToArray();
            Assert.Equal(["rad", "rad/s", "rad/s^2"], units);
        }
    }

    [Fact]
    public void Report_ShowsRotationsInMilliradians_InTablesAndCharts()
    {
        var dir = Path.Combine(Path.GetTempPath(), "mc-rot-" + Guid.NewGuid().ToString("N"));
        try
        {
            var run = CliRun.Run("report", Cabinet, "-o", dir);
            Assert.True(run.ExitCode == 0, run.ToString());
            var html = File.ReadAllText(Path.Combine(dir, "report.html"));
            Assert.Contains("Largest rotation over the sweep", html, StringComparison.Ordinal);
            Assert.Contains("Rotation (mrad peak)", html, StringComparison.Ordinal);
            Assert.Contains("Rotation amplitude (mrad peak)", html, StringComparison.Ordinal);
            Assert.Contains("Rotation (mrad, instantaneous)", html, StringComparison.Ordinal);
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void LoadCaseCombination_LeavesRotationsOutOfTheLengthTables_AndSaysWhere()
    {
        var text = File.ReadAllText(Cabinet)
            .Replace("harmonic:\n  loads: [floor-shake]\n", "load-cases:\n  shake: [floor-shake]\n  knock-free: [floor-shake]\n\nharmonic:\n  cases: [shake, knock-free]\n  combine: rms\n", StringComparison.Ordinal);
        Assert.Contains("load-cases:", text, StringComparison.Ordinal);
        var path = Path.Combine(Path.GetTempPath(), "mc-rot-cases-" + Guid.NewGuid().ToString("N") + ".yaml");
        try
        {
            File.WriteAllText(path, text);
            var run = CliRun.Run("harmonic", path);
            Assert.True(run.ExitCode == 0, run.ToString());
            var combination = run.Stdout[run.Stdout.IndexOf("Combination of the load cases", StringComparison.Ordinal)..];
            Assert.DoesNotContain(combination.Split('\n'), l => l.TrimStart().StartsWith("cabinet.ry", StringComparison.Ordinal));
            Assert.Contains("Rotations (cabinet.ry) are angles and are left out of these length tables", combination, StringComparison.Ordinal);
            Assert.Contains(combination.Split('\n'), l => l.TrimStart().StartsWith("cabinet.x", StringComparison.Ordinal));
        }
        finally
        {
            File.Delete(path);
        }
    }
}
