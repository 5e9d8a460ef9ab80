using System.Collections.Immutable;
using ModalChain.Core;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Io.Json.Records;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Io.Json;

/// <summary>Maps a transient result to its output record, <see cref="TransientOutput"/>, the JSON object of <c>modalchain transient --format json</c> (SI units).</summary>
/// <remarks>
/// Field names are a public contract: time_s, responses (dof, quantity, unit, values), element_forces (element, kind,
/// unit, values), reactions (support, unit, values), peaks (name, quantity, unit, value, time_s, rms), energy, warnings;
/// further fields are additions. Element forces are k(u_A − u_B) and c(u̇_A − u̇_B) with A and B as in 'between';
/// a reaction is the force the support receives, positive along the direction of motion. "amplitude" says what a
/// number is: "instantaneous" for a time history, "peak" for a peak's value (largest magnitude, with sign); a peak's
/// "rms" is the r.m.s. over rms_window_s. Plane and 3d models add mount_forces (element, kind, direction, unit, values,
/// peak_abs, peak_value, peak_time_s, rms): the force or moment each spring and damper applies to its second end per
/// direction; those histories are not repeated in element_forces or peaks. With electrical nodes the names and units
/// of <see cref="ElectricalLabels"/> apply, and source_currents (support, A) and transducer_ports (transducer, quantity
/// voltage in V or current in A) are added.
/// </remarks>
public static class TransientJson
{
    /// <summary>Writes one JSON object to <paramref name="stream"/>.</summary>
    /// <remarks>The last argument chooses the recorded samples to write (ascending indices into <see cref="TransientResult.Times"/>), for
    /// example from <see cref="ThinnedSamples"/>; null writes every recorded sample. Peaks and RMS are always those of the
    /// whole run.</remarks>
    public static void Write(Stream stream, ModelDocument document, TransientResult result, IReadOnlyList<string> loads, string toolVersion,
        IReadOnlyList<int>? samples = null)
    {
        ArgumentNullException.ThrowIfNull(document);
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(loads);
        OutputJson.Write(stream, Output(document, result, loads, toolVersion, samples));
    }

    /// <summary>The output record of a transient result; arguments as <see cref="Write"/>.</summary>
    /// <remarks>The histories are lazy sequences over the result's arrays: nothing is copied until it is written.</remarks>
    public static TransientOutput Output(ModelDocument document, TransientResult result, IReadOnlyList<string> loads, string toolVersion,
        IReadOnlyList<int>? samples = null)
    {
        ArgumentNullException.ThrowIfNull(document);
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(loads);
        IEnumerable<double> Pick(ImmutableArray<double> values) => samples is null ? values : samples.Select(i => values[i]);
        static string Kind(ResponseQuantity q) => q == ResponseQuantity.SpringForce ? "spring" : "damper";
        var e = result.Energy;
        var network = result.Network;
        return new()
        {
            Title = MarkupText.Clean(document.Network.Title),
            FormatVersion = JsonFormat.Version,
            Source = SourceOutput.Of(document, toolVersion),
            Method = MethodName(result.Settings.Method),
            MethodDescription = result.MethodDescription,
            StepS = result.Settings.Step,
            DurationS = result.Settings.Duration,
            Steps = result.StepCount,
            RecordEvery = result.Settings.RecordEvery,
            Loads = loads,
            HistorySamples = samples is null ? null : new()
            {
                Recorded = result.Times.Length,
                Written = samples.Count,
                Rule = samples.Count == result.Times.Length
                    ? "every recorded sample"
                    : "thinned: the first and last sample and, for every history, its smallest and largest value in each of equal time buckets, so every local extreme at that resolution and every history's largest value survive",
            },
            TimeS = Pick(result.Times),
            Responses = [.. result.Responses.Where(r => IsMotion(r.Quantity)).Select(r => new TransientResponseOutput
            {
                Dof = r.Name,
                Quantity = ElectricalLabels.Quantity(network, r.Name, r.Quantity),
                Unit = ElectricalLabels.Unit(network, r.Name, r.Quantity, r.Unit),
                Amplitude = "instantaneous",
                Values = Pick(r.Values),
            })],
            ElementForces = [.. result.Responses.Where(r => r.Quantity is ResponseQuantity.SpringForce or ResponseQuantity.DamperForce && r.Direction is null)
                .Select(r => new TransientElementForceOutput { Element = r.Name, Kind = Kind(r.Quantity), Unit = ElectricalLabels.Unit(network, r.Name, r.Quantity, "N"), Amplitude = "instantaneous", Values = Pick(r.Values) })],
            // Plane and 3d models only: each spring's and damper's force (N) or moment (N*m) per direction, with its peak.
            MountForces = result.Network.Space == Core.Model.ModelSpace.Line ? null : [.. result.Responses.Where(r => r.Direction is not null)
                .Select(r => new TransientMountForceOutput
                {
                    Element = r.Name,
                    Kind = Kind(r.Quantity),
                    Direction = r.Direction!,
                    Unit = r.Unit,
                    Amplitude = "instantaneous",
                    Values = Pick(r.Values),
                    PeakAbs = Math.Abs(r.Peak.Value),
                    PeakValue = r.Peak.Value,
                    PeakTimeS = r.Peak.Time,
                    Rms = r.Rms,
                })],
            Reactions = [.. result.Responses.Where(r => r.Quantity == ResponseQuantity.Reaction)
                .Select(r => new TransientReactionOutput { Support = r.Name, Unit = "N", Amplitude = "instantaneous", Values = Pick(r.Values) })],
            SourceCurrents = result.Responses.Any(r => r.Quantity == ResponseQuantity.SourceCurrent)
                ? [.. result.Responses.Where(r => r.Quantity == ResponseQuantity.SourceCurrent)
                    .Select(r => new TransientSourceCurrentOutput { Support = r.Name, Unit = "A", Amplitude = "instantaneous", Values = Pick(r.Values) })]
                : null,
            TransducerPorts = result.Responses.Any(r => r.Quantity is ResponseQuantity.PortVoltage or ResponseQuantity.PortCurrent)
                ? [.. result.Responses.Where(r => r.Quantity is ResponseQuantity.PortVoltage or ResponseQuantity.PortCurrent)
                    .Select(r => new TransientPortOutput
                    {
                        Transducer = r.Name,
                        Quantity = r.Quantity == ResponseQuantity.PortVoltage ? "voltage" : "current",
                        Unit = r.Unit,
                        Amplitude = "instantaneous",
                        Values = Pick(r.Values),
                    })]
                : null,
            RmsWindowS = new() { From = result.Settings.RmsFrom ?? 0, To = result.Settings.RmsTo ?? result.StepCount * result.Settings.Step },
            Peaks = [.. result.Responses.Where(r => r.Direction is null).Select(r => new TransientPeakOutput
            {
                Name = r.Name,
                Quantity = ElectricalLabels.Quantity(network, r.Name, r.Quantity),
                Unit = ElectricalLabels.Unit(network, r.Name, r.Quantity, r.Unit),
                Amplitude = "peak",
                Value = r.Peak.Value,
                TimeS = r.Peak.Time,
                Rms = r.Rms,
            })],
            Energy = new()
            {
                InitialJ = e.InitialEnergy,
                InputWorkJ = e.InputWork,
                FinalKineticJ = e.FinalKineticEnergy,
                FinalStrainJ = e.FinalStrainEnergy,
                DissipatedJ = e.Dissipated,
                MaxRelativeError = e.MaxRelativeError,
            },
            Warnings = [.. document.Warnings.Select(w => w.ToString()), .. result.Warnings],
            Caution = Cautions.Text,
        };
    }

