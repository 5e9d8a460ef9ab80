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
}
