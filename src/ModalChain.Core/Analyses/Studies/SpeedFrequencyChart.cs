using System.Collections.Immutable;

namespace ModalChain.Core.Analyses.Studies;

/// <summary>Where an order line meets a natural frequency: the running speed at which that order excites the mode.</summary>
/// <param name="ModeNumber">1-based mode number.</param>
/// <param name="Order">Harmonic order h.</param>
/// <param name="SpeedHz">Running speed s = f_n / h in Hz (rev/s).</param>
/// <param name="FrequencyHz">The natural frequency f_n in Hz.</param>
public sealed record SpeedFrequencyCrossing(int ModeNumber, double Order, double SpeedHz, double FrequencyHz);

/// <summary>Data of a speed-frequency chart: natural frequencies against running speed, with the order lines f = h·s and their crossings.</summary>
/// <remarks>
/// For a non-rotating lumped structure the natural frequencies do not change with the machine's speed, so they are
/// horizontal lines; an order line h meets mode n at s = f_n/h, which is where a run-up passes through resonance.
/// Crossings are listed only for speeds inside [From, To], ascending in speed.
/// </remarks>
/// <param name="SpeedsHz">Running speeds of the chart's points in Hz.</param>
/// <param name="NaturalFrequenciesHz">Natural frequencies in Hz (non-rigid modes), ascending.</param>
/// <param name="ModeNumbers">The mode number of each natural frequency.</param>
/// <param name="Orders">The orders drawn.</param>
/// <param name="Crossings">Where each order line meets each natural frequency within the speed range.</param>
public sealed record SpeedFrequencyChart(
    ImmutableArray<double> SpeedsHz, ImmutableArray<double> NaturalFrequenciesHz, ImmutableArray<int> ModeNumbers,
    ImmutableArray<double> Orders, ImmutableArray<SpeedFrequencyCrossing> Crossings)
{
    /// <summary>Builds the chart for natural frequencies <paramref name="modes"/> over speeds <paramref name="fromHz"/>..<paramref name="toHz"/> (Hz).</summary>
    /// <param name="modes">Mode numbers and natural frequencies in Hz; rigid-body modes (0 Hz) are left out.</param>
    /// <param name="fromHz">Lowest speed in Hz, non-negative.</param>
    /// <param name="toHz">Highest speed in Hz, above <paramref name="fromHz"/>.</param>
    /// <param name="points">Number of chart points along the speed axis, at least 2.</param>
    /// <param name="orders">Harmonic orders, each positive.</param>
    public static SpeedFrequencyChart Build(IReadOnlyList<(int Number, double FrequencyHz)> modes, double fromHz, double toHz, int points, IReadOnlyList<double> orders)
    {
        ArgumentNullException.ThrowIfNull(modes);
        ArgumentNullException.ThrowIfNull(orders);
        Guard.NonNegative(fromHz, nameof(fromHz));
        Guard.Positive(toHz, nameof(toHz));
        if (!(toHz > fromHz)) throw new ArgumentException("The speed range must increase.", nameof(toHz));
        if (points < 2) throw new ArgumentOutOfRangeException(nameof(points), points, "At least two points are needed.");
        foreach (var h in orders) Guard.Positive(h, nameof(orders));

        var speeds = Enumerable.Range(0, points).Select(i => fromHz + (toHz - fromHz) * i / (points - 1)).ToImmutableArray();
        var elastic = modes.Where(m => m.FrequencyHz > 0).OrderBy(m => m.FrequencyHz).ToArray();
        var crossings = (
            from m in elastic
            from h in orders
            let s = m.FrequencyHz / h
            where s >= fromHz && s <= toHz
            orderby s, m.Number, h
            select new SpeedFrequencyCrossing(m.Number, h, s, m.FrequencyHz)).ToImmutableArray();
        return new SpeedFrequencyChart(speeds, [.. elastic.Select(m => m.FrequencyHz)], [.. elastic.Select(m => m.Number)], [.. orders], crossings);
    }
}
