using ModalChain.TestSupport;

namespace ModalChain.Cli.Tests.Commands;

public class TuneCommandTests
{
    [Fact]
    public void Json_HasTheIssuedFields_AndDenHartogValues()
    {
        // Den Hartog 1956 §3.3 [confirmed citation]: μ = 5 % → f = 0.952381, ζ_a = 0.133631 (absorber-referenced),
        // 0.127267 (primary-referenced); peak √41 (REFERENCES §3). Tolerance 5e-7 absolute on the printed digits.
        var run = CommandRun.Of("tune", CommandRun.Deck("68 kN/mm"), "--host", "deck", "--mass-ratio", "5 %", "--format", "json");
        Assert.Equal(0, run.ExitCode);
        var json = run.Json();
        Assert.Equal(2, json.GetProperty("mode").GetInt32());
        Assert.Equal("deck", json.GetProperty("host").GetString());
        var modalMass = json.GetProperty("modal_mass_kg").GetDouble();
        var a = json.GetProperty("absorber");
        NumericAssert.Close(0.05 * modalMass, a.GetProperty("mass_kg").GetDouble(), Tolerance.Rel(1e-14), "m_a = μM");
        NumericAssert.Close(0.952381, a.GetProperty("frequency_ratio").GetDouble(), Tolerance.Abs(5e-7), "f");
        NumericAssert.Close(0.133631, a.GetProperty("damping_ratio").GetDouble(), Tolerance.Abs(5e-7), "ζ_a");
        NumericAssert.Close(0.127267, a.GetProperty("damping_ratio_primary_referenced").GetDouble(), Tolerance.Abs(5e-7), "ζ primary");
        var k = a.GetProperty("stiffness_n_per_m").GetDouble();
        var m = a.GetProperty("mass_kg").GetDouble();
        NumericAssert.Close(a.GetProperty("frequency_hz").GetDouble(), Math.Sqrt(k / m) / (2 * Math.PI), Tolerance.Rel(1e-12), "f = √(k/m)/2π");
        NumericAssert.Close(Math.Sqrt(41), json.GetProperty("fixed_point_peak").GetDouble(), Tolerance.Rel(1e-14), "√41");
        Assert.Equal(System.Text.Json.JsonValueKind.Array, json.GetProperty("mistuning").ValueKind);
        Assert.Contains("fatigue", json.GetProperty("absorber_caution").GetString());
    }

    [Fact]
    public void Table_CarriesBothCautionsAndBothDampingConventions()
    {
        var run = CommandRun.Of("tune", CommandRun.Deck("68 kN/mm"), "--host", "deck", "--mass-ratio", "0.05");
        Assert.Equal(0, run.ExitCode);
        Assert.Contains("Absorber caution:", run.Output);
        Assert.Contains("detunes", run.Output);
        Assert.Contains("licensed", run.Output);
        Assert.Contains("0.133631", run.Output);
        Assert.Contains("0.127267", run.Output);
    }

    [Fact]
    public void Write_ProducesAModelEveryCommandReads()
    {
        var output = CommandRun.TempPath();
        var run = CommandRun.Of("tune", CommandRun.Deck("68 kN/mm"), "--host", "deck", "--mass-ratio", "5 %", "--write", output);
        Assert.Equal(0, run.ExitCode);
        Assert.Contains("wrote", run.Error);
        var modes = CommandRun.Of("modes", output, "--format", "json");
        Assert.Equal(0, modes.ExitCode);
        Assert.Equal(3, modes.Json().GetProperty("modes").GetArrayLength());
        Assert.Equal(0, CommandRun.Of("validate", output).ExitCode);
        Assert.Contains(CommandRun.Of("check", output).ExitCode, new[] { 0, 1 });
    }

    [Theory]
    [InlineData("--host", "roof", "--mass-ratio", "5 %", "'roof' is not a mass")]
    [InlineData("--host", "ground", "--mass-ratio", "5 %", "is a support")]
    [InlineData("--host", "deck", "--mass-ratio", "0 %", "must be positive")]
    [InlineData("--host", "deck", "--mass-ratio", "-5 %", "must be positive")]
    [InlineData("--host", "deck", "--mass-ratio", "500 %", "not a tuned absorber")]
    [InlineData("--host", "deck", "--mass-ratio", "5 kg", "--mass-ratio")]
    [InlineData("--host", "deck", "--mass-ratio", "five", "--mass-ratio")]
    public void BadInputs_ExitTwoWithAClearMessage(string o1, string v1, string o2, string v2, string expected)
    {
        var run = CommandRun.Of("tune", CommandRun.Deck("68 kN/mm"), o1, v1, o2, v2);
        Assert.Equal(2, run.ExitCode);
        Assert.Contains(expected, run.Error);
        Assert.DoesNotContain("   at ", run.Error); // no stack trace
    }

