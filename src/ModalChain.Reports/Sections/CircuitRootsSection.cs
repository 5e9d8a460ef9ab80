using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using System.Text.Json;
using ModalChain.Core.Analyses.Circuits;
using ModalChain.Core.Model;
using ModalChain.Io.Json;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Html;
using ModalChain.Reports.Units;

namespace ModalChain.Reports.Sections;

/// <summary>The roots of a circuit with its sources switched off: natural frequencies, damping ratios and Q factors of its oscillations, time constants of its relaxations, and its DC levels.</summary>
/// <remarks>The numbers are those of <c>modalchain modes --format json</c> on the circuit (circuit-modes.schema.json).</remarks>
public sealed class CircuitRootsSection : IReportSection
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    private readonly ReportContext _context;

    private CircuitRootsSection(ReportContext context, ImmutableArray<CircuitRoot> roots)
    {
        _context = context;
        Roots = roots;
    }

    /// <summary>The factory registered in <see cref="ReportSections.Circuit"/>: null for a model without a circuit.</summary>
    public static IReportSection? Create(ReportContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        if (context.Document.Circuit is not { } model) return null;
        return new CircuitRootsSection(context, CircuitModes.Solve(CircuitAnalogy.Of(model.Circuit)));
    }

    /// <summary>The roots shown, DC levels first, then in ascending |s|.</summary>
    public ImmutableArray<CircuitRoot> Roots { get; }

    /// <inheritdoc />
    public string Key => "circuit_roots";

    /// <inheritdoc />
    public string Title => "Natural frequencies, damping ratios and time constants";

    /// <inheritdoc />
    public IReadOnlyList<ReportFigure> Figures => [];

    /// <summary>The column headers of the roots table.</summary>
    public static readonly ImmutableArray<string> Headers =
        ["#", "Kind", "f₀ (Hz)", "ω₀ (rad/s)", "ζ", "Q", "f_d (Hz)", "τ", "Root s (1/s)"];

    /// <inheritdoc />
    public void WriteHtml(HtmlWriter html)
    {
        ArgumentNullException.ThrowIfNull(html);
        html.Paragraph("The roots s of the circuit's free response e^(st) with every source switched off (voltage sources shorted, current sources open). " +
            "A complex pair is a decaying oscillation: natural frequency f₀ = |s|/2π, damping ratio ζ = −Re s/|s|, Q factor Q = 1/(2ζ), damped frequency f_d = Im s/2π. " +
            "A real root is an exponential relaxation with time constant τ = −1/s. A DC level is a zero root: the voltage level a part of the circuit keeps when no inductor or resistor ties it to ground or to a source.");
        if (Roots.IsEmpty)
        {
            html.Paragraph("The circuit has no free response: every node's voltage is set by a source.", "note");
            return;
        }
        html.Table("Roots of the circuit", Headers, Roots.Select(Row), new HashSet<int> { 0, 2, 3, 4, 5, 6, 7, 8 });
        var oscillations = Roots.Count(r => r.Kind == CircuitRootKind.Oscillation);
        var relaxations = Roots.Count(r => r.Kind == CircuitRootKind.Relaxation);
        var levels = Roots.Count(r => r.Kind == CircuitRootKind.DcLevel);
        html.Paragraph(string.Create(Inv, $"{oscillations} oscillation{(oscillations == 1 ? "" : "s")}, {relaxations} relaxation{(relaxations == 1 ? "" : "s")}, {levels} DC level{(levels == 1 ? "" : "s")}."), "note");
    }

    /// <summary>The table row of <paramref name="r"/>.</summary>
    public static IReadOnlyList<string> Row(CircuitRoot r)
    {
        ArgumentNullException.ThrowIfNull(r);
        var oscillation = r.Kind == CircuitRootKind.Oscillation;
        return
        [
            r.Number.ToString(Inv),
            r.Kind switch { CircuitRootKind.DcLevel => "DC level", CircuitRootKind.Oscillation => "oscillation", _ => "relaxation" },
            oscillation ? DisplayUnits.Number(r.NaturalFrequencyHz) : "—",
            oscillation ? DisplayUnits.Number(2 * Math.PI * r.NaturalFrequencyHz) : "—",
            oscillation ? DisplayUnits.Number(r.DampingRatio) : "—",
            oscillation ? DisplayUnits.Number(r.QualityFactor) : "—",
            oscillation ? DisplayUnits.Number(r.DampedFrequencyHz) : "—",
            r.Kind == CircuitRootKind.Relaxation ? ElectricalUnits.Format(r.TimeConstant, ElectricalUnits.Second) : "—",
            Root(r.Root),
        ];
    }

    /// <inheritdoc />
    public void WriteJson(Utf8JsonWriter json)
    {
        ArgumentNullException.ThrowIfNull(json);
        using var buffer = new MemoryStream();
        CircuitJson.WriteModes(buffer, _context.Document, Roots, _context.Options.ToolVersion);
        using var parsed = JsonDocument.Parse(buffer.ToArray());
        parsed.RootElement.WriteTo(json);
    }

    private static string Root(Complex s) =>
        s.Imaginary == 0 ? DisplayUnits.Number(s.Real) : $"{DisplayUnits.Number(s.Real)} {(s.Imaginary < 0 ? "−" : "+")} {DisplayUnits.Number(Math.Abs(s.Imaginary))}i";
}
