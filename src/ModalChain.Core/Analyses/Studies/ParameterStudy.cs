using System.Collections.Immutable;
using System.Globalization;
using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Studies;

/// <summary>How the study's values are spaced between its ends.</summary>
public enum StudySpacing
{
    /// <summary>Equal steps.</summary>
    Linear,
    /// <summary>Equal ratios (both ends must be positive).</summary>
    Geometric,
}

/// <summary>A criterion a study evaluates at every value: a name and a reserve that is ≥ 0 exactly when it passes.</summary>
/// <param name="Name">Name printed in results, e.g. "separation ±20 %".</param>
/// <param name="Reserve">The reserve (a fraction) of the criterion for a network and its modes; must be continuous in the parameter for thresholds to be exact.</param>
public sealed record StudyCriterion(string Name, Func<Network, ModalResult, double> Reserve)
{
    /// <summary>The vibration limit this criterion checks, when it is one; its response at a step is Value·(1 − reserve).</summary>
    public VibrationLimit? Limit { get; init; }

    /// <summary>The frequency-separation rule as a study criterion.</summary>
    public static StudyCriterion Separation(SeparationCriterion criterion)
    {
        ArgumentNullException.ThrowIfNull(criterion);
        criterion.Validated();
        var name = string.Create(CultureInfo.InvariantCulture, $"separation ±{criterion.Margin * 100:G4} %");
        return new StudyCriterion(name, (_, modal) =>
            SeparationCheck.GoverningReserve([.. modal.Modes.Select(m => m.NaturalFrequencyHz)], criterion, SeparationCheck.ExemptShares(modal, criterion.Exempt)));
    }
}

/// <summary>A parameter study: one numeric field varied over a range, modes re-solved and criteria evaluated at each value.</summary>
/// <param name="Parameter">The field varied.</param>
/// <param name="From">First value, SI.</param>
/// <param name="To">Last value, SI; different from <paramref name="From"/>.</param>
/// <param name="Steps">Number of values including both ends, at least 2.</param>
/// <param name="Spacing">Linear or geometric spacing.</param>
/// <param name="Criteria">Criteria to evaluate at each value and whose thresholds to find.</param>
/// <param name="ThresholdTolerance">Relative width (of the parameter value) at which the threshold search stops.</param>
public sealed record StudyRequest(
    ParameterPath Parameter, double From, double To, int Steps, StudySpacing Spacing,
    ImmutableArray<StudyCriterion> Criteria, double ThresholdTolerance = 1e-9)
{
    /// <summary>Problems with the request as sentences a user can act on; empty when it can run.</summary>
    public ImmutableArray<string> Problems()
    {
        var inv = CultureInfo.InvariantCulture;
        var p = ImmutableArray.CreateBuilder<string>();
        var range = Parameter.MinimumExcluded
            ? string.Create(inv, $"above {Parameter.Minimum:G3} up to {Parameter.Maximum:G3}, SI")
              + (Parameter.MasslessEnd is { } node ? $"; the inerter carries the massless node '{node}', which has no inertia without it" : "")
            : string.Create(inv, $"from {Parameter.Minimum:G3} to {Parameter.Maximum:G3}, SI");
        if (!Parameter.Admits(From)) p.Add(string.Create(inv, $"--from {From:G6} is not a valid value of {Parameter.Text} ({range})"));
        if (!Parameter.Admits(To)) p.Add(string.Create(inv, $"--to {To:G6} is not a valid value of {Parameter.Text} ({range})"));
        if (From == To) p.Add(string.Create(inv, $"--from and --to are both {From:G6}: a study needs a range"));
        if (Steps < 2) p.Add($"--steps must be at least 2 (got {Steps})");
        if (Steps > 100_000) p.Add($"--steps {Steps} is more than 100000; use fewer steps and let threshold bisection refine");
        if (Spacing == StudySpacing.Geometric && (From <= 0 || To <= 0)) p.Add("geometric spacing needs both ends positive");
        return p.ToImmutable();
    }

    /// <summary>The study's values, SI, from <see cref="From"/> to <see cref="To"/> inclusive.</summary>
    public ImmutableArray<double> Values()
    {
        var values = new double[Steps];
        for (var i = 0; i < Steps; i++)
        {
            var t = (double)i / (Steps - 1);
            values[i] = Spacing == StudySpacing.Geometric ? From * Math.Pow(To / From, t) : From + (To - From) * t;
        }
        values[^1] = To;
        return [.. values];
    }
}

