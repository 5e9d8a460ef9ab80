using System.Collections.Frozen;
using System.Globalization;

namespace ModalChain.Core.Units;

/// <summary>The unit symbols a model file may use, with their factors to SI.</summary>
/// <remarks>
/// Conversion factors are exact by definition where one exists (inch = 0.0254 m, pound = 0.45359237 kg,
/// standard gravity g = 9.80665 m/s², pound-force = 4.4482216152605 N).
/// Symbols are matched case-sensitively after normalising "·", "⋅" and spaces inside compound units to "*",
/// "²" to "^2", and "per" spellings are not accepted: the trade's written forms are.
/// </remarks>
public static class UnitTable
{
    private const double Inch = 0.0254;
    private const double Pound = 0.45359237;
    private const double PoundForce = 4.4482216152605;
    private const double StandardGravity = 9.80665;

    private static readonly FrozenDictionary<Quantity, (string Symbol, double Factor)[]> Table =
        new Dictionary<Quantity, (string, double)[]>
        {
            [Quantity.Mass] = [("kg", 1), ("g", 1e-3), ("t", 1e3), ("lb", Pound)],
            [Quantity.Stiffness] = [("N/m", 1), ("kN/m", 1e3), ("N/mm", 1e3), ("kN/mm", 1e6), ("MN/m", 1e6), ("lbf/in", PoundForce / Inch)],
            [Quantity.Damping] = [("N*s/m", 1), ("Ns/m", 1), ("kN*s/m", 1e3), ("kNs/m", 1e3), ("N*s/mm", 1e3), ("lbf*s/in", PoundForce / Inch)],
            [Quantity.Length] = [("m", 1), ("mm", 1e-3), ("cm", 1e-2), ("um", 1e-6), ("µm", 1e-6), ("in", Inch)],
            [Quantity.Frequency] = [("Hz", 1), ("rpm", 1.0 / 60), ("rad/s", 1 / (2 * Math.PI)), ("cpm", 1.0 / 60), ("kHz", 1e3), ("MHz", 1e6)],
            [Quantity.Ratio] = [("%", 0.01)],
            [Quantity.Force] = [("N", 1), ("kN", 1e3), ("MN", 1e6), ("lbf", PoundForce)],
            [Quantity.Time] = [("s", 1), ("ms", 1e-3), ("min", 60), ("us", 1e-6), ("µs", 1e-6), ("μs", 1e-6), ("ns", 1e-9)],
            [Quantity.Angle] = [("rad", 1), ("deg", Math.PI / 180), ("°", Math.PI / 180)],
            [Quantity.Velocity] = [("m/s", 1), ("mm/s", 1e-3), ("um/s", 1e-6), ("µm/s", 1e-6), ("in/s", Inch)],
            [Quantity.Acceleration] = [("m/s^2", 1), ("mm/s^2", 1e-3), ("g", StandardGravity), ("in/s^2", Inch)],
            [Quantity.MassRadius] = [("kg*m", 1), ("g*mm", 1e-6), ("g*m", 1e-3), ("g*cm", 1e-5), ("kg*mm", 1e-3), ("oz*in", Pound / 16 * Inch)],
            [Quantity.RotationalStiffness] = [("N*m/rad", 1), ("Nm/rad", 1), ("kN*m/rad", 1e3), ("kNm/rad", 1e3), ("MN*m/rad", 1e6), ("N*mm/rad", 1e-3), ("lbf*in/rad", PoundForce * Inch)],
            [Quantity.RotationalDamping] = [("N*m*s/rad", 1), ("Nms/rad", 1), ("kN*m*s/rad", 1e3), ("N*mm*s/rad", 1e-3), ("lbf*in*s/rad", PoundForce * Inch)],
            [Quantity.MomentOfInertia] = [("kg*m^2", 1), ("t*m^2", 1e3), ("kg*cm^2", 1e-4), ("kg*mm^2", 1e-6), ("lb*in^2", Pound * Inch * Inch)],
            [Quantity.Moment] = [("N*m", 1), ("Nm", 1), ("kN*m", 1e3), ("kNm", 1e3), ("N*mm", 1e-3), ("lbf*in", PoundForce * Inch), ("lbf*ft", PoundForce * 12 * Inch)],
            [Quantity.ForceFactor] = [("T*m", 1), ("N/A", 1), ("V*s/m", 1)],
            [Quantity.Resistance] = [.. Prefixed("Ω"), .. Prefixed("ohm")],
            [Quantity.Inductance] = Prefixed("H"),
            [Quantity.Capacitance] = Prefixed("F"),
            [Quantity.Voltage] = Prefixed("V"),
            [Quantity.Current] = Prefixed("A"),
        }.ToFrozenDictionary();

