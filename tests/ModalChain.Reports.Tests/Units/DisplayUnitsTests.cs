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
}
