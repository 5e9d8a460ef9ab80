using System.Collections.Immutable;
using ModalChain.Core.Analyses.Harmonic;

namespace ModalChain.Core.Analyses.Criteria;

/// <summary>A machine vibration zone criterion: the r.m.s. velocity of each mass must stay within a given zone of a machine class.</summary>
/// <param name="At">The masses checked (names), each on its own.</param>
/// <param name="Class">The machine class whose zone boundaries apply.</param>
/// <param name="AcceptedZone">The worst zone accepted: A, B or C; the limit is that zone's upper boundary.</param>
public sealed record MachineZoneCriterion(ImmutableArray<string> At, MachineZoneClass Class, char AcceptedZone)
{
    /// <summary>The limit in m/s r.m.s.: the upper boundary of <see cref="AcceptedZone"/>.</summary>
    public double Limit => Class.UpperBoundary(AcceptedZone);

    /// <summary>Short text such as "machine zone B (medium-rigid) at skid".</summary>
    public string Describe(string at) => $"machine zone {AcceptedZone} ({Class.Name}) at {at}";
}

/// <summary>The outcome of a machine zone criterion at one mass.</summary>
/// <param name="Criterion">The criterion.</param>
/// <param name="At">The mass.</param>
/// <param name="RmsVelocity">r.m.s. velocity of the steady-state response over all operating points, m/s.</param>
/// <param name="Zone">The zone the velocity lies in (A to D; a value on a boundary is in the better zone).</param>
/// <param name="Reserve">(limit − value)/limit as a fraction.</param>
public sealed record MachineZoneResult(MachineZoneCriterion Criterion, string At, double RmsVelocity, char Zone, double Reserve)
{
    /// <summary>True when the velocity does not exceed the upper boundary of the accepted zone.</summary>
    public bool Passes => RmsVelocity <= Criterion.Limit;

    /// <summary>The translation whose velocity is reported when <see cref="At"/> is measured in several directions (the largest governs); null when it names one motion.</summary>
    public string? MeasuredAt { get; init; }

    /// <summary>Why the value or reserve has no finite value, or null.</summary>
    public string? ReserveNote => ReserveNotes.OfLimit(RmsVelocity, Reserve);
}

/// <summary>A sensitive-equipment floor criterion: one-third-octave r.m.s. velocity of each mass below a criterion curve.</summary>
/// <param name="At">The masses checked (names), each on its own.</param>
/// <param name="Curve">The criterion curve.</param>
public sealed record FloorCriterion(ImmutableArray<string> At, FloorCurve Curve)
{
    /// <summary>Short text such as "floor curve VC-A at bench".</summary>
    public string Describe(string at) => $"floor curve {Curve.Name} at {at}";
}

/// <summary>The r.m.s. velocity in one one-third-octave band against the curve's limit there.</summary>
/// <param name="Band">Band index n (centre 10^(n/10) Hz).</param>
/// <param name="CentreHz">Exact centre frequency in Hz.</param>
/// <param name="NominalHz">Nominal centre frequency in Hz as usually printed.</param>
/// <param name="RmsVelocity">Band r.m.s. velocity √(Σ v_rms,k²) of the components in the band, m/s.</param>
/// <param name="Limit">The curve's limit in the band, m/s r.m.s.</param>
/// <param name="Reserve">(limit − value)/limit as a fraction.</param>
public sealed record BandLevel(int Band, double CentreHz, double NominalHz, double RmsVelocity, double Limit, double Reserve)
{
    /// <summary>True when the band level does not exceed the limit.</summary>
    public bool Passes => RmsVelocity <= Limit;
}

/// <summary>The outcome of a floor criterion at one mass: every band that holds a response component.</summary>
/// <param name="Criterion">The criterion.</param>
/// <param name="At">The mass.</param>
/// <param name="Bands">The bands with a component, ascending.</param>
/// <param name="UncomparedHz">Frequencies (Hz) of components outside the bands where the curve has a limit (above the 80 Hz band or below the 1 Hz band).</param>
public sealed record FloorResult(FloorCriterion Criterion, string At, ImmutableArray<BandLevel> Bands, ImmutableArray<double> UncomparedHz)
{
    /// <summary>The band with the smallest reserve, or null when no component lies where the curve has a limit.</summary>
    public BandLevel? Governing => Bands.IsEmpty ? null : Bands.MinBy(b => b.Reserve);

