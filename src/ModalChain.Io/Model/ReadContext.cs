using System.Runtime.CompilerServices;
using ModalChain.Core.Units;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Yaml;

namespace ModalChain.Io.Model;

/// <summary>Plausible range of a value; outside it the value is taken as a typing or unit mistake.</summary>
/// <param name="Minimum">Smallest accepted SI value.</param>
/// <param name="Maximum">Largest accepted SI value.</param>
/// <param name="MinimumInclusive">Whether <paramref name="Minimum"/> itself is accepted.</param>
internal readonly record struct Range(double Minimum, double Maximum, bool MinimumInclusive = true)
{
    public static readonly Range Any = new(double.MinValue, double.MaxValue);
}

/// <summary>State shared by the section readers of one file: the file name and the diagnostics found so far.</summary>
internal sealed partial class ReadContext
{
    public ReadContext(string file)
    {
        File = file;
        t_suggestionWork = 0;
    }

    // "3,5 kg": a decimal comma, as written in much of Europe; model files use the invariant decimal point.
    [System.Text.RegularExpressions.GeneratedRegex(@"^\s*([+-]?\d+),(\d+)")]
    private static partial System.Text.RegularExpressions.Regex DecimalComma();

    // "3 200 kg": thousands grouped with a space, which would otherwise read as 3 with the unit "200 kg".
    [System.Text.RegularExpressions.GeneratedRegex(@"^(\s*[+-]?\d{1,3}) (\d{3}\b)")]
    private static partial System.Text.RegularExpressions.Regex GroupedDigits();

    public string File { get; }
    public List<Diagnostic> Diagnostics { get; } = [];
    public PositionTable Positions { get; } = new();

    // Section readers ask HasErrors once per element; scanning the whole list each time made a file with many
    // warnings or errors quadratic. Diagnostics are only ever appended, so only the new ones are looked at.
    private int _scanned;
    private bool _hasErrors;

    public bool HasErrors
    {
        get
        {
            for (; !_hasErrors && _scanned < Diagnostics.Count; _scanned++) _hasErrors = Diagnostics[_scanned].Severity == Severity.Error;
            return _hasErrors;
        }
    }

    /// <summary>How many errors have been reported so far.</summary>
    public int ErrorCount => Diagnostics.Count(d => d.Severity == Severity.Error);

    public void Error(YNode node, string message) => Error(node.Position, message);
    public void Error(SourcePosition at, string message) => Diagnostics.Add(new Diagnostic(Severity.Error, File, at, message));
    public void Warning(SourcePosition at, string message) => Diagnostics.Add(new Diagnostic(Severity.Warning, File, at, message));

    /// <summary>The node as a mapping, or an error saying what was expected.</summary>
    public YMapping? Mapping(YNode node, string what)
    {
        if (node is YMapping m) return m;
        Error(node, $"{what} must be a mapping of 'key: value' entries");
        return null;
    }

    /// <summary>The entries of a mapping after reporting keys not in <paramref name="allowed"/>.</summary>
    public void RejectUnknownKeys(YMapping mapping, string what, params string[] allowed)
    {
        foreach (var (key, _) in mapping.Entries)
            if (Array.IndexOf(allowed, key.Value) < 0)
                Error(key, $"unknown key '{key.Value}' in {what}{Suggest(key.Value, allowed)}; accepted keys: {string.Join(", ", allowed)}");
    }

    /// <summary>Reads a required value of <paramref name="quantity"/> from <paramref name="mapping"/>[<paramref name="key"/>].</summary>
    /// <remarks>A missing key is reported at <paramref name="owner"/> (where the element is named) when given, else at the mapping's start.</remarks>
    public double? Required(YMapping mapping, string key, Quantity quantity, Range range, string what, SourcePosition? owner = null)
    {
        var node = mapping[key];
        if (node is null)
        {
            Error(owner ?? mapping.Position, $"{what} needs '{key}', e.g. '{key}: {Example(quantity)}'");
            return null;
        }
        return Value(node, quantity, range, key, what);
    }

    /// <summary>Reads an optional value; null when absent.</summary>
    public double? Optional(YMapping mapping, string key, Quantity quantity, Range range, string what) =>
        mapping[key] is { } node ? Value(node, quantity, range, key, what) : null;

