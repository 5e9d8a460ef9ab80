using System.ComponentModel;

namespace ModalChain.Io.Json.Records;

/// <summary>The JSON of <c>modalchain transient --format json</c>: one property per field, in the order written.</summary>
/// <remarks>
/// The histories (<c>time_s</c> and every <c>values</c>) are sequences read as they are written, so a long run goes to
/// the stream in pieces and is never held as text. Element forces are k(u_A − u_B) and c(u̇_A − u̇_B) with A and B as
/// in 'between'; a reaction is the force the support receives, positive along the direction of motion.
/// </remarks>
[Description("Time histories of a model's response, with peaks, RMS values and the energy balance (SI units).")]
public sealed record TransientOutput : CommandOutput
{
    [Description("The integration method: newmark, hht, exact or modal.")]
    public required string Method { get; init; }

    [Description("The method and its parameters, in words.")]
    public required string MethodDescription { get; init; }

    [Description("Time step, in s.")]
    public required double StepS { get; init; }

    [Description("Duration of the run, in s.")]
    public required double DurationS { get; init; }

    [Description("Number of steps integrated.")]
    public required int Steps { get; init; }

    [Description("Every how many steps a sample is recorded.")]
    public required int RecordEvery { get; init; }

    [Description("Names of the loads applied.")]
    public required IReadOnlyList<string> Loads { get; init; }

    [Description("Present when the histories are thinned (a report's results.json): how many samples were recorded and written, and the rule.")]
    public TransientSamplesOutput? HistorySamples { get; init; }

    [Description("The time of each written sample, in s.")]
    public required IEnumerable<double> TimeS { get; init; }

    [Description("The motion of each output DOF over time.")]
    public required IReadOnlyList<TransientResponseOutput> Responses { get; init; }

    [Description("The force of each spring and damper over time (line models; plane and 3d models give mount_forces).")]
    public required IReadOnlyList<TransientElementForceOutput> ElementForces { get; init; }

    [Description("Plane and 3d models only: the force (or moment) each spring and damper applies to its second end, per direction, over time, with its peak; these histories are not repeated in element_forces or peaks.")]
    public IReadOnlyList<TransientMountForceOutput>? MountForces { get; init; }

    [Description("The force each mechanical support receives over time, in N (electrical elements' currents left out; a voltage source's support is in 'source_currents').")]
    public required IReadOnlyList<TransientReactionOutput> Reactions { get; init; }

    [Description("Models with electrical voltage sources only: the current each source delivers into its circuit over time, in A (minus its support's reaction).")]
    public IReadOnlyList<TransientSourceCurrentOutput>? SourceCurrents { get; init; }

    [Description("Models with transducers only: each transducer's port voltage u = Bl*(v_a - v_b) in V and port current in A (out of its branch terminal n1 into the circuit) over time.")]
    public IReadOnlyList<TransientPortOutput>? TransducerPorts { get; init; }

    [Description("The window the r.m.s. values are taken over, in s.")]
    public required TransientWindowOutput RmsWindowS { get; init; }

    [Description("The peak and r.m.s. value of every history of the run (not only of the written samples).")]
    public required IReadOnlyList<TransientPeakOutput> Peaks { get; init; }

    [Description("The energy balance of the run.")]
    public required TransientEnergyOutput Energy { get; init; }

    [Description("Warnings of the model file, then of the analysis.")]
    public required IReadOnlyList<string> Warnings { get; init; }
}

/// <summary>How the histories were thinned, in <see cref="TransientOutput"/>.</summary>
public sealed record TransientSamplesOutput
{
    [Description("Samples recorded by the run.")]
    public required int Recorded { get; init; }

    [Description("Samples written in time_s and every 'values'.")]
    public required int Written { get; init; }

    [Description("How the written samples were chosen.")]
    public required string Rule { get; init; }
}

/// <summary>A motion history in <see cref="TransientOutput"/>.</summary>
public sealed record TransientResponseOutput
{
    [Description("Degree-of-freedom label (mass name, or linked masses joined by '+').")]
    public required string Dof { get; init; }

    [Description("What the values measure: displacement, velocity or acceleration; at an electrical node flux_linkage, voltage or voltage_rate.")]
    public required string Quantity { get; init; }

    [Description("SI unit of the values (m, m/s, m/s^2; rad, rad/s, rad/s^2 at a rotation DOF of a plane or 3d model; V*s, V, V/s at an electrical node).")]
    public required string Unit { get; init; }

    [Description("Instantaneous values."), SchemaConst("instantaneous")]
    public required string Amplitude { get; init; }

    [Description("One value per written time, in 'unit'.")]
    public required IEnumerable<double> Values { get; init; }
}

/// <summary>An element-force history in <see cref="TransientOutput"/>.</summary>
public sealed record TransientElementForceOutput
{
    [Description("Name of the spring or damper.")]
    public required string Element { get; init; }

    [Description("spring or damper.")]
    public required string Kind { get; init; }

    [Description("N for a force; A for the current of an element with an end on an electrical node (an inductor or resistor).")]
    public required string Unit { get; init; }

    [Description("Instantaneous values."), SchemaConst("instantaneous")]
    public required string Amplitude { get; init; }

    [Description("One value per written time, in 'unit'.")]
    public required IEnumerable<double> Values { get; init; }
}

