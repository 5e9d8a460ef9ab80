using System.Text.Json;
using ModalChain.TestSupport;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests.Commands;

/// <summary>Every command on a model with inerters (between two masses and to ground).</summary>
public class InerterCommandTests
{
    // Invented scenario: a footbridge deck with a tuned mass whose motion an inerter to ground amplifies.
    private const string Model =
        "title: Footbridge deck with a tuned mass and inerters\n" +
        "masses:\n" +
        "  deck: 12000 kg\n" +
        "  tuned: 240 kg\n" +
        "springs:\n" +
        "  deck-support: {between: [ground, deck], stiffness: 4.7 kN/mm}\n" +
        "  tuned-spring: {between: [deck, tuned], stiffness: 95 kN/m}\n" +
        "dampers:\n" +
        "  tuned-damper: {between: [deck, tuned], coefficient: 1.2 kN*s/m}\n" +
        "inerters:\n" +
        "  grounded: {between: [tuned, ground], inertance: 360 kg}\n" +
        "  across: {between: [deck, tuned], inertance: 60 kg}\n" +
        "damping:\n" +
        "  modal: 1 %\n" +
        "loads:\n" +
        "  walker: {kind: force, at: deck, amplitude: 280 N, speed: 2 Hz}\n" +
        "  heel-drop: {kind: force, at: deck, time: {kind: half-sine, amplitude: 1.5 kN, duration: 50 ms, start: 0.2 s}}\n" +
        "harmonic:\n" +
        "  loads: [walker]\n" +
        "  frequencies: {from: 0.5 Hz, to: 6 Hz, points: 60}\n" +
        "  outputs: [deck, tuned]\n" +
        "criteria:\n" +
        "  separation: {margin: 10 %, speeds: [2 Hz], orders: [1]}\n" +
        "  limits:\n" +
        "    - {at: deck, quantity: velocity, peak: 50 mm/s}\n" +
        "transient:\n" +
        "  duration: 3 s\n" +
        "  step: 2 ms\n" +
        "  loads: [heel-drop]\n" +
        "  outputs: [deck, tuned]\n";

    [Fact]
    public void Modes_ReportIotaMIotaAsTotalMass_AndThePhysicalMassBesideIt()
    {
        using var model = new TempModel(Model);
        var o = Run("modes", model.Path, "--format", "json");
        Assert.True(o.ExitCode == 0, o.ToString());
        using var json = JsonDocument.Parse(o.Stdout);
        // ιᵀMι = Σ m + b_grounded (the inerter between the masses cancels in ιᵀMι; definition in docs/methods.md).
        NumericAssert.Close(12600.0, json.RootElement.GetProperty("total_mass_kg").GetDouble(), Tolerance.Rel(1e-14), "ιᵀMι");
        NumericAssert.Close(12240.0, json.RootElement.GetProperty("physical_mass_kg").GetDouble(), Tolerance.Rel(1e-14), "physical mass");
        var table = Run("modes", model.Path);
        Assert.Contains("physical mass of the masses is 12240 kg", table.Stdout, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("harmonic")]
    [InlineData("harmonic", "--method", "modal")]
    [InlineData("transient")]
    [InlineData("transient", "--method", "modal")]
    [InlineData("tune", "--host", "deck", "--mass-ratio", "2%", "--mode", "2")]
    [InlineData("study", "--vary", "springs.tuned-spring.stiffness", "--from", "50 kN/m", "--to", "150 kN/m", "--steps", "3")]
    [InlineData("validate")]
    public void EveryCommand_RunsOnAModelWithInerters(string command, params string[] options)
    {
        using var model = new TempModel(Model);
        var o = Run([command, model.Path, .. options]);
        Assert.True(o.ExitCode == 0, o.ToString());
        Assert.DoesNotContain("NaN", o.Stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_EvaluatesTheCriteria_OfAModelWithInerters()
    {
        using var model = new TempModel(Model);
        var o = Run("check", model.Path);
        // Mode 1 at 1.885 Hz lies inside 2 Hz ± 10 %: the separation check fails (exit 1), the limit is evaluated.
        Assert.True(o.ExitCode == 1, o.ToString());
        Assert.Contains("FAIL", o.Stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void Report_IsWrittenForAModelWithInerters()
    {
        using var model = new TempModel(Model);
        var dir = Path.Combine(Path.GetTempPath(), "modalchain-inerter-report-" + Guid.NewGuid().ToString("N"));
        try
        {
            var o = Run("report", model.Path, "-o", dir);
            Assert.True(o.ExitCode == 0, o.ToString());
            Assert.True(File.Exists(Path.Combine(dir, "report.html")));
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }
}
