using System.Collections.Immutable;
using System.Globalization;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;

namespace ModalChain.Core.Analyses.Transient;

/// <summary>Response of a network to loads that vary in time, from given initial conditions.</summary>
/// <remarks>
/// Solves M ü + C u̇ + K u = f(t) for the free DOFs in absolute coordinates. A support with a prescribed acceleration
/// a_s(t) moves with u̇_s = ∫a_s and u_s = ∫u̇_s, integrated on the time grid exactly for a_s linear between steps;
/// it loads the free DOFs by −K_fp u_s − C_fp u̇_s − M_fp a_s (for a spring k from the support to mass i, f_i += k u_s;
/// for an inerter b from the support to mass i, f_i += b a_s). Warnings follow common practice: at least ~10 steps per period of the
/// highest mode that takes a significant share (≥ 1 %) of the effective mass or of a load, and a duration of at
/// least a few periods of the lowest mode. Models of more than 300 DOFs get only their lowest modes (30, or those the
/// modal method keeps) by shift-invert Lanczos unless a complete modal result is passed in, so the step check then
/// looks at those modes only.
/// </remarks>
public static class TransientAnalysis
{
    private const double SignificantShare = 0.01;
    private const double MinimumStepsPerPeriod = 10;
    private const double MinimumPeriodsOfLowestMode = 3;
    private const int LargeModel = 300;

    /// <summary>Largest model for <see cref="TransientMethod.Exact"/>: its dense exponential is of order 4n.</summary>
    public const int ExactMethodMaxDofs = 400;
    private const int ModesForChecks = 30;

    /// <summary>Runs <paramref name="settings"/> on <paramref name="network"/> damped by its discrete dampers only.</summary>
    /// <param name="network">The network.</param>
    /// <param name="matrices">Its matrices; C (the discrete dampers) is the viscous damping used by newmark, hht and exact.</param>
    /// <param name="excitations">Forces and support accelerations acting together.</param>
    /// <param name="initial">Initial displacements (m) and velocities (m/s) of masses; others start at rest.</param>
    /// <param name="settings">Duration, step, method and outputs.</param>
    /// <param name="modes">A modal result of the same network with all modes, if already computed; otherwise it is computed.</param>
    /// <param name="progress">Receives the fraction of steps done, about 200 times per run.</param>
    public static TransientResult Run(Network network, StructuralMatrices matrices, IReadOnlyList<TransientExcitation> excitations,
        IReadOnlyList<InitialCondition> initial, TransientSettings settings, ModalResult? modes = null, IProgress<double>? progress = null)
    {
        ArgumentNullException.ThrowIfNull(network);
        ArgumentNullException.ThrowIfNull(matrices);
        // Transducers map an eliminated node onto others (supports included): their coupling comes from the partition.
        var coupling = network.Space == ModelSpace.Line && network.Transducers.IsDefaultOrEmpty
            ? SupportCoupling.FromElements(network, matrices.Dofs)
            : SupportCoupling.FromPartition(SupportPartition.Assemble(network), DampingMatrices: null);
        return Run(network, matrices, coupling, null, excitations, initial, settings, modes, progress, []);
    }

    /// <summary>Runs <paramref name="settings"/> on an assembled model with its full damping model (dampers, Rayleigh, modal).</summary>
    /// <remarks>
    /// C is <see cref="DampingMatrices.FF"/> of <paramref name="system"/> and the supports couple through K_fp, C_fp, K_pp and
    /// C_pp of its partition, so distributed damping that acts on motion relative to the supports is kept. The modal method
    /// uses the system's modal damping ratios unless the settings give their own. A loss factor has no time-domain form and
    /// is left out, with a warning.
    /// </remarks>
    public static TransientResult Run(DampedSystem system, IReadOnlyList<TransientExcitation> excitations,
        IReadOnlyList<InitialCondition> initial, TransientSettings settings, IProgress<double>? progress = null)
    {
        ArgumentNullException.ThrowIfNull(system);
        var network = system.Model.Network;
        var p = system.Partition;
        var matrices = new StructuralMatrices(p.Free, p.Mass, p.StiffnessFF, system.Damping.FF,
            Vector<double>.Build.Dense(p.FreeCount, 1.0), MassIsDiagonal: Assembler.IsDiagonal(p.Mass));
        var coupling = SupportCoupling.FromPartition(p, system.Damping);
        var notes = new List<string>();
        if (system.LossFactor > 0)
            notes.Add(Invariant($"The loss factor η = {system.LossFactor:G3} is a frequency-domain model and is left out of this time history; give modal or Rayleigh damping (ζ ≈ η/2 at resonance) for transient runs."));
        var ratios = system.ModalDampingRatios.Select(z => double.IsNaN(z) ? 0.0 : z - system.LossFactor / 2).ToImmutableArray();
        return Run(network, matrices, coupling, ratios, excitations, initial, settings, system.Modes, progress, notes);
    }

