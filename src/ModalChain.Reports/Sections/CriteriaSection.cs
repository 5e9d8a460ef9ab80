using System.Globalization;
using System.Text.Json;
using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
using ModalChain.Io.Json;
using ModalChain.Io.Model;
using ModalChain.Reports.Figures;
using ModalChain.Reports.Html;
using ModalChain.Reports.Units;

namespace ModalChain.Reports.Sections;

/// <summary>The model's criteria (frequency separation, vibration limits at the operating points) with their reserves.</summary>
/// <remarks>Present when the model has a 'criteria' section; the numbers are the object of <c>modalchain check --format json</c>.</remarks>
public sealed class CriteriaSection : IReportSection
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;
    private readonly ReportContext _context;
    private readonly CheckOutcome _outcome;

    private CriteriaSection(ReportContext context, CheckOutcome outcome)
    {
        _context = context;
        _outcome = outcome;
    }

    /// <summary>The factory registered in <see cref="ReportSections.Default"/>: null when the model has no criteria.</summary>
    public static IReportSection? Create(ReportContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        var criteria = context.Document.Criteria;
        if (criteria.IsEmpty) return null;
        return new CriteriaSection(context, CriteriaCheck.Evaluate(context.Damped, criteria, OperatingLoads.Of(context.Document), context.Document.Cases));
    }

    /// <inheritdoc />
    public string Key => "criteria";

    /// <inheritdoc />
    public string Title => "Criteria and reserves";

    /// <inheritdoc />
    public IReadOnlyList<ReportFigure> Figures => [];

    /// <summary>The outcome shown.</summary>
    public CheckOutcome Outcome => _outcome;

    /// <inheritdoc />
    public void WriteHtml(HtmlWriter html)
    {
        ArgumentNullException.ThrowIfNull(html);
        html.Paragraph(_outcome.AllPass
            ? "Every criterion of the model passes."
            : "At least one criterion fails or could not be evaluated: see the tables.", _outcome.AllPass ? "verdict pass" : "verdict fail");
        html.Paragraph("The reserve is how far a result is from failing, in % (negative: failing by that much). Margins and limits are the model's; where they follow common practice they are not a code requirement (docs/criteria.md).", "note");
        if (_outcome.Separation is { } sep)
        {
            var c = sep.Criterion;
            var rows = new List<IReadOnlyList<string>>();
            foreach (var (speed, order, fe) in c.Excitations())
            {
                var pairs = sep.Pairs.Where(p => p.SpeedHz == speed && p.Order == order).ToList();
                if (pairs.Count == 0) continue;
                var worst = pairs.MinBy(p => p.Reserve)!;
                rows.Add(
                [
                    DisplayUnits.Number(speed * 60), DisplayUnits.Given(order), DisplayUnits.Number(fe),
                    $"{DisplayUnits.Number((1 - c.Margin) * fe)} – {DisplayUnits.Number((1 + c.Margin) * fe)}",
                    worst.ModeNumber.ToString(Inv), DisplayUnits.Number(worst.NaturalFrequencyHz),
                    DisplayUnits.Percent(worst.Separation), Reserve(worst.Reserve, worst.ReserveNote), worst.Passes ? "pass" : "FAIL",
                ]);
            }
            var heading = string.Create(Inv, $"Frequency separation: no natural frequency within ±{DisplayUnits.Given(100 * c.Margin)} % of running speed × order");
            if (rows.Count > 0)
                html.Table(heading,
                    ["Speed (rpm)", "Order", "Excitation (Hz)", "Band (Hz)", "Nearest mode", "f (Hz)", "Separation (%)", "Reserve (%)", "Result"],
                    rows, new HashSet<int> { 0, 1, 2, 4, 5, 6, 7 }, "criteria-table");
            else html.Paragraph($"{heading}: no mode left to check ({sep.ReserveNote}).");
            if (!sep.Exempted.IsEmpty)
                html.List(sep.Exempted.Select(x => $"Mode {x.ModeNumber} ({DisplayUnits.Number(x.NaturalFrequencyHz)} Hz) is not checked: {x.Reason}."), "notes");
        }
        if (_outcome.Limits.Count > 0)
            html.Table("Vibration limits at the operating points",
                ["Criterion", "Value", "Limit", "Reserve (%)", "Result"],
                _outcome.Limits.Select(l => (IReadOnlyList<string>)
                [
                    l.MeasuredAt is { } m ? $"{l.Limit.Describe()} (largest: {m})" : l.Limit.Describe(), Show(l.Value, l.Limit.Quantity, _context.Units), Show(l.Limit.Value, l.Limit.Quantity, _context.Units), Reserve(l.Reserve, l.ReserveNote), l.Passes ? "pass" : "FAIL",
                ]), new HashSet<int> { 1, 2, 3 }, "criteria-table");
        if (_outcome.Limits.Any(l => l.MeasuredAt is not null) || _outcome.Zones.Any(z => z.MeasuredAt is not null) || _outcome.Floors.Any(f => f.MeasuredAt is not null))
            html.Paragraph("A point named without a direction is measured in each translation it has; the largest response (for a floor curve, the direction nearest to failing) governs and is named in brackets.", "note");
        if (_outcome.Limits.Count > 0 && _outcome.Combination is { } rule)
            html.Paragraph($"The limits' values are the load cases combined at their running speeds by the rule {LoadCaseSelection.Describe(rule)}.", "note");
        var v = _context.Units.Velocity;
        var floor = _context.Units.FloorVelocity;
        if (_outcome.Zones.Length > 0)
        {
            html.Table("Machine vibration zones at the operating points (r.m.s. velocity)",
                ["Where", "Class", $"Zone boundaries A/B, B/C, C/D ({v.Symbol} r.m.s.)", $"Value ({v.Symbol} r.m.s.)", "Zone", "Accepted", "Reserve (%)", "Result"],
                _outcome.Zones.Select(z => (IReadOnlyList<string>)
                [
                    z.MeasuredAt is { } m ? $"{z.At} (largest: {m})" : z.At, z.Criterion.Class.Name,
                    $"{v.Format(z.Criterion.Class.BoundaryAB)}, {v.Format(z.Criterion.Class.BoundaryBC)}, {v.Format(z.Criterion.Class.BoundaryCD)}",
                    double.IsFinite(z.RmsVelocity) ? v.Format(z.RmsVelocity) : "unbounded", z.Zone.ToString(),
                    "up to " + z.Criterion.AcceptedZone, Reserve(z.Reserve, z.ReserveNote), z.Passes ? "pass" : "FAIL",
                ]), new HashSet<int> { 3, 6 }, "criteria-table");
            html.Paragraph("Zone boundaries: " + string.Join("; ", _outcome.Zones.Select(z => z.Criterion.Class).Distinct().Select(c => $"{c.Name}, {c.Source}")) +
                ". They are levels used in practice, not a statement of compliance.", "note");
        }
        foreach (var f in _outcome.Floors)
        {
            html.Table($"Floor curve {f.Criterion.Curve.Name} at {(f.MeasuredAt is { } m ? $"{f.At} (nearest to failing: {m})" : f.At)}: one-third-octave r.m.s. velocity",
                ["Band (Hz)", $"Value ({floor.Symbol} r.m.s.)", $"Limit ({floor.Symbol} r.m.s.)", "Reserve (%)", "Result"],
                f.Bands.Select(b => (IReadOnlyList<string>)
                [
                    DisplayUnits.Number(b.NominalHz), double.IsFinite(b.RmsVelocity) ? floor.Format(b.RmsVelocity) : "unbounded",
                    floor.Format(b.Limit), Reserve(b.Reserve, null), b.Passes ? "pass" : "FAIL",
                ]), new HashSet<int> { 0, 1, 2, 3 }, "criteria-table");
            var uncompared = f.UncomparedHz.Length > 0
                ? $" Not compared (the curve states no limit there): {string.Join(", ", f.UncomparedHz.Select(h => DisplayUnits.Number(h) + " Hz"))}."
                : "";
            html.Paragraph($"Worst band reserve {Reserve(f.Reserve, f.ReserveNote)} %.{uncompared} Curve: {f.Criterion.Curve.Source}; below 8 Hz constant acceleration [from memory, unverified].", "note");
        }
        if (_outcome.NotEvaluated.Count > 0)
        {
            html.Heading("Not evaluated");
            html.List(_outcome.NotEvaluated.Select(n => $"{n.Criterion}: {n.Reason}"), "warnings");
        }
    }

    /// <inheritdoc />
    public void WriteJson(Utf8JsonWriter json)
    {
        ArgumentNullException.ThrowIfNull(json);
        using var buffer = new MemoryStream();
        CheckJson.Write(buffer, _context.Document, _outcome, _context.Options.ToolVersion);
        using var parsed = JsonDocument.Parse(buffer.ToArray());
        parsed.RootElement.WriteTo(json);
    }

    private static string Reserve(double fraction, string? note) =>
        double.IsFinite(fraction) ? (100 * fraction).ToString("+0.0;−0.0;0.0", Inv) : note ?? "n/a";

    private static string Show(double si, ResponseQuantity q, DisplayUnits units) =>
        !double.IsFinite(si) ? (double.IsPositiveInfinity(si) ? "unbounded" : "n/a") : units.Of(q).Format(si) + " " + units.Of(q).Symbol;
}