    /// <summary>Reads one scalar as <paramref name="quantity"/>, checking it lies in <paramref name="range"/>.</summary>
    public double? Value(YNode node, Quantity quantity, Range range, string what) => Value(node, quantity, range, null, what);

    // The description "'key' of what" is composed only when there is an error to describe: a large model reads
    // hundreds of thousands of values, nearly all of them right.
    private double? Value(YNode node, Quantity quantity, Range range, string? key, string what)
    {
        if (node is not YScalar scalar || scalar.IsPlainNull)
        {
            Error(node, $"{Of(key, what)} must be a {UnitTable.Describe(quantity)} value such as '{Example(quantity)}'");
            return null;
        }
        if (!_parsed.TryGetValue((scalar.Value, quantity), out var v))
        {
            if (Parse(scalar, quantity, Of(key, what)) is not { } parsed) return null;
            _parsed[(scalar.Value, quantity)] = v = parsed;
        }
        var belowMinimum = range.MinimumInclusive ? v < range.Minimum : v <= range.Minimum;
        if (belowMinimum || v > range.Maximum)
        {
            Error(scalar, $"{Of(key, what)} is {Si(v, quantity)}, {RangeText(range, quantity, v)}");
            return null;
        }
        return v;
    }

    /// <summary>The value of a text already read as <paramref name="quantity"/> (so known to be well written), when it
    /// lies in <paramref name="range"/>; false for a text not read yet or out of range, which <see cref="Value(YNode, Quantity, Range, string)"/>
    /// then reads and reports. Reports nothing, so a section reader may try it first on every element.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public bool TryKnownValue(string text, Quantity quantity, Range range, out double value)
    {
        if (!_parsed.TryGetValue((text, quantity), out value)) return false;
        var belowMinimum = range.MinimumInclusive ? value < range.Minimum : value <= range.Minimum;
        return !(belowMinimum || value > range.Maximum);
    }

    private static string Of(string? key, string what) => key is null ? what : $"'{key}' of {what}";

    // Large models repeat a few values ("40 kg", "5 MN/m") many thousands of times; each text is parsed once.
    private readonly Dictionary<(string Text, Quantity Quantity), double> _parsed = [];

    // The units each kind of element property is written in (a bare number counts as its SI unit): one text is
    // parsed once, so this costs one set lookup per distinct value text.
    private readonly Dictionary<Quantity, HashSet<string>> _written = [];

    /// <summary>The kinds of element property the reader notes the written units of: mass, stiffness, damping coefficient.</summary>
    private static bool IsElementProperty(Quantity quantity) => quantity is Quantity.Mass or Quantity.Stiffness or Quantity.Damping;

    /// <summary>For each of mass, stiffness and damping coefficient, the one unit every value of that kind in the file is written in (absent when the file mixes units or has no such value).</summary>
    public IReadOnlyDictionary<Quantity, string> WrittenUnits() =>
        _written.Where(kv => kv.Value.Count == 1).ToDictionary(kv => kv.Key, kv => kv.Value.First());

    private double? Parse(YScalar scalar, Quantity quantity, string what)
    {
        if (DecimalComma().IsMatch(scalar.Value))
        {
            Error(scalar, $"{what}: '{scalar.Value}' uses a decimal comma; write the decimal point, e.g. '{DecimalComma().Replace(scalar.Value, "$1.$2")}'");
            return null;
        }
        if (GroupedDigits().IsMatch(scalar.Value))
        {
            Error(scalar, $"{what}: '{scalar.Value}' groups digits with spaces; write the number without separators, e.g. '{GroupedDigits().Replace(scalar.Value, "$1$2")}'");
            return null;
        }
        var parsed = QuantityParser.Parse(scalar.Value, quantity);
        if (!parsed.Succeeded)
        {
            Error(scalar, $"{what}: {parsed.Error}");
            return null;
        }
        if (IsElementProperty(quantity))
        {
            if (!_written.TryGetValue(quantity, out var units)) _written[quantity] = units = [];
            units.Add(parsed.Unit ?? UnitTable.SiSymbol(quantity));
        }
        return parsed.Value;
    }

