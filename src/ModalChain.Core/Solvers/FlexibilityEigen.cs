using MathNet.Numerics.LinearAlgebra;

namespace ModalChain.Core.Solvers;

/// <summary>One spring of a scalar network over matrix indices: ends <paramref name="A"/> and <paramref name="B"/> (−1 = a support), stiffness in N/m.</summary>
/// <param name="A">Matrix index of the first end, or −1 when it is a support.</param>
/// <param name="B">Matrix index of the second end, or −1 when it is a support.</param>
/// <param name="Stiffness">Stiffness in N/m, non-negative.</param>
internal readonly record struct SpringEdge(int A, int B, double Stiffness);

/// <summary>
/// The flexible modes of a scalar spring network from its flexibility, with relative accuracy in the low frequencies
/// whatever the spread of the stiffnesses.
/// </summary>
/// <remarks>
/// <para>
/// K of a scalar spring network is a weighted graph Laplacian plus a diagonal of springs to supports:
/// K = Σ_e k_e b_e b_eᵀ. Its off-diagonals are −w_ij ≤ 0 and its diagonal is g_i + Σ_j w_ij. The factorisation
/// K = L D Lᵀ is computed by eliminating one node at a time on w and g rather than on K (the star–mesh or Kron
/// reduction: w'_ij = w_ij + w_ik w_kj / d_k, g'_i = g_i + w_ik g_k / d_k, d_k = g_k + Σ_j w_kj). Every operation adds
/// non-negative numbers, so no subtraction cancels; this is the device of Grassmann, Taksar &amp; Heyman (Operations
/// Research 33, 1985) for Markov chains, and the reason Ye (Math. Comp. 78, 2009) could show that diagonally dominant
/// matrices given by their off-diagonals and diagonal excesses have accurately computable factorisations [from memory].
/// L⁻¹ = (I − N)⁻¹ with N ≥ 0 is non-negative, so the flexibility F = L⁻ᵀ D⁻¹ L⁻¹ is a sum of non-negative terms:
/// each entry carries a few units of relative rounding, not an error proportional to the largest stiffness.
/// </para>
/// <para>
/// A group of masses that no spring ties to a support has no flexibility; its reference mass (the heaviest) is held
/// to compute F_r, and the inertia-relief projector P = I − ι (Mι)ᵀ / (ιᵀMι) gives the free-free flexibility
/// P F_r Pᵀ, whose eigenvectors are the group's flexible modes and whose null vector is its rigid translation
/// (a standard construction for unsupported structures, e.g. Craig &amp; Kurdila, Fundamentals of Structural
/// Dynamics, 2nd ed., §16 [from memory]).
/// </para>
/// <para>
/// The symmetric problem M^½ F M^½ v = μ v is solved densely; ω² = 1/μ, so the lowest frequencies are the largest,
/// best-resolved eigenvalues. Each ω² is then the Rayleigh quotient written as strain energy,
/// Σ_e k_e (φ_a − φ_b)² / Σ_i m_i φ_i², again a sum of non-negative terms; its error is second order in the shape
/// error. Dense O(n³) in time and O(n²) in memory.
/// </para>
/// </remarks>
internal static class FlexibilityEigen
{
    /// <summary>The flexible modes, ascending in ω², with M-normalised shapes (one column per mode).</summary>
    /// <param name="mass">Diagonal of M in kg, one entry per index.</param>
    /// <param name="springs">The springs over matrix indices.</param>
    /// <param name="freeGroups">Indices of each group that no spring ties to a support.</param>
    public static (double[] EigenValues, Matrix<double> Shapes) Solve(
        IReadOnlyList<double> mass, IReadOnlyList<SpringEdge> springs, IReadOnlyList<int[]> freeGroups)
    {
        var n = mass.Count;
        var w = new double[n][];
        for (var i = 0; i < n; i++) w[i] = new double[n];
        var g = new double[n];
        foreach (var s in springs)
        {
            if (!(s.Stiffness > 0) || s.A == s.B || (s.A < 0 && s.B < 0)) continue;
            if (s.A < 0) g[s.B] += s.Stiffness;
            else if (s.B < 0) g[s.A] += s.Stiffness;
            else { w[s.A][s.B] += s.Stiffness; w[s.B][s.A] += s.Stiffness; }
        }

        // Hold the reference mass of each free group: its springs become springs to a support for the others.
        var held = new bool[n];
        foreach (var group in freeGroups)
        {
            var r = group.MaxBy(i => mass[i]);
            held[r] = true;
            for (var j = 0; j < n; j++)
            {
                if (w[r][j] == 0) continue;
                g[j] += w[r][j];
                w[r][j] = w[j][r] = 0;
            }
        }

        var flexibility = Flexibility(w, g, held);
        foreach (var group in freeGroups) ApplyInertiaRelief(flexibility, mass, group);

        var root = mass.Select(Math.Sqrt).ToArray();
        var s2 = Matrix<double>.Build.Dense(n, n, (i, j) => root[i] * flexibility[i][j] * root[j]);
        // A vanishingly soft spring (1e-294 N/m) gives flexibilities near the top of the double range, which the
        // eigen solve would square into infinity: solve the scaled matrix (only its eigenvectors are used below).
        var largest = s2.Enumerate().Select(Math.Abs).DefaultIfEmpty(0).Max();
        if (!double.IsFinite(largest))
            throw new NumericalFailureException("The flexibility of the spring network overflows: a spring is too soft for its flexibility to be represented.");
        // Entries below 1e-200 of the largest cannot change an eigenvector at working precision, but as subnormal
        // numbers they break the managed reduction: flush them.
        if (largest > 0) s2.MapInplace(v => Math.Abs(v) < 1e-200 * largest ? 0 : v / largest);
        var evd = s2.Evd(MathNet.Numerics.LinearAlgebra.Symmetricity.Symmetric);
        if (evd.EigenVectors.Enumerate().Any(v => !double.IsFinite(v)))
            throw new NumericalFailureException("The eigenvectors of the flexibility are not finite.");

        // The free groups' translations are null vectors of F: leave out the vectors nearest to them.
        var rigidShare = new double[n];
        for (var c = 0; c < n; c++)
            foreach (var group in freeGroups)
            {
                var p = group.Sum(i => root[i] * evd.EigenVectors[i, c]);
                rigidShare[c] += p * p / group.Sum(i => mass[i]);
            }
        var flexible = Enumerable.Range(0, n).OrderBy(c => rigidShare[c]).Take(n - freeGroups.Count).ToArray();

        var shapes = Matrix<double>.Build.Dense(n, flexible.Length, (i, j) => evd.EigenVectors[i, flexible[j]] / root[i]);
        var values = new double[flexible.Length];
        for (var j = 0; j < flexible.Length; j++) values[j] = StrainEnergyQuotient(shapes.Column(j), mass, springs);
        var order = Enumerable.Range(0, values.Length).OrderBy(j => values[j]).ToArray();
        var sorted = Matrix<double>.Build.Dense(n, order.Length, (i, j) => shapes[i, order[j]]);
        ModeNormalisation.ApplySignConvention(sorted);
        return ([.. order.Select(j => values[j])], sorted);
    }

