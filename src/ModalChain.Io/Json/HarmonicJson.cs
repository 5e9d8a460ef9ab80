using System.Numerics;
using System.Text.Json;
using ModalChain.Core;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Io.Json;

/// <summary>Writes a harmonic result as the JSON object of <c>modalchain harmonic --format json</c> (SI units).</summary>
/// <remarks>
/// Field names are a public contract: frequencies_hz, responses (dof, quantity, unit, magnitude, phase_deg),
/// reactions (support, magnitude, phase_deg), peaks, operating_points; further fields are additions (cases and
/// combination for a model with load cases). Phases are
/// in degrees in (−180, 180], of Re(A e^{iωt}) relative to the loads' phase reference. Plane and 3d models add
/// mount_forces (element, kind, direction, unit, magnitude, phase_deg, and over the sweep peak_magnitude and
/// peak_frequency_hz): the force (N) or moment (N*m) each spring and damper applies to its second end per direction. Every magnitude is the
/// peak (zero-to-peak) amplitude of the sinusoid, said by "amplitude": "peak" beside its unit; r.m.s. is peak/√2.
/// </remarks>
public static class HarmonicJson
{
    /// <summary>Writes one JSON object to <paramref name="stream"/>.</summary>
    public static void Write(Stream stream, ModelDocument document, HarmonicResult result, string toolVersion)
    {
        ArgumentNullException.ThrowIfNull(document);
        ArgumentNullException.ThrowIfNull(result);
        using var w = new Utf8JsonWriter(stream, ModesJson.WriterOptions);
        w.WriteStartObject();
        w.WriteString("title", MarkupText.Clean(document.Network.Title));
        w.Source(document, toolVersion);
        WriteSweep(w, result, DofMap.RotationLabels(document.Network));
        w.WriteStartArray("cases");
        w.WriteEndArray();
        w.WriteNull("combination");
        w.WriteStartArray("warnings");
        foreach (var d in document.Warnings) w.WriteStringValue(d.ToString());
        foreach (var warning in result.Warnings) w.WriteStringValue(warning);
        w.WriteEndArray();
        w.WriteString("caution", Cautions.Text);
        w.WriteEndObject();
    }

    /// <summary>Writes the result of a model with load cases: the top-level sweep fields stay empty (no sweep applies every load at once); each case's sweep is under "cases" and their combination under "combination".</summary>
    public static void Write(Stream stream, ModelDocument document, LoadCaseResult result, string toolVersion)
    {
        ArgumentNullException.ThrowIfNull(document);
        ArgumentNullException.ThrowIfNull(result);
        using var w = new Utf8JsonWriter(stream, ModesJson.WriterOptions);
        w.WriteStartObject();
        w.WriteString("title", MarkupText.Clean(document.Network.Title));
        w.Source(document, toolVersion);
        var first = result.Cases[0].Result;
        w.WriteString("method", first.Method == HarmonicMethod.Modal ? "modal" : "direct");
        w.WriteNumber("modes_used", first.ModesUsed);
        w.WriteStartArray("loads");
        foreach (var l in result.Cases.SelectMany(c => c.Case.Loads).Distinct()) w.WriteStringValue(l);
        w.WriteEndArray();
        foreach (var empty in new[] { "frequencies_hz", "responses", "element_forces", "reactions", "transmissibility", "peaks", "operating_points" })
        {
            w.WriteStartArray(empty);
            w.WriteEndArray();
        }
        w.WriteStartArray("notes");
        w.WriteStringValue("the model has load cases: each case is swept on its own under 'cases', and the cases are combined at their running speeds under 'combination'");
        w.WriteEndArray();

        var rotation = DofMap.RotationLabels(document.Network);
        w.WriteStartArray("cases");
        foreach (var c in result.Cases)
        {
            w.WriteStartObject();
            w.WriteString("name", c.Case.Name);
            WriteSweep(w, c.Result, rotation);
            w.WriteStartArray("warnings");
            foreach (var warning in c.Result.Warnings) w.WriteStringValue(warning);
            w.WriteEndArray();
            w.WriteEndObject();
        }
        w.WriteEndArray();

        w.WriteStartObject("combination");
        w.WriteString("rule", LoadCaseSelection.Name(result.Rule));
        w.WriteString("rule_description", LoadCaseSelection.Describe(result.Rule));
        w.WriteStartArray("responses");
        foreach (var r in result.Combined)
            foreach (var q in Enum.GetValues<ResponseQuantity>())
                foreach (var rms in new[] { false, true })
                {
                    var scale = rms ? 1 / Math.Sqrt(2) : 1;
                    w.WriteStartObject();
                    w.WriteString("dof", r.Dof);
                    w.WriteString("quantity", Name(q));
                    w.WriteString("unit", Unit(q, rotation(r.Dof)));
                    w.WriteString("amplitude", rms ? "rms" : "peak");
                    w.Number("magnitude", rms ? r.Rms(q, result.Rule) : r.Peak(q, result.Rule));
                    w.WriteStartArray("components");
                    foreach (var c in r.Components)
                    {
                        w.WriteStartObject();
                        w.WriteString("case", c.Case);
                        w.Number("speed_hz", c.SpeedHz);
                        w.Number("speed_rpm", 60 * c.SpeedHz);
                        w.Number("magnitude", scale * c.Peak(q));
                        w.WriteEndObject();
                    }
                    w.WriteEndArray();
                    w.WriteEndObject();
                }
        w.WriteEndArray();
        w.WriteStartArray("notes");
        foreach (var n in result.Notes) w.WriteStringValue(n);
        w.WriteEndArray();
        w.WriteEndObject();

        w.WriteStartArray("warnings");
        foreach (var d in document.Warnings) w.WriteStringValue(d.ToString());
        foreach (var c in result.Cases)
            foreach (var warning in c.Result.Warnings) w.WriteStringValue($"load case '{c.Case.Name}': {warning}");
        w.WriteEndArray();
        w.WriteString("caution", Cautions.Text);
        w.WriteEndObject();
    }

