using System.Text.Json;
using ModalChain.Core;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Io.Json.Records;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Io.Json;

/// <summary>Maps a modal result to its output record, <see cref="ModesOutput"/>, the JSON object of <c>modalchain modes --format json</c> (SI units).</summary>
/// <remarks>Field names are a public contract read by other tools; add fields, never rename them. See docs/model-format.md.</remarks>
public static class ModesJson
{
    /// <summary>Options of the hand-written JSON writers (the circuit outputs, the report's results.json frame): indented,
    /// escaped as the output records are (<see cref="JsonFormat.Encoder"/>).</summary>
    public static readonly JsonWriterOptions WriterOptions = new() { Indented = true, Encoder = JsonFormat.Encoder, SkipValidation = true };

    /// <summary>How many of the lowest modes carry their energy shares per DOF and per spring unless every mode is asked for.</summary>
    /// <remarks>
    /// The shares are what a reader uses to find where a mode moves and which spring to stiffen, which matters for the
    /// modes near the running speeds, the lowest ones. Written for every mode they are modes × (DOFs + springs)
    /// numbers, five times the shapes' size in a network of n masses and 1.25 n springs (522 MB of 620 at n = 2,000).
    /// </remarks>
    public const int DefaultEnergyShareModes = 20;

    /// <summary>Writes one JSON object to <paramref name="stream"/>, the modes going to the stream as they are written.</summary>
    /// <param name="stream">Where to write (UTF-8).</param>
    /// <param name="document">The model read.</param>
    /// <param name="result">Its modes.</param>
    /// <param name="toolVersion">Version recorded in 'source'.</param>
    /// <param name="damping">The assembled damped system, for damping ratios per mode; null for an undamped report (ratios 0).</param>
    /// <param name="complexModes">Complex modes, written when the damping is not classical; null or empty otherwise.</param>
    /// <param name="energyShareModes">How many of the lowest modes carry <c>kinetic_energy_share</c> and <c>strain_energy_share</c> (<see cref="int.MaxValue"/> for all).</param>
    public static void Write(Stream stream, ModelDocument document, ModalResult result, string toolVersion,
        DampedSystem? damping = null, IReadOnlyList<ComplexMode>? complexModes = null, int energyShareModes = DefaultEnergyShareModes) =>
        OutputJson.Write(stream, Output(document, result, toolVersion, damping, complexModes, energyShareModes));

    /// <summary>Writes the same object as a value of <paramref name="writer"/> (the modes section of a report's results.json).</summary>
    /// <remarks>Parameters as <see cref="Write(Stream, ModelDocument, ModalResult, string, DampedSystem?, IReadOnlyList{ComplexMode}?, int)"/>.</remarks>
    public static void Write(Utf8JsonWriter writer, ModelDocument document, ModalResult result, string toolVersion,
        DampedSystem? damping = null, IReadOnlyList<ComplexMode>? complexModes = null, int energyShareModes = DefaultEnergyShareModes) =>
        OutputJson.Write(writer, Output(document, result, toolVersion, damping, complexModes, energyShareModes));

