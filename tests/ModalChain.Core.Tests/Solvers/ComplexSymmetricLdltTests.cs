using System.Numerics;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Solvers;

/// <summary>The complex symmetric sparse LDLᵀ of a dynamic stiffness against the dense complex LU.</summary>
public class ComplexSymmetricLdltTests
{
    [Theory]
    [InlineData(1, 0.3)]
    [InlineData(2, 4.0)]
    [InlineData(3, 17.0)]
    [InlineData(6, 55.0)]
    public void SolveOfTheDynamicStiffness_MatchesTheDenseLu(int seed, double frequencyHz)
    {
        // Identity: Z x = b solved by LDLᵀ on one pattern and by Gaussian elimination with partial pivoting agree to
        // round-off. Z = K(1+iη) − ω²M + iωC of seeded random networks with dampers (C not proportional); tolerance
        // 1e-9 of max|x|. The factor is refactorised at a second frequency to check that the workspace is reused cleanly.
        var network = TestNetworks.Random(new Random(seed), 40);
        if (Topology.UnsupportedGroups(network).Length > 0) network = TestNetworks.Random(new Random(seed + 100), 40);
        var p = SupportPartition.Assemble(network);
        var k = SymmetricSparseMatrix.From(p.StiffnessFF);
        var m = SymmetricSparseMatrix.From(p.Mass);
        var c = SymmetricSparseMatrix.From(p.DamperFF);
        var n = k.Size;
        var factor = new ComplexSymmetricLdlt(SparseLdltPattern.Analyse(k, m, c));
        var random = new Random(seed);
        foreach (var f in new[] { frequencyHz, 1.7 * frequencyHz })
        {
            var omega = 2 * Math.PI * f;
            var hysteretic = new Complex(1, 0.02);
            Assert.True(factor.Factor([(hysteretic, k), (-omega * omega, m), (new Complex(0, omega), c)]));
            var b = Enumerable.Range(0, n).Select(_ => new Complex(random.NextDouble() - 0.5, random.NextDouble() - 0.5)).ToArray();
            var x = (Complex[])b.Clone();
            factor.Solve(x);

            var z = new Complex[n * n];
            for (var i = 0; i < n; i++)
                for (var j = 0; j < n; j++)
                    z[i * n + j] = hysteretic * k[i, j] - omega * omega * m[i, j] + new Complex(0, omega * c[i, j]);
            var pivots = new int[n];
            Assert.True(ComplexLu.Factor(z, n, pivots));
            var reference = (Complex[])b.Clone();
            ComplexLu.Solve(z, n, pivots, reference);
            var scale = reference.Max(v => v.Magnitude);
            for (var i = 0; i < n; i++)
                NumericAssert.Small((x[i] - reference[i]).Magnitude, 1e-9 * scale, $"seed {seed}, {f:G4} Hz: x[{i}]");
        }
    }

    [Fact]
    public void AZeroMatrix_IsRefusedAsSingular()
    {
        // A dynamic stiffness with a zero pivot (an undamped mass at zero frequency on no spring) cannot be factorised.
        var zero = SymmetricSparseMatrix.Diagonal([0.0, 0.0]);
        var factor = new ComplexSymmetricLdlt(SparseLdltPattern.Analyse(SymmetricSparseMatrix.Diagonal([1.0, 1.0])));
        Assert.False(factor.Factor([(Complex.One, zero)]));
    }
}
