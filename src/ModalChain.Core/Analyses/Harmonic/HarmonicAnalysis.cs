using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;

namespace ModalChain.Core.Analyses.Harmonic;

/// <summary>Steady-state response of a damped network to harmonic loads over a frequency sweep.</summary>
/// <remarks>
/// Solves (K(1+iη) − ω²M + iωC) X = F − (K(1+iη)_fp + iωC_fp) U at each ω for complex amplitudes X of the masses,
/// F of the applied loads and U of the moving supports; velocity is iωX and acceleration −ω²X. Loads acting
/// together add as complex amplitudes. Two methods: <see cref="HarmonicMethod.Direct"/> (exact, any damping) and
/// <see cref="HarmonicMethod.Modal"/> (superposition with residual flexibility); they agree to round-off on
/// classically damped models when every mode is kept.
/// </remarks>
public static class HarmonicAnalysis
{
    /// <summary>Assembles <paramref name="model"/> and runs the sweep of <paramref name="spec"/>, with operating points.</summary>
    public static HarmonicResult Solve(StructuralModel model, HarmonicSpec spec) => Solve(Assemble(model, spec), spec);

    /// <summary>Above this many DOFs a modal sweep solves only the modes it superposes, not every mode.</summary>
    public const int LowestModesFromDofs = TruncationCheckMaxDofs;

