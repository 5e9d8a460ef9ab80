using System.Globalization;
using ModalChain.Core.Units;

namespace ModalChain.Reports.Units;

/// <summary>Formats SI values for display in the chosen <see cref="UnitSystem"/>, always in invariant culture.</summary>
/// <remarks>Conversion factors come from <see cref="UnitTable"/>, so the report and the model reader agree on them.</remarks>
public sealed class DisplayUnits
{
    private readonly (string Symbol, double Factor) _mass;
    private readonly (string Symbol, double Factor) _stiffness;
    private readonly (string Symbol, double Factor) _damping;
    private readonly (string Symbol, double Factor) _length;

    /// <summary>Creates a formatter for <paramref name="system"/>.</summary>
    public DisplayUnits(UnitSystem system)
    {
        System = system;
        var imperial = system == UnitSystem.Imperial;
        _mass = Unit(Quantity.Mass, imperial ? "lb" : "kg");
        _stiffness = Unit(Quantity.Stiffness, imperial ? "lbf/in" : "kN/m");
        _damping = Unit(Quantity.Damping, imperial ? "lbf*s/in" : "N*s/m");
        _length = Unit(Quantity.Length, imperial ? "in" : "m");
    }

    /// <summary>The unit system shown.</summary>
    public UnitSystem System { get; }

    /// <summary>Symbol of mass as printed ("kg" or "lb").</summary>
    public string MassSymbol => _mass.Symbol;

    /// <summary>Symbol of stiffness as printed ("kN/m" or "lbf/in").</summary>
    public string StiffnessSymbol => _stiffness.Symbol;

    /// <summary>Symbol of the damping coefficient as printed ("N·s/m" or "lbf·s/in").</summary>
    public string DampingSymbol => _damping.Symbol;

    /// <summary>Symbol of drawing length as printed ("m" or "in").</summary>
    public string LengthSymbol => _length.Symbol;

    /// <summary>A mass given in kg, as a number in the display unit.</summary>
    /// <param name="kilograms">Mass in kg.</param>
    /// <param name="given">True for a value the user wrote (shown to six digits without padding zeros), false for a result (four significant digits).</param>
    public string Mass(double kilograms, bool given = false) => Format(kilograms / _mass.Factor, given);

    /// <summary>A stiffness given in N/m, as a number in the display unit.</summary>
    public string Stiffness(double newtonsPerMetre, bool given = false) => Format(newtonsPerMetre / _stiffness.Factor, given);

    /// <summary>A damping coefficient given in N·s/m, as a number in the display unit.</summary>
    public string Damping(double newtonSecondsPerMetre, bool given = false) => Format(newtonSecondsPerMetre / _damping.Factor, given);

    /// <summary>A drawing length given in m, as a number in the display unit.</summary>
    public string Length(double metres, bool given = false) => Format(metres / _length.Factor, given);

    /// <summary>A value the user wrote, to six significant digits without padding zeros ("850", "1.2", "95000").</summary>
    public static string Given(double value) =>
        double.IsFinite(value) ? value.ToString("G6", CultureInfo.InvariantCulture) : Number(value);

    private static string Format(double value, bool given) => given ? Given(value) : Number(value);

    /// <summary>A number with four significant digits, without exponent for ordinary magnitudes.</summary>
    public static string Number(double value, int digits = 4)
    {
        if (!double.IsFinite(value)) return double.IsPositiveInfinity(value) ? "∞" : "—";
        if (value == 0) return "0";
        var magnitude = Math.Abs(value);
        if (magnitude >= 1e-3 && magnitude < 1e7)
        {
            var exponent = (int)Math.Floor(Math.Log10(magnitude));
            // 999.96 rounds to 1000.0 at four digits: count the digits of the rounded value, not of the input.
            if (Math.Abs(Math.Round(value, Math.Max(0, digits - 1 - exponent))) >= Math.Pow(10, exponent + 1)) exponent++;
            var decimals = Math.Max(0, digits - 1 - exponent);
            return Math.Round(value, decimals).ToString("F" + decimals, CultureInfo.InvariantCulture);
        }
        return value.ToString("G" + digits, CultureInfo.InvariantCulture);
    }

    /// <summary>A fraction (0.123) as a percentage with one decimal ("12.3").</summary>
    public static string Percent(double fraction) =>
        double.IsFinite(fraction) ? (100 * fraction).ToString("F1", CultureInfo.InvariantCulture) : "—";

    private static (string, double) Unit(Quantity quantity, string symbol)
    {
        var factor = UnitTable.FactorToSi(quantity, symbol)
            ?? throw new InvalidOperationException($"'{symbol}' is not a unit of {quantity} in the unit table.");
        return (symbol.Replace("*", "·"), factor);
    }
}
