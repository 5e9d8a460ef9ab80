using System.Globalization;

namespace ModalChain.Core.Units;

/// <summary>Outcome of reading one value with its unit: the SI value, or a sentence saying what is wrong.</summary>
/// <param name="Value">The value in SI units when <see cref="Error"/> is null.</param>
/// <param name="Error">A message a user can act on, or null on success.</param>
/// <param name="Unit">The unit written, in the unit table's spelling ("kN/mm", "N*s/m"), or null for a bare number (read in SI) or a failure.</param>
public readonly record struct ParsedQuantity(double Value, string? Error, string? Unit = null)
{
    /// <summary>True when the text was read.</summary>
    public bool Succeeded => Error is null;
}

/// <summary>Reads texts such as "95 kN/mm", "1.5 kN*s/m", "2 %" or "1480 rpm" into SI values.</summary>
/// <remarks>A bare number is taken as already being in SI units. Numbers use invariant culture ("1.5", never "1,5").</remarks>
public static class QuantityParser
{
    /// <summary>Parses <paramref name="text"/> as a value of <paramref name="quantity"/>.</summary>
    public static ParsedQuantity Parse(string text, Quantity quantity)
    {
        ArgumentNullException.ThrowIfNull(text);
        var trimmed = text.Trim();
        if (trimmed.Length == 0) return Fail($"expected a {UnitTable.Describe(quantity)} value, found nothing");

        if (IsNonFiniteWord(trimmed))
            return Fail($"'{trimmed}' is not a finite number");
        var split = NumberLength(trimmed);
        if (split == 0)
            return Fail($"'{trimmed}' is not a number with a unit; write e.g. '{Example(quantity)}'");
        var numberText = trimmed[..split];
        var unitText = trimmed[split..].Trim();
        if (!double.TryParse(numberText, NumberStyles.Float, CultureInfo.InvariantCulture, out var number))
            return Fail($"'{numberText}' is not a number");
        if (!double.IsFinite(number))
            return Fail($"'{trimmed}' is not a finite number");

        if (unitText.Length == 0) return new ParsedQuantity(number, null);

        var factor = UnitTable.FactorToSi(quantity, unitText);
        if (factor is { } f)
        {
            var si = number * f;
            return double.IsFinite(si) ? new ParsedQuantity(si, null, UnitTable.Canonical(quantity, unitText)) : Fail($"'{trimmed}' is too large to represent");
        }

        var others = UnitTable.QuantitiesOf(unitText);
        var accepted = string.Join(", ", UnitTable.Symbols(quantity));
        if (others.Count > 0)
            return Fail($"'{unitText}' is a unit of {UnitTable.Describe(others[0])}, but a {UnitTable.Describe(quantity)} is expected here (accepted units: {accepted})");
        return Fail($"unknown unit '{unitText}' for a {UnitTable.Describe(quantity)} (accepted units: {accepted})");
    }

    private static ParsedQuantity Fail(string message) => new(double.NaN, message);

    private static string Example(Quantity quantity) =>
        quantity == Quantity.Ratio ? "2 %" : "12 " + UnitTable.Symbols(quantity)[0];

    private static bool IsNonFiniteWord(string s)
    {
        var word = s.TrimStart('+', '-', '.').Split(' ')[0];
        return word.Equals("nan", StringComparison.OrdinalIgnoreCase)
            || word.Equals("inf", StringComparison.OrdinalIgnoreCase)
            || word.Equals("infinity", StringComparison.OrdinalIgnoreCase)
            || word.StartsWith('∞');
    }

    // Length of the leading numeric literal: sign, digits, decimal point, exponent.
    private static int NumberLength(string s)
    {
        var i = 0;
        if (i < s.Length && (s[i] == '+' || s[i] == '-')) i++;
        var digits = 0;
        while (i < s.Length && char.IsAsciiDigit(s[i])) { i++; digits++; }
        if (i < s.Length && s[i] == '.') { i++; while (i < s.Length && char.IsAsciiDigit(s[i])) { i++; digits++; } }
        if (digits == 0) return 0;
        if (i < s.Length && (s[i] == 'e' || s[i] == 'E'))
        {
            var j = i + 1;
            if (j < s.Length && (s[j] == '+' || s[j] == '-')) j++;
            var expDigits = 0;
            while (j < s.Length && char.IsAsciiDigit(s[j])) { j++; expDigits++; }
            if (expDigits > 0) i = j;
        }
        return i;
    }
}
