using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;

namespace ModalChain.Core.Solvers;

/// <summary>The lowest eigenpairs of a large sparse K φ = λ M φ by thick-restart shift-invert Lanczos, proved complete by a Sturm count.</summary>
/// <remarks>
/// <para>Shift-invert (Ericsson &amp; Ruhe, 1980, Math. Comp. 35): with K − σM = P L D Lᵀ Pᵀ (<see cref="SparseLdlt"/>),
/// the operator (K − σM)⁻¹M is self-adjoint in the M inner product and has eigenvalues θ = 1/(λ − σ), so the λ just
/// above σ become the largest, best separated θ. σ = −10⁻⁶ s with s = maxᵢ Σⱼ|Kᵢⱼ|/Mᵢᵢ (a bound on λ_max), so
/// K − σM is positive definite even when K is singular (rigid-body modes) and the lowest modes converge first.</para>
/// <para>Lanczos with thick restart (Wu &amp; Simon, 2000, SIAM J. Matrix Anal. Appl. 22(2)): the basis V, Vᵀ M V = I,
/// is extended one vector at a time and each new vector is orthogonalised against the whole basis twice (full
/// reorthogonalisation in the M inner product, classical Gram–Schmidt repeated), so the projected matrix
/// H = Vᵀ M (K − σM)⁻¹ M V is computed in full. When the basis holds m vectors, the Ritz vectors of the largest θ not yet
/// locked are kept with the last residual vector, and H restarts as diag(θ) bordered by the residual couplings. A Ritz
/// pair is accepted when its residual estimate |β sₘᵢ| ≤ 10⁻¹¹ θᵢ and the residual of K φ = λ M φ itself,
/// ‖Kφ − λMφ‖/‖Kφ‖ (‖Kφ‖/(s‖Mφ‖) for a rigid-body mode), is at most 10⁻⁹ or, for a low mode of a model whose
/// eigenvalues span more decades than that allows (rounding φ alone leaves about u·s/λ), the normwise backward error
/// ‖Kφ − λMφ‖/(s‖Mφ‖) is at most 10⁻¹⁴. An accepted pair is locked at once (deflation as in the ARPACK users' guide,
/// Lehoucq, Sorensen &amp; Yang, 1998, §4.6): its vector leaves the active basis and every later vector is
/// M-orthogonalised against it. Without locking (issue 13) each restart recombined the converged vectors, their
/// residuals crept up with every restart, and a pass that needed all wanted pairs to pass at the same restart never
/// ended on a 2,100-mass chain.</para>
/// <para>Completeness (Grimes, Lewis &amp; Simon, 1994, SIAM J. Matrix Anal. Appl. 15(1)): a single-vector Krylov space
/// holds one vector per distinct eigenvalue in exact arithmetic, so a repeated frequency or an unlucky start can hide
/// a mode. After the wanted pairs converge, K − τM is factorised at a τ in the gap above the highest wanted
/// eigenvalue (between its cluster, relative width 10⁻⁸, and the next converged value) and its negative pivots
/// counted (<see cref="SturmSequence"/>). If more eigenvalues lie below τ than were found, the found vectors are
/// locked (every later vector is M-orthogonalised against them) and Lanczos starts again from a fresh seeded random
/// vector to find the missing ones; the result is returned only when the count and the pairs found agree.
/// Fewer than found means the pairs are wrong and throws <see cref="NumericalFailureException"/>.</para>
/// <para>Shapes are M-orthonormal (ΦᵀMΦ = I to round-off); cost per Lanczos step: one sparse solve, one product with M
/// and O(n m) for the reorthogonalisation; two factorisations in all when nothing was missed.</para>
/// </remarks>
public sealed class ShiftInvertLanczos : IGeneralizedEigenSolver
{
    private const double RitzTolerance = 1e-11;
    private const double ResidualTolerance = 1e-9;
    private const double ClusterWidth = 1e-8;
    private const double RigidBodyTolerance = 1e-10;
    private const int MaxPasses = 6;
    private const int PassSize = 120;   // most pairs one pass looks for; more come in further, deflated passes
    private const int MaxRestarts = 400;
    private const int StallRestarts = 5;
    private const double BackwardErrorTolerance = 1e-14;

