using System.Collections.Immutable;
using System.Globalization;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;

namespace ModalChain.Core.Analyses.FirstOrder;

/// <summary>Receives one recorded instant of a <see cref="DrivenFirstOrderSystem"/> run.</summary>
/// <param name="index">0-based sample number.</param>
/// <param name="time">Time in s.</param>
/// <param name="sample">The motion of every free DOF and support at that instant (valid during the call only).</param>
public delegate void DrivenSampleSink(int index, double time, DrivenSample sample);

/// <summary>The motion of a line network at one instant of a <see cref="DrivenFirstOrderSystem"/> run.</summary>
/// <param name="Displacement">Free DOFs' displacements in m.</param>
/// <param name="Velocity">Free DOFs' velocities in m/s (massless DOFs' included, from their first-order or static rows).</param>
/// <param name="Acceleration">Free DOFs' accelerations in m/s² at DOFs with inertia; NaN at massless DOFs (not computed).</param>
/// <param name="SupportDisplacement">Every support's displacement in m, in the partition's support order (ground first, 0).</param>
/// <param name="SupportVelocity">Every support's velocity in m/s.</param>
/// <param name="SupportAcceleration">Every support's acceleration in m/s² (the slope of its velocity over the piece that starts here).</param>
/// <param name="Inputs">The inputs' values: support velocities (m/s), then forces (N per unit input).</param>
public sealed record DrivenSample(double[] Displacement, double[] Velocity, double[] Acceleration,
    double[] SupportDisplacement, double[] SupportVelocity, double[] SupportAcceleration, double[] Inputs);

/// <summary>
/// The first-order form of a line network (<see cref="FirstOrderSystem"/>) driven by forces and by supports whose
/// velocity is prescribed, integrated exactly for inputs linear over each piece, with pieces cut at the inputs' breakpoints.
/// </summary>
/// <remarks>
/// <para>The free DOFs obey M ẍ + C ẋ + K x = F(t) − K_fp x_p − C_fp v_p − M_fp v̇_p (<see cref="SupportPartition"/>), with
/// v_p(t) the prescribed velocity of each driven support and x_p = ∫v_p its displacement. With the state z = [x_r; ẋ_r; x_d]
/// of <see cref="FirstOrderSystem"/> (ż = A z + B F̃, F̃ = R F the condensed load) and x_p appended, y = [z; x_p] obeys
/// ẏ = Ã y + B̃ u + D̃ u̇ for the inputs u = [v_p; forces]: Ã = [[A, −B R K_fp], [0, 0]],
/// B̃ = [[−B R C_fp, B R F_j], [I, 0]], D̃ = [[−B R M_fp, 0], [0, 0]].</para>
/// <para>Over a piece [a, b] of length τ with u(t) = u_a + δ (t − a)/τ, y(b) = Φ y(a) + Γ₀ u_a + Γ₁ δ, where Φ, Γ₀ and Γ₁
/// are blocks of the exponential of [[Ãτ, B̃τ, D̃], [0, 0, I], [0, 0, 0]] (Van Loan, "Computing integrals involving the
/// matrix exponential", IEEE Trans. Automatic Control 23 (1978) 395–404; <see cref="MatrixExponential"/>). Each recording
/// step is cut at the inputs' breakpoints (a step's instant, a pulse's ends), so steps, ramps and rectangular pulses
/// are followed exactly whatever the step; a smooth input is taken on each piece as its start value and the secant
/// through the piece's midpoint (second order in the step).</para>
/// <para>Where a prescribed velocity jumps by Δ (a step, or between the pieces of a smooth input) the support's
/// acceleration is an impulse: the inertial DOFs an inerter joins to it take the velocity jump D̃Δ at once
/// (−M_rr⁻¹M_rp Δ, the momentum balance M_rr ẋ_r + M_rp v_p kept continuous); displacements stay continuous. The
/// recorded values are those just after such a jump. The network starts at rest and unloaded, with every support at
/// x_p = 0, v_p = 0 before t = 0. Dense, as <see cref="FirstOrderIntegrator"/>: up to
/// <see cref="Transient.TransientAnalysis.ExactMethodMaxDofs"/> free DOFs.</para>
/// </remarks>
public sealed class DrivenFirstOrderSystem
{
    private readonly Matrix<double> _a;
    private readonly Matrix<double> _b;
    private readonly Matrix<double> _d;
    private readonly double[][] _forces;

