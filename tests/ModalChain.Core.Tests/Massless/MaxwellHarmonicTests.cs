using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Massless;

/// <summary>Harmonic responses through Maxwell and standard-linear-solid mounts against their complex stiffness.</summary>
public class MaxwellHarmonicTests
{
    private static HarmonicResult Sweep(Network network, double[] frequencies, HarmonicMethod method = HarmonicMethod.Direct)
    {
        var force = new ForceLoad("f", "m", 1, 0);
        var system = DampedSystem.Build(new StructuralModel(network, DampingModel.None, [force]));
        return HarmonicAnalysis.Sweep(system, frequencies, [force], ["m", "inner"], method);
    }

    [Theory]
    [InlineData(50.0, 8e4, 400.0)]
    [InlineData(1200.0, 3e6, 1.2e5)]
    public void MaxwellMount_ComplexStiffness_IsStorageAndLossOfTheClosedForm(double m, double k, double c)
    {
        // Closed form (derived in docs/methods.md): the series spring and damper have 1/K* = 1/k + 1/(iωc), so
        // K* = k(ωτ)²/(1 + (ωτ)²) + i·kωτ/(1 + (ωτ)²) with τ = c/k. A unit force on m gives X = 1/(K* − ω²m), so the
        // mount's K* is read back from the direct solve as 1/X + ω²m.
        var tau = c / k;
        double[] frequencies = [0.05 / tau / (2 * Math.PI), 0.7 / tau / (2 * Math.PI), 1 / tau / (2 * Math.PI), 4 / tau / (2 * Math.PI), 30 / tau / (2 * Math.PI)];
        var result = Sweep(MasslessTestKit.MassOnMaxwell(m, k, c), frequencies);
        for (var f = 0; f < frequencies.Length; f++)
        {
            var omega = 2 * Math.PI * frequencies[f];
            var wt = omega * tau;
            var storage = k * wt * wt / (1 + wt * wt);
            var loss = k * wt / (1 + wt * wt);
            var x = result.ResponseOf("m")!.Displacement[f];
            var kStar = 1 / x + omega * omega * m;
            NumericAssert.Close(storage, kStar.Real, Tolerance.Abs(1e-9 * k), $"storage stiffness at ωτ = {wt}");
            NumericAssert.Close(loss, kStar.Imaginary, Tolerance.Abs(1e-9 * k), $"loss stiffness at ωτ = {wt}");
            // The inner node follows from the damper's force balance: iωc·Y = k(X − Y).
            var y = result.ResponseOf("inner")!.Displacement[f];
            NumericAssert.Small((y - k * x / (k + new Complex(0, omega * c))).Magnitude, 1e-10 * x.Magnitude, $"inner node at ωτ = {wt}");
        }
    }

    [Fact]
    public void StandardLinearSolid_LossFactorPeaks_AtOneOverTauRootOnePlusK2OverK1()
    {
        // Closed form (derived in docs/methods.md): K* = k1 + k2(ωτ)²/(1+(ωτ)²) + i·k2ωτ/(1+(ωτ)²), τ = c/k2 (the
        // damper with the series spring k2). tan δ = k2 u / (k1 + (k1+k2)u²), u = ωτ, peaks at u² = k1/(k1+k2), i.e.
        // ω = 1/(τ√(1 + k2/k1)), with the peak value k2 / (2√(k1(k1+k2))).
        double m = 30, k1 = 6e4, k2 = 1.8e5, c = 450;
        var tau = c / k2;
        var peak = 1 / (tau * Math.Sqrt(1 + k2 / k1));
        double[] omegas = [peak * 0.98, peak, peak * 1.02];
        var result = Sweep(MasslessTestKit.MassOnStandardLinearSolid(m, k1, k2, c), [.. omegas.Select(w => w / (2 * Math.PI))]);
        var tan = new double[3];
        for (var i = 0; i < 3; i++)
        {
            var kStar = 1 / result.ResponseOf("m")!.Displacement[i] + omegas[i] * omegas[i] * m;
            tan[i] = kStar.Imaginary / kStar.Real;
        }
        Assert.True(tan[1] > tan[0] && tan[1] > tan[2], $"tan δ {tan[0]}, {tan[1]}, {tan[2]} must peak at the middle frequency");
        NumericAssert.Close(k2 / (2 * Math.Sqrt(k1 * (k1 + k2))), tan[1], Tolerance.Rel(1e-9), "peak loss factor");
    }

    [Fact]
    public void ModalMethod_FallsBackToDirect_WithANote_WhenFirstOrderStatesExist()
    {
        // Common practice: undamped modes do not describe a first-order state, so the modal method must not be used
        // silently; the result must equal the direct one and say why.
        var network = MasslessTestKit.MassOnStandardLinearSolid(30, 6e4, 1.8e5, 450);
        double[] frequencies = [3, 7, 12];
        var direct = Sweep(network, frequencies);
        var modal = Sweep(network, frequencies, HarmonicMethod.Modal);
        Assert.Contains(modal.Notes, n => n.Contains("first-order state", StringComparison.Ordinal));
        for (var f = 0; f < frequencies.Length; f++)
            Assert.Equal(direct.ResponseOf("m")!.Displacement[f], modal.ResponseOf("m")!.Displacement[f]);
    }

    [Fact]
    public void DirectSolve_OnAChainWithMaxwellAndSeriesNodes_MatchesTheDenseComplexSolve()
    {
        // Independent reference: the dense complex solve assembled element by element in the test (MasslessTestKit).
        var network = new NetworkBuilder { Title = "two masses, three massless nodes" }
            .AddMass("m1", 220).AddNode("a").AddMass("m2", 35).AddNode("b").AddNode("c")
            .AddSpring("k1", Network.Ground, "a", 4e5).AddDamper("d1", "a", "m1", 900)
            .AddSpring("k2", "m1", "b", 2e5).AddSpring("k3", "b", "m2", 1e5).AddSpring("k4", "m1", Network.Ground, 1e5)
            .AddSpring("k5", "m2", "c", 3e4).AddDamper("d2", "c", Network.Ground, 60)
            .Build();
        var force = new ForceLoad("f", "m1", 1, 0);
        var system = DampedSystem.Build(new StructuralModel(network, DampingModel.None, [force]));
        double[] frequencies = [0.5, 3, 6.4, 9, 25];
        var names = network.Masses.Select(m => m.Name).ToArray();
        var result = HarmonicAnalysis.Sweep(system, frequencies, [force], names, HarmonicMethod.Direct);
        for (var f = 0; f < frequencies.Length; f++)
        {
            var reference = MasslessTestKit.DenseSolve(network, 2 * Math.PI * frequencies[f], new Dictionary<string, Complex> { ["m1"] = 1 });
            var scale = reference.Max(x => x.Magnitude);
            for (var i = 0; i < names.Length; i++)
                NumericAssert.Small((result.ResponseOf(names[i])!.Displacement[f] - reference[i]).Magnitude, 1e-10 * scale, $"{names[i]} at {frequencies[f]} Hz");
        }
    }
}
