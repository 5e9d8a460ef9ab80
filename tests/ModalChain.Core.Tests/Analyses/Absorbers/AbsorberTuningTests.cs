using System.Collections.Immutable;
using ModalChain.Core.Analyses.Absorbers;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Absorbers;

public class AbsorberTuningTests
{
    private static Network Sdof(double m, double k) =>
        new NetworkBuilder().AddMass("floor", m).AddSpring("legs", Network.Ground, "floor", k).Build();

    // REFERENCES §1 case A: m1 = 10, m2 = 1, k1 = 30, k2 = 5 (Rao, 5th ed., Ex. 5.3 [from memory]).
    private static Network CaseA() => new NetworkBuilder().AddMass("m1", 10).AddMass("m2", 1)
        .AddSpring("k1", Network.Ground, "m1", 30).AddSpring("k2", "m1", "m2", 5).Build();

    private static AbsorberRequest Request(string host, double mu, int? mode = null, params double[] excitations) =>
        new(host, mu, mode, [.. excitations]);

    [Fact]
    public void SingleMassPrimary_ModalMassIsThePhysicalMass()
    {
        // For one mass, φ = 1/√m after mass normalisation, so 1/φ² = m exactly (definition of the mass-normalised shape).
        var modal = ModalAnalysis.Solve(Sdof(2400, 6.0e7));
        var design = AbsorberTuning.Design(modal, Request("floor", 0.05, mode: 1));
        NumericAssert.Close(2400, design.ModalMass, Tolerance.Rel(1e-13), "modal mass");
    }

    [Fact]
    public void TwoMassPrimary_ModalMassIsOneOverPhiSquared()
    {
        // Case A: ω² from the frequency equation m1 m2 ω⁴ − [m1(k2+k3) + m2(k1+k2)]ω² + (k1+k2)(k2+k3) − k2² = 0
        // (REFERENCES §1), mode ratio r = X2/X1 = (k1 + k2 − m1ω²)/k2; mass-normalised φ1 = 1/√(m1 + m2 r²),
        // φ2 = r φ1. Modal mass at m1 is m1 + m2 r², at m2 (m1 + m2 r²)/r². Tolerance 1e-10 relative.
        const double m1 = 10, m2 = 1, k1 = 30, k2 = 5;
        var b = -(m1 * k2 + m2 * (k1 + k2));
        var c = (k1 + k2) * k2 - k2 * k2;
        var disc = Math.Sqrt(b * b - 4 * m1 * m2 * c);
        var modal = ModalAnalysis.Solve(CaseA());
        foreach (var (number, w2) in new[] { (1, (-b - disc) / (2 * m1 * m2)), (2, (-b + disc) / (2 * m1 * m2)) })
        {
            var r = (k1 + k2 - m1 * w2) / k2;
            var generalised = m1 + m2 * r * r;
            var atM1 = AbsorberTuning.Design(modal, Request("m1", 0.05, mode: number));
            var atM2 = AbsorberTuning.Design(modal, Request("m2", 0.05, mode: number));
            NumericAssert.Close(generalised, atM1.ModalMass, Tolerance.Rel(1e-10), $"mode {number} at m1");
            NumericAssert.Close(generalised / (r * r), atM2.ModalMass, Tolerance.Rel(1e-10), $"mode {number} at m2");
            NumericAssert.Close(1 / Math.Pow(modal.Modes[number - 1].Shape[0], 2), atM1.ModalMass, Tolerance.Rel(1e-14), "1/φ²");
        }
    }

