using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Modal;

/// <summary>
/// A very stiff spring beside ordinary ones (a "rigid" connection modelled as a spring): no real mode may be taken for a
/// rigid-body mode, and every frequency keeps its relative accuracy (issue 12, item 1).
/// </summary>
public class StiffSpringTests
{
    /// <summary>
    /// Roots ω1² ≤ ω2² of m1·m2·ω⁴ − [m1(k2+k3) + m2(k1+k2)]ω² + (k1+k2)(k2+k3) − k2² = 0 (REFERENCES.md §1, the
    /// two-DOF frequency equation, Rao ch. 5 [from memory]), written without cancellation: the constant term is
    /// k1k2 + k1k3 + k2k3 and the discriminant (m1(k2+k3) − m2(k1+k2))² + 4m1m2k2².
    /// </summary>
    private static (double Low, double High) ClosedForm(double m1, double m2, double k1, double k2, double k3)
    {
        var a = m1 * m2;
        var b = m1 * (k2 + k3) + m2 * (k1 + k2);
        var c = k1 * k2 + k1 * k3 + k2 * k3;
        var d = m1 * (k2 + k3) - m2 * (k1 + k2);
        var high = (b + Math.Sqrt(d * d + 4 * a * k2 * k2)) / (2 * a);
        return (c / (a * high), high);
    }

    [Fact]
    public void IssueExample_HasTwoFlexibleModesAtTheClosedFormFrequencies()
    {
        // ground –1e14 N/m– m0 –100 N/m– m1, 1 kg each: ω1 ≈ 10 rad/s (1.59 Hz) was reported as a 0 Hz rigid-body mode.
        // Closed form REFERENCES.md §1 with k3 = 0; tolerance 1e-10 relative (the issue asks 1e-8).
        var result = ModalAnalysis.Solve(TestNetworks.TwoMassThreeSpring(1, 1, 1e14, 100, 0));
        var (low, high) = ClosedForm(1, 1, 1e14, 100, 0);
        Assert.Equal(0, result.RigidBodyModeCount);
        Assert.All(result.Modes, m => Assert.False(m.IsRigidBody));
        NumericAssert.Close(low, result.Modes[0].EigenValue, Tolerance.Rel(1e-10), "ω1²");
        NumericAssert.Close(high, result.Modes[1].EigenValue, Tolerance.Rel(1e-10), "ω2²");
        NumericAssert.Close(Math.Sqrt(low) / (2 * Math.PI), result.Modes[0].NaturalFrequencyHz, Tolerance.Rel(1e-10), "f1");
        Assert.True(double.IsFinite(result.Modes[0].PeriodSeconds));
    }

    [Fact]
    public void VanishinglySoftSpring_GivesTheDecoupledClosedForms_NotACrash()
    {
        // ground –2e6 N/m– m0 (100 kg) –1e-294 N/m– m1 (50 kg) –1e6 N/m– m2 (80 kg): found by the corruption guard
        // (a stiffness of 1e-300 kN/mm ended in an internal error). The soft spring decouples the parts, so the closed
        // forms are those of each part (common practice): m0 alone ω² = k0/m0 = 20,000; the pair ω² = k(1/m1 + 1/m2) =
        // 32,500; and a mode of the pair on the soft spring with ω² ≈ 1e-294/130, below any frequency worth printing.
        var network = new NetworkBuilder()
            .AddMass("m0", 100).AddMass("m1", 50).AddMass("m2", 80)
            .AddSpring("k0", Network.Ground, "m0", 2e6)
            .AddSpring("k1", "m0", "m1", 1e-294)
            .AddSpring("k2", "m1", "m2", 1e6)
            .Build();
        var result = ModalAnalysis.Solve(network);
        Assert.All(result.Modes, m => Assert.True(double.IsFinite(m.EigenValue) && m.EigenValue >= 0, $"mode {m.Number}: ω² = {m.EigenValue}"));
        Assert.True(result.Modes[0].EigenValue < 1e-200, $"ω1² = {result.Modes[0].EigenValue}");
        NumericAssert.Close(20_000, result.Modes[1].EigenValue, Tolerance.Rel(1e-10), "ω2² (m0 on k0)");
        NumericAssert.Close(32_500, result.Modes[2].EigenValue, Tolerance.Rel(1e-10), "ω3² (the pair on k2)");
    }

