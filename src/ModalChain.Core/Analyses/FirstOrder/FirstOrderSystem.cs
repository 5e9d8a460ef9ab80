using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;

namespace ModalChain.Core.Analyses.FirstOrder;

/// <summary>The state-space form of M ẍ + C ẋ + K x = F when some massless DOFs are touched by damping (first-order states).</summary>
/// <remarks>
/// <para>The free DOFs split into inertial r, massless-static s and massless-damped d (<see cref="MasslessReduction.Classify"/>).
/// The s DOFs are condensed statically (<see cref="MasslessReduction.Condense"/>; C has no s rows). What remains is</para>
/// <para>M_rr ẍ_r + C_rr ẋ_r + C_rd ẋ_d + K̃_rr x_r + K̃_rd x_d = F̃_r and C_dr ẋ_r + C_dd ẋ_d + K̃_dr x_r + K̃_dd x_d = F̃_d,</para>
/// <para>a descriptor system E ż = Â z + B̂ F̃ in z = [x_r; ẋ_r; x_d] whose E = diag(I, M_rr, 0) + the C_rd/C_dd coupling is
/// invertible when M_rr and C_dd are. Solving the second line for ẋ_d (P = C_dd⁻¹) gives the explicit form ż = A z + B F̃:</para>
/// <para>ẋ_d = P(F̃_d − K̃_dr x_r − C_dr ẋ_r − K̃_dd x_d);
/// ẍ_r = M_rr⁻¹(F̃_r − C_rd P F̃_d − (K̃_rr − C_rd P K̃_dr) x_r − (C_rr − C_rd P C_dr) ẋ_r − (K̃_rd − C_rd P K̃_dd) x_d).</para>
/// <para>The state has 2·n_r + n_d entries: each inertial DOF brings two roots, each first-order DOF one. A hysteretic loss
/// factor has no time-domain form and is not part of A. C_dd singular (massless nodes joined to the rest by no damper
/// path) or M_rr singular (inertance that reaches no mass) is refused with the DOFs named.</para>
/// </remarks>
public sealed class FirstOrderSystem
{
    private FirstOrderSystem(MasslessClasses classes, StaticCondensation condensation, int[] r, int[] d,
        Matrix<double> a, Matrix<double> b, Matrix<double> massRR, Matrix<double> stiffness, Matrix<double> damping)
    {
        Classes = classes;
        Condensation = condensation;
        InertialSlots = [.. r];
        FirstOrderSlots = [.. d];
        State = a;
        Input = b;
        InertialMass = massRR;
        KeptStiffness = stiffness;
        KeptDamping = damping;
    }

    /// <summary>How the free DOFs split.</summary>
    public MasslessClasses Classes { get; }

    /// <summary>The static condensation of the massless DOFs no damping touches (kept = inertial and first-order DOFs).</summary>
    public StaticCondensation Condensation { get; }

    /// <summary>Positions of the inertial DOFs among <see cref="StaticCondensation.Kept"/>.</summary>
    public ImmutableArray<int> InertialSlots { get; }

    /// <summary>Positions of the first-order DOFs among <see cref="StaticCondensation.Kept"/>.</summary>
    public ImmutableArray<int> FirstOrderSlots { get; }

    /// <summary>A in 1/s (dense, order 2·n_r + n_d): ż = A z + B F̃ with z = [x_r; ẋ_r; x_d].</summary>
    public Matrix<double> State { get; }

    /// <summary>B (order × kept DOFs): the state's response to the condensed load F̃ in N.</summary>
    public Matrix<double> Input { get; }

    /// <summary>M_rr in kg.</summary>
    public Matrix<double> InertialMass { get; }

    /// <summary>K̃ over the kept DOFs in N/m (dense).</summary>
    public Matrix<double> KeptStiffness { get; }

    /// <summary>C over the kept DOFs in N·s/m (dense).</summary>
    public Matrix<double> KeptDamping { get; }

    /// <summary>Number of inertial DOFs n_r.</summary>
    public int InertialCount => InertialSlots.Length;

    /// <summary>Number of first-order DOFs n_d.</summary>
    public int FirstOrderCount => FirstOrderSlots.Length;

