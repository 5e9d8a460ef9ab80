using System.Globalization;
using System.Text;
using System.Text.Json;
using ModalChain.Core;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Io.Json;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Cli.Tests.Schemas;

/// <summary>The hand-written <c>modes</c> JSON writer as it was before the output went through <c>ModesOutput</c>
/// (commit d474794), kept only to prove the record route writes the same bytes (<see cref="ModesRecordRouteTests"/>).</summary>
internal static class LegacyModesJson
{
    private static readonly JsonEncodedText ShapeName = JsonEncodedText.Encode("shape");
    private static readonly JsonEncodedText KineticName = JsonEncodedText.Encode("kinetic_energy_share");
    private static readonly JsonEncodedText StrainName = JsonEncodedText.Encode("strain_energy_share");

    /// <summary>Writes one JSON object to <paramref name="stream"/>.</summary>
    /// <param name="stream">Where to write (UTF-8).</param>
    /// <param name="document">The model read.</param>
    /// <param name="result">Its modes.</param>
    /// <param name="toolVersion">Version recorded in 'source'.</param>
    /// <param name="damping">The assembled damped system, for damping ratios per mode; null for an undamped report (ratios 0).</param>
    /// <param name="complexModes">Complex modes, written when the damping is not classical; null or empty otherwise.</param>
    /// <param name="energyShareModes">How many of the lowest modes carry <c>kinetic_energy_share</c> and <c>strain_energy_share</c> (<see cref="int.MaxValue"/> for all).</param>
    public static void Write(Stream stream, ModelDocument document, ModalResult result, string toolVersion,
        DampedSystem? damping = null, IReadOnlyList<ComplexMode>? complexModes = null, int energyShareModes = ModesJson.DefaultEnergyShareModes)
    {
        using var writer = new Utf8JsonWriter(stream, ModesJson.WriterOptions);
        writer.WriteStartObject();
        WriteBody(writer, document, result, toolVersion, damping, complexModes, energyShareModes);
        writer.WriteEndObject();
    }

    /// <summary>Writes the properties of the modes object into an object the caller has opened.</summary>
    /// <remarks>Parameters as <see cref="Write"/>.</remarks>
    public static void WriteBody(Utf8JsonWriter writer, ModelDocument document, ModalResult result, string toolVersion,
        DampedSystem? damping = null, IReadOnlyList<ComplexMode>? complexModes = null, int energyShareModes = ModesJson.DefaultEnergyShareModes)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(energyShareModes);
        var network = result.Network;
        var dofNames = result.Matrices.Dofs.Dofs.Select(d => d.ToString()).ToArray();
        var massNames = network.Masses.Select(m => m.Name).ToArray();
        var springNames = network.Springs.Select(s => s.Name).ToArray();
        // Encoded once: a large model writes every name once per mode in three keyed objects.
        var dofKeys = dofNames.Select(d => JsonEncodedText.Encode(d, ModesJson.WriterOptions.Encoder)).ToArray();
        var springKeys = springNames.Select(s => JsonEncodedText.Encode(s, ModesJson.WriterOptions.Encoder)).ToArray();
        var massKeys = massNames.Select(m => JsonEncodedText.Encode(m, ModesJson.WriterOptions.Encoder)).ToArray();
        var dofLine = LineKeys(dofKeys);
        var springLine = LineKeys(springKeys);
        var massLine = LineKeys(massKeys);
        var buffer = new byte[1 << 16];

        writer.WriteString("title", MarkupText.Clean(network.Title));
        Source(writer, document, toolVersion);
        writer.WriteStartArray("dofs");
        foreach (var d in dofNames) writer.WriteStringValue(d);
        writer.WriteEndArray();
        Number(writer, "total_mass_kg", result.TotalMass);
        if (network.Space != ModelSpace.Line)
        {
            // Plane and 3d models: what each direction's effective masses sum to, and the point rotations are taken about.
            if (result.ReferencePoint is { } o) Array(writer, "reference_point_m", [o.X, o.Y, o.Z]);
            writer.WriteStartObject("total_by_direction");
            foreach (var t in result.TotalByDirection) Number(writer, t.Direction.Label(), t.Value);
            writer.WriteEndObject();
        }
        // ιᵀMι above counts the inerters' grounded terminals; this is the masses alone (equal without inerters).
        if (result.Network.Inerters.Length > 0) Number(writer, "physical_mass_kg", result.Network.TotalMass);
        writer.WriteString("algorithm", result.Algorithm);
        writer.WriteNumber("energy_share_modes", Math.Min(energyShareModes, result.Modes.Length));

