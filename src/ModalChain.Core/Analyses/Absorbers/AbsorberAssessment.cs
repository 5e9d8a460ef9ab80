using System.Collections.Immutable;

namespace ModalChain.Core.Analyses.Absorbers;

/// <summary>The host's response peak when the absorber's tuned frequency is off by a fraction.</summary>
/// <param name="FrequencyError">Relative error of the absorber's frequency, e.g. −0.1 for 10 % low.</param>
/// <param name="Peak">Worst host amplification over the band with that error (same measure as <see cref="AbsorberAssessment.PeakAfter"/>).</param>
public sealed record MistuningPoint(double FrequencyError, double Peak);

/// <summary>How a designed absorber performs on the full network, from harmonic responses.</summary>
/// <param name="BandHz">The frequency band searched for peaks, Hz.</param>
/// <param name="PeakBefore">Worst dynamic amplification of the host without the absorber: |x_host|·K_modal/|F| with the mode's modal stiffness K = M ω_p², for a unit force at the host.</param>
/// <param name="PeakAfter">The same with the absorber attached.</param>
/// <param name="PeakFrequencyHz">Frequency of <paramref name="PeakAfter"/>, Hz.</param>
/// <param name="StrokePerForce">Absorber stroke (relative displacement to the host) at that frequency per unit force at the host, m/N.</param>
/// <param name="Mistuning">Peaks with the absorber's frequency off by ±5 % and ±10 %.</param>
public sealed record AbsorberAssessment(
    (double Low, double High) BandHz, double PeakBefore, double PeakAfter, double PeakFrequencyHz, double StrokePerForce,
    ImmutableArray<MistuningPoint> Mistuning)
{
    /// <summary>Peak stroke in m under the model's own loads at their running speeds; NaN when no load has a speed.</summary>
    public double OperatingStroke { get; init; } = double.NaN;
}