    private DrivenFirstOrderSystem(SupportPartition partition, FirstOrderSystem system, ImmutableArray<int> driven,
        double[][] forces, Matrix<double> a, Matrix<double> b, Matrix<double> d)
    {
        Partition = partition;
        System = system;
        DrivenSupports = driven;
        _forces = forces;
        _a = a;
        _b = b;
        _d = d;
    }

    /// <summary>The network's free/support partition.</summary>
    public SupportPartition Partition { get; }

    /// <summary>The first-order form of the free DOFs.</summary>
    public FirstOrderSystem System { get; }

    /// <summary>Columns (in <see cref="SupportPartition.Supports"/>) of the supports moved at a prescribed velocity: the first inputs.</summary>
    public ImmutableArray<int> DrivenSupports { get; }

    /// <summary>Number of force inputs (after the support velocities).</summary>
    public int ForceCount => _forces.Length;

    /// <summary>Number of inputs: driven supports' velocities, then forces.</summary>
    public int InputCount => DrivenSupports.Length + _forces.Length;

    private int StateCount => System.Order + DrivenSupports.Length;

    /// <summary>Builds the driven form of <paramref name="partition"/> (a line network's).</summary>
    /// <param name="partition">The network's partition; C is its discrete dampers.</param>
    /// <param name="drivenSupports">Names of the supports whose velocity is prescribed (never ground), in input order.</param>
    /// <param name="forces">Per force input, the force in N per unit input on each free DOF.</param>
    /// <exception cref="NumericalFailureException">The first-order form cannot be built (see <see cref="FirstOrderSystem.Build"/>), or the network is too large.</exception>
    public static DrivenFirstOrderSystem Build(SupportPartition partition, IReadOnlyList<string> drivenSupports, IReadOnlyList<double[]> forces)
    {
        ArgumentNullException.ThrowIfNull(partition);
        ArgumentNullException.ThrowIfNull(drivenSupports);
        ArgumentNullException.ThrowIfNull(forces);
        var n = partition.FreeCount;
        if (n > Transient.TransientAnalysis.ExactMethodMaxDofs)
            throw new NumericalFailureException(string.Create(CultureInfo.InvariantCulture,
                $"the first-order form is dense and limited to {Transient.TransientAnalysis.ExactMethodMaxDofs} free DOFs; the network has {n}"));
        var driven = drivenSupports.Select(s =>
        {
            var column = partition.SupportIndex(s);
            return column > 0 ? column : throw new ArgumentException($"'{s}' is not a support that can move (ground is fixed).", nameof(drivenSupports));
        }).ToImmutableArray();
        foreach (var f in forces)
            if (f.Length != n) throw new ArgumentException($"A force input has {f.Length} entries; the network has {n} free DOFs.", nameof(forces));

        var system = FirstOrderSystem.Build(partition.Mass, partition.DamperFF, partition.StiffnessFF, partition.Free.Label);
        var order = system.Order;
        var condensation = system.Condensation;
        var nk = condensation.Kept.Length;
        // R: F̃ = R F, the condensed load of a full load (F_k + Tᵀ F_c).
        var reduce = Matrix<double>.Build.Dense(nk, n);
        for (var k = 0; k < nk; k++) reduce[k, condensation.Kept[k]] = 1;
        for (var c = 0; c < condensation.Condensed.Length; c++)
            for (var k = 0; k < nk; k++) reduce[k, condensation.Condensed[c]] += condensation.Transfer[c, k];
        var br = system.Input * reduce;

        var nv = driven.Length;
        var nu = nv + forces.Count;
        var size = order + nv;
        var a = Matrix<double>.Build.Dense(size, size);
        var b = Matrix<double>.Build.Dense(size, nu);
        var d = Matrix<double>.Build.Dense(size, nu);
        a.SetSubMatrix(0, 0, system.State);
        for (var s = 0; s < nv; s++)
        {
            var column = driven[s];
            var kp = br * partition.StiffnessFP.Column(column);
            var cp = br * partition.DamperFP.Column(column);
            var mp = br * partition.MassFP.Column(column);
            for (var i = 0; i < order; i++)
            {
                a[i, order + s] = -kp[i];
                b[i, s] = -cp[i];
                d[i, s] = -mp[i];
            }
            b[order + s, s] = 1;
        }
        for (var j = 0; j < forces.Count; j++)
        {
            var column = br * Vector<double>.Build.DenseOfArray(forces[j]);
            for (var i = 0; i < order; i++) b[i, nv + j] = column[i];
        }
        return new DrivenFirstOrderSystem(partition, system, driven, [.. forces.Select(f => (double[])f.Clone())], a, b, d);
    }