        writer.WriteStartArray("modes");
        foreach (var mode in result.Modes)
        {
            writer.WriteStartObject();
            writer.WriteNumber("number", mode.Number);
            Number(writer, "frequency_hz", mode.NaturalFrequencyHz);
            Number(writer, "omega_rad_s", mode.AngularFrequency);
            Number(writer, "period_s", mode.PeriodSeconds);
            writer.WriteBoolean("rigid_body", mode.IsRigidBody);
            // Shapes are written per mass: a linked group's one DOF is repeated for each of its masses. Plane and 3d
            // models write them per DOF label (skid.z, skid.ry), the masses' and bodies' several directions each.
            // Each keyed object is one line (JsonNumbers.KeyedLine): large models write n numbers per mode.
            if (network.Space != ModelSpace.Line) KeyedLine(writer, ShapeName, dofLine, mode.Shape.AsSpan(), ref buffer);
            else KeyedLine(writer, ShapeName, massLine, network.Links.IsDefaultOrEmpty && network.Transducers.IsDefaultOrEmpty ? mode.Shape.AsSpan() : result.ShapeByMass(mode).AsSpan(), ref buffer);
            Number(writer, "participation", mode.ParticipationFactor);
            Number(writer, "effective_mass_kg", mode.EffectiveModalMass);
            Number(writer, "effective_mass_fraction", mode.EffectiveMassFraction);
            Number(writer, "cumulative_mass_fraction", mode.CumulativeEffectiveMassFraction);
            if (mode.Number <= energyShareModes)
            {
                KeyedLine(writer, KineticName, dofLine, mode.KineticEnergyShare.AsSpan(), ref buffer);
                KeyedLine(writer, StrainName, springLine, mode.StrainEnergyShare.AsSpan(), ref buffer);
            }
            Number(writer, "residual", mode.Residual);
            if (network.Space != ModelSpace.Line) WriteDirections(writer, mode);
            var zeta = ModesJson.DampingRatioOf(damping, mode);
            Number(writer, "damping_ratio", zeta);
            Number(writer, "damped_frequency_hz", zeta < 1 ? mode.NaturalFrequencyHz * Math.Sqrt(1 - zeta * zeta) : double.NaN);
            writer.WriteEndObject();
            // Hand finished modes to the stream as they are written rather than holding the whole document.
            if (writer.BytesPending > 1 << 16) writer.Flush();
        }
        writer.WriteEndArray();

        writer.WriteStartObject("damping");
        writer.WriteBoolean("classical", damping?.IsClassical ?? true);
        Number(writer, "non_classical_index", damping?.NonClassicalIndex ?? 0);
        Number(writer, "loss_factor", damping?.LossFactor ?? 0);
        writer.WriteString("damping_ratio_basis", damping is null || damping.IsClassical
            ? "exact modal damping ratio"
            : "diagonal of the modal damping matrix (estimate); see complex_modes for the damped system's own values");
        writer.WriteEndObject();
        if (complexModes is { Count: > 0 })
        {
            writer.WriteStartArray("complex_modes");
            foreach (var c in complexModes)
            {
                writer.WriteStartObject();
                writer.WriteNumber("number", c.Number);
                Number(writer, "undamped_frequency_hz", c.UndampedFrequencyHz);
                Number(writer, "damped_frequency_hz", c.DampedFrequencyHz);
                Number(writer, "damping_ratio", c.DampingRatio);
                writer.WriteBoolean("oscillatory", c.IsOscillatory);
                writer.WriteString("kind", ModesJson.KindName(c.Kind));
                Number(writer, "eigenvalue_real", c.EigenValue.Real);
                Number(writer, "eigenvalue_imag", c.EigenValue.Imaginary);
                writer.WriteEndObject();
            }
            writer.WriteEndArray();
        }

        writer.WriteStartObject("quality");
        Number(writer, "max_residual", result.Quality.MaxResidual);
        Number(writer, "max_orthogonality_error", result.Quality.MaxOrthogonalityError);
        writer.WriteString("solver", result.Algorithm);
        writer.WriteEndObject();

