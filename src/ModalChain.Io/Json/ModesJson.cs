using System.Text.Encodings.Web;
using System.Text.Json;
using ModalChain.Core;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Io.Json;

/// <summary>Writes a modal result as the stable JSON object of <c>modalchain modes --format json</c> (SI units).</summary>
/// <remarks>Field names are a public contract read by other tools; add fields, never rename them. See docs/model-format.md.</remarks>
public static class ModesJson
{
    /// <summary>Options shared by every JSON output of the tool: indented, non-ASCII kept readable.</summary>
    public static readonly JsonWriterOptions WriterOptions = new() { Indented = true, Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping, SkipValidation = true };

    /// <summary>How many of the lowest modes carry their energy shares per DOF and per spring unless every mode is asked for.</summary>
    /// <remarks>
    /// The shares are what a reader uses to find where a mode moves and which spring to stiffen, which matters for the
    /// modes near the running speeds, the lowest ones. Written for every mode they are modes × (DOFs + springs)
    /// numbers, five times the shapes' size in a network of n masses and 1.25 n springs (522 MB of 620 at n = 2,000).
    /// </remarks>
    public const int DefaultEnergyShareModes = 20;

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
        DampedSystem? damping = null, IReadOnlyList<ComplexMode>? complexModes = null, int energyShareModes = DefaultEnergyShareModes)
    {
        using var writer = new Utf8JsonWriter(stream, WriterOptions);
        writer.WriteStartObject();
        WriteBody(writer, document, result, toolVersion, damping, complexModes, energyShareModes);
        writer.WriteEndObject();
    }

    /// <summary>Writes the properties of the modes object into an object the caller has opened.</summary>
    /// <remarks>Parameters as <see cref="Write"/>.</remarks>
    public static void WriteBody(Utf8JsonWriter writer, ModelDocument document, ModalResult result, string toolVersion,
        DampedSystem? damping = null, IReadOnlyList<ComplexMode>? complexModes = null, int energyShareModes = DefaultEnergyShareModes)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(energyShareModes);
        var network = result.Network;
        var dofNames = result.Matrices.Dofs.Dofs.Select(d => d.ToString()).ToArray();
        var massNames = network.Masses.Select(m => m.Name).ToArray();
        var springNames = network.Springs.Select(s => s.Name).ToArray();
        // Encoded once: a large model writes every name once per mode in three keyed objects.
        var dofKeys = dofNames.Select(d => JsonEncodedText.Encode(d, WriterOptions.Encoder)).ToArray();
        var springKeys = springNames.Select(s => JsonEncodedText.Encode(s, WriterOptions.Encoder)).ToArray();
        var massKeys = massNames.Select(m => JsonEncodedText.Encode(m, WriterOptions.Encoder)).ToArray();
        var dofLine = JsonNumbers.LineKeys(dofKeys);
        var springLine = JsonNumbers.LineKeys(springKeys);
        var massLine = JsonNumbers.LineKeys(massKeys);
        var buffer = new byte[1 << 16];

        writer.WriteString("title", MarkupText.Clean(network.Title));
        writer.Source(document, toolVersion);
        writer.WriteStartArray("dofs");
        foreach (var d in dofNames) writer.WriteStringValue(d);
        writer.WriteEndArray();
        writer.Number("total_mass_kg", result.TotalMass);
        if (network.Space != ModelSpace.Line)
        {
            // Plane and 3d models: what each direction's effective masses sum to, and the point rotations are taken about.
            if (result.ReferencePoint is { } o) writer.Array("reference_point_m", [o.X, o.Y, o.Z]);
            writer.WriteStartObject("total_by_direction");
            foreach (var t in result.TotalByDirection) writer.Number(t.Direction.Label(), t.Value);
            writer.WriteEndObject();
        }
        // ιᵀMι above counts the inerters' grounded terminals; this is the masses alone (equal without inerters).
        if (result.Network.Inerters.Length > 0) writer.Number("physical_mass_kg", result.Network.TotalMass);
        writer.WriteString("algorithm", result.Algorithm);
        writer.WriteNumber("energy_share_modes", Math.Min(energyShareModes, result.Modes.Length));

        writer.WriteStartArray("modes");
        foreach (var mode in result.Modes)
        {
            writer.WriteStartObject();
            writer.WriteNumber("number", mode.Number);
            writer.Number("frequency_hz", mode.NaturalFrequencyHz);
            writer.Number("omega_rad_s", mode.AngularFrequency);
            writer.Number("period_s", mode.PeriodSeconds);
            writer.WriteBoolean("rigid_body", mode.IsRigidBody);
            // Shapes are written per mass: a linked group's one DOF is repeated for each of its masses. Plane and 3d
            // models write them per DOF label (skid.z, skid.ry), the masses' and bodies' several directions each.
            // Each keyed object is one line (JsonNumbers.KeyedLine): large models write n numbers per mode.
            if (network.Space != ModelSpace.Line) writer.KeyedLine(ShapeName, dofLine, mode.Shape.AsSpan(), ref buffer);
            else writer.KeyedLine(ShapeName, massLine, network.Links.IsDefaultOrEmpty && network.Transducers.IsDefaultOrEmpty ? mode.Shape.AsSpan() : result.ShapeByMass(mode).AsSpan(), ref buffer);
            writer.Number("participation", mode.ParticipationFactor);
            writer.Number("effective_mass_kg", mode.EffectiveModalMass);
            writer.Number("effective_mass_fraction", mode.EffectiveMassFraction);
            writer.Number("cumulative_mass_fraction", mode.CumulativeEffectiveMassFraction);
            if (mode.Number <= energyShareModes)
            {
                writer.KeyedLine(KineticName, dofLine, mode.KineticEnergyShare.AsSpan(), ref buffer);
                writer.KeyedLine(StrainName, springLine, mode.StrainEnergyShare.AsSpan(), ref buffer);
            }
            writer.Number("residual", mode.Residual);
            if (network.Space != ModelSpace.Line) WriteDirections(writer, mode);
            var zeta = DampingRatioOf(damping, mode);
            writer.Number("damping_ratio", zeta);
            writer.Number("damped_frequency_hz", zeta < 1 ? mode.NaturalFrequencyHz * Math.Sqrt(1 - zeta * zeta) : double.NaN);
            writer.WriteEndObject();
            // Hand finished modes to the stream as they are written rather than holding the whole document.
            if (writer.BytesPending > 1 << 16) writer.Flush();
        }
        writer.WriteEndArray();

        writer.WriteStartObject("damping");
        writer.WriteBoolean("classical", damping?.IsClassical ?? true);
        writer.Number("non_classical_index", damping?.NonClassicalIndex ?? 0);
        writer.Number("loss_factor", damping?.LossFactor ?? 0);
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
                writer.Number("undamped_frequency_hz", c.UndampedFrequencyHz);
                writer.Number("damped_frequency_hz", c.DampedFrequencyHz);
                writer.Number("damping_ratio", c.DampingRatio);
                writer.WriteBoolean("oscillatory", c.IsOscillatory);
                writer.WriteString("kind", KindName(c.Kind));
                writer.Number("eigenvalue_real", c.EigenValue.Real);
                writer.Number("eigenvalue_imag", c.EigenValue.Imaginary);
                writer.WriteEndObject();
            }
            writer.WriteEndArray();
        }

        writer.WriteStartObject("quality");
        writer.Number("max_residual", result.Quality.MaxResidual);
        writer.Number("max_orthogonality_error", result.Quality.MaxOrthogonalityError);
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
        writer.Number("decoupling", mode.Decoupling);
        writer.WriteStartObject("kinetic_energy_by_direction");
        foreach (var k in mode.KineticEnergyByDirection) writer.Number(k.Direction.Label(), k.Value);
        writer.WriteEndObject();
        writer.WriteStartArray("effective_mass_by_direction");
        foreach (var p in mode.Participation)
        {
            writer.WriteStartObject();
            writer.WriteString("direction", p.Direction.Label());
            writer.WriteString("unit", p.Direction.IsRotation() ? "kg*m^2" : "kg");
            writer.Number("participation", p.ParticipationFactor);
            writer.Number("effective_mass", p.EffectiveMass);
            writer.Number("fraction", p.Fraction);
            writer.Number("cumulative_fraction", p.CumulativeFraction);
            writer.WriteEndObject();
        }
        writer.WriteEndArray();
    }

    /// <summary>The JSON name of a complex root's kind: elastic, rigid-body (a zero root), rigid-body-relaxation or relaxation (first-order, τ = −1/λ).</summary>
    public static string KindName(ComplexModeKind kind) => kind switch
    {
        ComplexModeKind.RigidBody => "rigid-body",
        ComplexModeKind.RigidBodyRelaxation => "rigid-body-relaxation",
        ComplexModeKind.Relaxation => "relaxation",
        _ => "elastic",
    };

    /// <summary>
    /// The damping ratio of <paramref name="mode"/>: from <paramref name="damping"/>, 0 without one, NaN for a rigid-body
    /// mode, and NaN for every undamped mode of a model with first-order states (a damper at a massless node): those
    /// modes condense the massless nodes through their springs only, so Φᵀ C Φ would damp them as if a massless node held
    /// by no spring stood still; the complex roots give the damping there.
    /// </summary>
    public static double DampingRatioOf(DampedSystem? damping, Mode mode)
    {
        ArgumentNullException.ThrowIfNull(mode);
        if (mode.IsRigidBody || damping is { HasFirstOrderStates: true }) return double.NaN;
        return damping is null ? 0 : damping.ModalDampingRatios[mode.Number - 1];
    }
}
