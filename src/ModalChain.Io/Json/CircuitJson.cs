using System.Collections.Immutable;
using System.Text.Json;
using ModalChain.Core;
using ModalChain.Core.Analyses.Circuits;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Io.Json;

/// <summary>Writes the JSON of <c>modes</c>, <c>harmonic</c> and <c>transient</c> on a circuit model (SI: Hz, s, V, A, Ω, degrees for phases).</summary>
/// <remarks>Schemas: docs/schema/circuit-modes.schema.json, circuit-harmonic.schema.json and circuit-transient.schema.json. Field names are a public contract.</remarks>
public static class CircuitJson
{
    /// <summary>The roots of the circuit with its sources switched off.</summary>
    public static void WriteModes(Stream stream, ModelDocument document, ImmutableArray<CircuitRoot> roots, string toolVersion)
    {
        ArgumentNullException.ThrowIfNull(document);
        using var w = Start(stream, document, toolVersion, "roots");
        w.WriteStartArray("roots");
        foreach (var r in roots)
        {
            w.WriteStartObject();
            w.WriteNumber("number", r.Number);
            w.WriteString("kind", r.Kind switch { CircuitRootKind.DcLevel => "dc_level", CircuitRootKind.Oscillation => "oscillation", _ => "relaxation" });
            w.Number("root_real_per_s", r.Root.Real);
            w.Number("root_imaginary_per_s", r.Root.Imaginary);
            w.Number("natural_frequency_hz", r.NaturalFrequencyHz);
            w.Number("damped_frequency_hz", r.DampedFrequencyHz);
            w.Number("damping_ratio", r.DampingRatio);
            w.Number("q_factor", r.QualityFactor);
            w.Number("time_constant_s", r.TimeConstant);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        End(w);
    }

    /// <summary>Driving-point impedance and transfer functions of each source over the sweep.</summary>
    public static void WriteHarmonic(Stream stream, ModelDocument document, ImmutableArray<CircuitSourceResponse> responses, string toolVersion)
    {
        ArgumentNullException.ThrowIfNull(document);
        using var w = Start(stream, document, toolVersion, "sweep");
        w.WriteStartArray("sources");
        foreach (var r in responses)
        {
            w.WriteStartObject();
            w.WriteString("source", MarkupText.Clean(r.Source));
            w.WriteString("kind", r.IsVoltageSource ? "voltage" : "current");
            w.WriteString("transfer_unit", r.IsVoltageSource ? "V/V" : "V/A");
            w.Array("frequencies_hz", r.FrequenciesHz);
            w.Array("impedance_magnitude_ohm", r.Impedance.Select(z => z.Magnitude));
            w.Array("impedance_phase_deg", r.Impedance.Select(z => z.Phase * 180 / Math.PI));
            w.WriteStartArray("transfer");
            for (var n = 0; n < r.Nodes.Length; n++)
            {
                w.WriteStartObject();
                w.WriteString("node", MarkupText.Clean(r.Nodes[n]));
                w.Array("magnitude", r.Transfer.Select(row => row[n].Magnitude));
                w.Array("phase_deg", r.Transfer.Select(row => row[n].Phase * 180 / Math.PI));
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteEndObject();
        }
        w.WriteEndArray();
        End(w);
    }

    /// <summary>Node voltages and branch currents against time.</summary>
    public static void WriteTransient(Stream stream, ModelDocument document, CircuitTransientResult result, string toolVersion)
    {
        ArgumentNullException.ThrowIfNull(document);
        ArgumentNullException.ThrowIfNull(result);
        using var w = Start(stream, document, toolVersion, "time response");
        w.Array("times_s", result.Times);
        w.WriteStartArray("node_voltages");
        for (var i = 0; i < result.Nodes.Length; i++)
        {
            w.WriteStartObject();
            w.WriteString("node", MarkupText.Clean(result.Nodes[i]));
            w.Array("volts", result.Volts[i]);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteStartArray("branch_currents");
        foreach (var b in result.Currents)
        {
            w.WriteStartObject();
            w.WriteString("element", MarkupText.Clean(b.Element));
            w.WriteString("kind", b.Kind);
            w.Array("amperes", b.Amperes);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        End(w);
    }

    private static Utf8JsonWriter Start(Stream stream, ModelDocument document, string toolVersion, string analysis)
    {
        var w = new Utf8JsonWriter(stream, ModesJson.WriterOptions);
        w.WriteStartObject();
        w.Source(document, toolVersion);
        w.WriteString("title", MarkupText.Clean(document.Circuit?.Circuit.Title ?? document.Network.Title));
        w.WriteString("model_kind", "circuit");
        w.WriteString("analysis", analysis);
        return w;
    }

    private static void End(Utf8JsonWriter w)
    {
        w.WriteString("caution", Cautions.Text);
        w.WriteEndObject();
        w.Flush();
    }
}
