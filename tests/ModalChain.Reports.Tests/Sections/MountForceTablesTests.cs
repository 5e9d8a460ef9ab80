using System.Globalization;
using System.Numerics;
using System.Text.Json;
using ModalChain.Reports.Pdf;
using ModalChain.Reports.Sections;
using ModalChain.Reports.Units;
using ModalChain.TestSupport;

namespace ModalChain.Reports.Tests.Sections;

/// <summary>The mount-force tables of plane and 3d models: the numbers of results.json (what the CLI's JSON writes) in the
/// display units, and in equilibrium with the support reactions.</summary>
public sealed class MountForceTablesTests
{
    private static readonly DateTimeOffset Date = new(2026, 12, 1, 12, 0, 0, TimeSpan.Zero);
    private const string Skid = "models/compressor-skid-deck.yaml";
    private const string Cabinet = "models/instrument-cabinet-sway.yaml";

    // 1 lbf = 4.4482216152605 N and 1 in = 0.0254 m exactly (NIST SP 811, appendix B).
    private const double PoundForce = 4.4482216152605;
    private const double Inch = 0.0254;

    private static Report Build(string model, UnitSystem units = UnitSystem.Si) =>
        ReportBuilder.Build(Repository.Load(model), new ReportOptions("test", Date, units));

    private static TableBlock Table(Report report, string section, string caption) =>
        report.Document!.Sections.Single(s => s.Key == section).Blocks.OfType<TableBlock>().Single(t => t.Caption == caption);

    private static double Number(string cell) => double.Parse(cell, CultureInfo.InvariantCulture);

    /// <summary>Display value → SI for a row's unit (N or N·m; lbf or lbf·in).</summary>
    private static double Si(string cell, string unit) => Number(cell) * unit switch
    {
        "N" => 1,
        "N·m" => 1,
        "lbf" => PoundForce,
        "lbf·in" => PoundForce * Inch,
        _ => throw new Xunit.Sdk.XunitException($"unexpected unit '{unit}'"),
    };

    /// <summary>A printed value (4 significant digits, or 0 for rounding noise) equals the JSON's SI value (identity).</summary>
    private static void AssertPrinted(double expectedSi, string cell, string unit, double largestSi, string what)
    {
        if (cell == "0")
        {
            Assert.True(Math.Abs(expectedSi) < MountForceTables.NoiseFraction * largestSi, $"{what}: printed 0 but is {expectedSi}");
            return;
        }
        NumericAssert.Close(expectedSi, Si(cell, unit), Tolerance.Rel(6e-4), what); // four significant digits
    }

