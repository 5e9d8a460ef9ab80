using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Model;

using ModalChain.Core;
using ModalChain.Core.Analyses.Circuits;

namespace ModalChain.Core.Tests.Circuits.Reference;

/// <summary>The first-order form ẋ = F x + B u of a circuit's node flux equations, with the maps from the state to node voltages and branch currents.</summary>
/// <remarks>
/// <para>
/// The node flux equations C λ̈ + G λ̇ + Γ λ = i (see <see cref="CircuitAnalogy"/>) are split over the nodes with
/// capacitance (m), the nodes without any capacitor (z, massless) and the nodes voltage sources hold (p). The state is
/// x = [λ_m; q_m; λ_z; λ_p] with q_m = C_mm λ̇_m + C_mp λ̇_p the charge the capacitors of the m nodes hold (the analogue of
/// momentum: it stays continuous when a source voltage jumps, so a capacitive divider jumps at once as it should). The
/// inputs u are the source voltages (V) followed by the source currents (A). Then λ̇_m = C_mm⁻¹(q_m − C_mp λ̇_p),
/// λ̇_p = ±V, and the rows of the massless nodes are first order: G_zz λ̇_z = i_z − G_zm λ̇_m − G_zp λ̇_p − Γ_z λ, an
/// exact static condensation of their velocities; q̇_m = i_m − G_m λ̇ − Γ_m λ.
/// </para>
/// <para>
/// This needs C_mm and G_zz regular: every group of capacitor-joined nodes has a capacitor to ground or to a source
/// node, and every group of resistor-joined capacitor-free nodes has a resistor to the rest. The reader refuses
/// circuits that break either (<see cref="CircuitTopology.UnsupportedGroups"/>). Dense: meant for circuits of up to a few
/// hundred nodes.
/// </para>
/// </remarks>
internal sealed class CircuitStateSpace
{
    private CircuitStateSpace(CircuitAnalogy analogy, Matrix<double> system, Matrix<double> input, Matrix<double> flux,
        Matrix<double> voltage, Matrix<double> voltageInput, Matrix<double> injection)
    {
        Analogy = analogy;
        System = system;
        Input = input;
        Flux = flux;
        Voltage = voltage;
        VoltageInput = voltageInput;
        Injection = injection;
    }

    /// <summary>The circuit's analogy (node order and matrices).</summary>
    public CircuitAnalogy Analogy { get; }

    /// <summary>F (1/s): ẋ = F x + B u.</summary>
    public Matrix<double> System { get; }

    /// <summary>B: ẋ = F x + B u.</summary>
    public Matrix<double> Input { get; }

    /// <summary>Node flux linkages (V·s) from the state: λ = Λ x, rows in the analogy's node order.</summary>
    public Matrix<double> Flux { get; }

    /// <summary>Node voltages (V) from the state: v = V x + V_u u.</summary>
    public Matrix<double> Voltage { get; }

    /// <summary>Node voltages (V) from the inputs: v = V x + V_u u.</summary>
    public Matrix<double> VoltageInput { get; }

    /// <summary>Current (A) the current sources deliver into each node, per unit input.</summary>
    public Matrix<double> Injection { get; }

    /// <summary>Number of states.</summary>
    public int StateCount => System.RowCount;

    /// <summary>Number of states that are not the prescribed fluxes of source nodes (the free dynamics, whose roots are the circuit's).</summary>
    public int FreeStateCount => StateCount - Analogy.PrescribedCount;

    /// <summary>Number of inputs: voltage sources, then current sources.</summary>
    public int InputCount => Input.ColumnCount;