    /// <summary>
    /// At most <paramref name="maxSamples"/> recorded samples (or 2 + 2 per history when that is more) that keep the shape of every history: the first and the
    /// last, and for each history the smallest and the largest value in each of equal buckets of samples (so every
    /// history's largest and smallest recorded value is kept exactly). Every sample when the run recorded no more.
    /// </summary>
    public static ImmutableArray<int> ThinnedSamples(TransientResult result, int maxSamples)
    {
        ArgumentNullException.ThrowIfNull(result);
        ArgumentOutOfRangeException.ThrowIfLessThan(maxSamples, 4);
        var n = result.Times.Length;
        if (n <= maxSamples) return [.. Enumerable.Range(0, n)];
        var histories = Math.Max(1, result.Responses.Length);
        var buckets = Math.Max(1, (maxSamples - 2) / (2 * histories));
        var picked = new SortedSet<int> { 0, n - 1 };
        foreach (var r in result.Responses)
        {
            var v = r.Values;
            for (var b = 0; b < buckets; b++)
            {
                var from = (int)((long)b * n / buckets);
                var to = (int)((long)(b + 1) * n / buckets);
                int lo = from, hi = from;
                for (var k = from + 1; k < to; k++)
                {
                    if (v[k] < v[lo]) lo = k;
                    if (v[k] > v[hi]) hi = k;
                }
                picked.Add(lo);
                picked.Add(hi);
            }
        }
        return [.. picked];
    }

    /// <summary>The method's name as written in model files and on the command line.</summary>
    public static string MethodName(TransientMethod method) => method switch
    {
        TransientMethod.Hht => "hht",
        TransientMethod.Exact => "exact",
        TransientMethod.Modal => "modal",
        _ => "newmark",
    };

    /// <summary>The quantity's name in JSON and CSV headers.</summary>
    public static string QuantityName(ResponseQuantity quantity) => quantity switch
    {
        ResponseQuantity.Displacement => "displacement",
        ResponseQuantity.Velocity => "velocity",
        ResponseQuantity.Acceleration => "acceleration",
        ResponseQuantity.SpringForce => "spring_force",
        ResponseQuantity.DamperForce => "damper_force",
        ResponseQuantity.PortVoltage => "port_voltage",
        ResponseQuantity.PortCurrent => "port_current",
        ResponseQuantity.SourceCurrent => "source_current",
        _ => "reaction",
    };

    /// <summary>True for displacement, velocity and acceleration (the motion of a mass).</summary>
    public static bool IsMotion(ResponseQuantity q) => q is ResponseQuantity.Displacement or ResponseQuantity.Velocity or ResponseQuantity.Acceleration;
}