    [Theory]
    [InlineData(true)]
    [InlineData(false)]
    public void StiffSpringSweep_FrequenciesMatchTheClosedFormFrom1e2To1e16(bool stiffToGround)
    {
        // The stiff spring either holds m1 to ground (m2 hangs on 100 N/m) or joins m1 to m2 (the pair hangs on
        // 100 N/m). REFERENCES.md §1 closed form; tolerance 1e-8 relative on both ω², at every decade.
        for (var exponent = 2; exponent <= 16; exponent++)
        {
            var stiff = Math.Pow(10, exponent);
            var (k1, k2) = stiffToGround ? (stiff, 100.0) : (100.0, stiff);
            var result = ModalAnalysis.Solve(TestNetworks.TwoMassThreeSpring(1, 2, k1, k2, 0));
            var (low, high) = ClosedForm(1, 2, k1, k2, 0);
            Assert.Equal(0, result.RigidBodyModeCount);
            NumericAssert.Close(low, result.Modes[0].EigenValue, Tolerance.Rel(1e-8), $"ω1² at k = 1e{exponent}");
            NumericAssert.Close(high, result.Modes[1].EigenValue, Tolerance.Rel(1e-8), $"ω2² at k = 1e{exponent}");
            NumericAssert.Small(result.Quality.MaxOrthogonalityError, 1e-8, $"M-orthogonality at k = 1e{exponent}");
        }
    }

    [Fact]
    public void StiffSpringInsideAFreeGroup_KeepsExactlyOneRigidBodyModeAndTheFlexibleClosedForm()
    {
        // Free–free chain a –kA– b –kB– c. Its flexible ω² solve λ² − pλ + q = 0 with p = trace(M⁻¹K) =
        // kA/ma + (kA+kB)/mb + kB/mc and q = kA·kB·(ma+mb+mc)/(ma·mb·mc) (sum of the principal 2×2 minors; derived
        // here). One rigid-body mode, ι/√Σm (common practice). Tolerance 1e-8 relative.
        const double ma = 3, mb = 1, mc = 2, kA = 1e13, kB = 50;
        var network = new NetworkBuilder().AddMass("a", ma).AddMass("b", mb).AddMass("c", mc)
            .AddSpring("kA", "a", "b", kA).AddSpring("kB", "b", "c", kB).Build();
        var result = ModalAnalysis.Solve(network);
        var p = kA / ma + (kA + kB) / mb + kB / mc;
        var q = kA * kB * (ma + mb + mc) / (ma * mb * mc);
        var high = (p + Math.Sqrt(p * p - 4 * q)) / 2;
        Assert.Equal(1, result.RigidBodyModeCount);
        Assert.True(result.Modes[0].IsRigidBody);
        NumericAssert.Close(Enumerable.Repeat(1 / Math.Sqrt(6.0), 3).ToArray(), result.Modes[0].Shape, Tolerance.Rel(1e-14), "rigid shape");
        NumericAssert.Close(q / high, result.Modes[1].EigenValue, Tolerance.Rel(1e-8), "ω1² (flexible)");
        NumericAssert.Close(high, result.Modes[2].EigenValue, Tolerance.Rel(1e-8), "ω2² (flexible)");
    }

