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

/// <summary>The force (or moment) one spring or damper of a plane or 3d model transmits in one direction, over the sweep: what a mount is selected on.</summary>
/// <param name="Element">Name of the spring or damper.</param>
/// <param name="Kind">Spring or damper.</param>
/// <param name="Direction">
/// The global direction (<c>x</c> … <c>rz</c>) of a component; for an axial element <c>axial</c> (along the line from end A
/// to end B) and its resolution into the translations.
/// </param>
/// <param name="Unit">"N" for a force, "N*m" for a moment (rotational component).</param>
/// <param name="Force">
/// Complex amplitude at each frequency of the force the element applies to its second end B in that direction:
/// k_d(1+iη)Δ_d or iωc_dΔ_d with Δ_d = u_A,d − u_B,d the relative motion of its ends (through the attachment maps).
/// </param>
public sealed record MountForce(string Element, ElementKind Kind, string Direction, string Unit, ImmutableArray<Complex> Force);

/// <summary>The force a support receives from the network over the sweep, positive in the direction of motion.</summary>
/// <param name="Support">Name of the support.</param>
/// <param name="Force">Complex force amplitude in N at each frequency.</param>
public sealed record SupportReaction(string Support, ImmutableArray<Complex> Force);

/// <summary>A transducer's port voltage and current over the sweep (<see cref="Assembly.TransducerPortTerms"/>).</summary>
/// <param name="Transducer">Name of the transducer.</param>
/// <param name="Voltage">Complex port voltage u = Bl·(v_a − v_b) in V at each frequency.</param>
/// <param name="Current">Complex port current i in A at each frequency: the current the transducer drives out of its branch terminal n1 into the circuit.</param>
public sealed record TransducerPortResponse(string Transducer, ImmutableArray<Complex> Voltage, ImmutableArray<Complex> Current);

/// <summary>The current a voltage source (an electrical support moved at the source voltage) delivers over the sweep.</summary>
/// <param name="Support">Name of the source's support.</param>
/// <param name="Current">Complex current in A at each frequency, out of the source into the circuit: minus the support's reaction.</param>
public sealed record SourceCurrent(string Support, ImmutableArray<Complex> Current);

/// <summary>A transmissibility over the sweep.</summary>
/// <param name="Kind">"force" (|Σ reactions| / |Σ applied forces|) or "motion" (|X_dof| / |U_support| for one moving support).</param>
/// <param name="Dof">The mass for "motion"; null for "force".</param>
/// <param name="Reference">The support whose motion, or "applied forces", that the ratio refers to.</param>
/// <param name="Ratio">Dimensionless ratio at each frequency.</param>
public sealed record Transmissibility(string Kind, string? Dof, string Reference, ImmutableArray<double> Ratio);

/// <summary>Where the largest computed response of a sweep sits when it is not a peak inside the sweep.</summary>
public enum SweepEdge
{
    /// <summary>The largest response is a peak inside the sweep.</summary>
    None,
    /// <summary>The largest response is at the sweep's lowest frequency: it rises towards lower frequencies.</summary>
    Start,
    /// <summary>The largest response is at the sweep's highest frequency: it rises towards higher frequencies.</summary>
    End,
}

/// <summary>The peak of a response over a sweep and where it occurs.</summary>
/// <remarks>
/// A peak is a local maximum inside the sweep. When the largest computed value sits on the first or last frequency
/// the response is still rising there and the true peak lies outside the sweep: <see cref="RisingAt"/> says which end
/// and <see cref="EdgeMagnitude"/> holds that value, while <see cref="Magnitude"/> is the largest peak inside the sweep
/// (or, when there is none, the edge value, a lower bound of the true peak).
/// </remarks>
/// <param name="Dof">Name of the mass.</param>
/// <param name="Quantity">Displacement, velocity or acceleration.</param>
/// <param name="Magnitude">Amplitude of the peak in m, m/s or m/s².</param>
/// <param name="FrequencyHz">Frequency of the peak, in Hz.</param>
public sealed record ResponsePeak(string Dof, ResponseQuantity Quantity, double Magnitude, double FrequencyHz)
{
    /// <summary>The end of the sweep where the largest computed value sits; <see cref="SweepEdge.None"/> for a peak inside.</summary>
    public SweepEdge RisingAt { get; init; } = SweepEdge.None;

    /// <summary>The value at the end named by <see cref="RisingAt"/>; NaN when the largest value is a peak inside.</summary>
    public double EdgeMagnitude { get; init; } = double.NaN;

    /// <summary>True when <see cref="Magnitude"/> is a local maximum inside the sweep (not merely its end value).</summary>
    public bool IsInterior { get; init; } = true;

    /// <summary>The largest value computed over the sweep, its ends included.</summary>
    public double LargestComputed => RisingAt == SweepEdge.None ? Magnitude : Math.Max(Magnitude, EdgeMagnitude);

    /// <summary>The words a user reads when the largest response is on an end of the sweep; null otherwise.</summary>
    public string? EdgeWarning => RisingAt switch
    {
        SweepEdge.Start => "rising at the start of the sweep: widen the range",
        SweepEdge.End => "rising at the end of the sweep: widen the range",
        _ => null,
    };

