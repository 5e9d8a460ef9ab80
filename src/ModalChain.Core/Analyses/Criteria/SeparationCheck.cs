using System.Collections.Immutable;
using ModalChain.Core.Analyses.Modal;

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
    /// <param name="naturalFrequenciesHz">Natural frequencies in Hz, in mode order.</param>
    /// <param name="criterion">The rule.</param>
    /// <param name="exemptShares">Per mode, the share of its kinetic energy carried by the criterion's exempt masses
    /// (<see cref="ExemptShares"/>); a mode above <see cref="SeparationCriterion.ExemptShare"/> is not checked. Null: none exempt.</param>
    public static SeparationResult Evaluate(IReadOnlyList<double> naturalFrequenciesHz, SeparationCriterion criterion, IReadOnlyList<double>? exemptShares = null)
    {
        ArgumentNullException.ThrowIfNull(naturalFrequenciesHz);
        ArgumentNullException.ThrowIfNull(criterion);
        criterion.Validated();
        if (exemptShares is not null && exemptShares.Count != naturalFrequenciesHz.Count)
            throw new ArgumentException($"{exemptShares.Count} exempt shares for {naturalFrequenciesHz.Count} modes.", nameof(exemptShares));
        var pairs = ImmutableArray.CreateBuilder<SeparationPair>();
        var exempted = ImmutableArray.CreateBuilder<ExemptMode>();
        for (var j = 0; j < naturalFrequenciesHz.Count; j++)
        {
            if (IsExempt(exemptShares, j))
            {
                exempted.Add(new ExemptMode(j + 1, naturalFrequenciesHz[j], exemptShares![j], criterion.Exempt));
                continue;
            }
            foreach (var (speed, order, fe) in criterion.Excitations())
                pairs.Add(Pair(j + 1, naturalFrequenciesHz[j], speed, order, fe, criterion.Margin));
        }
        var all = pairs.ToImmutable();
        var governing = all.IsEmpty ? null : all.MinBy(p => p.Reserve);
        return new SeparationResult(criterion, all, governing) { Exempted = exempted.ToImmutable() };
    }

    /// <summary>The smallest reserve over all pairs of the modes checked, as a fraction; the criterion passes when it is ≥ 0.</summary>
    /// <param name="naturalFrequenciesHz">Natural frequencies in Hz, in mode order.</param>
    /// <param name="criterion">The rule.</param>
    /// <param name="exemptShares">As for <see cref="Evaluate"/>.</param>
    public static double GoverningReserve(IReadOnlyList<double> naturalFrequenciesHz, SeparationCriterion criterion, IReadOnlyList<double>? exemptShares = null)
    {
        ArgumentNullException.ThrowIfNull(naturalFrequenciesHz);
        ArgumentNullException.ThrowIfNull(criterion);
        var worst = double.PositiveInfinity;
        for (var j = 0; j < naturalFrequenciesHz.Count; j++)
        {
            if (IsExempt(exemptShares, j)) continue;
            foreach (var (_, _, fe) in criterion.Excitations())
                worst = Math.Min(worst, Reserve(naturalFrequenciesHz[j], fe, criterion.Margin));
        }
        return worst;
    }

    /// <summary>Per mode of <paramref name="modal"/>, the share of its kinetic energy carried by <paramref name="masses"/>:
    /// Σ m_k φ_k² over those masses divided by Σ m φ² over every mass (plane and 3d models: the kinetic-energy shares of their DOFs,
    /// bodies counted in the whole); null when no mass is named.</summary>
    public static ImmutableArray<double>? ExemptShares(ModalResult modal, IReadOnlyCollection<string> masses)
    {
        ArgumentNullException.ThrowIfNull(modal);
        ArgumentNullException.ThrowIfNull(masses);
        if (masses.Count == 0) return null;
        if (modal.Network.Space != Model.ModelSpace.Line)
        {
            // Plane and 3d models: the named masses' DOFs' kinetic-energy shares (which sum to 1 over every DOF, bodies included).
            var dofs = modal.Matrices.Dofs.Dofs;
            return [.. modal.Modes.Select(mode => Enumerable.Range(0, dofs.Length).Where(i => masses.Contains(dofs[i].Node)).Sum(i => mode.KineticEnergyShare[i]))];
        }
        var named = modal.Network.Masses.Select(m => masses.Contains(m.Name)).ToArray();
        var kilograms = modal.Network.Masses.Select(m => m.Kilograms).ToArray();
        return [.. modal.Modes.Select(mode =>
        {
            var shape = modal.ShapeByMass(mode);
            double part = 0, total = 0;
            for (var k = 0; k < shape.Length; k++)
            {
                var energy = kilograms[k] * shape[k] * shape[k];
                total += energy;
                if (named[k]) part += energy;
            }
            return total > 0 ? part / total : 0;
        })];
    }

    private static bool IsExempt(IReadOnlyList<double>? shares, int mode) => shares is not null && shares[mode] > SeparationCriterion.ExemptShare;

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