    [Fact]
    public void ModeOutOfRange_ExitsTwo()
    {
        var run = CommandRun.Of("tune", CommandRun.Deck("68 kN/mm"), "--host", "deck", "--mass-ratio", "5 %", "--mode", "7");
        Assert.Equal(2, run.ExitCode);
        Assert.Contains("mode 7 does not exist", run.Error);
    }

    [Fact]
    public void BaseTarget_UsesWarburtonsTuning()
    {
        // Warburton 1982 [confirmed citation; formulas from memory]: μ = 5 % base acceleration f = 0.940401, ζ_a = 0.135333.
        var run = CommandRun.Of("tune", CommandRun.Deck("68 kN/mm"), "--host", "deck", "--mass-ratio", "5 %", "--target", "base", "--format", "json");
        Assert.Equal(0, run.ExitCode);
        var a = run.Json().GetProperty("absorber");
        NumericAssert.Close(0.940401, a.GetProperty("frequency_ratio").GetDouble(), Tolerance.Abs(5e-7), "f");
        NumericAssert.Close(0.135333, a.GetProperty("damping_ratio").GetDouble(), Tolerance.Abs(5e-7), "ζ_a");
    }

    [Fact]
    public void CsvFormat_IsRefused()
    {
        var run = CommandRun.Of("tune", CommandRun.Deck("68 kN/mm"), "--host", "deck", "--mass-ratio", "5 %", "--format", "csv");
        Assert.Equal(2, run.ExitCode);
        Assert.Contains("--format 'csv' is not one of table, json", run.Error);
    }

    [Fact]
    public void LoadSpeed_ChoosesTheModeWhenTheModelHasNoSeparationCriterion()
    {
        // Deck 2600 kg on 68 kN/mm with a 400 kg fan on 1.6 kN/mm: modes near 9.7 and 26 Hz; a load at 1470 rpm (24.5 Hz)
        // picks mode 2, one at 600 rpm (10 Hz) mode 1.
        string Model(string speed) => CommandRun.ModelFile($"""
            masses:
              deck: 2600 kg
              fan: 400 kg
            springs:
              beams: {"{"}between: [ground, deck], stiffness: 68 kN/mm{"}"}
              mounts: {"{"}between: [deck, fan], stiffness: 1.6 kN/mm{"}"}
            damping:
              modal: 2 %
            loads:
              fan: {"{"}kind: unbalance, at: fan, mass-radius: 6 kg*mm, speed: {speed}{"}"}
            """);
        Assert.Equal(2, CommandRun.Of("tune", Model("1470 rpm"), "--host", "deck", "--mass-ratio", "5 %", "--format", "json").Json().GetProperty("mode").GetInt32());
        Assert.Equal(1, CommandRun.Of("tune", Model("600 rpm"), "--host", "fan", "--mass-ratio", "5 %", "--format", "json").Json().GetProperty("mode").GetInt32());
    }

    [Fact]
    public void SingleMassWithoutSpeed_TunesItsOnlyMode()
    {
        // The one mode of a single mass is the only candidate: no --mode is asked for, and the choice is stated.
        var path = CommandRun.ModelFile("masses:\n  deck: 100 kg\nsprings:\n  s: {between: [ground, deck], stiffness: 1e5}\n");
        var run = CommandRun.Of("tune", path, "--host", "deck", "--mass-ratio", "5 %");
        Assert.Equal(0, run.ExitCode);
        Assert.Contains("largest motion at the host", run.Output);
    }

    [Fact]
    public void SpeedTarget_WithoutASpeed_ExitsTwo()
    {
        var path = CommandRun.ModelFile("masses:\n  deck: 100 kg\nsprings:\n  s: {between: [ground, deck], stiffness: 1e5}\n");
        var run = CommandRun.Of("tune", path, "--host", "deck", "--mass-ratio", "5 %", "--target", "speed");
        Assert.Equal(2, run.ExitCode);
        Assert.Contains("needs one", run.Error);
    }

