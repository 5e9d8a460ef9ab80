using System.Collections.Immutable;
using System.Text.Json;
using ModalChain.Core;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Io.Json;

/// <summary>Writes a transient result as the JSON object of <c>modalchain transient --format json</c> (SI units).</summary>
/// <remarks>
/// Field names are a public contract: time_s, responses (dof, quantity, unit, values), element_forces (element, kind,
/// unit, values), reactions (support, unit, values), peaks (name, quantity, unit, value, time_s, rms), energy, warnings;
/// further fields are additions. Element forces are k(u_A − u_B) and c(u̇_A − u̇_B) with A and B as in 'between';
/// a reaction is the force the support receives, positive along the direction of motion. "amplitude" says what a
/// number is: "instantaneous" for a time history, "peak" for a peak's value (largest magnitude, with sign); a peak's
/// "rms" is the r.m.s. over rms_window_s. Plane and 3d models add mount_forces (element, kind, direction, unit, values,
/// peak_abs, peak_value, peak_time_s, rms): the force or moment each spring and damper applies to its second end per
/// direction; those histories are not repeated in element_forces or peaks.
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
        IEnumerable<double> Pick(ImmutableArray<double> values) => samples is null ? values : samples.Select(i => values[i]);
        using var w = new Utf8JsonWriter(stream, ModesJson.WriterOptions);
        w.WriteStartObject();
        w.WriteString("title", MarkupText.Clean(document.Network.Title));
        w.Source(document, toolVersion);
        w.WriteString("method", MethodName(result.Settings.Method));
        w.WriteString("method_description", result.MethodDescription);
        w.Number("step_s", result.Settings.Step);
        w.Number("duration_s", result.Settings.Duration);
        w.WriteNumber("steps", result.StepCount);
        w.WriteNumber("record_every", result.Settings.RecordEvery);
        w.WriteStartArray("loads");
        foreach (var l in loads) w.WriteStringValue(l);
        w.WriteEndArray();
        if (samples is not null)
        {
            w.WriteStartObject("history_samples");
            w.WriteNumber("recorded", result.Times.Length);
            w.WriteNumber("written", samples.Count);
            w.WriteString("rule", samples.Count == result.Times.Length
                ? "every recorded sample"
                : "thinned: the first and last sample and, for every history, its smallest and largest value in each of equal time buckets, so every local extreme at that resolution and every history's largest value survive");
            w.WriteEndObject();
        }
        w.Array("time_s", Pick(result.Times));

        w.WriteStartArray("responses");
        foreach (var r in result.Responses.Where(r => IsMotion(r.Quantity)))
        {
            w.WriteStartObject();
            w.WriteString("dof", r.Name);
            w.WriteString("quantity", QuantityName(r.Quantity));
            w.WriteString("unit", r.Unit);
            w.WriteString("amplitude", "instantaneous");
            w.Array("values", Pick(r.Values));
            w.WriteEndObject();
        }
        w.WriteEndArray();

        w.WriteStartArray("element_forces");
        foreach (var r in result.Responses.Where(r => r.Quantity is ResponseQuantity.SpringForce or ResponseQuantity.DamperForce && r.Direction is null))
        {
            w.WriteStartObject();
            w.WriteString("element", r.Name);
            w.WriteString("kind", r.Quantity == ResponseQuantity.SpringForce ? "spring" : "damper");
            w.WriteString("unit", "N");
            w.WriteString("amplitude", "instantaneous");
            w.Array("values", Pick(r.Values));
            w.WriteEndObject();
        }
        w.WriteEndArray();

        // Plane and 3d models only: each spring's and damper's force (N) or moment (N*m) per direction, with its peak.
        if (result.Network.Space != Core.Model.ModelSpace.Line)
        {
            w.WriteStartArray("mount_forces");
            foreach (var r in result.Responses.Where(r => r.Direction is not null))
            {
                w.WriteStartObject();
                w.WriteString("element", r.Name);
                w.WriteString("kind", r.Quantity == ResponseQuantity.SpringForce ? "spring" : "damper");
                w.WriteString("direction", r.Direction);
                w.WriteString("unit", r.Unit);
                w.WriteString("amplitude", "instantaneous");
                w.Array("values", Pick(r.Values));
                w.Number("peak_abs", Math.Abs(r.Peak.Value));
                w.Number("peak_value", r.Peak.Value);
                w.Number("peak_time_s", r.Peak.Time);
                w.Number("rms", r.Rms);
                w.WriteEndObject();
            }
            w.WriteEndArray();
        }

        w.WriteStartArray("reactions");
        foreach (var r in result.Responses.Where(r => r.Quantity == ResponseQuantity.Reaction))
        {
            w.WriteStartObject();
            w.WriteString("support", r.Name);
            w.WriteString("unit", "N");
            w.WriteString("amplitude", "instantaneous");
            w.Array("values", Pick(r.Values));
            w.WriteEndObject();
        }
        w.WriteEndArray();

        w.WriteStartObject("rms_window_s");
        w.Number("from", result.Settings.RmsFrom ?? 0);
        w.Number("to", result.Settings.RmsTo ?? result.StepCount * result.Settings.Step);
        w.WriteEndObject();
        w.WriteStartArray("peaks");
        foreach (var r in result.Responses.Where(r => r.Direction is null))
        {
            w.WriteStartObject();
            w.WriteString("name", r.Name);
            w.WriteString("quantity", QuantityName(r.Quantity));
            w.WriteString("unit", r.Unit);
            w.WriteString("amplitude", "peak");
            w.Number("value", r.Peak.Value);
            w.Number("time_s", r.Peak.Time);
            w.Number("rms", r.Rms);
            w.WriteEndObject();
        }
        w.WriteEndArray();

        var e = result.Energy;
        w.WriteStartObject("energy");
        w.Number("initial_j", e.InitialEnergy);
        w.Number("input_work_j", e.InputWork);
        w.Number("final_kinetic_j", e.FinalKineticEnergy);
        w.Number("final_strain_j", e.FinalStrainEnergy);
        w.Number("dissipated_j", e.Dissipated);
        w.Number("max_relative_error", e.MaxRelativeError);
        w.WriteEndObject();

        w.WriteStartArray("warnings");
        foreach (var warning in document.Warnings) w.WriteStringValue(warning.ToString());
        foreach (var warning in result.Warnings) w.WriteStringValue(warning);
        w.WriteEndArray();
        w.WriteString("caution", Cautions.Text);
        w.WriteEndObject();
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
        _ => "reaction",
    };

    /// <summary>True for displacement, velocity and acceleration (the motion of a mass).</summary>
    public static bool IsMotion(ResponseQuantity q) => q is ResponseQuantity.Displacement or ResponseQuantity.Velocity or ResponseQuantity.Acceleration;
}
