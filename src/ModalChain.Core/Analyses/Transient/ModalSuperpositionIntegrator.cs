using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Solvers;

namespace ModalChain.Core.Analyses.Transient;

/// <summary>Modal superposition: each retained mode integrated exactly for a load linear between steps.</summary>
/// <remarks>
/// With mass-normalised shapes Φ (ΦᵀMΦ = I), u ≈ Φ q and each modal coordinate obeys
/// q̈ⱼ + 2ζⱼωⱼ q̇ⱼ + ωⱼ² qⱼ = pⱼ(t) = φⱼᵀ f(t). For pⱼ linear over a step, the state (qⱼ, q̇ⱼ) advances exactly by
/// (qⱼ, q̇ⱼ)₊ = Φⱼ (qⱼ, q̇ⱼ) + Γ₀ⱼ pⱼ + Γ₁ⱼ (pⱼ₊ − pⱼ); the 2×2 coefficients are the closed-form recurrence of
/// Nigam &amp; Jennings, "Calculation of response spectra from strong-motion earthquake records", Bull. Seismol. Soc.
/// Am. 59 (1969) 909–922, computed here from the same first-order-hold exponential as
/// <see cref="StateSpaceExactIntegrator"/> so that they hold for any ζ ≥ 0 and for rigid-body modes (ω = 0).
/// The initial modal state is q₀ = ΦᵀM u₀, q̇₀ = ΦᵀM u̇₀; modal accelerations are q̈ = p − 2ζω q̇ − ω² q.
/// The load is kept factored (<see cref="LoadSet"/>) so each distribution is projected once and a step costs
/// O(modes × load terms), independent of the number of DOFs. The sink receives modal coordinates.
/// </remarks>
public sealed class ModalSuperpositionIntegrator
{
    /// <summary>Name printed with results.</summary>
    public string Name => "modal superposition (exact per mode, first-order hold)";

