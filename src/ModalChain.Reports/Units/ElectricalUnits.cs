namespace ModalChain.Reports.Units;

/// <summary>Electrical values written the way a schematic writes them: a number and an SI-prefixed unit ("2.2 Ω", "470 µH", "22 µF").</summary>
/// <remarks>
/// The prefixes are those the model reader accepts for electrical units (<see cref="Core.Units.UnitTable"/>: p n µ m k M G),
/// so a value printed here can be typed back into a model file (with "u" for µ and "ohm" for Ω where the keyboard lacks them).
/// The number keeps <see cref="DisplayUnits.Number"/>'s four significant digits.
/// </remarks>
public static class ElectricalUnits
{
    /// <summary>Resistance and impedance.</summary>
    public const string Ohm = "Ω";

    /// <summary>Inductance.</summary>
    public const string Henry = "H";

    /// <summary>Capacitance.</summary>
    public const string Farad = "F";

    /// <summary>Voltage.</summary>
    public const string Volt = "V";

    /// <summary>Current.</summary>
    public const string Ampere = "A";

    /// <summary>Time.</summary>
    public const string Second = "s";

    private static readonly (string Prefix, double Factor)[] Prefixes =
    [
        ("G", 1e9), ("M", 1e6), ("k", 1e3), ("", 1), ("m", 1e-3), ("µ", 1e-6), ("n", 1e-9), ("p", 1e-12),
    ];

    /// <summary>The prefix and its factor for <paramref name="si"/>: the largest whose scaled value is at least 1 (p below 1 pico-unit, G above 999 giga-units).</summary>
    public static (string Prefix, double Factor) PrefixOf(double si)
    {
        var magnitude = Math.Abs(si);
        if (!double.IsFinite(magnitude) || magnitude == 0) return ("", 1);
        foreach (var (prefix, factor) in Prefixes)
        {
            // 999.96 m rounds to 1000 at four digits: take the next prefix up when the rounded value reaches 1000.
            if (magnitude >= factor * (1 - 5e-5)) return (prefix, factor);
        }
        return Prefixes[^1];
    }

    /// <summary>"<paramref name="si"/> in <paramref name="unit"/>" with an SI prefix, e.g. Format(4.7e-4, "H") is "470.0 µH"; "—" for a value that is not finite.</summary>
    /// <param name="si">The value in the unprefixed SI unit.</param>
    /// <param name="unit">The unit's symbol (<see cref="Ohm"/>, <see cref="Henry"/>, ...).</param>
    /// <param name="given">True for a value the user wrote: up to six significant digits without padding zeros ("470 µH", <see cref="DisplayUnits.Given"/>); false for a computed one, four significant digits.</param>
    public static string Format(double si, string unit, bool given = false)
    {
        ArgumentNullException.ThrowIfNull(unit);
        if (!double.IsFinite(si)) return DisplayUnits.Number(si);
        var (prefix, factor) = PrefixOf(si);
        // A given value is rounded to 9 decimals in its prefixed unit first (at least 10 significant digits), so 470e-6 / 1e-6 prints 470, not 469.99999999999994.
        return (given ? DisplayUnits.Given(Math.Round(si / factor, 9)) : DisplayUnits.Number(si / factor)) + " " + prefix + unit;
    }
}
