using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Io.Json;

namespace ModalChain.Io.Csv;

/// <summary>Writes a harmonic sweep as CSV: one row per frequency, magnitude and phase columns with SI units in the header.</summary>
public static class HarmonicCsv
{
    /// <summary>Writes the header and one row per frequency to <paramref name="writer"/>.</summary>
    public static void Write(TextWriter writer, HarmonicResult result)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(result);
        var header = new List<string> { "frequency [Hz]" };
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
        foreach (var m in result.MountForces)
        {
            var kind = m.Kind == ElementKind.Spring ? "spring" : "damper";
            header.Add($"{m.Element} {kind} {m.Direction} magnitude [{m.Unit}]");
            header.Add($"{m.Element} {kind} {m.Direction} phase [deg]");
            var mount = m;
            columns.Add(k => mount.Force[k]);
        }
        foreach (var s in result.Reactions)
        {
            header.Add($"reaction {s.Support} magnitude [N]");
            header.Add($"reaction {s.Support} phase [deg]");
            var reaction = s;
            columns.Add(k => reaction.Force[k]);
        }
        writer.Write(CsvText.Row(header));
        writer.Write('\n');
        var fields = new string[header.Count];
        for (var k = 0; k < result.FrequenciesHz.Length; k++)
        {
            fields[0] = CsvText.Number(result.FrequenciesHz[k]);
            for (var c = 0; c < columns.Count; c++)
            {
                var z = columns[c](k);
                fields[1 + 2 * c] = CsvText.Number(z.Magnitude);
                fields[2 + 2 * c] = CsvText.Number(HarmonicJson.PhaseDegrees(z));
            }
            writer.Write(CsvText.Row(fields));
            writer.Write('\n');
        }
    }
}