    /// <summary>Order of the state, 2·n_r + n_d.</summary>
    public int Order => 2 * InertialCount + FirstOrderCount;

    /// <summary>Number of free DOFs before condensation.</summary>
    public int Size => Condensation.FullSize;

    /// <summary>Builds the state-space form of M (kg), C (N·s/m) and K (N/m) over the free DOFs.</summary>
    /// <exception cref="NumericalFailureException">C_dd or M_rr is singular (see the remarks).</exception>
    public static FirstOrderSystem Build(Matrix<double> mass, Matrix<double> damping, Matrix<double> stiffness,
        Func<int, string>? label = null)
    {
        ArgumentNullException.ThrowIfNull(mass);
        ArgumentNullException.ThrowIfNull(damping);
        ArgumentNullException.ThrowIfNull(stiffness);
        label ??= i => i.ToString(CultureInfo.InvariantCulture);
        var classes = MasslessReduction.Classify(mass, damping);
        var condensation = MasslessReduction.Condense(stiffness, classes.Static);
        var kept = condensation.Kept;
        var slot = new Dictionary<int, int>();
        for (var k = 0; k < kept.Length; k++) slot[kept[k]] = k;
        var r = classes.Inertial.Select(i => slot[i]).ToArray();
        var d = classes.FirstOrder.Select(i => slot[i]).ToArray();
        var nr = r.Length;
        var nd = d.Length;
        var nk = kept.Length;

        var kk = Matrix<double>.Build.DenseOfMatrix(condensation.Stiffness);
        var ck = Matrix<double>.Build.Dense(nk, nk);
        foreach (var (i, j, v) in damping.EnumerateIndexed(Zeros.AllowSkip))
            if (slot.TryGetValue(i, out var a) && slot.TryGetValue(j, out var b)) ck[a, b] += v;
        var mrr = Matrix<double>.Build.Dense(nr, nr);
        foreach (var (i, j, v) in mass.EnumerateIndexed(Zeros.AllowSkip))
            if (slot.TryGetValue(i, out var a) && slot.TryGetValue(j, out var b)) mrr[Array.IndexOf(r, a), Array.IndexOf(r, b)] += v;

        Matrix<double> Block(Matrix<double> m, int[] rows, int[] columns) =>
            Matrix<double>.Build.Dense(rows.Length, columns.Length, (i, j) => m[rows[i], columns[j]]);
        var krr = Block(kk, r, r);
        var krd = Block(kk, r, d);
        var kdr = Block(kk, d, r);
        var kdd = Block(kk, d, d);
        var crr = Block(ck, r, r);
        var crd = Block(ck, r, d);
        var cdr = Block(ck, d, r);
        var cdd = Block(ck, d, d);

        var p = nd == 0 ? Matrix<double>.Build.Dense(0, 0) : Invert(cdd, "damping", classes.FirstOrder, label,
            "a massless node (or group of them) that a damper reaches must be tied by damping to a mass or a support");
        var mInv = nr == 0 ? Matrix<double>.Build.Dense(0, 0) : Invert(mrr, "mass", classes.Inertial, label,
            "the inertance at these DOFs reaches no mass (e.g. an inerter between two massless nodes and nothing else)");

        var cp = crd * p;                               // C_rd P
        var kr = krr - cp * kdr;
        var cr = crr - cp * cdr;
        var kd = krd - cp * kdd;
        var order = 2 * nr + nd;
        var state = Matrix<double>.Build.Dense(order, order);
        var input = Matrix<double>.Build.Dense(order, nk);
        for (var i = 0; i < nr; i++) state[i, nr + i] = 1;
        if (nr > 0)
        {
            state.SetSubMatrix(nr, 0, -(mInv * kr));
            state.SetSubMatrix(nr, nr, -(mInv * cr));
            if (nd > 0) state.SetSubMatrix(nr, 2 * nr, -(mInv * kd));
            var mcp = mInv * cp;
            for (var i = 0; i < nr; i++)
            {
                for (var j = 0; j < nr; j++) input[nr + i, r[j]] = mInv[i, j];
                for (var j = 0; j < nd; j++) input[nr + i, d[j]] = -mcp[i, j];
            }
        }
        if (nd > 0)
        {
            if (nr > 0)
            {
                state.SetSubMatrix(2 * nr, 0, -(p * kdr));
                state.SetSubMatrix(2 * nr, nr, -(p * cdr));
            }
            state.SetSubMatrix(2 * nr, 2 * nr, -(p * kdd));
            for (var i = 0; i < nd; i++)
                for (var j = 0; j < nd; j++) input[2 * nr + i, d[j]] = p[i, j];
        }
        return new FirstOrderSystem(classes, condensation, r, d, state, input, mrr, kk, ck);
    }