    [Fact]
    public void SpeedTarget_JsonReportsTheResponseAtTheSpeedBeforeAndAfter()
    {
        // Deck 100 kg on 1e5 N/m (f_p = 5.03 Hz) forced at 4.5 Hz; tolerance 0: the undamped absorber tuned to 4.5 Hz cancels
        // the deck's motion there (Den Hartog 1956 §3.2 [from memory]). Before: 1/|1 − r²| (SDOF closed form).
        var path = CommandRun.ModelFile("masses:\n  deck: 100 kg\nsprings:\n  s: {between: [ground, deck], stiffness: 1e5}\n");
        var run = CommandRun.Of("tune", path, "--host", "deck", "--mass-ratio", "5 %", "--target", "speed", "--speed", "4.5 Hz",
            "--speed-tolerance", "0", "--format", "json");
        Assert.Equal(0, run.ExitCode);
        var json = run.Json();
        Assert.Equal("running-speed", json.GetProperty("method").GetString());
        Assert.Equal("speed", json.GetProperty("target").GetString());
        var at = json.GetProperty("at_speeds")[0];
        var r = 4.5 / (Math.Sqrt(1e5 / 100) / (2 * Math.PI));
        NumericAssert.Close(1 / Math.Abs(1 - r * r), at.GetProperty("before").GetDouble(), Tolerance.Rel(1e-9), "before");
        NumericAssert.Small(at.GetProperty("after").GetDouble(), 1e-9, "after");
        NumericAssert.Close(4.5, json.GetProperty("absorber").GetProperty("frequency_hz").GetDouble(), Tolerance.Rel(1e-12), "tuned to the speed");
    }

    private static string[] Tune(string model, string output, params string[] extra) =>
        ["tune", model, "--host", "deck", "--mass-ratio", "5 %", "--write", output, .. extra];

    private static string TempFolder()
    {
        var dir = Path.Combine(Path.GetTempPath(), "modalchain-tune-tests", Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(dir);
        return dir;
    }

    [Fact]
    public void Write_RefusesAnExistingFileWithoutForce_AndReplacesItWithForce()
    {
        var dir = TempFolder();
        var output = Path.Combine(dir, "tuned.yaml");
        File.WriteAllText(output, "# my own notes\n");
        var model = CommandRun.Deck("68 kN/mm");

        var refused = CommandRun.Of(Tune(model, output));
        Assert.Equal(2, refused.ExitCode);
        Assert.Contains("--force", refused.Error);
        Assert.Equal("# my own notes\n", File.ReadAllText(output));

        var forced = CommandRun.Of(Tune(model, output, "--force"));
        Assert.True(forced.ExitCode == 0, forced.Error);
        Assert.Equal(3, CommandRun.Of("modes", output, "--format", "json").Json().GetProperty("modes").GetArrayLength());
        Assert.Equal(["tuned.yaml"], Directory.GetFileSystemEntries(dir).Select(Path.GetFileName)); // no temporary file left
    }

    [Fact]
    [System.Runtime.Versioning.UnsupportedOSPlatform("windows")]
    public void Write_NeverOverwritesTheModelItRead_EvenThroughSymbolicLinksOrWithForce()
    {
        var dir = TempFolder();
        var model = Path.Combine(dir, "deck.yaml");
        File.Copy(CommandRun.Deck("68 kN/mm"), model);
        var before = File.ReadAllBytes(model);
        var fileLink = Path.Combine(dir, "link.yaml");
        File.CreateSymbolicLink(fileLink, model);
        var folderLink = Path.Combine(TempFolder(), "folder");
        Directory.CreateSymbolicLink(folderLink, dir);

        foreach (var output in new[] { model, Path.Combine(dir, ".", "deck.yaml"), fileLink, Path.Combine(folderLink, "deck.yaml") })
        {
            var run = CommandRun.Of(Tune(model, output, "--force"));
            Assert.True(run.ExitCode == 2, $"{output}: exit {run.ExitCode}");
            Assert.Contains("is the model that was read", run.Error);
            Assert.Equal(before, File.ReadAllBytes(model));
        }
        // Read through the link, written to the real path: the same file too.
        var viaLink = CommandRun.Of(Tune(fileLink, model, "--force"));
        Assert.Equal(2, viaLink.ExitCode);
        Assert.Equal(before, File.ReadAllBytes(model));
    }

    [Theory]
    [InlineData("")]
    [InlineData(" ")]
    public void Write_WithoutAFileName_ExitsTwo(string output)
    {
        var run = CommandRun.Of(Tune(CommandRun.Deck("68 kN/mm"), output));
        Assert.Equal(2, run.ExitCode);
        Assert.Contains("--write", run.Error);
    }

    [Fact]
    public void Write_ToAFolder_ExitsTwo()
    {
        var run = CommandRun.Of(Tune(CommandRun.Deck("68 kN/mm"), TempFolder(), "--force"));
        Assert.Equal(2, run.ExitCode);
        Assert.Contains("is a folder", run.Error);
    }
}
