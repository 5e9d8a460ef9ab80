using System.Collections.Immutable;
using System.Globalization;
using ModalChain.Io.Diagnostics;

namespace ModalChain.Io.Csv;

/// <summary>Reads a time history table: one 'time, value' row per line, checked row by row with line and column.</summary>
/// <remarks>
/// Fields are separated by a comma, a semicolon or a tab and use a decimal point (never the culture's comma). Blank
/// lines and lines starting with '#' are skipped; the first other line may be a header of names. Times must be
/// strictly increasing. Units are those the model file states for the table (SI by default).
/// </remarks>
public static class TimeTableCsv
{
    /// <summary>Parses <paramref name="text"/>; problems go to <paramref name="diagnostics"/> naming <paramref name="file"/>; null when any row is bad.</summary>
    public static (ImmutableArray<double> Times, ImmutableArray<double> Values)? Parse(string text, string file, ICollection<Diagnostic> diagnostics)
    {
        ArgumentNullException.ThrowIfNull(text);
        ArgumentNullException.ThrowIfNull(diagnostics);
        var times = new List<double>();
        var values = new List<double>();
        var errors = 0;
        var firstContent = true;
        var lines = text.Split('\n');
        for (var l = 0; l < lines.Length; l++)
        {
            var line = lines[l].TrimEnd('\r');
            var number = l + 1;
            if (line.Trim().Length == 0 || line.TrimStart().StartsWith('#')) continue;
            var fields = Split(line);
            var header = firstContent && fields.Count > 0 && !double.TryParse(fields[0].Text, NumberStyles.Float, CultureInfo.InvariantCulture, out _)
                && fields.Any(x => x.Text.Any(char.IsLetter));
            firstContent = false;
            if (header) continue;

            void Error(int column, string message)
            {
                diagnostics.Add(new Diagnostic(Severity.Error, file, new SourcePosition(number, column), message));
                errors++;
            }
            if (fields.Count != 2)
            {
                Error(1, $"a row needs exactly two fields, time and value; found {fields.Count}");
                continue;
            }
            var ok = true;
            var parsed = new double[2];
            for (var i = 0; i < 2; i++)
            {
                var (field, column) = fields[i];
                var name = i == 0 ? "time" : "value";
                if (field.Length == 0)
                {
                    Error(column, $"the {name} is missing");
                    ok = false;
                }
                else if (!double.TryParse(field, NumberStyles.Float, CultureInfo.InvariantCulture, out parsed[i]))
                {
                    Error(column, $"the {name} '{field}' is not a number (write a decimal point, e.g. 0.25)");
                    ok = false;
                }
                else if (!double.IsFinite(parsed[i]))
                {
                    Error(column, $"the {name} '{field}' is not finite");
                    ok = false;
                }
            }
            if (!ok) continue;
            if (parsed[0] < 0)
            {
                Error(fields[0].Column, $"the time {Format(parsed[0])} s is negative; a record starts at 0 s or later");
                continue;
            }
            if (times.Count > 0 && !(parsed[0] > times[^1]))
            {
                Error(fields[0].Column, $"the time {Format(parsed[0])} s is not after the previous row's {Format(times[^1])} s; rows must be sorted by increasing time, each time once");
                continue;
            }
            times.Add(parsed[0]);
            values.Add(parsed[1]);
        }
        if (errors > 0) return null;
        if (times.Count < 2)
        {
            diagnostics.Add(new Diagnostic(Severity.Error, file, new SourcePosition(Math.Max(1, lines.Length), 1),
                $"the table has {times.Count} row{(times.Count == 1 ? "" : "s")}; it needs at least two (time, value) rows"));
            return null;
        }
        return ([.. times], [.. values]);
    }

    private static List<(string Text, int Column)> Split(string line)
    {
        var separator = line.Contains(',') ? ',' : line.Contains(';') ? ';' : '\t';
        var fields = new List<(string, int)>();
        var start = 0;
        while (true)
        {
            var end = line.IndexOf(separator, start);
            var raw = end < 0 ? line[start..] : line[start..end];
            var leading = raw.Length - raw.TrimStart().Length;
            fields.Add((raw.Trim(), start + leading + 1));
            if (end < 0) break;
            start = end + 1;
        }
        return fields;
    }

    private static string Format(double v) => v.ToString("G6", CultureInfo.InvariantCulture);
}
