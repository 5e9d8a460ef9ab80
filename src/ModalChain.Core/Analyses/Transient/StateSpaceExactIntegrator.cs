using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Solvers;

namespace ModalChain.Core.Analyses.Transient;

/// <summary>The exact discrete-time solution of M ü + C u̇ + K u = f for loads linear between steps (first-order hold).</summary>
/// <remarks>
/// With z = (u, u̇), ż = A z + B f, A = [[0, I], [−M⁻¹K, −M⁻¹C]], B = [0; M⁻¹] and f linear over each step,
/// z₊ = Φ z + Γ₀ f + Γ₁ (f₊ − f), where Φ = e^{Ah}, Γ₀ = ∫₀ʰ e^{As} ds B and Γ₁ = (1/h) ∫₀ʰ e^{As} (h − s) ds B.
/// The three blocks come from one exponential of the block-triangular matrix [[A, B, 0], [0, 0, I/h], [0, 0, 0]]·h
/// (Van Loan, "Computing integrals involving the matrix exponential", IEEE Trans. Autom. Control 23 (1978) 395–404;
/// the first-order-hold discretisation of Franklin, Powell &amp; Workman, Digital Control of Dynamic Systems, 3rd ed.,
/// §6.3 [from memory]). The result does not depend on h beyond the load's sampling. Accelerations are
/// ü = M⁻¹(f − C u̇ − K u) at each step. Cost: a dense exponential of order 4n once, then O(n²) per step, so the
/// method is meant for models of up to a few hundred DOFs.
/// </remarks>
public sealed class StateSpaceExactIntegrator
{
    /// <summary>Name printed with results.</summary>
    public string Name => "exact state-space discretisation (first-order hold)";

    /// <summary>Integrates <paramref name="system"/> over <paramref name="stepCount"/> steps of <paramref name="step"/> s.</summary>
    /// <param name="system">M, C, K.</param>
    /// <param name="load">The load vector in N, sampled at the step times and taken as linear between them.</param>
    /// <param name="u0">Initial displacement in m.</param>
    /// <param name="v0">Initial velocity in m/s.</param>
    /// <param name="step">Time step h in s.</param>
    /// <param name="stepCount">Number of steps.</param>
    /// <param name="sink">Receives every state, step 0 included.</param>
    public void Run(LinearDynamicSystem system, LoadVector load, ReadOnlySpan<double> u0, ReadOnlySpan<double> v0,
        double step, int stepCount, IStepSink sink)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(load);
        ArgumentNullException.ThrowIfNull(sink);
        system.CheckShapes();
        var n = system.Size;
        Integration.CheckRun(n, u0, v0, step, stepCount);

        var (phi, gamma0, gamma1) = Discretise(system, step);
        var s2 = 2 * n;
        // Row-major copies so that the per-step products are plain loops over arrays.
        var phiRows = phi.ToRowMajorArray();
        var g0Rows = (gamma0 - gamma1).ToRowMajorArray();
        var g1Rows = gamma1.ToRowMajorArray();

        var m = SymmetricSparseMatrix.From(system.Mass);
        var c = SymmetricSparseMatrix.From(system.Damping);
        var k = SymmetricSparseMatrix.From(system.Stiffness);
        var mInverse = m.IsDiagonal ? null : SparseCholesky.Factor(m);

        var z = new double[s2];
        var zNew = new double[s2];
        u0.CopyTo(z);
        v0.CopyTo(z.AsSpan(n));
        var a = new double[n];
        var fOld = new double[n];
        var fNew = new double[n];
        var rhs = new double[n];

        load(0, fOld);
        Integration.InitialAcceleration(m, c, k, fOld, z.AsSpan(0, n), z.AsSpan(n), a);
        sink.Accept(0, 0, z.AsSpan(0, n), z.AsSpan(n), a, fOld);

        for (var s = 1; s <= stepCount; s++)
        {
            var t = s * step;
            load(t, fNew);
            for (var i = 0; i < s2; i++)
            {
                var sum = 0.0;
                var row = i * s2;
                for (var j = 0; j < s2; j++) sum += phiRows[row + j] * z[j];
                var rowIn = i * n;
                for (var j = 0; j < n; j++) sum += g0Rows[rowIn + j] * fOld[j] + g1Rows[rowIn + j] * fNew[j];
                zNew[i] = sum;
            }
            (z, zNew) = (zNew, z);

            var u = z.AsSpan(0, n);
            var v = z.AsSpan(n);
            fNew.CopyTo(rhs, 0);
            k.MultiplyAdd(-1, u, rhs);
            c.MultiplyAdd(-1, v, rhs);
            if (mInverse is null)
                for (var i = 0; i < n; i++) a[i] = rhs[i] / m[i, i];
            else mInverse.Solve(rhs, a);

            sink.Accept(s, t, u, v, a, fNew);
            (fOld, fNew) = (fNew, fOld);
        }
    }

    /// <summary>Φ, Γ₀ and Γ₁ of the first-order-hold discretisation for step <paramref name="step"/> s.</summary>
    internal static (Matrix<double> Phi, Matrix<double> Gamma0, Matrix<double> Gamma1) Discretise(LinearDynamicSystem system, double step)
    {
        var n = system.Size;
        var mass = Matrix<double>.Build.DenseOfMatrix(system.Mass);
        Matrix<double> mInv;
        try { mInv = mass.Inverse(); }
        catch (Exception ex) when (ex is ArgumentException or InvalidOperationException)
        { throw new NumericalFailureException($"M ({n}×{n}) could not be inverted.", ex); }
        var w = Matrix<double>.Build.Dense(4 * n, 4 * n);
        w.SetSubMatrix(0, n, Matrix<double>.Build.DenseIdentity(n) * step);
        w.SetSubMatrix(n, 0, -(mInv * system.Stiffness) * step);
        w.SetSubMatrix(n, n, -(mInv * system.Damping) * step);
        w.SetSubMatrix(n, 2 * n, mInv * step);
        w.SetSubMatrix(2 * n, 3 * n, Matrix<double>.Build.DenseIdentity(n));
        var e = MatrixExponential.Compute(w);
        return (e.SubMatrix(0, 2 * n, 0, 2 * n), e.SubMatrix(0, 2 * n, 2 * n, n), e.SubMatrix(0, 2 * n, 3 * n, n));
    }
}