    [Theory]
    [InlineData(Skid, UnitSystem.Si)]
    [InlineData(Skid, UnitSystem.Imperial)]
    [InlineData(Cabinet, UnitSystem.Si)]
    [InlineData(Cabinet, UnitSystem.Imperial)]
    public void HarmonicTable_ShowsEveryMountAndDirection_WithTheJsonPeaksAndOperatingPointAmplitudes(string model, UnitSystem units)
    {
        var report = Build(model, units);
        var table = Table(report, "harmonic", MountForceTables.HarmonicCaption);
        using var json = JsonDocument.Parse(report.Json.ToArray());
        var harmonic = json.RootElement.GetProperty("harmonic");
        var mounts = harmonic.GetProperty("mount_forces").EnumerateArray().ToArray();
        var points = harmonic.GetProperty("operating_points").EnumerateArray().ToArray();
        Assert.NotEmpty(points);
        Assert.Equal(5 + points.Length, table.Headers.Length);
        Assert.Contains("peak", table.Headers[3], StringComparison.Ordinal);
        Assert.Equal(mounts.Length, table.Rows.Length);
        var largest = mounts.Max(m => m.GetProperty("peak_magnitude").GetDouble());
        for (var i = 0; i < mounts.Length; i++)
        {
            var m = mounts[i];
            var row = table.Rows[i];
            var what = $"{model} {units}: {row[0]} {row[1]}";
            Assert.Equal($"{m.GetProperty("kind").GetString()} {m.GetProperty("element").GetString()}", row[0]);
            Assert.Equal(m.GetProperty("direction").GetString(), row[1]);
            var moment = m.GetProperty("unit").GetString() == "N*m";
            Assert.Equal(units == UnitSystem.Si ? (moment ? "N·m" : "N") : (moment ? "lbf·in" : "lbf"), row[2]);
            AssertPrinted(m.GetProperty("peak_magnitude").GetDouble(), row[3], row[2], largest, what + " peak");
            if (row[3] == "0") Assert.Equal("—", row[4]); // no frequency for rounding noise
            else NumericAssert.Close(m.GetProperty("peak_frequency_hz").GetDouble(), Number(row[4]), Tolerance.Rel(6e-4), what + " at Hz");
            for (var p = 0; p < points.Length; p++)
            {
                var at = points[p].GetProperty("mount_forces").EnumerateArray()
                    .Single(o => o.GetProperty("element").GetString() == m.GetProperty("element").GetString()
                        && o.GetProperty("kind").GetString() == m.GetProperty("kind").GetString()
                        && o.GetProperty("direction").GetString() == m.GetProperty("direction").GetString());
                AssertPrinted(at.GetProperty("magnitude").GetDouble(), row[5 + p], row[2], largest, what + $" at {points[p].GetProperty("speed_rpm").GetDouble()} rpm");
            }
        }
        // Peak, not r.m.s., is what the note and headers state (a mount is selected on these numbers).
        var html = report.Html;
        Assert.Contains("compare peak with peak", html, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(UnitSystem.Si)]
    [InlineData(UnitSystem.Imperial)]
    public void TransientTable_OfTheSkid_ShowsTheJsonPeakAndRms_AndTheGeneralTableNoLongerRepeatsThem(UnitSystem units)
    {
        var report = Build(Skid, units);
        var table = Table(report, "transient", MountForceTables.TransientCaption);
        using var json = JsonDocument.Parse(report.Json.ToArray());
        var mounts = json.RootElement.GetProperty("transient").GetProperty("mount_forces").EnumerateArray().ToArray();
        Assert.Equal(["Spring or damper", "Direction", "Unit", "Peak (largest magnitude, signed)", "at (s)", "r.m.s."], table.Headers.ToArray());
        Assert.Equal(mounts.Length, table.Rows.Length);
        Assert.Equal(5 * 3 - 2, mounts.Length); // deck-beams in z; four mounts in x, y, z
        var largest = mounts.Max(m => m.GetProperty("peak_abs").GetDouble());
        for (var i = 0; i < mounts.Length; i++)
        {
            var m = mounts[i];
            var row = table.Rows[i];
            var what = $"{units}: {row[0]} {row[1]}";
            Assert.Equal($"{m.GetProperty("kind").GetString()} {m.GetProperty("element").GetString()}", row[0]);
            Assert.Equal(m.GetProperty("direction").GetString(), row[1]);
            AssertPrinted(m.GetProperty("peak_value").GetDouble(), row[3], row[2], largest, what + " peak");
            if (row[3] == "0") Assert.Equal("—", row[4]);
            else NumericAssert.Close(m.GetProperty("peak_time_s").GetDouble(), Number(row[4]), Tolerance.Abs(1e-3), what + " time");
            AssertPrinted(m.GetProperty("rms").GetDouble(), row[5], row[2], largest, what + " rms");
        }
        var general = Table(report, "transient", "Peaks and RMS of each recorded response");
        Assert.DoesNotContain(general.Rows, r => r[0].StartsWith("mount-", StringComparison.Ordinal) || r[0] == "deck-beams");
    }

    [Fact]
    public void CabinetAtItsOperatingPoint_MountForcesIntoEachSupport_SumToItsReaction()
    {
        // Identity (equilibrium of each support): the force a support receives is the sum of the forces the elements
        // ending on it pass to it, direction by direction. The cabinet's damping is a discrete damper only, so no modal
        // damping force reaches the supports outside the elements.
        var report = Build(Cabinet);
        using var json = JsonDocument.Parse(report.Json.ToArray());
        var point = json.RootElement.GetProperty("harmonic").GetProperty("operating_points")[0];
        static Complex Phasor(JsonElement e) => Complex.FromPolarCoordinates(e.GetProperty("magnitude").GetDouble(), e.GetProperty("phase_deg").GetDouble() * Math.PI / 180);
        var mounts = point.GetProperty("mount_forces").EnumerateArray().ToArray();
        Complex Sum(string[] elements, string direction) => mounts
            .Where(m => elements.Contains(m.GetProperty("element").GetString()) && m.GetProperty("direction").GetString() == direction)
            .Aggregate(Complex.Zero, (s, m) => s + Phasor(m));
        Complex Reaction(string support) => Phasor(point.GetProperty("reactions").EnumerateArray().Single(r => r.GetProperty("support").GetString() == support));
        string[] onFloor = ["pads-front", "pads-back", "pad-loss"];
        foreach (var direction in new[] { "x", "z" })
        {
            var reaction = Reaction("floor." + direction);
            Assert.True(reaction.Magnitude > 0, $"floor.{direction} carries load");
            NumericAssert.Close(0, (Sum(onFloor, direction) - reaction).Magnitude, Tolerance.Abs(1e-9 * reaction.Magnitude), $"floor.{direction}: Σ mount forces − reaction");
        }
        var wall = Reaction("wall.x");
        NumericAssert.Close(0, (Sum(["restraint"], "x") - wall).Magnitude, Tolerance.Abs(1e-9 * wall.Magnitude), "wall.x: restraint − reaction");
    }
}
