using ModalChain.Reports.Units;

namespace ModalChain.Reports.Tests.Units;

/// <summary>Display units and number formatting of the report.</summary>
public sealed class DisplayUnitsTests
{
    [Theory]
    // Exact definitions: 1 lb = 0.45359237 kg; 1 lbf/in = 4.4482216152605 N / 0.0254 m = 175.126835 N/m (NIST SP 811, 2008, App. B).
    [InlineData(0.45359237 * 2500, "2500")]
    [InlineData(0.45359237, "1.000")]
    public void ImperialMass_IsInPounds(double kg, string expected) =>
        Assert.Equal(expected, new DisplayUnits(UnitSystem.Imperial).Mass(kg));

    [Fact]
    public void ImperialStiffness_IsInPoundForcePerInch() =>
        Assert.Equal("1.000", new DisplayUnits(UnitSystem.Imperial).Stiffness(4.4482216152605 / 0.0254));

    [Fact]
    public void SiStiffness_IsInKilonewtonsPerMetre()
    {
        var si = new DisplayUnits(UnitSystem.Si);
        Assert.Equal("kN/m", si.StiffnessSymbol);
        Assert.Equal("95000", si.Stiffness(95e6));
    }

    [Theory]
    [InlineData(14.9123, "14.91")]
    [InlineData(0.0670612, "0.06706")]
    [InlineData(3200, "3200")]
    [InlineData(1.2, "1.200")]
    [InlineData(999.99999, "1000")]
    [InlineData(0.099999999, "0.1000")]
    [InlineData(123456789, "1.235E+08")]
    [InlineData(0, "0")]
    [InlineData(double.PositiveInfinity, "∞")]
    public void Number_HasFourSignificantDigits(double value, string expected) => Assert.Equal(expected, DisplayUnits.Number(value));

    [Fact]
    public void ImperialResponseUnits_FollowTheExactDefinitions()
    {
        // 1 in = 0.0254 m, 1 lbf = 4.4482216152605 N (NIST SP 811, 2008, App. B); 1 in·lbf = 0.0254 × 4.4482216152605 J.
        var u = new DisplayUnits(UnitSystem.Imperial);
        ModalChain.TestSupport.NumericAssert.Close(1, u.Displacement.From(0.0254), ModalChain.TestSupport.Tolerance.Rel(1e-15), "in");
        ModalChain.TestSupport.NumericAssert.Close(1, u.Velocity.From(0.0254), ModalChain.TestSupport.Tolerance.Rel(1e-15), "in/s");
        ModalChain.TestSupport.NumericAssert.Close(1, u.Acceleration.From(0.0254), ModalChain.TestSupport.Tolerance.Rel(1e-15), "in/s²");
        ModalChain.TestSupport.NumericAssert.Close(1, u.Force.From(4.4482216152605), ModalChain.TestSupport.Tolerance.Rel(1e-15), "lbf");
        ModalChain.TestSupport.NumericAssert.Close(1, u.Energy.From(0.0254 * 4.4482216152605), ModalChain.TestSupport.Tolerance.Rel(1e-15), "in·lbf");
        ModalChain.TestSupport.NumericAssert.Close(1, u.FloorVelocity.From(0.0254e-6), ModalChain.TestSupport.Tolerance.Rel(1e-12), "µin/s");
        // 1 in/kip = 0.0254 m / 4448.2216152605 N.
        ModalChain.TestSupport.NumericAssert.Close(1, u.Compliance.From(0.0254 / 4448.2216152605), ModalChain.TestSupport.Tolerance.Rel(1e-12), "in/kip");
    }

    [Fact]
    public void WrittenUnits_AreUsedOnlyWithinTheirSystem()
    {
        var written = new Dictionary<ModalChain.Core.Units.Quantity, string> { [ModalChain.Core.Units.Quantity.Stiffness] = "kN/mm", [ModalChain.Core.Units.Quantity.Mass] = "t" };
        var si = new DisplayUnits(UnitSystem.Si, written);
        Assert.Equal("kN/mm", si.StiffnessSymbol);
        Assert.Equal("95", si.Stiffness(95e6, given: true));
        Assert.Equal("t", si.MassSymbol);
        Assert.Equal("lbf/in", new DisplayUnits(UnitSystem.Imperial, written).StiffnessSymbol);
        Assert.Equal(UnitSystem.Si, DisplayUnits.SystemOf(written));
        Assert.Equal(UnitSystem.Imperial, DisplayUnits.SystemOf(new Dictionary<ModalChain.Core.Units.Quantity, string> { [ModalChain.Core.Units.Quantity.Mass] = "lb" }));
    }
}
