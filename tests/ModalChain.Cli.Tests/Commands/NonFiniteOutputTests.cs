using System.Text.RegularExpressions;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests.Commands;

/// <summary>No table or JSON prints inf, Infinity, ∞ or NaN: a reserve with no finite value is explained in words, and is null in JSON with a reason.</summary>
public partial class NonFiniteOutputTests
{
    // One mass that nothing holds: its only mode is a rigid-body mode at 0 Hz, so no natural frequency can be in a band.
    private const string Free = "title: Free crate\nmasses: {crate: 10 kg}\ncriteria:\n  separation: {speeds: 1480 rpm}\n";

    [GeneratedRegex(@"(?i:\binf(inity)?\b)|∞|\bNaN\b")]
    private static partial Regex NonFinite();

    [Fact]
    public void Check_Table_SaysThereIsNoModeInRange_InsteadOfInfinity()
    {
        using var model = new TempModel(Free);
        var o = Run("check", model.Path);
        Assert.True(o.ExitCode == 0, o.ToString());
        Assert.DoesNotMatch(NonFinite(), o.Stdout);
        Assert.Contains("n/a: rigid-body mode (0 Hz), in no band", o.Stdout, StringComparison.Ordinal);
        Assert.Contains("passes; reserve n/a: no mode in range", o.Stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_Json_WritesNullWithAReason()
    {
        using var model = new TempModel(Free);
        var o = Run("check", model.Path, "--format", "json");
        Assert.True(o.ExitCode == 0, o.ToString());
        Assert.DoesNotMatch(NonFinite(), o.Stdout);
        using var json = System.Text.Json.JsonDocument.Parse(o.Stdout);
        var sep = json.RootElement.GetProperty("separation");
        Assert.Equal(System.Text.Json.JsonValueKind.Null, sep.GetProperty("reserve").ValueKind);
        Assert.Contains("no mode in range", sep.GetProperty("reserve_note").GetString(), StringComparison.Ordinal);
        var pair = sep.GetProperty("pairs")[0];
        Assert.Equal(System.Text.Json.JsonValueKind.Null, pair.GetProperty("reserve").ValueKind);
        Assert.Contains("rigid-body mode", pair.GetProperty("reserve_note").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Check_Json_HasNoReserveNote_WhereTheReserveIsANumber()
    {
        var o = Run("check", ModelPath("mezzanine-fan-absorber-check.yaml"), "--format", "json");
        Assert.DoesNotContain("reserve_note", o.Stdout, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("table")]
    [InlineData("json")]
    [InlineData("csv")]
    public void Study_OfAModelWithOnlyRigidBodyModes_PrintsNoNonFiniteNumber(string format)
    {
        using var model = new TempModel(Free);
        var o = Run("study", model.Path, "--vary", "masses.crate.mass", "--from", "1 kg", "--to", "2 kg", "--steps", "2", "--format", format);
        Assert.True(o.ExitCode == 0, o.ToString());
        Assert.DoesNotMatch(NonFinite(), o.Stdout);
        if (format != "csv") Assert.Contains("no mode in range", o.Stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void Report_OfAModelWithOnlyRigidBodyModes_ExplainsTheReserve()
    {
        using var model = new TempModel(Free);
        var dir = Path.Combine(Path.GetTempPath(), "modalchain-nonfinite-" + Guid.NewGuid().ToString("N"));
        try
        {
            var o = Run("report", model.Path, "-o", dir);
            Assert.True(o.ExitCode == 0, o.ToString());
            var html = File.ReadAllText(Path.Combine(dir, "report.html"));
            Assert.DoesNotContain("∞", html, StringComparison.Ordinal);
            Assert.Contains("n/a: rigid-body mode (0 Hz), in no band", html, StringComparison.Ordinal);
            Assert.DoesNotMatch(NonFinite(), File.ReadAllText(Path.Combine(dir, "results.json")));
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void Tune_OnAnUndampedModel_SaysThePeakBeforeIsUnbounded()
    {
        // No damping anywhere: the host's response at the controlled resonance grows without bound before the absorber.
        using var model = new TempModel(
            "masses: {deck: 2600 kg, fan: 400 kg}\nsprings:\n  beams: {between: [ground, deck], stiffness: 68 kN/mm}\n" +
            "  mounts: {between: [deck, fan], stiffness: 1.6 kN/mm}\n");
        var table = Run("tune", model.Path, "--host", "deck", "--mass-ratio", "5 %", "--mode", "2");
        Assert.True(table.ExitCode == 0, table.ToString());
        Assert.DoesNotMatch(NonFinite(), table.Stdout);
        Assert.Contains("peak before           unbounded (no damping acts on that resonance)", table.Stdout, StringComparison.Ordinal);
        var json = Run("tune", model.Path, "--host", "deck", "--mass-ratio", "5 %", "--mode", "2", "--format", "json");
        using var doc = System.Text.Json.JsonDocument.Parse(json.Stdout);
        Assert.Equal(System.Text.Json.JsonValueKind.Null, doc.RootElement.GetProperty("peak_before").ValueKind);
        Assert.Equal("unbounded: no damping acts on that resonance", doc.RootElement.GetProperty("peak_before_note").GetString());
        Assert.False(doc.RootElement.TryGetProperty("peak_after_note", out _)); // the absorber's damper bounds the peak after
    }

    public static TheoryData<string, string> EveryModelAndFormat()
    {
        var data = new TheoryData<string, string>();
        foreach (var model in ModelNames())
            foreach (var command in new[] { "modes", "check", "harmonic", "transient" })
                foreach (var format in command == "check" ? new[] { "table", "json" } : ["table", "json", "csv"])
                    data.Add(model, command + " " + format);
        return data;
    }

    [Theory]
    [MemberData(nameof(EveryModelAndFormat))]
    public void ExampleModels_PrintNoNonFiniteNumber(string model, string commandAndFormat)
    {
        var (command, format) = (commandAndFormat.Split(' ')[0], commandAndFormat.Split(' ')[1]);
        var o = Run(command, ModelPath(model), "--format", format);
        if (o.ExitCode == ExitCodes.InputError) return; // the model lacks what the command needs (no loads, no criteria)
        Assert.True(o.ExitCode is 0 or 1, o.ToString());
        Assert.DoesNotMatch(NonFinite(), o.Stdout);
    }
}
