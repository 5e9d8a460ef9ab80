using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Solvers;

namespace ModalChain.Core.Analyses.FirstOrder;

/// <summary>The exact discrete-time solution of a model with massless nodes, in the state-space form of <see cref="FirstOrderSystem"/>.</summary>
/// <remarks>
/// <para>ż = A z + B F̃ with z = [x_r; ẋ_r; x_d] and the load linear between steps (first-order hold) gives
/// z₊ = Φ z + Γ₀ F̃ + Γ₁ (F̃₊ − F̃), Φ = e^{Ah}, from one exponential of [[A, B, 0], [0, 0, I/h], [0, 0, 0]]·h (Van Loan
/// 1978, as <see cref="StateSpaceExactIntegrator"/>). No M⁻¹ of the whole model is needed: the massless DOFs' own
/// velocities come from the first-order rows (ẋ_d) and the static rows (ẋ_s = T ẋ_k + G ḟ_s with the hold's slope
/// ḟ), their accelerations from z̈ = A ż + B Ḟ̃ (the load's second derivative, zero under the hold, is left out).
/// The sink receives every DOF, massless ones included, so the energy balance of the physical M, C and K closes as
/// for any other model.</para>
/// <para>Initial conditions: x_r, ẋ_r and x_d are states and are taken as given; a massless node's initial velocity and
/// a static massless node's initial displacement are not states (they follow from the others) and are ignored.</para>
/// </remarks>
public sealed class FirstOrderIntegrator
{
    /// <summary>Name printed with results.</summary>
    public string Name => "exact state-space discretisation of the first-order form (massless nodes, first-order hold)";

    /// <summary>Integrates <paramref name="system"/> over <paramref name="stepCount"/> steps of <paramref name="step"/> s.</summary>
    /// <param name="system">The state-space form.</param>
    /// <param name="load">The full load vector in N (every free DOF), sampled at the step times, linear between them.</param>
    /// <param name="u0">Initial displacement in m (every free DOF).</param>
    /// <param name="v0">Initial velocity in m/s (every free DOF).</param>
    /// <param name="step">Time step h in s.</param>
    /// <param name="stepCount">Number of steps.</param>
    /// <param name="sink">Receives every state, step 0 included, over every free DOF.</param>
    public void Run(FirstOrderSystem system, LoadVector load, ReadOnlySpan<double> u0, ReadOnlySpan<double> v0,
        double step, int stepCount, IStepSink sink)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(load);
        ArgumentNullException.ThrowIfNull(sink);
        var n = system.Size;
        if (u0.Length != n || v0.Length != n)
            throw new ArgumentException($"The system has {n} DOFs but the initial state has {u0.Length} displacements and {v0.Length} velocities.");
        Guard.Positive(step, nameof(step));
        if (stepCount < 1) throw new ArgumentOutOfRangeException(nameof(stepCount), stepCount, "At least one step is needed.");

        var (phi, gamma0, gamma1) = Discretise(system, step);
        var order = system.Order;
        var nk = system.Condensation.Kept.Length;
        var phiRows = phi.ToRowMajorArray();
        var g0Rows = (gamma0 - gamma1).ToRowMajorArray();
        var g1Rows = gamma1.ToRowMajorArray();

        var z = system.StateOf(u0, v0);
        var zNew = new double[order];
        var fOld = new double[n];
        var fNew = new double[n];
        var rate = new double[n];
        load(0, fOld);
        load(step, fNew);
        for (var i = 0; i < n; i++) rate[i] = (fNew[i] - fOld[i]) / step;
        Emit(system, sink, 0, 0, z, fOld, rate);
        var rOld = system.ReduceLoad(fOld);

        for (var s = 1; s <= stepCount; s++)
        {
            var t = s * step;
            load(t, fNew);
            var rNew = system.ReduceLoad(fNew);
            for (var i = 0; i < order; i++)
            {
                var sum = 0.0;
                var row = i * order;
                for (var j = 0; j < order; j++) sum += phiRows[row + j] * z[j];
                var rowIn = i * nk;
                for (var j = 0; j < nk; j++) sum += g0Rows[rowIn + j] * rOld[j] + g1Rows[rowIn + j] * rNew[j];
                zNew[i] = sum;
            }
            (z, zNew) = (zNew, z);
            for (var i = 0; i < n; i++) rate[i] = (fNew[i] - fOld[i]) / step;
            Emit(system, sink, s, t, z, fNew, rate);
            (fOld, fNew) = (fNew, fOld);
            rOld = rNew;
        }
    }

    /// <summary>Hands the sink every DOF's displacement, velocity and acceleration of state <paramref name="z"/>.</summary>
    private static void Emit(FirstOrderSystem system, IStepSink sink, int step, double time, double[] z, double[] force, double[] rate)
    {
        var u = system.Displacements(z, force);
        var zdot = system.Derivative(z, force);
        var v = system.Velocities(z, force, rate);
        // z̈ = A ż + B Ḟ̃: its x_r rows are ẍ_r (= ż's ẋ_r rows), its x_d rows ẍ_d.
        var zddot = Second(system, zdot, rate);
        var nr = system.InertialCount;
        var kept = new double[system.Condensation.Kept.Length];
        for (var i = 0; i < nr; i++) kept[system.InertialSlots[i]] = zdot[nr + i];
        for (var i = 0; i < system.FirstOrderCount; i++) kept[system.FirstOrderSlots[i]] = zddot[2 * nr + i];
        var a = system.Condensation.Expand(kept);
        sink.Accept(step, time, u, v, a, force);
    }

    private static double[] Second(FirstOrderSystem system, double[] zdot, double[] rate)
    {
        var order = system.Order;
        var f = system.ReduceLoad(rate);
        var result = new double[order];
        for (var i = 0; i < order; i++)
        {
            var sum = 0.0;
            for (var j = 0; j < order; j++) sum += system.State[i, j] * zdot[j];
            for (var j = 0; j < f.Length; j++) sum += system.Input[i, j] * f[j];
            result[i] = sum;
        }
        return result;
    }

    /// <summary>Φ, Γ₀ and Γ₁ of the first-order-hold discretisation for step <paramref name="step"/> s.</summary>
    internal static (Matrix<double> Phi, Matrix<double> Gamma0, Matrix<double> Gamma1) Discretise(FirstOrderSystem system, double step)
    {
        var order = system.Order;
        var nk = system.Condensation.Kept.Length;
        var w = Matrix<double>.Build.Dense(order + 2 * nk, order + 2 * nk);
        w.SetSubMatrix(0, 0, system.State * step);
        w.SetSubMatrix(0, order, system.Input * step);
        w.SetSubMatrix(order, order + nk, Matrix<double>.Build.DenseIdentity(nk));
        var e = MatrixExponential.Compute(w);
        return (e.SubMatrix(0, order, 0, order), e.SubMatrix(0, order, order, nk), e.SubMatrix(0, order, order + nk, nk));
    }
}
