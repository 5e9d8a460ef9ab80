using System.Collections.Immutable;
using System.Numerics;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Modal;

/// <summary>One eigenvalue of the damped system's state-space eigenproblem.</summary>
/// <param name="Number">1-based number in ascending |λ|.</param>
/// <param name="EigenValue">λ in 1/s; the free motion is e^{λt}.</param>
/// <param name="UndampedFrequencyHz">|λ|/2π in Hz.</param>
/// <param name="DampedFrequencyHz">|Im λ|/2π in Hz: the frequency of the decaying free oscillation (0 when not oscillatory).</param>
/// <param name="DampingRatio">ζ = −Re λ / |λ| for an oscillatory root; NaN for a real (overdamped) root.</param>
/// <param name="IsOscillatory">False for a real root (overdamped motion, no oscillation).</param>
public sealed record ComplexMode(int Number, Complex EigenValue, double UndampedFrequencyHz, double DampedFrequencyHz, double DampingRatio, bool IsOscillatory)
{
    /// <summary>What the root stands for: an elastic mode, a zero root of a rigid-body motion, or its damped relaxation.</summary>
    public ComplexModeKind Kind { get; init; } = ComplexModeKind.Elastic;
}

/// <summary>What a root of the damped system stands for.</summary>
public enum ComplexModeKind
{
    /// <summary>A root of the elastic (spring-held) motion: oscillatory, or real when overdamped.</summary>
    Elastic,

    /// <summary>A zero root (λ = 0 exactly) of a group of masses that no spring ties to a support: it can stand anywhere.</summary>
    RigidBody,

    /// <summary>The real root λ &lt; 0 with which damping to a support brings a free group's rigid-body velocity to rest.</summary>
    RigidBodyRelaxation,

    /// <summary>
    /// A real root λ &lt; 0 of first-order relaxation: a spring creeping through a damper at a massless node (a
    /// Maxwell element), with time constant τ = −1/λ (see <see cref="FirstOrder.FirstOrderSystem.ComplexModes"/>).
    /// </summary>
    Relaxation,
}


/// <summary>Damped natural frequencies and damping ratios of a non-classically damped network.</summary>
/// <remarks>
/// <para>
/// Solves the state-space eigenproblem A z = λ z with z = [x; ẋ] and A = [[0, I], [−M⁻¹K, −M⁻¹C]] (Foss 1958;
/// Meirovitch, Principles and Techniques of Vibrations, §4.14 [from memory]). Each underdamped mode gives a
/// conjugate pair λ = −ζω_n ± iω_n√(1−ζ²); one entry per pair (Im λ &gt; 0) is returned, plus each real root.
/// Only viscous damping enters; a hysteretic loss factor has no time-domain eigenproblem and is ignored here.
/// Dense O((2n)³); meant for models up to a few hundred masses.
/// </para>
/// <para>
/// Rigid-body roots are not left to round-off. With R the M-orthonormal unit translations of the groups that no
/// spring ties to a support (K R = 0, from <see cref="Topology.UnsupportedGroups"/>) and Q an M-orthonormal basis of
/// the rest, x = Q y + R q gives ÿ + QᵀCQ ẏ + QᵀCR q̇ + QᵀKQ y = 0 and q̈ + RᵀCQ ẏ + RᵀCR q̇ = 0: q itself never
/// appears, so each group has one exact zero root. Translations in the null space of RᵀCR are not resisted by any
/// damper (C R n = 0: no damper ties them to a support or a held mass) and give a second zero root (free drift);
/// the others leave a real relaxation root (−c/m for a single free mass on a damper to ground). The reduced state
/// [y; ẏ; q̇ of the damped translations] is solved, the zero roots are added exactly and the real roots whose
/// eigenvector carries the most rigid-body kinetic energy are labelled relaxations.
/// </para>
/// </remarks>
public static class ComplexModes
{
    /// <summary>Below this share of ‖M⁻¹C‖ a rigid-body translation counts as undamped (free drift).</summary>
    private const double UndampedTolerance = 1e-12;

    /// <summary>The complex modes of <paramref name="system"/> (viscous damping C_ff of every source).</summary>
    /// <remarks>
    /// The zero roots of circuit node groups that no inductor holds (<see cref="Topology.FluxLevelCount"/>) only set a
    /// constant flux level: they are left out (one zero root per such group), so the roots listed are those of motions
    /// and of the circuit's own dynamics.
    /// </remarks>
    public static ImmutableArray<ComplexMode> Solve(DampedSystem system)
    {
        ArgumentNullException.ThrowIfNull(system);
        var roots = SolveAll(system);
        var fluxLevels = Topology.FluxLevelCount(system.Model.Network);
        if (fluxLevels == 0) return roots;
        var kept = ImmutableArray.CreateBuilder<ComplexMode>(roots.Length);
        foreach (var root in roots)
        {
            if (fluxLevels > 0 && root.Kind == ComplexModeKind.RigidBody) { fluxLevels--; continue; }
            kept.Add(root with { Number = kept.Count + 1 });
        }
        return kept.ToImmutable();
    }

