using System.Collections.Immutable;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Absorbers;

/// <summary>Judges an absorber on the full network (all modes, the model's own damping) and refines its tuning numerically.</summary>
/// <remarks>
/// The measure is the host's dynamic amplification |x_host|·K/|F| for a harmonic force F at the host, with K = M ω_p²
/// the modal stiffness of the controlled mode (M its modal mass at the host), so that for a one-mass primary it is
/// the classical |X₁|k/F of Den Hartog (1956). Peaks are searched over 0.5–1.5 f_p by a refined sweep whose every local
/// maximum is refined by golden-section search, and each is attributed to a mode of the model without the absorber by
/// mode shape (<see cref="Owner"/>): the peak reported is the controlled mode's, the other modes' peaks are listed apart,
/// and an end of the band where the controlled mode's response is larger than its peak is flagged, not taken as the peak.
/// The band-optimal tuning minimises that peak over the absorber's frequency and damping ratio (its mass is fixed by
/// μ), by the Nelder–Mead simplex method (Nelder &amp; Mead 1965) on (ln f_a, ln ζ_a) from the closed form. The
/// running-speed tuning minimises the worst amplification over every excitation frequency f_e ± t·f_e (t the speed
/// tolerance; at t = 0 the values at f_e), from the undamped absorber tuned to the speed (Den Hartog 1956 §3.2), the
/// closed form and a simplex search on (ln f_a, √ζ_a), keeping the best: never worse on that measure than the closed form.
/// </remarks>
public static class AbsorberPerformance
{
    /// <summary>Frequency errors of the mistuning table: ±5 % and ±10 %.</summary>
    public static readonly ImmutableArray<double> MistuningErrors = [-0.10, -0.05, 0.05, 0.10];

    private const int BandPoints = 240;
    private const int SpeedBandPoints = 40;

    /// <summary>The band searched for peaks around the controlled mode, Hz: 0.5–1.5 f_p.</summary>
    public static (double Low, double High) Band(AbsorberDesign design)
    {
        ArgumentNullException.ThrowIfNull(design);
        return (0.5 * design.ModeFrequencyHz, 1.5 * design.ModeFrequencyHz);
    }

    /// <summary>Other modes of the model whose natural frequency lies within 0.5–1.5 f_p (distinct from f_p), by number.</summary>
    public static ImmutableArray<int> ModesInClassicalBand(AbsorberDesign design)
    {
        ArgumentNullException.ThrowIfNull(design);
        var f = design.ModelFrequenciesHz;
        return [.. Enumerable.Range(1, f.Length).Where(n => n != design.ModeNumber && f[n - 1] > 0
            && f[n - 1] >= 0.5 * design.ModeFrequencyHz && f[n - 1] <= 1.5 * design.ModeFrequencyHz && !Same(f[n - 1], design.ModeFrequencyHz))];
    }

    /// <summary>The mode of the model without the absorber whose natural frequency is nearest (in ratio) to <paramref name="frequencyHz"/>: where an absorber's frequency sits.</summary>
    public static int ModeOf(AbsorberDesign design, double frequencyHz)
    {
        ArgumentNullException.ThrowIfNull(design);
        var f = design.ModelFrequenciesHz;
        if (f.IsDefaultOrEmpty || !(frequencyHz > 0)) return design.ModeNumber;
        var best = design.ModeNumber;
        var distance = double.PositiveInfinity;
        for (var n = 1; n <= f.Length; n++)
        {
            if (!(f[n - 1] > 0)) continue;
            var d = Math.Abs(Math.Log(frequencyHz / f[n - 1]));
            // Modes of one frequency share a band: keep the controlled one.
            if (d < distance - 1e-12 || (Math.Abs(d - distance) <= 1e-12 && n == design.ModeNumber)) { distance = d; best = n; }
        }
        return best;
    }

