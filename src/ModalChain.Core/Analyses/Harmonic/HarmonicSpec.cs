using System.Collections.Immutable;

namespace ModalChain.Core.Analyses.Harmonic;

/// <summary>How the steady-state response is computed at each frequency.</summary>
public enum HarmonicMethod
{
    /// <summary>Complex linear solve of (K(1+iη) − ω²M + iωC) x = F at every frequency, all DOFs, any damping.</summary>
    Direct,
    /// <summary>Superposition of the lowest modes, with residual flexibility for the rest.</summary>
    Modal,
}

/// <summary>How the points of a frequency range are spaced.</summary>
public enum FrequencySpacing
{
    /// <summary>Equal steps in Hz.</summary>
    Linear,
    /// <summary>Equal ratios between neighbours.</summary>
    Logarithmic,
}

/// <summary>The frequencies of a sweep: a range or an explicit list.</summary>
public abstract record FrequencySweep;

/// <summary>A range of frequencies from <paramref name="FromHz"/> to <paramref name="ToHz"/>, both included.</summary>
/// <param name="FromHz">Lowest frequency in Hz, positive.</param>
/// <param name="ToHz">Highest frequency in Hz, above <paramref name="FromHz"/>.</param>
/// <param name="Points">Number of points, at least 2.</param>
/// <param name="Spacing">Linear or logarithmic spacing.</param>
public sealed record FrequencyRange(double FromHz, double ToHz, int Points, FrequencySpacing Spacing) : FrequencySweep;

/// <summary>Exactly these frequencies, in this order.</summary>
/// <param name="FrequenciesHz">Frequencies in Hz, each positive.</param>
public sealed record FrequencyList(ImmutableArray<double> FrequenciesHz) : FrequencySweep;

/// <summary>What a harmonic sweep computes: which loads, at which frequencies, which outputs, by which method.</summary>
/// <param name="Loads">Names of the loads that act together; empty for every load of the model.</param>
/// <param name="Frequencies">The sweep.</param>
/// <param name="Refine">For a range: add points around each natural frequency in it so no resonance peak is missed.</param>
/// <param name="Outputs">Names of the masses to report; empty for every mass.</param>
/// <param name="Method">Direct solve or modal superposition.</param>
/// <param name="ModeCount">For the modal method: how many of the lowest modes to superpose; null for every mode up to twice the highest frequency.</param>
public sealed record HarmonicSpec(
    ImmutableArray<string> Loads,
    FrequencySweep Frequencies,
    bool Refine,
    ImmutableArray<string> Outputs,
    HarmonicMethod Method,
    int? ModeCount = null)
{
    /// <summary>A linear sweep of every load at every mass by the direct method.</summary>
    public static HarmonicSpec Default(double fromHz, double toHz, int points) =>
        new([], new FrequencyRange(fromHz, toHz, points, FrequencySpacing.Linear), true, [], HarmonicMethod.Direct);
}
