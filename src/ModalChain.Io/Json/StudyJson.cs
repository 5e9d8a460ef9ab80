using ModalChain.Core;
using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Studies;
using ModalChain.Io.Json.Records;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Io.Json;

/// <summary>Maps parameter studies and speed-frequency charts to their output records (SI units; speeds also in rpm)
/// and writes them.</summary>
public static class StudyJson
{
    /// <summary>Writes a parameter study as one JSON object to <paramref name="stream"/>.</summary>
    public static void Write(Stream stream, ModelDocument document, StudyResult result, string unit, string toolVersion) =>
        OutputJson.Write(stream, Output(document, result, unit, toolVersion));

    /// <summary>Writes a speed-frequency chart as one JSON object to <paramref name="stream"/>.</summary>
    public static void WriteChart(Stream stream, ModelDocument document, SpeedFrequencyChart chart, string toolVersion) =>
        OutputJson.Write(stream, Output(document, chart, toolVersion));

    /// <summary>The output record of a parameter study; <paramref name="unit"/> is the SI unit of the varied field.</summary>
    public static ParameterStudyOutput Output(ModelDocument document, StudyResult result, string unit, string toolVersion)
    {
        ArgumentNullException.ThrowIfNull(document);
        ArgumentNullException.ThrowIfNull(result);
        var criteria = result.Request.Criteria;
        return new()
        {
            Title = MarkupText.Clean(document.Network.Title),
            FormatVersion = JsonFormat.Version,
            Source = SourceOutput.Of(document, toolVersion),
            Parameter = result.Request.Parameter.Text,
            Unit = unit,
            Values = [.. result.Steps.Select(s => s.Value)],
            Modes = [.. result.Modes.Select(m => new StudyModeOutput
            {
                Identity = m.Identity,
                FrequencyHz = m.FrequenciesHz,
                ModeNumber = m.ModeNumbers,
                MacToPrevious = m.Mac,
                // Plane and 3d models: the mode's motion name at each value.
                Motion = m.Motions.IsDefaultOrEmpty ? null : m.Motions,
            })],
            Criteria = [.. criteria.Select((criterion, c) => new StudyCriterionOutput
            {
                Name = criterion.Name,
                Reserve = [.. result.Steps.Select(s => s.Reserves[c])],
                // Beside each null reserve, the reason (JSON has no infinity).
                ReserveNote = result.Steps.Any(s => !double.IsFinite(s.Reserves[c]))
                    ? [.. result.Steps.Select(s => criterion.Limit is null
                        ? ReserveNotes.OfSeparation(s.Reserves[c], rigidBody: false)
                        : ReserveNotes.OfLimit(0, s.Reserves[c]))]
                    : null,
                Passes = [.. result.Steps.Select(s => s.Reserves[c] >= 0)],
                // The operating-point response at each value, in the limit's measure and SI unit.
                Unit = criterion.Limit is { } l ? CheckJson.Unit(l.Quantity) : null,
                Limit = criterion.Limit?.Value,
                Response = criterion.Limit is { } limit ? [.. result.Steps.Select(s => limit.Value * (1 - s.Reserves[c]))] : null,
            })],
            Thresholds = [.. result.Thresholds.Select(t => new StudyThresholdOutput
            {
                Criterion = t.Criterion,
                Value = t.Value,
                Direction = t.PassesAbove ? "passes above" : "passes below",
                Bracket = [t.Bracket.Low, t.Bracket.High],
            })],
            Caution = Cautions.Text,
        };
    }

    /// <summary>The output record of a speed-frequency chart.</summary>
    public static SpeedChartOutput Output(ModelDocument document, SpeedFrequencyChart chart, string toolVersion)
    {
        ArgumentNullException.ThrowIfNull(document);
        ArgumentNullException.ThrowIfNull(chart);
        return new()
        {
            Title = MarkupText.Clean(document.Network.Title),
            FormatVersion = JsonFormat.Version,
            Source = SourceOutput.Of(document, toolVersion),
            Chart = "speed-frequency",
            SpeedsHz = chart.SpeedsHz,
            SpeedsRpm = [.. chart.SpeedsHz.Select(s => s * 60)],
            NaturalFrequencies = [.. chart.NaturalFrequenciesHz.Select((f, i) => new SpeedChartModeOutput { Mode = chart.ModeNumbers[i], FrequencyHz = f })],
            OrderLines = [.. chart.Orders.Select(h => new SpeedChartOrderOutput { Order = h, FrequencyHz = [.. chart.SpeedsHz.Select(s => h * s)] })],
            Crossings = [.. chart.Crossings.Select(c => new SpeedChartCrossingOutput
            {
                Mode = c.ModeNumber,
                Order = c.Order,
                SpeedHz = c.SpeedHz,
                SpeedRpm = c.SpeedHz * 60,
                FrequencyHz = c.FrequencyHz,
            })],
            Caution = Cautions.Text,
        };
    }
}