    /// <summary>Σ_e k_e (φ_a − φ_b)² / Σ_i m_i φ_i² in rad²/s²: the Rayleigh quotient as a sum of non-negative terms.</summary>
    public static double StrainEnergyQuotient(Vector<double> phi, IReadOnlyList<double> mass, IReadOnlyList<SpringEdge> springs)
    {
        var strain = 0.0;
        foreach (var s in springs)
        {
            if (s.A == s.B) continue;
            var d = (s.A >= 0 ? phi[s.A] : 0) - (s.B >= 0 ? phi[s.B] : 0);
            strain += s.Stiffness * d * d;
        }
        var kinetic = 0.0;
        for (var i = 0; i < mass.Count; i++) kinetic += mass[i] * phi[i] * phi[i];
        return strain / kinetic;
    }

    /// <summary>K⁻¹ of the held indices by elimination on spring weights; rows and columns of held-out indices stay zero.</summary>
    private static double[][] Flexibility(double[][] w, double[] g, bool[] heldOut)
    {
        var n = g.Length;
        var active = Enumerable.Range(0, n).Where(i => !heldOut[i]).ToArray();
        var m = active.Length;
        // Multipliers ℓ_ik = w_ik / d_k (L = I − N, N_ik = ℓ_ik), pivots d_k; indices are positions in 'active'.
        var multipliers = new double[m][];
        var pivots = new double[m];
        for (var k = 0; k < m; k++)
        {
            var rk = w[active[k]];
            var d = g[active[k]];
            for (var j = k + 1; j < m; j++) d += rk[active[j]];
            if (!(d > 0) || !double.IsFinite(d))
                throw new NumericalFailureException($"The flexibility of the spring network could not be formed: pivot {k} is {d}.");
            pivots[k] = d;
            var l = new double[m];
            for (var i = k + 1; i < m; i++)
            {
                var wik = w[active[i]][active[k]];
                if (wik == 0) continue;
                l[i] = wik / d;
                var ri = w[active[i]];
                for (var j = k + 1; j < m; j++)
                {
                    if (j == i) continue;
                    var wkj = rk[active[j]];
                    if (wkj != 0) ri[active[j]] += l[i] * wkj;
                }
                g[active[i]] += l[i] * g[active[k]];
            }
            multipliers[k] = l;
        }

        // X = L⁻¹ (lower triangular, non-negative): row i = e_i + Σ_{k<i} ℓ_ik row k.
        var x = new double[m][];
        for (var i = 0; i < m; i++)
        {
            var row = new double[m];
            row[i] = 1;
            for (var k = 0; k < i; k++)
            {
                var l = multipliers[k][i];
                if (l == 0) continue;
                var rowK = x[k];
                for (var j = 0; j <= k; j++) row[j] += l * rowK[j];
            }
            x[i] = row;
        }

        // F = Xᵀ D⁻¹ X.
        var f = new double[n][];
        for (var i = 0; i < n; i++) f[i] = new double[n];
        for (var k = 0; k < m; k++)
        {
            var row = x[k];
            var inv = 1 / pivots[k];
            for (var a = 0; a <= k; a++)
            {
                if (row[a] == 0) continue;
                var s = row[a] * inv;
                var fa = f[active[a]];
                for (var b = 0; b <= k; b++) fa[active[b]] += s * row[b];
            }
        }
        return f;
    }

    /// <summary>Replaces the group's block F_gg by P F_gg Pᵀ with P = I − ι uᵀ, u = Mι / (ιᵀMι).</summary>
    private static void ApplyInertiaRelief(double[][] f, IReadOnlyList<double> mass, int[] group)
    {
        var total = group.Sum(i => mass[i]);
        var fu = group.Select(a => group.Sum(b => f[a][b] * mass[b]) / total).ToArray();
        var ufu = group.Select((b, j) => mass[b] * fu[j]).Sum() / total;
        for (var p = 0; p < group.Length; p++)
            for (var q = 0; q < group.Length; q++)
                f[group[p]][group[q]] += ufu - fu[p] - fu[q];
    }
}
