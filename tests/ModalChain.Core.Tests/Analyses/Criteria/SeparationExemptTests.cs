using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Criteria;

/// <summary>Absorber modes exempted from the separation rule by the absorber's name.</summary>
public class SeparationExemptTests
{
    /// <summary>A host of 1000 kg on a spring tuned to <paramref name="hostHz"/>, with an absorber of mass ratio μ tuned to ratio <paramref name="tuning"/> of it.</summary>
    private static Network HostWithAbsorber(double hostHz, double mu, double tuning)
    {
        const double mp = 1000;
        var kp = mp * Math.Pow(2 * Math.PI * hostHz, 2);
        var ma = mu * mp;
        var ka = ma * Math.Pow(2 * Math.PI * hostHz * tuning, 2);
        var b = new NetworkBuilder { Title = "host and absorber" };
        b.AddMass("host", mp);
        b.AddMass("absorber", ma);
        b.AddSpring("host-spring", Network.Ground, "host", kp);
        b.AddSpring("absorber-spring", "host", "absorber", ka);
        return b.Build();
    }

    [Fact]
    public void AbsorberShare_InA3dModelWhoseMassesMoveInZ_IsTheLineModelsShare()
    {
        // The same host and absorber as a 3d model moving in z only has the same modes (identity of the two
        // formulations), so the absorber's share must match the closed form as in the line model.
        const double mu = 0.05, tuning = 1 / (1 + mu);
        var line = HostWithAbsorber(10, mu, tuning);
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        foreach (var m in line.Masses) b.AddMass(new Mass(m.Name, m.Kilograms) { Location = new Point3(0, 0, m.Name == "host" ? 0 : 1), Moves = [Direction.Z] });
        foreach (var s in line.Springs) b.AddSpring(new Spring(s.Name, s.NodeA, s.NodeB, s.Stiffness) { Components = [new(Direction.Z, s.Stiffness)] });
        var modal = ModalAnalysis.Solve(b.Build());
        var shares = SeparationCheck.ExemptShares(modal, ["absorber"])!.Value;
        var wa = 2 * Math.PI * 10 * tuning;
        for (var j = 0; j < 2; j++)
        {
            var r = 1 / (1 - Math.Pow(modal.Modes[j].AngularFrequency / wa, 2));
            NumericAssert.Close(mu * r * r / (1 + mu * r * r), shares[j], Tolerance.Rel(1e-9), $"absorber share of mode {j + 1}");
        }
    }

    [Theory]
    [InlineData(0.01)]
    [InlineData(0.05)]
    [InlineData(0.10)]
    [InlineData(0.20)]
    public void AbsorberShare_MatchesTheTwoMassClosedForm(double mu)
    {
        // Undamped two-mass system: in a mode at ω the absorber moves r = x_a/x_p = 1/(1 − ω²/ω_a²) times the host, so it
        // carries μr²/(1 + μr²) of the kinetic energy (the eigenvector of the 2×2 problem, by hand; closed form).
        var tuning = 1 / (1 + mu); // the classical fixed-point tuning (Den Hartog, Mechanical Vibrations, §3.3)
        var modal = ModalAnalysis.Solve(HostWithAbsorber(10, mu, tuning));
        var shares = SeparationCheck.ExemptShares(modal, ["absorber"])!.Value;
        var wa = 2 * Math.PI * 10 * tuning;
        for (var j = 0; j < 2; j++)
        {
            var r = 1 / (1 - Math.Pow(modal.Modes[j].AngularFrequency / wa, 2));
            NumericAssert.Close(mu * r * r / (1 + mu * r * r), shares[j], Tolerance.Rel(1e-9), $"absorber share of mode {j + 1}");
        }
    }

    [Theory]
    [InlineData(0.01)]
    [InlineData(0.05)]
    [InlineData(0.20)]
    public void BothModesOfAClassicallyTunedAbsorber_AreExempt_AndTheCheckPasses(double mu)
    {
        // The running speed is the host's frequency: both split modes lie within ±20 % of it for these mass ratios,
        // so without the exemption the rule fails (as it should for a structure without an absorber).
        var network = HostWithAbsorber(10, mu, 1 / (1 + mu));
        var modal = ModalAnalysis.Solve(network);
        var rule = new SeparationCriterion(0.2, [10.0], [1.0]);
        var frequencies = modal.Modes.Select(m => m.NaturalFrequencyHz).ToArray();
        Assert.False(SeparationCheck.Evaluate(frequencies, rule).Passes);

        var exempt = rule with { Exempt = ["absorber"] };
        var result = SeparationCheck.Evaluate(frequencies, exempt, SeparationCheck.ExemptShares(modal, exempt.Exempt));
        Assert.Equal([1, 2], result.Exempted.Select(x => x.ModeNumber));
        Assert.Empty(result.Pairs);
        Assert.True(result.Passes);
        Assert.Equal(double.PositiveInfinity, SeparationCheck.GoverningReserve(frequencies, exempt, SeparationCheck.ExemptShares(modal, exempt.Exempt)));
        Assert.All(result.Exempted, x => Assert.Contains("'absorber' carries", x.Reason, StringComparison.Ordinal));
    }

    [Fact]
    public void AStructuralModeAwayFromTheAbsorber_IsStillChecked()
    {
        // A two-storey chain (10 Hz-ish and higher) with a 2 % absorber tuned to the first mode: the second mode moves
        // the absorber with its host, a share near its mass fraction, far below the 20 % rule.
        var b = new NetworkBuilder { Title = "two storeys and an absorber" };
        b.AddMass("floor-1", 1000);
        b.AddMass("floor-2", 1000);
        b.AddMass("absorber", 20);
        b.AddSpring("storey-1", Network.Ground, "floor-1", 8e6);
        b.AddSpring("storey-2", "floor-1", "floor-2", 8e6);
        var first = ModalAnalysis.Solve(b.Build()).Modes[0].AngularFrequency;
        b.AddSpring("absorber-spring", "floor-2", "absorber", 20 * Math.Pow(first / 1.02, 2));
        var modal = ModalAnalysis.Solve(b.Build());
        var shares = SeparationCheck.ExemptShares(modal, ["absorber"])!.Value;
        Assert.True(shares[2] < 0.05, $"share of the highest mode {shares[2]}");
        var rule = new SeparationCriterion(0.2, [modal.Modes[2].NaturalFrequencyHz], [1.0]) { Exempt = ["absorber"] };
        var result = SeparationCheck.Evaluate([.. modal.Modes.Select(m => m.NaturalFrequencyHz)], rule, shares);
        Assert.DoesNotContain(result.Exempted, x => x.ModeNumber == 3);
        Assert.False(result.Passes); // mode 3 sits on the running speed and is checked
    }

    [Fact]
    public void NoExemptMasses_ChecksEveryMode()
    {
        var modal = ModalAnalysis.Solve(HostWithAbsorber(10, 0.05, 1 / 1.05));
        Assert.Null(SeparationCheck.ExemptShares(modal, []));
        var result = SeparationCheck.Evaluate([.. modal.Modes.Select(m => m.NaturalFrequencyHz)], new SeparationCriterion(0.2, [10.0], [1.0]), null);
        Assert.Empty(result.Exempted);
        Assert.Equal(2, result.Pairs.Length);
    }
}