    private static TransientResult Run(Network network, StructuralMatrices matrices, SupportCoupling coupling, ImmutableArray<double>? modalRatios,
        IReadOnlyList<TransientExcitation> excitations, IReadOnlyList<InitialCondition> initial, TransientSettings settings,
        ModalResult? modes, IProgress<double>? progress, List<string> notes)
    {
        ArgumentNullException.ThrowIfNull(excitations);
        ArgumentNullException.ThrowIfNull(initial);
        ArgumentNullException.ThrowIfNull(settings);
        settings.Check();
        var dofs = matrices.Dofs;
        var n = matrices.Size;
        if (n == 0) throw new ArgumentException("The network has no masses.", nameof(network));
        var h = settings.Step;
        var steps = settings.StepCount;
        if (settings.Method == TransientMethod.Exact && n > ExactMethodMaxDofs)
            throw new ArgumentOutOfRangeException(nameof(settings), settings.Method,
                $"The exact method forms a dense exponential of order 4n = {4 * n}; it is limited to {ExactMethodMaxDofs} DOFs. Use newmark or modal.");

        var supportMotion = SupportMotion(network, excitations, h, steps);
        var load = BuildLoad(network, dofs, excitations, coupling, supportMotion);
        var probes = BuildProbes(network, dofs, settings, coupling, supportMotion);

        var u0 = new double[n];
        var v0 = new double[n];
        foreach (var ic in initial)
        {
            var i = network.Space == ModelSpace.Line ? dofs.IndexOf(ic.Mass) : dofs.IndexOfLabel(ic.Mass);
            if (i < 0) throw new ArgumentException($"Initial condition for unknown mass '{ic.Mass}'.", nameof(initial));
            Guard.Finite(ic.Displacement, nameof(initial));
            Guard.Finite(ic.Velocity, nameof(initial));
            u0[i] = ic.Displacement;
            v0[i] = ic.Velocity;
        }

        modes ??= Modes(network, matrices, settings);
        var warnings = notes;
        var rmsFrom = settings.RmsFrom ?? 0.0;
        var rmsTo = settings.RmsTo ?? double.PositiveInfinity;
        var system = new LinearDynamicSystem(matrices.Mass, matrices.Damping, matrices.Stiffness);
        string description;
        ResponseRecorder recorder;
        var consideredModes = modes.Modes;

        // Massless nodes: no M⁻¹ exists, so the state-space form of FirstOrderSystem is integrated exactly, whatever
        // method was asked for, unless the modal method runs on a model whose massless nodes carry springs only.
        var firstOrder = MasslessReduction.HasMasslessDofs(matrices.Mass)
            && (settings.Method != TransientMethod.Modal || MasslessReduction.Classify(matrices.Mass, matrices.Damping).HasFirstOrderStates);
        if (firstOrder)
        {
            if (n > ExactMethodMaxDofs)
                throw new ArgumentOutOfRangeException(nameof(settings), settings.Method,
                    $"A model with massless nodes is integrated in its state-space form, a dense exponential limited to {ExactMethodMaxDofs} DOFs; it has {n}.");
            var state = FirstOrder.FirstOrderSystem.Build(matrices.Mass, matrices.Damping, matrices.Stiffness, dofs.Label);
            var integrator = new FirstOrder.FirstOrderIntegrator();
            description = integrator.Name + (settings.Method == TransientMethod.Exact ? "" : Invariant($", in place of the {settings.Method.ToString().ToLowerInvariant()} method asked for (the model has massless nodes)"));
            recorder = PhysicalRecorder(system, probes, settings, steps, rmsFrom, rmsTo, progress);
            integrator.Run(state, load.AsLoadVector(), u0, v0, h, steps, recorder);
        }
        else switch (settings.Method)
        {
            case TransientMethod.Newmark:
            case TransientMethod.Hht:
            {
                var integrator = new NewmarkIntegrator(settings.Method == TransientMethod.Hht ? settings.HhtAlpha : 0.0);
                description = integrator.Name;
                if (CompleteClassicalBasis(matrices, modes) is { } basis)
                {
                    // Modal damping fills C (and so the factor of the effective stiffness) densely: O(n²) per step. With
                    // all modes and classical damping the same recurrence decouples exactly in u = Φq, at O(n) per step.
                    var (shapes, modalC, modalK) = basis;
                    var count = modalC.Length;
                    var modal = new LinearDynamicSystem(
                        Matrix<double>.Build.SparseOfDiagonalArray(Enumerable.Repeat(1.0, count).ToArray()),
                        Matrix<double>.Build.SparseOfDiagonalArray(modalC),
                        Matrix<double>.Build.SparseOfDiagonalArray(modalK));
                    recorder = new ResponseRecorder([.. probes.Select(p => p.ToModal(shapes))],
                        SymmetricSparseMatrix.Diagonal(Enumerable.Repeat(1.0, count).ToArray()),
                        SymmetricSparseMatrix.Diagonal(modalC), SymmetricSparseMatrix.Diagonal(modalK),
                        h, steps, settings.RecordEvery, rmsFrom, rmsTo, progress);
                    var q0 = shapes.TransposeThisAndMultiply(matrices.Mass * Vector<double>.Build.DenseOfArray(u0)).ToArray();
                    var qd0 = shapes.TransposeThisAndMultiply(matrices.Mass * Vector<double>.Build.DenseOfArray(v0)).ToArray();
                    integrator.Run(modal, Project(load, shapes).AsLoadVector(), q0, qd0, h, steps, recorder);
                    description += string.Create(CultureInfo.InvariantCulture, $", stepped in the coordinates of all {count} undamped modes (classical damping)");
                }
                else
                {
                    recorder = PhysicalRecorder(system, probes, settings, steps, rmsFrom, rmsTo, progress);
                    integrator.Run(system, load.AsLoadVector(), u0, v0, h, steps, recorder);
                }
                break;
            }
            case TransientMethod.Exact:
            {
                var integrator = new StateSpaceExactIntegrator();
                description = integrator.Name;
                recorder = PhysicalRecorder(system, probes, settings, steps, rmsFrom, rmsTo, progress);
                integrator.Run(system, load.AsLoadVector(), u0, v0, h, steps, recorder);
                break;
            }
            case TransientMethod.Modal:
            {
                var count = Math.Min(settings.ModeCount ?? modes.Modes.Length, modes.Modes.Length);
                if (settings.ModeCount is null && count < modes.ModeCountAvailable)
                    warnings.Add(Invariant($"The modal method kept the lowest {count} of {n} modes, chosen automatically for a model of more than {LargeModel} masses (up to {modes.Modes[count - 1].NaturalFrequencyHz:G4} Hz): give 'modes' under 'transient' or --count for more."));
                consideredModes = modes.Modes[..count];
                var shapes = Matrix<double>.Build.Dense(n, count, (i, j) => consideredModes[j].Shape[i]);
                var omega = consideredModes.Select(m => m.AngularFrequency).ToArray();
                var zeta = ModalDamping(settings, modalRatios, shapes, omega, matrices.Damping, warnings, Topology.UnsupportedGroups(network).Length);
                var integrator = new ModalSuperpositionIntegrator();
                description = string.Create(CultureInfo.InvariantCulture, $"{integrator.Name}, {count} of {n} modes");
                var twoZetaOmega = omega.Select((w, j) => 2 * zeta[j] * w).ToArray();
                recorder = new ResponseRecorder(
                    [.. probes.Select(p => p.ToModal(shapes))],
                    SymmetricSparseMatrix.Diagonal(Enumerable.Repeat(1.0, count).ToArray()),
                    SymmetricSparseMatrix.Diagonal(twoZetaOmega),
                    SymmetricSparseMatrix.Diagonal(omega.Select(w => w * w).ToArray()),
                    h, steps, settings.RecordEvery, rmsFrom, rmsTo, progress);
                integrator.Run(shapes, omega, zeta, matrices.Mass, load, u0, v0, h, steps, recorder);
                var cumulative = consideredModes[^1].CumulativeEffectiveMassFraction;
                if (count < modes.ModeCountAvailable && cumulative < 0.9)
                    warnings.Add(Invariant($"The {count} modes kept carry {100 * cumulative:F1} % of the effective mass (less than 90 %): responses to loads that excite higher modes are underestimated."));
                break;
            }
            default:
                throw new ArgumentOutOfRangeException(nameof(settings), settings.Method, "Unknown method.");
        }

        warnings.AddRange(StepWarnings(modes, consideredModes, load, matrices, settings, excitations));
        if (RmsWindowWarning(settings, steps, recorder.RmsSamples) is { } rmsWarning) warnings.Add(rmsWarning);
        var energy = recorder.Energy;
        if (energy.MaxRelativeError > 0.01)
            warnings.Add(Invariant($"The energy balance closes only to {100 * energy.MaxRelativeError:F2} % of the largest energy: reduce the step."));

        return new TransientResult(network, settings, description, steps, recorder.Times, recorder.Histories(), energy, [.. warnings]);
    }

