using System.Collections.Immutable;

namespace ModalChain.Core.Analyses.Harmonic;

/// <summary>Turns a sweep specification into the list of frequencies computed.</summary>
public static class FrequencyGrid
{
    /// <summary>Offsets, in multiples of ζ·f_n, of the points added around a natural frequency f_n.</summary>
    /// <remarks>The half-power points lie near f_n(1 ± ζ); ±3ζ covers the resonance peak's shoulders (common practice).</remarks>
    private static readonly double[] RefineOffsets = [-3, -2, -1.5, -1, -0.6, -0.3, 0, 0.3, 0.6, 1, 1.5, 2, 3];

    /// <summary>The frequencies in Hz for <paramref name="sweep"/>; a range is refined around <paramref name="naturalFrequenciesHz"/> when <paramref name="refine"/>.</summary>
    /// <param name="sweep">Range or explicit list.</param>
    /// <param name="refine">Whether to add points near natural frequencies (ranges only).</param>
    /// <param name="naturalFrequenciesHz">Undamped natural frequencies in Hz.</param>
    /// <param name="dampingRatios">Damping ratio of each natural frequency (NaN or 0 allowed: a floor of 0.1 % is used).</param>
    public static ImmutableArray<double> Build(FrequencySweep sweep, bool refine, IReadOnlyList<double> naturalFrequenciesHz, IReadOnlyList<double> dampingRatios)
    {
        ArgumentNullException.ThrowIfNull(sweep);
        switch (sweep)
        {
            case FrequencyList list:
                foreach (var f in list.FrequenciesHz) Guard.Positive(f, "frequency");
                return list.FrequenciesHz;
            case FrequencyRange range:
                Guard.Positive(range.FromHz, nameof(range.FromHz));
                if (!(range.ToHz > range.FromHz)) throw new ArgumentException($"The sweep must rise: from {range.FromHz} Hz to {range.ToHz} Hz.", nameof(sweep));
                if (range.Points < 2) throw new ArgumentException($"A range needs at least 2 points, got {range.Points}.", nameof(sweep));
                var points = new List<double>(range.Points + 16 * naturalFrequenciesHz.Count);
                for (var i = 0; i < range.Points; i++)
                {
                    var t = (double)i / (range.Points - 1);
                    points.Add(range.Spacing == FrequencySpacing.Logarithmic
                        ? range.FromHz * Math.Pow(range.ToHz / range.FromHz, t)
                        : range.FromHz + t * (range.ToHz - range.FromHz));
                }
                points[^1] = range.ToHz;
                if (refine)
                    for (var j = 0; j < naturalFrequenciesHz.Count; j++)
                    {
                        var fn = naturalFrequenciesHz[j];
                        if (!(fn > 0) || fn < range.FromHz || fn > range.ToHz) continue;
                        var given = j < dampingRatios.Count && double.IsFinite(dampingRatios[j]) ? dampingRatios[j] : 0;
                        var zeta = Math.Min(Math.Max(given, 1e-3), 0.3);
                        // An undamped mode is singular exactly at f_n: straddle it instead.
                        foreach (var o in RefineOffsets)
                            if (o != 0 || given > 0) points.Add(fn * (1 + o * zeta));
                        if (given > 0) points.Add(fn * Math.Sqrt(1 - 2 * zeta * zeta));
                    }
                points.RemoveAll(f => f < range.FromHz || f > range.ToHz);
                points.Sort();
                var result = ImmutableArray.CreateBuilder<double>(points.Count);
                foreach (var f in points)
                    if (result.Count == 0 || f - result[^1] > 1e-9 * f) result.Add(f);
                return result.ToImmutable();
            default:
                throw new ArgumentException($"Unknown sweep kind {sweep.GetType().Name}.", nameof(sweep));
        }
    }
}
