using System.Numerics;
using ModalChain.Core.Assembly;
using ModalChain.Core.Solvers;

namespace ModalChain.Core.Analyses.Harmonic;

/// <summary>Per-thread scratch memory of an engine, allocated once per sweep and thread.</summary>
internal abstract class EngineWorkspace;

/// <summary>Computes fixed linear functions y_k = w_kᵀ X of the free displacements for one frequency, into caller-owned buffers.</summary>
/// <remarks>
/// An observation row w_k is a unit vector for the displacement of one mass, or a row of K_pf or C_pf for a support
/// reaction; asking for the functions rather than all of X keeps each frequency's cost proportional to the outputs.
/// </remarks>
internal abstract class HarmonicEngine(double[][] observations)
{
    /// <summary>The observation rows w_k, each of length n (free DOFs).</summary>
    public double[][] Observations { get; } = observations;

    /// <summary>Σ_i w_i a_i over the non-zero weights.</summary>
    protected static Complex Dot(double[] w, Func<int, Complex> a)
    {
        var s = Complex.Zero;
        for (var i = 0; i < w.Length; i++)
            if (w[i] != 0) s += w[i] * a(i);
        return s;
    }

    public abstract EngineWorkspace CreateWorkspace();

    /// <summary>Writes y_k = w_kᵀX into <paramref name="x"/> for circular frequency ω in rad/s; false when the system is singular there.</summary>
    /// <param name="omega">Circular frequency in rad/s.</param>
    /// <param name="coefficients">(iω)^{p_r} per load term, in the order of the loading's terms.</param>
    /// <param name="x">One value per observation row (m for a unit row, N for a stiffness row, N·s/m·m for a damping row).</param>
    /// <param name="workspace">Scratch memory from <see cref="CreateWorkspace"/>.</param>
    public abstract bool Solve(double omega, ReadOnlySpan<Complex> coefficients, Span<Complex> x, EngineWorkspace workspace);

    /// <summary>How many frequencies <see cref="SolveBlock"/> handles best at once; 1 for engines that gain nothing from it.</summary>
    public virtual int BlockSize => 1;

    /// <summary>Solves at each of <paramref name="omegas"/> in turn; the index of the first singular frequency, else −1.</summary>
    /// <param name="omegas">Circular frequencies in rad/s.</param>
    /// <param name="coefficients">Per frequency, <paramref name="terms"/> values (iω)^{p_r}: frequency-major.</param>
    /// <param name="terms">Load terms per frequency.</param>
    /// <param name="x">Per frequency, one value per observation row: frequency-major.</param>
    /// <param name="workspace">Scratch memory from <see cref="CreateWorkspace"/>.</param>
    public virtual int SolveBlock(ReadOnlySpan<double> omegas, ReadOnlySpan<Complex> coefficients, int terms, Span<Complex> x, EngineWorkspace workspace)
    {
        var nk = Observations.Length;
        var failed = -1;
        for (var f = 0; f < omegas.Length; f++)
            if (!Solve(omegas[f], coefficients.Slice(f * terms, terms), x.Slice(f * nk, nk), workspace) && failed < 0) failed = f;
        return failed;
    }
}

/// <summary>Chooses the engine of the direct method by the size and storage of the model.</summary>
internal static class DirectEngines
{
    /// <summary>Above this many DOFs a model with sparse C is solved by <see cref="SparseDirectEngine"/>.</summary>
    public const int SparseFromDofs = 300;

    /// <summary>The sparse engine above <see cref="SparseFromDofs"/> DOFs when C is stored sparse; the Hessenberg engine otherwise.</summary>
    public static HarmonicEngine Create(DampedSystem system, HarmonicLoading loading, double[][] observations) =>
        UsesSparse(system) ? new SparseDirectEngine(system, loading, observations) : new DirectEngine(system, loading, observations);

