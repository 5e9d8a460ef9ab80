using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests.Commands;

/// <summary><c>validate</c>: a summary on stdout, warnings on stderr, exit 0 for a usable model.</summary>
public class ValidateCommandTests
{
    [Fact]
    public void Summary_StatesDofsTotalMassAndWarnings()
    {
        using var model = new TempModel(
            "title: Deck with a loose crate\n" +
            "masses:\n" +
            "  deck: 3200 kg\n" +
            "  crate: 150 kg\n" +
            "springs:\n" +
            "  columns: {between: [ground, deck], stiffness: 95 kN/mm}\n");
        var o = Run("validate", model.Path);
        Assert.True(o.ExitCode == 0, o.ToString());
        Assert.Contains("title:               Deck with a loose crate", o.Stdout, StringComparison.Ordinal);
        Assert.Contains("degrees of freedom:  2", o.Stdout, StringComparison.Ordinal);
        Assert.Contains("total mass:          3350 kg", o.Stdout, StringComparison.Ordinal);
        Assert.Contains("unsupported groups:  1 (rigid-body modes expected)", o.Stdout, StringComparison.Ordinal);
        Assert.Contains("warnings:            1", o.Stdout, StringComparison.Ordinal);
        Assert.Equal($"{model.Path}:4:3: warning: mass 'crate' has no spring: nothing holds it, so it has a rigid-body mode (reported at 0 Hz)",
            o.Stderr.Trim());
    }
}
