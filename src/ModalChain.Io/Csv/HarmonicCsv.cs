using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
using ModalChain.Io.Json;

namespace ModalChain.Io.Csv;

/// <summary>Writes a harmonic sweep as CSV: one row per frequency (per case and frequency for load cases), magnitude and phase columns with SI units in the header.</summary>
public static class HarmonicCsv
{
    /// <summary>Writes the header and one row per frequency to <paramref name="writer"/>.</summary>
    /// <param name="writer">The target.</param>
    /// <param name="result">The sweep.</param>
    /// <param name="network">The network swept, to name electrical columns in V and A (<see cref="ElectricalLabels"/>); null writes every column in mechanical units.</param>
    public static void Write(TextWriter writer, HarmonicResult result, Network? network = null) => Write(writer, result, null, true, network);

    /// <summary>Writes the sweeps of a model with load cases as one table: a first column names the case, then each case's rows (every case has the same columns).</summary>
    public static void Write(TextWriter writer, LoadCaseResult result, Network? network = null)
    {
        ArgumentNullException.ThrowIfNull(result);
        for (var c = 0; c < result.Cases.Length; c++) Write(writer, result.Cases[c].Result, result.Cases[c].Case.Name, c == 0, network);
    }

    private static void Write(TextWriter writer, HarmonicResult result, string? caseName, bool withHeader, Network? network)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(result);
        var lead = caseName is null ? 0 : 1;
        var header = caseName is null ? new List<string> { "frequency [Hz]" } : ["case", "frequency [Hz]"];
        var columns = new List<Func<int, Complex>>();
        foreach (var r in result.Responses)
            foreach (var q in Enum.GetValues<ResponseQuantity>())
            {
                var (name, unit) = network is null ? (HarmonicJson.Name(q), HarmonicJson.Unit(q))
                    : (ElectricalLabels.Quantity(network, r.Dof, q).Replace('_', ' '), ElectricalLabels.Unit(network, r.Dof, q, rotation: false));
                header.Add($"{r.Dof} {name} magnitude [{unit}]");
                header.Add($"{r.Dof} {name} phase [deg]");
                var response = r;
                var quantity = q;
                columns.Add(k => response.At(k, result.FrequenciesHz[k], quantity));
            }
        foreach (var e in result.ElementForces)
        {
            var spring = e.Kind == ElementKind.Spring;
            var current = network is not null && ElectricalLabels.IsElement(network, e.Element, spring);
            // An electrical element is named as the transient CSV names it: an inductor or a resistor carries a current.
            var kind = network is null ? (spring ? "spring" : "damper") : ElectricalLabels.ElementWord(network, e.Element, spring);
            header.Add(current ? $"{e.Element} {kind} current magnitude [A]" : $"{e.Element} {kind} force magnitude [N]");
            header.Add(current ? $"{e.Element} {kind} current phase [deg]" : $"{e.Element} {kind} force phase [deg]");
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
        foreach (var c in result.SourceCurrents)
        {
            header.Add($"source current {c.Support} magnitude [A]");
            header.Add($"source current {c.Support} phase [deg]");
            var source = c;
            columns.Add(k => source.Current[k]);
        }
        foreach (var port in result.TransducerPorts)
        {
            header.Add($"port {port.Transducer} voltage magnitude [V]");
            header.Add($"port {port.Transducer} voltage phase [deg]");
            header.Add($"port {port.Transducer} current magnitude [A]");
            header.Add($"port {port.Transducer} current phase [deg]");
            var p = port;
            columns.Add(k => p.Voltage[k]);
            columns.Add(k => p.Current[k]);
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