    /// <summary>True when the direct method runs on the sparse engine: large sparse models, and every model with a massless DOF.</summary>
    /// <remarks>
    /// The Hessenberg engine needs M⁻¹; the dynamic stiffness K(1+iη) − ω²M + iωC needs none and stays regular at a
    /// massless DOF (its diagonal there is k(1+iη) + iωc), so a singular M goes to the sparse engine whatever its size.
    /// </remarks>
    public static bool UsesSparse(DampedSystem system) =>
        (system.Partition.FreeCount > SparseFromDofs
            && system.Damping.FF.Storage is MathNet.Numerics.LinearAlgebra.Storage.SparseCompressedRowMatrixStorage<double>)
        || MasslessReduction.HasMasslessDofs(system.Partition.Mass);
}

/// <summary>The direct method on a sparse model: a complex symmetric LDLᵀ of (K(1+iη) − ω²M + iωC) at each frequency.</summary>
/// <remarks>
/// The ordering and the pattern of L are found once for the union of the patterns of K, M and C
/// (<see cref="SparseLdltPattern"/>); each frequency refactorises numerically on that pattern
/// (<see cref="ComplexSymmetricLdlt"/>) and solves once for the combined right-hand side. Memory is one complex factor
/// per thread, O(nnz(L)), instead of the Hessenberg engine's dense (2n)² state matrix, and no O(n³) reduction. Exact for
/// any damping, like the Hessenberg engine; the two agree to round-off.
/// </remarks>
internal sealed class SparseDirectEngine : HarmonicEngine
{
    private readonly SymmetricSparseMatrix _k;
    private readonly SymmetricSparseMatrix _m;
    private readonly SymmetricSparseMatrix _c;
    private readonly SparseLdltPattern _pattern;
    private readonly Complex _hysteretic;
    private readonly HarmonicLoading _loading;
    private readonly (int Index, double Weight)[][] _rows;

    public SparseDirectEngine(DampedSystem system, HarmonicLoading loading, double[][] observations) : base(observations)
    {
        var p = system.Partition;
        _k = SymmetricSparseMatrix.From(p.StiffnessFF);
        _m = SymmetricSparseMatrix.From(p.Mass);
        _c = SymmetricSparseMatrix.From(system.Damping.FF);
        _pattern = SparseLdltPattern.Analyse(_k, _m, _c);
        _hysteretic = new Complex(1, system.LossFactor);
        _loading = loading;
        _rows = [.. observations.Select(w => w.Select((v, i) => (i, v)).Where(e => e.v != 0).ToArray())];
    }

    private sealed class Workspace(SparseLdltPattern pattern) : EngineWorkspace
    {
        public readonly ComplexSymmetricLdlt Factor = new(pattern);
        public readonly Complex[] B = new Complex[pattern.Size];
    }

    public override EngineWorkspace CreateWorkspace() => new Workspace(_pattern);

    public override bool Solve(double omega, ReadOnlySpan<Complex> coefficients, Span<Complex> x, EngineWorkspace workspace)
    {
        var ws = (Workspace)workspace;
        if (!ws.Factor.Factor([(_hysteretic, _k), (-omega * omega, _m), (new Complex(0, omega), _c)])) return false;
        var b = ws.B.AsSpan();
        b.Clear();
        for (var r = 0; r < _loading.Terms.Count; r++)
        {
            var c = coefficients[r];
            if (c == Complex.Zero) continue;
            var v = _loading.Terms[r].Vector;
            for (var i = 0; i < b.Length; i++) b[i] += c * v[i];
        }
        ws.Factor.Solve(b);
        for (var k = 0; k < x.Length; k++)
        {
            var s = Complex.Zero;
            foreach (var (i, w) in _rows[k]) s += w * b[i];
            x[k] = s;
        }
        return true;
    }
}