/// <summary>A mount force per direction in <see cref="TransientOutput"/> (plane and 3d models).</summary>
public sealed record TransientMountForceOutput
{
    [Description("Name of the spring or damper.")]
    public required string Element { get; init; }

    [Description("spring or damper.")]
    public required string Kind { get; init; }

    [Description("Global direction of the force: x, y, z, or rx, ry, rz for a moment; 'axial' for an axial element's force along the line from its first to its second end (also given resolved into x, y, z).")]
    public required string Direction { get; init; }

    [Description("N for a force, N*m for a moment.")]
    public required string Unit { get; init; }

    [Description("Instantaneous values."), SchemaConst("instantaneous")]
    public required string Amplitude { get; init; }

    [Description("Values in 'unit' at time_s.")]
    public required IEnumerable<double> Values { get; init; }

    [Description("The largest magnitude over every step of the run, in 'unit'.")]
    public required double PeakAbs { get; init; }

    [Description("The value with its sign at that instant, in 'unit'.")]
    public required double PeakValue { get; init; }

    [Description("The instant, in s.")]
    public required double PeakTimeS { get; init; }

    [Description("Root mean square over rms_window_s, in 'unit'; null when the window holds no step.")]
    public required double Rms { get; init; }
}

/// <summary>A support reaction history in <see cref="TransientOutput"/>.</summary>
public sealed record TransientReactionOutput
{
    [Description("Name of the support.")]
    public required string Support { get; init; }

    [Description("N.")]
    public required string Unit { get; init; }

    [Description("Instantaneous values."), SchemaConst("instantaneous")]
    public required string Amplitude { get; init; }

    [Description("One value per written time, in 'unit'.")]
    public required IEnumerable<double> Values { get; init; }
}

/// <summary>A voltage source's current history in <see cref="TransientOutput"/>.</summary>
public sealed record TransientSourceCurrentOutput
{
    [Description("Name of the source's support.")]
    public required string Support { get; init; }

    [Description("A."), SchemaEnum("A")]
    public required string Unit { get; init; }

    [Description("Instantaneous values."), SchemaConst("instantaneous")]
    public required string Amplitude { get; init; }

    [Description("One value per written time, in 'unit'.")]
    public required IEnumerable<double> Values { get; init; }
}

/// <summary>A transducer's port voltage or current history in <see cref="TransientOutput"/>.</summary>
public sealed record TransientPortOutput
{
    [Description("Name of the transducer.")]
    public required string Transducer { get; init; }

    [Description("voltage (u = Bl*(v_a - v_b), V) or current (out of branch terminal n1 into the circuit, A)."), SchemaEnum("voltage", "current")]
    public required string Quantity { get; init; }

    [Description("V for a voltage, A for a current."), SchemaEnum("V", "A")]
    public required string Unit { get; init; }

    [Description("Instantaneous values."), SchemaConst("instantaneous")]
    public required string Amplitude { get; init; }

    [Description("One value per written time, in 'unit'.")]
    public required IEnumerable<double> Values { get; init; }
}

/// <summary>The r.m.s. window in <see cref="TransientOutput"/>.</summary>
public sealed record TransientWindowOutput
{
    [Description("Start, in s.")]
    public required double From { get; init; }

    [Description("End, in s.")]
    public required double To { get; init; }
}

/// <summary>The peak of one history in <see cref="TransientOutput"/>.</summary>
public sealed record TransientPeakOutput
{
    [Description("The DOF, element or support.")]
    public required string Name { get; init; }

    [Description("What the value measures: displacement, velocity, acceleration, spring_force, damper_force or reaction; flux_linkage, voltage, voltage_rate at an electrical node, inductor_current or resistor_current for an electrical element, port_voltage, port_current, source_current.")]
    public required string Quantity { get; init; }

    [Description("SI unit of the values (m, m/s, m/s^2; rad, rad/s, rad/s^2 at a rotation DOF of a plane or 3d model, N, ...; V*s, V, V/s, A on the electrical side).")]
    public required string Unit { get; init; }

    [Description("A peak: the largest magnitude, with its sign."), SchemaConst("peak")]
    public required string Amplitude { get; init; }

    [Description("The value at the peak, in 'unit'.")]
    public required double Value { get; init; }

    [Description("The instant of the peak, in s.")]
    public required double TimeS { get; init; }

    [Description("Root mean square over rms_window_s, in 'unit'; null when the window holds no step.")]
    public required double Rms { get; init; }
}

/// <summary>The energy balance in <see cref="TransientOutput"/>.</summary>
public sealed record TransientEnergyOutput
{
    [Description("Energy at the start, in J.")]
    public required double InitialJ { get; init; }

    [Description("Work done by the loads, in J.")]
    public required double InputWorkJ { get; init; }

    [Description("Kinetic energy at the end, in J.")]
    public required double FinalKineticJ { get; init; }

    [Description("Strain energy at the end, in J.")]
    public required double FinalStrainJ { get; init; }

    [Description("Energy dissipated by damping, in J.")]
    public required double DissipatedJ { get; init; }

    [Description("Largest error of the energy balance E0 + W - T - V - D over the steps, relative to the largest energy figure seen (fraction).")]
    public required double MaxRelativeError { get; init; }
}