    /// <summary>Assembles <paramref name="model"/> with the undamped modes the sweep of <paramref name="spec"/> needs.</summary>
    /// <remarks>
    /// Every mode for models of up to <see cref="LowestModesFromDofs"/> DOFs (so their results do not depend on this
    /// choice). A modal sweep of a larger model solves only the modes it superposes: the spec's
    /// <see cref="HarmonicSpec.ModeCount"/> lowest, or else every mode below twice the highest frequency it is asked
    /// for (the sweep's and the running speeds of the model's loads), at least one. A direct sweep of a larger model
    /// solves the modes below twice the highest frequency too: it uses them only to refine the grid around natural
    /// frequencies and to warn of undamped resonances. With a sparse model the lowest modes come from the sparse solver,
    /// so neither method forms a dense n×n matrix. Modal damping ratios in the model still need every mode (they define
    /// C from all of them).
    /// </remarks>
    public static DampedSystem Assemble(StructuralModel model, HarmonicSpec spec, SolverChoice choice = SolverChoice.Auto)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(spec);
        var size = model.Network.Masses.Length;
        if (size <= LowestModesFromDofs) return DampedSystem.Build(model, new ModalOptions(Choice: choice));
        var count = spec.Method == HarmonicMethod.Modal ? spec.ModeCount : null;
        double? below = count is null ? 2 * HighestFrequencyHz(model, spec) : null;
        var modes = ModalAnalysis.Solve(model.Network, new ModalOptions(count, Choice: choice, BelowFrequencyHz: below));
        if (modes.Modes.IsEmpty) modes = ModalAnalysis.Solve(model.Network, new ModalOptions(1, Choice: choice));
        return DampedSystem.Build(model, modes, choice);
    }

    /// <summary>The highest frequency in Hz a sweep of <paramref name="spec"/> computes: its own and its loads' running speeds.</summary>
    private static double HighestFrequencyHz(StructuralModel model, HarmonicSpec spec)
    {
        var sweep = spec.Frequencies switch
        {
            FrequencyRange r => Math.Max(r.FromHz, r.ToHz),
            FrequencyList l when !l.FrequenciesHz.IsDefaultOrEmpty => l.FrequenciesHz.Max(),
            _ => 0.0,
        };
        var speeds = ResolveLoads(model, spec.Loads).Select(l => l.SpeedHz ?? 0).DefaultIfEmpty(0).Max();
        return Math.Max(sweep, speeds);
    }

    /// <summary>Runs the sweep of <paramref name="spec"/> on an assembled system, with operating points at the loads' speeds.</summary>
    public static HarmonicResult Solve(DampedSystem system, HarmonicSpec spec)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(spec);
        var loads = ResolveLoads(system.Model, spec.Loads);
        var outputs = spec.Outputs.IsDefaultOrEmpty ? DefaultOutputs(system) : spec.Outputs;
        var modes = system.Modes.Modes;
        var frequencies = FrequencyGrid.Build(spec.Frequencies, spec.Refine,
            [.. modes.Select(m => m.NaturalFrequencyHz)], system.ModalDampingRatios);
        var sweep = Sweep(system, frequencies, loads, outputs, spec.Method, spec.ModeCount);

        var operating = ImmutableArray.CreateBuilder<OperatingPoint>();
        var warnings = new List<string>(sweep.Warnings);
        foreach (var group in loads.Where(l => l.SpeedHz is > 0).GroupBy(l => l.SpeedHz!.Value).OrderBy(g => g.Key))
        {
            var at = Sweep(system, [group.Key], [.. group], outputs, spec.Method, spec.ModeCount);
            operating.Add(new OperatingPoint(group.Key, [.. group.Select(l => l.Name)], at));
            warnings.AddRange(at.Warnings.Select(w => string.Create(CultureInfo.InvariantCulture, $"operating point {group.Key:G6} Hz: {w}")));
        }
        return sweep with { OperatingPoints = operating.ToImmutable(), Warnings = [.. warnings] };
    }

    /// <summary>The response at exactly <paramref name="frequenciesHz"/> to <paramref name="loads"/> acting together.</summary>
    /// <param name="system">The assembled model.</param>
    /// <param name="frequenciesHz">Frequencies in Hz, each positive, in the order wanted.</param>
    /// <param name="loads">Loads acting together (superposed with their phases).</param>
    /// <param name="outputs">Masses to report.</param>
    /// <param name="method">Direct or modal.</param>
    /// <param name="modeCount">Modal method: modes to keep; null for every mode up to twice the highest frequency.</param>
    public static HarmonicResult Sweep(DampedSystem system, IReadOnlyList<double> frequenciesHz, IReadOnlyList<Load> loads,
        IReadOnlyList<string> outputs, HarmonicMethod method, int? modeCount = null)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(frequenciesHz);
        ArgumentNullException.ThrowIfNull(loads);
        ArgumentNullException.ThrowIfNull(outputs);
        foreach (var f in frequenciesHz) Guard.Positive(f, "frequency");
        var network = system.Model.Network;
        var p = system.Partition;
        var n = p.FreeCount;
        var loading = HarmonicLoading.Compile(system, loads);
        var spatial = network.Space != ModelSpace.Line;
        // A mass or body named as an output of a plane or 3d model stands for each of its DOFs.
        if (spatial) outputs = [.. outputs.SelectMany(o => p.Free.OutputLabels(o) is { IsEmpty: false } labels ? labels : [o]).Distinct()];
        var outputIndex = outputs.Select(o =>
        {
            var i = spatial ? p.Free.IndexOfLabel(o) : p.Free.IndexOf(o);
            return i >= 0 ? i : throw new ArgumentException(spatial
                ? $"Output '{o}' is not a degree of freedom of the network (outputs are labelled like '{p.Free.Label(0)}')."
                : $"Output '{o}' is not a mass of the network.", nameof(outputs));
        }).ToArray();
        var outputSet = outputs.ToHashSet();

        // Plane and 3d models report every spring and damper per direction (mount forces) instead of the line model's element forces.
        var springs = spatial ? [] : network.Springs.Where(s => outputSet.Contains(s.NodeA) || outputSet.Contains(s.NodeB)).ToArray();
        var dampers = spatial ? [] : network.Dampers.Where(d => outputSet.Contains(d.NodeA) || outputSet.Contains(d.NodeB)).ToArray();
        var mountRows = spatial ? SpatialLoads.MountRows(network, p) : [];
        var neededSet = new SortedSet<int>(outputIndex);
        // An end a transducer eliminates moves as a combination of kept nodes (ConstraintElimination).
        var elimination = spatial ? null : ConstraintElimination.Of(network);
        var ends = new List<(string Node, double Weight)>();
        foreach (var e in springs.Select(s => (s.NodeA, s.NodeB)).Concat(dampers.Select(d => (d.NodeA, d.NodeB))))
        {
            ends.Clear();
            if (elimination is null) { ends.Add((e.NodeA, 1)); ends.Add((e.NodeB, 1)); }
            else { elimination.AddTerms(e.NodeA, 1, ends); elimination.AddTerms(e.NodeB, 1, ends); }
            foreach (var (node, _) in ends)
                if (p.Free.IndexOf(node) is var a and >= 0) neededSet.Add(a);
        }
        // Port terms, and the electrical elements whose share of a support's reaction is a current: their ends are needed too.
        var ports = spatial ? [] : TransducerPortTerms.Of(network);
        var electricalShare = spatial || network.ElectricalNodes.IsEmpty ? [] : TransducerPortTerms.ElectricalShares(network, elimination);
        foreach (var node in ports.SelectMany(port => port.Voltage.Concat(port.Current)).Select(t => t.Node)
            .Concat(electricalShare.SelectMany(e => e.NodeB is null ? new[] { e.NodeA } : [e.NodeA, e.NodeB])))
        {
            ends.Clear();
            if (elimination is null) ends.Add((node, 1));
            else elimination.AddTerms(node, 1, ends);
            foreach (var (kept, _) in ends)
                if (p.Free.IndexOf(kept) is var a and >= 0) neededSet.Add(a);
        }
        var needed = neededSet.ToArray();
        var slot = new Dictionary<int, int>();
        for (var k = 0; k < needed.Length; k++) slot[needed[k]] = k;
        // Observation rows: unit rows for the displacements needed, then K_pf and C_pf rows for each support's reaction.
        var observations = new List<double[]>(needed.Length + 2 * p.SupportCount);
        foreach (var i in needed)
        {
            var unit = new double[n];
            unit[i] = 1;
            observations.Add(unit);
        }
        // Mount rows: the free part of each element row's relative motion Δ = (t_A − t_B)·[x; u].
        var mountObservation = new int[mountRows.Length];
        for (var r = 0; r < mountRows.Length; r++)
        {
            mountObservation[r] = -1;
            if (mountRows[r].Free.Length == 0) continue;
            var w = new double[n];
            foreach (var (i, c) in mountRows[r].Free) w[i] += c;
            mountObservation[r] = observations.Count;
            observations.Add(w);
        }
        var stiffnessRow = new int[p.SupportCount];
        var dampingRow = new int[p.SupportCount];
        var massRow = new int[p.SupportCount];
        for (var s = 0; s < p.SupportCount; s++)
        {
            massRow[s] = -1;
            if (p.HasInertialCoupling)
            {
                var ms = new double[n];
                for (var i = 0; i < n; i++) ms[i] = p.MassFP[i, s];
                if (ms.Any(v => v != 0))
                {
                    massRow[s] = observations.Count;
                    observations.Add(ms);
                }
            }
            var ks = new double[n];
            var cs = new double[n];
            for (var i = 0; i < n; i++)
            {
                ks[i] = p.StiffnessFP[i, s];
                cs[i] = system.Damping.FP[i, s];
            }
            stiffnessRow[s] = ks.Any(v => v != 0) ? observations.Count : -1;
            if (stiffnessRow[s] >= 0) observations.Add(ks);
            dampingRow[s] = cs.Any(v => v != 0) ? observations.Count : -1;
            if (dampingRow[s] >= 0) observations.Add(cs);
        }

        var notes = ImmutableArray.CreateBuilder<string>();
        int used;
        HarmonicEngine engine;
        // Damping at a massless node makes it a first-order state that no undamped mode describes: solve directly.
        // (Asked of the system, which looks at C only when a mass is massless: reading C forms it, a dense n×n product
        // for modal damping ratios that the modal method never uses.)
        if (method == HarmonicMethod.Modal && system.HasFirstOrderStates)
        {
            method = HarmonicMethod.Direct;
            notes.Add("the modal method was asked for, but damping at a massless node makes it a first-order state that the undamped modes do not describe: solved directly instead");
        }
        if (method == HarmonicMethod.Modal)
        {
            var fmax = frequenciesHz.Count > 0 ? frequenciesHz.Max() : 0;
            var solved = system.Modes.Modes.Length;
            used = Math.Min(solved, modeCount is { } c ? Math.Clamp(c, 1, n)
                : Math.Max(1, system.Modes.Modes.Count(m => m.NaturalFrequencyHz <= 2 * fmax)));
            var rigid = system.Modes.RigidBodyModeCount > 0;
            engine = new ModalEngine(system, loading, [.. observations], used, residualFlexibility: !rigid);
            notes.Add(string.Create(CultureInfo.InvariantCulture, $"modal superposition of {used} of {n} modes") +
                (used < n ? (rigid ? "; residual flexibility left out (the network has rigid-body modes)" : ", residual flexibility for the rest") : ""));
            if (solved < n)
                notes.Add(string.Create(CultureInfo.InvariantCulture,
                    $"only the lowest {solved} of {n} modes were solved (up to {system.Modes.Modes[^1].NaturalFrequencyHz:G4} Hz{(modeCount is null ? "; every mode below twice the highest frequency" : "")})"));
            if (!system.IsClassical)
                notes.Add(string.Create(CultureInfo.InvariantCulture,
                    $"damping is not classical (coupling index {system.NonClassicalIndex:G3}): the kept modal equations are solved coupled"));
        }
        else
        {
            used = 0;
            engine = DirectEngines.Create(system, loading, [.. observations]);
            notes.Add(engine is SparseDirectEngine
                ? "direct solve (sparse complex LDLᵀ of the dynamic stiffness at each frequency on one ordering, exact for any damping)"
                : "direct solve (Hessenberg form of the state matrix, exact for any damping)");
        }
        if (system.Model.Damping.IsNone && !system.HasViscousDamping)
            notes.Add("the model has no damping: responses at natural frequencies are unbounded");

        var nf = frequenciesHz.Count;
        var nk = observations.Count;
        var terms = loading.Terms.Count;
        var x = new Complex[nf * nk];
        var failed = -1;
        // Contiguous chunks, one per worker, each with its workspace allocated once: no allocation per frequency.
        var workers = Math.Max(1, Math.Min(Environment.ProcessorCount, nf / 64 + 1));
        // An engine may solve several frequencies at once (the modal engine's products over a block); results do not depend on it.
        var block = engine.BlockSize;
        Parallel.For(0, workers, new ParallelOptions { MaxDegreeOfParallelism = workers }, w =>
        {
            var workspace = engine.CreateWorkspace();
            var omegas = new double[block];
            var coefficients = new Complex[block * terms];
            var powers = new Complex[HarmonicLoading.MaxPower - HarmonicLoading.MinPower + 1];
            var end = (int)((long)nf * (w + 1) / workers);
            for (var k0 = (int)((long)nf * w / workers); k0 < end; k0 += block)
            {
                var count = Math.Min(block, end - k0);
                for (var f = 0; f < count; f++)
                {
                    var omega = 2 * Math.PI * frequenciesHz[k0 + f];
                    omegas[f] = omega;
                    HarmonicLoading.Powers(omega, powers);
                    for (var r = 0; r < terms; r++) coefficients[f * terms + r] = powers[loading.Terms[r].Power - HarmonicLoading.MinPower];
                }
                var singular = engine.SolveBlock(omegas.AsSpan(0, count), coefficients.AsSpan(0, count * terms), terms, x.AsSpan(k0 * nk, count * nk), workspace);
                if (singular >= 0) Interlocked.Exchange(ref failed, k0 + singular);
            }
        });
        if (failed >= 0)
            throw new NumericalFailureException(string.Create(CultureInfo.InvariantCulture,
                $"the dynamic stiffness is singular at {frequenciesHz[failed]:G6} Hz ({n} DOFs): an undamped natural frequency; add damping or move the point"));

        var outputSlots = outputIndex.Select(i => slot[i]).ToArray();
        var warnings = ImmutableArray.CreateBuilder<string>();
        if (system.LossFactor == 0 && !system.HasViscousDamping)
            warnings.AddRange(UndampedResonanceWarnings(system, frequenciesHz, x, nk, outputSlots));
        if (method == HarmonicMethod.Modal && used < n)
        {
            if (n > TruncationCheckMaxDofs)
                notes.Add(string.Create(CultureInfo.InvariantCulture,
                    $"the truncation error is not estimated above {TruncationCheckMaxDofs} masses: compare with the direct method at the peaks"));
            else
            {
                var (error, at, output, count) = TruncationError(system, loading, [.. observations], frequenciesHz, x, nk, outputSlots, used);
                notes.Add(string.Create(CultureInfo.InvariantCulture,
                    $"truncation error against a direct solve at {count} frequencies (response peaks or operating points): up to {100 * error:G2} % of the largest output there"));
                if (error > TruncationTolerance)
                    warnings.Add(string.Create(CultureInfo.InvariantCulture,
                        $"the modal superposition of {used} of {n} modes is off by up to {100 * error:G2} % (at {at:G6} Hz, output {outputs[output]}) against a direct solve, above the {100 * TruncationTolerance:G2} % tolerance: keep more modes or use the direct method"));
            }
        }

        // Post-processing: support motions, responses, element forces and reactions.
        var u = new Complex[nf * p.SupportCount];
        var powers = new Complex[HarmonicLoading.MaxPower - HarmonicLoading.MinPower + 1];
        for (var k = 0; k < nf; k++)
        {
            HarmonicLoading.Powers(2 * Math.PI * frequenciesHz[k], powers);
            foreach (var (s, a, q) in loading.SupportMotion) u[k * p.SupportCount + s] += a * powers[q - HarmonicLoading.MinPower];
        }
        Complex AtKept(int k, string node)
        {
            var i = p.Free.IndexOf(node);
            return i >= 0 ? x[k * nk + slot[i]] : u[k * p.SupportCount + p.SupportIndex(node)];
        }
        Complex At(int k, string node) => elimination is null ? AtKept(k, node) : elimination.Value(node, n => AtKept(k, n));

        var responses = outputs.Select((o, j) => new DofResponse(o,
            [.. Enumerable.Range(0, nf).Select(k => x[k * nk + slot[outputIndex[j]]])])).ToImmutableArray();
        var hysteretic = new Complex(1, system.LossFactor);
        var forces = ImmutableArray.CreateBuilder<ElementForce>();
        foreach (var s in springs)
            forces.Add(new ElementForce(s.Name, ElementKind.Spring,
                [.. Enumerable.Range(0, nf).Select(k => s.Stiffness * hysteretic * (At(k, s.NodeA) - At(k, s.NodeB)))]));
        foreach (var d in dampers)
            forces.Add(new ElementForce(d.Name, ElementKind.Damper,
                [.. Enumerable.Range(0, nf).Select(k => new Complex(0, 2 * Math.PI * frequenciesHz[k] * d.Coefficient) * (At(k, d.NodeA) - At(k, d.NodeB)))]));

        var mountForces = MountForces(network.Space, mountRows, mountObservation, frequenciesHz, x, nk, u, p.SupportCount, hysteretic);

        var reactions = ImmutableArray.CreateBuilder<SupportReaction>();
        var sourceCurrents = ImmutableArray.CreateBuilder<SourceCurrent>();
        var total = new Complex[nf];
        var inertial = p.HasInertialCoupling;
        for (var s = 0; s < p.SupportCount; s++)
        {
            var electricalSupport = network.IsElectrical(p.Supports[s]);
            var r = new Complex[nf];
            for (var k = 0; k < nf; k++)
            {
                var iw = new Complex(0, 2 * Math.PI * frequenciesHz[k]);
                var sum = Complex.Zero;
                if (stiffnessRow[s] >= 0) sum += hysteretic * x[k * nk + stiffnessRow[s]];
                if (dampingRow[s] >= 0) sum += iw * x[k * nk + dampingRow[s]];
                if (massRow[s] >= 0) sum += iw * iw * x[k * nk + massRow[s]];
                for (var t = 0; t < p.SupportCount; t++)
                {
                    var ut = u[k * p.SupportCount + t];
                    if (ut != Complex.Zero)
                        sum += (p.StiffnessPP[s, t] * hysteretic + iw * system.Damping.PP[s, t] + iw * iw * (inertial ? p.MassPP[s, t] : 0)) * ut;
                }
                r[k] = -sum;
                // An electrical element's force on a mechanical support (ground) is a current: taken back out of the reaction.
                if (!electricalSupport)
                    foreach (var e in electricalShare)
                        if (e.Weight(p.Supports[s]) is var w and not 0)
                            r[k] += w * e.Value * ElementFactor(e.Derivative, iw, hysteretic) * (At(k, e.NodeA) - (e.NodeB is null ? Complex.Zero : At(k, e.NodeB)));
                if (!electricalSupport) total[k] += r[k];
            }
            if (electricalSupport) sourceCurrents.Add(new SourceCurrent(p.Supports[s], [.. r.Select(v => -v)]));
            else reactions.Add(new SupportReaction(p.Supports[s], [.. r]));
        }
        var portResponses = ports.Select(port => new TransducerPortResponse(port.Transducer.Name,
            [.. Enumerable.Range(0, nf).Select(k => TransducerPortTerms.Harmonic(port.Voltage, 2 * Math.PI * frequenciesHz[k], hysteretic, node => At(k, node)))],
            [.. Enumerable.Range(0, nf).Select(k => TransducerPortTerms.Harmonic(port.Current, 2 * Math.PI * frequenciesHz[k], hysteretic, node => At(k, node)))]))
            .ToImmutableArray();
        if ((!ports.IsEmpty || !electricalShare.IsEmpty) && (!system.Model.Damping.ModalRatios.IsDefaultOrEmpty || system.Model.Damping.Rayleigh is not null))
            notes.Add("port currents, source currents and the mechanical reactions are separated by the electrical elements alone: the model's modal or Rayleigh damping acts on the electrical side too and is not in the port currents");

        var transmissibilities = ImmutableArray.CreateBuilder<Transmissibility>();
        var moving = loading.SupportMotion.Select(m => m.Support).Distinct().ToArray();
        // Reactions of a plane or 3d model lie in several directions: their sum is no transmissibility.
        if (moving.Length == 0 && loading.AppliedForces.Count > 0 && !spatial)
        {
            var ratio = new double[nf];
            for (var k = 0; k < nf; k++)
            {
                HarmonicLoading.Powers(2 * Math.PI * frequenciesHz[k], powers);
                var applied = Complex.Zero;
                foreach (var (a, q) in loading.AppliedForces) applied += a * powers[q - HarmonicLoading.MinPower];
                ratio[k] = applied.Magnitude > 0 ? total[k].Magnitude / applied.Magnitude : double.NaN;
            }
            transmissibilities.Add(new Transmissibility("force", null, "applied forces", [.. ratio]));
        }
        else if (moving.Length == 1)
        {
            var s = moving[0];
            foreach (var r in responses)
                transmissibilities.Add(new Transmissibility("motion", r.Dof, p.Supports[s],
                    [.. Enumerable.Range(0, nf).Select(k => u[k * p.SupportCount + s].Magnitude is var um and > 0 ? r.Displacement[k].Magnitude / um : double.NaN)]));
        }

        return new HarmonicResult([.. frequenciesHz], method, used, [.. loads.Select(l => l.Name)], responses,
            forces.ToImmutable(), reactions.ToImmutable(), transmissibilities.ToImmutable(), [], notes.ToImmutable())
        {
            Warnings = warnings.ToImmutable(),
            MountForces = mountForces,
            TransducerPorts = portResponses,
            SourceCurrents = sourceCurrents.ToImmutable(),
        };
    }

    private static Complex ElementFactor(int derivative, Complex iw, Complex hysteretic) =>
        derivative switch { 0 => hysteretic, 1 => iw, _ => iw * iw };

    /// <summary>The outputs when none are named: every mass (line models) or every DOF label (plane and 3d models).</summary>
    private static ImmutableArray<string> DefaultOutputs(DampedSystem system)
    {
        var network = system.Model.Network;
        if (network.Space == ModelSpace.Line) return [.. network.Masses.Select(m => m.Name).Where(m => system.Partition.Free.IndexOf(m) >= 0)]; // nodes a transducer eliminates have no DOF
        var free = system.Partition.Free;
        return [.. Enumerable.Range(0, free.Count).Select(free.Label)];
    }

    /// <summary>
    /// Per element row of a plane or 3d model, the force it applies to its end B: k(1+iη)Δ or iωcΔ, with
    /// Δ = (observed free part) + Σ c·u over the moving supports' columns; an axial row also resolved into x, y, z.
    /// </summary>
    private static ImmutableArray<MountForce> MountForces(ModelSpace space, ImmutableArray<MountRow> rows, int[] observation,
        IReadOnlyList<double> frequenciesHz, Complex[] x, int nk, Complex[] u, int supportCount, Complex hysteretic)
    {
        var result = ImmutableArray.CreateBuilder<MountForce>();
        var nf = frequenciesHz.Count;
        for (var r = 0; r < rows.Length; r++)
        {
            var row = rows[r];
            var force = new Complex[nf];
            for (var k = 0; k < nf; k++)
            {
                var delta = observation[r] >= 0 ? x[k * nk + observation[r]] : Complex.Zero;
                foreach (var (c, w) in row.Prescribed) delta += w * u[k * supportCount + c];
                force[k] = row.IsDamper
                    ? new Complex(0, 2 * Math.PI * frequenciesHz[k] * row.Value) * delta
                    : row.Value * hysteretic * delta;
            }
            var kind = row.IsDamper ? ElementKind.Damper : ElementKind.Spring;
            foreach (var (label, factor) in SpatialLoads.Resolved(row, space))
                result.Add(new MountForce(row.Element, kind, label, row.IsMoment ? "N*m" : "N", [.. force.Select(f => factor * f)]));
        }
        return result.ToImmutable();
    }

    /// <summary>Above this relative difference from a direct solve a truncated modal sweep is warned (2 %).</summary>
    public const double TruncationTolerance = 0.02;

    /// <summary>Largest model whose truncated modal sweep is checked against a dense direct solve (O(n³) per point).</summary>
    public const int TruncationCheckMaxDofs = 300;

    /// <summary>How many frequencies of a truncated modal sweep are checked against the direct solve.</summary>
    private const int TruncationCheckPoints = 12;

    /// <summary>Relative distance from a natural frequency within which an undamped response is warned (1 %).</summary>
    public const double UndampedResonanceBand = 0.01;

    /// <summary>One warning per elastic mode whose natural frequency lies within <see cref="UndampedResonanceBand"/> of a computed point of an undamped model.</summary>
    private static IEnumerable<string> UndampedResonanceWarnings(DampedSystem system, IReadOnlyList<double> frequenciesHz,
        Complex[] x, int nk, int[] outputSlots)
    {
        foreach (var mode in system.Modes.Modes.Where(m => !m.IsRigidBody && m.NaturalFrequencyHz > 0))
        {
            var fn = mode.NaturalFrequencyHz;
            var nearest = -1;
            for (var k = 0; k < frequenciesHz.Count; k++)
                if (nearest < 0 || Math.Abs(frequenciesHz[k] - fn) < Math.Abs(frequenciesHz[nearest] - fn)) nearest = k;
            if (nearest < 0) yield break;
            var distance = Math.Abs(frequenciesHz[nearest] / fn - 1);
            if (distance > UndampedResonanceBand) continue;
            var amplitude = outputSlots.Length == 0 ? 0 : outputSlots.Max(s => x[nearest * nk + s].Magnitude);
            yield return string.Create(CultureInfo.InvariantCulture,
                $"the model has no damping and {frequenciesHz[nearest]:G6} Hz lies {100 * distance:G2} % from the natural frequency of mode {mode.Number} ({fn:G6} Hz): the displacement there ({amplitude:G3} m at the largest output) is set by how close the point lies to resonance, not by the structure, and grows without bound at resonance; add damping (modal ratios, Rayleigh, a loss factor or dampers)");
        }
    }

    /// <summary>
    /// The largest relative difference between the modal result <paramref name="x"/> and a dense direct solve, over a
    /// few frequencies where it matters most: the points nearest the natural frequencies of the modes left out, then the
    /// local maxima of each output (largest first) or, for a short list such as an operating point, every frequency.
    /// Relative to the largest output displacement at that frequency.
    /// </summary>
    private static (double Error, double AtHz, int Output, int Count) TruncationError(DampedSystem system, HarmonicLoading loading,
        double[][] observations, IReadOnlyList<double> frequenciesHz, Complex[] x, int nk, int[] outputSlots, int used)
    {
        var nf = frequenciesHz.Count;
        var chosen = new SortedSet<int>();
        if (nf <= TruncationCheckPoints) chosen.UnionWith(Enumerable.Range(0, nf));
        else
        {
            // A truncated mode's resonance is missing from the modal result altogether, so the points nearest the natural
            // frequencies of the modes left out come first; then the modal result's own peaks, largest first.
            var (lo, hi) = (frequenciesHz.Min(), frequenciesHz.Max());
            foreach (var mode in system.Modes.Modes.Skip(used).Where(m => m.NaturalFrequencyHz >= lo && m.NaturalFrequencyHz <= hi))
            {
                if (chosen.Count == TruncationCheckPoints / 2) break;
                var nearest = 0;
                for (var k = 1; k < nf; k++)
                    if (Math.Abs(frequenciesHz[k] - mode.NaturalFrequencyHz) < Math.Abs(frequenciesHz[nearest] - mode.NaturalFrequencyHz)) nearest = k;
                chosen.Add(nearest);
            }
            var candidates = new List<(double Magnitude, int K)>();
            foreach (var s in outputSlots)
                for (var k = 0; k < nf; k++)
                {
                    var v = x[k * nk + s].Magnitude;
                    var left = k > 0 ? x[(k - 1) * nk + s].Magnitude : double.NegativeInfinity;
                    var right = k < nf - 1 ? x[(k + 1) * nk + s].Magnitude : double.NegativeInfinity;
                    if (v >= left && v >= right) candidates.Add((v, k));
                }
            foreach (var (_, k) in candidates.OrderByDescending(c => c.Magnitude))
            {
                if (chosen.Count == TruncationCheckPoints) break;
                chosen.Add(k);
            }
        }

        var engine = new DenseEngine(system, loading, observations);
        var workspace = engine.CreateWorkspace();
        var coefficients = new Complex[loading.Terms.Count];
        var powers = new Complex[HarmonicLoading.MaxPower - HarmonicLoading.MinPower + 1];
        var y = new Complex[nk];
        var worst = (Error: 0.0, AtHz: double.NaN, Output: 0, Count: chosen.Count);
        foreach (var k in chosen)
        {
            var omega = 2 * Math.PI * frequenciesHz[k];
            HarmonicLoading.Powers(omega, powers);
            for (var r = 0; r < coefficients.Length; r++) coefficients[r] = powers[loading.Terms[r].Power - HarmonicLoading.MinPower];
            if (!engine.Solve(omega, coefficients, y, workspace)) continue;
            var scale = outputSlots.Max(s => y[s].Magnitude);
            if (!(scale > 0)) continue;
            for (var o = 0; o < outputSlots.Length; o++)
            {
                var error = (x[k * nk + outputSlots[o]] - y[outputSlots[o]]).Magnitude / scale;
                if (error > worst.Error) worst = (error, frequenciesHz[k], o, chosen.Count);
            }
        }
        return worst;
    }

    /// <summary>The largest |X| of one mass over a band, cheaply: for optimisers that call it many times.</summary>
    /// <remarks>
    /// Sweeps <paramref name="points"/> points (refined around the natural frequencies in the band) by the direct
    /// method at that single DOF, then narrows the bracket of every local maximum by golden-section search
    /// (Kiefer 1953) to a relative width of 1e-7 and returns the largest. When the largest sample is an end of the band
    /// the result is flagged (<see cref="ResponsePeak.RisingAt"/>, with the end value in <see cref="ResponsePeak.EdgeMagnitude"/>). Cost: one Hessenberg reduction of the 2n state matrix plus O(n²) per point; above 300 DOFs with sparse C, one sparse complex LDLᵀ per point on one ordering.
    /// </remarks>
    /// <param name="system">The assembled model.</param>
    /// <param name="loads">Loads acting together.</param>
    /// <param name="dof">The mass whose displacement amplitude is maximised.</param>
    /// <param name="fromHz">Band start in Hz.</param>
    /// <param name="toHz">Band end in Hz.</param>
    /// <param name="points">Coarse points in the band (at least 2).</param>
    /// <param name="quantity">Displacement, velocity or acceleration.</param>
    public static ResponsePeak PeakResponse(DampedSystem system, IReadOnlyList<Load> loads, string dof, double fromHz, double toHz,
        int points = 200, ResponseQuantity quantity = ResponseQuantity.Displacement) =>
        PeakResponseOf(system, loads, dof, Observation(system, dof), fromHz, toHz, points, quantity);

    /// <summary><see cref="PeakResponse(DampedSystem, IReadOnlyList{Load}, string, double, double, int, ResponseQuantity)"/> of a combination of DOFs: the response is observation·x, named <paramref name="label"/>.</summary>
    internal static ResponsePeak PeakResponseOf(DampedSystem system, IReadOnlyList<Load> loads, string label, double[] observation, double fromHz, double toHz,
        int points = 200, ResponseQuantity quantity = ResponseQuantity.Displacement)
    {
        var band = BandPeaksOf(system, loads, label, observation, fromHz, toHz, points, quantity);
        if (band.Unbounded is { } unbounded) return unbounded;
        var best = band.Peaks.IsEmpty ? null : band.Peaks.MaxBy(p => p.Magnitude);
        var sampled = band.Sampled;
        if (best is null) return sampled;
        if (sampled.RisingAt == SweepEdge.None || sampled.EdgeMagnitude <= best.Magnitude) return best;
        return best with { RisingAt = sampled.RisingAt, EdgeMagnitude = sampled.EdgeMagnitude };
    }

    /// <summary>Every peak of one mass's response inside a band, refined, with the band's end values: what <see cref="PeakResponse"/> chooses from.</summary>
    /// <returns>The refined interior peaks in ascending frequency, the peak of the samples with its edge flag, the values at both ends, and the sample where the response is unbounded (else null).</returns>
    public static BandPeakSearch BandPeaks(DampedSystem system, IReadOnlyList<Load> loads, string dof, double fromHz, double toHz,
        int points = 200, ResponseQuantity quantity = ResponseQuantity.Displacement) =>
        BandPeaksOf(system, loads, dof, Observation(system, dof), fromHz, toHz, points, quantity);

    private static double[] Observation(DampedSystem system, string dof)
    {
        ArgumentNullException.ThrowIfNull(system);
        var index = system.Model.Network.Space == ModelSpace.Line ? system.Partition.Free.IndexOf(dof) : system.Partition.Free.IndexOfLabel(dof);
        if (index < 0) throw new ArgumentException($"'{dof}' is not a mass of the network.", nameof(dof));
        var unitRow = new double[system.Partition.FreeCount];
        unitRow[index] = 1;
        return unitRow;
    }

    /// <summary><see cref="BandPeaks(DampedSystem, IReadOnlyList{Load}, string, double, double, int, ResponseQuantity)"/> of a combination of DOFs: the response is observation·x over the free DOFs, named <paramref name="dof"/>.</summary>
    internal static BandPeakSearch BandPeaksOf(DampedSystem system, IReadOnlyList<Load> loads, string dof, double[] observation, double fromHz, double toHz,
        int points = 200, ResponseQuantity quantity = ResponseQuantity.Displacement)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(loads);
        ArgumentNullException.ThrowIfNull(observation);
        if (observation.Length != system.Partition.FreeCount)
            throw new ArgumentException($"The observation has {observation.Length} entries for {system.Partition.FreeCount} free DOFs.", nameof(observation));
        var frequencies = FrequencyGrid.Build(new FrequencyRange(fromHz, toHz, points, FrequencySpacing.Linear), true,
            [.. system.Modes.Modes.Select(m => m.NaturalFrequencyHz)], system.ModalDampingRatios);
        var loading = HarmonicLoading.Compile(system, loads);
        var engine = DirectEngines.Create(system, loading, [observation]);
        var ws = engine.CreateWorkspace();
        var coefficients = new Complex[loading.Terms.Count];
        var powers = new Complex[HarmonicLoading.MaxPower - HarmonicLoading.MinPower + 1];
        var x = new Complex[1];
        double Magnitude(double f)
        {
            var omega = 2 * Math.PI * f;
            HarmonicLoading.Powers(omega, powers);
            for (var r = 0; r < coefficients.Length; r++) coefficients[r] = powers[loading.Terms[r].Power - HarmonicLoading.MinPower];
            if (!engine.Solve(omega, coefficients, x, ws)) return double.PositiveInfinity;
            return x[0].Magnitude * Math.Pow(omega, (int)quantity);
        }
        var values = frequencies.Select(Magnitude).ToArray();
        var worst = Array.IndexOf(values, values.Max());
        var sampled = ResponsePeak.Of(dof, quantity, frequencies, values);
        var start = new ResponsePeak(dof, quantity, values[0], frequencies[0]);
        var end = new ResponsePeak(dof, quantity, values[^1], frequencies[^1]);
        if (double.IsPositiveInfinity(values[worst]))
            return new BandPeakSearch([], sampled, start, end, new ResponsePeak(dof, quantity, values[worst], frequencies[worst]));

        // A tuned absorber leaves two nearly equal peaks; refining only the highest sample would let an optimiser
        // trade a sampled peak for an unsampled one, so every interior local maximum is refined. The ends of the band
        // are never a peak: when the largest value sits there the result says so (ResponsePeak.RisingAt).
        var peaks = ImmutableArray.CreateBuilder<ResponsePeak>();
        for (var i = 1; i < values.Length - 1; i++)
        {
            if (!(values[i] >= values[i - 1] && values[i] >= values[i + 1])) continue;
            var (f, v) = GoldenSectionMaximum(Magnitude, frequencies[i - 1], frequencies[i + 1]);
            peaks.Add(new ResponsePeak(dof, quantity, v, f));
        }
        return new BandPeakSearch(peaks.ToImmutable(), sampled, start, end, null);
    }

    /// <summary>The complex responses observation·x at one frequency to <paramref name="loads"/> by the direct method; null where the dynamic stiffness is singular (an undamped resonance).</summary>
    /// <param name="system">The assembled model.</param>
    /// <param name="frequencyHz">The frequency in Hz, positive.</param>
    /// <param name="loads">Loads acting together.</param>
    /// <param name="observations">Rows over the free DOFs; one response each.</param>
    internal static Complex[]? Observe(DampedSystem system, double frequencyHz, IReadOnlyList<Load> loads, double[][] observations) =>
        Observe(system, [frequencyHz], loads, observations)[0];

    /// <summary>The same at each of <paramref name="frequenciesHz"/>, on one engine (the direct method's reduction is done once).</summary>
    internal static Complex[]?[] Observe(DampedSystem system, IReadOnlyList<double> frequenciesHz, IReadOnlyList<Load> loads, double[][] observations)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(frequenciesHz);
        ArgumentNullException.ThrowIfNull(loads);
        ArgumentNullException.ThrowIfNull(observations);
        foreach (var f in frequenciesHz) Guard.Positive(f, "frequency");
        var loading = HarmonicLoading.Compile(system, loads);
        var engine = DirectEngines.Create(system, loading, observations);
        var workspace = engine.CreateWorkspace();
        var powers = new Complex[HarmonicLoading.MaxPower - HarmonicLoading.MinPower + 1];
        var coefficients = new Complex[loading.Terms.Count];
        var results = new Complex[]?[frequenciesHz.Count];
        for (var k = 0; k < results.Length; k++)
        {
            var omega = 2 * Math.PI * frequenciesHz[k];
            HarmonicLoading.Powers(omega, powers);
            for (var r = 0; r < coefficients.Length; r++) coefficients[r] = powers[loading.Terms[r].Power - HarmonicLoading.MinPower];
            var x = new Complex[observations.Length];
            results[k] = engine.Solve(omega, coefficients, x, workspace) ? x : null;
        }
        return results;
    }

    /// <summary>Maximum of a unimodal function on [lo, hi] by golden-section search (Kiefer 1953) to a relative width of 1e-7.</summary>
    private static (double At, double Value) GoldenSectionMaximum(Func<double, double> function, double lo, double hi)
    {
        var ratio = (Math.Sqrt(5) - 1) / 2;
        double c = hi - ratio * (hi - lo), d = lo + ratio * (hi - lo), fc = function(c), fd = function(d);
        while (hi - lo > 1e-7 * hi)
        {
            if (fc > fd) { hi = d; d = c; fd = fc; c = hi - ratio * (hi - lo); fc = function(c); }
            else { lo = c; c = d; fc = fd; d = lo + ratio * (hi - lo); fd = function(d); }
        }
        var at = (lo + hi) / 2;
        return (at, function(at));
    }

    private static ImmutableArray<Load> ResolveLoads(StructuralModel model, ImmutableArray<string> names)
    {
        if (names.IsDefaultOrEmpty) return model.Loads;
        return [.. names.Select(n => model.FindLoad(n) ?? throw new ArgumentException($"The model has no load named '{n}'.", nameof(names)))];
    }
}
