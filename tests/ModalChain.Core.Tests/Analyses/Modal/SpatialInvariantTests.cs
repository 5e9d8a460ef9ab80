using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Modal;

/// <summary>
/// Identities every correct modal result of a plane or 3d model satisfies, on seeded random networks: effective masses
/// per direction sum to ι_dᵀMι_d (Chopra, Dynamics of Structures, §13.2, for the translation; the same completeness
/// argument for a rotation), M-orthonormality, residuals, and invariance of the frequencies under a rigid motion of
/// the whole model (common practice).
/// </summary>
public class SpatialInvariantTests
{
    private static readonly Direction[] Translations = [Direction.X, Direction.Y, Direction.Z];
    private static readonly Direction[] Rotations = [Direction.Rx, Direction.Ry, Direction.Rz];

    /// <summary>A rigid motion x → R x + t applied to a model.</summary>
    private sealed record Motion(Matrix<double> R, Point3 T)
    {
        public static Motion Identity { get; } = new(Matrix<double>.Build.DenseIdentity(3), default);

        public Point3 Apply(Point3 p) => Rotate(p) + T;

        public Point3 Rotate(Point3 p)
        {
            var v = R * Vector<double>.Build.DenseOfArray([p.X, p.Y, p.Z]);
            return new Point3(v[0], v[1], v[2]);
        }

        public InertiaMatrix Apply(InertiaMatrix j)
        {
            var a = R * Matrix<double>.Build.DenseOfArray(j.ToArray()) * R.Transpose();
            return new InertiaMatrix(a[0, 0], a[1, 1], a[2, 2], a[0, 1], a[1, 2], a[0, 2]);
        }

        /// <summary>A seeded random rotation (a normalised random quaternion) and translation.</summary>
        public static Motion Random(Random random)
        {
            var q = Enumerable.Range(0, 4).Select(_ => random.NextDouble() * 2 - 1).ToArray();
            var n = Math.Sqrt(q.Sum(x => x * x));
            var (w, x, y, z) = (q[0] / n, q[1] / n, q[2] / n, q[3] / n);
            var r = Matrix<double>.Build.DenseOfArray(new[,]
            {
                { 1 - 2 * (y * y + z * z), 2 * (x * y - z * w), 2 * (x * z + y * w) },
                { 2 * (x * y + z * w), 1 - 2 * (x * x + z * z), 2 * (y * z - x * w) },
                { 2 * (x * z - y * w), 2 * (y * z + x * w), 1 - 2 * (x * x + y * y) },
            });
            return new Motion(r, new Point3(random.NextDouble() * 20 - 10, random.NextDouble() * 20 - 10, random.NextDouble() * 20 - 10));
        }
    }

    private static Point3 RandomPoint(Random random, double size = 2) =>
        new(random.NextDouble() * 2 * size - size, random.NextDouble() * 2 * size - size, random.NextDouble() * 2 * size - size);

