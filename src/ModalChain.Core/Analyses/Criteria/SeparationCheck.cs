using System.Collections.Immutable;

namespace ModalChain.Core.Analyses.Criteria;

/// <summary>Evaluates a <see cref="SeparationCriterion"/> against natural frequencies.</summary>
/// <remarks>
/// A pair passes when |f_n − f_e| ≥ m·f_e. Because m·f_e and the band edges (1 ± m)·f_e are rounded in floating
/// point, a natural frequency within 1e-12 (relative) of an edge is taken as lying on it, and passes with zero reserve.
/// The reserve of f_n against the edges e₋ = (1 − m) f_e and e₊ = (1 + m) f_e is (f_n − e₊)/f_n above the band,
/// (e₋ − f_n)/f_n below it, and −min(e₊ − f_n, f_n − e₋)/f_n inside it. A rigid-body mode (0 Hz) has reserve +∞.
/// </remarks>
public static class SeparationCheck
{
    /// <summary>Relative tolerance within which a natural frequency counts as lying on a band edge.</summary>
    public const double EdgeTolerance = 1e-12;

    /// <summary>Checks natural frequencies <paramref name="naturalFrequenciesHz"/> (Hz, mode order) against <paramref name="criterion"/>.</summary>
    public static SeparationResult Evaluate(IReadOnlyList<double> naturalFrequenciesHz, SeparationCriterion criterion)
    {
        ArgumentNullException.ThrowIfNull(naturalFrequenciesHz);
        ArgumentNullException.ThrowIfNull(criterion);
        criterion.Validated();
        var pairs = ImmutableArray.CreateBuilder<SeparationPair>();
        for (var j = 0; j < naturalFrequenciesHz.Count; j++)
            foreach (var (speed, order, fe) in criterion.Excitations())
                pairs.Add(Pair(j + 1, naturalFrequenciesHz[j], speed, order, fe, criterion.Margin));
        var all = pairs.ToImmutable();
        var governing = all.IsEmpty ? null : all.MinBy(p => p.Reserve);
        return new SeparationResult(criterion, all, governing);
    }

    /// <summary>The smallest reserve over all pairs, as a fraction; the criterion passes when it is ≥ 0.</summary>
    public static double GoverningReserve(IReadOnlyList<double> naturalFrequenciesHz, SeparationCriterion criterion)
    {
        var worst = double.PositiveInfinity;
        foreach (var fn in naturalFrequenciesHz)
            foreach (var (_, _, fe) in criterion.Excitations())
                worst = Math.Min(worst, Reserve(fn, fe, criterion.Margin));
        return worst;
    }

    /// <summary>The reserve of a natural frequency <paramref name="fn"/> (Hz) against excitation <paramref name="fe"/> (Hz) with margin <paramref name="margin"/>.</summary>
    public static double Reserve(double fn, double fe, double margin)
    {
        if (!(fn > 0)) return double.PositiveInfinity;
        var lower = (1 - margin) * fe;
        var upper = (1 + margin) * fe;
        if (Math.Abs(fn - upper) <= EdgeTolerance * upper || Math.Abs(fn - lower) <= EdgeTolerance * lower) return 0;
        if (fn >= upper) return (fn - upper) / fn;
        if (fn <= lower) return (lower - fn) / fn;
        return -Math.Min(upper - fn, fn - lower) / fn;
    }

    private static SeparationPair Pair(int mode, double fn, double speed, double order, double fe, double margin)
    {
        var reserve = Reserve(fn, fe, margin);
        return new SeparationPair(mode, fn, speed, order, fe, Math.Abs(fn / fe - 1), reserve, reserve >= 0);
    }
}