    /// <summary>Runs from rest for <paramref name="duration"/> s, recording every <paramref name="step"/> s (t = 0 included).</summary>
    /// <param name="inputs">Per input, its value against time (m/s for a support velocity, the unit input for a force); null for 0.</param>
    /// <param name="duration">Duration in s; positive.</param>
    /// <param name="step">Recording step in s; positive and at most the duration.</param>
    /// <param name="sink">Receives each recorded instant.</param>
    /// <returns>The number of samples recorded.</returns>
    public int Run(IReadOnlyList<TimeFunction?> inputs, double duration, double step, DrivenSampleSink sink)
    {
        ArgumentNullException.ThrowIfNull(inputs);
        ArgumentNullException.ThrowIfNull(sink);
        if (inputs.Count != InputCount) throw new ArgumentException($"{inputs.Count} inputs given; the system has {InputCount}.", nameof(inputs));
        if (!(duration > 0) || !double.IsFinite(duration)) throw new ArgumentOutOfRangeException(nameof(duration));
        if (!(step > 0) || !(step <= duration)) throw new ArgumentOutOfRangeException(nameof(step));
        var count = (int)Math.Ceiling(duration / step - 1e-9);
        var breakpoints = inputs.Where(w => w is not null).SelectMany(w => w!.Breakpoints)
            .Where(t => t > 0 && t < count * step).Distinct().Order().ToArray();

        var nu = InputCount;
        var full = Discretise(step);
        var y = Vector<double>.Build.Dense(StateCount);
        var held = Vector<double>.Build.Dense(nu); // the inputs' values as the state last saw them (0 before t = 0)
        var next = 0;
        Jump(y, held, inputs, 0);
        Record(sink, 0, 0, y, inputs, NextPiece(0, step, breakpoints, ref next));
        next = 0;
        for (var k = 0; k < count; k++)
        {
            double a = k * step, b = (k + 1) * step;
            var start = a;
            while (next < breakpoints.Length && breakpoints[next] <= start) next++;
            var cuts = new List<double>();
            while (next < breakpoints.Length && breakpoints[next] < b - 1e-12 * step) cuts.Add(breakpoints[next++]);
            cuts.Add(b);
            foreach (var end in cuts)
            {
                Jump(y, held, inputs, start);
                var piece = cuts.Count == 1 ? full : Discretise(end - start);
                var (ua, change) = Hold(inputs, start, end);
                y = piece.Phi * y + piece.Gamma0 * ua + piece.Gamma1 * change;
                held = ua + change;
                start = end;
            }
            Jump(y, held, inputs, b);
            var probe = next;
            Record(sink, k + 1, b, y, inputs, NextPiece(b, step, breakpoints, ref probe));
        }
        return count + 1;
    }

    // A prescribed velocity that differs from the value the state last saw has jumped: apply the impulse D̃Δ.
    private void Jump(Vector<double> y, Vector<double> held, IReadOnlyList<TimeFunction?> inputs, double t)
    {
        for (var i = 0; i < InputCount; i++)
        {
            var now = inputs[i]?.ValueAt(t) ?? 0;
            var change = now - held[i];
            held[i] = now;
            if (change == 0) continue;
            for (var r = 0; r < y.Count; r++) y[r] += _d[r, i] * change;
        }
    }

    // The length of the piece that starts at t: up to the next breakpoint or one step.
    private static double NextPiece(double t, double step, double[] breakpoints, ref int next)
    {
        while (next < breakpoints.Length && breakpoints[next] <= t) next++;
        return next < breakpoints.Length && breakpoints[next] < t + step ? breakpoints[next] - t : step;
    }

