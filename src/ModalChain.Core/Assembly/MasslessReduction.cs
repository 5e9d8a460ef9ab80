using System.Collections.Immutable;
using System.Globalization;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Model;

namespace ModalChain.Core.Assembly;

/// <summary>How the free DOFs of a model with massless nodes split: inertial, condensed statically, first-order states.</summary>
/// <remarks>
/// <para>A DOF whose row of M (inerters included) is all zero is massless. A massless DOF that no viscous damping
/// touches (its row of C is zero) carries springs only: its equation K_sr x_r + K_ss x_s = F_s holds at every instant,
/// so it is condensed statically (Guyan 1965; exact here, since it has no inertia): K̃ = K_kk − K_ks K_ss⁻¹ K_sk,
/// F̃ = F_k − K_ks K_ss⁻¹ F_s and x_s = −K_ss⁻¹ K_sk x_k + K_ss⁻¹ F_s. A massless DOF that a damper touches keeps a
/// first-order equation C_dr ẋ_r + C_dd ẋ_d + K_dr x_r + K_dd x_d = F_d (see
/// <see cref="Analyses.FirstOrder.FirstOrderSystem"/>).</para>
/// <para>Proportional damping is applied as written: the a0·M part of Rayleigh damping and modal damping ratios
/// (C = MΦ diag(2ζω) ΦᵀM) have zero rows at massless DOFs, while the a1·K part puts a damper a1·k beside every spring,
/// so under stiffness-proportional damping a massless node between springs becomes a first-order state.</para>
/// </remarks>
/// <param name="Inertial">Free DOFs with inertia (r), ascending.</param>
/// <param name="Static">Massless DOFs that no damping touches (s), ascending: condensed statically.</param>
/// <param name="FirstOrder">Massless DOFs touched by damping (d), ascending: first-order states.</param>
public sealed record MasslessClasses(ImmutableArray<int> Inertial, ImmutableArray<int> Static, ImmutableArray<int> FirstOrder)
{
    /// <summary>True when some free DOF is massless.</summary>
    public bool HasMasslessDofs => Static.Length + FirstOrder.Length > 0;

    /// <summary>True when some massless DOF is touched by damping, so the model needs the state-space form.</summary>
    public bool HasFirstOrderStates => FirstOrder.Length > 0;

    /// <summary>Every massless DOF (s and d), ascending.</summary>
    public ImmutableArray<int> Massless => [.. Static.Concat(FirstOrder).Order()];
}

/// <summary>Finds massless DOFs and condenses them statically; shared by every analysis of a model with massless nodes.</summary>
public static class MasslessReduction
{
    /// <summary>Largest number of massless DOFs condensed (their stiffness block is inverted densely).</summary>
    public const int MaxCondensed = 2000;

    /// <summary>True when row <paramref name="i"/> of <paramref name="mass"/> has no non-zero entry.</summary>
    public static bool IsMassless(Matrix<double> mass, int i)
    {
        ArgumentNullException.ThrowIfNull(mass);
        foreach (var (_, v) in mass.Row(i).EnumerateIndexed(Zeros.AllowSkip))
            if (v != 0) return false;
        return true;
    }

    /// <summary>True when some row of <paramref name="mass"/> is all zero.</summary>
    public static bool HasMasslessDofs(Matrix<double> mass)
    {
        ArgumentNullException.ThrowIfNull(mass);
        var rowHasMass = new bool[mass.RowCount];
        foreach (var (i, _, v) in mass.EnumerateIndexed(Zeros.AllowSkip))
            if (v != 0) rowHasMass[i] = true;
        return rowHasMass.Any(x => !x);
    }

