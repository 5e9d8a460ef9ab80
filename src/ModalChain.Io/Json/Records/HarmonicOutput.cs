using System.ComponentModel;
using System.Text.Json.Serialization;

namespace ModalChain.Io.Json.Records;

/// <summary>The fields of one frequency sweep, shared by the whole output and by each load case's sweep.</summary>
/// <remarks>
/// Every magnitude is the peak (zero-to-peak) amplitude of the sinusoid; phases are in degrees in (−180, 180], of
/// Re(A e^{iωt}) relative to the loads' phase reference. Series over the sweep are sequences read as they are written.
/// The derived records place their own fields around these with <see cref="JsonPropertyOrderAttribute"/>.
/// </remarks>
public abstract record HarmonicSweepFields
{
    [Description("How the responses were computed: direct or modal (superposition of modes).")]
    public required string Method { get; init; }

    [Description("For the modal method, the number of modes superposed; otherwise 0.")]
    public required int ModesUsed { get; init; }

    [Description("Names of the loads applied.")]
    public required IReadOnlyList<string> Loads { get; init; }

    [Description("The sweep's frequencies, in Hz.")]
    public required IEnumerable<double> FrequenciesHz { get; init; }

    [Description("Each output DOF's displacement, velocity and acceleration over the sweep.")]
    public required IReadOnlyList<HarmonicSeriesOutput> Responses { get; init; }

    [Description("Each spring's and damper's force over the sweep (line models); the current in A of one with an end on an electrical node (an inductor or resistor).")]
    public required IReadOnlyList<HarmonicElementSeriesOutput> ElementForces { get; init; }

    [Description("Each mechanical support's reaction over the sweep, in N (electrical elements' currents left out; a voltage source's support is in 'source_currents').")]
    public required IReadOnlyList<HarmonicReactionSeriesOutput> Reactions { get; init; }

    [Description("Plane and 3d models only: the force (or moment) each spring and damper applies to its second end, per direction, over the sweep, with its largest amplitude: what a mount is selected on.")]
    public IReadOnlyList<HarmonicMountSeriesOutput>? MountForces { get; init; }

    [Description("Models with electrical voltage sources (an electrical support moved at the source voltage) only: the current each source delivers into its circuit over the sweep, in A (minus its support's reaction; such a support is not in 'reactions').")]
    public IReadOnlyList<HarmonicSourceCurrentSeriesOutput>? SourceCurrents { get; init; }

    [Description("Models with transducers only: each transducer's port voltage u = Bl*(v_a - v_b) in V and port current in A (the current it drives out of its branch terminal n1 into the circuit) over the sweep.")]
    public IReadOnlyList<HarmonicPortSeriesOutput>? TransducerPorts { get; init; }

    [Description("Transmissibility ratios over the sweep.")]
    public required IReadOnlyList<HarmonicTransmissibilityOutput> Transmissibility { get; init; }

    [Description("The largest response of each output DOF and quantity in the sweep.")]
    public required IReadOnlyList<HarmonicPeakOutput> Peaks { get; init; }

    [Description("The responses at each running speed of the loads.")]
    public required IReadOnlyList<HarmonicOperatingPointOutput> OperatingPoints { get; init; }

    [Description("Notes on the analysis.")]
    public required IReadOnlyList<string> Notes { get; init; }
}

/// <summary>The JSON of <c>modalchain harmonic --format json</c>.</summary>
/// <remarks>A model with load cases leaves the sweep fields empty (no sweep applies every load at once): each case's
/// sweep is under <c>cases</c> and their combination under <c>combination</c>.</remarks>
[Description("Frequency response of a model: responses, element forces, reactions, transmissibility, peaks and operating points (SI units; phases in degrees).")]
public sealed record HarmonicOutput : HarmonicSweepFields
{
    [Description(Describe.Title), JsonPropertyOrder(-3)]
    public required string Title { get; init; }

    [Description(Describe.FormatVersion), SchemaConst(JsonFormat.Version), JsonPropertyOrder(-2)]
    public required string FormatVersion { get; init; }

    [Description("The model file this result comes from."), JsonPropertyOrder(-1)]
    public required SourceOutput Source { get; init; }

    [Description("One sweep per load case (its loads alone), with the same fields as a model without cases; empty when the model has no load cases."), JsonPropertyOrder(1)]
    public required IReadOnlyList<HarmonicCaseOutput> Cases { get; init; }

    [Description("The load cases combined at their running speeds by the stated rule; null when the model has no load cases."),
     JsonPropertyOrder(2), JsonIgnore(Condition = JsonIgnoreCondition.Never)]
    public required HarmonicCombinationOutput? Combination { get; init; }

