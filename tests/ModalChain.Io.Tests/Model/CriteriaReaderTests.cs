using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Io.Model;
using ModalChain.TestSupport;

namespace ModalChain.Io.Tests.Model;

public class CriteriaReaderTests
{
    private const string Network = """
        masses:
          deck: {mass: 3200 kg}
          skid: {mass: 850 kg}
        springs:
          columns: {between: [ground, deck], stiffness: 95 kN/mm}
          mounts:  {between: [deck, skid], stiffness: 8.4 kN/mm}

        """;

    private static LoadResult Read(string criteria) => ModelReader.Read(Network + criteria, "m.yaml");

    private static void AssertError(LoadResult result, int line, int column, string fragment)
    {
        Assert.False(result.Succeeded);
        Assert.Contains(result.Errors, d => d.Position.Line == line && d.Position.Column == column && d.Message.Contains(fragment, StringComparison.Ordinal));
    }

    [Fact]
    public void TheIssueExample_ReadsInSi()
    {
        var result = Read("""
            criteria:
              separation: {margin: 20 %, speeds: [1480 rpm], orders: [1, 2]}
              limits:
                - {at: skid, quantity: velocity, peak: 4 mm/s}
                - {at: deck, quantity: acceleration, rms: 0.05 m/s^2}
            """);
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        var c = result.Model!.Criteria;
        NumericAssert.Close(0.20, c.Separation!.Margin, Tolerance.Rel(1e-15));
        NumericAssert.Close(1480.0 / 60, c.Separation.SpeedsHz.Single(), Tolerance.Rel(1e-15));
        Assert.Equal([1.0, 2.0], c.Separation.Orders.ToArray());
        Assert.Equal(new VibrationLimit("skid", ResponseQuantity.Velocity, AmplitudeMeasure.Peak, 4e-3), c.Limits[0]);
        Assert.Equal(new VibrationLimit("deck", ResponseQuantity.Acceleration, AmplitudeMeasure.Rms, 0.05), c.Limits[1]);
    }

    [Fact]
    public void Defaults_MarginTwentyPercentAndFirstOrder()
    {
        // The 20 % default is common practice (REFERENCES §8), documented in docs/criteria.md.
        var result = Read("criteria:\n  separation: {speeds: 24.7 Hz}\n");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        var s = result.Model!.Criteria.Separation!;
        Assert.Equal(SeparationCriterion.DefaultMargin, s.Margin);
        Assert.Equal([1.0], s.Orders.ToArray());
        Assert.Equal([24.7], s.SpeedsHz.ToArray());
        Assert.Empty(result.Model.Criteria.Limits);
    }

    [Fact]
    public void NoCriteriaSection_IsEmpty()
    {
        var result = ModelReader.Read(Network, "m.yaml");
        Assert.True(result.Model!.Criteria.IsEmpty);
    }

    [Fact]
    public void DisplacementLimit_TakesLengthUnits()
    {
        var result = Read("criteria:\n  limits:\n    - {at: deck, quantity: displacement, peak: 25 um}\n");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        NumericAssert.Close(25e-6, result.Model!.Criteria.Limits.Single().Value, Tolerance.Rel(1e-15));
    }

    // Line numbers: the network text above takes lines 1-6, criteria start on line 7.
    [Fact]
    public void LimitAtUnknownMass_PointsAtTheName() =>
        AssertError(Read("criteria:\n  limits:\n    - {at: skd, quantity: velocity, peak: 4 mm/s}\n"), 9, 12, "not a mass of the model (did you mean 'skid'?)");

    [Fact]
    public void WrongUnitForTheQuantity_IsAnError() =>
        AssertError(Read("criteria:\n  limits:\n    - {at: skid, quantity: velocity, peak: 4 mm}\n"), 9, 44, "'mm' is a unit of length, but a velocity is expected");

    [Fact]
    public void PeakAndRmsTogether_IsAnError() =>
        AssertError(Read("criteria:\n  limits:\n    - {at: skid, quantity: velocity, peak: 4 mm/s, rms: 3 mm/s}\n"), 9, 57, "both 'peak' and 'rms'");

    [Fact]
    public void NeitherPeakNorRms_IsAnError() =>
        AssertError(Read("criteria:\n  limits:\n    - {at: skid, quantity: velocity}\n"), 9, 7, "needs 'peak' or 'rms'");

    [Fact]
    public void UnknownQuantity_SuggestsTheNearest() =>
        AssertError(Read("criteria:\n  limits:\n    - {at: skid, quantity: velocty, peak: 4 mm/s}\n"), 9, 28, "(did you mean 'velocity'?)");

    [Theory]
    [InlineData("0 %")]
    [InlineData("100 %")]
    [InlineData("-5 %")]
    [InlineData("96 %")]
    public void MarginOutsideItsRange_IsAnError(string margin) =>
        AssertError(Read($"criteria:\n  separation: {{margin: {margin}, speeds: [1480 rpm]}}\n"), 8, 24, "'margin' of the separation criterion");

    [Fact]
    public void MissingSpeeds_IsAnError() =>
        AssertError(Read("criteria:\n  separation: {margin: 20 %}\n"), 8, 15, "needs 'speeds'");

    [Fact]
    public void NonPositiveOrder_IsAnError() =>
        AssertError(Read("criteria:\n  separation: {speeds: [1480 rpm], orders: [1, 0]}\n"), 8, 48, "'orders' of the separation criterion");

    [Fact]
    public void UnknownCriteriaKey_IsAnError() =>
        AssertError(Read("criteria:\n  seperation: {speeds: [1480 rpm]}\n"), 8, 3, "unknown key 'seperation'");

    [Fact]
    public void AllProblemsAreReportedAtOnce()
    {
        var result = Read("criteria:\n  separation: {margin: 0 %, speeds: [1480 kg]}\n  limits:\n    - {at: nowhere, quantity: speed, peak: 4 mm/s}\n");
        Assert.True(result.Errors.Count() >= 4, string.Join("\n", result.Diagnostics));
    }

    [Fact]
    public void SeparationExempt_ReadsOneNameOrAList()
    {
        var one = Read("criteria:\n  separation: {speeds: [1480 rpm], exempt: skid}\n");
        Assert.True(one.Succeeded, string.Join("\n", one.Diagnostics));
        Assert.Equal(["skid"], one.Model!.Criteria.Separation!.Exempt.ToArray());
        var list = Read("criteria:\n  separation: {speeds: [1480 rpm], exempt: [skid, deck]}\n");
        Assert.Equal(["skid", "deck"], list.Model!.Criteria.Separation!.Exempt.ToArray());
        Assert.Empty(Read("criteria:\n  separation: {speeds: [1480 rpm]}\n").Model!.Criteria.Separation!.Exempt);
    }

    [Fact]
    public void SeparationExempt_ReportsUnknownAndRepeatedNamesWhereTheyStand()
    {
        // Line 8 is the separation line (the network above takes 7 lines and a blank one).
        AssertError(Read("criteria:\n  separation: {speeds: [1480 rpm], exempt: [skid, skd]}\n"), 8, 51, "names 'skd', which is not a mass of the model (did you mean 'skid'?)");
        AssertError(Read("criteria:\n  separation: {speeds: [1480 rpm], exempt: [skid, skid]}\n"), 8, 51, "names 'skid' twice");
        AssertError(Read("criteria:\n  separation: {speeds: [1480 rpm], exempt: {skid: 1}}\n"), 8, 44, "must be a list of mass names");
    }
}
