using System.Globalization;
using ModalChain.Core.Units;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Units;

/// <summary>
/// Reading "number unit" texts into SI values. Exact conversion factors by definition: inch = 0.0254 m,
/// pound = 0.45359237 kg (international yard and pound, 1959), pound-force = 0.45359237 kg × 9.80665 m/s² =
/// 4.4482216152605 N, standard gravity 9.80665 m/s² (3rd CGPM, 1901); all as listed in NIST Special Publication 811
/// (2008 ed.), Appendix B (attribution from memory). Tolerances are 1e-15 relative: one rounding of the product.
/// </summary>
public class QuantityParserTests
{
    private const double Inch = 0.0254;
    private const double Pound = 0.45359237;
    private const double PoundForce = 4.4482216152605;

    private static double Si(string text, Quantity quantity)
    {
        var parsed = QuantityParser.Parse(text, quantity);
        Assert.True(parsed.Succeeded, $"'{text}' as {quantity}: {parsed.Error}");
        return parsed.Value;
    }

    private static string Error(string text, Quantity quantity)
    {
        var parsed = QuantityParser.Parse(text, quantity);
        Assert.False(parsed.Succeeded, $"'{text}' as {quantity} was accepted as {parsed.Value}");
        Assert.True(double.IsNaN(parsed.Value));
        return parsed.Error!;
    }

    // Every unit issue 2 lists (mass, stiffness, damping, length, frequency, ratio), with its SI value.
    public static TheoryData<string, Quantity, double> IssueUnits => new()
    {
        { "12 kg", Quantity.Mass, 12 },
        { "500 g", Quantity.Mass, 0.5 },
        { "2.5 t", Quantity.Mass, 2500 },
        { "10 lb", Quantity.Mass, 10 * Pound },
        { "7 N/m", Quantity.Stiffness, 7 },
        { "3 kN/m", Quantity.Stiffness, 3e3 },
        { "8.4 N/mm", Quantity.Stiffness, 8.4e3 },
        { "95 kN/mm", Quantity.Stiffness, 95e6 },
        { "2 MN/m", Quantity.Stiffness, 2e6 },
        { "1 lbf/in", Quantity.Stiffness, PoundForce / Inch },
        { "250 lbf/in", Quantity.Stiffness, 250 * PoundForce / Inch },
        { "40 N*s/m", Quantity.Damping, 40 },
        { "40 N·s/m", Quantity.Damping, 40 },
        { "40 Ns/m", Quantity.Damping, 40 },
        { "1.5 kN*s/m", Quantity.Damping, 1.5e3 },
        { "3 m", Quantity.Length, 3 },
        { "250 mm", Quantity.Length, 0.25 },
        { "12 in", Quantity.Length, 12 * Inch },
        { "50 Hz", Quantity.Frequency, 50 },
        { "1480 rpm", Quantity.Frequency, 1480.0 / 60 },
        { "100 rad/s", Quantity.Frequency, 100 / (2 * Math.PI) },
        { "5 %", Quantity.Ratio, 0.05 },
        { "0.05", Quantity.Ratio, 0.05 },
    };

    [Theory]
    [MemberData(nameof(IssueUnits))]
    public void EveryUnitListedInIssue2_ConvertsToSi(string text, Quantity quantity, double expected)
    {
        NumericAssert.Close(expected, Si(text, quantity), Tolerance.Rel(1e-15), text);
    }