    /// <summary>How many of the lowest modes a run of <paramref name="settings"/> on <paramref name="size"/> DOFs uses; null for all.</summary>
    /// <remarks>
    /// All modes for models of up to 300 DOFs; above, the modes the modal method keeps (its count, or the lowest 30
    /// when none is given: an automatic choice the result states) or the lowest 30 for the time-step and duration checks. A caller that builds a <see cref="DampedSystem"/>
    /// for the run solves only these.
    /// </remarks>
    public static int? ModesNeeded(int size, TransientSettings settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        if (size <= LargeModel) return null;
        return Math.Min(size, settings.Method == TransientMethod.Modal && settings.ModeCount is { } count ? count : AutomaticModeCount);
    }

    /// <summary>Modes kept by the modal method on a model of more than 300 DOFs when no count is given (also the modes of the step checks).</summary>
    public const int AutomaticModeCount = ModesForChecks;

    /// <summary>All modes for small models; for large ones only the lowest (those the modal method keeps, or 30 for the step checks), by shift-invert Lanczos (Sturm-checked).</summary>
    private static ModalResult Modes(Network network, StructuralMatrices matrices, TransientSettings settings) =>
        ModesNeeded(matrices.Size, settings) is { } count
            ? ModalAnalysis.Solve(network, matrices, new ModalOptions(count, new ShiftInvertLanczos()))
            : ModalAnalysis.Solve(network, matrices);

    /// <summary>
    /// All mass-normalised mode shapes Φ with the diagonals of ΦᵀCΦ (1/s) and ΦᵀKΦ = ω² (1/s²), when Newmark's
    /// recurrence is cheaper in modal coordinates; null when the physical step is kept.
    /// </summary>
    /// <remarks>
    /// Newmark's and HHT's recurrences are linear in M, C and K, so with ΦᵀMΦ = I, ΦᵀKΦ = Ω² and ΦᵀCΦ diagonal
    /// (classical damping, Caughey &amp; O'Kelly 1965) stepping q with u = Φq is the same scheme as stepping u, mode by
    /// mode (Bathe, Finite Element Procedures, 1996, §9.3, from memory); with every mode kept nothing is truncated.
    /// It is chosen only when C has more entries than K, i.e. when modal damping has filled C, because then the
    /// physical step costs O(n²) (C·v, the dense factor and vᵀCv) against O(n) per load term and output in q.
    /// </remarks>
    private static (Matrix<double> Shapes, double[] Damping, double[] Stiffness)? CompleteClassicalBasis(StructuralMatrices matrices, ModalResult modes)
    {
        var n = matrices.Size;
        if (modes.Modes.Length != n) return null;
        if (SymmetricSparseMatrix.From(matrices.Damping).NonZeros <= SymmetricSparseMatrix.From(matrices.Stiffness).NonZeros) return null;
        var shapes = Matrix<double>.Build.Dense(n, n, (i, j) => modes.Modes[j].Shape[i]);
        var modalC = shapes.TransposeThisAndMultiply(matrices.Damping * shapes);
        if (!(DampingAssembly.NonClassicalIndex(modalC) < DampedSystem.ClassicalTolerance)) return null;
        var c = new double[n];
        var k = new double[n];
        for (var j = 0; j < n; j++)
        {
            c[j] = modalC[j, j];
            var w = modes.Modes[j].AngularFrequency;
            k[j] = w * w;
        }
        return (shapes, c, k);
    }