    [Description("Warnings of the model file, then of the analysis."), JsonPropertyOrder(3)]
    public required IReadOnlyList<string> Warnings { get; init; }

    [Description(Describe.Caution), JsonPropertyOrder(4)]
    public required string Caution { get; init; }
}

/// <summary>One load case's sweep in <see cref="HarmonicOutput"/>.</summary>
public sealed record HarmonicCaseOutput : HarmonicSweepFields
{
    [Description("Name of the load case."), JsonPropertyOrder(-1)]
    public required string Name { get; init; }

    [Description("Warnings of this case's analysis."), JsonPropertyOrder(1)]
    public required IReadOnlyList<string> Warnings { get; init; }
}

/// <summary>
/// The fields every curve over the sweep ends with (a DOF's response, an element's or mount's force, a reaction): the
/// derived records name what the curve is of and its unit, and these follow them.
/// </summary>
public abstract record HarmonicCurveFields
{
    [Description("peak: magnitudes are zero-to-peak amplitudes."), SchemaConst("peak"), JsonPropertyOrder(1)]
    public required string Amplitude { get; init; }

    [Description("Amplitude in 'unit' at each frequency."), JsonPropertyOrder(2)]
    public required IEnumerable<double> Magnitude { get; init; }

    [Description("Phase in degrees at each frequency."), JsonPropertyOrder(3)]
    public required IEnumerable<double> PhaseDeg { get; init; }
}

/// <summary>A DOF's response over the sweep.</summary>
public sealed record HarmonicSeriesOutput : HarmonicCurveFields
{
    [Description("Degree-of-freedom label (mass name, or linked masses joined by '+').")]
    public required string Dof { get; init; }

    [Description("displacement, velocity or acceleration; at an electrical node flux_linkage, voltage or voltage_rate.")]
    public required string Quantity { get; init; }

    [Description("SI unit of the values (m, m/s, m/s^2; rad, rad/s, rad/s^2 at a rotation DOF of a plane or 3d model; V*s, V, V/s at an electrical node).")]
    public required string Unit { get; init; }
}

/// <summary>A spring's or damper's force over the sweep.</summary>
public sealed record HarmonicElementSeriesOutput : HarmonicCurveFields
{
    [Description("Name of the spring or damper.")]
    public required string Element { get; init; }

    [Description("spring or damper.")]
    public required string Kind { get; init; }

    [Description("N for a force; A for the current of an element with an end on an electrical node (an inductor or resistor).")]
    public required string Unit { get; init; }
}

/// <summary>A voltage source's current over the sweep.</summary>
public sealed record HarmonicSourceCurrentSeriesOutput : HarmonicCurveFields
{
    [Description("Name of the source's support.")]
    public required string Support { get; init; }

    [Description("A."), SchemaEnum("A")]
    public required string Unit { get; init; }
}

/// <summary>A transducer's port voltage or current over the sweep.</summary>
public sealed record HarmonicPortSeriesOutput : HarmonicCurveFields
{
    [Description("Name of the transducer.")]
    public required string Transducer { get; init; }

    [Description("voltage (u = Bl*(v_a - v_b), V) or current (out of branch terminal n1 into the circuit, A)."), SchemaEnum("voltage", "current")]
    public required string Quantity { get; init; }

    [Description("V for a voltage, A for a current."), SchemaEnum("V", "A")]
    public required string Unit { get; init; }
}

/// <summary>A support's reaction over the sweep.</summary>
public sealed record HarmonicReactionSeriesOutput : HarmonicCurveFields
{
    [Description("Name of the support.")]
    public required string Support { get; init; }

    [Description("N.")]
    public required string Unit { get; init; }
}

/// <summary>A mount's force per direction over the sweep (plane and 3d models).</summary>
public sealed record HarmonicMountSeriesOutput : HarmonicCurveFields
{
    [Description("Name of the spring or damper.")]
    public required string Element { get; init; }

    [Description("spring or damper.")]
    public required string Kind { get; init; }

    [Description("Global direction of the force: x, y, z, or rx, ry, rz for a moment; 'axial' for an axial element's force along the line from its first to its second end (also given resolved into x, y, z).")]
    public required string Direction { get; init; }

    [Description("N for a force, N*m for a moment.")]
    public required string Unit { get; init; }


    [Description("The largest amplitude over the sweep, in 'unit'."), JsonPropertyOrder(4)]
    public required double PeakMagnitude { get; init; }

    [Description("Where it occurs, in Hz."), JsonPropertyOrder(5)]
    public required double PeakFrequencyHz { get; init; }
}

/// <summary>A transmissibility ratio over the sweep.</summary>
public sealed record HarmonicTransmissibilityOutput
{
    [Description("force (|sum of reactions| / |sum of applied forces|) or motion (|X_dof| / |U_support| for one moving support)."), SchemaEnum("force", "motion")]
    public required string Kind { get; init; }