    [Fact]
    public void DenHartogDesign_GivesTheIssuedMassStiffnessAndDamping()
    {
        // m_a = μM, ω_a = ω_p/(1+μ), c_a = 2 m_a ω_p √(3μ/(8(1+μ)³)) (Den Hartog 1956 §3.3), ζ_a = c_a/(2√(k_a m_a)).
        const double bigM = 2400, k = 6.0e7, mu = 0.05;
        var wp = Math.Sqrt(k / bigM);
        var d = AbsorberTuning.Design(ModalAnalysis.Solve(Sdof(bigM, k)), Request("floor", mu, mode: 1));
        NumericAssert.Close(mu * bigM, d.Mass, Tolerance.Rel(1e-13), "m_a");
        NumericAssert.Close(d.Mass * Math.Pow(wp / (1 + mu), 2), d.Stiffness, Tolerance.Rel(1e-12), "k_a");
        NumericAssert.Close(2 * d.Mass * wp * Math.Sqrt(3 * mu / (8 * Math.Pow(1 + mu, 3))), d.Damping, Tolerance.Rel(1e-12), "c_a");
        NumericAssert.Close(0.133631, d.DampingRatio, Tolerance.Abs(5e-7), "ζ_a (absorber-referenced), REFERENCES §3");
        NumericAssert.Close(0.127267, d.DampingRatioPrimaryReferenced, Tolerance.Abs(5e-7), "ζ primary-referenced, REFERENCES §3");
        NumericAssert.Close(wp / (1 + mu) / (2 * Math.PI), d.FrequencyHz, Tolerance.Rel(1e-12), "tuned frequency");
    }

    [Fact]
    public void AttachedToSingleMassPrimary_ReproducesTheTwoMassReference()
    {
        // The attached network has the 2-DOF absorber's modes: compare its frequencies with the undamped
        // 2-DOF frequency equation (REFERENCES §1 with k3 = 0), to 1e-10 relative.
        const double bigM = 2400, k = 6.0e7;
        var net = Sdof(bigM, k);
        var d = AbsorberTuning.Design(ModalAnalysis.Solve(net), Request("floor", 0.1, mode: 1));
        var attached = AbsorberTuning.Attach(net, d, AbsorberTuning.FreeNames(net, "floor"));
        Assert.Equal(["floor", "floor-absorber"], attached.Masses.Select(m => m.Name));
        Assert.Equal(net.Masses[0], attached.Masses[0]);
        var modal = ModalAnalysis.Solve(attached);
        double m1 = bigM, m2 = d.Mass, k1 = k, k2 = d.Stiffness;
        var b = -(m1 * k2 + m2 * (k1 + k2));
        var c = (k1 + k2) * k2 - k2 * k2;
        var disc = Math.Sqrt(b * b - 4 * m1 * m2 * c);
        NumericAssert.Close((-b - disc) / (2 * m1 * m2), modal.Modes[0].EigenValue, Tolerance.Rel(1e-10), "ω1²");
        NumericAssert.Close((-b + disc) / (2 * m1 * m2), modal.Modes[1].EigenValue, Tolerance.Rel(1e-10), "ω2²");
        Assert.Single(attached.Dampers);
        NumericAssert.Close(d.Damping, attached.Dampers[0].Coefficient, Tolerance.Rel(0));
    }

    [Fact]
    public void WithoutModeNumber_TheModeNearestTheExcitationIsChosen()
    {
        // Case A: ω = 1.581139 and 2.449490 rad/s (REFERENCES §1) = 0.2516 and 0.3898 Hz.
        var modal = ModalAnalysis.Solve(CaseA());
        Assert.Equal(1, AbsorberTuning.Design(modal, Request("m1", 0.05, null, 0.26)).ModeNumber);
        Assert.Equal(2, AbsorberTuning.Design(modal, Request("m1", 0.05, null, 0.05, 0.37)).ModeNumber);
        Assert.Contains("0.37 Hz", AbsorberTuning.Design(modal, Request("m1", 0.05, null, 0.37)).ChosenBy);
    }

    [Fact]
    public void Retuned_KeepsMassAndDampingRatio()
    {
        var d = AbsorberTuning.Design(ModalAnalysis.Solve(Sdof(1000, 1e6)), Request("floor", 0.05, mode: 1));
        var r = d.Retuned(d.FrequencyHz * 1.1, d.DampingRatio);
        NumericAssert.Close(d.FrequencyHz * 1.1, Math.Sqrt(r.Stiffness / r.Mass) / (2 * Math.PI), Tolerance.Rel(1e-13), "new frequency");
        NumericAssert.Close(d.DampingRatio, r.DampingRatio, Tolerance.Rel(1e-13), "ζ_a kept");
        Assert.Equal(d.Mass, r.Mass);
    }

