using System.Globalization;
using System.Text.Json;
using ModalChain.TestSupport;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests;

/// <summary>
/// Under a decimal-comma culture (de-DE) every numeric option reads '30.5' as thirty and a half, and every output on
/// stdout is byte-identical to the one under the invariant culture.
/// </summary>
public class CommandLineCultureTests
{
    private static readonly string Chiller = ModelPath("chiller-deck.yaml");
    private static readonly string Startup = ModelPath("fan-platform-startup.yaml");
    private static readonly string Mezzanine = ModelPath("mezzanine-fan-absorber-check.yaml");

    /// <summary>Runs in-process under <paramref name="culture"/>, writing to writers of that culture, as a console would.</summary>
    private static CliOutcome RunUnder(string culture, params string[] args)
    {
        using var scope = new CultureScope(culture);
        using var stdout = new StringWriter(CultureInfo.CurrentCulture);
        using var stderr = new StringWriter(CultureInfo.CurrentCulture);
        var code = CliApp.Run(args, stdout, stderr);
        return new CliOutcome(code, stdout.ToString(), stderr.ToString());
    }

    private static JsonElement Json(CliOutcome o)
    {
        Assert.True(o.ExitCode == 0, o.ToString());
        return JsonDocument.Parse(o.Stdout).RootElement;
    }

    [Fact]
    public void Harmonic_FromAndTo_AreReadWithADecimalPoint()
    {
        // The reported bug: under de-DE '--to 30.5' swept to 305 Hz and exited 0.
        var f = Json(RunUnder("de-DE", "harmonic", Chiller, "--from", "10.5", "--to", "30.5", "--points", "3", "--format", "json"))
            .GetProperty("frequencies_hz").EnumerateArray().Select(e => e.GetDouble()).ToArray();
        NumericAssert.Close(10.5, f[0], Tolerance.Rel(1e-15), "--from 10.5");
        NumericAssert.Close(30.5, f[^1], Tolerance.Rel(1e-15), "--to 30.5");
    }

