using ModalChain.TestSupport;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests.Formatting;

/// <summary>The modes table shows what issue 2 item 7 asks at a glance: frequency, period, effective mass, where the mode lives.</summary>
public class ModesTableTests
{
    [Fact]
    public void Header_NamesTheColumnsWithUnits()
    {
        var o = Run("modes", ModelPath("chiller-deck.yaml"));
        var header = o.Stdout.Split('\n').Single(l => l.StartsWith("mode ", StringComparison.Ordinal));
        foreach (var column in new[] { "frequency [Hz]", "omega [rad/s]", "period [s]", "eff. mass [%]", "cumulative [%]", "where it moves" })
            Assert.Contains(column, header, StringComparison.Ordinal);
    }

    [Fact]
    public void ChillerDeck_FundamentalLivesInTheSkid_AndItsMountsAreTheSpringToStiffen()
    {
        // The skid (850 kg) on soft mounts (8.4 kN/mm) over a stiff deck (95 kN/mm): mode 1 is the skid bouncing on its
        // mounts, so nearly all its kinetic energy is in the skid and its strain energy in the mounts (common practice).
        var o = Run("modes", ModelPath("chiller-deck.yaml"));
        var lines = o.Stdout.Split('\n');
        var row1 = lines.First(l => l.TrimStart().StartsWith("1 ", StringComparison.Ordinal));
        Assert.Matches(@"skid (9\d|100)%$", row1.TrimEnd());
        Assert.Contains(lines, l => l.StartsWith("Mode 1 stores", StringComparison.Ordinal) && l.Contains("spring 'mounts'", StringComparison.Ordinal));
    }

    [Fact]
    public void EveryElasticModeRow_NamesTheSpringWithTheLargestStrainEnergyShare()
    {
        // REFERENCES.md §1 case A (Rao, Mechanical Vibrations, 5th ed., Ex. 5.3 [from memory]; values recomputed):
        // m1 = 10 kg on k1 = 30 N/m to ground, m2 = 1 kg on k2 = 5 N/m to m1; mode ratios X2/X1 = 2 and -5.
        // Strain energy by hand, U = k·(stretch)²/2 with X1 = 1: mode 1, k1: 15, k2: 5·(2-1)²/2 = 2.5, so k1 holds
        // 15/17.5 = 85.7 %; mode 2, k1: 15, k2: 5·(-5-1)²/2 = 90, so k2 holds 90/105 = 85.7 %.
        using var model = new TempModel(
            "title: Two masses, case A\n" +
            "masses:\n" +
            "  lower: 10 kg\n" +
            "  upper: 1 kg\n" +
            "springs:\n" +
            "  support: {between: [ground, lower], stiffness: 30 N/m}\n" +
            "  link: {between: [lower, upper], stiffness: 5 N/m}\n");
        var o = Run("modes", model.Path);
        Assert.True(o.ExitCode == 0, o.ToString());
        var lines = o.Stdout.Split('\n');
        var header = lines.Single(l => l.StartsWith("mode ", StringComparison.Ordinal));
        Assert.Contains("most strained spring", header, StringComparison.Ordinal);
        var expected = new[] { (1, "support", 15 / 17.5), (2, "link", 90 / 105.0) };
        foreach (var (mode, spring, share) in expected)
        {
            // A table row opens with the mode number and the frequency to four decimals.
            var row = lines.Single(l => System.Text.RegularExpressions.Regex.IsMatch(l, $@"^\s*{mode}\s+\d+\.\d{{4}}\s"));
            var cell = System.Text.RegularExpressions.Regex.Match(row, @"\b(support|link) (\d+)%");
            Assert.True(cell.Success, row);
            Assert.Equal(spring, cell.Groups[1].Value);
            // The share is printed to whole percent, so it matches the hand value within half a percent.
            NumericAssert.Close(100 * share, double.Parse(cell.Groups[2].Value, System.Globalization.CultureInfo.InvariantCulture), Tolerance.Abs(0.5), $"mode {mode} share");
        }
    }
}
