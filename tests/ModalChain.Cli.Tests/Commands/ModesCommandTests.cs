using System.Text.Json;
using ModalChain.TestSupport;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests.Commands;

/// <summary><c>modes</c> on models the examples do not cover: rigid-body modes, warnings, another culture.</summary>
public class ModesCommandTests
{
    private const string Floating =
        "title: Cart and load on a frictionless track\n" +
        "masses:\n" +
        "  cart: 400 kg\n" +
        "  load: 100 kg\n" +
        "springs:\n" +
        "  coupler: {between: [cart, load], stiffness: 20 kN/m}\n";

    [Fact]
    public void UnsupportedNetwork_ReportsARigidBodyMode_WithAWarningOnStderr()
    {
        using var model = new TempModel(Floating);
        var o = Run("modes", model.Path);
        Assert.True(o.ExitCode == 0, o.ToString());
        Assert.StartsWith($"{model.Path}:3:3: warning: masses 'cart', 'load' are not connected to ground", o.Stderr, StringComparison.Ordinal);
        var row1 = o.Stdout.Split('\n').First(l => l.TrimStart().StartsWith("1 ", StringComparison.Ordinal));
        Assert.Contains("rigid body", row1, StringComparison.Ordinal);
        Assert.Contains("1 rigid-body mode(s) at 0 Hz", o.Stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void UnsupportedNetwork_JsonStaysOneObject_WithTheWarningInside()
    {
        using var model = new TempModel(Floating);
        var o = Run("modes", model.Path, "--format", "json");
        Assert.Equal(0, o.ExitCode);
        using var json = JsonDocument.Parse(o.Stdout);
        var modes = json.RootElement.GetProperty("modes");
        Assert.Equal(JsonValueKind.Null, modes[0].GetProperty("period_s").ValueKind);
        // Free-free two-mass oscillator: ω² = k (m1 + m2)/(m1 m2) (common practice).
        NumericAssert.Close(Math.Sqrt(20e3 * 500 / 40e3), modes[1].GetProperty("omega_rad_s").GetDouble(), Tolerance.Rel(1e-12), "elastic ω");
        Assert.Single(json.RootElement.GetProperty("warnings").EnumerateArray());
        Assert.Contains("warning:", o.Stderr, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("table")]
    [InlineData("json")]
    [InlineData("csv")]
    public void Output_IsIdenticalUnderADecimalCommaCulture(string format)
    {
        var path = ModelPath("chiller-deck.yaml");
        var invariant = Run("modes", path, "--format", format);
        CliOutcome german;
        using (new CultureScope("de-DE")) german = Run("modes", path, "--format", format);
        Assert.Equal(0, german.ExitCode);
        Assert.Equal(invariant.Stdout, german.Stdout);
    }

    [Fact]
    public void ChillerDeck_MatchesTheTwoMassFrequencyEquation()
    {
        // m1 m2 ω⁴ − [m1 k2 + m2 (k1 + k2)] ω² + k1 k2 = 0 (two masses in a chain from ground, k3 = 0;
        // REFERENCES.md §1; any vibration textbook, common practice). deck 3200 kg on 95 kN/mm, skid 850 kg on 8.4 kN/mm.
        const double m1 = 3200, m2 = 850, k1 = 95e6, k2 = 8.4e6;
        double a = m1 * m2, b = -(m1 * k2 + m2 * (k1 + k2)), c = k1 * k2;
        var disc = Math.Sqrt(b * b - 4 * a * c);
        double[] omega = [Math.Sqrt((-b - disc) / (2 * a)), Math.Sqrt((-b + disc) / (2 * a))];
        var o = Run("modes", ModelPath("chiller-deck.yaml"), "--format", "json");
        using var json = JsonDocument.Parse(o.Stdout);
        var modes = json.RootElement.GetProperty("modes");
        for (var i = 0; i < 2; i++)
            NumericAssert.Close(omega[i], modes[i].GetProperty("omega_rad_s").GetDouble(), Tolerance.Rel(1e-10), $"ω{i + 1}");
    }

    [Theory]
    [InlineData("20 Hz", 1)]
    [InlineData("1200 rpm", 1)]
    [InlineData("40 Hz", 2)]
    [InlineData("5 Hz", 0)]
    public void Below_ReportsExactlyTheModesUnderTheFrequency(string below, int expected)
    {
        // The chiller deck's modes are at 14.91 and 29.09 Hz (the two-mass frequency equation above); 1200 rpm = 20 Hz.
        var o = Run("modes", ModelPath("chiller-deck.yaml"), "--below", below, "--format", "json");
        Assert.True(o.ExitCode == 0, o.ToString());
        using var json = JsonDocument.Parse(o.Stdout);
        var modes = json.RootElement.GetProperty("modes");
        Assert.Equal(expected, modes.GetArrayLength());
        using var all = JsonDocument.Parse(Run("modes", ModelPath("chiller-deck.yaml"), "--format", "json").Stdout);
        for (var i = 0; i < expected; i++)
            NumericAssert.Close(all.RootElement.GetProperty("modes")[i].GetProperty("omega_rad_s").GetDouble(),
                modes[i].GetProperty("omega_rad_s").GetDouble(), Tolerance.Rel(1e-12), $"ω{i + 1}");
    }

    [Theory]
    [InlineData("fast")]
    [InlineData("-3 Hz")]
    [InlineData("0 Hz")]
    public void Below_WithoutAPositiveFrequency_IsAnInputError(string below)
    {
        var o = Run("modes", ModelPath("chiller-deck.yaml"), "--below", below);
        Assert.Equal(2, o.ExitCode);
        Assert.Contains("--below", o.Stderr, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(new string[0], 20)]
    [InlineData(new[] { "--detail", "standard" }, 20)]
    [InlineData(new[] { "--detail", "energy" }, 25)]
    [InlineData(new[] { "--detail", "ENERGY" }, 25)]
    public void Detail_DecidesWhichModesCarryEnergyShares(string[] detail, int expected)
    {
        // 25 equal masses in a chain from ground: 25 modes, more than the 20 that carry energy shares by default.
        var text = "title: Chain of 25 masses\nmasses:\n" + string.Concat(Enumerable.Range(1, 25).Select(i => $"  m{i}: 10 kg\n")) +
            "springs:\n" + string.Concat(Enumerable.Range(1, 25).Select(i => $"  k{i}: {{between: [{(i == 1 ? "ground" : $"m{i - 1}")}, m{i}], stiffness: 1 kN/m}}\n"));
        using var model = new TempModel(text);
        var o = Run(["modes", model.Path, "--format", "json", .. detail]);
        Assert.True(o.ExitCode == 0, o.ToString());
        using var json = JsonDocument.Parse(o.Stdout);
        Assert.Equal(expected, json.RootElement.GetProperty("energy_share_modes").GetInt32());
        var modes = json.RootElement.GetProperty("modes").EnumerateArray().ToArray();
        Assert.Equal(25, modes.Length);
        for (var i = 0; i < modes.Length; i++)
        {
            Assert.Equal(i < expected, modes[i].TryGetProperty("kinetic_energy_share", out _));
            Assert.Equal(i < expected, modes[i].TryGetProperty("strain_energy_share", out _));
        }
    }

    [Fact]
    public void Detail_WithAnUnknownWord_IsAnInputError()
    {
        var o = Run("modes", ModelPath("chiller-deck.yaml"), "--detail", "everything");
        Assert.Equal(2, o.ExitCode);
        Assert.Contains("--detail", o.Stderr, StringComparison.Ordinal);
    }
}
