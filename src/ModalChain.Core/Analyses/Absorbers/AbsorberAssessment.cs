using System.Collections.Immutable;
using ModalChain.Core.Analyses.Harmonic;

namespace ModalChain.Core.Analyses.Absorbers;

/// <summary>The host's response peak when the absorber's tuned frequency is off by a fraction.</summary>
/// <param name="FrequencyError">Relative error of the absorber's frequency, e.g. −0.1 for 10 % low.</param>
/// <param name="Peak">Worst host amplification over the band with that error (same measure as <see cref="AbsorberAssessment.PeakAfter"/>).</param>
public sealed record MistuningPoint(double FrequencyError, double Peak)
{
    /// <summary>Worst host amplification at the excitation frequencies (running speeds × orders) with that error; NaN when none is known.</summary>
    public double AtSpeeds { get; init; } = double.NaN;
}

/// <summary>The host's response at one excitation frequency (a running speed × order), without and with the absorber.</summary>
/// <param name="FrequencyHz">The excitation frequency, Hz.</param>
/// <param name="Before">Host amplification |x_host|·K/|F| without the absorber (+∞ at an undamped resonance).</param>
/// <param name="After">The same with the absorber attached.</param>
public sealed record SpeedResponse(double FrequencyHz, double Before, double After);

/// <summary>A mode of the model other than the controlled one whose frequency lies in 0.5–1.5 times the controlled mode's.</summary>
/// <param name="ModeNumber">1-based number of the neighbouring mode (model without the absorber).</param>
/// <param name="FrequencyHz">Its natural frequency, Hz.</param>
/// <param name="PeakBefore">Largest host amplification peak in 0.5–1.5 f_p that belongs to that mode, without the absorber (same measure as the controlled peak); NaN when none of the band's peaks belongs to it.</param>
/// <param name="PeakAfter">The same with the absorber.</param>
public sealed record NeighbourMode(int ModeNumber, double FrequencyHz, double PeakBefore, double PeakAfter);

/// <summary>How a designed absorber performs on the full network, from harmonic responses.</summary>
/// <param name="BandHz">The frequency band searched for peaks, Hz: 0.5–1.5 f_p (<see cref="AbsorberPerformance.Band"/>).</param>
/// <param name="PeakBefore">Largest peak of the controlled mode (<see cref="AbsorberPerformance.Owner"/>): worst dynamic amplification of the host without the absorber: |x_host|·K_modal/|F| with the mode's modal stiffness K = M ω_p², for a unit force at the host.</param>
/// <param name="PeakAfter">The same with the absorber attached.</param>
/// <param name="PeakFrequencyHz">Frequency of <paramref name="PeakAfter"/>, Hz.</param>
/// <param name="StrokePerForce">Absorber stroke (relative displacement to the host) at that frequency per unit force at the host, m/N.</param>
/// <param name="Mistuning">Peaks with the absorber's frequency off by ±5 % and ±10 %.</param>
public sealed record AbsorberAssessment(
    (double Low, double High) BandHz, double PeakBefore, double PeakAfter, double PeakFrequencyHz, double StrokePerForce,
    ImmutableArray<MistuningPoint> Mistuning)
{
    /// <summary>Peak stroke in m under the model's own loads at their running speeds (or its load cases combined by their rule); NaN when no load has a speed.</summary>
    public double OperatingStroke { get; init; } = double.NaN;

    /// <summary>What <see cref="OperatingStroke"/> was computed under, in words ("the model's loads at their running speeds", or the load cases and their rule).</summary>
    public string OperatingStrokeBasis { get; init; } = AbsorberPerformance.LoadsBasis;

    /// <summary>The mode (of the model without the absorber) the peak after belongs to, by <see cref="AbsorberPerformance.Owner"/>: the controlled one unless no peak in the band is its.</summary>
    public int PeakAfterMode { get; init; }

    /// <summary>Where the largest host response without the absorber sits when it is on an end of the band (the response rises beyond it).</summary>
    public SweepEdge PeakBeforeRisingAt { get; init; } = SweepEdge.None;

    /// <summary>The same with the absorber.</summary>
    public SweepEdge PeakAfterRisingAt { get; init; } = SweepEdge.None;

    /// <summary>The host's response at every excitation frequency, before and after.</summary>
    public ImmutableArray<SpeedResponse> AtSpeeds { get; init; } = [];

    /// <summary>Other modes within 0.5–1.5 f_p, which the absorber does not control, with their peaks before and after.</summary>
    public ImmutableArray<NeighbourMode> Neighbours { get; init; } = [];
}
