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
        return new CriteriaSection(context, CriteriaCheck.Evaluate(context.Damped, criteria, OperatingLoads.Of(context.Document)));
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
            html.Table(string.Create(Inv, $"Frequency separation: no natural frequency within ±{DisplayUnits.Given(100 * c.Margin)} % of running speed × order"),
                ["Speed (rpm)", "Order", "Excitation (Hz)", "Band (Hz)", "Nearest mode", "f (Hz)", "Separation (%)", "Reserve (%)", "Result"],
                rows, new HashSet<int> { 0, 1, 2, 4, 5, 6, 7 }, "criteria-table");
        }
        if (_outcome.Limits.Count > 0)
            html.Table("Vibration limits at the operating points",
                ["Criterion", "Value", "Limit", "Reserve (%)", "Result"],
                _outcome.Limits.Select(l => (IReadOnlyList<string>)
                [
                    l.Limit.Describe(), Show(l.Value, l.Limit.Quantity), Show(l.Limit.Value, l.Limit.Quantity), Reserve(l.Reserve, l.ReserveNote), l.Passes ? "pass" : "FAIL",
                ]), new HashSet<int> { 1, 2, 3 }, "criteria-table");
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

    private static string Show(double si, ResponseQuantity q) => q switch
    {
        ResponseQuantity.Displacement => DisplayUnits.Number(si * 1e3) + " mm",
        ResponseQuantity.Velocity => DisplayUnits.Number(si * 1e3) + " mm/s",
        _ => DisplayUnits.Number(si) + " m/s²",
    };
}
