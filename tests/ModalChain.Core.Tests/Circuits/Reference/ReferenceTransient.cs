using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;

using ModalChain.Core.Analyses.Circuits;

namespace ModalChain.Core.Tests.Circuits.Reference;

/// <summary>Independent reference for the tests: time responses by the exact solution of the circuit's own ẋ = F x + B u (charge states) over each piece.</summary>
/// <remarks>
/// Over a piece [a, b] of length τ on which the inputs are linear, x(b) = Φ x(a) + Γ₀ u(a) + Γ₁ (u(b) − u(a))/τ, where
/// Φ, Γ₀ and Γ₁ are blocks of the exponential of [[F, B, 0], [0, 0, I], [0, 0, 0]]·τ (Van Loan, "Computing integrals
/// involving the matrix exponential", IEEE Trans. Automatic Control 23 (1978) 395–404; <see cref="MatrixExponential"/>).
/// Each step is cut at the sources' breakpoints (a step's instant, a pulse's ends), so steps, ramps and rectangular
/// pulses are followed exactly whatever the time step; smooth waveforms (sine, half-sine) are taken as linear between
/// the piece's start and its midpoint's secant, second order in the step. The circuit starts at rest: capacitors
/// uncharged, no current in the inductors. The Dirac impulse of capacitor current at the instant a source voltage
/// jumps is not shown (it carries the charge the jump needs; the recorded values are those just after it).
/// </remarks>
internal static class ReferenceTransient
{
    /// <summary>Runs the circuit from rest for <paramref name="duration"/> s with recording step <paramref name="step"/> s.</summary>
    public static CircuitTransientResult Run(CircuitStateSpace space, double duration, double step)
    {
        ArgumentNullException.ThrowIfNull(space);
        if (!(duration > 0) || !double.IsFinite(duration)) throw new ArgumentOutOfRangeException(nameof(duration));
        if (!(step > 0) || !(step <= duration)) throw new ArgumentOutOfRangeException(nameof(step));
        var circuit = space.Analogy.Circuit;
        var waveforms = circuit.VoltageSources.Select(v => v.Waveform).Concat(circuit.CurrentSources.Select(c => c.Waveform)).ToArray();
        var count = (int)Math.Ceiling(duration / step - 1e-9);
        var breakpoints = waveforms.Where(w => w is not null).SelectMany(w => w!.Breakpoints)
            .Where(t => t > 0 && t < count * step).Distinct().Order().ToArray();

        var n = space.StateCount;
        var nu = space.InputCount;
        var full = Discretise(space, step);
        var x = Vector<double>.Build.Dense(n);
        var u = Vector<double>.Build.Dense(nu);
        var times = new double[count + 1];
        var recorder = new Recorder(space, count + 1);
        Inputs(waveforms, 0, u);
        recorder.Record(0, x, u);
        var next = 0;
        for (var k = 0; k < count; k++)
        {
            double a = k * step, b = (k + 1) * step;
            times[k + 1] = b;
            var start = a;
            while (next < breakpoints.Length && breakpoints[next] <= start) next++;
            var cuts = new List<double>();
            while (next < breakpoints.Length && breakpoints[next] < b - 1e-12 * step) cuts.Add(breakpoints[next++]);
            cuts.Add(b);
            foreach (var end in cuts)
            {
                var d = cuts.Count == 1 ? full : Discretise(space, end - start);
                x = Advance(d, x, waveforms, start, end, nu);
                start = end;
            }
            Inputs(waveforms, b, u);
            recorder.Record(k + 1, x, u);
        }
        return recorder.Result([.. times]);
    }

    private sealed record Discrete(Matrix<double> Phi, Matrix<double> Gamma0, Matrix<double> Gamma1, double Length);

    private static Discrete Discretise(CircuitStateSpace space, double tau)
    {
        int n = space.StateCount, nu = space.InputCount;
        var big = Matrix<double>.Build.Dense(n + 2 * nu, n + 2 * nu);
        big.SetSubMatrix(0, 0, space.System * tau);
        big.SetSubMatrix(0, n, space.Input * tau);
        for (var i = 0; i < nu; i++) big[n + i, n + nu + i] = 1; // u̇ = Δu/τ: the third block multiplies the change Δu
        var e = MatrixExponential.Compute(big);
        return new Discrete(e.SubMatrix(0, n, 0, n), e.SubMatrix(0, n, n, nu), e.SubMatrix(0, n, n + nu, nu), tau);
    }