    private static ImmutableArray<ComplexMode> SolveAll(DampedSystem system)
    {
        var free = system.Partition.Free;
        // Massless DOFs: their damped ones are first-order states, the rest are condensed (no M⁻¹ exists).
        if (MasslessReduction.HasMasslessDofs(system.Partition.Mass))
            return FirstOrder.FirstOrderSystem.Build(system.Partition.Mass, system.Damping.FF, system.Partition.StiffnessFF, free.Label).ComplexModes();
        // Plane and 3d models: no topological groups (rigid-body roots are recognised by size), M may be full.
        if (system.Model.Network.Space != ModelSpace.Line) return Solve(system.Partition.Mass, system.Partition.StiffnessFF, system.Damping.FF);
        var groups = Topology.UnsupportedGroups(system.Model.Network)
            .Select(g => g.Select(name => free.IndexOf(name)).Where(i => i >= 0).Distinct().ToArray())
            .Where(g => g.Length > 0)
            .ToArray();
        return Solve(system.Partition.Mass, system.Partition.StiffnessFF, system.Damping.FF, groups);
    }

    /// <summary>The complex modes of M ẍ + C ẋ + K x = 0 with M in kg (diagonal, or symmetric positive definite), K in N/m and C in N·s/m.</summary>
    /// <remarks>Without the topology, zero roots are recognised only by their size (below 1e-9 of the largest |λ|) and left out.</remarks>
    public static ImmutableArray<ComplexMode> Solve(Matrix<double> mass, Matrix<double> stiffness, Matrix<double> damping)
    {
        ArgumentNullException.ThrowIfNull(mass);
        ArgumentNullException.ThrowIfNull(stiffness);
        ArgumentNullException.ThrowIfNull(damping);
        var n = mass.RowCount;
        var a = Matrix<double>.Build.Dense(2 * n, 2 * n);
        var diagonal = true;
        for (var i = 0; i < n && diagonal; i++)
            for (var j = 0; j < n && diagonal; j++)
                diagonal = i == j || mass[i, j] == 0;
        if (diagonal)
        {
            for (var i = 0; i < n; i++)
            {
                a[i, n + i] = 1;
                var inv = 1 / mass[i, i];
                for (var j = 0; j < n; j++)
                {
                    a[n + i, j] = -inv * stiffness[i, j];
                    a[n + i, n + j] = -inv * damping[i, j];
                }
            }
        }
        else
        {
            // A body's inertia couples its rotations: M⁻¹K and M⁻¹C through a Cholesky solve.
            var cholesky = Matrix<double>.Build.DenseOfMatrix(mass).Cholesky();
            var mk = cholesky.Solve(Matrix<double>.Build.DenseOfMatrix(stiffness));
            var mc = cholesky.Solve(Matrix<double>.Build.DenseOfMatrix(damping));
            for (var i = 0; i < n; i++)
            {
                a[i, n + i] = 1;
                for (var j = 0; j < n; j++)
                {
                    a[n + i, j] = -mk[i, j];
                    a[n + i, n + j] = -mc[i, j];
                }
            }
        }
        var values = a.Evd().EigenValues;
        var scale = values.Select(v => v.Magnitude).DefaultIfEmpty(0).Max();
        var zero = 1e-9 * Math.Max(scale, 1e-300);
        return Listed(values.Where(v => v.Magnitude > zero), scale, [], 0);
    }