    /// <summary>The SI unit symbol of <paramref name="quantity"/> as the tool prints it.</summary>
    public static string SiSymbol(Quantity quantity) => quantity switch
    {
        Quantity.Mass => "kg",
        Quantity.Stiffness => "N/m",
        Quantity.Damping => "N*s/m",
        Quantity.Length => "m",
        Quantity.Frequency => "Hz",
        Quantity.Ratio => "1",
        Quantity.Force => "N",
        Quantity.Time => "s",
        Quantity.Angle => "rad",
        Quantity.Velocity => "m/s",
        Quantity.Acceleration => "m/s^2",
        Quantity.MassRadius => "kg*m",
        Quantity.RotationalStiffness => "N*m/rad",
        Quantity.RotationalDamping => "N*m*s/rad",
        Quantity.MomentOfInertia => "kg*m^2",
        Quantity.Moment => "N*m",
        Quantity.ForceFactor => "T*m",
        Quantity.Resistance => "Ω",
        Quantity.Inductance => "H",
        Quantity.Capacitance => "F",
        Quantity.Voltage => "V",
        Quantity.Current => "A",
        _ => throw new ArgumentOutOfRangeException(nameof(quantity), quantity, null),
    };

    // The electrical units with the SI prefixes an engineer writes on a schematic: p n u/µ/μ m (none) k M G. The unit
    // alone comes first, so it is the one messages offer as an example. Ω may be typed as the ohm sign U+2126 as well.
    private static (string, double)[] Prefixed(string unit) =>
    [
        (unit, 1), ("p" + unit, 1e-12), ("n" + unit, 1e-9), ("u" + unit, 1e-6), ("µ" + unit, 1e-6), ("μ" + unit, 1e-6),
        ("m" + unit, 1e-3), ("k" + unit, 1e3), ("M" + unit, 1e6), ("G" + unit, 1e9),
    ];

    /// <summary>Lowercase name of the quantity as written in messages ("stiffness", "mass-radius").</summary>
    public static string Describe(Quantity quantity) => quantity switch
    {
        Quantity.MassRadius => "mass-radius",
        Quantity.Damping => "damping coefficient",
        Quantity.RotationalStiffness => "rotational stiffness",
        Quantity.RotationalDamping => "rotational damping coefficient",
        Quantity.MomentOfInertia => "moment of inertia",
        Quantity.ForceFactor => "force factor",
        _ => quantity.ToString().ToLowerInvariant(),
    };

    /// <summary>Accepted symbols for <paramref name="quantity"/>, in the order documented.</summary>
    public static IReadOnlyList<string> Symbols(Quantity quantity) => [.. Table[quantity].Select(u => u.Symbol)];

    /// <summary>Factor that turns a value in <paramref name="symbol"/> into SI, or null when the symbol is not a unit of <paramref name="quantity"/>.</summary>
    public static double? FactorToSi(Quantity quantity, string symbol)
    {
        var s = Normalise(symbol);
        foreach (var (sym, factor) in Table[quantity])
            if (sym == s) return factor;
        return null;
    }

    /// <summary>The table's spelling of <paramref name="symbol"/> as a unit of <paramref name="quantity"/> ("kN s/m" gives "kN*s/m"), or null when it is not one.</summary>
    public static string? Canonical(Quantity quantity, string symbol)
    {
        var s = Normalise(symbol);
        foreach (var (sym, _) in Table[quantity])
            if (sym == s) return sym;
        return null;
    }

    /// <summary>The quantities for which <paramref name="symbol"/> is a unit (used to say "kg is a unit of mass").</summary>
    public static IReadOnlyList<Quantity> QuantitiesOf(string symbol)
    {
        var s = Normalise(symbol);
        return [.. Table.Where(kv => kv.Value.Any(u => u.Symbol == s)).Select(kv => kv.Key).Order()];
    }

    /// <summary>Formats <paramref name="siValue"/> in the SI unit with invariant culture, e.g. "12.5 kN/m" is never produced: always "12500 N/m".</summary>
    public static string FormatSi(double siValue, Quantity quantity) =>
        siValue.ToString("G6", CultureInfo.InvariantCulture) + " " + SiSymbol(quantity);

    internal static string Normalise(string symbol)
    {
        var s = symbol.Trim()
            .Replace('·', '*').Replace('⋅', '*').Replace('×', '*')
            .Replace("²", "^2").Replace("**2", "^2").Replace('\u2126', 'Ω');
        // "kN s/m" and "N s/m" are common handwritten forms of a product.
        s = string.Join('*', s.Split(' ', StringSplitOptions.RemoveEmptyEntries));
        return s;
    }
}
