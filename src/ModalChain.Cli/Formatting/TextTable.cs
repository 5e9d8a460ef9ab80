namespace ModalChain.Cli.Formatting;

/// <summary>A plain-text table with right-aligned numeric columns, for terminals and log files alike.</summary>
internal sealed class TextTable(params string[] headers)
{
    private readonly List<string[]> _rows = [];

    public void Add(params string[] cells) => _rows.Add(cells);

    /// <summary>The number of rows added.</summary>
    public int Count => _rows.Count;

    public void Write(TextWriter writer, bool lastColumnLeftAligned = false)
    {
        var widths = headers.Select((h, i) => Math.Max(h.Length, _rows.Select(r => r[i].Length).DefaultIfEmpty(0).Max())).ToArray();
        string Line(string[] cells) => string.Join("  ", cells.Select((c, i) =>
            lastColumnLeftAligned && i == cells.Length - 1 ? c : c.PadLeft(widths[i]))).TrimEnd();
        writer.WriteLine(Line(headers));
        writer.WriteLine(string.Join("  ", widths.Select(w => new string('-', w))));
        foreach (var r in _rows) writer.WriteLine(Line(r));
    }
}
