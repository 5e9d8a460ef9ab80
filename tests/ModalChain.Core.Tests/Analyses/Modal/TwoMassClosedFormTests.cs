using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Modal;

public class TwoMassClosedFormTests
{
    private static Network TwoMassThreeSpring(double m1, double m2, double k1, double k2, double k3)
    {
        var b = new NetworkBuilder().AddMass("m1", m1).AddMass("m2", m2)
            .AddSpring("k1", Network.Ground, "m1", k1).AddSpring("k2", "m1", "m2", k2);
        if (k3 > 0) b.AddSpring("k3", "m2", Network.Ground, k3);
        return b.Build();
    }

    [Fact]
    public void SymmetricTwoMassThreeSpring_MatchesClosedForm()
    {
        // m1 = m2 = m, k1 = k2 = k3 = k: ω1 = √(k/m), ω2 = √(3k/m), X2/X1 = +1 and −1.
        // Source: any standard vibration textbook, e.g. Thomson & Dahleh, Theory of Vibration with Applications,
        // 5th ed., ch. 5 (common practice; values recomputed).
        const double m = 12.5, k = 4.0e4;
        var result = ModalAnalysis.Solve(TwoMassThreeSpring(m, m, k, k, k));
        NumericAssert.Close(Math.Sqrt(k / m), result.Modes[0].AngularFrequency, Tolerance.Rel(1e-12), "ω1");
        NumericAssert.Close(Math.Sqrt(3 * k / m), result.Modes[1].AngularFrequency, Tolerance.Rel(1e-12), "ω2");
        NumericAssert.Close(1.0, result.Modes[0].Shape[1] / result.Modes[0].Shape[0], Tolerance.Abs(1e-12), "mode 1 ratio");
        NumericAssert.Close(-1.0, result.Modes[1].Shape[1] / result.Modes[1].Shape[0], Tolerance.Abs(1e-12), "mode 2 ratio");
    }
}
