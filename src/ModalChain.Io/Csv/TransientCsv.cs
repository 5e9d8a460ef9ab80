using ModalChain.Core.Analyses.Transient;
using ModalChain.Io.Json;

namespace ModalChain.Io.Csv;

/// <summary>Writes a transient result as CSV: one row per recorded time step, one column per quantity, SI units in the header.</summary>
public static class TransientCsv
{
    /// <summary>Writes the header and one row per recorded instant to <paramref name="writer"/>.</summary>
    public static void Write(TextWriter writer, TransientResult result)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(result);
        var header = new List<string> { "time [s]" };
        foreach (var r in result.Responses)
            header.Add(r.Quantity == ResponseQuantity.Reaction
                ? $"reaction {r.Name} [{r.Unit}]"
                : r.Direction is { } d
                    ? $"{r.Name} {TransientJson.QuantityName(r.Quantity).Replace('_', ' ')} {d} [{r.Unit}]"
                    : $"{r.Name} {ElectricalLabels.Quantity(result.Network, r.Name, r.Quantity).Replace('_', ' ')} [{ElectricalLabels.Unit(result.Network, r.Name, r.Quantity, r.Unit)}]");
        writer.Write(CsvText.Row(header));
        writer.Write('\n');
        var fields = new string[result.Responses.Length + 1];
        for (var k = 0; k < result.Times.Length; k++)
        {
            fields[0] = CsvText.Number(result.Times[k]);
            for (var j = 0; j < result.Responses.Length; j++) fields[j + 1] = CsvText.Number(result.Responses[j].Values[k]);
            writer.Write(string.Join(',', fields));
            writer.Write('\n');
        }
    }
}
