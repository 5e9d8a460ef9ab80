using System.ComponentModel;
using System.Text.Json.Serialization;

namespace ModalChain.Io.Json.Records;

/// <summary>The JSON of <c>modalchain check --format json</c>: one property per field, in the order written.</summary>
/// <remarks>
/// Reserves are fractions: separation reserve = relative change of the natural frequency that reaches the band edge;
/// limit reserve = (limit − value)/limit. A reserve with no finite value is null, with "reserve_note" saying why.
/// Machine zones and floor curves compare r.m.s. velocity ("measure": "rms"); a floor curve's reserve is its worst band's.
/// </remarks>
[Description("Frequency separation and vibration limits checked against the model's criteria; reserves are fractions.")]
public sealed record CheckOutput : CommandOutput
{
    [Description("Whether every evaluated criterion is met.")]
    public required bool Passes { get; init; }

    [Description("The frequency-separation check; null when the criteria have none."), JsonIgnore(Condition = JsonIgnoreCondition.Never)]
    public required CheckSeparationOutput? Separation { get; init; }

    [Description("The rule that combined the load cases for the limits (sum or rms); null when the model has no load cases."),
     JsonIgnore(Condition = JsonIgnoreCondition.Never), SchemaEnum("sum", "rms")]
    public required string? LoadCaseCombination { get; init; }

    [Description("Each vibration limit with the computed value.")]
    public required IReadOnlyList<CheckLimitOutput> Limits { get; init; }

    [Description("Each machine-vibration zone criterion with the computed r.m.s. velocity.")]
    public required IReadOnlyList<CheckZoneOutput> MachineZones { get; init; }

    [Description("Each floor-vibration curve with the computed r.m.s. velocity per band.")]
    public required IReadOnlyList<CheckFloorOutput> FloorCurves { get; init; }

    [Description("Criteria of the model that could not be evaluated, with the reason.")]
    public required IReadOnlyList<CheckNotEvaluatedOutput> NotEvaluated { get; init; }
}

/// <summary>The frequency-separation check in <see cref="CheckOutput"/>.</summary>
public sealed record CheckSeparationOutput
{
    [Description(Describe.Passes)]
    public required bool Passes { get; init; }

    [Description("Half-width of the forbidden band (fraction).")]
    public required double Margin { get; init; }

    [Description("Running speeds, in Hz.")]
    public required IReadOnlyList<double> SpeedsHz { get; init; }

    [Description("Harmonic orders of the running speeds checked (1 for running speed, 2 for twice running speed, ...).")]
    public required IReadOnlyList<double> Orders { get; init; }

    [Description(Describe.Reserve)]
    public required double Reserve { get; init; }

    [Description(Describe.Note)]
    public string? ReserveNote { get; init; }

    [Description("Each checked mode against each excitation frequency.")]
    public required IReadOnlyList<CheckPairOutput> Pairs { get; init; }

    [Description("The masses named by criteria.separation.exempt (empty when none).")]
    public required IReadOnlyList<string> Exempt { get; init; }

    [Description("Modes left out of the check because the exempt masses carry most of their kinetic energy; they have no pairs.")]
    public required IReadOnlyList<CheckExemptModeOutput> ExemptModes { get; init; }
}

/// <summary>One mode against one excitation frequency in <see cref="CheckSeparationOutput"/>.</summary>
public sealed record CheckPairOutput
{
    [Description(Describe.Mode)]
    public required int Mode { get; init; }

    [Description("Natural frequency, in Hz.")]
    public required double FrequencyHz { get; init; }

    [Description("Running speed, in Hz.")]
    public required double SpeedHz { get; init; }

    [Description("Harmonic order of the running speed.")]
    public required double Order { get; init; }

    [Description("Running speed times order, in Hz.")]
    public required double ExcitationHz { get; init; }

    [Description("Relative distance of the natural frequency from the excitation frequency (fraction).")]
    public required double Separation { get; init; }

    [Description(Describe.Reserve)]
    public required double Reserve { get; init; }

    [Description(Describe.Note)]
    public string? ReserveNote { get; init; }

    [Description(Describe.Passes)]
    public required bool Passes { get; init; }
}

/// <summary>A mode left out of the separation check in <see cref="CheckSeparationOutput"/>.</summary>
public sealed record CheckExemptModeOutput
{
    [Description(Describe.Mode)]
    public required int Mode { get; init; }

    [Description("Natural frequency, in Hz.")]
    public required double FrequencyHz { get; init; }

    [Description("Share of the mode's kinetic energy carried by the exempt masses (fraction).")]
    public required double KineticEnergyShare { get; init; }

    [Description("Why the mode is not checked.")]
    public required string Reason { get; init; }
}

/// <summary>One vibration limit in <see cref="CheckOutput"/>.</summary>
public sealed record CheckLimitOutput
{
    [Description("The motion or element the limit applies to, as the model names it.")]
    public required string At { get; init; }

    [Description("The translation whose response is reported when 'at' names a point of a plane or 3d model without a direction: each translation is measured and the largest governs. Absent when 'at' names one motion.")]
    public string? MeasuredAt { get; init; }

    [Description("displacement, velocity or acceleration (or force for element forces).")]
    public required string Quantity { get; init; }

    [Description("Peak amplitude or r.m.s. value."), SchemaEnum("peak", "rms")]
    public required string Measure { get; init; }