    /// <inheritdoc />
    public string Name => "shift-invert Lanczos on a sparse LDLᵀ, Sturm-checked (managed)";

    /// <summary>For tests only: this many times, one converged pair is thrown away before the Sturm check, as a faulty solver would.</summary>
    internal int InjectedSkips { get; init; }

    /// <inheritdoc />
    public EigenSolution Solve(Matrix<double> stiffness, Matrix<double> mass, int count, bool massIsDiagonal)
    {
        var problem = Problem.Create(stiffness, mass);
        if (count < 1 || count > problem.Size) throw new ArgumentOutOfRangeException(nameof(count), count, $"count must be in 1..{problem.Size}.");
        return ToSolution(Run(problem, count, eigenvalueLimit: null));
    }

    /// <summary>The lowest <paramref name="count"/> pairs of a problem already analysed (its ordering and pattern reused).</summary>
    internal EigenSolution Solve(Problem problem, int count)
    {
        if (count < 1 || count > problem.Size) throw new ArgumentOutOfRangeException(nameof(count), count, $"count must be in 1..{problem.Size}.");
        return ToSolution(Run(problem, count, eigenvalueLimit: null));
    }

    /// <summary>Every eigenpair with λ &lt; <paramref name="eigenvalueLimit"/> (rad²/s²), at most <paramref name="maxCount"/> of the lowest.</summary>
    /// <returns>The pairs, possibly none; the Sturm count at the limit equals their number unless <paramref name="maxCount"/> cut it.</returns>
    public EigenSolution SolveBelow(Matrix<double> stiffness, Matrix<double> mass, double eigenvalueLimit, int? maxCount = null) =>
        SolveBelow(Problem.Create(stiffness, mass), eigenvalueLimit, maxCount);

    /// <summary>As the public overload, on a problem already analysed.</summary>
    internal EigenSolution SolveBelow(Problem problem, double eigenvalueLimit, int? maxCount)
    {
        Guard.Finite(eigenvalueLimit);
        var below = SturmSequence.CountBelow(problem.Pattern, problem.K, problem.M, eigenvalueLimit);
        var wanted = Math.Min(below, maxCount ?? below);
        if (wanted == 0) return new EigenSolution([], Matrix<double>.Build.Dense(problem.Size, 0), Name);
        return ToSolution(Run(problem, wanted, wanted == below ? eigenvalueLimit : null));
    }

    private EigenSolution ToSolution(Outcome outcome) =>
        new(outcome.EigenValues, outcome.Shapes, Name);

