using System.Globalization;
using ModalChain.Core.Analyses.Studies;

namespace ModalChain.Io.Csv;

/// <summary>Writes a parameter study as CSV: one row per value, one column per tracked mode and per criterion reserve.</summary>
public static class StudyCsv
{
    /// <summary>Writes the header and one row per step; the parameter column is in SI (<paramref name="siUnit"/>).</summary>
    public static void Write(TextWriter writer, StudyResult result, string siUnit)
    {
        var criteria = result.Request.Criteria;
        writer.Write(CsvText.Row([
            $"{result.Request.Parameter.Text} [{siUnit}]",
            .. result.Modes.Select(m => $"mode {m.Identity} frequency [Hz]"),
            .. result.Modes.Select(m => $"mode {m.Identity} number [1]"),
            .. criteria.Select(c => $"{c.Name} reserve [1]")]));
        writer.Write('\n');
        foreach (var s in result.Steps)
        {
            writer.Write(CsvText.Row([
                CsvText.Number(s.Value),
                .. result.Modes.Select(m => CsvText.Number(m.FrequenciesHz[s.Index])),
                .. result.Modes.Select(m => m.ModeNumbers[s.Index].ToString(CultureInfo.InvariantCulture)),
                .. s.Reserves.Select(CsvText.Number)]));
            writer.Write('\n');
        }
    }
}