    [Description("SI unit of the values (m, m/s, m/s^2; rad, rad/s, rad/s^2 at a rotation DOF of a plane or 3d model, N, ...).")]
    public required string Unit { get; init; }

    [Description("The limit, in the unit.")]
    public required double Limit { get; init; }

    [Description("The computed value, in the unit.")]
    public required double Value { get; init; }

    [Description(Describe.Reserve)]
    public required double Reserve { get; init; }

    [Description(Describe.Note)]
    public string? ReserveNote { get; init; }

    [Description(Describe.Passes)]
    public required bool Passes { get; init; }
}

/// <summary>One machine-vibration zone criterion in <see cref="CheckOutput"/>.</summary>
public sealed record CheckZoneOutput
{
    [Description("The motion the criterion applies to, as the model names it.")]
    public required string At { get; init; }

    [Description("The translation whose r.m.s. velocity is reported when 'at' names a point of a plane or 3d model without a direction: each translation is measured and the largest governs. Absent when 'at' names one motion.")]
    public string? MeasuredAt { get; init; }

    [Description("The machine class whose zone boundaries apply.")]
    public required string Class { get; init; }

    [Description("Always velocity."), SchemaEnum("velocity")]
    public required string Quantity { get; init; }

    [Description("Always r.m.s."), SchemaEnum("rms")]
    public required string Measure { get; init; }

    [Description("SI unit of the values."), SchemaEnum("m/s")]
    public required string Unit { get; init; }

    [Description("The worst zone accepted.")]
    public required string AcceptedZone { get; init; }

    [Description("The upper boundary of the accepted zone, in m/s.")]
    public required double Limit { get; init; }

    [Description("The computed r.m.s. velocity, in m/s.")]
    public required double Value { get; init; }

    [Description("The zone the value falls in.")]
    public required string Zone { get; init; }

    [Description("The class's zone boundaries, in m/s.")]
    public required CheckZoneBoundariesOutput Boundaries { get; init; }

    [Description("Where the class's boundaries come from.")]
    public required string Source { get; init; }

    [Description(Describe.Reserve)]
    public required double Reserve { get; init; }

    [Description(Describe.Note)]
    public string? ReserveNote { get; init; }

    [Description(Describe.Passes)]
    public required bool Passes { get; init; }
}

/// <summary>Zone boundaries of a machine class in <see cref="CheckZoneOutput"/>.</summary>
public sealed record CheckZoneBoundariesOutput
{
    [Description("Between zones A and B, in m/s."), JsonPropertyName("a_b")]
    public required double AB { get; init; }

    [Description("Between zones B and C, in m/s."), JsonPropertyName("b_c")]
    public required double BC { get; init; }

    [Description("Between zones C and D, in m/s."), JsonPropertyName("c_d")]
    public required double CD { get; init; }
}

/// <summary>One floor-vibration curve in <see cref="CheckOutput"/>.</summary>
public sealed record CheckFloorOutput
{
    [Description("The motion the curve applies to, as the model names it.")]
    public required string At { get; init; }

    [Description("The translation whose bands are reported when 'at' names a point of a plane or 3d model without a direction: the direction with the smallest reserve governs. Absent when 'at' names one motion.")]
    public string? MeasuredAt { get; init; }

    [Description("The curve's name.")]
    public required string Curve { get; init; }

    [Description("Always velocity."), SchemaEnum("velocity")]
    public required string Quantity { get; init; }

    [Description("Always r.m.s."), SchemaEnum("rms")]
    public required string Measure { get; init; }

    [Description("SI unit of the values."), SchemaEnum("m/s")]
    public required string Unit { get; init; }

    [Description("Where the curve comes from.")]
    public required string Source { get; init; }

    [Description("Each one-third-octave band compared.")]
    public required IReadOnlyList<CheckBandOutput> Bands { get; init; }

    [Description("Frequencies of response components outside the bands the curve has a limit for (above its highest or below its lowest band), in Hz.")]
    public required IReadOnlyList<double> UncomparedHz { get; init; }

    [Description(Describe.Reserve)]
    public required double Reserve { get; init; }

    [Description(Describe.Note)]
    public string? ReserveNote { get; init; }

    [Description(Describe.Passes)]
    public required bool Passes { get; init; }
}

/// <summary>One band of a floor curve in <see cref="CheckFloorOutput"/>.</summary>
public sealed record CheckBandOutput
{
    [Description("Exact centre frequency, in Hz.")]
    public required double CentreHz { get; init; }

    [Description("Nominal centre frequency, in Hz.")]
    public required double NominalHz { get; init; }

    [Description("The computed r.m.s. velocity in the band, in m/s.")]
    public required double Value { get; init; }

    [Description("The curve's limit in the band, in m/s.")]
    public required double Limit { get; init; }

    [Description(Describe.Reserve)]
    public required double Reserve { get; init; }

    [Description(Describe.Passes)]
    public required bool Passes { get; init; }
}

/// <summary>A criterion that could not be evaluated in <see cref="CheckOutput"/>.</summary>
public sealed record CheckNotEvaluatedOutput
{
    [Description("The criterion, as the model names it.")]
    public required string Criterion { get; init; }

    [Description("Why it was not evaluated.")]
    public required string Reason { get; init; }
}