    // The further units of the table (force, time, angle, velocity, acceleration, mass-radius and extra spellings).
    public static TheoryData<string, Quantity, double> FurtherUnits => new()
    {
        { "2 kNs/m", Quantity.Damping, 2e3 },
        { "2 N*s/mm", Quantity.Damping, 2e3 },
        { "2 lbf*s/in", Quantity.Damping, 2 * PoundForce / Inch },
        { "4 cm", Quantity.Length, 0.04 },
        { "4 um", Quantity.Length, 4e-6 },
        { "4 µm", Quantity.Length, 4e-6 },
        { "900 cpm", Quantity.Frequency, 15 },
        { "3 N", Quantity.Force, 3 },
        { "3 kN", Quantity.Force, 3e3 },
        { "3 MN", Quantity.Force, 3e6 },
        { "3 lbf", Quantity.Force, 3 * PoundForce },
        { "2 s", Quantity.Time, 2 },
        { "2 ms", Quantity.Time, 2e-3 },
        { "2 min", Quantity.Time, 120 },
        { "1 rad", Quantity.Angle, 1 },
        { "90 deg", Quantity.Angle, Math.PI / 2 },
        { "90 °", Quantity.Angle, Math.PI / 2 },
        { "2 m/s", Quantity.Velocity, 2 },
        { "2 mm/s", Quantity.Velocity, 2e-3 },
        { "2 um/s", Quantity.Velocity, 2e-6 },
        { "2 µm/s", Quantity.Velocity, 2e-6 },
        { "2 in/s", Quantity.Velocity, 2 * Inch },
        { "2 m/s^2", Quantity.Acceleration, 2 },
        { "2 m/s²", Quantity.Acceleration, 2 },
        { "2 mm/s^2", Quantity.Acceleration, 2e-3 },
        { "0.5 g", Quantity.Acceleration, 0.5 * 9.80665 },
        { "2 in/s^2", Quantity.Acceleration, 2 * Inch },
        { "3 kg*m", Quantity.MassRadius, 3 },
        { "300 g*mm", Quantity.MassRadius, 3e-4 },
        { "3 g*m", Quantity.MassRadius, 3e-3 },
        { "3 g*cm", Quantity.MassRadius, 3e-5 },
        { "3 kg*mm", Quantity.MassRadius, 3e-3 },
        { "3 oz*in", Quantity.MassRadius, 3 * Pound / 16 * Inch },
    };

    [Theory]
    [MemberData(nameof(FurtherUnits))]
    public void EveryFurtherUnitOfTheTable_ConvertsToSi(string text, Quantity quantity, double expected)
    {
        NumericAssert.Close(expected, Si(text, quantity), Tolerance.Rel(1e-15), text);
    }

    [Fact]
    public void PoundForcePerInch_Is175Point126835NewtonsPerMetre()
    {
        // 4.4482216152605 / 0.0254 = 175.126835246476... N/m exactly (NIST SP 811 factors; attribution from memory).
        NumericAssert.Close(175.12683524647638, Si("1 lbf/in", Quantity.Stiffness), Tolerance.Rel(1e-15), "lbf/in");
        NumericAssert.Close(Pound * 9.80665, Si("1 lbf", Quantity.Force), Tolerance.Rel(1e-15), "lbf = lb × g_n");
    }

    [Theory]
    [InlineData("12", Quantity.Mass, 12)]
    [InlineData("95000000", Quantity.Stiffness, 95e6)]
    [InlineData("1.5e3", Quantity.Damping, 1.5e3)]
    [InlineData("-0.25", Quantity.Length, -0.25)]
    [InlineData("+4.2E-1", Quantity.Frequency, 0.42)]
    [InlineData(".5", Quantity.Mass, 0.5)]
    [InlineData("5.", Quantity.Mass, 5)]
    public void BareNumbers_AreTakenAsSi(string text, Quantity quantity, double expected)
    {
        NumericAssert.Close(expected, Si(text, quantity), Tolerance.Rel(1e-15), text);
    }

    [Theory]
    [InlineData("95kN/mm", Quantity.Stiffness, 95e6)]
    [InlineData("  95 kN/mm  ", Quantity.Stiffness, 95e6)]
    [InlineData("95   kN/mm", Quantity.Stiffness, 95e6)]
    [InlineData("1.5 kN·s/m", Quantity.Damping, 1.5e3)]
    [InlineData("1.5 kN⋅s/m", Quantity.Damping, 1.5e3)]
    [InlineData("1.5 kN s/m", Quantity.Damping, 1.5e3)]
    [InlineData("1.5 N s/m", Quantity.Damping, 1.5)]
    [InlineData("1.5kN*s/m", Quantity.Damping, 1.5e3)]
    [InlineData("2%", Quantity.Ratio, 0.02)]
    [InlineData("1e3kg", Quantity.Mass, 1e3)]
    public void SpacingVariants_ReadTheSame(string text, Quantity quantity, double expected)
    {
        NumericAssert.Close(expected, Si(text, quantity), Tolerance.Rel(1e-15), text);
    }