    // u(t) = u_a + (t − a)/τ·δ on the piece, δ the secant through the midpoint (exact for a linear piece).
    private (Vector<double> Start, Vector<double> Change) Hold(IReadOnlyList<TimeFunction?> inputs, double a, double b)
    {
        var ua = Vector<double>.Build.Dense(InputCount);
        var change = Vector<double>.Build.Dense(InputCount);
        for (var i = 0; i < InputCount; i++)
        {
            if (inputs[i] is not { } f) continue;
            var start = f.ValueAt(a);
            ua[i] = start;
            change[i] = 2 * (f.ValueAt(0.5 * (a + b)) - start);
        }
        return (ua, change);
    }

    private sealed record Discrete(Matrix<double> Phi, Matrix<double> Gamma0, Matrix<double> Gamma1);

    private Discrete Discretise(double tau)
    {
        int n = StateCount, nu = InputCount;
        var big = Matrix<double>.Build.Dense(n + 2 * nu, n + 2 * nu);
        big.SetSubMatrix(0, 0, _a * tau);
        big.SetSubMatrix(0, n, _b * tau);
        big.SetSubMatrix(0, n + nu, _d);
        for (var i = 0; i < nu; i++) big[n + i, n + nu + i] = 1;
        // Displacements, velocities and inputs may differ by many orders of magnitude (an electrical analogue's fluxes
        // and voltages): the exponential is taken of the balanced matrix D⁻¹WD and scaled back, e^W = D e^{D⁻¹WD} D⁻¹,
        // which keeps the small entries that carry the slow parts of the response (D in powers of two: exact).
        var scale = FirstOrderRoots.Balance(big);
        var e = MatrixExponential.Compute(big);
        for (var i = 0; i < e.RowCount; i++)
            for (var j = 0; j < e.ColumnCount; j++) e[i, j] *= scale[i] / scale[j];
        return new Discrete(e.SubMatrix(0, n, 0, n), e.SubMatrix(0, n, n, nu), e.SubMatrix(0, n, n + nu, nu));
    }

    private void Record(DrivenSampleSink sink, int index, double t, Vector<double> y, IReadOnlyList<TimeFunction?> inputs, double piece)
    {
        var p = Partition;
        var n = p.FreeCount;
        var nv = DrivenSupports.Length;
        var order = System.Order;
        var (u, change) = Hold(inputs, t, t + piece);
        var rate = change / piece;
        var xp = new double[p.SupportCount];
        var vp = new double[p.SupportCount];
        var ap = new double[p.SupportCount];
        for (var s = 0; s < nv; s++)
        {
            xp[DrivenSupports[s]] = y[order + s];
            vp[DrivenSupports[s]] = u[s];
            ap[DrivenSupports[s]] = rate[s];
        }
        // The full load on the free DOFs and its rate: applied forces and the supports' coupling.
        var load = new double[n];
        var loadRate = new double[n];
        for (var j = 0; j < _forces.Length; j++)
            for (var i = 0; i < n; i++)
            {
                load[i] += _forces[j][i] * u[nv + j];
                loadRate[i] += _forces[j][i] * rate[nv + j];
            }
        foreach (var column in DrivenSupports)
            for (var i = 0; i < n; i++)
            {
                load[i] -= p.StiffnessFP[i, column] * xp[column] + p.DamperFP[i, column] * vp[column] + p.MassFP[i, column] * ap[column];
                loadRate[i] -= p.StiffnessFP[i, column] * vp[column] + p.DamperFP[i, column] * ap[column];
            }
        var z = y.SubVector(0, order).ToArray();
        var displacement = System.Displacements(z, load);
        var velocity = System.Velocities(z, load, loadRate);
        var zdot = System.Derivative(z, load);
        var acceleration = new double[n];
        Array.Fill(acceleration, double.NaN);
        var nr = System.InertialCount;
        for (var i = 0; i < nr; i++) acceleration[System.Classes.Inertial[i]] = zdot[nr + i];
        sink(index, t, new DrivenSample(displacement, velocity, acceleration, xp, vp, ap, u.ToArray()));
    }
}
