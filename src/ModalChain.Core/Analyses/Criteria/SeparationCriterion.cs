using System.Collections.Immutable;

namespace ModalChain.Core.Analyses.Criteria;

/// <summary>The frequency-separation rule: no natural frequency within ±margin of any running speed × order.</summary>
/// <remarks>
/// The excitation frequency of a speed s (Hz) and an order h is f_e = h·s. The forbidden band is the open interval
/// ((1 − m)·f_e, (1 + m)·f_e); a natural frequency exactly on an edge passes. The 20 % margin that is usual in
/// machine-foundation work is common practice, not a code requirement (see docs/criteria.md).
/// </remarks>
/// <param name="Margin">Margin m as a fraction of the excitation frequency (0.2 for ±20 %), in (0, 1).</param>
/// <param name="SpeedsHz">Running speeds in Hz (revolutions per second), each positive.</param>
/// <param name="Orders">Harmonic orders h (1 for running speed, 2 for twice running speed, …), each positive.</param>
public sealed record SeparationCriterion(double Margin, ImmutableArray<double> SpeedsHz, ImmutableArray<double> Orders)
{
    /// <summary>The margin used when a model does not state one: ±20 % (common practice).</summary>
    public const double DefaultMargin = 0.20;

    /// <summary>The share of a mode's kinetic energy above which the <see cref="Exempt"/> masses make it an exempt mode: 0.2.</summary>
    /// <remarks>
    /// Not a majority: an absorber splits the mode it controls into two, and with the classical tuning
    /// f_a/f_p = 1/(1 + μ) the absorber carries a share μr²/(1 + μr²), r = 1/(1 − ω²/ω_a²), of each one's kinetic energy:
    /// 0.57/0.43 at μ = 1 %, 0.66/0.34 at 5 %, 0.72/0.28 at 10 %, 0.79/0.21 at 20 % (lower/upper mode). A majority rule
    /// would exempt only the lower mode. A structural mode away from the absorber's frequency moves the absorber with
    /// its host, a share of about its mass fraction, well below 0.2.
    /// </remarks>
    public const double ExemptShare = 0.2;

    /// <summary>
    /// Names of masses (typically absorber masses) whose own modes are exempt from the rule: a mode in which these
    /// masses together carry more than <see cref="ExemptShare"/> (20 %) of the kinetic energy (Σ m_k φ_k² over them, divided by
    /// Σ m φ² over every mass) is not checked. An absorber splits the mode it controls into two modes either side of
    /// the running speed by design; judging those by separation would fail every working absorber.
    /// </summary>
    public ImmutableArray<string> Exempt { get; init; } = [];

    /// <summary>Checks the fields; throws for a caller bug (the reader reports input problems itself).</summary>
    public SeparationCriterion Validated()
    {
        if (!(Margin > 0 && Margin < 1)) throw new ArgumentOutOfRangeException(nameof(Margin), Margin, "The margin must lie in (0, 1).");
        if (SpeedsHz.IsDefaultOrEmpty) throw new ArgumentException("At least one running speed is needed.", nameof(SpeedsHz));
        if (Orders.IsDefaultOrEmpty) throw new ArgumentException("At least one order is needed.", nameof(Orders));
        foreach (var s in SpeedsHz) Guard.Positive(s, nameof(SpeedsHz));
        foreach (var h in Orders) Guard.Positive(h, nameof(Orders));
        return this;
    }

    /// <summary>Every excitation frequency h·s in Hz with its speed and order, speeds outer, orders inner, in the order given.</summary>
    public IEnumerable<(double SpeedHz, double Order, double FrequencyHz)> Excitations() =>
        SpeedsHz.SelectMany(s => Orders.Select(h => (s, h, h * s)));
}

/// <summary>How one natural frequency stands against one excitation frequency.</summary>
/// <param name="ModeNumber">1-based number of the mode (ascending frequency).</param>
/// <param name="NaturalFrequencyHz">The mode's natural frequency in Hz.</param>
/// <param name="SpeedHz">Running speed in Hz.</param>
/// <param name="Order">Harmonic order.</param>
/// <param name="ExcitationHz">Excitation frequency order × speed in Hz.</param>
/// <param name="Separation">|f_n / f_e − 1|, the relative distance from the excitation (a fraction).</param>
/// <param name="Reserve">
/// Signed relative change of the natural frequency that would put it on the nearest band edge, as a fraction of
/// f_n: positive outside the band (how far it may move before failing), negative inside (how far it must move to pass).
/// </param>
/// <param name="Passes">True when the natural frequency is outside the open band (an edge passes).</param>
public sealed record SeparationPair(
    int ModeNumber, double NaturalFrequencyHz, double SpeedHz, double Order, double ExcitationHz,
    double Separation, double Reserve, bool Passes)
{
    /// <summary>Why <see cref="Reserve"/> has no finite value (a rigid-body mode lies in no band), or null when it has one.</summary>
    public string? ReserveNote => ReserveNotes.OfSeparation(Reserve, rigidBody: true);
}

