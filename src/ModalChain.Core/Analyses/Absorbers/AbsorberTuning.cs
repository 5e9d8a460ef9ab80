using System.Collections.Immutable;
using System.Globalization;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Absorbers;

/// <summary>What to tune: where the absorber hangs, how heavy it is, which mode it controls and against what.</summary>
/// <param name="Host">Name of the mass the absorber is attached to (line models), or in plane and 3d models a point and translation (<see cref="AbsorberHost"/>: <c>deck.z</c>, <c>skid.top.x</c>).</param>
/// <param name="MassRatio">μ = absorber mass / modal mass of the controlled mode at the host, a fraction in (0, 1].</param>
/// <param name="ModeNumber">1-based mode to control, or null to take the mode nearest an excitation frequency (with none, the mode with the largest motion at the host).</param>
/// <param name="ExcitationsHz">Excitation frequencies in Hz (running speeds × orders): they choose the mode when <paramref name="ModeNumber"/> is null, and the response is reported at them.</param>
/// <param name="Target">The excitation the tuning is optimal for.</param>
/// <param name="SpeedTolerance">For <see cref="AbsorberTarget.RunningSpeed"/>: the relative band ±t around each excitation over which the worst response is minimised (speed variation and mistuning together), a fraction in [0, 0.5).</param>
public sealed record AbsorberRequest(
    string Host, double MassRatio, int? ModeNumber, ImmutableArray<double> ExcitationsHz, AbsorberTarget Target = AbsorberTarget.Force,
    double SpeedTolerance = AbsorberRequest.DefaultSpeedTolerance)
{
    /// <summary>The default tolerance of the running-speed tuning: ±5 %.</summary>
    public const double DefaultSpeedTolerance = 0.05;
}

/// <summary>A sized absorber: the equivalent single-mode primary it was designed for and its own mass, spring and damper.</summary>
/// <param name="Host">Mass the absorber is attached to, or in plane and 3d models the point and translation (<see cref="AbsorberHost"/>).</param>
/// <param name="ModeNumber">1-based mode controlled.</param>
/// <param name="ModeFrequencyHz">Natural frequency f_p of the controlled mode in Hz.</param>
/// <param name="ModalMass">Modal mass of the mode at the host, 1/φ_host² with mass-normalised φ, in kg.</param>
/// <param name="Optimum">The dimensionless optimum used.</param>
/// <param name="Target">The excitation it is tuned for.</param>
/// <param name="Mass">Absorber mass m_a = μ·M in kg.</param>
/// <param name="Stiffness">Absorber spring k_a = m_a (f ω_p)² in N/m.</param>
/// <param name="Damping">Absorber damper c_a = 2 ζ_a √(k_a m_a) in N·s/m.</param>
/// <param name="FrequencyHz">Tuned frequency √(k_a/m_a)/2π in Hz.</param>
/// <param name="ChosenBy">Why this mode: "--mode", the excitation it is nearest to, or the largest motion at the host.</param>
public sealed record AbsorberDesign(
    string Host, int ModeNumber, double ModeFrequencyHz, double ModalMass, AbsorberOptimum Optimum, AbsorberTarget Target,
    double Mass, double Stiffness, double Damping, double FrequencyHz, string ChosenBy)
{
    /// <summary>Natural frequencies of every mode of the model without the absorber, Hz, by mode number (index = number − 1); empty when unknown.</summary>
    public ImmutableArray<double> ModelFrequenciesHz { get; init; } = [];

    /// <summary>Mass-normalised shapes of every mode of the model without the absorber, by mode number, over <see cref="ModelDofs"/>; empty when unknown.</summary>
    public ImmutableArray<ImmutableArray<double>> ModelShapes { get; init; } = [];

    /// <summary>The degrees of freedom of <see cref="ModelShapes"/>.</summary>
    public ImmutableArray<Dofs.Dof> ModelDofs { get; init; } = [];

    /// <summary>The point and direction <see cref="Host"/> names; null when the design was made without a model (then resolved from <see cref="Host"/>).</summary>
    public AbsorberHost? HostPoint { get; init; }

    /// <summary>Excitation frequencies (running speeds × orders) in Hz at which the response is reported; empty when none.</summary>
    public ImmutableArray<double> ExcitationsHz { get; init; } = [];

    /// <summary>Relative band ±t around each excitation for <see cref="AbsorberTarget.RunningSpeed"/>.</summary>
    public double SpeedTolerance { get; init; } = AbsorberRequest.DefaultSpeedTolerance;

    /// <summary>ζ_a = c_a / (2√(k_a m_a)), referred to the absorber's own frequency.</summary>
    public double DampingRatio => Damping / (2 * Math.Sqrt(Stiffness * Mass));

    /// <summary>c_a / (2 m_a ω_p), referred to the controlled mode's frequency.</summary>
    public double DampingRatioPrimaryReferenced => Damping / (2 * Mass * 2 * Math.PI * ModeFrequencyHz);

    /// <summary>Returns the same absorber with its spring retuned to <paramref name="frequencyHz"/> and its damping ratio <paramref name="dampingRatio"/> kept.</summary>
    public AbsorberDesign Retuned(double frequencyHz, double dampingRatio)
    {
        Guard.Positive(frequencyHz, nameof(frequencyHz));
        Guard.NonNegative(dampingRatio, nameof(dampingRatio));
        var omega = 2 * Math.PI * frequencyHz;
        var k = Mass * omega * omega;
        return this with { Stiffness = k, Damping = 2 * dampingRatio * Math.Sqrt(k * Mass), FrequencyHz = frequencyHz };
    }
}

