using System.Globalization;
using ModalChain.Core.Units;

namespace ModalChain.Reports.Units;

/// <summary>One unit a kind of value is shown in: its symbols and how many SI units one of it is.</summary>
/// <param name="Symbol">The symbol as typeset in reports and charts ("m/s²", "N·s/m", "µm/s").</param>
/// <param name="Plain">The same symbol in plain text for terminals ("m/s^2", "N*s/m", "um/s").</param>
/// <param name="Factor">SI units per display unit (0.0254 for inches).</param>
public sealed record DisplayUnit(string Symbol, string Plain, double Factor)
{
    /// <summary>An SI value as a number in this unit.</summary>
    public double From(double si) => si / Factor;

    /// <summary>An SI value as a number in this unit, four significant digits (see <see cref="DisplayUnits.Number"/>).</summary>
    public string Format(double si) => DisplayUnits.Number(si / Factor);
}

/// <summary>Formats SI values for display in the chosen <see cref="UnitSystem"/>, always in invariant culture.</summary>
/// <remarks>
/// Conversion factors come from <see cref="UnitTable"/> where the unit is one a model may be written in, so the
/// displays and the model reader agree on them; the few display-only units (µin/s, in·lbf, in/kip) use the same exact
/// definitions (inch = 0.0254 m, pound-force = 4.4482216152605 N). Mass, stiffness and damping coefficient are shown
/// in the unit the model file writes them in (<see cref="Io.Model.ModelDocument.WrittenUnits"/>) when that unit belongs
/// to the chosen system, so a model written in kN/mm reads back in kN/mm.
/// </remarks>
public sealed class DisplayUnits
{
    private const double Inch = 0.0254;
    private const double PoundForce = 4.4482216152605;

    private static readonly HashSet<string> ImperialSymbols = ["lb", "lbf/in", "lbf*s/in", "in", "oz*in", "in/s", "in/s^2", "lbf"];

    /// <summary>Creates a formatter for <paramref name="system"/>.</summary>
    /// <param name="system">The unit system shown.</param>
    /// <param name="written">The units the model writes mass, stiffness and damping coefficient in (each used when it belongs to <paramref name="system"/>); null for the system's defaults.</param>
    public DisplayUnits(UnitSystem system, IReadOnlyDictionary<Quantity, string>? written = null)
    {
        System = system;
        var imperial = system == UnitSystem.Imperial;
        string Chosen(Quantity q, string fallback) =>
            written is not null && written.TryGetValue(q, out var w) && ImperialSymbols.Contains(w) == imperial ? w : fallback;
        MassUnit = Table(Quantity.Mass, Chosen(Quantity.Mass, imperial ? "lb" : "kg"));
        StiffnessUnit = Table(Quantity.Stiffness, Chosen(Quantity.Stiffness, imperial ? "lbf/in" : "kN/m"));
        DampingUnit = Table(Quantity.Damping, Chosen(Quantity.Damping, imperial ? "lbf*s/in" : "N*s/m"));
        LengthUnit = Table(Quantity.Length, imperial ? "in" : "m");
        Displacement = Table(Quantity.Length, imperial ? "in" : "mm");
        Velocity = Table(Quantity.Velocity, imperial ? "in/s" : "mm/s");
        FloorVelocity = imperial ? new DisplayUnit("µin/s", "uin/s", Inch * 1e-6) : Table(Quantity.Velocity, "µm/s") with { Plain = "um/s" };
        Acceleration = Table(Quantity.Acceleration, imperial ? "in/s^2" : "m/s^2");
        Force = Table(Quantity.Force, imperial ? "lbf" : "N");
        MassRadius = Table(Quantity.MassRadius, imperial ? "oz*in" : "kg*m");
        Energy = imperial ? new DisplayUnit("in·lbf", "in*lbf", Inch * PoundForce) : new DisplayUnit("J", "J", 1);
        Compliance = imperial ? new DisplayUnit("in/kip", "in/kip", Inch / (1000 * PoundForce)) : new DisplayUnit("mm/kN", "mm/kN", 1e-6);
    }

    /// <summary>The unit system shown.</summary>
    public UnitSystem System { get; }

    /// <summary>The system to show a model in when none is asked for: imperial when every mass, stiffness and damping
    /// coefficient the file writes is in US customary units, SI otherwise.</summary>
    public static UnitSystem SystemOf(IReadOnlyDictionary<Quantity, string> written)
    {
        ArgumentNullException.ThrowIfNull(written);
        return written.Count > 0 && written.Values.All(ImperialSymbols.Contains) ? UnitSystem.Imperial : UnitSystem.Si;
    }

    /// <summary>Masses of elements: kg (SI) or lb, or the unit the model writes masses in.</summary>
    public DisplayUnit MassUnit { get; }

    /// <summary>Stiffness: kN/m (SI) or lbf/in, or the unit the model writes stiffness in.</summary>
    public DisplayUnit StiffnessUnit { get; }

    /// <summary>Damping coefficient: N·s/m (SI) or lbf·s/in, or the unit the model writes damping coefficients in.</summary>
    public DisplayUnit DampingUnit { get; }

    /// <summary>Drawing lengths (positions): m or in.</summary>
    public DisplayUnit LengthUnit { get; }

    /// <summary>Response displacement and absorber stroke: mm or in.</summary>
    public DisplayUnit Displacement { get; }

    /// <summary>Response velocity: mm/s or in/s.</summary>
    public DisplayUnit Velocity { get; }

    /// <summary>The small velocities of floor vibration criteria: µm/s or µin/s.</summary>
    public DisplayUnit FloorVelocity { get; }

    /// <summary>Response acceleration: m/s² or in/s².</summary>
    public DisplayUnit Acceleration { get; }