    [Description("The DOF for motion; null for force."), JsonIgnore(Condition = JsonIgnoreCondition.Never)]
    public required string? Dof { get; init; }

    [Description("The support whose motion, or 'applied forces', the ratio refers to.")]
    public required string Reference { get; init; }

    [Description("Dimensionless ratio at each frequency.")]
    public required IEnumerable<double> Ratio { get; init; }
}

/// <summary>The largest response of a DOF and quantity in the sweep.</summary>
public sealed record HarmonicPeakOutput
{
    [Description("Degree-of-freedom label (mass name, or linked masses joined by '+').")]
    public required string Dof { get; init; }

    [Description("displacement, velocity or acceleration; at an electrical node flux_linkage, voltage or voltage_rate.")]
    public required string Quantity { get; init; }

    [Description("SI unit of the values (m, m/s, m/s^2; rad, rad/s, rad/s^2 at a rotation DOF of a plane or 3d model; V*s, V, V/s at an electrical node).")]
    public required string Unit { get; init; }

    [Description("peak: magnitudes are zero-to-peak amplitudes."), SchemaConst("peak")]
    public required string Amplitude { get; init; }

    [Description("Amplitude in 'unit'.")]
    public required double Magnitude { get; init; }

    [Description("In Hz.")]
    public required double FrequencyHz { get; init; }

    [Description("'start' or 'end' when the largest response is on that end of the sweep, else 'none'."), SchemaEnum("none", "start", "end")]
    public required string RisingAt { get; init; }

    [Description("The amplitude at that end of the sweep, in 'unit'.")]
    public required double EdgeMagnitude { get; init; }

    [Description("Whether the peak lies inside the sweep.")]
    public required bool IsInteriorPeak { get; init; }

    [Description("Why the peak is not an interior peak (it rises at the end of the sweep).")]
    public string? Note { get; init; }
}

/// <summary>The responses at one running speed.</summary>
public sealed record HarmonicOperatingPointOutput
{
    [Description("Running speed, in Hz.")]
    public required double SpeedHz { get; init; }

    [Description("Running speed, in rpm.")]
    public required double SpeedRpm { get; init; }

    [Description("The loads running at this speed.")]
    public required IReadOnlyList<string> Loads { get; init; }

    [Description("Each output DOF's displacement, velocity and acceleration.")]
    public required IReadOnlyList<HarmonicPointOutput> Responses { get; init; }

    [Description("Each spring's and damper's force.")]
    public required IReadOnlyList<HarmonicElementPointOutput> ElementForces { get; init; }

    [Description("Each mechanical support's reaction, in N.")]
    public required IReadOnlyList<HarmonicReactionPointOutput> Reactions { get; init; }

    [Description("Plane and 3d models only: each spring's and damper's force (or moment) per direction at the running speed.")]
    public IReadOnlyList<HarmonicMountPointOutput>? MountForces { get; init; }

    [Description("Models with electrical voltage sources only: the current each source delivers at the running speed, in A.")]
    public IReadOnlyList<HarmonicElectricalPointOutput>? SourceCurrents { get; init; }

    [Description("Models with transducers only: each transducer's port voltage (V) and port current (A, out of branch terminal n1 into the circuit) at the running speed.")]
    public IReadOnlyList<HarmonicElectricalPointOutput>? TransducerPorts { get; init; }
}

/// <summary>A source current, or a transducer's port voltage or current, at one frequency.</summary>
public sealed record HarmonicElectricalPointOutput
{
    [Description("The source's support or the transducer.")]
    public required string Name { get; init; }

    [Description("current (a source's or a port's) or voltage (a port's)."), SchemaEnum("voltage", "current")]
    public required string Quantity { get; init; }

    [Description("V for a voltage, A for a current."), SchemaEnum("V", "A")]
    public required string Unit { get; init; }

    [Description("peak: the magnitude is the zero-to-peak amplitude."), SchemaConst("peak")]
    public required string Amplitude { get; init; }

    [Description("Amplitude in 'unit'.")]
    public required double Magnitude { get; init; }

    [Description("In degrees.")]
    public required double PhaseDeg { get; init; }
}

/// <summary>A DOF's response at one frequency.</summary>
public sealed record HarmonicPointOutput
{
    [Description("Degree-of-freedom label (mass name, or linked masses joined by '+').")]
    public required string Dof { get; init; }

    [Description("displacement, velocity or acceleration; at an electrical node flux_linkage, voltage or voltage_rate.")]
    public required string Quantity { get; init; }

    [Description("SI unit of the values (m, m/s, m/s^2; rad, rad/s, rad/s^2 at a rotation DOF of a plane or 3d model; V*s, V, V/s at an electrical node).")]
    public required string Unit { get; init; }