/// <summary>The sentences printed, and written to JSON beside a null, where a reserve has no finite value.</summary>
public static class ReserveNotes
{
    /// <summary>For a separation pair or check whose reserve is <paramref name="reserve"/>; null when it is finite.</summary>
    /// <param name="reserve">The reserve (a fraction).</param>
    /// <param name="rigidBody">True for one pair (its mode is a rigid-body mode), false for the whole check (no elastic mode at all).</param>
    public static string? OfSeparation(double reserve, bool rigidBody) =>
        double.IsFinite(reserve) ? null
        : double.IsPositiveInfinity(reserve)
            ? rigidBody ? "n/a: rigid-body mode (0 Hz), in no band" : "n/a: no mode in range, only rigid-body modes at 0 Hz"
            : "n/a: not evaluated";

    /// <summary>For a vibration limit whose response is <paramref name="value"/> and reserve <paramref name="reserve"/>; null when both are finite.</summary>
    public static string? OfLimit(double value, double reserve) =>
        double.IsFinite(value) && double.IsFinite(reserve) ? null
        : double.IsPositiveInfinity(value) ? "n/a: the response is unbounded (undamped resonance at an operating speed)"
        : double.IsNegativeInfinity(reserve) ? "n/a: not evaluated"
        : "n/a: the response could not be computed";
}

/// <summary>A mode left out of the separation check because the criterion's exempt masses carry most of its kinetic energy.</summary>
/// <param name="ModeNumber">1-based number of the mode.</param>
/// <param name="NaturalFrequencyHz">Its natural frequency in Hz.</param>
/// <param name="KineticEnergyShare">The share of the mode's kinetic energy carried by the exempt masses (a fraction above <see cref="SeparationCriterion.ExemptShare"/>).</param>
/// <param name="Masses">The exempt masses, as the criterion names them.</param>
public sealed record ExemptMode(int ModeNumber, double NaturalFrequencyHz, double KineticEnergyShare, ImmutableArray<string> Masses)
{
    /// <summary>Why the mode is not checked, as a sentence a reviewer can act on.</summary>
    public string Reason => string.Create(System.Globalization.CultureInfo.InvariantCulture,
        $"{string.Join(", ", Masses.Select(m => $"'{m}'"))} {(Masses.Length == 1 ? "carries" : "carry")} {100 * KineticEnergyShare:F1} % of its kinetic energy " +
        $"(more than {100 * SeparationCriterion.ExemptShare:G3} %), so it is exempt by criteria.separation.exempt");
}

/// <summary>The outcome of a separation check over every mode, speed and order.</summary>
/// <param name="Criterion">The rule checked.</param>
/// <param name="Pairs">One entry per (mode, speed, order) of the modes checked (exempt modes have none), modes outer.</param>
/// <param name="Governing">The pair with the smallest reserve (the one nearest to failing, or failing most); null with no modes.</param>
public sealed record SeparationResult(SeparationCriterion Criterion, ImmutableArray<SeparationPair> Pairs, SeparationPair? Governing)
{
    /// <summary>The modes left out because the exempt masses carry most of their kinetic energy, in mode order.</summary>
    public ImmutableArray<ExemptMode> Exempted { get; init; } = [];

    /// <summary>True when every pair passes.</summary>
    public bool Passes => Pairs.All(p => p.Passes);

    /// <summary>The governing reserve as a fraction (+∞ when there is nothing to check).</summary>
    public double Reserve => Governing?.Reserve ?? double.PositiveInfinity;

    /// <summary>Why <see cref="Reserve"/> has no finite value (no elastic mode, or every mode exempt), or null when it has one.</summary>
    public string? ReserveNote =>
        Governing is null && !Exempted.IsEmpty ? "n/a: every mode is exempt (criteria.separation.exempt)" : ReserveNotes.OfSeparation(Reserve, rigidBody: false);
}
