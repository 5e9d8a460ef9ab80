using System.CommandLine;
using System.CommandLine.Parsing;
using System.Globalization;
using ModalChain.Core.Units;

namespace ModalChain.Cli.Commands;

/// <summary>A value given on the command line with its unit, read into SI, remembering the unit for display.</summary>
/// <param name="Si">The value in SI.</param>
/// <param name="Unit">The unit symbol the user wrote (the SI symbol for a bare number).</param>
/// <param name="Factor">Factor from that unit to SI.</param>
/// <param name="Bare">True when the user wrote a number without a unit, which is read in the SI unit.</param>
internal sealed record CommandValue(double Si, string Unit, double Factor, bool Bare = false)
{
    /// <summary>Formats an SI value in the user's unit.</summary>
    public string Show(double si, string format = "G6") =>
        (si / Factor).ToString(format, CultureInfo.InvariantCulture) + " " + Unit;
}

/// <summary>Which values a numeric option admits besides being finite.</summary>
internal enum ValueBound
{
    Any,
    NonNegative,
    Positive,
}

/// <summary>
/// The one rule for values on the command line, used by every command: a number is written with '.' as the decimal
/// point whatever the machine's language, optionally followed by a unit of the option's kind ("30.5", "30.5 Hz",
/// "1480 rpm"); a bare number is in the SI unit the option's help states; a unit of another kind is an input error
/// (exit 2) that names the kind expected. Counts are whole numbers; choices are words, matched ignoring case.
/// </summary>
/// <remarks>
/// Units and numbers are read by <see cref="QuantityParser"/>, the same reader as the model file's, so the command line
/// and the file accept the same spellings. The options parse while the command line is parsed, so a wrong value stops
/// the program before any model is read.
/// </remarks>
internal static class CommandValues
{
    /// <summary>An option holding a <paramref name="quantity"/>; its help states the accepted units and the unit of a bare number.</summary>
    /// <param name="name">The option's name, e.g. "--from".</param>
    /// <param name="quantity">The kind of value (frequency, time, ratio, …).</param>
    /// <param name="description">What the value is, one sentence; the unit rule is appended.</param>
    /// <param name="bound">Which finite values are admitted.</param>
    public static Option<CommandValue?> Quantity(string name, Quantity quantity, string description, ValueBound bound = ValueBound.Any)
    {
        var option = new Option<CommandValue?>(name)
        {
            Description = description + " " + UnitRule(quantity),
            HelpName = UnitTable.Describe(quantity).Replace(' ', '-'),
        };
        option.CustomParser = r =>
        {
            if (r.Tokens.Count == 0) return null;
            var text = string.Join(' ', r.Tokens.Select(t => t.Value));
            var value = Read(text, quantity, name, bound, out var error);
            if (value is null) r.AddError(error!);
            return value;
        };
        return option;
    }

    /// <summary>The sentence every quantity option's help ends with: which units it takes and what a bare number means.</summary>
    public static string UnitRule(Quantity quantity) => quantity == Core.Units.Quantity.Ratio
        ? "A number with an optional '%': a bare number is a fraction (0.05 is 5 %)."
        : $"A number with an optional unit ({string.Join(", ", UnitTable.Symbols(quantity))}); a bare number is in {UnitTable.SiSymbol(quantity)}.";

    /// <summary>Reads <paramref name="text"/> as <paramref name="quantity"/>, or returns null with a message naming <paramref name="option"/>.</summary>
    /// <remarks>The option factories use this while parsing; a command whose quantity depends on another option (study --from) calls it itself.</remarks>
    public static CommandValue? Read(string text, Quantity quantity, string option, ValueBound bound, out string? error)
    {
        var parsed = QuantityParser.Parse(text, quantity);
        if (!parsed.Succeeded)
        {
            error = $"{option} '{text}': {parsed.Error}";
            return null;
        }
        var admitted = bound switch
        {
            ValueBound.Positive => parsed.Value > 0,
            ValueBound.NonNegative => parsed.Value >= 0,
            _ => true,
        };
        if (!admitted)
        {
            error = $"{option} '{text}': must be {(bound == ValueBound.Positive ? "positive" : "zero or positive")} (a {UnitTable.Describe(quantity)})";
            return null;
        }
        error = null;
        var unit = UnitText(text);
        if (unit.Length == 0) return new CommandValue(parsed.Value, UnitTable.SiSymbol(quantity), 1, Bare: true);
        return UnitTable.FactorToSi(quantity, unit) is { } factor
            ? new CommandValue(parsed.Value, unit, factor)
            : new CommandValue(parsed.Value, UnitTable.SiSymbol(quantity), 1);
    }

    /// <summary>An option holding a whole number of at least <paramref name="minimum"/>; absent, it is null.</summary>
    public static Option<int?> Count(string name, string description, int minimum, string helpName = "N")
    {
        var option = new Option<int?>(name) { Description = description, HelpName = helpName };
        option.CustomParser = r =>
        {
            if (r.Tokens.Count == 0) return null;
            var text = string.Join(' ', r.Tokens.Select(t => t.Value));
            if (int.TryParse(text.Trim(), NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out var n) && n >= minimum) return n;
            r.AddError($"{name} must be a whole number, at least {minimum.ToString(CultureInfo.InvariantCulture)} (got '{text}').");
            return null;
        };
        return option;
    }

    /// <summary>An option holding one of the words of <paramref name="choices"/>, matched ignoring case; absent, it is default(<typeparamref name="T"/>).</summary>
    /// <remarks>Help lists the words in lower case as written here; the description should state the default.</remarks>
    public static Option<T> Choice<T>(string name, string description, params (string Word, T Value)[] choices)
    {
        var words = string.Join('|', choices.Select(c => c.Word));
        var option = new Option<T>(name) { Description = description, HelpName = words, Arity = ArgumentArity.ExactlyOne };
        option.CustomParser = r =>
        {
            if (r.Tokens.Count == 0) return default!;
            var text = string.Join(' ', r.Tokens.Select(t => t.Value)).Trim();
            foreach (var (word, value) in choices)
                if (string.Equals(word, text, StringComparison.OrdinalIgnoreCase)) return value;
            r.AddError($"{name} '{text}' is not one of {string.Join(", ", choices.Select(c => c.Word))}.");
            return default!;
        };
        option.CompletionSources.Add(_ => choices.Select(c => new System.CommandLine.Completions.CompletionItem(c.Word)));
        return option;
    }

    // The unit the user wrote: what follows the leading number.
    private static string UnitText(string text)
    {
        var trimmed = text.Trim();
        var i = 0;
        if (i < trimmed.Length && trimmed[i] is '+' or '-') i++;
        while (i < trimmed.Length && (char.IsAsciiDigit(trimmed[i]) || trimmed[i] == '.')) i++;
        if (i < trimmed.Length && trimmed[i] is 'e' or 'E')
        {
            var j = i + 1;
            if (j < trimmed.Length && trimmed[j] is '+' or '-') j++;
            var digits = j;
            while (j < trimmed.Length && char.IsAsciiDigit(trimmed[j])) j++;
            if (j > digits) i = j;
        }
        return trimmed[i..].Trim();
    }
}
