using ModalChain.Core;
using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Io.Json.Records;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Io.Json;

/// <summary>Maps a <see cref="CheckOutcome"/> to its output record, <see cref="CheckOutput"/>, and writes it.</summary>
/// <remarks>
/// Reserves are fractions: separation reserve = relative change of the natural frequency that reaches the band edge;
/// limit reserve = (limit − value)/limit. A reserve with no finite value is null, with "reserve_note" saying why
/// (JSON has no infinity). Machine zones and floor curves compare r.m.s. velocity ("measure": "rms"); a floor
/// curve's reserve is its worst band's.
/// </remarks>
public static class CheckJson
{
    /// <summary>Writes one JSON object to <paramref name="stream"/>.</summary>
    public static void Write(Stream stream, ModelDocument document, CheckOutcome outcome, string toolVersion) =>
        OutputJson.Write(stream, Output(document, outcome, toolVersion));

    /// <summary>The output record of a check.</summary>
    public static CheckOutput Output(ModelDocument document, CheckOutcome outcome, string toolVersion)
    {
        ArgumentNullException.ThrowIfNull(document);
        ArgumentNullException.ThrowIfNull(outcome);
        return new()
        {
            Title = MarkupText.Clean(document.Network.Title),
            FormatVersion = JsonFormat.Version,
            Source = SourceOutput.Of(document, toolVersion),
            Passes = outcome.AllPass,
            Separation = outcome.Separation is { } sep ? new()
            {
                Passes = sep.Passes,
                Margin = sep.Criterion.Margin,
                SpeedsHz = sep.Criterion.SpeedsHz,
                Orders = sep.Criterion.Orders,
                Reserve = sep.Reserve,
                ReserveNote = sep.ReserveNote,
                Pairs = [.. sep.Pairs.Select(p => new CheckPairOutput
                {
                    Mode = p.ModeNumber,
                    FrequencyHz = p.NaturalFrequencyHz,
                    SpeedHz = p.SpeedHz,
                    Order = p.Order,
                    ExcitationHz = p.ExcitationHz,
                    Separation = p.Separation,
                    Reserve = p.Reserve,
                    ReserveNote = p.ReserveNote,
                    Passes = p.Passes,
                })],
                Exempt = [.. sep.Criterion.Exempt.Select(MarkupText.Clean)],
                ExemptModes = [.. sep.Exempted.Select(x => new CheckExemptModeOutput
                {
                    Mode = x.ModeNumber,
                    FrequencyHz = x.NaturalFrequencyHz,
                    KineticEnergyShare = x.KineticEnergyShare,
                    Reason = MarkupText.Clean(x.Reason),
                })],
            } : null,
            LoadCaseCombination = outcome.Combination is { } rule ? LoadCaseSelection.Name(rule) : null,
            Limits = [.. outcome.Limits.Select(l => new CheckLimitOutput
            {
                At = l.Limit.At,
                MeasuredAt = l.MeasuredAt,
                Quantity = l.Limit.Quantity.ToString().ToLowerInvariant(),
                Measure = l.Limit.Measure == AmplitudeMeasure.Peak ? "peak" : "rms",
                Unit = Unit(l.Limit.Quantity),
                Limit = l.Limit.Value,
                Value = l.Value,
                Reserve = l.Reserve,
                ReserveNote = l.ReserveNote,
                Passes = l.Passes,
            })],
            MachineZones = [.. outcome.Zones.Select(z => new CheckZoneOutput
            {
                At = z.At,
                MeasuredAt = z.MeasuredAt,
                Class = z.Criterion.Class.Name,
                Quantity = "velocity",
                Measure = "rms",
                Unit = "m/s",
                AcceptedZone = z.Criterion.AcceptedZone.ToString(),
                Limit = z.Criterion.Limit,
                Value = z.RmsVelocity,
                Zone = z.Zone.ToString(),
                Boundaries = new() { AB = z.Criterion.Class.BoundaryAB, BC = z.Criterion.Class.BoundaryBC, CD = z.Criterion.Class.BoundaryCD },
                Source = z.Criterion.Class.Source,
                Reserve = z.Reserve,
                ReserveNote = z.ReserveNote,
                Passes = z.Passes,
            })],
            FloorCurves = [.. outcome.Floors.Select(f => new CheckFloorOutput
            {
                At = f.At,
                MeasuredAt = f.MeasuredAt,
                Curve = f.Criterion.Curve.Name,
                Quantity = "velocity",
                Measure = "rms",
                Unit = "m/s",
                Source = f.Criterion.Curve.Source,
                Bands = [.. f.Bands.Select(b => new CheckBandOutput
                {
                    CentreHz = b.CentreHz,
                    NominalHz = b.NominalHz,
                    Value = b.RmsVelocity,
                    Limit = b.Limit,
                    Reserve = b.Reserve,
                    Passes = b.Passes,
                })],
                UncomparedHz = f.UncomparedHz,
                Reserve = f.Reserve,
                ReserveNote = f.ReserveNote,
                Passes = f.Passes,
            })],
            NotEvaluated = [.. outcome.NotEvaluated.Select(n => new CheckNotEvaluatedOutput { Criterion = n.Criterion, Reason = n.Reason })],
            Caution = Cautions.Text,
        };
    }

    internal static string Unit(ResponseQuantity q) => q switch
    {
        ResponseQuantity.Displacement => "m",
        ResponseQuantity.Velocity => "m/s",
        _ => "m/s^2",
    };
}