    /// <summary>The load in modal coordinates: each term's distribution b becomes Φᵀb (N per unit of the time function).</summary>
    private static LoadSet Project(LoadSet load, Matrix<double> shapes)
    {
        var count = shapes.ColumnCount;
        return new LoadSet(count, [.. load.Terms.Select(term =>
        {
            var projected = new double[count];
            foreach (var (dof, weight) in term.Distribution)
                for (var j = 0; j < count; j++) projected[j] += weight * shapes[dof, j];
            return term with { Distribution = [.. projected.Select((w, j) => (j, w))] };
        })]);
    }

    private static ResponseRecorder PhysicalRecorder(LinearDynamicSystem system, List<Probe> probes, TransientSettings settings,
        int steps, double rmsFrom, double rmsTo, IProgress<double>? progress) =>
        new(probes, SymmetricSparseMatrix.From(system.Mass), SymmetricSparseMatrix.From(system.Damping),
            SymmetricSparseMatrix.From(system.Stiffness), settings.Step, steps, settings.RecordEvery, rmsFrom, rmsTo, progress);

    /// <summary>ζⱼ from the settings (elastic modes in order, last repeats) or from the diagonal of ΦᵀCΦ; warns when C is far from classical.</summary>
    private static double[] ModalDamping(TransientSettings settings, ImmutableArray<double>? given, Matrix<double> shapes, double[] omega,
        Matrix<double> c, List<string> warnings, int rigidBodyModes)
    {
        var count = omega.Length;
        var zeta = new double[count];
        if (!settings.ModalDampingRatios.IsEmpty)
        {
            for (var j = rigidBodyModes; j < count; j++)
                zeta[j] = settings.ModalDampingRatios[Math.Min(j - rigidBodyModes, settings.ModalDampingRatios.Length - 1)];
            return zeta;
        }
        if (given is { } ratios && ratios.Length >= count)
        {
            for (var j = 0; j < count; j++) zeta[j] = Math.Max(0, ratios[j]);
        }
        var g = shapes.TransposeThisAndMultiply(c * shapes);
        var worst = 0.0;
        for (var i = 0; i < count; i++)
        {
            if (given is null || given.Value.Length < count) zeta[i] = omega[i] > 0 ? g[i, i] / (2 * omega[i]) : 0.0;
            for (var j = 0; j < count; j++)
                if (i != j && g[i, i] > 0 && g[j, j] > 0) worst = Math.Max(worst, Math.Abs(g[i, j]) / Math.Sqrt(g[i, i] * g[j, j]));
        }
        if (worst > 0.01)
            warnings.Add(Invariant($"The damping is not classical (coupling {worst:G3} between modes): the modal method keeps only the diagonal of ΦᵀCΦ; use newmark or exact for this model."));
        return zeta;
    }

    /// <summary>A warning when the RMS window holds no step of the run, or reaches past either end of it; null otherwise.</summary>
    private static string? RmsWindowWarning(TransientSettings settings, int steps, int samples)
    {
        var end = steps * settings.Step;
        var from = settings.RmsFrom ?? 0.0;
        var to = settings.RmsTo ?? end;
        if (samples == 0)
            return Invariant($"The RMS window {from:G4} to {to:G4} s holds no step of the run (0 to {end:G4} s): every RMS is reported as not available. Run longer or move the window inside the run.");
        if (settings.RmsTo is { } given && given > end * (1 + 1e-9))
            return Invariant($"The RMS window ends at {given:G4} s, after the run ({end:G4} s): each RMS covers {from:G4} to {end:G4} s only.");
        return null;
    }

    private static IEnumerable<string> StepWarnings(ModalResult modes, ImmutableArray<Mode> considered, LoadSet load,
        StructuralMatrices matrices, TransientSettings settings, IReadOnlyList<TransientExcitation> excitations)
    {
        var h = settings.Step;
        var n = matrices.Size;
        var mass = Enumerable.Range(0, n).Select(i => matrices.Mass[i, i]).ToArray();
        var highest = considered.Where(m => !m.IsRigidBody && Significant(m, load, mass)).MaxBy(m => m.AngularFrequency);
        if (highest is not null && highest.PeriodSeconds < MinimumStepsPerPeriod * h)
            yield return Invariant($"The step {h:G4} s gives only {highest.PeriodSeconds / h:F1} steps per period of mode {highest.Number} ({highest.NaturalFrequencyHz:G4} Hz), which takes a significant share of the mass or load: use at most {highest.PeriodSeconds / MinimumStepsPerPeriod:G3} s (about 10 steps per period, common practice).");

        var lowest = modes.Modes.FirstOrDefault(m => !m.IsRigidBody);
        if (lowest is not null && settings.Duration < MinimumPeriodsOfLowestMode * lowest.PeriodSeconds)
            yield return Invariant($"The duration {settings.Duration:G4} s covers only {settings.Duration / lowest.PeriodSeconds:F2} periods of the lowest mode ({lowest.NaturalFrequencyHz:G4} Hz): run at least {MinimumPeriodsOfLowestMode * lowest.PeriodSeconds:G3} s to see its response.");

        foreach (var e in excitations)
        {
            var f = e switch { ForceHistory fh => fh.Time, SupportAccelerationHistory sa => sa.Acceleration, SupportVelocityHistory sv => sv.Velocity, _ => null };
            var highestHz = f switch
            {
                SineFunction s => Math.Abs(s.FrequencyHz),
                UnbalanceSpeedRamp r => Math.Max(r.FromRadPerSecond, r.ToRadPerSecond) / (2 * Math.PI),
                _ => 0.0,
            };
            if (highestHz > 0 && highestHz * h * MinimumStepsPerPeriod > 1)
                yield return Invariant($"Load '{e.Name}' reaches {highestHz:G4} Hz: the step {h:G4} s gives only {1 / (highestHz * h):F1} steps per cycle of the load.");
            var pulse = f switch { RectangularPulse r => r.Duration, HalfSinePulse s => s.Duration, _ => double.PositiveInfinity };
            if (pulse < MinimumStepsPerPeriod * h)
                yield return Invariant($"Load '{e.Name}' lasts {pulse:G4} s, only {pulse / h:F1} steps: its shape is poorly resolved.");
            if (f is TableFunction table)
            {
                var finest = Enumerable.Range(1, table.Times.Length - 1).Min(i => table.Times[i] - table.Times[i - 1]);
                if (finest < h * (1 - 1e-9))
                    yield return Invariant($"Load '{e.Name}' is sampled every {finest:G4} s, finer than the step {h:G4} s: samples between steps are skipped.");
            }
        }
    }

