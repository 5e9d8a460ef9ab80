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

    [Fact]
    public void Summary_OfTheFloorTest_CountsItsElectricalSideApart()
    {
        // Hand counts from models/floor-shaker-test.yaml: 5 springs and 3 dampers in the structure; the circuit's 4 nodes
        // (amplifier-out held by the source, shaker-coil, sensor-coil, sensor-out) with 3 resistors and no inductor or
        // capacitor; 2 transducers. Its nodes without an inductor set a flux level, not a rigid-body mode, so the
        // structure (every bay held by its beams) has no unsupported group.
        var o = Run("validate", System.IO.Path.Combine(RepositoryRoot, "models", "floor-shaker-test.yaml"));
        Assert.True(o.ExitCode == 0, o.ToString());
        // 4 masses and sensor-out (the coil nodes are eliminated by their transducers, amplifier-out is held by the source).
        Assert.Contains("degrees of freedom:  5 (one direction per mass; 1 of them circuit nodes' flux linkages)", o.Stdout, StringComparison.Ordinal);
        Assert.Contains("springs, dampers:    5, 3", o.Stdout, StringComparison.Ordinal);
        Assert.Contains("electrical side:     4 nodes, 3 resistors, 0 inductors, 0 capacitors between nodes", o.Stdout, StringComparison.Ordinal);
        Assert.Contains("transducers:         2", o.Stdout, StringComparison.Ordinal);
        Assert.Contains("unsupported groups:  0", o.Stdout, StringComparison.Ordinal);
        Assert.Contains("total mass:          11030 kg", o.Stdout, StringComparison.Ordinal);
    }
}