    /// <summary>Integrates the modal equations over <paramref name="stepCount"/> steps of <paramref name="step"/> s.</summary>
    /// <param name="shapes">Mass-normalised shapes Φ, n × m, in 1/√kg.</param>
    /// <param name="angularFrequencies">ωⱼ in rad/s, one per retained mode.</param>
    /// <param name="dampingRatios">ζⱼ (dimensionless, ≥ 0), one per retained mode.</param>
    /// <param name="mass">Mass matrix M in kg (to project the initial state).</param>
    /// <param name="load">The load, factored into distributions and time functions.</param>
    /// <param name="u0">Initial displacement in m.</param>
    /// <param name="v0">Initial velocity in m/s.</param>
    /// <param name="step">Time step h in s.</param>
    /// <param name="stepCount">Number of steps.</param>
    /// <param name="sink">Receives q, q̇, q̈ and p (modal coordinates) at every step, step 0 included.</param>
    public void Run(Matrix<double> shapes, IReadOnlyList<double> angularFrequencies, IReadOnlyList<double> dampingRatios,
        Matrix<double> mass, LoadSet load, ReadOnlySpan<double> u0, ReadOnlySpan<double> v0,
        double step, int stepCount, IStepSink sink)
    {
        ArgumentNullException.ThrowIfNull(shapes);
        ArgumentNullException.ThrowIfNull(angularFrequencies);
        ArgumentNullException.ThrowIfNull(dampingRatios);
        ArgumentNullException.ThrowIfNull(mass);
        ArgumentNullException.ThrowIfNull(load);
        ArgumentNullException.ThrowIfNull(sink);
        var n = shapes.RowCount;
        var modes = shapes.ColumnCount;
        if (angularFrequencies.Count != modes || dampingRatios.Count != modes)
            throw new ArgumentException($"{modes} shapes but {angularFrequencies.Count} frequencies and {dampingRatios.Count} damping ratios.");
        if (load.Size != n) throw new ArgumentException($"The load has {load.Size} DOFs but the shapes {n}.", nameof(load));
        Integration.CheckRun(n, u0, v0, step, stepCount);
        for (var j = 0; j < modes; j++)
        {
            Guard.NonNegative(angularFrequencies[j], "angularFrequencies");
            Guard.NonNegative(dampingRatios[j], "dampingRatios");
        }

        var coefficients = new double[modes * 8];
        for (var j = 0; j < modes; j++) StepCoefficients(angularFrequencies[j], dampingRatios[j], step).CopyTo(coefficients, 8 * j);

        // Projected distributions: for term r, Φᵀ b_r (one value per mode).
        var terms = load.Terms;
        var projected = new double[terms.Length * modes];
        for (var r = 0; r < terms.Length; r++)
            foreach (var (dof, weight) in terms[r].Distribution)
                for (var j = 0; j < modes; j++) projected[r * modes + j] += weight * shapes[dof, j];

        var mu0 = mass * Vector<double>.Build.DenseOfArray(u0.ToArray());
        var mv0 = mass * Vector<double>.Build.DenseOfArray(v0.ToArray());
        var q = shapes.TransposeThisAndMultiply(mu0).ToArray();
        var qd = shapes.TransposeThisAndMultiply(mv0).ToArray();
        var qdd = new double[modes];
        var pOld = new double[modes];
        var pNew = new double[modes];
        var twoZetaOmega = new double[modes];
        var omega2 = new double[modes];
        for (var j = 0; j < modes; j++)
        {
            twoZetaOmega[j] = 2 * dampingRatios[j] * angularFrequencies[j];
            omega2[j] = angularFrequencies[j] * angularFrequencies[j];
        }

        Project(terms, projected, modes, 0, pOld);
        for (var j = 0; j < modes; j++) qdd[j] = pOld[j] - twoZetaOmega[j] * qd[j] - omega2[j] * q[j];
        sink.Accept(0, 0, q, qd, qdd, pOld);

        for (var s = 1; s <= stepCount; s++)
        {
            var t = s * step;
            Project(terms, projected, modes, t, pNew);
            for (var j = 0; j < modes; j++)
            {
                var o = 8 * j;
                var dp = pNew[j] - pOld[j];
                var qj = q[j];
                var vj = qd[j];
                q[j] = coefficients[o] * qj + coefficients[o + 1] * vj + coefficients[o + 4] * pOld[j] + coefficients[o + 6] * dp;
                qd[j] = coefficients[o + 2] * qj + coefficients[o + 3] * vj + coefficients[o + 5] * pOld[j] + coefficients[o + 7] * dp;
                qdd[j] = pNew[j] - twoZetaOmega[j] * qd[j] - omega2[j] * q[j];
            }
            sink.Accept(s, t, q, qd, qdd, pNew);
            (pOld, pNew) = (pNew, pOld);
        }
    }

    /// <summary>p(t) = Σ_r (Φᵀ b_r) g_r(t) into <paramref name="p"/>.</summary>
    private static void Project(ImmutableArray<LoadTerm> terms, double[] projected, int modes, double time, double[] p)
    {
        Array.Clear(p);
        for (var r = 0; r < terms.Length; r++)
        {
            var g = terms[r].Time.ValueAt(time);
            if (g == 0) continue;
            var offset = r * modes;
            for (var j = 0; j < modes; j++) p[j] += projected[offset + j] * g;
        }
    }

    /// <summary>The eight step coefficients of one mode: Φ (row-major 2×2), Γ₀ (2), Γ₁ (2).</summary>
    internal static double[] StepCoefficients(double omega, double zeta, double step)
    {
        var w = Matrix<double>.Build.Dense(4, 4);
        w[0, 1] = step;
        w[1, 0] = -omega * omega * step;
        w[1, 1] = -2 * zeta * omega * step;
        w[1, 2] = step;
        w[2, 3] = 1;
        var e = MatrixExponential.Compute(w);
        return [e[0, 0], e[0, 1], e[1, 0], e[1, 1], e[0, 2], e[1, 2], e[0, 3], e[1, 3]];
    }
}