    /// <summary>The complex modes of M ẍ + C ẋ + K x = 0 whose free groups (index sets with K ι_g = 0) are known.</summary>
    internal static ImmutableArray<ComplexMode> Solve(Matrix<double> mass, Matrix<double> stiffness, Matrix<double> damping, IReadOnlyList<int[]> freeGroups)
    {
        var n = mass.RowCount;
        var r = freeGroups.Count;
        if (r == 0) return Solve(mass, stiffness, damping);

        var root = Enumerable.Range(0, n).Select(i => Math.Sqrt(mass[i, i])).ToArray();
        // R: M-orthonormal group translations; Q: M-orthonormal complement, from a full QR of M^½R.
        var rigid = Matrix<double>.Build.Dense(n, r);
        for (var g = 0; g < r; g++)
        {
            var total = freeGroups[g].Sum(i => mass[i, i]);
            foreach (var i in freeGroups[g]) rigid[i, g] = 1 / Math.Sqrt(total);
        }
        var scaledRigid = Matrix<double>.Build.Dense(n, r, (i, g) => root[i] * rigid[i, g]);
        var qFull = scaledRigid.QR(MathNet.Numerics.LinearAlgebra.Factorization.QRMethod.Full).Q;
        var p = n - r;
        var q = Matrix<double>.Build.Dense(n, p, (i, j) => qFull[i, r + j] / root[i]);

        var c = Matrix<double>.Build.DenseOfMatrix(damping);
        var rcr = rigid.TransposeThisAndMultiply(c * rigid);
        rcr = (rcr + rcr.Transpose()) * 0.5;
        var rateScale = Enumerable.Range(0, n).Select(i => c.Row(i).L1Norm() / mass[i, i]).DefaultIfEmpty(0).Max();
        var evd = rcr.Evd(MathNet.Numerics.LinearAlgebra.Symmetricity.Symmetric);
        var damped = Enumerable.Range(0, r).Where(j => evd.EigenValues[j].Real > UndampedTolerance * rateScale).ToArray();
        var drifting = r - damped.Length;
        var rc = rigid * Matrix<double>.Build.Dense(r, damped.Length, (i, j) => evd.EigenVectors[i, damped[j]]);

        // State [y; ẏ; v] with v the velocities of the damped translations.
        var k = Matrix<double>.Build.DenseOfMatrix(stiffness);
        var kqq = q.TransposeThisAndMultiply(k * q);
        var cqq = q.TransposeThisAndMultiply(c * q);
        var cqr = q.TransposeThisAndMultiply(c * rc);
        var crr = rc.TransposeThisAndMultiply(c * rc);
        var m = damped.Length;
        var size = 2 * p + m;
        var a = Matrix<double>.Build.Dense(size, size);
        for (var i = 0; i < p; i++)
        {
            a[i, p + i] = 1;
            for (var j = 0; j < p; j++)
            {
                a[p + i, j] = -kqq[i, j];
                a[p + i, p + j] = -cqq[i, j];
            }
            for (var j = 0; j < m; j++)
            {
                a[p + i, 2 * p + j] = -cqr[i, j];
                a[2 * p + j, p + i] = -cqr[i, j];
            }
        }
        for (var i = 0; i < m; i++)
            for (var j = 0; j < m; j++)
                a[2 * p + i, 2 * p + j] = -crr[i, j];

        var values = Array.Empty<Complex>();
        var relaxations = new HashSet<int>();
        if (size > 0)
        {
            var solved = a.Evd();
            values = [.. solved.EigenValues];
            // The m real roots whose eigenvectors carry the most rigid-body kinetic energy |v|² / (|ẏ|² + |v|²).
            double RigidShare(int col)
            {
                double Sq(int i) => solved.EigenVectors[i, col] * solved.EigenVectors[i, col];
                var rigidPart = Enumerable.Range(2 * p, m).Sum(Sq);
                var elastic = Enumerable.Range(p, p).Sum(Sq);
                return rigidPart / Math.Max(rigidPart + elastic, double.Epsilon);
            }
            var imagTolerance = 1e-10 * values.Max(v => v.Magnitude);
            foreach (var col in Enumerable.Range(0, size)
                .Where(col => Math.Abs(values[col].Imaginary) <= imagTolerance)
                .OrderByDescending(RigidShare).Take(m))
                relaxations.Add(col);
        }
        var scale = values.Select(v => v.Magnitude).DefaultIfEmpty(0).Max();
        var relaxationValues = relaxations.Select(col => new Complex(values[col].Real, 0)).ToArray();
        var elasticValues = values.Where((_, col) => !relaxations.Contains(col));
        return Listed(elasticValues, scale, relaxationValues, zeroRoots: r + drifting);
    }

    private static ImmutableArray<ComplexMode> Listed(IEnumerable<Complex> elastic, double scale, IReadOnlyList<Complex> relaxations, int zeroRoots)
    {
        var imagTolerance = 1e-10 * Math.Max(scale, 1e-300);
        var roots = elastic
            .Where(v => v.Imaginary > imagTolerance || Math.Abs(v.Imaginary) <= imagTolerance)
            .OrderBy(v => v.Magnitude)
            .ToArray();
        var list = ImmutableArray.CreateBuilder<ComplexMode>();
        for (var i = 0; i < zeroRoots; i++)
            list.Add(new ComplexMode(list.Count + 1, Complex.Zero, 0, 0, double.NaN, false) { Kind = ComplexModeKind.RigidBody });
        foreach (var v in relaxations.OrderBy(v => v.Magnitude))
            list.Add(new ComplexMode(list.Count + 1, v, v.Magnitude / (2 * Math.PI), 0, double.NaN, false) { Kind = ComplexModeKind.RigidBodyRelaxation });
        foreach (var v in roots)
        {
            var oscillatory = Math.Abs(v.Imaginary) > imagTolerance;
            list.Add(new ComplexMode(list.Count + 1, oscillatory ? v : new Complex(v.Real, 0), v.Magnitude / (2 * Math.PI),
                oscillatory ? v.Imaginary / (2 * Math.PI) : 0, oscillatory ? -v.Real / v.Magnitude : double.NaN, oscillatory));
        }
        return list.ToImmutable();
    }
}
