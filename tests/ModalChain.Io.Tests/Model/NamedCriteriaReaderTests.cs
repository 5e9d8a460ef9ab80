using ModalChain.Core.Analyses.Criteria;
using ModalChain.Io.Model;
using ModalChain.TestSupport;

namespace ModalChain.Io.Tests.Model;

/// <summary>Machine zones and floor curves named in 'criteria:': read by name, and located errors for bad input.</summary>
public class NamedCriteriaReaderTests
{
    // Six lines and a blank one, so 'criteria:' is line 7 and the first entry line 9.
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
        Assert.True(result.Errors.Any(d => d.Position.Line == line && d.Position.Column == column && d.Message.Contains(fragment, StringComparison.Ordinal)),
            string.Join("\n", result.Diagnostics));
    }

    [Fact]
    public void ZonesAndCurves_ReadByName_WithTheirPublishedValues()
    {
        var result = Read("""
            criteria:
              machine-zones:
                - {at: [skid, deck], class: medium-rigid, zone: b}
              floor-curves:
                - {at: deck, curve: vc-c}
            """);
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        var c = result.Model!.Criteria;
        Assert.False(c.IsEmpty);
        var zone = Assert.Single(c.Zones);
        Assert.Equal(["skid", "deck"], zone.At.ToArray());
        Assert.Equal('B', zone.AcceptedZone);
        // Medium machines on rigid supports, B/C boundary 2.8 mm/s r.m.s. (REFERENCES.md §8 [from memory, medium confidence]).
        NumericAssert.Close(2.8e-3, zone.Limit, Tolerance.Rel(1e-15), "B/C boundary");
        var floor = Assert.Single(c.Floors);
        Assert.Equal(["deck"], floor.At.ToArray());
        // VC-C: 12.5 µm/s (REFERENCES.md §8 [values from memory, high confidence]).
        Assert.Equal("VC-C", floor.Curve.Name);
        NumericAssert.Close(12.5e-6, floor.Curve.PlateauVelocity, Tolerance.Rel(1e-15), "VC-C");
    }

    [Fact]
    public void UnknownCurveName_IsLocated_AndSuggestsTheNearest()
    {
        var result = Read("criteria:\n  floor-curves:\n    - {at: deck, curve: VC-F}\n");
        AssertError(result, 9, 25, "'VC-F', which is not a known curve");
        Assert.Contains("VC-A, VC-B, VC-C, VC-D, VC-E", result.Errors.Single().Message, StringComparison.Ordinal);
    }

    [Fact]
    public void UnknownMass_IsLocated()
    {
        var result = Read("criteria:\n  machine-zones:\n    - {at: [skid, pump], class: medium-rigid, zone: B}\n");
        AssertError(result, 9, 19, "'pump', which is not a mass of the model");
    }

    [Fact]
    public void UnknownClass_AndZoneD_AreLocated()
    {
        var result = Read("criteria:\n  machine-zones:\n    - {at: skid, class: huge-rigid, zone: D}\n");
        AssertError(result, 9, 25, "'huge-rigid', which is not a known machine class");
        AssertError(result, 9, 43, "zone D has no upper boundary");
    }

    [Fact]
    public void MissingFields_AreLocatedAtTheEntry()
    {
        var result = Read("criteria:\n  machine-zones:\n    - {class: medium-rigid}\n  floor-curves:\n    - {at: deck}\n");
        AssertError(result, 9, 7, "needs 'at'");
        AssertError(result, 9, 7, "needs 'zone'");
        AssertError(result, 11, 7, "needs 'curve'");
    }

    [Fact]
    public void AListIsRequired_AndUnknownKeysAreRejected()
    {
        AssertError(Read("criteria:\n  floor-curves: {at: deck, curve: VC-A}\n"), 8, 17, "must be a list");
        var result = Read("criteria:\n  floor-curves:\n    - {at: deck, curve: VC-A, band: 8 Hz}\n");
        Assert.False(result.Succeeded);
        Assert.Contains(result.Errors, d => d.Position.Line == 9 && d.Message.Contains("band", StringComparison.Ordinal));
    }
}
