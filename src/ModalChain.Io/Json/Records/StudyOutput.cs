using System.ComponentModel;

namespace ModalChain.Io.Json.Records;

/// <summary>The JSON of <c>modalchain study --format json</c> for a parameter varied over a range.</summary>
/// <remarks>Every array of a step quantity has one item per studied value, in the order of <c>values</c>.</remarks>
[Description("A parameter study: natural frequencies, mode tracking and criterion reserves at each value of the varied parameter.")]
public sealed record ParameterStudyOutput : CommandOutput
{
    [Description("The field varied, as given to --vary: masses.NAME.mass, springs.NAME.stiffness, dampers.NAME.coefficient, inerters.NAME.inertance; in line models also transducers.NAME.force-factor; in plane and 3d models also bodies.NAME.mass, springs.NAME.stiffness.z, springs.NAME.rotational-stiffness.rx, springs.NAME.axial and their damper and inerter forms (inerters.NAME.inertance.y, inerters.NAME.rotational-inertance.rz, inerters.NAME.axial).")]
    public required string Parameter { get; init; }

    [Description("SI unit of the parameter's values (kg, N/m, N*s/m, ...).")]
    public required string Unit { get; init; }

    [Description("The parameter's value at each step, in 'unit'.")]
    public required IReadOnlyList<double> Values { get; init; }

    [Description("Each mode of the first step, followed through the study by shape likeness.")]
    public required IReadOnlyList<StudyModeOutput> Modes { get; init; }

    [Description("Each criterion's reserve at each step.")]
    public required IReadOnlyList<StudyCriterionOutput> Criteria { get; init; }

    [Description("Where a criterion changes from pass to fail between two studied values.")]
    public required IReadOnlyList<StudyThresholdOutput> Thresholds { get; init; }
}

/// <summary>One mode followed through a study in <see cref="ParameterStudyOutput"/>.</summary>
public sealed record StudyModeOutput
{
    [Description("The mode's number at the first step; it keeps this identity at every step.")]
    public required int Identity { get; init; }

    [Description("Its natural frequency at each step, in Hz.")]
    public required IReadOnlyList<double> FrequencyHz { get; init; }

    [Description("Its ascending-frequency number at each step (changes where it crosses another mode).")]
    public required IReadOnlyList<int> ModeNumber { get; init; }

    [Description("Modal assurance criterion of its shape with its shape at the previous step (1 at the first step).")]
    public required IReadOnlyList<double> MacToPrevious { get; init; }

    [Description("Plane and 3d models only: the mode's motion at each value (bounce, surge, sway, roll, pitch, yaw or 'coupled A + B'), as the modes output names it.")]
    public IReadOnlyList<string>? Motion { get; init; }
}

/// <summary>One criterion through a study in <see cref="ParameterStudyOutput"/>.</summary>
public sealed record StudyCriterionOutput
{
    [Description("The criterion's name.")]
    public required string Name { get; init; }

    [Description("Reserve as a fraction at each step; null when it has no finite value (see reserve_note).")]
    public required IReadOnlyList<double> Reserve { get; init; }

    [Description("Beside each null reserve, why it is null (null beside a finite reserve); present when any reserve is null.")]
    public IReadOnlyList<string?>? ReserveNote { get; init; }

    [Description("Whether the criterion is met at each step.")]
    public required IReadOnlyList<bool> Passes { get; init; }

    [Description("Limits only: SI unit of the limit and the response (m, m/s, m/s^2).")]
    public string? Unit { get; init; }

    [Description("Limits only: the limit, in 'unit'.")]
    public double? Limit { get; init; }

    [Description("Limits only: the operating-point response at each step, in the limit's measure and 'unit'.")]
    public IReadOnlyList<double>? Response { get; init; }
}

/// <summary>A pass/fail threshold of a criterion in <see cref="ParameterStudyOutput"/>.</summary>
public sealed record StudyThresholdOutput
{
    [Description("The criterion's name.")]
    public required string Criterion { get; init; }

    [Description("Parameter value where the criterion changes from pass to fail, in 'unit'.")]
    public required double Value { get; init; }

    [Description("On which side of the value the criterion passes."), SchemaEnum("passes above", "passes below")]
    public required string Direction { get; init; }

    [Description("The two studied values around the threshold, in 'unit'.")]
    public required IReadOnlyList<double> Bracket { get; init; }
}

/// <summary>The JSON of <c>modalchain study --vary speed --format json</c>: a speed-frequency chart.</summary>
[Description("A speed-frequency chart: natural frequencies against the running speed's order lines, and where they cross.")]
public sealed record SpeedChartOutput : CommandOutput
{
    [Description("The kind of chart."), SchemaConst("speed-frequency")]
    public required string Chart { get; init; }

    [Description("Running speeds of the chart's points, in Hz.")]
    public required IReadOnlyList<double> SpeedsHz { get; init; }

    [Description("The same speeds, in rpm.")]
    public required IReadOnlyList<double> SpeedsRpm { get; init; }

    [Description("The natural frequencies (rigid-body modes left out), ascending.")]
    public required IReadOnlyList<SpeedChartModeOutput> NaturalFrequencies { get; init; }

    [Description("Each harmonic order's line: order times speed at each chart speed.")]
    public required IReadOnlyList<SpeedChartOrderOutput> OrderLines { get; init; }

    [Description("Where each order line meets each natural frequency within the speed range.")]
    public required IReadOnlyList<SpeedChartCrossingOutput> Crossings { get; init; }
}

/// <summary>A natural frequency in <see cref="SpeedChartOutput"/>.</summary>
public sealed record SpeedChartModeOutput
{
    [Description(Describe.Mode)]
    public required int Mode { get; init; }

    [Description("In Hz.")]
    public required double FrequencyHz { get; init; }
}

/// <summary>An order line in <see cref="SpeedChartOutput"/>.</summary>
public sealed record SpeedChartOrderOutput
{
    [Description("Harmonic order h.")]
    public required double Order { get; init; }

    [Description("h times each chart speed, in Hz.")]
    public required IReadOnlyList<double> FrequencyHz { get; init; }
}

/// <summary>A crossing of an order line and a natural frequency in <see cref="SpeedChartOutput"/>.</summary>
public sealed record SpeedChartCrossingOutput
{
    [Description(Describe.Mode)]
    public required int Mode { get; init; }

    [Description("Harmonic order h.")]
    public required double Order { get; init; }

    [Description("Running speed f_n / h, in Hz.")]
    public required double SpeedHz { get; init; }

    [Description("The same speed, in rpm.")]
    public required double SpeedRpm { get; init; }

    [Description("The natural frequency f_n, in Hz.")]
    public required double FrequencyHz { get; init; }
}