    [Fact]
    public void RigidBodyModeCount_IsTheNumberOfUnsupportedGroupsEvenWithTinyStiffnesses()
    {
        // A soft spring of 1e-6 N/m next to 1e8 N/m still holds its mass: the topology, not the eigenvalue size, decides.
        // ω² of the soft mass is 1e-6 (single-DOF k/m, common practice); tolerance 1e-8 relative.
        var network = new NetworkBuilder().AddMass("stiff", 1).AddMass("soft", 1).AddMass("loose", 5)
            .AddSpring("k1", Network.Ground, "stiff", 1e8).AddSpring("k2", Network.Ground, "soft", 1e-6).Build();
        var result = ModalAnalysis.Solve(network);
        Assert.Equal(1, result.RigidBodyModeCount);
        var rigid = Assert.Single(result.Modes, m => m.IsRigidBody);
        Assert.Equal(1.0, rigid.Shape[2] * Math.Sqrt(5), 14);
        var soft = result.Modes.Single(m => !m.IsRigidBody && m.Shape[1] > 0.5);
        NumericAssert.Close(1e-6, soft.EigenValue, Tolerance.Rel(1e-8), "ω² of the soft mass");
    }

    [Fact]
    public void StiffnessRatioAboveTheLimit_IsWarnedWithTheRatioAndTheSprings()
    {
        var result = ModalAnalysis.Solve(TestNetworks.TwoMassThreeSpring(1, 1, 1e14, 100, 0));
        var warning = Assert.Single(result.Warnings);
        Assert.Contains("1e+12", warning);
        Assert.Contains("'k1'", warning);
        Assert.Contains("'k2'", warning);
        Assert.Contains("links:", warning);
        Assert.Empty(ModalAnalysis.Solve(TestNetworks.TwoMassThreeSpring(1, 1, 1e6, 100, 0)).Warnings);
    }

    [Fact]
    public void StiffnessRatioBeyondTheDoubleRange_IsWarnedInWords_NeverAsInfinity()
    {
        // A subnormal stiffness (4.9e-318 N/m, found by the corruption guard) makes the ratio overflow.
        var result = ModalAnalysis.Solve(TestNetworks.TwoMassThreeSpring(1, 1, 1e8, 4.9e-318, 0));
        var warning = Assert.Single(result.Warnings, w => w.Contains("span a ratio", StringComparison.Ordinal));
        Assert.Contains("beyond 1e+308", warning, StringComparison.Ordinal);
        Assert.DoesNotContain("Infinity", warning, StringComparison.Ordinal);
        Assert.DoesNotContain("∞", warning, StringComparison.Ordinal);
    }

    [Fact]
    public void ManyMassesWithStiffAndSoftSprings_MatchTheirCondensedCounterpartOnSeededNetworks()
    {
        // A chain whose every other spring is 1e15 N/m behaves, to first order in k_soft/k_stiff, as the chain of the
        // pairs with summed masses (the stiff springs as rigid links; common practice). The low ω² must agree to
        // 1e-8 relative (the first-order term is about 1e-13 here); seeded masses.
        var random = new Random(12);
        const int pairs = 12;
        var masses = Enumerable.Range(0, 2 * pairs).Select(_ => 1 + 9 * random.NextDouble()).ToArray();
        var stiffNet = new NetworkBuilder();
        var condensed = new NetworkBuilder();
        for (var i = 0; i < 2 * pairs; i++) stiffNet.AddMass($"m{i}", masses[i]);
        for (var p = 0; p < pairs; p++)
        {
            condensed.AddMass($"p{p}", masses[2 * p] + masses[2 * p + 1]);
            stiffNet.AddSpring($"stiff{p}", $"m{2 * p}", $"m{2 * p + 1}", 1e15);
            stiffNet.AddSpring($"soft{p}", p == 0 ? Network.Ground : $"m{2 * p - 1}", $"m{2 * p}", 100 + p);
            condensed.AddSpring($"soft{p}", p == 0 ? Network.Ground : $"p{p - 1}", $"p{p}", 100 + p);
        }
        var full = ModalAnalysis.Solve(stiffNet.Build());
        var reference = ModalAnalysis.Solve(condensed.Build());
        for (var j = 0; j < pairs; j++)
            NumericAssert.Close(reference.Modes[j].EigenValue, full.Modes[j].EigenValue, Tolerance.Rel(1e-8), $"ω{j + 1}²");
        Assert.Equal(0, full.RigidBodyModeCount);
    }
}
