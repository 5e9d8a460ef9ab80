using ModalChain.Reports.Units;

namespace ModalChain.Reports;

/// <summary>Which files a report run writes besides results.json.</summary>
public enum ReportFormat
{
    /// <summary>report.html and every figure as SVG (the default).</summary>
    Html,

    /// <summary>Every figure as SVG, no HTML.</summary>
    Svg,

    /// <summary>report.pdf (the whole report as one PDF) beside report.html, every figure as SVG and each figure also as its own PDF.</summary>
    Pdf,
}

/// <summary>Options of a report run.</summary>
/// <param name="ToolVersion">Version of the tool, printed on the report for traceability.</param>
/// <param name="Generated">When the report was made (printed in UTC).</param>
/// <param name="Units">Display units of the HTML and figures, or null for the system the model is written in (<see cref="DisplayUnits.SystemOf"/>); results.json is always SI.</param>
/// <param name="MaxModes">Largest number of modes tabulated and drawn (the lowest ones).</param>
public sealed record ReportOptions(string ToolVersion, DateTimeOffset Generated, UnitSystem? Units = null, int MaxModes = 20)
{
    /// <summary>Networks up to this many masses get an animated mode view in the HTML (larger ones would bloat the file).</summary>
    public int MaxAnimatedMasses { get; init; } = 40;

    /// <summary>The absorber to size and show (the "Tuned vibration absorber" section), or null for none.</summary>
    public Sections.AbsorberReportRequest? Absorber { get; init; }

    /// <summary>The eigen solver family used for the report's modes (Auto by default).</summary>
    public ModalChain.Core.Solvers.SolverChoice Solver { get; init; }
}
