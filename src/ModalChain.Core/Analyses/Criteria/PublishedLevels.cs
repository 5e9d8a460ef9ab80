using System.Collections.Immutable;

namespace ModalChain.Core.Analyses.Criteria;

/// <summary>How sure the project is of a published value it uses.</summary>
public enum SourceCertainty
{
    /// <summary>Cited in the project's reference list, values recalled with high confidence.</summary>
    ReferencedHighConfidence,
    /// <summary>Cited in the project's reference list, values recalled with medium confidence (secondary sources disagree).</summary>
    ReferencedMediumConfidence,
    /// <summary>Not in the project's reference list: recalled from memory and not verified against the publication.</summary>
    FromMemoryUnverified,
}

/// <summary>The zone boundaries of one class of machine, r.m.s. velocity in m/s.</summary>
/// <param name="Name">The name a model uses for the class, e.g. "medium-rigid".</param>
/// <param name="Description">What machines and supports the class covers.</param>
/// <param name="BoundaryAB">Boundary between zones A and B (m/s r.m.s.).</param>
/// <param name="BoundaryBC">Boundary between zones B and C (m/s r.m.s.).</param>
/// <param name="BoundaryCD">Boundary between zones C and D (m/s r.m.s.).</param>
/// <param name="Source">Where the values come from, with their certainty in words.</param>
/// <param name="Certainty">How sure the values are.</param>
public sealed record MachineZoneClass(
    string Name, string Description, double BoundaryAB, double BoundaryBC, double BoundaryCD, string Source, SourceCertainty Certainty)
{
    /// <summary>The upper boundary of <paramref name="zone"/> (A, B or C) in m/s r.m.s.: the largest value still in it.</summary>
    public double UpperBoundary(char zone) => zone switch
    {
        'A' => BoundaryAB,
        'B' => BoundaryBC,
        'C' => BoundaryCD,
        _ => throw new ArgumentOutOfRangeException(nameof(zone), zone, "Zone D has no upper boundary; a limit is the top of zone A, B or C."),
    };

    /// <summary>The zone (A to D) of an r.m.s. velocity <paramref name="rmsVelocity"/> in m/s; a value on a boundary belongs to the better zone.</summary>
    public char ZoneOf(double rmsVelocity) =>
        rmsVelocity <= BoundaryAB ? 'A' : rmsVelocity <= BoundaryBC ? 'B' : rmsVelocity <= BoundaryCD ? 'C' : 'D';
}

/// <summary>One vibration criterion curve for sensitive equipment: a one-third-octave r.m.s. velocity level.</summary>
/// <param name="Name">The curve's name as the trade writes it, e.g. "VC-A".</param>
/// <param name="PlateauVelocity">The constant r.m.s. velocity limit of the bands from 8 to 80 Hz, in m/s.</param>
/// <param name="Source">Where the value comes from, with its certainty in words.</param>
/// <param name="Certainty">How sure the value is.</param>
public sealed record FloorCurve(string Name, double PlateauVelocity, string Source, SourceCertainty Certainty)
{
    /// <summary>Index of the lowest band of the constant-velocity plateau: centre 10^(9/10) = 7.94 Hz, nominally 8 Hz.</summary>
    public const int PlateauFirstBand = 9;

    /// <summary>Index of the highest band of the plateau: centre 10^(19/10) = 79.4 Hz, nominally 80 Hz.</summary>
    public const int PlateauLastBand = 19;

    /// <summary>Index of the lowest band with a limit: centre 1 Hz.</summary>
    public const int FirstBand = 0;

    /// <summary>
    /// The r.m.s. velocity limit in m/s of one-third-octave band <paramref name="band"/>, or null when the curve states none there.
    /// </summary>
    /// <remarks>
    /// Bands 8 to 80 Hz (indices 9 to 19): the plateau velocity. Bands 1 to 6.3 Hz (indices 0 to 8): constant
    /// acceleration continuing the 8 Hz band, v(f_c) = v₀·f_c(9)/f_c; this low-frequency part is recalled from memory
    /// and unverified (docs/criteria.md). Above the 80 Hz band the curves state nothing and no limit is returned.
    /// </remarks>
    public double? LimitInBand(int band)
    {
        if (band < FirstBand || band > PlateauLastBand) return null;
        if (band >= PlateauFirstBand) return PlateauVelocity;
        return PlateauVelocity * ThirdOctaveBands.CentreHz(PlateauFirstBand) / ThirdOctaveBands.CentreHz(band);
    }
}