/// <summary>The modes and criterion reserves at one value of a study.</summary>
/// <param name="Index">0-based step index.</param>
/// <param name="Value">The parameter's value, SI.</param>
/// <param name="FrequenciesHz">Natural frequencies in Hz in ascending order (mode numbers of this step).</param>
/// <param name="Reserves">One reserve per criterion of the request, in its order (≥ 0 passes).</param>
public sealed record StudyStep(int Index, double Value, ImmutableArray<double> FrequenciesHz, ImmutableArray<double> Reserves);

/// <summary>One mode followed through a study by shape likeness.</summary>
/// <param name="Identity">The mode's number at the first step; it keeps this identity at every step.</param>
/// <param name="FrequenciesHz">Its frequency at each step, Hz.</param>
/// <param name="ModeNumbers">Its ascending-frequency number at each step (changes when it crosses another mode).</param>
/// <param name="Mac">MAC of its shape with its shape at the previous step (1 at the first step).</param>
public sealed record TrackedMode(int Identity, ImmutableArray<double> FrequenciesHz, ImmutableArray<int> ModeNumbers, ImmutableArray<double> Mac)
{
    /// <summary>
    /// Plane and 3d models: the mode's motion at each step (bounce, sway, roll, ... or "coupled A + B", as the modes
    /// table names it); empty in line models.
    /// </summary>
    public ImmutableArray<string> Motions { get; init; } = [];

    /// <summary>The smallest step-to-step MAC: below about 0.8 the steps are too coarse to follow this mode with confidence (common practice).</summary>
    public double WorstMac => Mac.Min();
}

/// <summary>A value of the parameter at which a criterion changes from failing to passing or back.</summary>
/// <param name="Criterion">The criterion's name.</param>
/// <param name="Value">The threshold value, SI, found by a bracketed root search between two steps.</param>
/// <param name="PassesAbove">True when the criterion passes just above the threshold (it starts passing as the value rises).</param>
/// <param name="Bracket">The two step values between which it was found.</param>
public sealed record StudyThreshold(string Criterion, double Value, bool PassesAbove, (double Low, double High) Bracket);

/// <summary>The outcome of a parameter study.</summary>
/// <param name="Request">What was run.</param>
/// <param name="Steps">One entry per value, in order.</param>
/// <param name="Modes">Each mode tracked through the study, by identity.</param>
/// <param name="Thresholds">Every pass/fail change of every criterion, in order of criterion then value.</param>
public sealed record StudyResult(StudyRequest Request, ImmutableArray<StudyStep> Steps, ImmutableArray<TrackedMode> Modes, ImmutableArray<StudyThreshold> Thresholds);