    /// <summary>
    /// A random 3d network of point masses and bodies, placed by <paramref name="motion"/>. With <paramref name="isotropic"/>
    /// every directional element has equal components in x, y, z (and in rx, ry, rz), so rotating the model leaves
    /// its matrices congruent; otherwise masses move in random subsets of the translations and components are random.
    /// </summary>
    private static Network RandomNetwork(int seed, Motion motion, bool isotropic, bool held = true)
    {
        var random = new Random(seed);
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.PlaceGround(new Support(Network.Ground) { Location = motion.Apply(RandomPoint(random)) });
        b.AddSupport(new Support("base") { Location = motion.Apply(RandomPoint(random)) });
        var ends = new List<(string Reference, string Node, bool PointMass)> { (Network.Ground, Network.Ground, false), ("base", "base", false) };
        var masses = random.Next(2, 5);
        for (var i = 0; i < masses; i++)
        {
            var moves = isotropic ? [] : Translations.Where(_ => random.NextDouble() < 0.7).ToImmutableArray();
            b.AddMass(new Mass($"m{i}", 5 + 50 * random.NextDouble()) { Location = motion.Apply(RandomPoint(random)), Moves = moves });
            ends.Add(($"m{i}", $"m{i}", true));
        }
        var bodies = random.Next(1, 3);
        for (var i = 0; i < bodies; i++)
        {
            var axes = Motion.Random(random);
            var principal = new[] { 2 + 20 * random.NextDouble(), 2 + 20 * random.NextDouble(), 2 + 20 * random.NextDouble() };
            var inertia = InertiaMatrix.FromPrincipal(principal, [axes.Rotate(new Point3(1, 0, 0)), axes.Rotate(new Point3(0, 1, 0)), axes.Rotate(new Point3(0, 0, 1))]);
            var centre = RandomPoint(random);
            var points = Enumerable.Range(0, 3).Select(p => new BodyPoint($"p{p}", motion.Apply(centre + RandomPoint(random, 0.8)))).ToImmutableArray();
            b.AddBody(new RigidBody($"b{i}", 40 + 300 * random.NextDouble(), motion.Apply(centre), motion.Apply(inertia), points));
            ends.Add(($"b{i}", $"b{i}", false));
            foreach (var p in points) ends.Add(($"b{i}.{p.Name}", $"b{i}", false));
        }
        var springs = held ? 4 + masses + 3 * bodies : masses + bodies;
        for (var s = 0; s < springs; s++)
        {
            var a = ends[random.Next(ends.Count)];
            var c = ends[random.Next(ends.Count)];
            // Only the movable ends on the second end keep some springs between free nodes.
            if (a.Node == c.Node || (a.Node is Network.Ground or "base" && c.Node is Network.Ground or "base")) { s--; continue; }
            var k = 1e3 + 1e5 * random.NextDouble();
            if (random.NextDouble() < 0.4)
            {
                b.AddSpring(new Spring($"s{s}", a.Reference, c.Reference, k) { Axial = true });
                continue;
            }
            var components = isotropic
                ? Translations.Select(d => new DirectionalValue(d, k)).ToList()
                : Translations.Where(_ => random.NextDouble() < 0.7).Select(d => new DirectionalValue(d, k * (0.2 + random.NextDouble()))).ToList();
            if (components.Count == 0) components.Add(new DirectionalValue(Direction.Z, k));
            if (!a.PointMass && !c.PointMass && random.NextDouble() < 0.5)
            {
                var kr = 1e2 + 1e4 * random.NextDouble();
                components.AddRange(isotropic
                    ? Rotations.Select(d => new DirectionalValue(d, kr))
                    : Rotations.Where(_ => random.NextDouble() < 0.5).Select(d => new DirectionalValue(d, kr * (0.2 + random.NextDouble()))));
            }
            b.AddSpring(new Spring($"s{s}", a.Reference, c.Reference, components.Where(x => !x.Direction.IsRotation()).Max(x => x.Value)) { Components = [.. components] });
        }
        return b.Build();
    }

    public static TheoryData<int> Seeds => [.. Enumerable.Range(1, 12).Select(i => 20261202 + i)];

