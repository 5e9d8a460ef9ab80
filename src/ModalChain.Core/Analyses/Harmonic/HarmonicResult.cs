using System.Collections.Immutable;
using System.Numerics;

namespace ModalChain.Core.Analyses.Harmonic;

/// <summary>A response quantity of a mass.</summary>
public enum ResponseQuantity
{
    /// <summary>Displacement X in m.</summary>
    Displacement,
    /// <summary>Velocity iωX in m/s.</summary>
    Velocity,
    /// <summary>Acceleration −ω²X in m/s².</summary>
    Acceleration,
}

/// <summary>Kind of network element whose force is reported.</summary>
public enum ElementKind
{
    /// <summary>A spring: force k(1 + iη)(X_A − X_B).</summary>
    Spring,
    /// <summary>A discrete viscous damper: force iωc(X_A − X_B).</summary>
    Damper,
}

/// <summary>Complex displacement amplitudes of one mass over the sweep (velocity and acceleration follow from them).</summary>
/// <param name="Dof">Name of the mass.</param>
/// <param name="Displacement">Complex displacement amplitude in m at each frequency of the sweep.</param>
public sealed record DofResponse(string Dof, ImmutableArray<Complex> Displacement)
{
    /// <summary>The complex amplitude of <paramref name="quantity"/> at sweep point <paramref name="k"/>, frequency <paramref name="frequencyHz"/> in Hz.</summary>
    public Complex At(int k, double frequencyHz, ResponseQuantity quantity)
    {
        var iw = new Complex(0, 2 * Math.PI * frequencyHz);
        return quantity switch
        {
            ResponseQuantity.Displacement => Displacement[k],
            ResponseQuantity.Velocity => iw * Displacement[k],
            ResponseQuantity.Acceleration => iw * iw * Displacement[k],
            _ => throw new ArgumentOutOfRangeException(nameof(quantity)),
        };
    }
}

/// <summary>Complex force amplitude in a spring or damper over the sweep, in N.</summary>
/// <param name="Element">Name of the spring or damper.</param>
/// <param name="Kind">Spring or damper.</param>
/// <param name="Force">Complex force amplitude in N at each frequency: k(1+iη)(X_A − X_B) or iωc(X_A − X_B), A and B as in 'between'.</param>
public sealed record ElementForce(string Element, ElementKind Kind, ImmutableArray<Complex> Force);

/// <summary>The force a support receives from the network over the sweep, positive in the direction of motion.</summary>
/// <param name="Support">Name of the support.</param>
/// <param name="Force">Complex force amplitude in N at each frequency.</param>
public sealed record SupportReaction(string Support, ImmutableArray<Complex> Force);

/// <summary>A transmissibility over the sweep.</summary>
/// <param name="Kind">"force" (|Σ reactions| / |Σ applied forces|) or "motion" (|X_dof| / |U_support| for one moving support).</param>
/// <param name="Dof">The mass for "motion"; null for "force".</param>
/// <param name="Reference">The support whose motion, or "applied forces", that the ratio refers to.</param>
/// <param name="Ratio">Dimensionless ratio at each frequency.</param>
public sealed record Transmissibility(string Kind, string? Dof, string Reference, ImmutableArray<double> Ratio);

/// <summary>The largest magnitude of a response over the sweep and where it occurs.</summary>
/// <param name="Dof">Name of the mass.</param>
/// <param name="Quantity">Displacement, velocity or acceleration.</param>
/// <param name="Magnitude">Largest amplitude in m, m/s or m/s².</param>
/// <param name="FrequencyHz">Frequency of the largest amplitude, in Hz.</param>
public sealed record ResponsePeak(string Dof, ResponseQuantity Quantity, double Magnitude, double FrequencyHz);

/// <summary>The response at a machine's running speed to the loads that run at that speed.</summary>
/// <param name="SpeedHz">Running speed in Hz.</param>
/// <param name="Loads">The loads that act at this speed.</param>
/// <param name="Response">The response at the single frequency <paramref name="SpeedHz"/>.</param>
public sealed record OperatingPoint(double SpeedHz, ImmutableArray<string> Loads, HarmonicResult Response);

/// <summary>The steady-state harmonic response of a network over a sweep.</summary>
/// <param name="FrequenciesHz">The frequencies computed, in Hz, in the order computed.</param>
/// <param name="Method">Direct or modal.</param>
/// <param name="ModesUsed">For the modal method, the number of modes superposed; otherwise 0.</param>
/// <param name="Loads">Names of the loads that acted together.</param>
/// <param name="Responses">Per output mass, its displacement amplitudes.</param>
/// <param name="ElementForces">Per spring and damper touching an output mass, its force amplitudes.</param>
/// <param name="Reactions">Per support, the force it receives.</param>
/// <param name="Transmissibilities">Force and motion transmissibilities where they are defined.</param>
/// <param name="OperatingPoints">The responses at the loads' running speeds.</param>
/// <param name="Notes">Facts about the solution a reviewer should read (method limits, damping treatment).</param>
public sealed record HarmonicResult(
    ImmutableArray<double> FrequenciesHz,
    HarmonicMethod Method,
    int ModesUsed,
    ImmutableArray<string> Loads,
    ImmutableArray<DofResponse> Responses,
    ImmutableArray<ElementForce> ElementForces,
    ImmutableArray<SupportReaction> Reactions,
    ImmutableArray<Transmissibility> Transmissibilities,
    ImmutableArray<OperatingPoint> OperatingPoints,
    ImmutableArray<string> Notes)
{
    /// <summary>Things the engineer must act on: an undamped model computed at resonance, a modal truncation error above tolerance.</summary>
    /// <remarks>For <see cref="HarmonicAnalysis.Solve(Assembly.DampedSystem, HarmonicSpec)"/> it also holds the operating points' warnings.</remarks>
    public ImmutableArray<string> Warnings { get; init; } = [];

    /// <summary>The response of mass <paramref name="dof"/>, or null when it is not an output.</summary>
    public DofResponse? ResponseOf(string dof) => Responses.FirstOrDefault(r => r.Dof == dof);

    /// <summary>Magnitudes of <paramref name="quantity"/> of <paramref name="response"/> over the sweep.</summary>
    public double[] Magnitudes(DofResponse response, ResponseQuantity quantity)
    {
        ArgumentNullException.ThrowIfNull(response);
        var m = new double[FrequenciesHz.Length];
        for (var k = 0; k < m.Length; k++) m[k] = response.At(k, FrequenciesHz[k], quantity).Magnitude;
        return m;
    }

    /// <summary>The peak of each quantity of each output over the sweep.</summary>
    public ImmutableArray<ResponsePeak> Peaks()
    {
        var peaks = ImmutableArray.CreateBuilder<ResponsePeak>();
        if (FrequenciesHz.IsEmpty) return peaks.ToImmutable();
        foreach (var r in Responses)
            foreach (var q in Enum.GetValues<ResponseQuantity>())
            {
                var m = Magnitudes(r, q);
                var k = Array.IndexOf(m, m.Max());
                peaks.Add(new ResponsePeak(r.Dof, q, m[k], FrequenciesHz[k]));
            }
        return peaks.ToImmutable();
    }
}