    private static Matrix<double> Invert(Matrix<double> block, string what, ImmutableArray<int> dofs, Func<int, string> label, string why)
    {
        var scale = block.Enumerate().Select(Math.Abs).DefaultIfEmpty(0).Max();
        try
        {
            var lu = block.LU();
            var inverse = lu.Inverse();
            var ok = scale > 0 && inverse.Enumerate().All(double.IsFinite)
                && Math.Abs(lu.Determinant) > 0
                && inverse.L1Norm() * block.L1Norm() < 1e12;
            if (ok) return inverse;
        }
        catch (ArgumentException) { }
        throw new NumericalFailureException(string.Create(CultureInfo.InvariantCulture,
            $"the {what} matrix at {string.Join(", ", dofs.Take(8).Select(i => $"'{label(i)}'"))}{(dofs.Length > 8 ? ", …" : "")} is singular: {why}"));
    }

    /// <summary>The reduced load F̃ (N, over the kept DOFs) of a full load vector.</summary>
    public double[] ReduceLoad(ReadOnlySpan<double> full) => Condensation.ReduceLoad(full);

    /// <summary>
    /// Every DOF's displacement (m) from the state z and the full load f (N): x_k from z, x_s = T x_k + G f_s.
    /// </summary>
    public double[] Displacements(ReadOnlySpan<double> z, ReadOnlySpan<double> full)
    {
        var kept = new double[Condensation.Kept.Length];
        var nr = InertialCount;
        for (var i = 0; i < nr; i++) kept[InertialSlots[i]] = z[i];
        for (var i = 0; i < FirstOrderCount; i++) kept[FirstOrderSlots[i]] = z[2 * nr + i];
        return Condensation.Expand(kept, CondensedPart(full));
    }

    /// <summary>
    /// Every DOF's velocity (m/s) from the state z, the full load f and its rate ḟ (N/s): ẋ_r from z, ẋ_d from the
    /// first-order rows, ẋ_s = T ẋ_k + G ḟ_s.
    /// </summary>
    public double[] Velocities(ReadOnlySpan<double> z, ReadOnlySpan<double> full, ReadOnlySpan<double> fullRate)
    {
        var zdot = Derivative(z, full);
        var kept = new double[Condensation.Kept.Length];
        var nr = InertialCount;
        for (var i = 0; i < nr; i++) kept[InertialSlots[i]] = z[nr + i];
        for (var i = 0; i < FirstOrderCount; i++) kept[FirstOrderSlots[i]] = zdot[2 * nr + i];
        return Condensation.Expand(kept, CondensedPart(fullRate));
    }

    /// <summary>ż = A z + B F̃ for the state z and the full load f (N).</summary>
    public double[] Derivative(ReadOnlySpan<double> z, ReadOnlySpan<double> full)
    {
        var f = ReduceLoad(full);
        var n = Order;
        var zdot = new double[n];
        for (var i = 0; i < n; i++)
        {
            var sum = 0.0;
            for (var j = 0; j < n; j++) sum += State[i, j] * z[j];
            for (var j = 0; j < f.Length; j++) sum += Input[i, j] * f[j];
            zdot[i] = sum;
        }
        return zdot;
    }

    /// <summary>The state of given full displacements and velocities (x_r, ẋ_r, x_d); the massless DOFs' own velocities follow from it.</summary>
    public double[] StateOf(ReadOnlySpan<double> displacement, ReadOnlySpan<double> velocity)
    {
        var nr = InertialCount;
        var z = new double[Order];
        for (var i = 0; i < nr; i++)
        {
            z[i] = displacement[Classes.Inertial[i]];
            z[nr + i] = velocity[Classes.Inertial[i]];
        }
        for (var i = 0; i < FirstOrderCount; i++) z[2 * nr + i] = displacement[Classes.FirstOrder[i]];
        return z;
    }

