using System.Collections.Immutable;
using System.Numerics;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Model;

using ModalChain.Core.Analyses.Circuits;

namespace ModalChain.Core.Tests.Circuits.Reference;

/// <summary>Independent reference for the tests: impedances and transfer functions by a dense complex solve of the node flux matrices at each frequency.</summary>
/// <remarks>
/// With every source but one switched off (voltage sources shorted, current sources open), the node flux phasors solve
/// (Γ + iωG − ω²C)_ff Λ_f = I_f − (Γ + iωG − ω²C)_fp Λ_p with Λ_p = ±V/(iω) at the node the driving voltage source
/// holds; node voltages are iωΛ. The current a voltage source delivers is the current balance of its node,
/// (Γ + iωG − ω²C)_p· Λ. Massless nodes need nothing special here. One dense LU per frequency.
/// </remarks>
internal static class ReferenceFrequencyResponse
{
    /// <summary>The response to each source of the circuit, alone, at <paramref name="frequenciesHz"/> (each positive).</summary>
    /// <exception cref="NumericalFailureException">The circuit matrix is singular at a frequency (a lossless resonance hit exactly).</exception>
    public static ImmutableArray<CircuitSourceResponse> Solve(CircuitAnalogy analogy, IReadOnlyList<double> frequenciesHz)
    {
        ArgumentNullException.ThrowIfNull(analogy);
        ArgumentNullException.ThrowIfNull(frequenciesHz);
        foreach (var f in frequenciesHz)
            if (!(f > 0) || !double.IsFinite(f)) throw new ArgumentOutOfRangeException(nameof(frequenciesHz), f, "Frequencies must be positive and finite.");
        var circuit = analogy.Circuit;
        var order = circuit.Nodes.Select(analogy.IndexOf).ToArray();
        var responses = new List<CircuitSourceResponse>();
        for (var s = 0; s < circuit.VoltageSources.Length; s++)
            responses.Add(Sweep(analogy, frequenciesHz, order, circuit.VoltageSources[s].Name, true, s));
        for (var s = 0; s < circuit.CurrentSources.Length; s++)
            responses.Add(Sweep(analogy, frequenciesHz, order, circuit.CurrentSources[s].Name, false, s));
        return [.. responses];
    }

    private static CircuitSourceResponse Sweep(CircuitAnalogy analogy, IReadOnlyList<double> frequencies, int[] order,
        string name, bool voltage, int source)
    {
        var n = analogy.Nodes.Length;
        var free = analogy.FreeCount;
        var impedance = new Complex[frequencies.Count];
        var transfer = new ImmutableArray<Complex>[frequencies.Count];
        for (var k = 0; k < frequencies.Count; k++)
        {
            var w = 2 * Math.PI * frequencies[k];
            var iw = new Complex(0, w);
            var a = Matrix<Complex>.Build.Dense(n, n, (i, j) =>
                new Complex(analogy.InverseInductance[i, j] - w * w * analogy.Capacitance[i, j], w * analogy.Conductance[i, j]));
            var flux = new Complex[n];
            int heldNode = -1, sign = 1;
            if (voltage)
            {
                (heldNode, sign) = analogy.VoltageSourceNodes[source];
                flux[heldNode] = sign / iw;
            }
            var rhs = MathNet.Numerics.LinearAlgebra.Vector<Complex>.Build.Dense(free);
            if (!voltage)
            {
                var cs = analogy.Circuit.CurrentSources[source];
                // (The production path before the engine indexed past the free block here for a current into a node a
                // voltage source holds; such a current flows into the source and moves nothing.)
                if (cs.To != Circuit.Ground && analogy.IndexOf(cs.To) < free) rhs[analogy.IndexOf(cs.To)] += 1;
                if (cs.From != Circuit.Ground && analogy.IndexOf(cs.From) < free) rhs[analogy.IndexOf(cs.From)] -= 1;
            }
            else
            {
                for (var i = 0; i < free; i++) rhs[i] -= a[i, heldNode] * flux[heldNode];
            }
            if (free > 0)
            {
                var aff = a.SubMatrix(0, free, 0, free);
                var solved = aff.LU().Solve(rhs);
                if (solved.Any(v => !double.IsFinite(v.Real) || !double.IsFinite(v.Imaginary)))
                    throw new NumericalFailureException($"The circuit matrix is singular at {frequencies[k].ToString("G6", System.Globalization.CultureInfo.InvariantCulture)} Hz (a lossless resonance).");
                for (var i = 0; i < free; i++) flux[i] = solved[i];
            }
            var volts = flux.Select(l => iw * l).ToArray();
            if (voltage)
            {
                var delivered = Complex.Zero;
                for (var j = 0; j < n; j++) delivered += a[heldNode, j] * flux[j];
                impedance[k] = 1 / (sign * delivered);
            }
            else
            {
                var cs = analogy.Circuit.CurrentSources[source];
                Complex At(string node) => node == Circuit.Ground ? Complex.Zero : volts[analogy.IndexOf(node)];
                impedance[k] = At(cs.To) - At(cs.From);
            }
            transfer[k] = [.. order.Select(i => volts[i])];
        }
        return new CircuitSourceResponse(name, voltage, [.. frequencies], [.. impedance], analogy.Circuit.Nodes, [.. transfer]);
    }
}