/// <summary>Names of the elements an absorber adds to a network.</summary>
/// <param name="Mass">Name of the absorber mass.</param>
/// <param name="Spring">Name of its spring to the host.</param>
/// <param name="Damper">Name of its damper to the host.</param>
public sealed record AbsorberNames(string Mass, string Spring, string Damper);

/// <summary>Sizes a tuned absorber for one mode of a network from the classical optimum of its equivalent single-mode primary.</summary>
/// <remarks>
/// Mode j seen at the host h behaves like a single mass M = 1/φ_{h,j}² on a spring M ω_j² when φ is mass-normalised
/// (φᵀMφ = 1): the kinetic energy ½ q̇² of the mode equals ½ M ẋ_h² with x_h = φ_h q. The absorber is sized for that
/// primary: m_a = μ M, ω_a = f ω_j, c_a = 2 ζ_a m_a ω_a (Den Hartog 1956 §3.3; Warburton 1982). The approximation is
/// good when the mode is well separated from its neighbours and the absorber is light. In plane and 3d models the host is
/// a point and a translation (<see cref="AbsorberHost"/>) whose motion is x_h = a·u, a the point's attachment row; then
/// φ_h = a·φ and M = 1/(a·φ)², and the absorber mass moves along that translation only.
/// </remarks>
public static class AbsorberTuning
{
    /// <summary>The largest mass ratio accepted: an absorber heavier than the modal mass it controls is not a tuned absorber.</summary>
    public const double MaximumMassRatio = 1.0;

    /// <summary>
    /// The smallest mass ratio accepted (0.01 %): a lighter absorber has no effect worth designing, and at ratios near the
    /// smallest doubles (1e-320) the absorber's stiffness and damping underflow and its damping ratio becomes NaN.
    /// </summary>
    public const double MinimumMassRatio = 1e-4;

    /// <summary>Above this mass ratio the single-mode approximation and the classical formulas are stretched; the tool says so.</summary>
    public const double LargeMassRatio = 0.25;