    /// <summary>A mode is significant when it carries ≥ 1 % of the effective mass or of a load term's (φᵀb)²/(bᵀM⁻¹b).</summary>
    private static bool Significant(Mode mode, LoadSet load, double[] mass)
    {
        if (mode.EffectiveMassFraction >= SignificantShare) return true;
        foreach (var term in load.Terms)
        {
            double projection = 0, norm = 0;
            foreach (var (dof, w) in term.Distribution)
            {
                projection += w * mode.Shape[dof];
                norm += w * w / mass[dof];
            }
            if (norm > 0 && projection * projection / norm >= SignificantShare) return true;
        }
        return false;
    }

    /// <summary>Displacement, velocity and acceleration histories of each moving support on the step grid.</summary>
    /// <remarks>
    /// A prescribed acceleration a(t) is integrated exactly for a linear between steps. A prescribed velocity v(t)
    /// (<see cref="SupportVelocityHistory"/>) is sampled at the steps; its acceleration is the derivative of the
    /// parabola through three neighbouring samples (the central difference (v₊ − v₋)/2h, and the one-sided
    /// (∓3v₀ ± 4v₁ ∓ v₂)/2h at the two ends), and its displacement the corrected trapezoid
    /// d₁ = d₀ + h(v₀ + v₁)/2 + h²(a₀ − a₁)/12, exact for a cubic. So a velocity that is the integral of an acceleration
    /// linear in time gives exactly the histories of that acceleration; a jump of the velocity (a voltage step) becomes an
    /// acceleration pulse over the two steps around it whose area is the jump. Both kinds may move one support: they add.
    /// </remarks>
    private static Dictionary<string, (TimeFunction Displacement, TimeFunction Velocity, TimeFunction Acceleration)> SupportMotion(
        Network network, IReadOnlyList<TransientExcitation> excitations, double h, int steps)
    {
        var motion = new Dictionary<string, (TimeFunction, TimeFunction, TimeFunction)>();
        // Keyed by the support's prescribed column: its name in line models, 'support.z' in plane and 3d models.
        string Column(TransientExcitation e)
        {
            if (e is SupportVelocityHistory sv)
                return network.Space == ModelSpace.Line ? sv.Support
                    : throw new ArgumentException($"Support velocity '{e.Name}' moves a support of a line model only.", nameof(excitations));
            var sa = (SupportAccelerationHistory)e;
            if (network.Space == ModelSpace.Line)
                return sa.Direction == Dofs.Direction.Along ? sa.Support
                    : throw new ArgumentException($"Support motion '{e.Name}' has direction '{sa.Direction.Label()}', but a line model moves along its one line only.", nameof(excitations));
            if (!Directions.Translations(network.Space).Contains(sa.Direction))
                throw new ArgumentException($"Support motion '{e.Name}' needs a translation of the model's space ({string.Join(", ", Directions.Translations(network.Space).Select(d => d.Label()))}) as its direction.", nameof(excitations));
            return $"{sa.Support}.{sa.Direction.Label()}";
        }
        static string SupportOf(TransientExcitation e) => e is SupportVelocityHistory v ? v.Support : ((SupportAccelerationHistory)e).Support;
        var moving = excitations.Where(e => e is SupportAccelerationHistory or SupportVelocityHistory);
        foreach (var group in moving.GroupBy(Column))
        {
            var support = SupportOf(group.First());
            if (support == Network.Ground)
                throw new ArgumentException("Ground is fixed; prescribe motion at another support.", nameof(excitations));
            if (!network.IsSupport(support))
                throw new ArgumentException($"Support motion '{group.First().Name}' refers to unknown support '{support}'.", nameof(excitations));
            var d = new double[steps + 1];
            var v = new double[steps + 1];
            var a = new double[steps + 1];
            var accelerations = group.OfType<SupportAccelerationHistory>().ToList();
            if (accelerations.Count > 0)
            {
                a[0] = accelerations.Sum(e => e.Acceleration.ValueAt(0));
                for (var s = 1; s <= steps; s++)
                {
                    a[s] = accelerations.Sum(e => e.Acceleration.ValueAt(s * h));
                    d[s] = d[s - 1] + h * v[s - 1] + h * h / 6 * (2 * a[s - 1] + a[s]);
                    v[s] = v[s - 1] + 0.5 * h * (a[s - 1] + a[s]);
                }
            }
            var velocities = group.OfType<SupportVelocityHistory>().ToList();
            if (velocities.Count > 0)
            {
                var (dv, vv, av) = PrescribedVelocity(s => velocities.Sum(e => e.Scale * e.Velocity.ValueAt(s * h)), h, steps);
                for (var s = 0; s <= steps; s++)
                {
                    d[s] += dv[s];
                    v[s] += vv[s];
                    a[s] += av[s];
                }
            }
            motion[group.Key] = (new GridHistory(h, d), new GridHistory(h, v), new GridHistory(h, a));
        }
        return motion;
    }

