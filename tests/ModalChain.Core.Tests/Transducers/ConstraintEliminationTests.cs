using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Transducers;

/// <summary>The reduced matrices against TᵀMT, TᵀCT, TᵀKT built independently in the test from the full matrices.</summary>
public class ConstraintEliminationTests
{
    /// <summary>A seeded two-sided network: masses m0..m3 and electrical nodes e0..e3 with resistors and inductors.</summary>
    private static NetworkBuilder Random(int seed)
    {
        var random = new Random(seed);
        var b = new NetworkBuilder { Title = $"random {seed}" }.AddSupport("source");
        for (var i = 0; i < 4; i++) b.AddMass($"m{i}", 1 + 9 * random.NextDouble());
        for (var i = 0; i < 4; i++) b.AddMass($"e{i}", 1e-6 * (1 + random.NextDouble()));
        b.AddSpring("g", Network.Ground, "m0", 1e4 * (1 + random.NextDouble()));
        for (var i = 1; i < 4; i++) b.AddSpring($"s{i}", $"m{i - 1}", $"m{i}", 1e4 * (1 + random.NextDouble()));
        b.AddDamper("dm", "m3", Network.Ground, 20 * random.NextDouble());
        b.AddDamper("r0", "source", "e0", 1 / (1 + 10 * random.NextDouble()));
        b.AddDamper("r1", "e0", "e1", 1 / (1 + 10 * random.NextDouble()));
        b.AddSpring("l2", "e1", "e2", 1 / (1e-3 * (1 + random.NextDouble())));
        b.AddDamper("r3", "e2", Network.Ground, 1 / (1 + 10 * random.NextDouble()));
        b.AddDamper("r4", "e3", "e2", 1 / (1 + 10 * random.NextDouble()));
        b.AddSpring("l5", "e3", Network.Ground, 1 / (1e-3 * (1 + random.NextDouble())));
        b.AddInerter("cap", "e1", "e3", 1e-6 * random.NextDouble());
        return b;
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    public void ReducedMatrices_EqualTheCongruenceOfTheFullOnes(int seed)
    {
        // Reference: the same network without transducers is assembled over all eight nodes; T (8 × 6) is written
        // here from the constraints λ_e1 = λ_e2 + Bl₁(x_m1 − x_m2) and 0 − λ_e3 = Bl₂(0 − x_m3), i.e. λ_e3 = Bl₂ x_m3,
        // and TᵀMT, TᵀCT, TᵀKT must equal the reduced matrices (an identity of the congruence; 1e-12 relative).
        const double bl1 = 7.5, bl2 = 12;
        var full = Random(seed).Build();
        var reduced = Random(seed)
            .AddTransducer("t1", "m1", "m2", "e1", "e2", bl1)      // eliminates e1 = e2 + Bl₁ m1 − Bl₁ m2
            .AddTransducer("t2", Network.Ground, "m3", Network.Ground, "e3", bl2) // n1 is ground: eliminates e3 = 0 − Bl₂·0 + Bl₂ m3
            .Build();
        var f = Assembler.Assemble(full);
        var r = Assembler.Assemble(reduced);
        string[] kept = ["m0", "m1", "m2", "m3", "e0", "e2"];
        Assert.Equal(kept, r.Dofs.Dofs.Select(d => d.Node).ToArray());
        var t = Matrix<double>.Build.Dense(8, 6);
        for (var j = 0; j < kept.Length; j++) t[f.Dofs.IndexOf(kept[j]), j] = 1;
        int Col(string node) => Array.IndexOf(kept, node);
        var e1 = f.Dofs.IndexOf("e1");
        t[e1, Col("e2")] = 1;
        t[e1, Col("m1")] = bl1;
        t[e1, Col("m2")] = -bl1;
        t[f.Dofs.IndexOf("e3"), Col("m3")] = bl2;
        NumericAssert.Close(t.Transpose() * f.DenseMass() * t, r.DenseMass(), Tolerance.Rel(1e-12), "TᵀMT");
        NumericAssert.Close(t.Transpose() * f.DenseStiffness() * t, r.DenseStiffness(), Tolerance.Rel(1e-12), "TᵀKT");
        NumericAssert.Close(t.Transpose() * f.DenseDamping() * t, r.DenseDamping(), Tolerance.Rel(1e-12), "TᵀCT");
        Assert.False(r.MassIsDiagonal);
    }

    [Fact]
    public void SupportPartition_PutsTheSourceColumnThroughTheSameCongruence()
    {
        // The free block of the partition equals the assembled matrices, and the support column of "source" carries the
        // resistor r0 to e0 only (no constraint names the source): K_fp, C_fp against the full partition's columns
        // mapped by Tᵀ (identity of the congruence; 1e-12).
        var full = Random(4).Build();
        var reduced = Random(4).AddTransducer("t1", "m1", "m2", "e1", "e2", 3).Build();
        var p = SupportPartition.Assemble(reduced);
        var a = Assembler.Assemble(reduced);
        NumericAssert.Close(a.DenseDamping(), Matrix<double>.Build.DenseOfMatrix(p.DamperFF), Tolerance.Rel(1e-12), "C_ff");
        NumericAssert.Close(a.DenseStiffness(), Matrix<double>.Build.DenseOfMatrix(p.StiffnessFF), Tolerance.Rel(1e-12), "K_ff");
        NumericAssert.Close(a.DenseMass(), Matrix<double>.Build.DenseOfMatrix(p.Mass), Tolerance.Rel(1e-12), "M");
        var pf = SupportPartition.Assemble(full);
        var s = p.SupportIndex("source");
        var kept = p.Free.Dofs.Select(d => d.Node).ToArray();
        for (var j = 0; j < kept.Length; j++)
        {
            var i = pf.Free.IndexOf(kept[j]);
            var expected = pf.DamperFP[i, s] + (kept[j] switch { "e2" => 1.0, "m1" => 3.0, "m2" => -3.0, _ => 0.0 }) * pf.DamperFP[pf.Free.IndexOf("e1"), s];
            NumericAssert.Close(expected, p.DamperFP[j, s], Tolerance.Abs(1e-14), $"C_fp[{kept[j]}]");
        }
    }

    [Fact]
    public void BuilderRefuses_TransducersItCannotEliminate()
    {
        // Common practice for constraint elimination: each constraint needs a coordinate of its own.
        NetworkBuilder Base() => new NetworkBuilder().AddMass("m", 1).AddMass("n", 1).AddMass("e", 1e-6).AddSupport("s");
        Assert.Contains("both branch terminals on supports",
            Assert.Throws<ArgumentException>(() => Base().AddTransducer("t", "m", Network.Ground, "s", Network.Ground, 1)).Message);
        Assert.Contains("already eliminates",
            Assert.Throws<ArgumentException>(() => Base().AddTransducer("t", "m", Network.Ground, "e", Network.Ground, 1)
                .AddTransducer("u", "n", Network.Ground, "e", Network.Ground, 1)).Message);
        Assert.Contains("mechanical terminal",
            Assert.Throws<ArgumentException>(() => Base().AddTransducer("t", "m", Network.Ground, "m", Network.Ground, 1)).Message);
        Assert.Contains("names as a terminal",
            Assert.Throws<ArgumentException>(() => Base().AddTransducer("t", "m", "e", "n", Network.Ground, 1)
                .AddTransducer("u", "m", Network.Ground, "e", Network.Ground, 1)).Message);
        Assert.Throws<ArgumentOutOfRangeException>(() => Base().AddTransducer("t", "m", Network.Ground, "e", Network.Ground, 0));
    }
}