    // u(t) = u_a + (t − a)/τ·Δu on the piece, Δu the secant through the midpoint (exact for a linear piece).
    private static Vector<double> Advance(Discrete d, Vector<double> x, TimeFunction?[] waveforms, double a, double b, int nu)
    {
        var ua = Vector<double>.Build.Dense(nu);
        var change = Vector<double>.Build.Dense(nu);
        for (var i = 0; i < nu; i++)
        {
            if (waveforms[i] is not { } f) continue;
            var start = f.ValueAt(a);
            ua[i] = start;
            change[i] = 2 * (f.ValueAt(0.5 * (a + b)) - start);
        }
        return d.Phi * x + d.Gamma0 * ua + d.Gamma1 * change;
    }

    private static void Inputs(TimeFunction?[] waveforms, double t, Vector<double> u)
    {
        for (var i = 0; i < waveforms.Length; i++) u[i] = waveforms[i]?.ValueAt(t) ?? 0;
    }

    private sealed class Recorder
    {
        private readonly CircuitStateSpace _space;
        private readonly int[] _order;
        private readonly double[][] _volts;
        private readonly List<(string Name, string Kind, Func<Vector<double>, Vector<double>, Vector<double>, double> Current)> _branches = [];
        private readonly double[][] _currents;

        public Recorder(CircuitStateSpace space, int samples)
        {
            _space = space;
            var analogy = space.Analogy;
            var circuit = analogy.Circuit;
            _order = [.. circuit.Nodes.Select(analogy.IndexOf)];
            _volts = [.. _order.Select(_ => new double[samples])];
            int At(string node) => node == Circuit.Ground ? -1 : analogy.IndexOf(node);
            double Of(Vector<double> values, int i) => i < 0 ? 0 : values[i];
            foreach (var r in circuit.Resistors)
            {
                var (a, b) = (At(r.NodeA), At(r.NodeB));
                _branches.Add((r.Name, "resistor", (_, v, _) => (Of(v, a) - Of(v, b)) / r.Ohms));
            }
            foreach (var l in circuit.Inductors)
            {
                var (a, b) = (At(l.NodeA), At(l.NodeB));
                _branches.Add((l.Name, "inductor", (lambda, _, _) => (Of(lambda, a) - Of(lambda, b)) / l.Henries));
            }
            foreach (var c in circuit.Capacitors)
            {
                var (a, b) = (At(c.NodeA), At(c.NodeB));
                _branches.Add((c.Name, "capacitor", (_, _, dv) => c.Farads * (Of(dv, a) - Of(dv, b))));
            }
            for (var s = 0; s < circuit.VoltageSources.Length; s++)
            {
                var (node, sign) = analogy.VoltageSourceNodes[s];
                var row = s;
                _branches.Add((circuit.VoltageSources[s].Name, "voltage-source", (lambda, v, dv) =>
                {
                    var balance = 0.0;
                    for (var j = 0; j < lambda.Count; j++)
                        balance += analogy.Capacitance[node, j] * dv[j] + analogy.Conductance[node, j] * v[j] + analogy.InverseInductance[node, j] * lambda[j];
                    return sign * (balance - _current![node]);
                }));
            }
            _currents = [.. _branches.Select(_ => new double[samples])];
        }

        private Vector<double>? _current;

        public void Record(int k, Vector<double> x, Vector<double> u)
        {
            var lambda = _space.Flux * x;
            var v = _space.Voltage * x + _space.VoltageInput * u;
            // Node voltage rates from ẋ = F x + B u; the source's own jumps (impulses) are left out.
            var dv = _space.Voltage * (_space.System * x + _space.Input * u);
            _current = _space.Injection * u;
            for (var i = 0; i < _order.Length; i++) _volts[i][k] = v[_order[i]];
            for (var b = 0; b < _branches.Count; b++) _currents[b][k] = _branches[b].Current(lambda, v, dv);
        }

        public CircuitTransientResult Result(ImmutableArray<double> times) =>
            new(times, _space.Analogy.Circuit.Nodes, [.. _volts.Select(h => h.ToImmutableArray())],
                [.. _branches.Select((b, i) => new CircuitBranchHistory(b.Name, b.Kind, [.. _currents[i]]))]);
    }
}
