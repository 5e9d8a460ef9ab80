using ModalChain.Io.Model;

namespace ModalChain.Io.Tests.Transducers;

/// <summary>The 'transducers' section: read into the network, with located errors for every misuse.</summary>
public class TransducerReaderTests
{
    // Lines 1–13; a test's own text starts on line 14.
    private const string Network = """
        masses:
          table: 2 kg
          probe: 0.5 kg
          coil-plus: 1e-6 kg
          coil-minus: 1e-6 kg
        supports:
          amplifier:
        springs:
          flexure: {between: [ground, table], stiffness: 40 kN/m}
          probe-spring: {between: [table, probe], stiffness: 5 kN/m}
        dampers:
          coil-resistance: {between: [amplifier, coil-plus], coefficient: 0.25 N*s/m}
          return: {between: [coil-minus, ground], coefficient: 1 N*s/m}

        """;

    private static LoadResult Read(string text) => ModelReader.Read(Network + text, "m.yaml");

    private static void AssertError(LoadResult result, int line, int column, string fragment)
    {
        Assert.False(result.Succeeded);
        Assert.True(result.Errors.Any(d => d.Position.Line == line && d.Position.Column == column && d.Message.Contains(fragment, StringComparison.Ordinal)),
            string.Join("\n", result.Diagnostics));
    }

    [Theory]
    [InlineData("12 T*m")]
    [InlineData("12 N/A")]
    [InlineData("12 V*s/m")]
    [InlineData("12 V·s/m")]
    [InlineData("12")]
    public void ATransducer_IsReadWithItsForceFactorInSI(string forceFactor)
    {
        // T·m = N/A = V·s/m (SI identities: 1 T = 1 V·s/m², 1 T·m = 1 N/A).
        var result = Read($"transducers:\n  coil: {{between: [table, ground], branch: [coil-plus, coil-minus], force-factor: {forceFactor}}}\n");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        var t = Assert.Single(result.Model!.Network.Transducers);
        Assert.Equal(("coil", "table", "ground", "coil-plus", "coil-minus"), (t.Name, t.NodeA, t.NodeB, t.BranchA, t.BranchB));
        Assert.Equal(12.0, t.ForceFactor);
        // The eliminated terminal has no DOF and no "rigid-body" warning.
        Assert.Equal(["table", "probe", "coil-minus"], Core.Dofs.DofMap.For(result.Model.Network).Dofs.Select(d => d.Node).ToArray());
        Assert.DoesNotContain(result.Diagnostics, d => d.Message.Contains("'coil-plus' has no spring", StringComparison.Ordinal));
    }

    [Fact]
    public void AnUnknownBranchNode_IsALocatedErrorWithASuggestion() =>
        AssertError(Read("transducers:\n  coil: {between: [table, ground], branch: [coil-plux, ground], force-factor: 12 T*m}\n"),
            15, 45, "unknown node 'coil-plux' (did you mean 'coil-plus'?)");

    [Fact]
    public void AnUnknownMechanicalNode_IsALocatedError() =>
        AssertError(Read("transducers:\n  coil: {between: [tabel, ground], branch: [coil-plus, ground], force-factor: 12 T*m}\n"),
            15, 20, "unknown node 'tabel'");

    [Theory]
    [InlineData("0 T*m", "force factor")]
    [InlineData("-3 T*m", "force factor")]
    [InlineData("12 kg", "force factor")]
    public void AZeroNegativeOrWronglyUnitedForceFactor_IsALocatedError(string value, string fragment) =>
        AssertError(Read($"transducers:\n  coil: {{between: [table, ground], branch: [coil-plus, ground], force-factor: {value}}}\n"),
            15, 79, fragment);

    [Fact]
    public void BothBranchTerminalsOnSupports_IsALocatedError() =>
        AssertError(Read("transducers:\n  coil: {between: [table, ground], branch: [amplifier, ground], force-factor: 12 T*m}\n"),
            15, 3, "both branch terminals on supports");

    [Fact]
    public void TwoTransducersOnOneBranchTerminal_IsALocatedErrorAtTheSecond() =>
        AssertError(Read("transducers:\n  coil: {between: [table, ground], branch: [coil-plus, ground], force-factor: 12 T*m}\n"
            + "  second: {between: [probe, table], branch: [coil-plus, coil-minus], force-factor: 3 T*m}\n"),
            16, 3, "which an earlier transducer already eliminates");

    [Fact]
    public void AMissingBranch_IsALocatedError() =>
        AssertError(Read("transducers:\n  coil: {between: [table, ground], force-factor: 12 T*m}\n"), 15, 3, "needs 'branch: [n1, n2]'");

    [Fact]
    public void ALoadAtTheEliminatedNode_IsALocatedError() =>
        AssertError(Read("transducers:\n  coil: {between: [table, ground], branch: [coil-plus, ground], force-factor: 12 T*m}\n"
            + "loads:\n  push: {kind: force, at: coil-plus, amplitude: 1 N}\n"),
            17, 27, "transducer 'coil' eliminates");

    [Fact]
    public void MovingASupportThatDrivesACapacitanceThroughTheConstraint_IsALocatedError() =>
        AssertError(Read("transducers:\n  coil: {between: [table, amplifier], branch: [coil-minus, ground], force-factor: 12 T*m}\n"
            + "loads:\n  shake: {kind: base-motion, support: amplifier, velocity: 1 m/s}\n"),
            17, 3, "moving such a support is not supported yet");

    [Fact]
    public void TransducersInAPlaneModel_AreALocatedError()
    {
        var result = ModelReader.Read("space: plane\nmasses:\n  a: {mass: 1 kg, at: [0, 0]}\ntransducers: {}\n", "p.yaml");
        AssertError(result, 4, 1, "line models only");
    }
}