    /// <summary>The fields of one sweep, from "method" to "notes".</summary>
    private static void WriteSweep(Utf8JsonWriter w, HarmonicResult result, Func<string, bool> rotation)
    {
        w.WriteString("method", result.Method == HarmonicMethod.Modal ? "modal" : "direct");
        w.WriteNumber("modes_used", result.ModesUsed);
        w.WriteStartArray("loads");
        foreach (var l in result.Loads) w.WriteStringValue(l);
        w.WriteEndArray();
        w.Array("frequencies_hz", result.FrequenciesHz);

        w.WriteStartArray("responses");
        foreach (var r in result.Responses)
            foreach (var q in Enum.GetValues<ResponseQuantity>())
            {
                var values = Enumerable.Range(0, result.FrequenciesHz.Length).Select(k => r.At(k, result.FrequenciesHz[k], q)).ToArray();
                w.WriteStartObject();
                w.WriteString("dof", r.Dof);
                w.WriteString("quantity", Name(q));
                w.WriteString("unit", Unit(q, rotation(r.Dof)));
                w.WriteString("amplitude", "peak");
                Series(w, values);
                w.WriteEndObject();
            }
        w.WriteEndArray();

        w.WriteStartArray("element_forces");
        foreach (var e in result.ElementForces)
        {
            w.WriteStartObject();
            w.WriteString("element", e.Element);
            w.WriteString("kind", e.Kind == ElementKind.Spring ? "spring" : "damper");
            w.WriteString("unit", "N");
            w.WriteString("amplitude", "peak");
            Series(w, e.Force);
            w.WriteEndObject();
        }
        w.WriteEndArray();

        w.WriteStartArray("reactions");
        foreach (var r in result.Reactions)
        {
            w.WriteStartObject();
            w.WriteString("support", r.Support);
            w.WriteString("unit", "N");
            w.WriteString("amplitude", "peak");
            Series(w, r.Force);
            w.WriteEndObject();
        }
        w.WriteEndArray();

        // Plane and 3d models only (line models keep their output unchanged): what each mount transmits per direction.
        if (!result.MountForces.IsEmpty)
        {
            w.WriteStartArray("mount_forces");
            foreach (var (m, peak, at) in result.MountForcePeaks())
            {
                w.WriteStartObject();
                MountHeader(w, m);
                Series(w, m.Force);
                w.Number("peak_magnitude", peak);
                w.Number("peak_frequency_hz", at);
                w.WriteEndObject();
            }
            w.WriteEndArray();
        }

        w.WriteStartArray("transmissibility");
        foreach (var t in result.Transmissibilities)
        {
            w.WriteStartObject();
            w.WriteString("kind", t.Kind);
            if (t.Dof is null) w.WriteNull("dof"); else w.WriteString("dof", t.Dof);
            w.WriteString("reference", t.Reference);
            w.Array("ratio", t.Ratio);
            w.WriteEndObject();
        }
        w.WriteEndArray();

        w.WriteStartArray("peaks");
        foreach (var p in result.Peaks())
        {
            w.WriteStartObject();
            w.WriteString("dof", p.Dof);
            w.WriteString("quantity", Name(p.Quantity));
            w.WriteString("unit", Unit(p.Quantity, rotation(p.Dof)));
            w.WriteString("amplitude", "peak");
            w.Number("magnitude", p.Magnitude);
            w.Number("frequency_hz", p.FrequencyHz);
            w.WriteString("rising_at", TuneJson.Edge(p.RisingAt));
            w.Number("edge_magnitude", p.EdgeMagnitude);
            w.WriteBoolean("is_interior_peak", p.IsInterior);
            w.Note("note", p.EdgeWarning);
            w.WriteEndObject();
        }
        w.WriteEndArray();

        w.WriteStartArray("operating_points");
        foreach (var op in result.OperatingPoints)
        {
            var at = op.Response;
            w.WriteStartObject();
            w.Number("speed_hz", op.SpeedHz);
            w.Number("speed_rpm", op.SpeedHz * 60);
            w.WriteStartArray("loads");
            foreach (var l in op.Loads) w.WriteStringValue(l);
            w.WriteEndArray();
            w.WriteStartArray("responses");
            foreach (var r in at.Responses)
                foreach (var q in Enum.GetValues<ResponseQuantity>())
                {
                    w.WriteStartObject();
                    w.WriteString("dof", r.Dof);
                    w.WriteString("quantity", Name(q));
                    w.WriteString("unit", Unit(q, rotation(r.Dof)));
                    w.WriteString("amplitude", "peak");
                    Point(w, r.At(0, op.SpeedHz, q));
                    w.WriteEndObject();
                }
            w.WriteEndArray();
            w.WriteStartArray("element_forces");
            foreach (var e in at.ElementForces)
            {
                w.WriteStartObject();
                w.WriteString("element", e.Element);
                w.WriteString("kind", e.Kind == ElementKind.Spring ? "spring" : "damper");
                w.WriteString("unit", "N");
                w.WriteString("amplitude", "peak");
                Point(w, e.Force[0]);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteStartArray("reactions");
            foreach (var r in at.Reactions)
            {
                w.WriteStartObject();
                w.WriteString("support", r.Support);
                w.WriteString("unit", "N");
                w.WriteString("amplitude", "peak");
                Point(w, r.Force[0]);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            if (!at.MountForces.IsEmpty)
            {
                w.WriteStartArray("mount_forces");
                foreach (var m in at.MountForces)
                {
                    w.WriteStartObject();
                    MountHeader(w, m);
                    Point(w, m.Force[0]);
                    w.WriteEndObject();
                }
                w.WriteEndArray();
            }
            w.WriteEndObject();
        }
        w.WriteEndArray();

        w.WriteStartArray("notes");
        foreach (var n in result.Notes) w.WriteStringValue(n);
        w.WriteEndArray();
    }

    /// <summary>The JSON name of a quantity: "displacement", "velocity", "acceleration".</summary>
    public static string Name(ResponseQuantity q) => q.ToString().ToLowerInvariant();

    /// <summary>The SI unit of a quantity as written in JSON and CSV headers.</summary>
    /// <summary>The SI unit of <paramref name="q"/>: of an angle (rad, rad/s, rad/s^2) when <paramref name="rotation"/>.</summary>
    public static string Unit(ResponseQuantity q, bool rotation) => !rotation ? Unit(q) : q switch
    {
        ResponseQuantity.Displacement => "rad",
        ResponseQuantity.Velocity => "rad/s",
        _ => "rad/s^2",
    };

    public static string Unit(ResponseQuantity q) => q switch
    {
        ResponseQuantity.Displacement => "m",
        ResponseQuantity.Velocity => "m/s",
        _ => "m/s^2",
    };

    /// <summary>Phase of <paramref name="z"/> in degrees.</summary>
    public static double PhaseDegrees(Complex z) => z == Complex.Zero ? 0 : z.Phase * 180 / Math.PI;

    /// <summary>element, kind, direction, unit and amplitude of a mount force.</summary>
    private static void MountHeader(Utf8JsonWriter w, MountForce m)
    {
        w.WriteString("element", m.Element);
        w.WriteString("kind", m.Kind == ElementKind.Spring ? "spring" : "damper");
        w.WriteString("direction", m.Direction);
        w.WriteString("unit", m.Unit);
        w.WriteString("amplitude", "peak");
    }

    private static void Series(Utf8JsonWriter w, IReadOnlyList<Complex> values)
    {
        w.Array("magnitude", values.Select(z => z.Magnitude));
        w.Array("phase_deg", values.Select(PhaseDegrees));
    }

    private static void Point(Utf8JsonWriter w, Complex z)
    {
        w.Number("magnitude", z.Magnitude);
        w.Number("phase_deg", PhaseDegrees(z));
    }
}
