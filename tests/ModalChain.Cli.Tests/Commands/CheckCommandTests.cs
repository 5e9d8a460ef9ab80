using ModalChain.TestSupport;

namespace ModalChain.Cli.Tests.Commands;

public class CheckCommandTests
{
    [Fact]
    public void PassingModel_ExitsZeroAndPrintsItsReserve()
    {
        // beams 150 kN/mm: deck mode about 38 Hz, clear of 24.5 and 49 Hz by more than 20 %.
        var run = CommandRun.Of("check", CommandRun.Deck("150 kN/mm"));
        Assert.Equal(0, run.ExitCode);
        Assert.Contains("all criteria pass", run.Output);
        Assert.Contains("reserve [%]", run.Output);
        Assert.Contains("Caution:", run.Output);
    }

    [Fact]
    public void FailingModel_ExitsOne()
    {
        var run = CommandRun.Of("check", CommandRun.Deck("68 kN/mm"));
        Assert.Equal(1, run.ExitCode);
        Assert.Contains("FAIL", run.Output);
    }

    [Fact]
    public void Json_IsOneObjectWithPairsAndReserves()
    {
        var run = CommandRun.Of("check", CommandRun.Deck("68 kN/mm"), "--format", "json");
        Assert.Equal(1, run.ExitCode);
        var json = run.Json();
        Assert.False(json.GetProperty("passes").GetBoolean());
        var sep = json.GetProperty("separation");
        Assert.Equal(2 * 2, sep.GetProperty("pairs").GetArrayLength()); // 2 modes × 1 speed × 2 orders
        NumericAssert.Close(0.2, sep.GetProperty("margin").GetDouble(), Tolerance.Rel(1e-15));
        Assert.True(sep.GetProperty("reserve").GetDouble() < 0);
        Assert.Contains("licensed engineer", json.GetProperty("caution").GetString());
    }

    [Fact]
    public void ModelWithoutCriteria_ExitsTwo()
    {
        var path = CommandRun.ModelFile("masses:\n  deck: 100 kg\nsprings:\n  s: {between: [ground, deck], stiffness: 1e5}\n");
        var run = CommandRun.Of("check", path);
        Assert.Equal(2, run.ExitCode);
        Assert.Contains("no 'criteria' section", run.Error);
    }

    [Fact]
    public void BadCriteria_ExitTwoWithPositions()
    {
        var path = CommandRun.Deck("68 kN/mm", extra: "  limits:\n    - {at: roof, quantity: velocity, peak: 4 mm/s}");
        var run = CommandRun.Of("check", path);
        Assert.Equal(2, run.ExitCode);
        Assert.Contains($"{path}:11:12: error:", run.Error);
    }

    [Fact]
    public void ExampleModel_FailsItsSeparationCheck_AsItsDocumentationSays()
    {
        // The example's header: "The deck's own mode lands near running speed, so the separation check fails".
        var run = CommandRun.Of("check", Path.Combine(CommandRun.Models(), "mezzanine-fan-absorber-check.yaml"), "--format", "json");
        Assert.Equal(1, run.ExitCode);
        var json = run.Json();
        Assert.Equal("Supply fan on a steel mezzanine", json.GetProperty("title").GetString());
        Assert.False(json.GetProperty("passes").GetBoolean());
        var sep = json.GetProperty("separation");
        Assert.False(sep.GetProperty("passes").GetBoolean());

        // Independent reference: the two undamped natural frequencies of deck (2600 kg on 68 kN/mm) and fan base
        // (420 kg on 1.6 kN/mm) from the closed-form roots of det(K − ω²M) = 0 for two masses in series (Rao,
        // Mechanical Vibrations, §5.3 [from memory]): m1·m2·ω⁴ − (m1·k2 + m2·(k1 + k2))·ω² + k1·k2 = 0.
        double m1 = 2600, m2 = 420, k1 = 68e6, k2 = 1.6e6;
        double a = m1 * m2, b = -(m1 * k2 + m2 * (k1 + k2)), c = k1 * k2;
        var disc = Math.Sqrt(b * b - 4 * a * c);
        var f2 = Math.Sqrt((-b + disc) / (2 * a)) / (2 * Math.PI);

        // The failing criterion: mode 2 (the deck's own mode, near 26.1 Hz) inside the ±20 % band of order 1 at 1470 rpm (24.5 Hz).
        var failing = sep.GetProperty("pairs").EnumerateArray().Where(p => !p.GetProperty("passes").GetBoolean()).ToList();
        var only = Assert.Single(failing);
        Assert.Equal(2, only.GetProperty("mode").GetInt32());
        Assert.Equal(1.0, only.GetProperty("order").GetDouble());
        NumericAssert.Close(24.5, only.GetProperty("excitation_hz").GetDouble(), Tolerance.Rel(1e-14), "1470 rpm");
        NumericAssert.Close(f2, only.GetProperty("frequency_hz").GetDouble(), Tolerance.Rel(1e-9), "f_2, closed form");
        // Reserve inside the band: −min(e₊ − f_n, f_n − e₋)/f_n with e± = (1 ± 0.2)·24.5 Hz (docs/methods.md).
        var expected = -Math.Min(1.2 * 24.5 - f2, f2 - 0.8 * 24.5) / f2;
        NumericAssert.Close(expected, sep.GetProperty("reserve").GetDouble(), Tolerance.Rel(1e-8), "governing reserve");
    }