/// <summary>The direct method: the exact solve of (K(1+iη) − ω²M + iωC) x = b through a Hessenberg form of the state matrix.</summary>
/// <remarks>
/// With z = [ω0·x; ẋ], the equations become (iωI − A) z = [0; M⁻¹b], A = [[0, ω0 I], [−M⁻¹K(1+iη)/ω0, −M⁻¹C]];
/// ω0 = √(mean K_ii/M_ii) balances the two blocks; M⁻¹ is dense when an inerter couples two masses. A = Q H Qᴴ is computed once (Householder), so each frequency
/// costs one O((2n)²) Hessenberg solve instead of an O(n³) factorisation (Laub 1981). This is exact for any
/// damping (no modal truncation or classical-damping assumption).
/// </remarks>
internal sealed class DirectEngine : HarmonicEngine
{
    private readonly ComplexHessenberg _hessenberg;
    private readonly Complex[] _g;    // terms × N: Qᴴ B b_r
    private readonly Complex[] _qx;   // observations × N: w_kᵀ Q[0..n) / ω0
    private readonly int _order;
    private readonly int _terms;

    public DirectEngine(DampedSystem system, HarmonicLoading loading, double[][] observations) : base(observations)
    {
        var p = system.Partition;
        var n = p.FreeCount;
        var order = 2 * n;
        _order = order;
        var stiffnessScale = 0.0;
        for (var i = 0; i < n; i++) stiffnessScale += Math.Abs(p.StiffnessFF[i, i]) / p.Mass[i, i];
        var w0 = stiffnessScale > 0 ? Math.Sqrt(stiffnessScale / n) : 1.0;
        var k = new Complex(1, system.LossFactor);

        // Lumped masses give a diagonal M; an inerter between two masses couples it, and M⁻¹ is then formed densely.
        var massIsDiagonal = Assembler.IsDiagonal(p.Mass);
        var inverse = massIsDiagonal ? null : p.Mass.Inverse();
        var stiffness = massIsDiagonal ? p.StiffnessFF : inverse! * p.StiffnessFF;
        var damping = massIsDiagonal ? system.Damping.FF : inverse! * system.Damping.FF;
        var a = new Complex[order * order];
        // A rigid body's inertia matrix off its principal axes couples its rotations in M: then M⁻¹ is formed densely.
        var massInverse = FullMassInverse(p.Mass);
        if (massInverse is null)
        {
            var inverseMass = new double[n];
            for (var i = 0; i < n; i++)
            {
                a[i * order + n + i] = w0;
                inverseMass[i] = 1 / p.Mass[i, i];
            }
            // Only the stored entries of K and C (both may be sparse): the rest of the state matrix stays zero.
            foreach (var (i, j, v) in p.StiffnessFF.EnumerateIndexed(MathNet.Numerics.LinearAlgebra.Zeros.AllowSkip))
                a[(n + i) * order + j] = -k * (v * inverseMass[i] / w0);
            foreach (var (i, j, v) in system.Damping.FF.EnumerateIndexed(MathNet.Numerics.LinearAlgebra.Zeros.AllowSkip))
                a[(n + i) * order + n + j] = -v * inverseMass[i];
        }
        else
        {
            var mk = massInverse * p.StiffnessFF;
            var mc = massInverse * system.Damping.FF;
            for (var i = 0; i < n; i++)
            {
                a[i * order + n + i] = w0;
                for (var j = 0; j < n; j++)
                {
                    a[(n + i) * order + j] = -k * (mk[i, j] / w0);
                    a[(n + i) * order + n + j] = -mc[i, j];
                }
            }
        }
        _hessenberg = ComplexHessenberg.Reduce(a, order);
        var q = _hessenberg.Q;

        _terms = loading.Terms.Count;
        _g = new Complex[_terms * order];
        for (var r = 0; r < _terms; r++)
        {
            var b = massInverse is null ? loading.Terms[r].Vector : SolveMass(massInverse, loading.Terms[r].Vector);
            for (var i = 0; i < n; i++)
            {
                if (b[i] == Complex.Zero) continue;
                var bi = massInverse is null ? b[i] / p.Mass[i, i] : b[i];
                var row = q.AsSpan((n + i) * order, order);
                var g = _g.AsSpan(r * order, order);
                for (var j = 0; j < order; j++) g[j] += Complex.Conjugate(row[j]) * bi;
            }
        }
        _qx = new Complex[observations.Length * order];
        for (var kk = 0; kk < observations.Length; kk++)
        {
            var w = observations[kk];
            var row = _qx.AsSpan(kk * order, order);
            for (var i = 0; i < n; i++)
            {
                if (w[i] == 0) continue;
                var f = w[i] / w0;
                var qi = q.AsSpan(i * order, order);
                for (var j = 0; j < order; j++) row[j] += f * qi[j];
            }
        }
    }