/// <summary>Runs a <see cref="StudyRequest"/>: all steps in parallel, then mode tracking and threshold searches (also in parallel).</summary>
/// <remarks>
/// Each step re-solves K φ = ω² M φ for the network with the parameter set. Modes are followed from step to step by
/// the mass-weighted modal assurance criterion (Allemang &amp; Brown 1982). Where a criterion's pass state differs
/// between two neighbouring steps, the parameter value at which its reserve changes sign is found by a bracketed
/// root search (Illinois regula falsi with bisection steps) to <see cref="StudyRequest.ThresholdTolerance"/>; a change that happens and reverses between two steps is not seen.
/// Results do not depend on the number of threads: every step is stored at its index.
/// </remarks>
public static class ParameterStudy
{
    /// <summary>Runs the study on <paramref name="network"/>; <paramref name="progress"/> hears the number of finished steps (from any thread).</summary>
    public static StudyResult Run(Network network, StudyRequest request, IProgress<int>? progress = null, CancellationToken cancellation = default)
    {
        ArgumentNullException.ThrowIfNull(network);
        ArgumentNullException.ThrowIfNull(request);
        var problems = request.Problems();
        if (problems.Length > 0) throw new ArgumentException(string.Join("; ", problems), nameof(request));

        var values = request.Values();
        var modal = new ModalResult[values.Length];
        var reserves = new double[values.Length][];
        var done = 0;
        Parallel.For(0, values.Length, new ParallelOptions { CancellationToken = cancellation }, i =>
        {
            var net = request.Parameter.Apply(network, values[i]);
            var result = ModalAnalysis.Solve(net);
            modal[i] = result;
            reserves[i] = [.. request.Criteria.Select(c => c.Reserve(net, result))];
            progress?.Report(Interlocked.Increment(ref done));
        });

        var steps = values.Select((v, i) => new StudyStep(i, v,
            [.. modal[i].Modes.Select(m => m.NaturalFrequencyHz)], [.. reserves[i]])).ToImmutableArray();
        return new StudyResult(request, steps, Track(modal), Thresholds(network, request, values, reserves));
    }

    /// <summary>Follows every mode of the first step through the later steps.</summary>
    private static ImmutableArray<TrackedMode> Track(ModalResult[] steps)
    {
        var n = steps[0].Modes.Length;
        var count = steps.Length;
        var frequency = new double[n][];
        var number = new int[n][];
        var mac = new double[n][];
        for (var id = 0; id < n; id++)
        {
            frequency[id] = new double[count];
            number[id] = new int[count];
            mac[id] = new double[count];
            frequency[id][0] = steps[0].Modes[id].NaturalFrequencyHz;
            number[id][0] = id + 1;
            mac[id][0] = 1;
        }
        var current = Enumerable.Range(0, n).ToArray(); // identity → index in the step's sorted modes
        for (var s = 1; s < count; s++)
        {
            var before = steps[s - 1];
            var after = steps[s];
            var prevShapes = current.Select(j => (IReadOnlyList<double>)before.Modes[j].Shape).ToArray();
            var prevHz = current.Select(j => before.Modes[j].NaturalFrequencyHz).ToArray();
            var nextShapes = after.Modes.Select(m => (IReadOnlyList<double>)m.Shape).ToArray();
            var nextHz = after.Modes.Select(m => m.NaturalFrequencyHz).ToArray();
            // The later step's full M: a diagonal of masses in line models, and in plane and 3d models the bodies'
            // inertia too, so the MAC weighs rotations as kinetic energy does.
            var (map, values) = ModeTracking.Pair(prevShapes, prevHz, nextShapes, nextHz, after.Matrices.Mass);
            for (var id = 0; id < n; id++)
            {
                current[id] = map[id];
                frequency[id][s] = nextHz[map[id]];
                number[id][s] = map[id] + 1;
                mac[id][s] = values[id];
            }
        }
        var spatial = steps[0].Network.Space != ModelSpace.Line;
        ImmutableArray<string> Motions(int id) => spatial
            ? [.. Enumerable.Range(0, count).Select(s => steps[s].Modes[number[id][s] - 1].Motion ?? "")]
            : [];
        return [.. Enumerable.Range(0, n).Select(id => new TrackedMode(id + 1, [.. frequency[id]], [.. number[id]], [.. mac[id]]) { Motions = Motions(id) })];
    }