    /// <summary>The displacement, the samples and the grid derivative of a prescribed velocity (see <see cref="SupportMotion"/>).</summary>
    internal static (double[] Displacement, double[] Velocity, double[] Acceleration) PrescribedVelocity(Func<int, double> velocityAtStep, double h, int steps)
    {
        var d = new double[steps + 1];
        var v = new double[steps + 1];
        var a = new double[steps + 1];
        for (var s = 0; s <= steps; s++) v[s] = velocityAtStep(s);
        if (steps == 1)
        {
            a[0] = a[1] = (v[1] - v[0]) / h;
        }
        else
        {
            a[0] = (-3 * v[0] + 4 * v[1] - v[2]) / (2 * h);
            for (var s = 1; s < steps; s++) a[s] = (v[s + 1] - v[s - 1]) / (2 * h);
            a[steps] = (3 * v[steps] - 4 * v[steps - 1] + v[steps - 2]) / (2 * h);
        }
        for (var s = 1; s <= steps; s++) d[s] = d[s - 1] + 0.5 * h * (v[s - 1] + v[s]) + h * h / 12 * (a[s - 1] - a[s]);
        return (d, v, a);
    }

    private static LoadSet BuildLoad(Network network, Dofs.DofMap dofs, IReadOnlyList<TransientExcitation> excitations, SupportCoupling coupling,
        Dictionary<string, (TimeFunction Displacement, TimeFunction Velocity, TimeFunction Acceleration)> supportMotion)
    {
        var terms = new List<LoadTerm>();
        foreach (var e in excitations.OfType<ForceHistory>())
        {
            if (network.Space != ModelSpace.Line)
            {
                // f_q = Tᵀ e_d F(t): a force at a body point also gives its moment about the centre of mass.
                Guard.Finite(e.Scale, nameof(excitations));
                terms.Add(new LoadTerm([.. SpatialLoads.UnitLoad(network, dofs, e.Mass, e.Direction, e.Name).Select(t => (t.Dof, e.Scale * t.Weight))], e.Time));
                continue;
            }
            var i = dofs.IndexOf(e.Mass);
            if (i < 0) throw new ArgumentException($"Load '{e.Name}' acts at unknown mass '{e.Mass}'.", nameof(excitations));
            Guard.Finite(e.Scale, nameof(excitations));
            terms.Add(new LoadTerm([(i, e.Scale)], e.Time));
        }
        // A moving support loads the free DOFs by −K_fp u_s − C_fp u̇_s − M_fp ü_s (M_fp: inerters with an end on it).
        foreach (var (support, (displacement, velocity, acceleration)) in supportMotion)
        {
            var s = coupling.Supports.IndexOf(support);
            var k = Column(coupling.StiffnessFP, s);
            var c = Column(coupling.DampingFP, s);
            var m = Column(coupling.MassFP, s);
            if (k.Length > 0) terms.Add(new LoadTerm([.. k.Select(e => (e.Index, -e.Value))], displacement));
            if (c.Length > 0) terms.Add(new LoadTerm([.. c.Select(e => (e.Index, -e.Value))], velocity));
            if (m.Length > 0) terms.Add(new LoadTerm([.. m.Select(e => (e.Index, -e.Value))], acceleration));
        }
        return new LoadSet(dofs.Count, [.. terms]);
    }

    private static (int, double) Negated((int Index, double Value) e) => (e.Index, -e.Value);

    private static (int Index, double Value)[] Column(Matrix<double> m, int column) =>
        [.. Enumerable.Range(0, m.RowCount).Select(i => (i, m[i, column])).Where(e => e.Item2 != 0)];