    /// <summary>M⁻¹ (dense) when M has an off-diagonal entry (a rigid body's products of inertia); null for a diagonal M.</summary>
    private static MathNet.Numerics.LinearAlgebra.Matrix<double>? FullMassInverse(MathNet.Numerics.LinearAlgebra.Matrix<double> mass)
    {
        foreach (var (i, j, v) in mass.EnumerateIndexed(MathNet.Numerics.LinearAlgebra.Zeros.AllowSkip))
            if (i != j && v != 0) return MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.DenseOfMatrix(mass).Inverse();
        return null;
    }

    /// <summary>M⁻¹ b for a complex load vector b.</summary>
    private static Complex[] SolveMass(MathNet.Numerics.LinearAlgebra.Matrix<double> massInverse, Complex[] b)
    {
        var n = b.Length;
        var x = new Complex[n];
        for (var i = 0; i < n; i++)
            for (var j = 0; j < n; j++)
                if (b[j] != Complex.Zero) x[i] += massInverse[i, j] * b[j];
        return x;
    }

    private sealed class Workspace(int order) : EngineWorkspace
    {
        public readonly Complex[] G = new Complex[order];
        public readonly Complex[] Matrix = new Complex[order * order + order];
    }

    public override EngineWorkspace CreateWorkspace() => new Workspace(_order);

    public override bool Solve(double omega, ReadOnlySpan<Complex> coefficients, Span<Complex> x, EngineWorkspace workspace)
    {
        var ws = (Workspace)workspace;
        var order = _order;
        var g = ws.G.AsSpan();
        g.Clear();
        for (var r = 0; r < _terms; r++)
        {
            var c = coefficients[r];
            if (c == Complex.Zero) continue;
            var gr = _g.AsSpan(r * order, order);
            for (var j = 0; j < order; j++) g[j] += c * gr[j];
        }
        if (!_hessenberg.SolveShifted(new Complex(0, omega), g, ws.Matrix)) return false;
        for (var kk = 0; kk < x.Length; kk++)
        {
            var row = _qx.AsSpan(kk * order, order);
            var s = Complex.Zero;
            for (var j = 0; j < order; j++) s += row[j] * g[j];
            x[kk] = s;
        }
        return true;
    }
}

/// <summary>Modal superposition of the lowest modes, with the residual (quasi-static) flexibility of the others.</summary>
/// <remarks>
/// x(ω) = Σ_{j≤m} φ_j φ_jᵀ b / (ω_j²(1+iη) − ω² + iω Ĉ_jj) + R b/(1+iη), R = K⁻¹ − Σ_{j≤m} φ_jφ_jᵀ/ω_j²
/// (residual flexibility, the static correction for truncated modes: Craig &amp; Kurdila, Fundamentals of Structural
/// Dynamics, 2nd ed., §14.3 [from memory]). When the damping is not classical the kept modal equations are coupled
/// by Ĉ = Φᵀ C Φ and are solved together (an m×m complex solve per frequency). With every mode kept R = 0 and the
/// result equals the direct method's.
/// </remarks>
internal sealed class ModalEngine : HarmonicEngine
{
    private readonly int _m;
    private readonly int _terms;
    private readonly double[] _lambda;
    private readonly double[] _damping;      // Ĉ_jj (classical) 
    private readonly double[]? _coupling;    // Ĉ m×m when not classical
    private readonly Complex _hysteretic;
    private readonly Complex[] _p;           // m × terms: φ_jᵀ b_r
    private readonly double[] _phi;          // observations × m: w_kᵀ φ_j
    private readonly Complex[]? _residual;   // observations × terms: w_kᵀ R b_r / (1+iη)