    [Description("peak: the magnitude is the zero-to-peak amplitude."), SchemaConst("peak")]
    public required string Amplitude { get; init; }

    [Description("Amplitude in 'unit'.")]
    public required double Magnitude { get; init; }

    [Description("In degrees.")]
    public required double PhaseDeg { get; init; }
}

/// <summary>A spring's or damper's force at one frequency.</summary>
public sealed record HarmonicElementPointOutput
{
    [Description("Name of the spring or damper.")]
    public required string Element { get; init; }

    [Description("spring or damper.")]
    public required string Kind { get; init; }

    [Description("N for a force; A for the current of an element with an end on an electrical node (an inductor or resistor).")]
    public required string Unit { get; init; }

    [Description("peak: the magnitude is the zero-to-peak amplitude."), SchemaConst("peak")]
    public required string Amplitude { get; init; }

    [Description("Amplitude in 'unit'.")]
    public required double Magnitude { get; init; }

    [Description("In degrees.")]
    public required double PhaseDeg { get; init; }
}

/// <summary>A support's reaction at one frequency.</summary>
public sealed record HarmonicReactionPointOutput
{
    [Description("Name of the support.")]
    public required string Support { get; init; }

    [Description("N.")]
    public required string Unit { get; init; }

    [Description("peak: the magnitude is the zero-to-peak amplitude."), SchemaConst("peak")]
    public required string Amplitude { get; init; }

    [Description("Amplitude in 'unit'.")]
    public required double Magnitude { get; init; }

    [Description("In degrees.")]
    public required double PhaseDeg { get; init; }
}

/// <summary>A mount's force per direction at one frequency (plane and 3d models).</summary>
public sealed record HarmonicMountPointOutput
{
    [Description("Name of the spring or damper.")]
    public required string Element { get; init; }

    [Description("spring or damper.")]
    public required string Kind { get; init; }

    [Description("Global direction of the force: x, y, z, or rx, ry, rz for a moment; 'axial' for an axial element's force along the line from its first to its second end (also given resolved into x, y, z).")]
    public required string Direction { get; init; }

    [Description("N for a force, N*m for a moment.")]
    public required string Unit { get; init; }

    [Description("peak: the magnitude is the zero-to-peak amplitude."), SchemaConst("peak")]
    public required string Amplitude { get; init; }

    [Description("Amplitude in 'unit'.")]
    public required double Magnitude { get; init; }

    [Description("In degrees.")]
    public required double PhaseDeg { get; init; }
}

/// <summary>The load cases combined, in <see cref="HarmonicOutput"/>.</summary>
public sealed record HarmonicCombinationOutput
{
    [Description("sum (sum of the components' amplitudes, an upper bound of the peak) or rms (root sum of squares)."), SchemaEnum("sum", "rms")]
    public required string Rule { get; init; }

    [Description("A sentence stating what the rule computes.")]
    public required string RuleDescription { get; init; }

    [Description("Each DOF, quantity and measure combined over the cases.")]
    public required IReadOnlyList<HarmonicCombinedOutput> Responses { get; init; }

    [Description("Notes on the combination.")]
    public required IReadOnlyList<string> Notes { get; init; }
}

/// <summary>One combined response in <see cref="HarmonicCombinationOutput"/>.</summary>
public sealed record HarmonicCombinedOutput
{
    [Description("Degree-of-freedom label.")]
    public required string Dof { get; init; }

    [Description("displacement, velocity or acceleration; at an electrical node flux_linkage, voltage or voltage_rate.")]
    public required string Quantity { get; init; }

    [Description("SI unit (m, m/s, m/s^2; rad, rad/s, rad/s^2 at a rotation DOF; V*s, V, V/s at an electrical node).")]
    public required string Unit { get; init; }

    [Description("peak or rms: the measure of 'magnitude' and of the components'."), SchemaEnum("peak", "rms")]
    public required string Amplitude { get; init; }

    [Description("The components combined by the rule, in 'unit'.")]
    public required double Magnitude { get; init; }

    [Description("Each case's response at its running speed.")]
    public required IReadOnlyList<HarmonicComponentOutput> Components { get; init; }
}

/// <summary>One case's component of a combined response.</summary>
public sealed record HarmonicComponentOutput
{
    [Description("Name of the load case.")]
    public required string Case { get; init; }

    [Description("Running speed in Hz.")]
    public required double SpeedHz { get; init; }

    [Description("Running speed in rpm.")]
    public required double SpeedRpm { get; init; }

    [Description("Amplitude of this component in 'unit' and 'amplitude' (peak or rms).")]
    public required double Magnitude { get; init; }
}