    /// <summary>Splits the free DOFs by their rows of M (kg) and C (N·s/m).</summary>
    public static MasslessClasses Classify(Matrix<double> mass, Matrix<double> damping)
    {
        ArgumentNullException.ThrowIfNull(mass);
        ArgumentNullException.ThrowIfNull(damping);
        var n = mass.RowCount;
        var hasMass = new bool[n];
        var hasDamping = new bool[n];
        foreach (var (i, _, v) in mass.EnumerateIndexed(Zeros.AllowSkip)) if (v != 0) hasMass[i] = true;
        foreach (var (i, _, v) in damping.EnumerateIndexed(Zeros.AllowSkip)) if (v != 0) hasDamping[i] = true;
        var r = ImmutableArray.CreateBuilder<int>();
        var s = ImmutableArray.CreateBuilder<int>();
        var d = ImmutableArray.CreateBuilder<int>();
        for (var i = 0; i < n; i++)
            (hasMass[i] ? r : hasDamping[i] ? d : s).Add(i);
        return new MasslessClasses(r.ToImmutable(), s.ToImmutable(), d.ToImmutable());
    }

    /// <summary>Condenses the DOFs <paramref name="condensed"/> of <paramref name="stiffness"/> (N/m) onto the others.</summary>
    /// <exception cref="NumericalFailureException">More than <see cref="MaxCondensed"/> DOFs, or a held block that cannot be inverted.</exception>
    public static StaticCondensation Condense(Matrix<double> stiffness, IReadOnlyList<int> condensed)
    {
        ArgumentNullException.ThrowIfNull(stiffness);
        ArgumentNullException.ThrowIfNull(condensed);
        var n = stiffness.RowCount;
        if (condensed.Count > MaxCondensed)
            throw new NumericalFailureException(string.Create(CultureInfo.InvariantCulture,
                $"the model has {condensed.Count} massless DOFs; at most {MaxCondensed} are condensed"));
        var slotOf = new int[n];
        Array.Fill(slotOf, -1);
        for (var c = 0; c < condensed.Count; c++) slotOf[condensed[c]] = c;
        var kept = Enumerable.Range(0, n).Where(i => slotOf[i] < 0).ToArray();
        var keptSlot = new int[n];
        Array.Fill(keptSlot, -1);
        for (var k = 0; k < kept.Length; k++) keptSlot[kept[k]] = k;

        var nc = condensed.Count;
        var kcc = Matrix<double>.Build.Dense(nc, nc);
        var kck = Matrix<double>.Build.Dense(nc, kept.Length);
        var kkk = new List<(int, int, double)>();
        foreach (var (i, j, v) in stiffness.EnumerateIndexed(Zeros.AllowSkip))
        {
            if (slotOf[i] >= 0 && slotOf[j] >= 0) kcc[slotOf[i], slotOf[j]] += v;
            else if (slotOf[i] >= 0) kck[slotOf[i], keptSlot[j]] += v;
            else if (slotOf[j] < 0) kkk.Add((keptSlot[i], keptSlot[j], v));
        }

        // Components of the condensed DOFs joined by stiffness; a component that no spring ties to a kept DOF or a
        // support (every row sums to zero: a network stiffness has non-positive off-diagonals) is not held and its
        // motion is left undetermined (0); its block couples to nothing, so dropping it changes nothing else.
        var component = Components(kcc);
        var undetermined = new List<int>();
        var flexibility = Matrix<double>.Build.Dense(nc, nc);
        foreach (var members in component)
        {
            var scale = members.Max(c => Math.Abs(kcc[c, c]));
            var held = false;
            foreach (var c in members)
            {
                var sum = members.Sum(j => kcc[c, j]);
                if (sum > 1e-12 * scale) { held = true; break; }
            }
            if (!held || !(scale > 0))
            {
                foreach (var c in members) undetermined.Add(condensed[c]);
                continue;
            }
            var block = Matrix<double>.Build.Dense(members.Length, members.Length, (a, b) => kcc[members[a], members[b]]);
            Matrix<double> inverse;
            try { inverse = block.Cholesky().Solve(Matrix<double>.Build.DenseIdentity(members.Length)); }
            catch (ArgumentException ex)
            {
                throw new NumericalFailureException(string.Create(CultureInfo.InvariantCulture,
                    $"the stiffness at {members.Length} massless DOF(s) is not positive definite; they cannot be condensed"), ex);
            }
            for (var a = 0; a < members.Length; a++)
                for (var b = 0; b < members.Length; b++)
                    flexibility[members[a], members[b]] = inverse[a, b];
        }

        var transfer = -(flexibility * kck);
        // K̃ = K_kk + K_kc T (K_kc = K_ckᵀ): only kept DOFs next to a condensed one change.
        var correction = kck.TransposeThisAndMultiply(transfer);
        foreach (var (i, j, v) in correction.EnumerateIndexed(Zeros.AllowSkip)) kkk.Add((i, j, v));
        var reduced = Assembler.Summed(kept.Length, kkk);
        return new StaticCondensation([.. kept], [.. condensed], reduced, transfer, flexibility, [.. undetermined.Order()]);
    }