    [Fact]
    public void UnitOfAnotherQuantity_IsNamedInTheMessage()
    {
        var message = Error("3 kg", Quantity.Stiffness);
        Assert.Contains("'kg' is a unit of mass", message);
        Assert.Contains("stiffness is expected", message);
        Assert.Contains("kN/mm", message);
        Assert.Contains("is a unit of length", Error("2 mm", Quantity.Stiffness));
        Assert.Contains("is a unit of stiffness", Error("2 kN/m", Quantity.Damping));
        Assert.Contains("is a unit of frequency", Error("1480 rpm", Quantity.Time));
        Assert.Contains("is a unit of frequency", Error("3 Hz", Quantity.Ratio));
    }

    [Theory]
    [InlineData("3 furlongs", Quantity.Length, "furlongs")]
    [InlineData("3 KG", Quantity.Mass, "KG")]
    [InlineData("3 mn/m", Quantity.Stiffness, "mn/m")]
    [InlineData("3 kN per m", Quantity.Stiffness, "kN per m")]
    public void UnknownUnit_IsRejectedWithTheAcceptedList(string text, Quantity quantity, string unit)
    {
        // Symbols are case-sensitive (MN is mega, mN would be milli): "KG" and "mn/m" are not guessed at.
        var message = Error(text, quantity);
        Assert.Contains($"unknown unit '{unit}'", message);
        Assert.Contains("accepted units:", message);
    }

    [Theory]
    [InlineData("NaN")]
    [InlineData("nan kg")]
    [InlineData(".nan")]
    [InlineData("inf")]
    [InlineData("-inf N/m")]
    [InlineData("Infinity")]
    [InlineData("-Infinity kg")]
    [InlineData(".inf")]
    [InlineData("-.inf")]
    [InlineData("∞")]
    [InlineData("-∞")]
    [InlineData("1e999")]
    [InlineData("-1e400 kg")]
    public void NonFiniteNumbers_AreRejected(string text)
    {
        Assert.Contains("not a finite number", Error(text, Quantity.Mass));
    }

    [Fact]
    public void ValueThatOverflowsInSi_IsRejected()
    {
        Assert.Contains("too large", Error("1e305 MN/m", Quantity.Stiffness));
    }

    [Theory]
    [InlineData("", "found nothing")]
    [InlineData("   ", "found nothing")]
    [InlineData("kg", "not a number with a unit")]
    [InlineData("heavy", "not a number with a unit")]
    [InlineData("-", "not a number with a unit")]
    public void TextWithoutANumber_IsRejected(string text, string expected)
    {
        Assert.Contains(expected, Error(text, Quantity.Mass));
    }

    [Fact]
    public void Parsing_IsUnaffectedByADecimalCommaCulture()
    {
        using var scope = new CultureScope("de-DE");
        Assert.Equal(",", CultureInfo.CurrentCulture.NumberFormat.NumberDecimalSeparator);
        NumericAssert.Close(1.5e3, Si("1.5 kN*s/m", Quantity.Damping), Tolerance.Rel(1e-15), "1.5 kN*s/m under de-DE");
        NumericAssert.Close(8.4e6, Si("8.4 kN/mm", Quantity.Stiffness), Tolerance.Rel(1e-15), "8.4 kN/mm under de-DE");
        NumericAssert.Close(0.025, Si("2.5 %", Quantity.Ratio), Tolerance.Rel(1e-15), "2.5 % under de-DE");
        NumericAssert.Close(2.5e-3, Si("2.5e-3", Quantity.Length), Tolerance.Rel(1e-15), "2.5e-3 under de-DE");
        // A decimal comma is never read as a decimal point, nor as a thousands separator.
        Error("1,5 kg", Quantity.Mass);
        Error("1,5", Quantity.Mass);
        Error("1.500,5 kg", Quantity.Mass);
    }
}