    /// <summary>The eigen solve with the figures a test needs to see how it went.</summary>
    internal Outcome Run(Problem problem, int count, double? eigenvalueLimit)
    {
        var n = problem.Size;
        var sigma = -1e-6 * problem.Scale;
        var factor = SparseLdlt.Factor(problem.Pattern, problem.K, -sigma, problem.M);
        if (factor.NegativePivots != 0)
            throw new NumericalFailureException($"K is not positive semi-definite: K − σM has {factor.NegativePivots} negative pivots at σ = {sigma:G6}.");

        var found = new List<(double Lambda, double[] Shape, double Residual)>();
        var skipsLeft = InjectedSkips;
        var extra = eigenvalueLimit is null ? 1 : 0;   // one pair beyond the wanted, to place τ in the gap above them
        var target = Math.Min(Math.Min(n, count + extra), PassSize);
        var seed = 20001;
        var restarts = 0;
        var passes = MaxPasses + 2 * ((count + PassSize - 1) / PassSize);
        for (var pass = 1; pass <= passes; pass++)
        {
            var locked = found.Select(f => f.Shape).ToList();
            found.AddRange(RunPass(problem, factor, sigma, target, locked, seed++, ref restarts));
            found.Sort((a, b) => a.Lambda.CompareTo(b.Lambda));
            if (skipsLeft > 0 && found.Count > 0)
            {
                skipsLeft--;
                found.RemoveAt(Math.Min(found.Count - 1, count / 2));
            }

            // Not yet as many pairs as wanted: go on with the next ones (deflated), in passes of at most PassSize.
            var have = eigenvalueLimit is { } l ? found.Count(f => f.Lambda < l) : found.Count;
            if (have < count + (eigenvalueLimit is null && found.Count < n ? extra : 0) && found.Count < n)
            {
                target = Math.Min(Math.Min(n - found.Count, count + extra - have), PassSize);
                continue;
            }

            var tau = eigenvalueLimit ?? CheckShift(found, count, problem.Scale);
            var expected = SturmSequence.CountBelow(problem.Pattern, problem.K, problem.M, tau);
            var foundBelow = found.Count(f => f.Lambda < tau);
            if (expected == foundBelow && found.Count >= count)
                return new Outcome(found.Take(count).ToList(), tau, expected, foundBelow, pass, restarts);
            if (expected < foundBelow)
                throw new NumericalFailureException(
                    $"Lanczos found {foundBelow} eigenvalues below {tau:G6} rad²/s² but the Sturm count of K − τM says {expected}.");
            target = Math.Min(Math.Min(n - found.Count, Math.Max(expected - foundBelow, count - found.Count) + extra), PassSize);
            if (target <= 0)
                throw new NumericalFailureException($"The Sturm count at {tau:G6} rad²/s² is {expected} but every one of the {n} vectors is already found.");
        }
        throw new NumericalFailureException(
            $"Lanczos did not find every mode: after {passes} passes ({found.Count} pairs found) the Sturm count could not confirm the lowest {count}.");
    }

    /// <summary>A τ above the cluster of the count-th eigenvalue and below the next distinct one found.</summary>
    private static double CheckShift(List<(double Lambda, double[] Shape, double Residual)> found, int count, double scale)
    {
        var last = found[count - 1].Lambda;
        var width = ClusterWidth * Math.Abs(last) + RigidBodyTolerance * scale;
        var top = last;
        foreach (var f in found.Skip(count))
        {
            if (f.Lambda > top + width) return (top + f.Lambda) / 2;
            top = f.Lambda;
        }
        return top + Math.Max(1e3 * width, 1e-6 * Math.Abs(top));
    }