    public ModalEngine(DampedSystem system, HarmonicLoading loading, double[][] observations, int modeCount, bool residualFlexibility) : base(observations)
    {
        var modes = system.Modes.Modes;
        var n = system.Partition.FreeCount;
        _m = modeCount;
        _terms = loading.Terms.Count;
        _hysteretic = new Complex(1, system.LossFactor);
        _lambda = [.. modes.Take(_m).Select(x => x.EigenValue)];
        _damping = [.. Enumerable.Range(0, _m).Select(j => system.ModalDamping[j, j])];
        if (!system.IsClassical)
        {
            _coupling = new double[_m * _m];
            for (var j = 0; j < _m; j++)
                for (var l = 0; l < _m; l++) _coupling[j * _m + l] = system.ModalDamping[j, l];
        }
        _p = new Complex[_m * _terms];
        for (var j = 0; j < _m; j++)
            for (var r = 0; r < _terms; r++)
            {
                var b = loading.Terms[r].Vector;
                var s = Complex.Zero;
                for (var i = 0; i < n; i++) s += modes[j].Shape[i] * b[i];
                _p[j * _terms + r] = s;
            }
        var no = observations.Length;
        _phi = new double[no * _m];
        for (var k = 0; k < no; k++)
            for (var j = 0; j < _m; j++)
            {
                var w = observations[k];
                var shape = modes[j].Shape;
                var s = 0.0;
                for (var i = 0; i < n; i++)
                    if (w[i] != 0) s += w[i] * shape[i];
                _phi[k * _m + j] = s;
            }

        if (residualFlexibility && _m < n)
        {
            // K_ff is sparse: one LDLᵀ (approximate minimum degree ordering) serves every load term, so the residual
            // flexibility of a 100,000-mass model costs a sparse factor, not a dense n×n LU.
            var factor = SparseLdlt.Factor(SymmetricSparseMatrix.From(system.Partition.StiffnessFF));
            _residual = new Complex[no * _terms];
            var re = new double[n];
            var im = new double[n];
            for (var r = 0; r < _terms; r++)
            {
                var b = loading.Terms[r].Vector;
                for (var i = 0; i < n; i++)
                {
                    re[i] = b[i].Real;
                    im[i] = b[i].Imaginary;
                }
                factor.Solve(re, re);
                factor.Solve(im, im);
                for (var k = 0; k < no; k++)
                {
                    var s = Dot(observations[k], i => new Complex(re[i], im[i]));
                    for (var j = 0; j < _m; j++) s -= _phi[k * _m + j] * _p[j * _terms + r] / _lambda[j];
                    _residual[k * _terms + r] = s / _hysteretic;
                }
            }
        }
    }

    /// <summary>Frequencies per block: the modal amplitudes of a block are laid out so that x = Φ_obs Q runs over frequencies in SIMD lanes.</summary>
    private const int Block = 32;

    private sealed class Workspace(int m, bool coupled) : EngineWorkspace
    {
        public readonly Complex[] Q = new Complex[m];
        public readonly Complex[]? Matrix = coupled ? new Complex[m * m] : null;
        public readonly int[]? Pivots = coupled ? new int[m] : null;
        /// <summary>Modal amplitudes of one block, mode-major: q_j at frequency f is (QRe, QIm)[j·Block + f].</summary>
        public readonly double[] QRe = new double[m * Block];
        public readonly double[] QIm = new double[m * Block];
    }

    public override EngineWorkspace CreateWorkspace() => new Workspace(_m, _coupling is not null);

    public override int BlockSize => Block;

    public override bool Solve(double omega, ReadOnlySpan<Complex> coefficients, Span<Complex> x, EngineWorkspace workspace) =>
        SolveBlock(new ReadOnlySpan<double>(in omega), coefficients, _terms, x, workspace) < 0;

