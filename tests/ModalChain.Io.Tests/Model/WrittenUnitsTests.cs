using ModalChain.Core.Units;
using ModalChain.Io.Model;

namespace ModalChain.Io.Tests.Model;

/// <summary>The reader notes the one unit each kind of element property is written in, for the display layers.</summary>
public sealed class WrittenUnitsTests
{
    private static IReadOnlyDictionary<Quantity, string> Written(string yaml)
    {
        var r = ModelReader.Read(yaml, "units.yaml");
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
        return r.Model!.WrittenUnits;
    }

    [Fact]
    public void OneUnitPerKind_IsNotedInTheTablesSpelling()
    {
        var w = Written("""
            masses:
              deck: 3.2 t
              skid: {mass: 0.85 t}
            springs:
              columns: {between: [ground, deck], stiffness: 95 kN/mm}
              mounts: {between: [deck, skid], stiffness: 8.4 kN/mm}
            dampers:
              pads: {between: [deck, skid], coefficient: 2 kN s/m}
            """);
        Assert.Equal("t", w[Quantity.Mass]);
        Assert.Equal("kN/mm", w[Quantity.Stiffness]);
        Assert.Equal("kN*s/m", w[Quantity.Damping]);
    }

    [Fact]
    public void MixedUnits_AndAbsentKinds_AreNotNoted()
    {
        var w = Written("""
            masses:
              deck: 3200 kg
            springs:
              columns: {between: [ground, deck], stiffness: 95 kN/mm}
              extra: {between: [ground, deck], stiffness: 9500 N/mm}
            """);
        Assert.Equal("kg", w[Quantity.Mass]);
        Assert.False(w.ContainsKey(Quantity.Stiffness));
        Assert.False(w.ContainsKey(Quantity.Damping));
    }

    [Fact]
    public void BareNumbers_CountAsTheSiUnit()
    {
        var w = Written("""
            masses:
              deck: 3200
            springs:
              columns: {between: [ground, deck], stiffness: 95e6}
            """);
        Assert.Equal("kg", w[Quantity.Mass]);
        Assert.Equal("N/m", w[Quantity.Stiffness]);
    }
}