    /// <summary>Problems with <paramref name="request"/> for <paramref name="modal"/>, as sentences a user can act on; empty when it can be designed.</summary>
    public static ImmutableArray<string> Problems(ModalResult modal, AbsorberRequest request)
    {
        ArgumentNullException.ThrowIfNull(modal);
        ArgumentNullException.ThrowIfNull(request);
        var problems = ImmutableArray.CreateBuilder<string>();
        var inv = CultureInfo.InvariantCulture;
        var point = AbsorberHost.Resolve(modal.Network, request.Host, out var hostProblem);
        if (modal.Network.IsElectrical(request.Host))
        {
            point = null;
            hostProblem = $"host '{request.Host}' is a node of the model's circuit (its velocity is a voltage): an absorber hangs on a mass of the structure; name one";
        }
        if (hostProblem is not null) problems.Add(hostProblem);
        if (!(request.MassRatio > 0) || !double.IsFinite(request.MassRatio))
            problems.Add(string.Create(inv, $"mass ratio must be positive, got {request.MassRatio * 100:G4} %"));
        else if (request.MassRatio < MinimumMassRatio)
            problems.Add(string.Create(inv, $"mass ratio {request.MassRatio * 100:G4} % is below {MinimumMassRatio * 100:G3} %: so light an absorber has no effect (typical ratios are 1-25 %)"));
        else if (request.MassRatio > MaximumMassRatio)
            problems.Add(string.Create(inv, $"mass ratio {request.MassRatio * 100:G4} % is beyond {MaximumMassRatio * 100:G3} %: an absorber heavier than the modal mass it controls is not a tuned absorber (typical ratios are 1-25 %)"));
        else if (request.Target == AbsorberTarget.BaseAcceleration && request.MassRatio >= 2)
            problems.Add("base-acceleration tuning needs a mass ratio below 200 %");
        if (request.ModeNumber is { } n && (n < 1 || n > modal.Modes.Length))
            problems.Add($"mode {n} does not exist; the model has {modal.Modes.Length} mode(s)");
        if (!(request.SpeedTolerance >= 0 && request.SpeedTolerance < 0.5))
            problems.Add(string.Create(inv, $"speed tolerance must be at least 0 and below 50 %, got {request.SpeedTolerance * 100:G4} %"));
        if (request.Target == AbsorberTarget.RunningSpeed && request.ExcitationsHz.IsDefaultOrEmpty)
            problems.Add("tuning for the running speed needs one: give --speed, criteria.separation.speeds or a load's speed");
        if (problems.Count > 0) return problems.ToImmutable();

        var mode = request.ModeNumber is { } chosen ? modal.Modes[chosen - 1] : Chosen(modal, request, point!, out _);
        if (mode is null)
            problems.Add("no mode to control: every mode of the model is a rigid-body mode");
        else if (mode.IsRigidBody)
            problems.Add($"mode {mode.Number} is a rigid-body mode (0 Hz); an absorber cannot be tuned to it");
        else if (Math.Abs(HostMotion(modal, point!, mode)) < 1e-9 * mode.Shape.Max(Math.Abs))
            problems.Add($"'{request.Host}' does not move in mode {mode.Number} (it sits at a node of the mode shape); hang the absorber where the mode moves");
        else if (request.MassRatio * ModalMassAt(modal, point!, mode) is var absorberMass && absorberMass > modal.Network.TotalMass)
            // Near a node the modal mass at the host (1/φ²) grows without bound; such an absorber outweighs the whole
            // structure, and tune --write wrote a model that no longer read (a 2e14 kg absorber).
            problems.Add(string.Create(inv, $"'{request.Host}' hardly moves in mode {mode.Number}: its modal mass there is {ModalMassAt(modal, point!, mode):G4} kg, so the absorber would weigh {absorberMass:G4} kg, more than the whole model ({modal.Network.TotalMass:G4} kg); hang the absorber where the mode moves"));
        return problems.ToImmutable();
    }

    /// <summary>Designs the absorber; call <see cref="Problems"/> first, since an invalid request is a caller bug here.</summary>
    public static AbsorberDesign Design(ModalResult modal, AbsorberRequest request)
    {
        var problems = Problems(modal, request);
        if (problems.Length > 0) throw new ArgumentException(string.Join("; ", problems), nameof(request));
        var inv = CultureInfo.InvariantCulture;
        var point = AbsorberHost.Resolve(modal.Network, request.Host, out _)!;
        string chosenBy;
        Mode mode;
        if (request.ModeNumber is { } n)
        {
            mode = modal.Modes[n - 1];
            chosenBy = "--mode";
        }
        else
        {
            mode = Chosen(modal, request, point, out var excitation)!;
            chosenBy = double.IsFinite(excitation)
                ? string.Create(inv, $"nearest to the excitation at {excitation:G6} Hz")
                : "no running speed given: the mode with the largest motion at the host, (phi at the host)^2/omega^2";
        }
        var modalMass = ModalMassAt(modal, point, mode);
        var optimum = request.Target == AbsorberTarget.RunningSpeed
            ? ClassicalOptimum.UndampedAt(request.MassRatio, NearestExcitation(request.ExcitationsHz, mode.NaturalFrequencyHz) / mode.NaturalFrequencyHz)
            : ClassicalOptimum.For(request.Target, request.MassRatio);
        var ma = request.MassRatio * modalMass;
        var omegaA = optimum.FrequencyRatio * mode.AngularFrequency;
        var ka = ma * omegaA * omegaA;
        var ca = 2 * optimum.DampingRatio * ma * omegaA;
        return new AbsorberDesign(request.Host, mode.Number, mode.NaturalFrequencyHz, modalMass, optimum, request.Target,
            ma, ka, ca, omegaA / (2 * Math.PI), chosenBy)
        {
            ModelFrequenciesHz = [.. modal.Modes.Select(m => m.NaturalFrequencyHz)],
            ModelShapes = [.. modal.Modes.Select(m => m.Shape)],
            ModelDofs = modal.Matrices.Dofs.Dofs,
            ExcitationsHz = request.ExcitationsHz.IsDefault ? [] : request.ExcitationsHz,
            SpeedTolerance = request.SpeedTolerance,
            HostPoint = point,
        };
    }

    /// <summary>The host's motion a·φ in <paramref name="mode"/> (mass-normalised), m per unit modal coordinate.</summary>
    public static double HostMotion(ModalResult modal, AbsorberHost host, Mode mode)
    {
        ArgumentNullException.ThrowIfNull(modal);
        ArgumentNullException.ThrowIfNull(host);
        ArgumentNullException.ThrowIfNull(mode);
        return host.Motion(modal.Network, modal.Matrices.Dofs, mode.Shape);
    }

