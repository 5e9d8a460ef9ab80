using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Core.Tests.Analyses.Harmonic;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Assembly;

/// <summary>Rayleigh and modal damping without discrete dampers: the closed-form modal damping against the projected C.</summary>
public class ProportionalDampingTests
{
    private static IEnumerable<StructuralModel> Models(Network network) =>
    [
        new StructuralModel(network, new DampingModel([], new RayleighDamping(0.4, 0.002), 0), []),
        new StructuralModel(network, new DampingModel([], new RayleighDamping(0, 0.001), 0.02), []),
        new StructuralModel(network, new DampingModel([], new RayleighDamping(1.5, 0), 0), []),
        new StructuralModel(network, new DampingModel([0.02, 0.05, 0.01], null, 0), []),
    ];

    [Fact]
    public void ClosedForm_EqualsPhiTransposeCPhi_OfTheAssembledMatrix()
    {
        // Φᵀ(a0·M + a1·K)Φ = a0·I + a1·Λ (Chopra, Dynamics of Structures, §11.4) and Φᵀ C_m Φ = diag(2ζ_jω_j) (§11.4.2)
        // for mass-normalised shapes: the closed form the damped system now uses must equal the projection of the C
        // it would assemble, computed here by the matrix route (DampingAssembly.ModalCoordinates of Damping.FF).
        // Identity; tolerance 1e-12 of the largest entry (matrix) and 1e-12 absolute (ratios). Seeded random networks,
        // and a network with two rigid-body modes (free groups), where a0 alone damps the rigid-body modes.
        var free = new NetworkBuilder().AddMass("a", 10).AddMass("b", 4).AddMass("c", 6).AddMass("d", 3).AddMass("e", 5)
            .AddSpring("ka", Network.Ground, "a", 4e4).AddSpring("kbc", "b", "c", 2e5).AddSpring("kde", "d", "e", 1e3).Build();
        var networks = Enumerable.Range(1, 6).Select(seed => HarmonicModels.Random(seed, 9, dampers: false)).Append(free);
        foreach (var network in networks)
            foreach (var model in Models(network))
            {
                var system = DampedSystem.Build(model);
                var label = $"{network.Title}, {model.Damping}";
                var projected = DampingAssembly.ModalCoordinates(system.Modes, system.Damping.FF);
                var scale = projected.Enumerate().Max(Math.Abs);
                NumericAssert.Small((system.ModalDamping - projected).Enumerate().Max(Math.Abs), 1e-12 * scale, label + ": Φᵀ C Φ");
                var reference = DampingAssembly.ModalRatios(system.Modes, projected, model.Damping.LossFactor);
                for (var j = 0; j < reference.Length; j++)
                {
                    if (double.IsNaN(reference[j])) { Assert.True(double.IsNaN(system.ModalDampingRatios[j]), $"{label}: rigid-body mode {j + 1}"); continue; }
                    NumericAssert.Close(reference[j], system.ModalDampingRatios[j], Tolerance.Abs(1e-12), $"{label}: ratio of mode {j + 1}");
                }
                Assert.Equal(0, system.NonClassicalIndex);
                Assert.True(system.IsClassical, label);
                Assert.Equal(system.Damping.FF.Enumerate().Any(v => v != 0), system.HasViscousDamping);
            }
    }

    [Fact]
    public void RayleighRatios_FollowTheTextbookFormula()
    {
        // ζ(ω) = a0/(2ω) + a1·ω/2 plus η/2 for the loss factor (Chopra, Dynamics of Structures, §11.4; η/2: common
        // practice). Closed form against closed form, but from the modes' own ω; tolerance 1e-15 absolute.
        var network = HarmonicModels.Random(3, 12, dampers: false);
        var rayleigh = new RayleighDamping(0.7, 0.0015);
        var system = DampedSystem.Build(new StructuralModel(network, new DampingModel([], rayleigh, 0.01), []));
        foreach (var mode in system.Modes.Modes)
            NumericAssert.Close(rayleigh.RatioAt(mode.AngularFrequency) + 0.005, system.ModalDampingRatios[mode.Number - 1],
                Tolerance.Abs(1e-15), $"mode {mode.Number}");
    }

    [Fact]
    public void ZeroRatios_AreNotViscousDamping_AndDeferredCIsTheAssembledOne()
    {
        // Modal ratios of 0 give C = 0 (no viscous damping) without forming C. The support blocks formed on first read
        // (C_fp = a1·K_fp − a0·M T − MΦ diag(2ζω) ΦᵀM T, never forming C_m) equal those of the dense route
        // DampingAssembly.Build (C_m = MΦ diag(2ζω) ΦᵀM formed, then C·T; identity, tolerance 1e-12 of the largest
        // entry), and rigid motion with the single support is not damped (Chopra §13.5 [from memory]): C_full·1 = 0 to
        // 1e-9 of the largest entry. Modal ratios and Rayleigh damping with both coefficients, on two seeded networks.
        var network = HarmonicModels.Random(5, 8, dampers: false);
        var none = DampedSystem.Build(new StructuralModel(network, new DampingModel([0.0], null, 0), []));
        Assert.False(none.HasViscousDamping);
        foreach (var model in Models(network).Concat(Models(HarmonicModels.Random(6, 11, dampers: false))))
        {
            var system = DampedSystem.Build(model);
            Assert.True(system.HasViscousDamping);
            var direct = DampingAssembly.Build(model, system.Partition, system.Modes);
            NumericAssert.Close(direct.FF, system.Damping.FF, Tolerance.Abs(1e-12 * direct.FF.Enumerate().Max(Math.Abs)), "C_ff");
            NumericAssert.Close(direct.FP, system.Damping.FP, Tolerance.Abs(1e-12 * direct.FF.Enumerate().Max(Math.Abs)), "C_fp");
            NumericAssert.Close(direct.PP, system.Damping.PP, Tolerance.Abs(1e-12 * direct.FF.Enumerate().Max(Math.Abs)), "C_pp");
            CheckRigidMotion(system);
        }
    }

    private static void CheckRigidMotion(DampedSystem system)
    {
        var full = Matrix<double>.Build.DenseOfMatrixArray(new[,] { { system.Damping.FF, system.Damping.FP }, { system.Damping.FP.Transpose(), system.Damping.PP } });
        var ones = Vector<double>.Build.Dense(full.RowCount, 1.0);
        NumericAssert.Small((full * ones).AbsoluteMaximum(), 1e-9 * full.Enumerate().Max(Math.Abs), "C·1");
    }

    [Fact]
    public void CompressedRowSum_EqualsMathNetSum()
    {
        // The one-pass sum over compressed rows against Math.NET's own a + β·b (an independent implementation), entry
        // for entry and exactly (the same floating-point operations), on seeded random sparse matrices with overlapping patterns.
        var random = new Random(7);
        for (var trial = 0; trial < 20; trial++)
        {
            Matrix<double> Sparse() => Matrix<double>.Build.SparseOfIndexed(30, 25,
                Enumerable.Range(0, 60).Select(_ => (random.Next(30), random.Next(25), random.NextDouble() - 0.5)).DistinctBy(e => (e.Item1, e.Item2)));
            var (a, b, beta) = (Sparse(), Sparse(), random.NextDouble() * 3 - 1);
            Assert.Equal(a + beta * b, DampingAssembly.Sum(a, beta, b));
        }
    }
}