    /// <remarks>
    /// Per block of up to <see cref="Block"/> frequencies: the modal amplitudes q_j(ω) (the diagonal division, or the
    /// coupled solve), then y = Φ_obs Q as real products over the block's frequencies. Every y_k(ω) is summed over the
    /// modes in the same order, with the same operations, as one frequency at a time, so the result does not depend on
    /// the block size, the SIMD width or the split between threads.
    /// </remarks>
    public override int SolveBlock(ReadOnlySpan<double> omegas, ReadOnlySpan<Complex> coefficients, int terms, Span<Complex> x, EngineWorkspace workspace)
    {
        var nk = Observations.Length;
        for (var start = 0; start < omegas.Length; start += Block)
        {
            var count = Math.Min(Block, omegas.Length - start);
            var failed = SolveChunk(omegas.Slice(start, count), coefficients.Slice(start * terms, count * terms), x.Slice(start * nk, count * nk), (Workspace)workspace);
            if (failed >= 0) return start + failed;
        }
        return -1;
    }

    private int SolveChunk(ReadOnlySpan<double> omegas, ReadOnlySpan<Complex> coefficients, Span<Complex> x, Workspace ws)
    {
        var m = _m;
        var terms = _terms;
        var count = omegas.Length;
        var qRe = ws.QRe;
        var qIm = ws.QIm;
        // Lanes past the block's last frequency are summed too (whole vectors); zeros keep them finite.
        if (count < Block)
        {
            Array.Clear(qRe);
            Array.Clear(qIm);
        }
        var q = ws.Q.AsSpan();
        for (var f = 0; f < count; f++)
        {
            var omega = omegas[f];
            var w2 = omega * omega;
            var cf = coefficients.Slice(f * terms, terms);
            for (var j = 0; j < m; j++)
            {
                var s = Complex.Zero;
                var pj = _p.AsSpan(j * terms, terms);
                for (var r = 0; r < terms; r++) s += cf[r] * pj[r];
                q[j] = s;
            }
            if (_coupling is null)
            {
                for (var j = 0; j < m; j++)
                {
                    var den = _lambda[j] * _hysteretic - w2 + new Complex(0, omega * _damping[j]);
                    if (den == Complex.Zero) return f;
                    q[j] /= den;
                }
            }
            else
            {
                var z = ws.Matrix!.AsSpan();
                for (var j = 0; j < m; j++)
                {
                    for (var l = 0; l < m; l++) z[j * m + l] = new Complex(0, omega * _coupling[j * m + l]);
                    z[j * m + j] += _lambda[j] * _hysteretic - w2;
                }
                if (!ComplexLu.Factor(z, m, ws.Pivots)) return f;
                ComplexLu.Solve(z, m, ws.Pivots, q);
            }
            for (var j = 0; j < m; j++)
            {
                qRe[j * Block + f] = q[j].Real;
                qIm[j * Block + f] = q[j].Imaginary;
            }
        }

        var nk = Observations.Length;
        Span<double> yRe = stackalloc double[Block];
        Span<double> yIm = stackalloc double[Block];
        for (var k = 0; k < nk; k++)
        {
            ObservedBlock(_phi.AsSpan(k * m, m), qRe, qIm, yRe, yIm);
            for (var f = 0; f < count; f++)
            {
                var s = new Complex(yRe[f], yIm[f]);
                if (_residual is not null)
                {
                    var rr = _residual.AsSpan(k * terms, terms);
                    var cf = coefficients.Slice(f * terms, terms);
                    for (var r = 0; r < terms; r++) s += cf[r] * rr[r];
                }
                x[f * nk + k] = s;
            }
        }
        return -1;
    }