    /// <summary>The peak of <paramref name="values"/> sampled at ascending <paramref name="frequenciesHz"/>, with the edge flag.</summary>
    /// <remarks>The largest strict-or-flat local maximum among the interior samples is the peak; the ends are flagged, never reported as the peak while an interior one exists.</remarks>
    public static ResponsePeak Of(string dof, ResponseQuantity quantity, IReadOnlyList<double> frequenciesHz, IReadOnlyList<double> values)
    {
        ArgumentNullException.ThrowIfNull(frequenciesHz);
        ArgumentNullException.ThrowIfNull(values);
        if (values.Count == 0) throw new ArgumentException("No values.", nameof(values));
        var n = values.Count;
        var largest = 0;
        for (var i = 1; i < n; i++) if (values[i] > values[largest]) largest = i;
        var interior = -1;
        for (var i = 1; i < n - 1; i++)
            if (values[i] >= values[i - 1] && values[i] >= values[i + 1] && (interior < 0 || values[i] > values[interior])) interior = i;
        var edge = n < 2 || (largest != 0 && largest != n - 1) ? SweepEdge.None : largest == 0 ? SweepEdge.Start : SweepEdge.End;
        if (edge == SweepEdge.None) return new ResponsePeak(dof, quantity, values[largest], frequenciesHz[largest]);
        var shown = interior >= 0 ? interior : largest;
        return new ResponsePeak(dof, quantity, values[shown], frequenciesHz[shown])
        {
            RisingAt = edge, EdgeMagnitude = values[largest], IsInterior = interior >= 0,
        };
    }
}

/// <summary>Every refined peak of one response inside a band, with the band's ends (<see cref="HarmonicAnalysis.BandPeaks"/>).</summary>
/// <param name="Peaks">Refined interior local maxima, in ascending frequency.</param>
/// <param name="Sampled">The peak of the samples with its edge flag (<see cref="ResponsePeak.Of"/>).</param>
/// <param name="Start">The value at the band's lowest frequency.</param>
/// <param name="End">The value at the band's highest frequency.</param>
/// <param name="Unbounded">The sample where the response is unbounded (an undamped resonance), else null.</param>
public sealed record BandPeakSearch(ImmutableArray<ResponsePeak> Peaks, ResponsePeak Sampled, ResponsePeak Start, ResponsePeak End, ResponsePeak? Unbounded);

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
/// <param name="Responses">Per output mass (per output DOF label such as <c>skid.z</c> in plane and 3d models), its displacement amplitudes.</param>
/// <param name="ElementForces">Per spring and damper touching an output mass, its force amplitudes.</param>
/// <param name="Reactions">
/// Per mechanical support, the force it receives in N: with electrical nodes, the currents of the electrical elements
/// (and the share a transducer's eliminated node puts on a support) are left out, and an electrical support is in
/// <see cref="HarmonicResult.SourceCurrents"/> instead.
/// </param>
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

    /// <summary>
    /// Plane and 3d models: per spring and damper and per direction it acts in, the force (or moment) it transmits
    /// (<see cref="MountForce"/>); empty in line models, whose element forces are <see cref="ElementForces"/>.
    /// </summary>
    public ImmutableArray<MountForce> MountForces { get; init; } = [];

    /// <summary>Per transducer of a line model, its port voltage and current (<see cref="TransducerPortResponse"/>); empty without transducers.</summary>
    public ImmutableArray<TransducerPortResponse> TransducerPorts { get; init; } = [];

    /// <summary>
    /// Per electrical support (a voltage source, <see cref="Model.Network.IsElectrical"/>), the current it delivers;
    /// such a support is not in <see cref="Reactions"/>, whose forces are the mechanical ones only.
    /// </summary>
    public ImmutableArray<SourceCurrent> SourceCurrents { get; init; } = [];

    /// <summary>The largest amplitude of each mount force over the sweep and the frequency where it occurs (the first such frequency).</summary>
    public ImmutableArray<(MountForce Force, double Magnitude, double FrequencyHz)> MountForcePeaks() =>
        [.. MountForces.Select(m =>
        {
            var k = 0;
            for (var i = 1; i < m.Force.Length; i++) if (m.Force[i].Magnitude > m.Force[k].Magnitude) k = i;
            return m.Force.IsEmpty ? (m, double.NaN, double.NaN) : (m, m.Force[k].Magnitude, FrequenciesHz[k]);
        })];

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

    /// <summary>The peak of each quantity of each output over the sweep, flagged when the largest value is on an end of the sweep (<see cref="ResponsePeak.Of"/>).</summary>
    public ImmutableArray<ResponsePeak> Peaks()
    {
        var peaks = ImmutableArray.CreateBuilder<ResponsePeak>();
        if (FrequenciesHz.IsEmpty) return peaks.ToImmutable();
        var order = Enumerable.Range(0, FrequenciesHz.Length).OrderBy(k => FrequenciesHz[k]).ToArray();
        var sorted = order.Select(k => FrequenciesHz[k]).ToArray();
        foreach (var r in Responses)
            foreach (var q in Enum.GetValues<ResponseQuantity>())
            {
                var m = Magnitudes(r, q);
                peaks.Add(ResponsePeak.Of(r.Dof, q, sorted, [.. order.Select(k => m[k])]));
            }
        return peaks.ToImmutable();
    }
}
