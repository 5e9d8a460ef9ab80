using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Io.Json;

namespace ModalChain.Io.Csv;

/// <summary>Writes a harmonic sweep as CSV: one row per frequency (per case and frequency for load cases), magnitude and phase columns with SI units in the header.</summary>
public static class HarmonicCsv
{
    /// <summary>Writes the header and one row per frequency to <paramref name="writer"/>.</summary>
    public static void Write(TextWriter writer, HarmonicResult result) => Write(writer, result, null, true);

    /// <summary>Writes the sweeps of a model with load cases as one table: a first column names the case, then each case's rows (every case has the same columns).</summary>
    public static void Write(TextWriter writer, LoadCaseResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        for (var c = 0; c < result.Cases.Length; c++) Write(writer, result.Cases[c].Result, result.Cases[c].Case.Name, c == 0);
    }

    private static void Write(TextWriter writer, HarmonicResult result, string? caseName, bool withHeader)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(result);
        var lead = caseName is null ? 0 : 1;
        var header = caseName is null ? new List<string> { "frequency [Hz]" } : ["case", "frequency [Hz]"];
        var columns = new List<Func<int, Complex>>();
        foreach (var r in result.Responses)
            foreach (var q in Enum.GetValues<ResponseQuantity>())
            {
                header.Add($"{r.Dof} {HarmonicJson.Name(q)} magnitude [{HarmonicJson.Unit(q)}]");
                header.Add($"{r.Dof} {HarmonicJson.Name(q)} phase [deg]");
                var response = r;
                var quantity = q;
                columns.Add(k => response.At(k, result.FrequenciesHz[k], quantity));
            }
        foreach (var e in result.ElementForces)
        {
            header.Add($"{e.Element} {(e.Kind == ElementKind.Spring ? "spring" : "damper")} force magnitude [N]");
            header.Add($"{e.Element} {(e.Kind == ElementKind.Spring ? "spring" : "damper")} force phase [deg]");
            var force = e;
            columns.Add(k => force.Force[k]);
        }
        foreach (var s in result.Reactions)
        {
            header.Add($"reaction {s.Support} magnitude [N]");
            header.Add($"reaction {s.Support} phase [deg]");
            var reaction = s;
            columns.Add(k => reaction.Force[k]);
        }
        if (withHeader)
        {
            writer.Write(CsvText.Row(header));
            writer.Write('\n');
        }
        var fields = new string[header.Count];
        if (caseName is not null) fields[0] = caseName;
        for (var k = 0; k < result.FrequenciesHz.Length; k++)
        {
            fields[lead] = CsvText.Number(result.FrequenciesHz[k]);
            for (var c = 0; c < columns.Count; c++)
            {
                var z = columns[c](k);
                fields[lead + 1 + 2 * c] = CsvText.Number(z.Magnitude);
                fields[lead + 2 + 2 * c] = CsvText.Number(HarmonicJson.PhaseDegrees(z));
            }
            writer.Write(CsvText.Row(fields));
            writer.Write('\n');
        }
    }
}