    /// <summary>The worst band's reserve (a fraction); +∞ when no band was compared.</summary>
    public double Reserve => Governing?.Reserve ?? double.PositiveInfinity;

    /// <summary>True when every band passes.</summary>
    public bool Passes => Bands.All(b => b.Passes);

    /// <summary>The translation whose bands are reported when <see cref="At"/> is measured in several directions (the one nearest to failing governs); null when it names one motion.</summary>
    public string? MeasuredAt { get; init; }

    /// <summary>Why <see cref="Reserve"/> has no finite value, or null.</summary>
    public string? ReserveNote => Bands.IsEmpty ? "n/a: no response component lies in a band the curve covers" : ReserveNotes.OfLimit(Governing!.RmsVelocity, Reserve);
}

/// <summary>Evaluates machine zone and floor criteria on steady harmonic response components.</summary>
/// <remarks>
/// A component of complex displacement X at frequency f has velocity amplitude |V| = ω|X| (ω = 2πf) and, being a
/// sinusoid, r.m.s. velocity |V|/√2. Machine zones use the overall r.m.s. velocity √(Σ|V_k|²/2) over all components
/// (distinct frequencies). Floor curves put each component in its one-third-octave band (<see cref="ThirdOctaveBands"/>),
/// take the band level √(Σ v_rms,k²) over the components in the band, and compare band by band; the reserve is the
/// worst band's. Components at one frequency must be added as complex amplitudes before they come here.
/// </remarks>
public static class VelocityLevels
{
    /// <summary>The r.m.s. velocity in m/s of one component: ω|X|/√2.</summary>
    public static double RmsVelocity(HarmonicComponent component) =>
        2 * Math.PI * component.FrequencyHz * component.Displacement.Magnitude / Math.Sqrt(2);

    /// <summary>The band levels of <paramref name="components"/>: (band index, r.m.s. velocity in m/s), ascending by band.</summary>
    public static IReadOnlyList<(int Band, double RmsVelocity)> BandLevels(IEnumerable<HarmonicComponent> components)
    {
        ArgumentNullException.ThrowIfNull(components);
        var squares = new SortedDictionary<int, double>();
        foreach (var c in components)
        {
            var band = ThirdOctaveBands.BandOf(c.FrequencyHz);
            var v = RmsVelocity(c);
            squares[band] = squares.GetValueOrDefault(band) + v * v;
        }
        return [.. squares.Select(kv => (kv.Key, Math.Sqrt(kv.Value)))];
    }

    /// <summary>Checks <paramref name="criterion"/> at mass <paramref name="at"/> with its response <paramref name="components"/>.</summary>
    public static MachineZoneResult Evaluate(MachineZoneCriterion criterion, string at, IReadOnlyList<HarmonicComponent> components)
    {
        ArgumentNullException.ThrowIfNull(criterion);
        var value = VibrationLimitCheck.Amplitude(components, ResponseQuantity.Velocity, AmplitudeMeasure.Rms);
        return new MachineZoneResult(criterion, at, value, criterion.Class.ZoneOf(value), (criterion.Limit - value) / criterion.Limit);
    }

    /// <summary>Checks <paramref name="criterion"/> at mass <paramref name="at"/> with its response <paramref name="components"/>.</summary>
    public static FloorResult Evaluate(FloorCriterion criterion, string at, IReadOnlyList<HarmonicComponent> components)
    {
        ArgumentNullException.ThrowIfNull(criterion);
        ArgumentNullException.ThrowIfNull(components);
        var compared = new List<HarmonicComponent>();
        var outside = ImmutableArray.CreateBuilder<double>();
        foreach (var c in components)
        {
            if (c.FrequencyHz > 0 && criterion.Curve.LimitInBand(ThirdOctaveBands.BandOf(c.FrequencyHz)) is not null) compared.Add(c);
            else outside.Add(c.FrequencyHz);
        }
        var bands = BandLevels(compared).Select(b =>
        {
            var limit = criterion.Curve.LimitInBand(b.Band)!.Value;
            return new BandLevel(b.Band, ThirdOctaveBands.CentreHz(b.Band), ThirdOctaveBands.NominalHz(b.Band), b.RmsVelocity, limit, (limit - b.RmsVelocity) / limit);
        });
        return new FloorResult(criterion, at, [.. bands], outside.ToImmutable());
    }
}