    private static List<int[]> Components(Matrix<double> kcc)
    {
        var n = kcc.RowCount;
        var parent = Enumerable.Range(0, n).ToArray();
        int Find(int x)
        {
            while (parent[x] != x) x = parent[x] = parent[parent[x]];
            return x;
        }
        for (var i = 0; i < n; i++)
            for (var j = i + 1; j < n; j++)
                if (kcc[i, j] != 0) parent[Find(i)] = Find(j);
        return [.. Enumerable.Range(0, n).GroupBy(Find).Select(g => g.ToArray())];
    }
}

/// <summary>A stiffness matrix with some DOFs condensed statically, and the maps back to every DOF.</summary>
/// <param name="Kept">Indices (in the full numbering) of the DOFs kept, ascending.</param>
/// <param name="Condensed">Indices of the DOFs condensed, in the order given.</param>
/// <param name="Stiffness">K̃ = K_kk − K_kc K_cc⁻¹ K_ck in N/m over the kept DOFs (sparse).</param>
/// <param name="Transfer">T = −K_cc⁻¹ K_ck (dimensionless): x_c = T x_k + G F_c.</param>
/// <param name="Flexibility">G = K_cc⁻¹ in m/N (zero rows and columns for undetermined DOFs).</param>
/// <param name="Undetermined">Condensed DOFs that no spring holds: their motion is not determined by K and is reported as 0.</param>
public sealed record StaticCondensation(
    ImmutableArray<int> Kept,
    ImmutableArray<int> Condensed,
    Matrix<double> Stiffness,
    Matrix<double> Transfer,
    Matrix<double> Flexibility,
    ImmutableArray<int> Undetermined)
{
    /// <summary>Number of DOFs before condensation.</summary>
    public int FullSize => Kept.Length + Condensed.Length;

    /// <summary>The reduced load F̃ = F_k + Tᵀ F_c (N) of a full load vector.</summary>
    public double[] ReduceLoad(ReadOnlySpan<double> full)
    {
        var f = new double[Kept.Length];
        for (var k = 0; k < Kept.Length; k++) f[k] = full[Kept[k]];
        for (var c = 0; c < Condensed.Length; c++)
        {
            var fc = full[Condensed[c]];
            if (fc == 0) continue;
            for (var k = 0; k < Kept.Length; k++) f[k] += Transfer[c, k] * fc;
        }
        return f;
    }

    /// <summary>Every DOF's value from the kept ones: x_c = T x_k + G F_c (<paramref name="condensedLoad"/> null for no load).</summary>
    public double[] Expand(ReadOnlySpan<double> kept, ReadOnlySpan<double> condensedLoad = default)
    {
        var x = new double[FullSize];
        for (var k = 0; k < Kept.Length; k++) x[Kept[k]] = kept[k];
        for (var c = 0; c < Condensed.Length; c++)
        {
            var sum = 0.0;
            for (var k = 0; k < Kept.Length; k++) sum += Transfer[c, k] * kept[k];
            if (!condensedLoad.IsEmpty)
                for (var j = 0; j < Condensed.Length; j++) sum += Flexibility[c, j] * condensedLoad[j];
            x[Condensed[c]] = sum;
        }
        return x;
    }
}