        writer.WriteStartArray("warnings");
        foreach (var w in document.Warnings) writer.WriteStringValue(w.ToString());
        foreach (var w in result.Warnings.Where(w => !document.Warnings.Any(d => d.Message == w))) writer.WriteStringValue(w);
        writer.WriteEndArray();
        writer.WriteString("caution", Cautions.Text);
    }

    /// <summary>A plane or 3d mode's motion name, decoupling figure, kinetic-energy share per direction and effective mass per direction.</summary>
    private static void WriteDirections(Utf8JsonWriter writer, Mode mode)
    {
        if (mode.Motion is null) writer.WriteNull("motion"); else writer.WriteString("motion", mode.Motion);
        Number(writer, "decoupling", mode.Decoupling);
        writer.WriteStartObject("kinetic_energy_by_direction");
        foreach (var k in mode.KineticEnergyByDirection) Number(writer, k.Direction.Label(), k.Value);
        writer.WriteEndObject();
        writer.WriteStartArray("effective_mass_by_direction");
        foreach (var p in mode.Participation)
        {
            writer.WriteStartObject();
            writer.WriteString("direction", p.Direction.Label());
            writer.WriteString("unit", p.Direction.IsRotation() ? "kg*m^2" : "kg");
            Number(writer, "participation", p.ParticipationFactor);
            Number(writer, "effective_mass", p.EffectiveMass);
            Number(writer, "fraction", p.Fraction);
            Number(writer, "cumulative_fraction", p.CumulativeFraction);
            writer.WriteEndObject();
        }
        writer.WriteEndArray();
    }


    private static void Source(Utf8JsonWriter writer, ModelDocument document, string toolVersion)
    {
        writer.WriteString("format_version", JsonFormat.Version);
        writer.WriteStartObject("source");
        writer.WriteString("file", MarkupText.Clean(document.File));
        writer.WriteString("sha256", document.Sha256);
        writer.WriteString("tool_version", toolVersion);
        writer.WriteEndObject();
    }

    private static void Number(Utf8JsonWriter writer, string name, double value)
    {
        if (double.IsFinite(value)) writer.WriteNumber(name, value);
        else writer.WriteNull(name);
    }

    private static void Number(Utf8JsonWriter writer, double value)
    {
        if (double.IsFinite(value)) writer.WriteNumberValue(value);
        else writer.WriteNullValue();
    }

    private static void Array(Utf8JsonWriter writer, string name, IEnumerable<double> values)
    {
        writer.WriteStartArray(name);
        foreach (var v in values) Number(writer, v);
        writer.WriteEndArray();
    }

    private static byte[][] LineKeys(IReadOnlyList<JsonEncodedText> keys)
    {
        var result = new byte[keys.Count][];
        for (var i = 0; i < keys.Count; i++)
        {
            var encoded = keys[i].EncodedUtf8Bytes;
            var bytes = new byte[encoded.Length + 3];
            bytes[0] = (byte)'"';
            encoded.CopyTo(bytes.AsSpan(1));
            bytes[^2] = (byte)'"';
            bytes[^1] = (byte)':';
            result[i] = bytes;
        }
        return result;
    }

    private static void KeyedLine(Utf8JsonWriter writer, JsonEncodedText name, byte[][] keys, ReadOnlySpan<double> values, ref byte[] buffer)
    {
        var at = 0;
        Put(ref buffer, ref at, (byte)'{');
        for (var i = 0; i < keys.Length; i++)
        {
            if (i > 0) Put(ref buffer, ref at, (byte)',');
            var key = keys[i];
            Reserve(ref buffer, at, key.Length + 32);
            key.CopyTo(buffer.AsSpan(at));
            at += key.Length;
            if (double.IsFinite(values[i]))
            {
                values[i].TryFormat(buffer.AsSpan(at), out var written, default, CultureInfo.InvariantCulture);
                at += written;
            }
            else
            {
                "null"u8.CopyTo(buffer.AsSpan(at));
                at += 4;
            }
        }
        Put(ref buffer, ref at, (byte)'}');
        writer.WritePropertyName(name);
        writer.WriteRawValue(buffer.AsSpan(0, at), skipInputValidation: true);
    }

    private static void Put(ref byte[] buffer, ref int at, byte value)
    {
        Reserve(ref buffer, at, 1);
        buffer[at++] = value;
    }

    private static void Reserve(ref byte[] buffer, int at, int more)
    {
        if (at + more <= buffer.Length) return;
        System.Array.Resize(ref buffer, Math.Max(2 * buffer.Length, at + more));
    }
}
