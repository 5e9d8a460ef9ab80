using ModalChain.Core.Units;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Units;

/// <summary>The table of unit symbols: SI symbols, accepted lists, lookup by symbol and invariant formatting.</summary>
public class UnitTableTests
{
    [Fact]
    public void EveryQuantity_HasItsSiUnitWithFactorOne()
    {
        foreach (var quantity in Enum.GetValues<Quantity>())
        {
            Assert.NotEmpty(UnitTable.Symbols(quantity));
            if (quantity == Quantity.Ratio) continue; // the SI "unit" of a ratio is a bare number
            Assert.Equal(1.0, UnitTable.FactorToSi(quantity, UnitTable.SiSymbol(quantity)));
        }
    }

    [Fact]
    public void AcceptedLists_ContainEveryUnitIssue2Requires()
    {
        Assert.Superset(new HashSet<string> { "kg", "g", "t", "lb" }, UnitTable.Symbols(Quantity.Mass).ToHashSet());
        Assert.Superset(new HashSet<string> { "N/m", "kN/m", "N/mm", "kN/mm", "MN/m", "lbf/in" }, UnitTable.Symbols(Quantity.Stiffness).ToHashSet());
        Assert.Superset(new HashSet<string> { "N*s/m", "Ns/m", "kN*s/m" }, UnitTable.Symbols(Quantity.Damping).ToHashSet());
        Assert.Superset(new HashSet<string> { "m", "mm", "in" }, UnitTable.Symbols(Quantity.Length).ToHashSet());
        Assert.Superset(new HashSet<string> { "Hz", "rpm", "rad/s" }, UnitTable.Symbols(Quantity.Frequency).ToHashSet());
        Assert.Superset(new HashSet<string> { "%" }, UnitTable.Symbols(Quantity.Ratio).ToHashSet());
    }

    [Fact]
    public void ExactFactors_MatchTheirDefinitions()
    {
        // inch 0.0254 m, pound 0.45359237 kg, pound-force 4.4482216152605 N (NIST SP 811, 2008, App. B; attribution
        // from memory); rpm = 1/60 Hz and rad/s = 1/(2π) Hz by definition of the units. Tolerance 1e-15 relative.
        NumericAssert.Close(0.0254, UnitTable.FactorToSi(Quantity.Length, "in")!.Value, Tolerance.Rel(1e-15), "in");
        NumericAssert.Close(0.45359237, UnitTable.FactorToSi(Quantity.Mass, "lb")!.Value, Tolerance.Rel(1e-15), "lb");
        NumericAssert.Close(4.4482216152605, UnitTable.FactorToSi(Quantity.Force, "lbf")!.Value, Tolerance.Rel(1e-15), "lbf");
        NumericAssert.Close(175.12683524647638, UnitTable.FactorToSi(Quantity.Stiffness, "lbf/in")!.Value, Tolerance.Rel(1e-15), "lbf/in");
        NumericAssert.Close(1.0 / 60, UnitTable.FactorToSi(Quantity.Frequency, "rpm")!.Value, Tolerance.Rel(1e-15), "rpm");
        NumericAssert.Close(1 / (2 * Math.PI), UnitTable.FactorToSi(Quantity.Frequency, "rad/s")!.Value, Tolerance.Rel(1e-15), "rad/s");
        NumericAssert.Close(0.01, UnitTable.FactorToSi(Quantity.Ratio, "%")!.Value, Tolerance.Rel(1e-15), "%");
        NumericAssert.Close(9.80665, UnitTable.FactorToSi(Quantity.Acceleration, "g")!.Value, Tolerance.Rel(1e-15), "g");
    }

    [Fact]
    public void SymbolOfSeveralQuantities_IsFoundUnderEach()
    {
        // "g" is both the gram and standard gravity; "m" only a length.
        Assert.Equal([Quantity.Mass, Quantity.Acceleration], UnitTable.QuantitiesOf("g"));
        Assert.Equal([Quantity.Length], UnitTable.QuantitiesOf("m"));
        Assert.Equal([Quantity.Damping], UnitTable.QuantitiesOf("kN·s/m"));
        Assert.Empty(UnitTable.QuantitiesOf("furlong"));
        Assert.Null(UnitTable.FactorToSi(Quantity.Stiffness, "kg"));
    }

    [Fact]
    public void FormatSi_UsesInvariantCultureUnderADecimalCommaCulture()
    {
        using var scope = new CultureScope("de-DE");
        Assert.Equal("1500 N*s/m", UnitTable.FormatSi(1500, Quantity.Damping));
        Assert.Equal("0.0254 m", UnitTable.FormatSi(0.0254, Quantity.Length));
        Assert.Equal("9.5E+07 N/m", UnitTable.FormatSi(95e6, Quantity.Stiffness));
    }

    [Fact]
    public void Describe_NamesQuantitiesInLowercaseWords()
    {
        Assert.Equal("stiffness", UnitTable.Describe(Quantity.Stiffness));
        Assert.Equal("damping coefficient", UnitTable.Describe(Quantity.Damping));
        Assert.Equal("mass-radius", UnitTable.Describe(Quantity.MassRadius));
    }
}
