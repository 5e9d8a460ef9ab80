using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Harmonic;

/// <summary>The sparse direct engine of large models against the Hessenberg engine of small ones (same equations).</summary>
public class SparseDirectEngineTests
{
    [Theory]
    [InlineData(31)]
    [InlineData(32)]
    public void SparseAndHessenbergEngines_GiveTheSameResponse(int seed)
    {
        // Identity: both solve (K(1+iη) − ω²M + iωC) X = F exactly (non-classical dampers, Rayleigh, loss factor, a
        // force and an unbalance), one by a sparse complex LDLᵀ per frequency, the other through a Hessenberg form of
        // the state matrix. Both engines are built directly, so 80 DOFs keep the dense reference cheap. Tolerance 1e-8 of
        // each output's largest value.
        var network = HarmonicModels.Random(seed, 80, dampers: true);
        var model = new StructuralModel(network, new DampingModel([], RayleighDamping.FromTargets(0.01, 0.2, 3), 0.01),
            [new ForceLoad("f", "m4", 500, 0.2), new UnbalanceLoad("u", "m70", 0.02, null, 0.7)]);
        var system = DampedSystem.Build(model, new ModalChain.Core.Analyses.Modal.ModalOptions(Count: 10));
        var loading = HarmonicLoading.Compile(system, model.Loads);
        var outputs = new[] { 4, 30, 70, 79 };
        var rows = outputs.Select(i => { var w = new double[80]; w[i] = 1; return w; }).ToArray();
        var sparse = new SparseDirectEngine(system, loading, rows);
        var dense = new DirectEngine(system, loading, rows);
        var (ws, wd) = (sparse.CreateWorkspace(), dense.CreateWorkspace());
        var xs = new Complex[outputs.Length];
        var xd = new Complex[outputs.Length];
        var powers = new Complex[HarmonicLoading.MaxPower - HarmonicLoading.MinPower + 1];
        var coefficients = new Complex[loading.Terms.Count];
        foreach (var f in new[] { 0.05, 0.21, 0.6, 1.3, 4.0 })
        {
            var omega = 2 * Math.PI * f;
            HarmonicLoading.Powers(omega, powers);
            for (var r = 0; r < coefficients.Length; r++) coefficients[r] = powers[loading.Terms[r].Power - HarmonicLoading.MinPower];
            Assert.True(sparse.Solve(omega, coefficients, xs, ws));
            Assert.True(dense.Solve(omega, coefficients, xd, wd));
            var scale = xd.Max(v => v.Magnitude);
            for (var k = 0; k < outputs.Length; k++)
                NumericAssert.Small((xs[k] - xd[k]).Magnitude, 1e-8 * scale, $"seed {seed}, {f} Hz, output m{outputs[k]}");
        }
    }

    [Fact]
    public void ASweepOfALargeModel_SaysItUsedTheSparseSolve()
    {
        var network = HarmonicModels.Random(33, 320, dampers: true);
        var model = new StructuralModel(network, DampingModel.None, [new ForceLoad("f", "m4", 500, 0)]);
        var spec = new HarmonicSpec([], new FrequencyRange(0.1, 1, 20, FrequencySpacing.Linear), false, ["m4"], HarmonicMethod.Direct);
        var system = HarmonicAnalysis.Assemble(model, spec);
        Assert.True(DirectEngines.UsesSparse(system));
        var result = HarmonicAnalysis.Solve(system, spec);
        Assert.Contains(result.Notes, n => n.StartsWith("direct solve (sparse complex LDLᵀ", StringComparison.Ordinal));
    }
}