    /// <summary>One thick-restart Lanczos run from a random vector, deflated against <paramref name="locked"/>, until the <paramref name="target"/> largest θ converge.</summary>
    /// <remarks>Each wanted pair is locked the first restart it passes both tests: its vector leaves the active basis and
    /// every later vector is M-orthogonalised against it, so a converged vector is not recombined (and its round-off
    /// compounded) by every later restart, and the pairs need not all pass at the same restart.</remarks>
    private static List<(double Lambda, double[] Shape, double Residual)> RunPass(
        Problem problem, SparseLdlt factor, double sigma, int target, List<double[]> locked, int seed, ref int restarts)
    {
        var n = problem.Size;
        var converged = new List<(double Lambda, double[] Shape, double Residual)>();
        var deflation = new List<double[]>(locked);   // earlier passes' vectors and this pass's locked ones
        var room = n - locked.Count;
        var size = Math.Min(room, Math.Max(2 * target, target + 20));
        var basis = new double[size + 1][];
        var h = new double[size + 1, size + 1];
        var random = new Random(seed);
        var mx = new double[n];
        var w = new double[n];

        basis[0] = RandomVector(random, n);
        if (!Orthonormalise(problem, basis[0], basis, 0, deflation, mx)) return converged;
        var j = 0;               // basis[0..j] are set; H columns 0..j−1 are complete
        var stalled = 0;
        for (var restart = 0; restart < MaxRestarts; restart++, restarts++)
        {
            var remaining = room - converged.Count;
            var capacity = Math.Min(size, remaining);
            var exhausted = false;
            for (; j < capacity; j++)
            {
                problem.M.Multiply(basis[j], mx);
                factor.Solve(mx, w);
                var norm0 = Math.Sqrt(Dot(w, problem.M, mx));
                var coefficients = Orthogonalise(problem, w, basis, j + 1, deflation, mx);
                for (var i = 0; i <= j; i++) h[i, j] = h[j, i] = coefficients[i];
                var beta = Math.Sqrt(Dot(w, problem.M, mx));
                if (!(beta > 1e-10 * norm0))
                {
                    // The Krylov space is invariant: continue from a fresh random vector, coupled by β = 0.
                    w = RandomVector(random, n);
                    if (!Orthonormalise(problem, w, basis, j + 1, deflation, mx))
                    {
                        exhausted = true;
                        j++;
                        break;
                    }
                    beta = 0;
                }
                else Scale(w, 1 / beta);
                h[j + 1, j] = h[j, j + 1] = beta;
                basis[j + 1] = w;
                w = new double[n];
            }

            var m = j;
            var complete = exhausted || m >= remaining;   // V spans all that is left: every Ritz pair is exact
            var projected = Matrix<double>.Build.Dense(m, m, (r, c) => 0.5 * (h[r, c] + h[c, r]));
            var evd = projected.Evd(Symmetricity.Symmetric);
            var theta = evd.EigenValues.Select(v => v.Real).ToArray();
            var order = Enumerable.Range(0, m).OrderByDescending(i => theta[i]).ToArray();
            var s = evd.EigenVectors;
            var lastBeta = exhausted ? 0 : h[m, m - 1];

            // Lock every wanted pair (among the largest θ still needed) that passes both tests.
            var needed = target - converged.Count;
            var lockedNow = new bool[m];
            var unconverged = 0;
            var failedResidual = 0;
            var worstResidual = 0.0;
            var worstLambda = 0.0;
            for (var r = 0; r < Math.Min(m, needed); r++)
            {
                var i = order[r];
                var estimate = complete ? 0 : Math.Abs(lastBeta * s[m - 1, i]);
                if (!(theta[i] > 0) || estimate > RitzTolerance * theta[i])
                {
                    unconverged++;
                    continue;
                }
                var shape = Combine(basis, s, i, m, n);
                var lambda = sigma + 1 / theta[i];
                var residual = problem.Residual(shape, lambda);
                if (problem.Accepts(residual, lambda))
                {
                    converged.Add((lambda, shape, residual));
                    deflation.Add(shape);
                    lockedNow[i] = true;
                }
                else
                {
                    unconverged++;
                    failedResidual++;
                    if (residual > worstResidual) (worstResidual, worstLambda) = (residual, lambda);
                }
            }
            if (converged.Count >= target || complete) return converged;

            // A pair whose Ritz estimate has converged but whose residual stays above the bound will not improve by more
            // restarts: say so with the figure rather than spending the remaining restarts.
            stalled = failedResidual == unconverged ? stalled + 1 : 0;
            if (stalled >= StallRestarts)
                throw new NumericalFailureException(
                    $"Lanczos could not reach the residual bound: the mode at λ = {worstLambda:G6} rad²/s² keeps ‖Kφ − λMφ‖/‖Kφ‖ = {worstResidual:G3} after its Ritz estimate converged ({converged.Count} of {target} modes locked).");

            // Thick restart (Wu & Simon, 2000): keep the Ritz vectors of the largest θ not locked, and the residual vector.
            needed = target - converged.Count;
            var nextCapacity = Math.Min(size, room - converged.Count);
            var keptIndex = order.Where(i => !lockedNow[i]).ToArray();
            var keep = Math.Max(0, Math.Min(Math.Min(nextCapacity - 1, keptIndex.Length), needed + (nextCapacity - needed) / 2));
            var kept = new double[size + 1][];
            for (var r = 0; r < keep; r++) kept[r] = Combine(basis, s, keptIndex[r], m, n);
            kept[keep] = basis[m];
            Array.Clear(h);
            for (var r = 0; r < keep; r++)
            {
                h[r, r] = theta[keptIndex[r]];
                h[keep, r] = h[r, keep] = lastBeta * s[m - 1, keptIndex[r]];
            }
            basis = kept;
            j = keep;
        }
        throw new NumericalFailureException(
            $"Lanczos did not converge: {converged.Count} of the {target} wanted modes of {n} passed the residual bound after {MaxRestarts} restarts of {size} vectors.");
    }