    [Fact]
    public void Harmonic_ADecimalComma_IsRefused_NotReadAsThousands()
    {
        var o = RunUnder("de-DE", "harmonic", Chiller, "--to", "30,5");
        Assert.Equal(ExitCodes.InputError, o.ExitCode);
        Assert.Contains("--to '30,5'", o.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Transient_StepAndDuration_AreReadWithADecimalPoint()
    {
        var json = Json(RunUnder("de-DE", "transient", Startup, "--step", "0.5 ms", "--duration", "0.0125", "--format", "json"));
        NumericAssert.Close(0.5e-3, json.GetProperty("step_s").GetDouble(), Tolerance.Rel(1e-15), "--step 0.5 ms");
        NumericAssert.Close(0.0125, json.GetProperty("duration_s").GetDouble(), Tolerance.Rel(1e-15), "--duration 0.0125");
    }

    [Fact]
    public void Tune_SpeedAndMassRatio_AreReadWithADecimalPoint()
    {
        var json = Json(RunUnder("de-DE", "tune", Mezzanine, "--host", "deck", "--mass-ratio", "0.025", "--speed", "24.5", "--format", "json"));
        NumericAssert.Close(0.025, json.GetProperty("mass_ratio").GetDouble(), Tolerance.Rel(1e-15), "--mass-ratio 0.025");
        Assert.Contains("24.5 Hz", json.GetProperty("mode_chosen_by").GetString(), StringComparison.Ordinal);
        var percent = Json(RunUnder("de-DE", "tune", Mezzanine, "--host", "deck", "--mass-ratio", "2.5 %", "--mode", "2", "--format", "json"));
        NumericAssert.Close(0.025, percent.GetProperty("mass_ratio").GetDouble(), Tolerance.Rel(1e-15), "--mass-ratio 2.5 %");
    }

    [Fact]
    public void Study_FromToAndOrders_AreReadWithADecimalPoint()
    {
        var values = Json(RunUnder("de-DE", "study", Mezzanine, "--vary", "masses.deck.mass", "--from", "2.5 t", "--to", "2750.5", "--steps", "2", "--format", "json"))
            .GetProperty("values").EnumerateArray().Select(e => e.GetDouble()).ToArray();
        NumericAssert.Close(2500, values[0], Tolerance.Rel(1e-15), "--from 2.5 t");
        NumericAssert.Close(2750.5, values[^1], Tolerance.Rel(1e-15), "--to 2750.5");
        var chart = Json(RunUnder("de-DE", "study", Mezzanine, "--vary", "speed", "--from", "0.5", "--to", "1500.5 rpm", "--steps", "2", "--orders", "1.5,2", "--format", "json"));
        Assert.Equal([1.5, 2], chart.GetProperty("order_lines").EnumerateArray().Select(e => e.GetProperty("order").GetDouble()).ToArray());
        var speeds = chart.GetProperty("speeds_hz").EnumerateArray().Select(e => e.GetDouble()).ToArray();
        NumericAssert.Close(0.5, speeds[0], Tolerance.Rel(1e-15), "--from 0.5 (Hz)");
        NumericAssert.Close(1500.5 / 60, speeds[^1], Tolerance.Rel(1e-15), "--to 1500.5 rpm");
    }

    [Fact]
    public void Counts_AreReadTheSameUnderEveryCulture()
    {
        Assert.Equal(2, Json(RunUnder("de-DE", "modes", Chiller, "--count", "2", "--format", "json")).GetProperty("modes").GetArrayLength());
        var o = RunUnder("de-DE", "harmonic", Chiller, "--points", "1.000");
        Assert.Equal(ExitCodes.InputError, o.ExitCode); // never read as one thousand
    }

    [Fact]
    public void Report_ModesAndMassRatio_AreReadWithADecimalPoint()
    {
        var dir = Path.Combine(Path.GetTempPath(), "modalchain-culture-" + Guid.NewGuid().ToString("N"));
        try
        {
            var o = RunUnder("de-DE", "report", Mezzanine, "-o", dir, "--modes", "1", "--absorber-host", "deck", "--mass-ratio", "0.025", "--absorber-mode", "2");
            Assert.True(o.ExitCode == 0, o.ToString());
            var results = File.ReadAllText(Path.Combine(dir, "results.json"));
            Assert.Contains("\"mass_ratio\": 0.025", results, StringComparison.Ordinal);
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }

    public static TheoryData<string[]> Outputs()
    {
        var data = new TheoryData<string[]>();
        foreach (var format in new[] { "table", "json", "csv" })
        {
            data.Add(["modes", Chiller, "--format", format]);
            data.Add(["harmonic", Chiller, "--from", "10.5", "--to", "30.5", "--points", "7", "--format", format]);
            data.Add(["transient", Startup, "--step", "1 ms", "--duration", "0.05", "--format", format]);
            data.Add(["study", Mezzanine, "--vary", "springs.beams.stiffness", "--from", "40.5 kN/mm", "--to", "140 kN/mm", "--steps", "3", "--format", format]);
            data.Add(["study", Mezzanine, "--vary", "speed", "--from", "0", "--to", "3000 rpm", "--steps", "5", "--format", format]);
        }
        foreach (var format in new[] { "table", "json" })
        {
            data.Add(["check", Mezzanine, "--format", format]);
            data.Add(["tune", Mezzanine, "--host", "deck", "--mass-ratio", "5 %", "--format", format]);
        }
        data.Add(["validate", Mezzanine]);
        data.Add(["harmonic", "--help"]);
        return data;
    }

    [Theory]
    [MemberData(nameof(Outputs))]
    public void Stdout_IsByteIdenticalUnderDeDeAndTheInvariantCulture(string[] args)
    {
        var invariant = RunUnder("", args);
        var german = RunUnder("de-DE", args);
        Assert.True(invariant.ExitCode is 0 or 1, invariant.ToString());
        Assert.Equal(invariant.ExitCode, german.ExitCode);
        Assert.Equal(invariant.Stdout, german.Stdout);
    }
}