    /// <summary>y(f) = Σ_j φ_kj q_j(f) for every frequency f of a block, accumulated over j in order (as a scalar loop would).</summary>
    private static void ObservedBlock(ReadOnlySpan<double> phi, double[] qRe, double[] qIm, Span<double> yRe, Span<double> yIm)
    {
        var width = Vector<double>.Count;
        if (!Vector.IsHardwareAccelerated || Block % (2 * width) != 0)
        {
            yRe.Clear();
            yIm.Clear();
            for (var j = 0; j < phi.Length; j++)
            {
                var w = phi[j];
                for (var f = 0; f < Block; f++)
                {
                    yRe[f] += w * qRe[j * Block + f];
                    yIm[f] += w * qIm[j * Block + f];
                }
            }
            return;
        }
        // Two vectors of frequencies at a time, four accumulators held in registers over all the modes.
        for (var f0 = 0; f0 < Block; f0 += 2 * width)
        {
            var re0 = Vector<double>.Zero;
            var re1 = Vector<double>.Zero;
            var im0 = Vector<double>.Zero;
            var im1 = Vector<double>.Zero;
            for (var j = 0; j < phi.Length; j++)
            {
                var w = new Vector<double>(phi[j]);
                var at = j * Block + f0;
                re0 += w * new Vector<double>(qRe, at);
                re1 += w * new Vector<double>(qRe, at + width);
                im0 += w * new Vector<double>(qIm, at);
                im1 += w * new Vector<double>(qIm, at + width);
            }
            re0.CopyTo(yRe[f0..]);
            re1.CopyTo(yRe[(f0 + width)..]);
            im0.CopyTo(yIm[f0..]);
            im1.CopyTo(yIm[(f0 + width)..]);
        }
    }
}

/// <summary>A reference solve for checks: the dense complex LU of (K(1+iη) − ω²M + iωC) at each frequency.</summary>
/// <remarks>
/// Gaussian elimination with partial pivoting (<see cref="ComplexLu"/>) of the n×n dynamic stiffness, O(n³) per
/// frequency: independent of the modes and of the state-space form, so it checks both other engines at a few points.
/// </remarks>
internal sealed class DenseEngine(DampedSystem system, HarmonicLoading loading, double[][] observations) : HarmonicEngine(observations)
{
    private readonly int _n = system.Partition.FreeCount;
    private readonly double[] _k = Dense(system.Partition.StiffnessFF);
    private readonly double[] _m = Dense(system.Partition.Mass);
    private readonly double[] _c = Dense(system.Damping.FF);

    /// <summary>Row-major copy (the engine is used on small models only, so a dense copy is cheap).</summary>
    private static double[] Dense(MathNet.Numerics.LinearAlgebra.Matrix<double> a)
    {
        var n = a.ColumnCount;
        var d = new double[a.RowCount * n];
        foreach (var (i, j, v) in a.EnumerateIndexed(MathNet.Numerics.LinearAlgebra.Zeros.AllowSkip)) d[i * n + j] = v;
        return d;
    }

    private sealed class Workspace(int n) : EngineWorkspace
    {
        public readonly Complex[] Matrix = new Complex[n * n];
        public readonly Complex[] B = new Complex[n];
        public readonly int[] Pivots = new int[n];
    }

    public override EngineWorkspace CreateWorkspace() => new Workspace(_n);

    public override bool Solve(double omega, ReadOnlySpan<Complex> coefficients, Span<Complex> x, EngineWorkspace workspace)
    {
        var ws = (Workspace)workspace;
        var n = _n;
        var hysteretic = new Complex(1, system.LossFactor);
        var z = ws.Matrix.AsSpan();
        for (var i = 0; i < n * n; i++)
            z[i] = hysteretic * _k[i] - omega * omega * _m[i] + new Complex(0, omega * _c[i]);
        var b = ws.B.AsSpan();
        b.Clear();
        for (var r = 0; r < loading.Terms.Count; r++)
        {
            var v = loading.Terms[r].Vector;
            for (var i = 0; i < n; i++) b[i] += coefficients[r] * v[i];
        }
        if (!ComplexLu.Factor(z, n, ws.Pivots)) return false;
        ComplexLu.Solve(z, n, ws.Pivots, b);
        for (var k = 0; k < x.Length; k++)
        {
            var w = Observations[k];
            var s = Complex.Zero;
            for (var i = 0; i < n; i++)
                if (w[i] != 0) s += w[i] * b[i];
            x[k] = s;
        }
        return true;
    }
}