    /// <summary>The modal mass of <paramref name="mode"/> seen at the host, 1/(a·φ)² in kg (+∞ at a node of the mode).</summary>
    public static double ModalMassAt(ModalResult modal, AbsorberHost host, Mode mode)
    {
        var phi = HostMotion(modal, host, mode);
        return 1 / (phi * phi);
    }

    private static double NearestExcitation(ImmutableArray<double> excitationsHz, double frequencyHz) =>
        excitationsHz.MinBy(f => Math.Abs(Math.Log(f / frequencyHz)));

    /// <summary>Element names for an absorber on <paramref name="host"/> that clash with nothing in <paramref name="network"/>.</summary>
    public static AbsorberNames FreeNames(Network network, string host)
    {
        ArgumentNullException.ThrowIfNull(network);
        ArgumentNullException.ThrowIfNull(host);
        if (network.Space != ModelSpace.Line) host = host.Replace('.', '-');
        var taken = network.Masses.Select(m => m.Name).Concat(network.Supports.Select(s => s.Name))
            .Concat(network.Springs.Select(s => s.Name)).Concat(network.Dampers.Select(d => d.Name)).ToHashSet();
        for (var i = 1; ; i++)
        {
            var stem = i == 1 ? $"{host}-absorber" : $"{host}-absorber-{i}";
            var names = new AbsorberNames(stem, stem + "-spring", stem + "-damper");
            if (!taken.Contains(names.Mass) && !taken.Contains(names.Spring) && !taken.Contains(names.Damper)) return names;
        }
    }

    /// <summary>The network with the absorber's mass, spring and damper added (mass drawn 0.5 m above the host when it has a position).</summary>
    /// <remarks>
    /// In plane and 3d models the absorber mass sits at the host point and moves along the host's translation only
    /// (<c>directions: [z]</c>); its spring and damper act in that direction between the host point and the mass.
    /// </remarks>
    public static Network Attach(Network network, AbsorberDesign design, AbsorberNames names)
    {
        ArgumentNullException.ThrowIfNull(network);
        ArgumentNullException.ThrowIfNull(design);
        ArgumentNullException.ThrowIfNull(names);
        if (network.Space != ModelSpace.Line)
        {
            var point = design.HostPoint ?? AbsorberHost.Resolve(network, design.Host, out var problem)
                ?? throw new ArgumentException(problem, nameof(design));
            var d = point.Direction;
            return network.WithAdded(
                // Drawn where the host point is, in the side view (x, z) as the reader draws a located mass.
                [new Mass(names.Mass, design.Mass, point.Location is { } l ? new DrawingPosition(l.X, l.Z) : null) { Location = point.Location, Moves = [d] }],
                [new Spring(names.Spring, point.Reference, names.Mass, design.Stiffness) { Components = [new DirectionalValue(d, design.Stiffness)] }],
                design.Damping > 0 ? [new Damper(names.Damper, point.Reference, names.Mass, design.Damping) { Components = [new DirectionalValue(d, design.Damping)] }] : []);
        }
        var host = network.Masses.FirstOrDefault(m => m.Name == design.Host)
            ?? throw new ArgumentException($"'{design.Host}' is not a mass of the network.", nameof(design));
        DrawingPosition? at = host.Position is { } p ? new DrawingPosition(p.X, p.Y + 0.5) : null;
        return network.WithAdded(
            [new Mass(names.Mass, design.Mass, at)],
            [new Spring(names.Spring, design.Host, names.Mass, design.Stiffness)],
            design.Damping > 0 ? [new Damper(names.Damper, design.Host, names.Mass, design.Damping)] : []);
    }

    /// <summary>
    /// The non-rigid mode nearest (in ratio) to any excitation frequency; with no excitation, the mode with the largest
    /// motion at the host, φ_h²/ω² (its share of the host's static deflection under a force at the host); null when every mode is rigid.
    /// </summary>
    private static Mode? Chosen(ModalResult modal, AbsorberRequest request, AbsorberHost host, out double excitationHz)
    {
        excitationHz = double.NaN;
        if (request.ExcitationsHz.IsDefaultOrEmpty)
            return modal.Modes.Where(m => !m.IsRigidBody).MaxBy(m => Math.Pow(HostMotion(modal, host, m), 2) / (m.AngularFrequency * m.AngularFrequency));
        Mode? best = null;
        var bestDistance = double.PositiveInfinity;
        foreach (var mode in modal.Modes.Where(m => !m.IsRigidBody))
            foreach (var fe in request.ExcitationsHz)
            {
                var d = Math.Abs(Math.Log(mode.NaturalFrequencyHz / fe));
                if (d < bestDistance) { bestDistance = d; best = mode; excitationHz = fe; }
            }
        return best;
    }
}