    [Fact]
    public void LimitsWithoutOperatingPoint_AreNotEvaluated_AndExitOne()
    {
        // A criterion that was not shown to pass does not pass (docs/criteria.md).
        var path = CommandRun.Deck("150 kN/mm", extra: "  limits:\n    - {at: deck, quantity: velocity, peak: 4 mm/s}");
        var run = CommandRun.Of("check", path);
        Assert.Equal(1, run.ExitCode);
        Assert.Contains("NOT EVALUATED", run.Output);
        Assert.Contains("no load with a running speed", run.Output);
    }

    private static string LabFloor => Path.Combine(CommandRun.Models(), "lab-floor-analyser.yaml");

    [Fact]
    public void LabFloorExample_ShowsZonesAndBands_AsRmsVelocity_InTableAndJson()
    {
        var table = CommandRun.Of("check", LabFloor);
        Assert.Equal(0, table.ExitCode);
        Assert.Contains("value [mm/s rms]", table.Output);
        Assert.Contains("value [um/s rms]", table.Output);
        Assert.Contains("Floor curve VC-C at analyser-bench", table.Output);

        var json = CommandRun.Of("check", LabFloor, "--format", "json").Json();
        var zone = Assert.Single(json.GetProperty("machine_zones").EnumerateArray().ToList());
        Assert.Equal("rms", zone.GetProperty("measure").GetString());
        Assert.Equal("pump-skid", zone.GetProperty("at").GetString());
        var floor = Assert.Single(json.GetProperty("floor_curves").EnumerateArray().ToList());
        Assert.Equal("rms", floor.GetProperty("measure").GetString());
        var bands = floor.GetProperty("bands").EnumerateArray().ToList();
        // The fan (1450 rpm = 24.17 Hz) lies in the 25 Hz band and the pump (2960 rpm = 49.33 Hz) in the 50 Hz band
        // (base-10 edges f_c·10^(±1/20), IEC 61260 [common practice]).
        Assert.Equal([25.0, 50.0], bands.Select(b => b.GetProperty("nominal_hz").GetDouble()).ToArray());
        // The curve's reserve is its worst band's.
        NumericAssert.Close(bands.Min(b => b.GetProperty("reserve").GetDouble()), floor.GetProperty("reserve").GetDouble(), Tolerance.Rel(1e-15), "worst band");
    }

    [Fact]
    public void StricterFloorCurve_Fails_AndExitsOne()
    {
        var text = File.ReadAllText(LabFloor).Replace("curve: VC-C", "curve: VC-E", StringComparison.Ordinal);
        var run = CommandRun.Of("check", CommandRun.ModelFile(text));
        Assert.Equal(1, run.ExitCode);
        Assert.Contains("FAIL", run.Output);
    }
}
