using ModalChain.Core.Solvers;

namespace ModalChain.Core.Analyses.Transient;

/// <summary>Newmark's average-acceleration method and its Hilber-Hughes-Taylor generalisation, with one factorisation per run.</summary>
/// <remarks>
/// Newmark (1959), J. Eng. Mech. Div. ASCE 85, 67–94: u₊ = u + h u̇ + h²[(½ − β) ü + β ü₊],
/// u̇₊ = u̇ + h[(1 − γ) ü + γ ü₊]. Hilber, Hughes &amp; Taylor (1977), Earthquake Eng. Struct. Dyn. 5, 283–292, weight the
/// elastic, damping and load terms between the old and new step:
/// M ü₊ + (1 + α)(C u̇₊ + K u₊) − α (C u̇ + K u) = (1 + α) f₊ − α f, with α ∈ [−⅓, 0], β = (1 − α)²/4, γ = ½ − α.
/// α = 0 is the average-acceleration method (β = ¼, γ = ½): unconditionally stable and without amplitude decay for
/// linear systems; α &lt; 0 damps the highest frequencies while keeping second-order accuracy.
/// Each step solves K̂ u₊ = (1 + α) f₊ − α f + α K u + M(a₀u + a₂u̇ + a₃ü) + C((1 + α) a₁ u − c_v u̇ − c_a ü) with
/// K̂ = a₀M + (1 + α) a₁ C + (1 + α) K factorised once (sparse Cholesky), a₀ = 1/(βh²), a₁ = γ/(βh), a₂ = 1/(βh),
/// a₃ = 1/(2β) − 1, c_v = (1 + α)(1 − γ/β) − α and c_a = (1 + α) h (1 − γ/(2β)); then ü₊ = a₀(u₊ − u) − a₂u̇ − a₃ü and
/// u̇₊ from the Newmark relation. For α = 0 the step needs no product with K, only with the diagonal M and with C.
/// </remarks>
public sealed class NewmarkIntegrator
{
    /// <summary>Creates the integrator; <paramref name="alpha"/> = 0 gives average acceleration.</summary>
    /// <param name="alpha">Hilber-Hughes-Taylor α, dimensionless, in [−⅓, 0].</param>
    public NewmarkIntegrator(double alpha = 0.0)
    {
        if (!(alpha >= -1.0 / 3.0 - 1e-15 && alpha <= 0))
            throw new ArgumentOutOfRangeException(nameof(alpha), alpha, "The Hilber-Hughes-Taylor α must lie in [−1/3, 0].");
        Alpha = alpha;
        Beta = (1 - alpha) * (1 - alpha) / 4;
        Gamma = 0.5 - alpha;
    }

    /// <summary>HHT α (0 for plain average acceleration).</summary>
    public double Alpha { get; }

    /// <summary>Newmark β.</summary>
    public double Beta { get; }

    /// <summary>Newmark γ.</summary>
    public double Gamma { get; }

    /// <summary>Name printed with results.</summary>
    public string Name => Alpha == 0
        ? "Newmark average acceleration (β = 1/4, γ = 1/2)"
        : FormattableString.Invariant($"Hilber-Hughes-Taylor (α = {Alpha:G4}, β = {Beta:G4}, γ = {Gamma:G4})");

    /// <summary>Integrates <paramref name="system"/> from the initial state over <paramref name="stepCount"/> steps of <paramref name="step"/> s.</summary>
    /// <param name="system">M, C, K.</param>
    /// <param name="load">The load vector in N, evaluated at the step times only.</param>
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

        var m = SymmetricSparseMatrix.From(system.Mass);
        var c = SymmetricSparseMatrix.From(system.Damping);
        var k = SymmetricSparseMatrix.From(system.Stiffness);
        var h = step;
        var a0 = 1 / (Beta * h * h);
        var a1 = Gamma / (Beta * h);
        var a2 = 1 / (Beta * h);
        var a3 = 1 / (2 * Beta) - 1;
        var onePlusAlpha = 1 + Alpha;
        var cv = onePlusAlpha * (1 - Gamma / Beta) - Alpha;
        var ca = onePlusAlpha * h * (1 - Gamma / (2 * Beta));
        var effective = SparseCholesky.Factor(SymmetricSparseMatrix.Combine(
            (a0, system.Mass), (onePlusAlpha * a1, system.Damping), (onePlusAlpha, system.Stiffness)));

        var u = u0.ToArray();
        var v = v0.ToArray();
        var a = new double[n];
        var fOld = new double[n];
        var fNew = new double[n];
        var rhs = new double[n];
        var work = new double[n];
        var next = new double[n];

        load(0, fOld);
        Integration.InitialAcceleration(m, c, k, fOld, u, v, a);
        sink.Accept(0, 0, u, v, a, fOld);

        var massDiagonal = m.IsDiagonal ? Enumerable.Range(0, n).Select(i => m[i, i]).ToArray() : null;
        var damped = c.ActiveIndices;
        for (var s = 1; s <= stepCount; s++)
        {
            var t = s * h;
            load(t, fNew);
            if (massDiagonal is not null)
            {
                for (var i = 0; i < n; i++)
                    rhs[i] = onePlusAlpha * fNew[i] - Alpha * fOld[i] + massDiagonal[i] * (a0 * u[i] + a2 * v[i] + a3 * a[i]);
            }
            else
            {
                for (var i = 0; i < n; i++)
                {
                    rhs[i] = onePlusAlpha * fNew[i] - Alpha * fOld[i];
                    work[i] = a0 * u[i] + a2 * v[i] + a3 * a[i];
                }
                m.MultiplyAdd(1, work, rhs);
            }
            if (Alpha != 0) k.MultiplyAdd(Alpha, u, rhs);
            if (damped.Length > 0)
            {
                // C only reads the DOFs that have a damper, so only those entries of its argument are formed.
                foreach (var i in damped) work[i] = onePlusAlpha * a1 * u[i] - cv * v[i] - ca * a[i];
                c.MultiplyAdd(1, work, rhs);
            }
            effective.Solve(rhs, next);
            for (var i = 0; i < n; i++)
            {
                var aNew = a0 * (next[i] - u[i]) - a2 * v[i] - a3 * a[i];
                v[i] += h * ((1 - Gamma) * a[i] + Gamma * aNew);
                a[i] = aNew;
                u[i] = next[i];
            }
            sink.Accept(s, t, u, v, a, fNew);
            (fOld, fNew) = (fNew, fOld);
        }
    }
}