    [Theory]
    [InlineData("roof", 0.05, null, "not a mass")]
    [InlineData("ground", 0.05, null, "is a support")]
    [InlineData("m1", 0.0, null, "must be positive")]
    [InlineData("m1", -0.05, null, "must be positive")]
    [InlineData("m1", 5.0, null, "not a tuned absorber")]
    [InlineData("m1", 0.05, 3, "mode 3 does not exist")]
    [InlineData("m1", 0.05, 0, "mode 0 does not exist")]
    public void BadRequests_AreReportedAsProblems(string host, double mu, int? mode, string expected)
    {
        var modal = ModalAnalysis.Solve(CaseA());
        var problems = AbsorberTuning.Problems(modal, new AbsorberRequest(host, mu, mode ?? 1, []));
        Assert.Contains(problems, p => p.Contains(expected, StringComparison.Ordinal));
        Assert.Throws<ArgumentException>(() => AbsorberTuning.Design(modal, new AbsorberRequest(host, mu, mode ?? 1, [])));
    }

    [Fact]
    public void NoModeAndNoSpeed_ChoosesTheModeWithTheLargestMotionAtTheHost()
    {
        // With no running speed the mode contributing most to the host's static deflection, φ_h²/ω², is chosen; for the
        // single-mass model that is its only mode, and nobody is asked for --mode.
        var single = new NetworkBuilder().AddMass("deck", 100).AddSpring("s", Network.Ground, "deck", 1e5).Build();
        var request = new AbsorberRequest("deck", 0.05, null, ImmutableArray<double>.Empty);
        var modal = ModalAnalysis.Solve(single);
        Assert.Empty(AbsorberTuning.Problems(modal, request));
        var design = AbsorberTuning.Design(modal, request);
        Assert.Equal(1, design.ModeNumber);
        Assert.Contains("largest motion at the host", design.ChosenBy, StringComparison.Ordinal);

        var two = ModalAnalysis.Solve(CaseA());
        var expected = two.Modes.Where(m => !m.IsRigidBody).MaxBy(m => m.Shape[0] * m.Shape[0] / (m.AngularFrequency * m.AngularFrequency))!.Number;
        Assert.Equal(expected, AbsorberTuning.Design(two, new AbsorberRequest("m1", 0.05, null, ImmutableArray<double>.Empty)).ModeNumber);
    }

    [Fact]
    public void HostAtANodeOfTheMode_IsRejected()
    {
        // Symmetric three-mass chain fixed at both ends: the middle mass does not move in mode 2 (REFERENCES §2, φ_2(2) = sin(π) = 0).
        var net = new NetworkBuilder().AddMass("a", 1).AddMass("b", 1).AddMass("c", 1)
            .AddSpring("s1", Network.Ground, "a", 100).AddSpring("s2", "a", "b", 100).AddSpring("s3", "b", "c", 100).AddSpring("s4", "c", Network.Ground, 100).Build();
        var problems = AbsorberTuning.Problems(ModalAnalysis.Solve(net), new AbsorberRequest("b", 0.05, 2, []));
        Assert.Contains(problems, p => p.Contains("node of the mode", StringComparison.Ordinal));
    }

    [Fact]
    public void FreeNames_AvoidExistingElements()
    {
        var net = new NetworkBuilder().AddMass("floor", 100).AddMass("floor-absorber", 5)
            .AddSpring("legs", Network.Ground, "floor", 1e5).AddSpring("x", "floor", "floor-absorber", 1e3).Build();
        var names = AbsorberTuning.FreeNames(net, "floor");
        Assert.Equal(new AbsorberNames("floor-absorber-2", "floor-absorber-2-spring", "floor-absorber-2-damper"), names);
    }
}