    /// <summary>The output record of <paramref name="result"/>; its modes are mapped as they are enumerated (written).</summary>
    /// <remarks>Parameters as <see cref="Write(Stream, ModelDocument, ModalResult, string, DampedSystem?, IReadOnlyList{ComplexMode}?, int)"/>.</remarks>
    public static ModesOutput Output(ModelDocument document, ModalResult result, string toolVersion,
        DampedSystem? damping = null, IReadOnlyList<ComplexMode>? complexModes = null, int energyShareModes = DefaultEnergyShareModes)
    {
        ArgumentNullException.ThrowIfNull(document);
        ArgumentNullException.ThrowIfNull(result);
        ArgumentOutOfRangeException.ThrowIfNegative(energyShareModes);
        var network = result.Network;
        var spatial = network.Space != ModelSpace.Line;
        string[] dofNames = [.. result.Matrices.Dofs.Dofs.Select(d => d.ToString())];
        // Encoded once: a large model writes every name once per mode in three keyed objects.
        var dofKeys = NameKeys.Of(dofNames);
        var springKeys = NameKeys.Of(network.Springs.Select(s => s.Name));
        var massKeys = NameKeys.Of(network.Masses.Select(m => m.Name));
        var bySpace = spatial || (network.Links.IsDefaultOrEmpty && network.Transducers.IsDefaultOrEmpty);

        ModeOutput Mode(Mode mode)
        {
            var shares = mode.Number <= energyShareModes;
            var zeta = DampingRatioOf(damping, mode);
            return new()
            {
                Number = mode.Number,
                FrequencyHz = mode.NaturalFrequencyHz,
                OmegaRadS = mode.AngularFrequency,
                PeriodS = mode.PeriodSeconds,
                RigidBody = mode.IsRigidBody,
                // Shapes are written per mass: a linked group's one DOF is repeated for each of its masses. Plane and 3d
                // models write them per DOF label (skid.z, skid.ry), the masses' and bodies' several directions each.
                Shape = spatial ? new(dofKeys, mode.Shape) : new(massKeys, bySpace ? mode.Shape : result.ShapeByMass(mode)),
                Participation = mode.ParticipationFactor,
                EffectiveMassKg = mode.EffectiveModalMass,
                EffectiveMassFraction = mode.EffectiveMassFraction,
                CumulativeMassFraction = mode.CumulativeEffectiveMassFraction,
                KineticEnergyShare = shares ? new(dofKeys, mode.KineticEnergyShare) : null,
                StrainEnergyShare = shares ? new(springKeys, mode.StrainEnergyShare) : null,
                Residual = mode.Residual,
                Motion = spatial ? mode.Motion : null,
                Decoupling = spatial ? mode.Decoupling : null,
                KineticEnergyByDirection = spatial ? ByDirection(mode.KineticEnergyByDirection) : null,
                EffectiveMassByDirection = spatial ? [.. mode.Participation.Select(p => new DirectionalMassOutput
                {
                    Direction = p.Direction.Label(),
                    Unit = p.Direction.IsRotation() ? "kg*m^2" : "kg",
                    Participation = p.ParticipationFactor,
                    EffectiveMass = p.EffectiveMass,
                    Fraction = p.Fraction,
                    CumulativeFraction = p.CumulativeFraction,
                })] : null,
                DampingRatio = zeta,
                DampedFrequencyHz = zeta < 1 ? mode.NaturalFrequencyHz * Math.Sqrt(1 - zeta * zeta) : double.NaN,
            };
        }

        return new()
        {
            Title = MarkupText.Clean(network.Title),
            FormatVersion = JsonFormat.Version,
            Source = SourceOutput.Of(document, toolVersion),
            Dofs = dofNames,
            TotalMassKg = result.TotalMass,
            // Plane and 3d models: what each direction's effective masses sum to, and the point rotations are taken about.
            ReferencePointM = spatial && result.ReferencePoint is { } o ? [o.X, o.Y, o.Z] : null,
            TotalByDirection = spatial ? ByDirection(result.TotalByDirection) : null,
            // ιᵀMι above counts the inerters' grounded terminals; this is the masses alone (equal without inerters).
            PhysicalMassKg = network.Inerters.Length > 0 ? network.TotalMass : null,
            Algorithm = result.Algorithm,
            EnergyShareModes = Math.Min(energyShareModes, result.Modes.Length),
            // Mapped while written: a large model's modes are never all held as records (or text) at once.
            Modes = result.Modes.Select(Mode),
            Damping = new()
            {
                Classical = damping?.IsClassical ?? true,
                NonClassicalIndex = damping?.NonClassicalIndex ?? 0,
                LossFactor = damping?.LossFactor ?? 0,
                DampingRatioBasis = damping is null || damping.IsClassical ? DampingBasis.Exact : DampingBasis.Estimate,
            },
            ComplexModes = complexModes is { Count: > 0 } ? [.. complexModes.Select(c => new ComplexModeOutput
            {
                Number = c.Number,
                UndampedFrequencyHz = c.UndampedFrequencyHz,
                DampedFrequencyHz = c.DampedFrequencyHz,
                DampingRatio = c.DampingRatio,
                Oscillatory = c.IsOscillatory,
                Kind = KindName(c.Kind),
                EigenvalueReal = c.EigenValue.Real,
                EigenvalueImag = c.EigenValue.Imaginary,
            })] : null,
            Quality = new()
            {
                MaxResidual = result.Quality.MaxResidual,
                MaxOrthogonalityError = result.Quality.MaxOrthogonalityError,
                Solver = result.Algorithm,
            },
            Warnings = [.. document.Warnings.Select(w => w.ToString()),
                .. result.Warnings.Where(w => !document.Warnings.Any(d => d.Message == w))],
            Caution = Cautions.Text,
        };
    }

    // Per direction label, in the result's order.
    private static Dictionary<string, double> ByDirection(IEnumerable<DirectionalFigure> figures)
    {
        var byLabel = new Dictionary<string, double>(StringComparer.Ordinal);
        foreach (var f in figures) byLabel.Add(f.Direction.Label(), f.Value);
        return byLabel;
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