    /// <summary>Reads a scalar string; null with an error when the node is not a non-empty scalar.</summary>
    public string? Text(YNode node, string what)
    {
        if (node is YScalar s && !s.IsPlainNull) return s.Value;
        Error(node, $"{what} must be text");
        return null;
    }

    private static string RangeText(Range range, Quantity quantity, double value)
    {
        // Say the sign rule plainly when that is what was broken; the plausible range is for magnitudes.
        if (value < 0 && range.Minimum >= 0)
            return range.Minimum > 0 || !range.MinimumInclusive
                ? $"but a {UnitTable.Describe(quantity)} must be positive"
                : $"but a {UnitTable.Describe(quantity)} cannot be negative";
        if (value == 0 && quantity == Quantity.Mass && range.Minimum > 0)
            return $"but a {UnitTable.Describe(quantity)} must be positive (a point without mass is declared under 'nodes:')";
        if (value == 0 && (range.Minimum > 0 || !range.MinimumInclusive))
            return $"but a {UnitTable.Describe(quantity)} must be positive";
        if (range.Minimum == 0 && !range.MinimumInclusive && range.Maximum == double.MaxValue) return "but it must be positive";
        if (range.Minimum == 0 && range.MinimumInclusive && range.Maximum == double.MaxValue) return "but it must not be negative";
        var low = range.Minimum == 0 && !range.MinimumInclusive ? "positive" : (range.MinimumInclusive ? "at least " : "above ") + Si(range.Minimum, quantity);
        return $"outside the plausible range ({low} and at most {Si(range.Maximum, quantity)}); check the number and its unit";
    }

    // Plain digits where a reader takes them in at a glance ("-8400000 N/m"), powers of ten beyond ("1e+30 kg").
    private static string Si(double value, Quantity quantity)
    {
        var magnitude = Math.Abs(value);
        var format = value == 0 || (magnitude >= 1e-3 && magnitude < 1e9) ? "0.######" : "0.###e+0";
        // A ratio's SI unit is the plain number 1, which is not written ("-2", not "-2 1").
        var symbol = UnitTable.SiSymbol(quantity);
        return value.ToString(format, System.Globalization.CultureInfo.InvariantCulture) + (symbol == "1" ? "" : " " + symbol);
    }

    private static string Example(Quantity quantity) => quantity switch
    {
        Quantity.Ratio => "2 %",
        _ => "12 " + UnitTable.Symbols(quantity)[0],
    };

    /// <summary>" (did you mean 'x'?)" for the closest allowed word within two edits (the first such in order), or empty.</summary>
    /// <remarks>
    /// A file with thousands of wrong names in a model of thousands of nodes would cost their product in comparisons,
    /// so the comparisons of one read (one thread) share a budget; past it, suggestions are left out.
    /// </remarks>
    public static string Suggest(string word, IEnumerable<string> allowed)
    {
        var lower = word.ToLowerInvariant();
        string? best = null;
        var bestDistance = 3;
        foreach (var a in allowed)
        {
            if (++t_suggestionWork > SuggestionBudget) return "";
            if (Math.Abs(a.Length - lower.Length) >= bestDistance) continue; // the distance is at least the length difference
            t_suggestionWork += (long)a.Length * lower.Length;
            var d = EditDistance(lower, a.ToLowerInvariant());
            if (d < bestDistance)
            {
                (best, bestDistance) = (a, d);
                if (d == 0) break;
            }
        }
        return best is not null ? $" (did you mean '{best}'?)" : "";
    }

    // Reset by each ReadContext: enough for every suggestion of an ordinary file, and for the first few thousand
    // misspelt names of a 100,000-node model.
    [ThreadStatic] private static long t_suggestionWork;
    private const long SuggestionBudget = 200_000_000;

    private static int EditDistance(string a, string b)
    {
        var previous = new int[b.Length + 1];
        var current = new int[b.Length + 1];
        for (var j = 0; j <= b.Length; j++) previous[j] = j;
        for (var i = 1; i <= a.Length; i++)
        {
            current[0] = i;
            for (var j = 1; j <= b.Length; j++)
                current[j] = Math.Min(Math.Min(previous[j] + 1, current[j - 1] + 1), previous[j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1));
            (previous, current) = (current, previous);
        }
        return previous[b.Length];
    }
}