    /// <summary>Builds the first-order form of <paramref name="analogy"/>.</summary>
    /// <exception cref="NumericalFailureException">C_mm or G_zz is singular (a circuit the reader should have refused).</exception>
    public static CircuitStateSpace Of(CircuitAnalogy analogy)
    {
        ArgumentNullException.ThrowIfNull(analogy);
        var circuit = analogy.Circuit;
        var nodes = analogy.Nodes.Length;
        int nm = analogy.MassiveCount, nz = analogy.MasslessCount, np = analogy.PrescribedCount;
        int nv = circuit.VoltageSources.Length, ni = circuit.CurrentSources.Length, nu = nv + ni;
        var n = 2 * nm + nz + np;
        var build = Matrix<double>.Build;
        var m = Enumerable.Range(0, nm).ToArray();
        var z = Enumerable.Range(nm, nz).ToArray();
        var p = Enumerable.Range(nm + nz, np).ToArray();

        var flux = build.Dense(nodes, n);
        for (var i = 0; i < nm; i++) flux[i, i] = 1;
        for (var j = 0; j < nz; j++) flux[nm + j, 2 * nm + j] = 1;
        for (var k = 0; k < np; k++) flux[nm + nz + k, 2 * nm + nz + k] = 1;

        var injection = build.Dense(nodes, nu);
        for (var s = 0; s < ni; s++)
        {
            var source = circuit.CurrentSources[s];
            if (source.To != Circuit.Ground) injection[analogy.IndexOf(source.To), nv + s] += 1;
            if (source.From != Circuit.Ground) injection[analogy.IndexOf(source.From), nv + s] -= 1;
        }

        var velocity = build.Dense(nodes, n);
        var velocityInput = build.Dense(nodes, nu);
        for (var s = 0; s < nv; s++)
        {
            var (node, sign) = analogy.VoltageSourceNodes[s];
            velocityInput[node, s] = sign;
        }
        var c = analogy.Capacitance;
        var g = analogy.Conductance;
        var gamma = analogy.InverseInductance;
        if (nm > 0)
        {
            var cmm = Sub(c, m, m);
            var inverse = Invert(cmm, "the capacitance matrix of the nodes with capacitors");
            var cmp = Sub(c, m, p);
            var fromSources = -(inverse * cmp * Sub(velocityInput, p, Enumerable.Range(0, nu).ToArray()));
            for (var i = 0; i < nm; i++)
            {
                for (var j = 0; j < nm; j++) velocity[i, nm + j] = inverse[i, j];
                for (var s = 0; s < nu; s++) velocityInput[i, s] = fromSources[i, s];
            }
        }
        if (nz > 0)
        {
            var inverse = Invert(Sub(g, z, z), "the conductance matrix of the nodes without capacitors");
            var gzm = Sub(g, z, m);
            var gzp = Sub(g, z, p);
            var all = Enumerable.Range(0, nodes).ToArray();
            var allStates = Enumerable.Range(0, n).ToArray();
            var allInputs = Enumerable.Range(0, nu).ToArray();
            var rows = -(inverse * (gzm * Sub(velocity, m, allStates) + Sub(gamma, z, all) * flux));
            var rowsInput = inverse * (Sub(injection, z, allInputs) - gzm * Sub(velocityInput, m, allInputs) - gzp * Sub(velocityInput, p, allInputs));
            for (var j = 0; j < nz; j++)
            {
                for (var k = 0; k < n; k++) velocity[nm + j, k] = rows[j, k];
                for (var s = 0; s < nu; s++) velocityInput[nm + j, s] = rowsInput[j, s];
            }
        }

        var system = build.Dense(n, n);
        var input = build.Dense(n, nu);
        // λ̇_m and λ̇_z are the node velocities; q̇_m is the current balance of the m nodes; λ̇_p the source voltages.
        var chargeRate = -(g.SubMatrix(0, nm, 0, nodes) * velocity) - gamma.SubMatrix(0, nm, 0, nodes) * flux;
        var chargeRateInput = injection.SubMatrix(0, nm, 0, nu) - g.SubMatrix(0, nm, 0, nodes) * velocityInput;
        for (var i = 0; i < nm; i++)
        {
            for (var k = 0; k < n; k++)
            {
                system[i, k] = velocity[i, k];
                system[nm + i, k] = chargeRate[i, k];
            }
            for (var s = 0; s < nu; s++)
            {
                input[i, s] = velocityInput[i, s];
                input[nm + i, s] = chargeRateInput[i, s];
            }
        }
        for (var j = 0; j < nz; j++)
        {
            for (var k = 0; k < n; k++) system[2 * nm + j, k] = velocity[nm + j, k];
            for (var s = 0; s < nu; s++) input[2 * nm + j, s] = velocityInput[nm + j, s];
        }
        for (var k = 0; k < np; k++)
            for (var s = 0; s < nu; s++) input[2 * nm + nz + k, s] = velocityInput[nm + nz + k, s];

        return new CircuitStateSpace(analogy, system, input, flux, velocity, velocityInput, injection);
    }

    private static Matrix<double> Sub(Matrix<double> a, int[] rows, int[] columns)
    {
        var r = Matrix<double>.Build.Dense(rows.Length, columns.Length);
        for (var i = 0; i < rows.Length; i++)
            for (var j = 0; j < columns.Length; j++) r[i, j] = a[rows[i], columns[j]];
        return r;
    }

    private static Matrix<double> Invert(Matrix<double> a, string what)
    {
        var scale = 0.0;
        for (var i = 0; i < a.RowCount; i++) scale = Math.Max(scale, Math.Abs(a[i, i]));
        var lu = a.LU();
        var inverse = lu.Inverse();
        if (!(scale > 0) || inverse.Enumerate().Any(v => !double.IsFinite(v)) || a.ConditionNumber() > 1e14)
            throw new NumericalFailureException($"{char.ToUpperInvariant(what[0])}{what[1..]} ({a.RowCount}×{a.RowCount}) is singular; a group of nodes floats.");
        return inverse;
    }
}