    private static double[] RandomVector(Random random, int n)
    {
        var v = new double[n];
        for (var i = 0; i < n; i++) v[i] = random.NextDouble() - 0.5;
        return v;
    }

    /// <summary>Σᵢ basis[i]·s[i, column] over the first m basis vectors.</summary>
    private static double[] Combine(double[][] basis, Matrix<double> s, int column, int m, int n)
    {
        var y = new double[n];
        for (var i = 0; i < m; i++) Axpy(s[i, column], basis[i], y);
        return y;
    }

    /// <summary>Makes w M-orthogonal to the locked vectors and basis[0..count−1], twice; returns the coefficients on the basis. Leaves M w in mw.</summary>
    private static double[] Orthogonalise(Problem problem, double[] w, double[][] basis, int count, List<double[]> locked, double[] mw)
    {
        var coefficients = new double[count];
        for (var sweep = 0; sweep < 2; sweep++)
        {
            problem.M.Multiply(w, mw);
            foreach (var x in locked) Axpy(-DotPlain(x, mw), x, w);
            var c = new double[count];
            for (var i = 0; i < count; i++) c[i] = DotPlain(basis[i], mw);
            for (var i = 0; i < count; i++)
            {
                Axpy(-c[i], basis[i], w);
                coefficients[i] += c[i];
            }
        }
        problem.M.Multiply(w, mw);
        return coefficients;
    }

    /// <summary>Orthogonalises and M-normalises a fresh vector; false when nothing of it is left (the space is exhausted).</summary>
    private static bool Orthonormalise(Problem problem, double[] w, double[][] basis, int count, List<double[]> locked, double[] mw)
    {
        problem.M.Multiply(w, mw);
        var before = Math.Sqrt(DotPlain(w, mw));
        Orthogonalise(problem, w, basis, count, locked, mw);
        var norm = Math.Sqrt(DotPlain(w, mw));
        if (!(norm > 1e-8 * before)) return false;
        Scale(w, 1 / norm);
        return true;
    }

    private static double Dot(double[] x, SymmetricSparseMatrix m, double[] mx)
    {
        m.Multiply(x, mx);
        return DotPlain(x, mx);
    }

    private static double DotPlain(double[] x, double[] y)
    {
        var width = System.Numerics.Vector<double>.Count;
        var sums = System.Numerics.Vector<double>.Zero;
        var i = 0;
        for (; i <= x.Length - width; i += width)
            sums += new System.Numerics.Vector<double>(x, i) * new System.Numerics.Vector<double>(y, i);
        var sum = System.Numerics.Vector.Sum(sums);
        for (; i < x.Length; i++) sum += x[i] * y[i];
        return sum;
    }

    private static void Axpy(double a, double[] x, double[] y)
    {
        var width = System.Numerics.Vector<double>.Count;
        var av = new System.Numerics.Vector<double>(a);
        var i = 0;
        for (; i <= x.Length - width; i += width)
            (new System.Numerics.Vector<double>(y, i) + av * new System.Numerics.Vector<double>(x, i)).CopyTo(y, i);
        for (; i < x.Length; i++) y[i] += a * x[i];
    }

    private static void Scale(double[] x, double a)
    {
        for (var i = 0; i < x.Length; i++) x[i] *= a;
    }

    /// <summary>K and M in the solver's sparse form with the pattern of K − σM analysed once.</summary>
    internal sealed class Problem
    {
        private readonly double[] _kx;
        private readonly double[] _mx;

        private Problem(SymmetricSparseMatrix k, SymmetricSparseMatrix m)
        {
            K = k;
            M = m;
            Size = k.Size;
            Pattern = SparseLdltPattern.Analyse(k, m);
            var scale = 0.0;
            for (var i = 0; i < Size; i++)
            {
                var (_, values) = k.Row(i);
                var sum = 0.0;
                foreach (var v in values.Span) sum += Math.Abs(v);
                var mii = m[i, i];
                if (!(mii > 0)) throw new NumericalFailureException($"M is not positive definite: diagonal entry {i} is {mii}.");
                scale = Math.Max(scale, sum / mii);
            }
            Scale = scale > 0 ? scale : 1.0;
            _kx = new double[Size];
            _mx = new double[Size];
        }

