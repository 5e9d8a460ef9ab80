namespace ModalChain.Reports.Figures;

/// <summary>A figure of the report: shown inline in report.html and written as its own file (SVG, and PDF on request).</summary>
public abstract class ReportFigure
{
    /// <summary>Creates a figure named <paramref name="name"/> (the file stem, e.g. "mode-02").</summary>
    protected ReportFigure(string name, string caption, string kind)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(name);
        if (!name.All(IsStemCharacter))
            throw new ArgumentException($"Figure name '{name}' must be a plain file stem (letters, digits, '-', '_').", nameof(name));
        Name = name;
        Caption = caption;
        Kind = kind;
    }

    /// <summary>A figure file stem from <paramref name="prefix"/> and a model name (a mass, a DOF label, a load case): every character a stem may not hold becomes '-'.</summary>
    public static string Stem(string prefix, string name) => prefix + "-" + new string([.. name.Select(c => IsStemCharacter(c) ? c : '-')]);

    private static bool IsStemCharacter(char c) => char.IsAsciiLetterOrDigit(c) || c is '-' or '_';

    /// <summary>File stem after the figure's content ("network", "mode-01", "harmonic-skid").</summary>
    public string Name { get; }

    /// <summary>One or two sentences under the figure in the HTML report (plain text).</summary>
    public string Caption { get; }

    /// <summary>What the figure shows, used as its CSS class in the HTML ("mode", "network", "chart").</summary>
    public string Kind { get; }

    /// <summary>The figure as SVG: with an XML declaration when <paramref name="standalone"/>; element ids unique within a report.</summary>
    public abstract string Svg(bool standalone);

    /// <summary>An animated SVG of the figure for the screen view of the HTML, or null when the figure is a still.</summary>
    public virtual string? AnimatedSvg() => null;

    /// <summary>Writes the figure as a one-page vector PDF.</summary>
    public abstract void WritePdf(Stream stream);

    /// <summary>Width and height in user units (1/96 in) of what <see cref="Draw"/> paints; null when the figure cannot be drawn onto a page.</summary>
    public virtual (double Width, double Height)? Size => null;

    /// <summary>Paints the figure as vectors onto <paramref name="canvas"/>, its top-left corner at the origin, in user units (the caller scales).</summary>
    /// <remarks>Used by report.pdf to place every figure on its page; a figure without a <see cref="Size"/> is not drawn.</remarks>
    public virtual void Draw(SkiaSharp.SKCanvas canvas) =>
        throw new NotSupportedException($"Figure '{Name}' cannot be drawn onto a page.");
}