/// <summary>The published levels ModalChain knows by name: every value in one table, each with its source.</summary>
/// <remarks>
/// These are levels used in practice, documented as such (docs/criteria.md), never a statement of compliance with a
/// standard: the standards add conditions (measurement positions, frequency range, machine power, foundation
/// classification) that a lumped model cannot check.
/// </remarks>
public static class PublishedLevels
{
    private const string ZoneSource = "ISO 10816-3 / ISO 20816-3 style zone boundaries";
    private const string CurveSource = "Ungar, Sturz & Amick, Sound & Vibration 24(7), 1990; Gordon, Proc. SPIE 1619, 1991";

    /// <summary>Machine vibration zone boundaries by class, in m/s r.m.s.</summary>
    public static readonly ImmutableArray<MachineZoneClass> MachineClasses =
    [
        new("medium-rigid", "medium-sized machines on rigid supports", 1.4e-3, 2.8e-3, 4.5e-3,
            ZoneSource + " [from memory, medium confidence: tables in secondary sources disagree]", SourceCertainty.ReferencedMediumConfidence),
        new("medium-flexible", "medium-sized machines on flexible supports", 2.3e-3, 4.5e-3, 7.1e-3,
            ZoneSource + " [from memory, unverified]", SourceCertainty.FromMemoryUnverified),
        new("large-rigid", "large machines on rigid supports", 2.3e-3, 4.5e-3, 7.1e-3,
            ZoneSource + " [from memory, unverified]", SourceCertainty.FromMemoryUnverified),
        new("large-flexible", "large machines on flexible supports", 3.5e-3, 7.1e-3, 11.0e-3,
            ZoneSource + " [from memory, unverified]", SourceCertainty.FromMemoryUnverified),
    ];

    /// <summary>The classical vibration criterion curves for sensitive equipment floors, plateau in m/s r.m.s.</summary>
    public static readonly ImmutableArray<FloorCurve> FloorCurves =
    [
        new("VC-A", 50e-6, CurveSource + " [values from memory, high confidence]", SourceCertainty.ReferencedHighConfidence),
        new("VC-B", 25e-6, CurveSource + " [values from memory, high confidence]", SourceCertainty.ReferencedHighConfidence),
        new("VC-C", 12.5e-6, CurveSource + " [values from memory, high confidence]", SourceCertainty.ReferencedHighConfidence),
        new("VC-D", 6.25e-6, CurveSource + " [values from memory, high confidence]", SourceCertainty.ReferencedHighConfidence),
        new("VC-E", 3.12e-6, CurveSource + " [values from memory, high confidence]", SourceCertainty.ReferencedHighConfidence),
    ];

    /// <summary>The machine class named <paramref name="name"/> (ignoring case), or null.</summary>
    public static MachineZoneClass? MachineClass(string name) =>
        MachineClasses.FirstOrDefault(c => string.Equals(c.Name, name, StringComparison.OrdinalIgnoreCase));

    /// <summary>The floor curve named <paramref name="name"/> (ignoring case), or null.</summary>
    public static FloorCurve? FloorCurve(string name) =>
        FloorCurves.FirstOrDefault(c => string.Equals(c.Name, name, StringComparison.OrdinalIgnoreCase));
}

/// <summary>Base-10 one-third-octave bands: centres 10^(n/10) Hz, edges f_c·10^(±1/20) (IEC 61260 / ANSI S1.11 [common practice]).</summary>
public static class ThirdOctaveBands
{
    // Within this (in units of 10·log10 f) a frequency counts as lying on an edge; 1e-9 is a relative 2.3e-10 in f.
    private const double EdgeTolerance = 1e-9;

    /// <summary>The exact centre frequency in Hz of band <paramref name="band"/>: 10^(n/10).</summary>
    public static double CentreHz(int band) => Math.Pow(10, band / 10.0);

    /// <summary>The lower edge in Hz of band <paramref name="band"/>: 10^((n − ½)/10).</summary>
    public static double LowerEdgeHz(int band) => Math.Pow(10, (band - 0.5) / 10);

    /// <summary>The upper edge in Hz of band <paramref name="band"/>: 10^((n + ½)/10).</summary>
    public static double UpperEdgeHz(int band) => Math.Pow(10, (band + 0.5) / 10);

    /// <summary>The nominal centre frequency as usually printed (1, 1.25, 1.6, 2, 2.5, 3.15, 4, 5, 6.3, 8 and decades).</summary>
    public static double NominalHz(int band)
    {
        double[] mantissa = [1, 1.25, 1.6, 2, 2.5, 3.15, 4, 5, 6.3, 8];
        var decade = (int)Math.Floor(band / 10.0);
        return mantissa[band - 10 * decade] * Math.Pow(10, decade);
    }

    /// <summary>The band that holds <paramref name="frequencyHz"/> (Hz, positive); a frequency on an edge belongs to the band above it.</summary>
    public static int BandOf(double frequencyHz)
    {
        Guard.Positive(frequencyHz);
        return (int)Math.Floor(10 * Math.Log10(frequencyHz) + 0.5 + EdgeTolerance);
    }
}