    /// <summary>Worst amplification of the host in the controlled mode's band for <paramref name="model"/> (with or without an absorber).</summary>
    /// <returns>The amplification and its frequency in Hz; +∞ when the response is unbounded (an undamped resonance in the band).</returns>
    public static (double Peak, double FrequencyHz) WorstPeak(StructuralModel model, AbsorberDesign design)
    {
        var p = BandPeak(model, design);
        return (p.Magnitude, p.FrequencyHz);
    }

    /// <summary>The host's amplification peak belonging to the controlled mode in the band, with the edge flag (<see cref="ResponsePeak.RisingAt"/>), magnitudes scaled to the amplification measure.</summary>
    /// <remarks>
    /// Peaks that belong to other modes (<see cref="Owner"/>) are left out. <see cref="ResponsePeak.RisingAt"/> is set
    /// when an end of the band that belongs to the controlled mode holds a larger value: a peak of the mode lies beyond the band.
    /// When no peak inside the band belongs to the controlled mode, the largest value of the band is returned, flagged as for a sweep.
    /// </remarks>
    public static ResponsePeak BandPeak(StructuralModel model, AbsorberDesign design)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(design);
        return Look(DampedSystem.Build(model), design).Controlled;
    }

    /// <summary>
    /// The mode of the model without the absorber that a response at <paramref name="frequencyHz"/> of <paramref name="system"/> belongs to:
    /// the natural frequency of <paramref name="system"/> nearest in ratio gives a mode shape, and its modal assurance criterion
    /// (Allemang &amp; Brown 1982) over the model's own masses with each mode of the model without the absorber picks the one it matches best.
    /// </summary>
    /// <remarks>With the absorber, the controlled mode splits into two modes whose shapes over the model's masses both match it; a neighbouring mode keeps its own shape.</remarks>
    public static int Owner(DampedSystem system, AbsorberDesign design, double frequencyHz)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(design);
        var nearest = system.Modes.Modes.Where(m => !m.IsRigidBody && m.NaturalFrequencyHz > 0)
            .MinBy(m => Math.Abs(Math.Log(frequencyHz / m.NaturalFrequencyHz)));
        if (nearest is null || design.ModelShapes.IsDefaultOrEmpty) return ModeOf(design, frequencyHz);
        var free = system.Partition.Free.Dofs;
        var phi = design.ModelDofs.Select(d => free.IndexOf(d) is var i and >= 0 ? nearest.Shape[i] : 0).ToArray();
        var best = design.ModeNumber;
        var bestMac = -1.0;
        for (var n = 1; n <= design.ModelShapes.Length; n++)
        {
            if (!(design.ModelFrequenciesHz[n - 1] > 0)) continue;
            var mac = Mac(phi, design.ModelShapes[n - 1]);
            if (mac > bestMac + 1e-12 || (Math.Abs(mac - bestMac) <= 1e-12 && n == design.ModeNumber)) { bestMac = mac; best = n; }
        }
        return best;
    }

    private static double Mac(IReadOnlyList<double> a, IReadOnlyList<double> b)
    {
        double ab = 0, aa = 0, bb = 0;
        for (var i = 0; i < a.Count; i++) { ab += a[i] * b[i]; aa += a[i] * a[i]; bb += b[i] * b[i]; }
        return aa > 0 && bb > 0 ? ab * ab / (aa * bb) : 0;
    }

    // The controlled mode's peak and the largest peak of every other mode in the band.
    private static (ResponsePeak Controlled, Dictionary<int, double> Others) Look(DampedSystem system, AbsorberDesign design)
    {
        var (lo, hi) = Band(design);
        var k = ModalStiffness(design);
        ResponsePeak Scaled(ResponsePeak p) => p with { Magnitude = p.Magnitude * k, EdgeMagnitude = p.EdgeMagnitude * k };
        var search = HarmonicAnalysis.BandPeaksOf(system, [UnitForce(system, design)], design.Host, HostRow(system, design), lo, hi, BandPoints);
        var others = new Dictionary<int, double>();
        if (search.Unbounded is { } unbounded) return (Scaled(unbounded), others);
        ResponsePeak? controlled = null;
        foreach (var p in search.Peaks)
        {
            var owner = Owner(system, design, p.FrequencyHz);
            if (owner == design.ModeNumber) { if (controlled is null || p.Magnitude > controlled.Magnitude) controlled = p; }
            else others[owner] = Math.Max(others.GetValueOrDefault(owner), p.Magnitude * k);
        }
        if (controlled is null) return (Scaled(search.Sampled), others);
        foreach (var (edge, end) in new[] { (SweepEdge.Start, search.Start), (SweepEdge.End, search.End) })
        {
            var largest = controlled.RisingAt == SweepEdge.None ? controlled.Magnitude : controlled.EdgeMagnitude;
            if (end.Magnitude > largest && Owner(system, design, end.FrequencyHz) == design.ModeNumber)
                controlled = controlled with { RisingAt = edge, EdgeMagnitude = end.Magnitude };
        }
        return (Scaled(controlled), others);
    }

    /// <summary>
    /// The value a band design is judged by: the controlled mode's peak, or the value at an end of the band that
    /// belongs to the controlled mode when it is larger (a peak pushed out of the band counts).
    /// </summary>
    public static double DesignPeak(ResponsePeak bandPeak)
    {
        ArgumentNullException.ThrowIfNull(bandPeak);
        return bandPeak.LargestComputed;
    }

    /// <summary>The worst host amplification over every excitation frequency f_e ± t·f_e (at f_e alone when t = 0); NaN without excitations.</summary>
    public static double SpeedObjective(StructuralModel model, AbsorberDesign design)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(design);
        if (design.ExcitationsHz.IsDefaultOrEmpty) return double.NaN;
        var system = DampedSystem.Build(model);
        var worst = 0.0;
        foreach (var fe in design.ExcitationsHz)
        {
            var t = design.SpeedTolerance;
            var value = t > 0
                ? SafeLargest(system, design, fe * (1 - t), fe * (1 + t))
                : AmplificationAt(system, design, fe);
            worst = Math.Max(worst, value);
        }
        return worst;
    }

    /// <summary>The host amplification |x_host|·K/|F| of <paramref name="model"/> at one frequency; +∞ when the response is unbounded there.</summary>
    public static double AmplificationAt(StructuralModel model, AbsorberDesign design, double frequencyHz)
    {
        ArgumentNullException.ThrowIfNull(model);
        return AmplificationAt(DampedSystem.Build(model), design, frequencyHz);
    }

    private static double AmplificationAt(DampedSystem system, AbsorberDesign design, double frequencyHz)
    {
        ArgumentNullException.ThrowIfNull(design);
        try
        {
            var r = HarmonicAnalysis.Observe(system, frequencyHz, [UnitForce(system, design)], [HostRow(system, design)]);
            var x = r is null ? double.PositiveInfinity : r[0].Magnitude;
            return double.IsFinite(x) ? x * ModalStiffness(design) : double.PositiveInfinity;
        }
        catch (NumericalFailureException) { return double.PositiveInfinity; }
    }

    /// <summary>Peaks before and after, stroke at the worst frequency, the mistuning table, the response at the excitations and the neighbouring modes' peaks.</summary>
    /// <remarks>The peak before is +∞ when the controlled mode has no damping in the model (an unbounded resonance).</remarks>
    public static AbsorberAssessment Assess(StructuralModel model, AbsorberDesign design, AbsorberNames names)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(names);
        ArgumentNullException.ThrowIfNull(design);
        var before = SafePeak(model, design);
        var withAbsorber = With(model, design, names);
        var after = BandPeak(withAbsorber, design);
        var stroke = double.NaN;
        if (double.IsFinite(after.Magnitude))
        {
            var system = DampedSystem.Build(withAbsorber);
            var response = HarmonicAnalysis.Observe(system, after.FrequencyHz, [UnitForce(system, design)], [HostRow(system, design), AbsorberRow(system, design, names)]);
            if (response is not null) stroke = (response[1] - response[0]).Magnitude;
        }
        var mistuning = MistuningErrors.Select(e =>
        {
            var detuned = With(model, design.Retuned(design.FrequencyHz * (1 + e), design.DampingRatio), names);
            return new MistuningPoint(e, BandPeak(detuned, design).Magnitude) { AtSpeeds = WorstAtSpeeds(detuned, design) };
        });
        var atSpeeds = design.ExcitationsHz.Select(fe => new SpeedResponse(fe, AmplificationAt(model, design, fe), AmplificationAt(withAbsorber, design, fe)));
        var lookBefore = SafeLook(model, design);
        var lookAfter = Look(DampedSystem.Build(withAbsorber), design);
        var neighbours = ModesInClassicalBand(design).Select(n => new NeighbourMode(n, design.ModelFrequenciesHz[n - 1],
            lookBefore.GetValueOrDefault(n, double.NaN), lookAfter.Others.GetValueOrDefault(n, double.NaN)));
        return new AbsorberAssessment(Band(design), before.Magnitude, after.Magnitude, after.FrequencyHz, stroke, [.. mistuning])
        {
            PeakAfterMode = Owner(DampedSystem.Build(withAbsorber), design, after.FrequencyHz),
            PeakBeforeRisingAt = before.RisingAt,
            PeakAfterRisingAt = after.RisingAt,
            AtSpeeds = [.. atSpeeds],
            Neighbours = [.. neighbours],
        };
    }

    /// <summary>The absorber frequency and damping ratio that minimise the worst host peak in the controlled mode's band, from <paramref name="start"/>.</summary>
    /// <returns>The refined design and the number of response evaluations used.</returns>
    public static (AbsorberDesign Design, int Evaluations) Optimise(StructuralModel model, AbsorberDesign start, AbsorberNames names)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(start);
        ArgumentNullException.ThrowIfNull(names);
        var evaluations = 0;
        double Objective(double[] p)
        {
            evaluations++;
            var d = start.Retuned(start.FrequencyHz * Math.Exp(p[0]), start.DampingRatio * Math.Exp(p[1]));
            var peak = DesignPeak(BandPeak(With(model, d, names), start));
            return double.IsFinite(peak) ? peak : double.MaxValue;
        }
        var best = NelderMead(Objective, [0, 0], [0.02, 0.2], relativeTolerance: 1e-9, maxEvaluations: 400);
        var design = start.Retuned(start.FrequencyHz * Math.Exp(best[0]), start.DampingRatio * Math.Exp(best[1]));
        return (design, evaluations);
    }

    /// <summary>
    /// The absorber frequency and damping ratio that minimise <see cref="SpeedObjective"/>: the best of the undamped
    /// absorber tuned to each excitation, <paramref name="closedForm"/>, and a simplex search from the better of them.
    /// </summary>
    /// <param name="model">The model without the absorber.</param>
    /// <param name="start">A design whose mass, host, mode and excitations are kept (its tuning is replaced).</param>
    /// <param name="closedForm">A classical design to beat (Den Hartog's); the result is never worse than it on the objective.</param>
    /// <param name="names">The absorber's element names.</param>
    /// <returns>The design, its objective value and the number of response evaluations used.</returns>
    public static (AbsorberDesign Design, double Objective, int Evaluations) OptimiseForSpeed(
        StructuralModel model, AbsorberDesign start, AbsorberDesign closedForm, AbsorberNames names)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(start);
        ArgumentNullException.ThrowIfNull(closedForm);
        ArgumentNullException.ThrowIfNull(names);
        if (start.ExcitationsHz.IsDefaultOrEmpty) throw new ArgumentException("The running-speed tuning needs excitation frequencies.", nameof(start));
        var evaluations = 0;
        double Of(AbsorberDesign d)
        {
            evaluations++;
            var v = SpeedObjective(With(model, d, names), start);
            return double.IsFinite(v) ? v : double.MaxValue;
        }
        var candidates = start.ExcitationsHz.Select(fe => start.Retuned(fe, 0))
            .Append(start.Retuned(closedForm.FrequencyHz, closedForm.DampingRatio)).ToList();
        var scored = candidates.Select(d => (Design: d, Value: Of(d))).ToList();
        var seed = scored.MinBy(c => c.Value);
        // One speed and no tolerance: the undamped absorber at the speed is exact (the host does not move), nothing to search.
        var exact = start.SpeedTolerance == 0 && start.ExcitationsHz.Length == 1;
        if (seed.Value > 0 && !exact)
        {
            var f0 = seed.Design.FrequencyHz;
            var s0 = Math.Sqrt(seed.Design.DampingRatio);
            AbsorberDesign FromPoint(double[] p) => start.Retuned(f0 * Math.Exp(p[0]), p[1] * p[1]);
            var best = NelderMead(p => Of(FromPoint(p)), [0, s0], [0.02, 0.1], relativeTolerance: 1e-9, maxEvaluations: 300);
            var refined = FromPoint(best);
            scored.Add((refined, Of(refined)));
        }
        var chosen = scored.MinBy(c => c.Value);
        return (chosen.Design, chosen.Value, evaluations);
    }

    /// <summary>The absorber's stroke (peak relative displacement to the host, m) under the model's own loads at their running speeds (a model without load cases).</summary>
    /// <remarks>Loads are grouped by speed as for vibration limits; strokes at distinct speeds add as a peak bound Σ|X_a − X_h|. NaN when no load has a speed.</remarks>
    public static double OperatingStroke(StructuralModel model, AbsorberDesign design, AbsorberNames names, IReadOnlyList<Load> loads)
    {
        ArgumentNullException.ThrowIfNull(loads);
        var groups = loads.Where(l => l.SpeedHz is > 0).GroupBy(l => l.SpeedHz!.Value).ToList();
        if (groups.Count == 0) return double.NaN;
        var system = DampedSystem.Build(With(model, design, names));
        var stroke = 0.0;
        foreach (var g in groups)
        {
            var r = HarmonicAnalysis.Observe(system, g.Key, [.. g], [HostRow(system, design), AbsorberRow(system, design, names)])
                ?? throw new NumericalFailureException(string.Create(System.Globalization.CultureInfo.InvariantCulture,
                    $"the dynamic stiffness with the absorber is singular at the running speed {g.Key:G6} Hz: an undamped natural frequency; add damping"));
            stroke += (r[1] - r[0]).Magnitude;
        }
        return stroke;
    }

    /// <summary>What the stroke in operation is computed under for a model without load cases.</summary>
    public const string LoadsBasis = "under the model's loads at their running speeds";

    /// <summary>What the stroke in operation is computed under for <paramref name="cases"/>, e.g. "under the load cases exhaust-fan, supply-fan, each on its own at its running speeds, combined by the sum rule".</summary>
    public static string CasesBasis(LoadCaseSelection cases)
    {
        ArgumentNullException.ThrowIfNull(cases);
        return $"under the load case{(cases.Cases.Length == 1 ? "" : "s")} {string.Join(", ", cases.Cases.Select(c => c.Name))}, each on its own at its running speeds, combined by the {LoadCaseSelection.Name(cases.Rule)} rule";
    }

    /// <summary>
    /// The absorber's stroke (m) under the model's load cases: each case on its own at its running speeds, the cases'
    /// components combined by the selection's rule as the vibration limits combine them (<see cref="Criteria.LoadCaseLimits"/>).
    /// </summary>
    /// <remarks>
    /// Within a case the loads running at one speed act together (complex sum) and give one component of the relative
    /// displacement, s_k = |X_a − X_h|; components of different cases (or speeds) are combined as amplitudes, Σ s_k by the
    /// sum rule (a bound of the peak stroke) or √(Σ s_k²) by the rms rule (<see cref="Harmonic.LoadCaseAnalysis.Combine"/>).
    /// Two cases running at the same speed are not added as complex amplitudes: their phases are unrelated. NaN when no
    /// case has a load with a speed.
    /// </remarks>
    public static double OperatingStroke(StructuralModel model, AbsorberDesign design, AbsorberNames names, LoadCaseSelection cases)
    {
        ArgumentNullException.ThrowIfNull(design);
        ArgumentNullException.ThrowIfNull(names);
        ArgumentNullException.ThrowIfNull(cases);
        var system = DampedSystem.Build(With(model, design, names));
        var components = LoadCaseAnalysis.Components(system, cases, [design.Host, names.Mass]);
        var host = components[design.Host];
        var mass = components[names.Mass];
        if (host.Count == 0) return double.NaN;
        return LoadCaseAnalysis.Combine(host.Zip(mass, (h, a) => (a.Displacement - h.Displacement).Magnitude), cases.Rule);
    }

    /// <summary><paramref name="model"/> with the absorber of <paramref name="design"/> attached.</summary>
    public static StructuralModel With(StructuralModel model, AbsorberDesign design, AbsorberNames names)
    {
        ArgumentNullException.ThrowIfNull(model);
        return model with { Network = AbsorberTuning.Attach(model.Network, design, names) };
    }

    private static ResponsePeak SafePeak(StructuralModel model, AbsorberDesign design)
    {
        // An undamped controlled mode has an unbounded resonance: say so rather than report the largest sampled value.
        var ratios = DampedSystem.Build(model).ModalDampingRatios;
        var ratio = design.ModeNumber <= ratios.Length ? ratios[design.ModeNumber - 1] : double.NaN;
        var unbounded = new ResponsePeak(design.Host, ResponseQuantity.Displacement, double.PositiveInfinity, design.ModeFrequencyHz);
        if (!(ratio > 0)) return unbounded;
        try { return BandPeak(model, design); }
        catch (NumericalFailureException) { return unbounded; }
    }

    private static ResponsePeak PeakIn(DampedSystem system, AbsorberDesign design, double lo, double hi, int points)
    {
        var peak = HarmonicAnalysis.PeakResponseOf(system, [UnitForce(system, design)], design.Host, HostRow(system, design), lo, hi, points);
        var k = ModalStiffness(design);
        return peak with { Magnitude = peak.Magnitude * k, EdgeMagnitude = peak.EdgeMagnitude * k };
    }

    // The largest value over [lo, hi], its ends included (or only the peak inside when peakOnly); +∞ when unbounded.
    private static double SafeLargest(DampedSystem system, AbsorberDesign design, double lo, double hi, bool peakOnly = false)
    {
        try
        {
            var p = PeakIn(system, design, lo, hi, SpeedBandPoints);
            return peakOnly ? p.Magnitude : p.LargestComputed;
        }
        catch (NumericalFailureException) { return double.PositiveInfinity; }
    }

    private static double WorstAtSpeeds(StructuralModel withAbsorber, AbsorberDesign design) =>
        design.ExcitationsHz.IsDefaultOrEmpty ? double.NaN : design.ExcitationsHz.Max(fe => AmplificationAt(withAbsorber, design, fe));

    private static Dictionary<int, double> SafeLook(StructuralModel model, AbsorberDesign design)
    {
        try { return Look(DampedSystem.Build(model), design).Others; }
        catch (NumericalFailureException) { return []; }
    }

    private static bool Same(double a, double b) => Math.Abs(a - b) <= 1e-6 * Math.Max(a, b);

    private static double ModalStiffness(AbsorberDesign d) => d.ModalMass * Math.Pow(2 * Math.PI * d.ModeFrequencyHz, 2);

    /// <summary>The host's amplification |x_host|·K/|F| at each of <paramref name="frequenciesHz"/> for a unit force at the host (NaN where the response is unbounded): the curve a report draws.</summary>
    /// <param name="model">The model, with or without the absorber.</param>
    /// <param name="design">The design whose host and modal stiffness are used.</param>
    /// <param name="frequenciesHz">Frequencies in Hz, positive.</param>
    public static double[] HostAmplification(StructuralModel model, AbsorberDesign design, IReadOnlyList<double> frequenciesHz)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(design);
        ArgumentNullException.ThrowIfNull(frequenciesHz);
        var system = DampedSystem.Build(model);
        var k = ModalStiffness(design);
        var loads = new Load[] { UnitForce(system, design) };
        double[][] rows = [HostRow(system, design)];
        return [.. HarmonicAnalysis.Observe(system, frequenciesHz, loads, rows).Select(x => x is not null && double.IsFinite(x[0].Magnitude) ? x[0].Magnitude * k : double.NaN)];
    }

    /// <summary>The point and direction of the design's host in <paramref name="network"/>.</summary>
    private static AbsorberHost HostOf(Network network, AbsorberDesign design) =>
        design.HostPoint ?? AbsorberHost.Resolve(network, design.Host, out var problem) ?? throw new ArgumentException(problem, nameof(design));

    // The host's motion over the free DOFs of this system (with or without the absorber, whose DOFs number differently).
    private static double[] HostRow(DampedSystem system, AbsorberDesign design) =>
        HostOf(system.Model.Network, design).Observation(system.Model.Network, system.Partition.Free);

    // The absorber mass's motion along the host's direction.
    private static double[] AbsorberRow(DampedSystem system, AbsorberDesign design, AbsorberNames names)
    {
        var host = HostOf(system.Model.Network, design);
        return (host with { Label = names.Mass, Reference = names.Mass }).Observation(system.Model.Network, system.Partition.Free);
    }

    private static ForceLoad UnitForce(DampedSystem system, AbsorberDesign design) => HostOf(system.Model.Network, design).UnitForce();

    /// <summary>Nelder–Mead simplex minimisation (Nelder &amp; Mead 1965) with the standard coefficients 1, 2, ½, ½.</summary>
    internal static double[] NelderMead(Func<double[], double> f, double[] start, double[] steps, double relativeTolerance, int maxEvaluations)
    {
        var n = start.Length;
        var simplex = new double[n + 1][];
        var values = new double[n + 1];
        simplex[0] = (double[])start.Clone();
        for (var i = 0; i < n; i++)
        {
            simplex[i + 1] = (double[])start.Clone();
            simplex[i + 1][i] += steps[i];
        }
        var used = 0;
        for (var i = 0; i <= n; i++) { values[i] = f(simplex[i]); used++; }
        while (used < maxEvaluations)
        {
            var order = Enumerable.Range(0, n + 1).OrderBy(i => values[i]).ToArray();
            simplex = [.. order.Select(i => simplex[i])];
            values = [.. order.Select(i => values[i])];
            if (Math.Abs(values[n] - values[0]) <= relativeTolerance * Math.Abs(values[0])
                && simplex.All(x => x.Zip(simplex[0]).All(p => Math.Abs(p.First - p.Second) < 1e-9))) break;
            var centroid = new double[n];
            for (var i = 0; i < n; i++) for (var j = 0; j < n; j++) centroid[j] += simplex[i][j] / n;
            double[] Along(double t) => [.. centroid.Select((c, j) => c + t * (simplex[n][j] - c))];
            var reflected = Along(-1);
            var fr = f(reflected); used++;
            if (fr < values[0])
            {
                var expanded = Along(-2);
                var fe = f(expanded); used++;
                if (fe < fr) { simplex[n] = expanded; values[n] = fe; }
                else { simplex[n] = reflected; values[n] = fr; }
            }
            else if (fr < values[n - 1]) { simplex[n] = reflected; values[n] = fr; }
            else
            {
                var contracted = fr < values[n] ? Along(-0.5) : Along(0.5);
                var fc = f(contracted); used++;
                if (fc < Math.Min(fr, values[n])) { simplex[n] = contracted; values[n] = fc; }
                else
                {
                    for (var i = 1; i <= n; i++)
                    {
                        simplex[i] = [.. simplex[i].Select((x, j) => simplex[0][j] + 0.5 * (x - simplex[0][j]))];
                        values[i] = f(simplex[i]); used++;
                    }
                }
            }
        }
        return simplex[Enumerable.Range(0, n + 1).MinBy(i => values[i])];
    }
}