    [Theory]
    [MemberData(nameof(Seeds))]
    public void EffectiveMassesPerDirection_SumToTheTotalMassAndTheInertiaAboutTheReferencePoint(int seed)
    {
        foreach (var (isotropic, held) in new[] { (false, true), (true, true), (false, false) })
        {
            var network = RandomNetwork(seed, Motion.Identity, isotropic, held);
            var result = ModalAnalysis.Solve(network);
            var what = $"seed {seed} (isotropic {isotropic}, held {held})";
            Assert.Equal(result.Matrices.Size, result.Modes.Length);
            // The rigid-body count is the dimension of K's null space; here from an SVD of M^-½ K M^-½ (another algorithm).
            var root = result.Matrices.DenseMass().Cholesky().Factor;
            var scaled = root.Solve(root.Solve(result.Matrices.DenseStiffness()).Transpose());
            var singular = scaled.Svd().S;
            Assert.Equal(singular.Count(v => v <= 1e-10 * singular[0]), result.RigidBodyModeCount);
            if (!held) Assert.True(result.RigidBodyModeCount > 0, $"{what}: the loose network has rigid-body modes");
            foreach (var total in result.TotalByDirection)
            {
                var sum = result.Modes.Sum(m => m.Participation.Single(p => p.Direction == total.Direction).EffectiveMass);
                NumericAssert.Close(total.Value, sum, Tolerance.Rel(1e-9), $"{what}: Σ M*_{total.Direction.Label()}");
                var last = result.Modes[^1].Participation.Single(p => p.Direction == total.Direction).CumulativeFraction;
                NumericAssert.Close(1, last, Tolerance.Abs(1e-9), $"{what}: cumulative fraction in {total.Direction.Label()}");
            }
            NumericAssert.Close(network.TotalMass - network.Masses.Where(m => !m.Moves.IsDefaultOrEmpty && !m.Moves.Contains(Direction.Z)).Sum(m => m.Kilograms),
                result.TotalByDirection.Single(t => t.Direction == Direction.Z).Value, Tolerance.Rel(1e-14), $"{what}: mass moving in z");
            NumericAssert.Small(result.Quality.MaxOrthogonalityError, 1e-10, $"{what}: Φᵀ M Φ − I");
            NumericAssert.Small(result.Quality.MaxResidual, 1e-8, $"{what}: residual");
            foreach (var mode in result.Modes)
            {
                NumericAssert.Close(1, mode.KineticEnergyShare.Sum(), Tolerance.Abs(1e-12), $"{what}, mode {mode.Number}: Σ kinetic shares");
                NumericAssert.Close(1, mode.KineticEnergyByDirection.Sum(s => s.Value), Tolerance.Abs(1e-12), $"{what}, mode {mode.Number}: Σ shares by direction");
                NumericAssert.Close(mode.IsRigidBody ? 0 : 1, mode.StrainEnergyShare.Sum(), Tolerance.Abs(1e-12), $"{what}, mode {mode.Number}: Σ strain shares");
                Assert.False(string.IsNullOrEmpty(mode.Motion));
            }
        }
    }

    [Theory]
    [MemberData(nameof(Seeds))]
    public void RotatingAndTranslatingTheWholeModel_LeavesEveryFrequencyUnchanged(int seed)
    {
        var before = ModalAnalysis.Solve(RandomNetwork(seed, Motion.Identity, isotropic: true));
        var motion = Motion.Random(new Random(seed * 7 + 1));
        var rotated = ModalAnalysis.Solve(RandomNetwork(seed, motion, isotropic: true));
        var shifted = ModalAnalysis.Solve(RandomNetwork(seed, Motion.Identity with { T = motion.T }, isotropic: false));
        var plain = ModalAnalysis.Solve(RandomNetwork(seed, Motion.Identity, isotropic: false));
        var scale = before.Modes[^1].EigenValue;
        NumericAssert.Close(before.Modes.Select(m => m.EigenValue).ToArray(), rotated.Modes.Select(m => m.EigenValue).ToArray(),
            new Tolerance(1e-12 * scale, 1e-9), $"seed {seed}: ω² after a rotation and translation");
        NumericAssert.Close(plain.Modes.Select(m => m.EigenValue).ToArray(), shifted.Modes.Select(m => m.EigenValue).ToArray(),
            new Tolerance(1e-12 * plain.Modes[^1].EigenValue, 1e-9), $"seed {seed}: ω² after a translation");
        // Translational totals do not depend on the axes; the inertia about the centre of mass has the same trace.
        double Trace(ModalResult r) => r.TotalByDirection.Where(t => t.Direction.IsRotation()).Sum(t => t.Value);
        NumericAssert.Close(Trace(before), Trace(rotated), Tolerance.Rel(1e-12), $"seed {seed}: trace of the inertia about the centre of mass");
    }
}
