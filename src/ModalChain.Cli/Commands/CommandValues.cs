using System.Globalization;
using ModalChain.Core.Units;

namespace ModalChain.Cli.Commands;

/// <summary>A value given on the command line with its unit, read into SI, remembering the unit for display.</summary>
/// <param name="Si">The value in SI.</param>
/// <param name="Unit">The unit symbol the user wrote (the SI symbol for a bare number).</param>
/// <param name="Factor">Factor from that unit to SI.</param>
internal readonly record struct CommandValue(double Si, string Unit, double Factor)
{
    /// <summary>Formats an SI value in the user's unit.</summary>
    public string Show(double si, string format = "G6") =>
        (si / Factor).ToString(format, CultureInfo.InvariantCulture) + " " + Unit;

    /// <summary>Reads <paramref name="text"/> as <paramref name="quantity"/>; on failure writes a message naming <paramref name="option"/>.</summary>
    public static CommandValue? Parse(string? text, Quantity quantity, string option, Streams io)
    {
        if (text is null) return null;
        var parsed = QuantityParser.Parse(text, quantity);
        if (!parsed.Succeeded)
        {
            io.Error.WriteLine($"modalchain: error: {option} '{text}': {parsed.Error}");
            return null;
        }
        var trimmed = text.Trim();
        var i = 0;
        while (i < trimmed.Length && (char.IsAsciiDigit(trimmed[i]) || trimmed[i] is '.' or '+' or '-' or 'e' or 'E')) i++;
        var unit = trimmed[i..].Trim();
        if (unit.Length == 0 || UnitTable.FactorToSi(quantity, unit) is not { } factor)
            return new CommandValue(parsed.Value, UnitTable.SiSymbol(quantity), 1);
        return new CommandValue(parsed.Value, unit, factor);
    }
}
