using System.Collections.Immutable;
using System.Globalization;
using System.Text.Json;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Io.Json;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Html;
using ModalChain.Reports.Units;

namespace ModalChain.Reports.Sections;

/// <summary>The harmonic section of a model with load cases: each case swept and charted on its own, then the cases combined at their running speeds.</summary>
/// <remarks>Its numbers in results.json are the object of <c>modalchain harmonic --format json</c> for the same model (with "cases" and "combination").</remarks>
public sealed class HarmonicCaseSection : IReportSection
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;
    private readonly ReportContext _context;
    private readonly LoadCaseResult _result;
    private readonly ImmutableArray<HarmonicSection> _cases;

    internal HarmonicCaseSection(ReportContext context, LoadCaseResult result, ImmutableArray<HarmonicSection> cases)
    {
        _context = context;
        _result = result;
        _cases = cases;
    }

    /// <inheritdoc />
    public string Key => "harmonic";

    /// <inheritdoc />
    public string Title => "Harmonic response";

    /// <inheritdoc />
    public IReadOnlyList<ReportFigure> Figures => [.. _cases.SelectMany(c => c.Figures)];

    private (string Symbol, double Metres) Displacement => (_context.Units.Displacement.Symbol, _context.Units.Displacement.Factor);

    private (string Symbol, double MetresPerSecond) Velocity => (_context.Units.Velocity.Symbol, _context.Units.Velocity.Factor);

    private (string Symbol, double MetresPerSecondSquared) Acceleration => (_context.Units.Acceleration.Symbol, _context.Units.Acceleration.Factor);

    /// <inheritdoc />
    public void WriteHtml(HtmlWriter html)
    {
        var rule = LoadCaseSelection.Name(_result.Rule);
        html.Paragraph(string.Create(Inv,
            $"The model has {_result.Cases.Length} load case{(_result.Cases.Length == 1 ? "" : "s")} ({string.Join(", ", _result.Cases.Select(c => c.Case.Name))}): each is swept and charted on its own, and they are combined at their running speeds by the {rule} rule."));
        foreach (var (c, section) in _result.Cases.Zip(_cases))
        {
            html.Heading($"Load case {c.Case.Name}");
            section.WriteHtml(html);
        }

        html.Heading($"Load cases combined at their running speeds ({rule} rule)");
        var (dSym, dScale) = Displacement;
        var (vSym, vScale) = Velocity;
        var (aSym, aScale) = Acceleration;
        var isRotation = Core.Dofs.DofMap.RotationLabels(_context.Document.Network);
        var translations = _result.Combined.Where(r => !isRotation(r.Dof)).ToArray();
        var rotations = _result.Combined.Where(r => isRotation(r.Dof)).Select(r => r.Dof).ToArray();
        html.Table($"Combined response, rule: {rule}",
            ["Mass", $"Displacement ({dSym} peak)", $"Velocity ({vSym} peak)", $"Velocity ({vSym} r.m.s.)", $"Acceleration ({aSym} peak)", "Components"],
            translations.Select(r => (IReadOnlyList<string>)
            [
                r.Dof,
                DisplayUnits.Number(r.Peak(ResponseQuantity.Displacement, _result.Rule) / dScale),
                DisplayUnits.Number(r.Peak(ResponseQuantity.Velocity, _result.Rule) / vScale),
                DisplayUnits.Number(r.Rms(ResponseQuantity.Velocity, _result.Rule) / vScale),
                DisplayUnits.Number(r.Peak(ResponseQuantity.Acceleration, _result.Rule) / aScale),
                string.Join(", ", r.Components.Select(c => $"{c.Case} at {DisplayUnits.Number(c.SpeedHz * 60)} rpm")),
            ]), new HashSet<int> { 1, 2, 3, 4 });
        html.Table("Components: each case at each of its running speeds",
            ["Mass", "Case", "Speed (rpm)", $"Displacement ({dSym} peak)", $"Velocity ({vSym} r.m.s.)", $"Acceleration ({aSym} peak)"],
            translations.SelectMany(r => r.Components.Select(c => (IReadOnlyList<string>)
            [
                r.Dof, c.Case, DisplayUnits.Number(c.SpeedHz * 60),
                DisplayUnits.Number(c.Peak(ResponseQuantity.Displacement) / dScale),
                DisplayUnits.Number(c.Peak(ResponseQuantity.Velocity) / Math.Sqrt(2) / vScale),
                DisplayUnits.Number(c.Peak(ResponseQuantity.Acceleration) / aScale),
            ])), new HashSet<int> { 2, 3, 4, 5 });
        if (rotations.Length > 0)
            html.Paragraph($"Rotations ({string.Join(", ", rotations)}) are angles and are left out of these length tables; their combined values are in results.json (rad, rad/s, rad/s²).", "note");
        html.Paragraph("Rule " + LoadCaseSelection.Describe(_result.Rule) + ".", "note");
        foreach (var note in _result.Notes) html.Paragraph(note, "note");
    }

    /// <inheritdoc />
    public void WriteJson(Utf8JsonWriter json)
    {
        ArgumentNullException.ThrowIfNull(json);
        using var buffer = new MemoryStream();
        HarmonicJson.Write(buffer, _context.Document, _result, _context.Options.ToolVersion);
        using var parsed = JsonDocument.Parse(buffer.ToArray());
        parsed.RootElement.WriteTo(json);
    }
}