    private double[] CondensedPart(ReadOnlySpan<double> full)
    {
        var c = Condensation.Condensed;
        if (full.IsEmpty) return new double[c.Length];
        var part = new double[c.Length];
        for (var i = 0; i < c.Length; i++) part[i] = full[c[i]];
        return part;
    }

    /// <summary>The complex roots of the free motion: eigenvalues of A, one per conjugate pair, each real root classified.</summary>
    /// <remarks>
    /// A root with |λ| at most 1e-9 of the largest is a zero root (a part that no spring holds: it can rest anywhere).
    /// A real root λ &lt; 0 is a relaxation (<see cref="ComplexModeKind.Relaxation"/>, time constant τ = −1/λ) when its
    /// eigenvector stores more strain energy x̃ᵀK̃x̃ than kinetic energy ẋ_rᵀM_rrẋ_r and the first-order DOFs take more
    /// of the damping power ẋᵀCẋ than the inertial ones: the creep of a spring through a damper at a massless node.
    /// Other real roots are overdamped motion of the masses.
    /// </remarks>
    public ImmutableArray<ComplexMode> ComplexModes()
    {
        var n = Order;
        if (n == 0) return [];
        var evd = State.Evd();
        var values = evd.EigenValues;
        var scale = values.Select(v => v.Magnitude).DefaultIfEmpty(0).Max();
        var zero = 1e-9 * Math.Max(scale, 1e-300);
        var imagTolerance = 1e-10 * Math.Max(scale, 1e-300);
        var nr = InertialCount;
        var nk = Condensation.Kept.Length;

        var list = new List<(Complex Value, ComplexModeKind Kind, bool Oscillatory)>();
        for (var col = 0; col < n; col++)
        {
            var v = values[col];
            if (v.Magnitude <= zero) { list.Add((Complex.Zero, ComplexModeKind.RigidBody, false)); continue; }
            if (Math.Abs(v.Imaginary) > imagTolerance)
            {
                if (v.Imaginary > 0) list.Add((v, ComplexModeKind.Elastic, true));
                continue;
            }
            // A real eigenvalue of a real matrix has a real eigenvector (Math.NET stores it in the column).
            var z = evd.EigenVectors.Column(col);
            var x = new double[nk];
            for (var i = 0; i < nr; i++) x[InertialSlots[i]] = z[i];
            for (var i = 0; i < FirstOrderCount; i++) x[FirstOrderSlots[i]] = z[2 * nr + i];
            var xv = MathNet.Numerics.LinearAlgebra.Vector<double>.Build.DenseOfArray(x);
            var strain = xv * (KeptStiffness * xv);
            var vr = z.SubVector(nr, nr);
            var kinetic = nr == 0 ? 0 : vr * (InertialMass * vr);
            var rate = xv * v.Real;
            var power = KeptDamping * rate;
            double dampedAtFirstOrder = 0, dampedAtInertial = 0;
            foreach (var s in FirstOrderSlots) dampedAtFirstOrder += rate[s] * power[s];
            foreach (var s in InertialSlots) dampedAtInertial += rate[s] * power[s];
            var relaxation = FirstOrderCount > 0 && strain > kinetic && dampedAtFirstOrder > dampedAtInertial;
            list.Add((new Complex(v.Real, 0), relaxation ? ComplexModeKind.Relaxation : ComplexModeKind.Elastic, false));
        }
        var ordered = list
            .OrderBy(e => e.Kind == ComplexModeKind.RigidBody ? 0 : 1)
            .ThenBy(e => e.Value.Magnitude)
            .ToArray();
        var result = ImmutableArray.CreateBuilder<ComplexMode>(ordered.Length);
        foreach (var (v, kind, oscillatory) in ordered)
            result.Add(new ComplexMode(result.Count + 1, v, v.Magnitude / (2 * Math.PI), oscillatory ? v.Imaginary / (2 * Math.PI) : 0,
                oscillatory ? -v.Real / v.Magnitude : double.NaN, oscillatory) { Kind = kind });
        return result.MoveToImmutable();
    }
}