    /// <summary>Forces (loads, element forces, reactions): N or lbf.</summary>
    public DisplayUnit Force { get; }

    /// <summary>Mass-radius product of an unbalance: kg·m or oz·in.</summary>
    public DisplayUnit MassRadius { get; }

    /// <summary>Energy (the transient energy balance): J or in·lbf.</summary>
    public DisplayUnit Energy { get; }

    /// <summary>Displacement per force (absorber stroke per force): mm/kN or in/kip.</summary>
    public DisplayUnit Compliance { get; }

    /// <summary>The unit of a harmonic response quantity.</summary>
    public DisplayUnit Of(Core.Analyses.Harmonic.ResponseQuantity quantity) => quantity switch
    {
        Core.Analyses.Harmonic.ResponseQuantity.Displacement => Displacement,
        Core.Analyses.Harmonic.ResponseQuantity.Velocity => Velocity,
        _ => Acceleration,
    };

    /// <summary>Rotations of plane and 3d models: angle in mrad, angular velocity in mrad/s, angular acceleration in rad/s²
    /// (the same in every unit system).</summary>
    public static DisplayUnit AngularOf(Core.Analyses.Harmonic.ResponseQuantity quantity) => quantity switch
    {
        Core.Analyses.Harmonic.ResponseQuantity.Displacement => new DisplayUnit("mrad", "mrad", 1e-3),
        Core.Analyses.Harmonic.ResponseQuantity.Velocity => new DisplayUnit("mrad/s", "mrad/s", 1e-3),
        _ => new DisplayUnit("rad/s²", "rad/s^2", 1),
    };

    /// <summary>The unit of <paramref name="quantity"/> at a DOF that is a rotation (<paramref name="rotation"/>) or a translation.</summary>
    public DisplayUnit Of(Core.Analyses.Harmonic.ResponseQuantity quantity, bool rotation) => rotation ? AngularOf(quantity) : Of(quantity);

    /// <summary>"Rotation", "Angular velocity", "Angular acceleration" for a rotation; "Displacement", "Velocity", "Acceleration" otherwise.</summary>
    public static string Word(Core.Analyses.Harmonic.ResponseQuantity quantity, bool rotation) => !rotation ? quantity.ToString() : quantity switch
    {
        Core.Analyses.Harmonic.ResponseQuantity.Displacement => "Rotation",
        Core.Analyses.Harmonic.ResponseQuantity.Velocity => "Angular velocity",
        _ => "Angular acceleration",
    };

    /// <summary>The unit of a recorded transient quantity (motions and forces).</summary>
    public DisplayUnit Of(Core.Analyses.Transient.ResponseQuantity quantity) => quantity switch
    {
        Core.Analyses.Transient.ResponseQuantity.Displacement => Displacement,
        Core.Analyses.Transient.ResponseQuantity.Velocity => Velocity,
        Core.Analyses.Transient.ResponseQuantity.Acceleration => Acceleration,
        _ => Force,
    };

    /// <summary>The words a human-facing table uses for a recorded transient quantity ("spring force", never the JSON key "spring_force").</summary>
    public static string Words(Core.Analyses.Transient.ResponseQuantity quantity) => quantity switch
    {
        Core.Analyses.Transient.ResponseQuantity.Displacement => "displacement",
        Core.Analyses.Transient.ResponseQuantity.Velocity => "velocity",
        Core.Analyses.Transient.ResponseQuantity.Acceleration => "acceleration",
        Core.Analyses.Transient.ResponseQuantity.SpringForce => "spring force",
        Core.Analyses.Transient.ResponseQuantity.DamperForce => "damper force",
        _ => "support reaction",
    };

    /// <summary>Symbol of mass as printed ("kg" or "lb").</summary>
    public string MassSymbol => MassUnit.Symbol;

    /// <summary>Symbol of stiffness as printed ("kN/m", "lbf/in" or the model's own, e.g. "kN/mm").</summary>
    public string StiffnessSymbol => StiffnessUnit.Symbol;

    /// <summary>Symbol of the damping coefficient as printed ("N·s/m" or "lbf·s/in").</summary>
    public string DampingSymbol => DampingUnit.Symbol;

    /// <summary>Symbol of drawing length as printed ("m" or "in").</summary>
    public string LengthSymbol => LengthUnit.Symbol;

    /// <summary>A mass given in kg, as a number in the display unit.</summary>
    /// <param name="kilograms">Mass in kg.</param>
    /// <param name="given">True for a value the user wrote (shown to six digits without padding zeros), false for a result (four significant digits).</param>
    public string Mass(double kilograms, bool given = false) => Format(kilograms / MassUnit.Factor, given);

    /// <summary>A stiffness given in N/m, as a number in the display unit.</summary>
    public string Stiffness(double newtonsPerMetre, bool given = false) => Format(newtonsPerMetre / StiffnessUnit.Factor, given);

    /// <summary>A damping coefficient given in N·s/m, as a number in the display unit.</summary>
    public string Damping(double newtonSecondsPerMetre, bool given = false) => Format(newtonSecondsPerMetre / DampingUnit.Factor, given);

    /// <summary>A drawing length given in m, as a number in the display unit.</summary>
    public string Length(double metres, bool given = false) => Format(metres / LengthUnit.Factor, given);

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

    private static DisplayUnit Table(Quantity quantity, string symbol)
    {
        var factor = UnitTable.FactorToSi(quantity, symbol)
            ?? throw new InvalidOperationException($"'{symbol}' is not a unit of {quantity} in the unit table.");
        return new DisplayUnit(symbol.Replace("*", "·").Replace("^2", "²"), symbol, factor);
    }
}
