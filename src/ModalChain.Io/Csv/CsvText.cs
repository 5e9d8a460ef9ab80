using System.Globalization;

namespace ModalChain.Io.Csv;

/// <summary>RFC 4180 field quoting and invariant number formatting shared by the CSV writers.</summary>
internal static class CsvText
{
    public static string Field(string text) =>
        text.IndexOfAny([',', '"', '\n', '\r']) >= 0 ? "\"" + text.Replace("\"", "\"\"") + "\"" : text;

    public static string Number(double value) =>
        double.IsFinite(value) ? value.ToString("R", CultureInfo.InvariantCulture) : "";

    public static string Row(IEnumerable<string> fields) => string.Join(',', fields.Select(Field));
}