    private static ImmutableArray<StudyThreshold> Thresholds(Network network, StudyRequest request, ImmutableArray<double> values, double[][] reserves)
    {
        var brackets = new List<(int Criterion, int Step)>();
        for (var c = 0; c < request.Criteria.Length; c++)
            for (var i = 0; i + 1 < values.Length; i++)
                if (reserves[i][c] >= 0 != reserves[i + 1][c] >= 0) brackets.Add((c, i));

        // Brackets are independent root searches: run them in parallel, store each at its index.
        var found = new StudyThreshold[brackets.Count];
        Parallel.For(0, brackets.Count, k =>
        {
            var (c, i) = brackets[k];
            var criterion = request.Criteria[c];
            double Reserve(double v)
            {
                var net = request.Parameter.Apply(network, v);
                return criterion.Reserve(net, ModalAnalysis.Solve(net));
            }
            var value = Root(Reserve, values[i], values[i + 1], reserves[i][c], reserves[i + 1][c], request.ThresholdTolerance);
            var passesAbove = values[i + 1] > values[i] ? reserves[i + 1][c] >= 0 : reserves[i][c] >= 0;
            found[k] = new StudyThreshold(criterion.Name, value,
                passesAbove, (Math.Min(values[i], values[i + 1]), Math.Max(values[i], values[i + 1])));
        });
        return [.. found];
    }

    /// <summary>The value between <paramref name="a"/> and <paramref name="b"/> where the pass state (reserve ≥ 0) changes, to relative width <paramref name="tolerance"/>.</summary>
    /// <remarks>
    /// The Illinois variant of regula falsi (Dowell &amp; Jarratt 1971), which keeps a bracket and converges
    /// superlinearly on a smooth reserve; every third step is a bisection, and non-finite reserves fall back to
    /// bisection, so the bracket always shrinks. The pass state, not the reserve's value, decides which end moves.
    /// </remarks>
    internal static double Root(Func<double, double> reserve, double a, double b, double fa, double fb, double tolerance)
    {
        var passA = fa >= 0;
        var side = 0;
        for (var iteration = 0; iteration < 200; iteration++)
        {
            if (Math.Abs(b - a) <= tolerance * Math.Max(Math.Abs(a), Math.Abs(b))) break;
            var mid = 0.5 * (a + b);
            var x = mid;
            if (iteration % 3 != 2 && double.IsFinite(fa) && double.IsFinite(fb) && fa != fb)
            {
                var falsi = (a * fb - b * fa) / (fb - fa);
                if (falsi > Math.Min(a, b) && falsi < Math.Max(a, b)) x = falsi;
            }
            if (x == a || x == b) x = mid;
            if (x == a || x == b) break;
            var fx = reserve(x);
            if (fx >= 0 == passA)
            {
                a = x; fa = fx;
                if (side == -1) fb /= 2;
                side = -1;
            }
            else
            {
                b = x; fb = fx;
                if (side == 1) fa /= 2;
                side = 1;
            }
        }
        return 0.5 * (a + b);
    }
}

/// <summary>Study criteria that need the steady-state response at the operating points.</summary>
public static class OperatingPointCriteria
{
    /// <summary>A vibration limit as a study criterion: the structure's damping and loads stay, its network follows the study.</summary>
    /// <param name="limit">The limit.</param>
    /// <param name="structure">The model whose network the study varies.</param>
    /// <param name="loads">The loads whose running speeds are the operating points (models without load cases).</param>
    /// <param name="cases">The load cases, when the model has them: the limit is then followed on their combination by its rule, as <c>check</c> evaluates it.</param>
    public static StudyCriterion Limit(ModalChain.Core.Analyses.Criteria.VibrationLimit limit, StructuralModel structure, IReadOnlyList<Load> loads,
        ModalChain.Core.Analyses.Harmonic.LoadCaseSelection? cases = null)
    {
        ArgumentNullException.ThrowIfNull(limit);
        ArgumentNullException.ThrowIfNull(structure);
        ArgumentNullException.ThrowIfNull(loads);
        return new StudyCriterion("limit " + limit.Describe(), (network, _) =>
        {
            var system = ModalChain.Core.Assembly.DampedSystem.Build(structure with { Network = network });
            if (cases is null) return ModalChain.Core.Analyses.Criteria.OperatingPointLimits.WorstReserve(system, loads, [limit]);
            var outcome = ModalChain.Core.Analyses.Criteria.LoadCaseLimits.Evaluate(system, cases, [limit]);
            return outcome.NotEvaluated.IsEmpty ? outcome.Evaluated.Single().Reserve : double.NegativeInfinity;
        })
        { Limit = limit };
    }
}