    private static List<Probe> BuildProbes(Network network, Dofs.DofMap dofs, TransientSettings settings, SupportCoupling coupling,
        Dictionary<string, (TimeFunction Displacement, TimeFunction Velocity, TimeFunction Acceleration)> supportMotion)
    {
        var spatial = network.Space != ModelSpace.Line;
        var outputs = !settings.Outputs.IsEmpty
            ? spatial ? [.. settings.Outputs.SelectMany(o => dofs.OutputLabels(o) is { IsEmpty: false } labels ? labels : [o]).Distinct()] : settings.Outputs
            : spatial ? [.. Enumerable.Range(0, dofs.Count).Select(dofs.Label)] : [.. network.Masses.Select(m => m.Name).Where(m => dofs.IndexOf(m) >= 0)]; // nodes a transducer eliminates have no DOF
        var probes = new List<Probe>();
        foreach (var name in outputs)
        {
            var i = spatial ? dofs.IndexOfLabel(name) : dofs.IndexOf(name);
            if (i < 0) throw new ArgumentException($"Output '{name}' is not a mass.", nameof(settings));
            var rotation = spatial && dofs.Dofs[i].Direction.IsRotation();
            probes.Add(new Probe(name, ResponseQuantity.Displacement, [(i, 1.0)], [], [], []) { Rotation = rotation });
            probes.Add(new Probe(name, ResponseQuantity.Velocity, [], [(i, 1.0)], [], []) { Rotation = rotation });
            probes.Add(new Probe(name, ResponseQuantity.Acceleration, [], [], [(i, 1.0)], []) { Rotation = rotation });
        }

        var wanted = outputs.ToHashSet();
        bool Recorded(string a, string b) => wanted.Contains(a) || wanted.Contains(b) || network.IsSupport(a) || network.IsSupport(b);

        // value × (end A − end B); a support end contributes its prescribed motion, or nothing when it is fixed.
        (List<(int, double)> State, List<(double, TimeFunction)> Known) Difference(string a, string b, double value, bool velocity)
        {
            var state = new List<(int, double)>();
            var known = new List<(double, TimeFunction)>();
            // An end a transducer eliminates moves as a combination of kept nodes (ConstraintElimination).
            var ends = new List<(string Node, double Weight)>(2);
            if (ConstraintElimination.Of(network) is { } elimination) { elimination.AddTerms(a, 1, ends); elimination.AddTerms(b, -1, ends); }
            else { ends.Add((a, 1.0)); ends.Add((b, -1.0)); }
            foreach (var (node, sign) in ends)
            {
                var i = dofs.IndexOf(node);
                if (i >= 0) state.Add((i, sign * value));
                else if (supportMotion.TryGetValue(node, out var m)) known.Add((sign * value, velocity ? m.Velocity : m.Displacement));
            }
            return (state, known);
        }

        if (spatial) probes.AddRange(MountProbes(network, dofs, coupling, supportMotion));
        foreach (var s in network.Springs.Where(s => !spatial && Recorded(s.NodeA, s.NodeB)))
        {
            var (state, known) = Difference(s.NodeA, s.NodeB, s.Stiffness, velocity: false);
            probes.Add(new Probe(s.Name, ResponseQuantity.SpringForce, [.. state], [], [], [.. known]));
        }
        foreach (var d in network.Dampers.Where(d => !spatial && Recorded(d.NodeA, d.NodeB)))
        {
            var (state, known) = Difference(d.NodeA, d.NodeB, d.Coefficient, velocity: true);
            probes.Add(new Probe(d.Name, ResponseQuantity.DamperForce, [], [.. state], [], [.. known]));
        }

        // weight × the derivative-th time derivative of a node (an eliminated one through its terms), into the probe's lists.
        void Term(string node, double weight, int derivative, List<(int, double)> u, List<(int, double)> v, List<(int, double)> a,
            List<(double, TimeFunction)> known)
        {
            var kept = new List<(string Node, double Weight)>(4);
            if (ConstraintElimination.Of(network) is { } elimination) elimination.AddTerms(node, weight, kept);
            else kept.Add((node, weight));
            foreach (var (n, w) in kept)
            {
                var i = dofs.IndexOf(n);
                if (i >= 0) (derivative == 0 ? u : derivative == 1 ? v : a).Add((i, w));
                else if (supportMotion.TryGetValue(n, out var m)) known.Add((w, derivative == 0 ? m.Displacement : derivative == 1 ? m.Velocity : m.Acceleration));
            }
        }

        // Transducer ports: u = Bl(v_a − v_b) and i by Kirchhoff's law at the eliminated node (TransducerPortTerms).
        if (!spatial)
            foreach (var port in TransducerPortTerms.Of(network))
                foreach (var (quantity, terms) in new[] { (ResponseQuantity.PortVoltage, port.Voltage), (ResponseQuantity.PortCurrent, port.Current) })
                {
                    var (u, v, a, known) = (new List<(int, double)>(), new List<(int, double)>(), new List<(int, double)>(), new List<(double, TimeFunction)>());
                    foreach (var t in terms) Term(t.Node, t.Weight, t.Derivative, u, v, a, known);
                    probes.Add(new Probe(port.Transducer.Name, quantity, [.. u], [.. v], [.. a], [.. known]));
                }
        var electricalShares = spatial || network.ElectricalNodes.IsEmpty ? [] : TransducerPortTerms.ElectricalShares(network, ConstraintElimination.Of(network));

        // Force received by support s: r_s = −(K_pf u + C_pf u̇ + M_pf ü + K_pp u_p + C_pp u̇_p + M_pp ü_p), K_pf = K_fpᵀ.
        for (var s = 0; s < coupling.Supports.Length; s++)
        {
            var u = Column(coupling.StiffnessFP, s).Select(e => (e.Index, -e.Value)).ToList();
            var v = Column(coupling.DampingFP, s).Select(e => (e.Index, -e.Value)).ToList();
            var a = Column(coupling.MassFP, s).Select(e => (e.Index, -e.Value)).ToList();
            var known = new List<(double, TimeFunction)>();
            var attached = u.Count > 0 || v.Count > 0 || a.Count > 0;
            for (var t = 0; t < coupling.Supports.Length; t++)
            {
                var kst = coupling.StiffnessPP[s, t];
                var cst = coupling.DampingPP[s, t];
                var mst = coupling.MassPP[s, t];
                attached |= kst != 0 || cst != 0 || mst != 0;
                if (!supportMotion.TryGetValue(coupling.Supports[t], out var m)) continue;
                if (kst != 0) known.Add((-kst, m.Displacement));
                if (cst != 0) known.Add((-cst, m.Velocity));
                if (mst != 0) known.Add((-mst, m.Acceleration));
            }
            if (!attached) continue;
            // An electrical support is a voltage source: its current is minus its reaction. At a mechanical support the
            // electrical elements' share (a current) is taken back out, as in the harmonic sweep.
            if (network.IsElectrical(coupling.Supports[s]))
            {
                probes.Add(new Probe(coupling.Supports[s], ResponseQuantity.SourceCurrent, [.. u.Select(Negated)], [.. v.Select(Negated)], [.. a.Select(Negated)],
                    [.. known.Select(k => (-k.Item1, k.Item2))]));
                continue;
            }
            foreach (var e in electricalShares)
                if (e.Weight(coupling.Supports[s]) is var w and not 0)
                {
                    Term(e.NodeA, w * e.Value, e.Derivative, u, v, a, known);
                    if (e.NodeB is not null) Term(e.NodeB, -w * e.Value, e.Derivative, u, v, a, known);
                }
            probes.Add(new Probe(coupling.Supports[s], ResponseQuantity.Reaction, [.. u], [.. v], [.. a], [.. known]));
        }
        return probes;
    }

