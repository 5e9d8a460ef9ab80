using System.Text.Json;
using ModalChain.Core.Model;
using ModalChain.Io.Model;
using ModalChain.TestSupport;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests;

/// <summary>The figures the example models state in their comments follow from the values they contain.</summary>
public class ExampleModelsTests
{
    private static Network Read(string model)
    {
        var r = ModelReader.ReadFile(ModelPath(model));
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
        return r.Model!.Network;
    }

    private static double Mass(Network n, string name) => n.Masses.Single(m => m.Name == name).Kilograms;
    private static double K(Network n, string name) => n.Springs.Single(s => s.Name == name).Stiffness;
    private static double C(Network n, string name) => n.Dampers.Single(d => d.Name == name).Coefficient;
    private static double Hz(double k, double m) => Math.Sqrt(k / m) / (2 * Math.PI);
    private static double DampingRatio(double c, double k, double m) => c / (2 * Math.Sqrt(k * m));

    [Fact]
    public void MezzanineAbsorber_IsTunedByDenHartogsRule()
    {
        var n = Read("mezzanine-absorber.yaml");
        double mp = Mass(n, "floor-bay"), ma = Mass(n, "absorber"), kp = K(n, "floor"), ka = K(n, "absorber-spring");
        var mu = ma / mp;
        NumericAssert.Close(0.05, mu, Tolerance.Rel(1e-12), "mass ratio");
        var fp = Hz(kp, mp);
        var fa = Hz(ka, ma);
        NumericAssert.Close(9.0, fp, Tolerance.Abs(0.05), "bay alone [Hz]");
        NumericAssert.Close(8.6, fa, Tolerance.Abs(0.05), "absorber alone [Hz]");
        // Den Hartog, Mechanical Vibrations, 4th ed., §3.3 (REFERENCES.md §3, citation confirmed):
        // f_a/f_p = 1/(1 + μ) = 0.952381 and ζ_opt = √(3μ/(8(1 + μ))) = 0.133631 referred to the absorber, at μ = 0.05.
        NumericAssert.Close(1 / (1 + mu), fa / fp, Tolerance.Rel(1e-3), "frequency ratio");
        NumericAssert.Close(Math.Sqrt(3 * mu / (8 * (1 + mu))), DampingRatio(C(n, "absorber-damper"), ka, ma), Tolerance.Rel(0.03), "absorber damping ratio");
        NumericAssert.Close(0.02, DampingRatio(C(n, "floor-loss"), kp, mp), Tolerance.Abs(0.001), "floor damping ratio");
        // Self-weight deflection g/ω² ≈ 3.1 mm, and f ≈ 15.76/√δ[mm] (common practice).
        var deflectionMm = 1000 * 9.80665 / Math.Pow(2 * Math.PI * fp, 2);
        NumericAssert.Close(3.1, deflectionMm, Tolerance.Abs(0.05), "self-weight deflection [mm]");
        NumericAssert.Close(fp, 15.76 / Math.Sqrt(deflectionMm), Tolerance.Rel(1e-3), "15.76/√δ");
    }

    [Fact]
    public void MezzanineAbsorber_ModesStraddleTheFloorFrequency()
    {
        // Adding a tuned absorber splits the floor's single resonance into two, one either side (Den Hartog §3.2-3.3).
        var n = Read("mezzanine-absorber.yaml");
        var fp = Hz(K(n, "floor"), Mass(n, "floor-bay"));
        var o = Run("modes", ModelPath("mezzanine-absorber.yaml"), "--format", "json");
        using var json = JsonDocument.Parse(o.Stdout);
        var modes = json.RootElement.GetProperty("modes");
        Assert.True(modes[0].GetProperty("frequency_hz").GetDouble() < fp && fp < modes[1].GetProperty("frequency_hz").GetDouble());
    }

    [Fact]
    public void StorageRack_StatedFiguresFollowFromItsValues()
    {
        var n = Read("storage-rack-centrifuge.yaml");
        // Shelf masses: 25 kg of shelf and beams plus the stock written beside each.
        Assert.Equal([205.0, 195.0, 85.0, 125.0], new[] { "shelf-1", "shelf-2", "shelf-3", "shelf-4" }.Select(s => Mass(n, s)));
        NumericAssert.Close(4 * 60e3, K(n, "rubber-feet"), Tolerance.Rel(1e-12), "four feet of 60 N/mm");
        NumericAssert.Close(0.05, DampingRatio(C(n, "rubber-feet-loss"), K(n, "rubber-feet"), Mass(n, "centrifuge")), Tolerance.Abs(0.002), "feet damping ratio");
        Assert.True(K(n, "storey-1") < K(n, "storey-2"), "the taller bottom storey is the softer one");
        var feet = n.Springs.Single(s => s.Name == "rubber-feet");
        Assert.Equal(("shelf-3", "centrifuge"), (feet.NodeA, feet.NodeB));
    }

    [Fact]
    public void ChillerDeck_StatedFiguresFollowFromItsValues()
    {
        var n = Read("chiller-deck.yaml");
        NumericAssert.Close(4 * 2.1e6, K(n, "mounts"), Tolerance.Rel(1e-12), "four mounts of 2.1 kN/mm");
    }
    [Fact]
    public void CompressorSkid_StatedFiguresFollowFromItsValues_AndItsCheckFailsOnTheRollMode()
    {
        // The file's comments: the crank at 980 rpm (16.3 Hz); seven modes (six of the skid on its mounts, one of the deck);
        // the roll mode about x at 16.4 Hz, on the crank speed, so the separation check fails on purpose (exit 1).
        var path = ModelPath("compressor-skid-deck.yaml");
        NumericAssert.Close(16.3, 980.0 / 60, Tolerance.Abs(0.05), "crank speed [Hz]");
        using var json = JsonDocument.Parse(Run("modes", path, "--format", "json").Stdout);
        var modes = json.RootElement.GetProperty("modes").EnumerateArray().ToArray();
        Assert.Equal(7, modes.Length);
        var roll = modes.Single(m => m.GetProperty("motion").GetString() == "roll");
        NumericAssert.Close(16.4, roll.GetProperty("frequency_hz").GetDouble(), Tolerance.Abs(0.05), "roll mode [Hz]");
        var check = Run("check", path);
        Assert.True(check.ExitCode == 1, check.ToString());
        Assert.Contains("FAIL", check.Stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void InstrumentCabinet_ModesAreClearOfTheFloorShake_SoItsCheckPasses()
    {
        // The file's comments: the floor shakes at 25 Hz; every mode (sway, rocking, bounce) must be 20 % clear of it.
        var path = ModelPath("instrument-cabinet-sway.yaml");
        using var json = JsonDocument.Parse(Run("modes", path, "--format", "json").Stdout);
        Assert.All(json.RootElement.GetProperty("modes").EnumerateArray(),
            m => Assert.True(Math.Abs(m.GetProperty("frequency_hz").GetDouble() / 25 - 1) >= 0.2, $"mode at {m.GetProperty("frequency_hz").GetDouble()} Hz"));
        var check = Run("check", path);
        Assert.True(check.ExitCode == 0, check.ToString());
    }
}