        public SymmetricSparseMatrix K { get; }
        public SymmetricSparseMatrix M { get; }
        public SparseLdltPattern Pattern { get; }
        public int Size { get; }

        /// <summary>maxᵢ Σⱼ|Kᵢⱼ|/Mᵢᵢ in rad²/s², a bound on the largest eigenvalue (exact for diagonal M).</summary>
        public double Scale { get; }

        public static Problem Create(Matrix<double> stiffness, Matrix<double> mass)
        {
            ArgumentNullException.ThrowIfNull(stiffness);
            ArgumentNullException.ThrowIfNull(mass);
            Guard.Square(stiffness.RowCount, stiffness.ColumnCount, "K");
            Guard.Square(mass.RowCount, mass.ColumnCount, "M");
            Guard.SameSize(stiffness.RowCount, mass.RowCount, "K", "M");
            return Create(SymmetricSparseMatrix.From(stiffness), SymmetricSparseMatrix.From(mass));
        }

        public static Problem Create(SymmetricSparseMatrix stiffness, SymmetricSparseMatrix mass) => new(stiffness, mass);

        /// <summary>
        /// True when the residual of <see cref="Residual"/> is at most 10⁻⁹, or when ‖Kφ − λMφ‖ ≤ 10⁻¹⁴ s‖Mφ‖: a normwise
        /// backward error of 10⁻¹⁴, about 45 units of round-off (Higham &amp; Higham, 1998, SIAM J. Matrix Anal. Appl. 20(2), from memory), the most double
        /// precision can give a low mode of a model whose eigenvalues span many decades, where φ's own rounding (u‖φ‖)
        /// multiplied by K already leaves about u·s‖Mφ‖, i.e. a relative residual near u·s/λ.
        /// </summary>
        public bool Accepts(double residual, double lambda) =>
            residual <= ResidualTolerance
            || (lambda >= RigidBodyTolerance * Scale && residual * lambda <= BackwardErrorTolerance * Scale);

        /// <summary>‖Kφ − λMφ‖/‖Kφ‖, or ‖Kφ‖/(s‖Mφ‖) for λ below the rigid-body threshold: the figure the modal analysis reports.</summary>
        public double Residual(double[] phi, double lambda)
        {
            K.Multiply(phi, _kx);
            M.Multiply(phi, _mx);
            double kNorm = 0, mNorm = 0, difference = 0;
            for (var i = 0; i < Size; i++)
            {
                kNorm += _kx[i] * _kx[i];
                mNorm += _mx[i] * _mx[i];
                var d = _kx[i] - lambda * _mx[i];
                difference += d * d;
            }
            if (lambda < RigidBodyTolerance * Scale) return Math.Sqrt(kNorm) / (Scale * Math.Sqrt(mNorm));
            return Math.Sqrt(difference / kNorm);
        }
    }

    /// <summary>The pairs returned (ascending), the Sturm shift τ, its count, the pairs found below τ, the number of Lanczos passes it took and their restarts in all.</summary>
    internal sealed record Outcome(List<(double Lambda, double[] Shape, double Residual)> Pairs, double CheckShift, int SturmCount, int FoundBelowShift, int Passes, int Restarts)
    {
        public ImmutableArray<double> EigenValues => [.. Pairs.Select(p => p.Lambda)];

        public Matrix<double> Shapes
        {
            get
            {
                var n = Pairs.Count == 0 ? 0 : Pairs[0].Shape.Length;
                var shapes = Matrix<double>.Build.Dense(n, Pairs.Count);
                for (var j = 0; j < Pairs.Count; j++) shapes.SetColumn(j, Pairs[j].Shape);
                ModeNormalisation.ApplySignConvention(shapes);
                return shapes;
            }
        }
    }
}