    /// <summary>
    /// Plane and 3d models: the force of every spring and damper in each direction it acts in (a mount force), k_d·Δ_d or
    /// c_d·Δ̇_d on its end B, Δ through the attachment maps; a moving support's column adds its prescribed motion.
    /// </summary>
    private static IEnumerable<Probe> MountProbes(Network network, Dofs.DofMap dofs, SupportCoupling coupling,
        Dictionary<string, (TimeFunction Displacement, TimeFunction Velocity, TimeFunction Acceleration)> supportMotion)
    {
        foreach (var row in SpatialLoads.MountRows(network, dofs, coupling.Supports))
        {
            var state = row.Free.Select(t => (t.Index, row.Value * t.Coefficient)).ToArray();
            var known = new List<(double, TimeFunction)>();
            foreach (var (column, c) in row.Prescribed)
                if (supportMotion.TryGetValue(coupling.Supports[column], out var m))
                    known.Add((row.Value * c, row.IsDamper ? m.Velocity : m.Displacement));
            foreach (var (label, factor) in SpatialLoads.Resolved(row, network.Space))
            {
                var weights = state.Select(t => (t.Index, factor * t.Item2)).ToArray();
                var prescribed = known.Select(k => (factor * k.Item1, k.Item2)).ToArray();
                yield return row.IsDamper
                    ? new Probe(row.Element, ResponseQuantity.DamperForce, [], weights, [], prescribed) { Direction = label }
                    : new Probe(row.Element, ResponseQuantity.SpringForce, weights, [], [], prescribed) { Direction = label };
            }
        }
    }

    private static bool IsDiagonal(Matrix<double> m)
    {
        foreach (var (i, j, v) in m.EnumerateIndexed(Zeros.AllowSkip))
            if (i != j && v != 0) return false;
        return true;
    }

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);

    /// <summary>A history known on the step grid, linear between grid points and held after the last one.</summary>
    private sealed record GridHistory(double Step, double[] Values) : TimeFunction
    {
        public override double ValueAt(double time)
        {
            var x = time / Step;
            if (x <= 0) return Values[0];
            var i = (int)x;
            if (i >= Values.Length - 1) return Values[^1];
            var w = x - i;
            return w < 1e-9 ? Values[i] : Values[i] + w * (Values[i + 1] - Values[i]);
        }
    }

    /// <summary>How the supports (ground first) couple to the free DOFs: K_fp, C_fp, M_fp (n × p) and K_pp, C_pp, M_pp (p × p).</summary>
    private sealed record SupportCoupling(ImmutableArray<string> Supports, Matrix<double> StiffnessFP, Matrix<double> DampingFP,
        Matrix<double> StiffnessPP, Matrix<double> DampingPP, Matrix<double> MassFP, Matrix<double> MassPP)
    {
        /// <summary>The coupling of a partition (its stiffness and inerter blocks) with the damping blocks given, or the partition's dampers when none.</summary>
        public static SupportCoupling FromPartition(SupportPartition p, DampingMatrices? DampingMatrices) =>
            new(p.Supports, p.StiffnessFP, DampingMatrices?.FP ?? p.DamperFP, p.StiffnessPP, DampingMatrices?.PP ?? p.DamperPP, p.MassFP, p.MassPP);

        /// <summary>The coupling of the discrete springs and dampers, assembled the same way as K and C.</summary>
        public static SupportCoupling FromElements(Network network, Dofs.DofMap dofs)
        {
            var supports = network.Supports.Select(s => s.Name).ToImmutableArray();
            var n = dofs.Count;
            var p = supports.Length;
            var kfp = Matrix<double>.Build.Sparse(n, p);
            var cfp = Matrix<double>.Build.Sparse(n, p);
            var kpp = Matrix<double>.Build.Dense(p, p);
            var cpp = Matrix<double>.Build.Dense(p, p);
            var mfp = Matrix<double>.Build.Sparse(n, p);
            var mpp = Matrix<double>.Build.Dense(p, p);
            void Add(Matrix<double> fp, Matrix<double> pp, string a, string b, double value)
            {
                int Free(string node) => dofs.IndexOf(node);
                int Prescribed(string node) => supports.IndexOf(node);
                foreach (var (x, y) in new[] { (a, b), (b, a) })
                {
                    if (Prescribed(x) is var sx and >= 0)
                    {
                        pp[sx, sx] += value;
                        if (Prescribed(y) is var sy and >= 0) pp[sx, sy] -= value;
                        else if (Free(y) is var iy and >= 0) fp[iy, sx] -= value;
                    }
                }
            }
            foreach (var s in network.Springs) Add(kfp, kpp, s.NodeA, s.NodeB, s.Stiffness);
            foreach (var d in network.Dampers) Add(cfp, cpp, d.NodeA, d.NodeB, d.Coefficient);
            foreach (var b in network.Inerters) Add(mfp, mpp, b.NodeA, b.NodeB, b.Inertance);
            return new SupportCoupling(supports, kfp, cfp, kpp, cpp, mfp, mpp);
        }
    }
}
