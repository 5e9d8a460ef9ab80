using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Modal;

/// <summary>
/// The two-mass, three-spring system (m1–k1–ground, k2 between, k3 from m2 to ground) against its closed-form frequency
/// equation m1·m2·ω⁴ − [m1(k2+k3) + m2(k1+k2)]ω² + (k1+k2)(k2+k3) − k2² = 0 and mode ratio X2/X1 = (k1 + k2 − m1ω²)/k2.
/// </summary>
public class TwoMassClosedFormTests
{
    private static Network TwoMassThreeSpring(double m1, double m2, double k1, double k2, double k3) =>
        TestNetworks.TwoMassThreeSpring(m1, m2, k1, k2, k3);

    /// <summary>Roots ω1² ≤ ω2² of the frequency equation, in rad²/s², computed without cancellation.</summary>
    private static (double Low, double High) FrequencyEquationRoots(double m1, double m2, double k1, double k2, double k3)
    {
        var a = m1 * m2;
        var b = m1 * (k2 + k3) + m2 * (k1 + k2);
        var c = (k1 + k2) * (k2 + k3) - k2 * k2;
        var high = (b + Math.Sqrt(b * b - 4 * a * c)) / (2 * a);
        return (c / (a * high), high);
    }

    private static double FrequencyEquation(double m1, double m2, double k1, double k2, double k3, double omega2) =>
        m1 * m2 * omega2 * omega2 - (m1 * (k2 + k3) + m2 * (k1 + k2)) * omega2 + (k1 + k2) * (k2 + k3) - k2 * k2;

    [Fact]
    public void SymmetricTwoMassThreeSpring_MatchesClosedForm()
    {
        // m1 = m2 = m, k1 = k2 = k3 = k: ω1 = √(k/m), ω2 = √(3k/m), X2/X1 = +1 and −1.
        // Source: REFERENCES.md §1 case D, any vibration textbook, e.g. Thomson & Dahleh, Theory of Vibration with
        // Applications, 5th ed., ch. 5 [common practice; values recomputed].
        const double m = 12.5, k = 4.0e4;
        var result = ModalAnalysis.Solve(TwoMassThreeSpring(m, m, k, k, k));
        NumericAssert.Close(Math.Sqrt(k / m), result.Modes[0].AngularFrequency, Tolerance.Rel(1e-12), "ω1");
        NumericAssert.Close(Math.Sqrt(3 * k / m), result.Modes[1].AngularFrequency, Tolerance.Rel(1e-12), "ω2");
        NumericAssert.Close(1.0, result.Modes[0].Shape[1] / result.Modes[0].Shape[0], Tolerance.Abs(1e-12), "mode 1 ratio");
        NumericAssert.Close(-1.0, result.Modes[1].Shape[1] / result.Modes[1].Shape[0], Tolerance.Abs(1e-12), "mode 2 ratio");
    }

    // Inputs in kg and N/m: textbook numbers, a deck carrying a skid, light-on-heavy, heavy-on-light, weak coupling,
    // a first mass held only through the second (k1 = 0), and several cases with k3 = 0 (no spring from m2 to ground).
    [Theory]
    [InlineData(10.0, 1.0, 30.0, 5.0, 0.0)]
    [InlineData(3200.0, 850.0, 95e6, 8.4e6, 0.0)]
    [InlineData(2.5, 7.5, 1.0e4, 3.0e4, 2.0e4)]
    [InlineData(1.0, 1000.0, 1.0e5, 1.0e3, 5.0e4)]
    [InlineData(1000.0, 1.0, 2.0e6, 40.0, 0.0)]
    [InlineData(40.0, 40.0, 1.0e5, 1.0e2, 1.0e5)]
    [InlineData(0.5, 2.0, 0.0, 100.0, 300.0)]
    [InlineData(123.4, 56.7, 8.9e5, 1.2e5, 3.4e5)]
    public void TwoMassThreeSpring_MatchesClosedFormFrequencyEquation(double m1, double m2, double k1, double k2, double k3)
    {
        // Frequency equation and mode ratio of the two-mass, three-spring system: REFERENCES.md §1; e.g. Rao,
        // Mechanical Vibrations, 5th ed., §5.3 (values recomputed; attribution from memory).
        var result = ModalAnalysis.Solve(TwoMassThreeSpring(m1, m2, k1, k2, k3));
        var (low, high) = FrequencyEquationRoots(m1, m2, k1, k2, k3);

        Assert.Equal(2, result.Modes.Length);
        NumericAssert.Close(low, result.Modes[0].EigenValue, Tolerance.Rel(1e-10), "ω1²");
        NumericAssert.Close(high, result.Modes[1].EigenValue, Tolerance.Rel(1e-10), "ω2²");
        foreach (var mode in result.Modes)
        {
            // The computed ω² satisfies the frequency equation to round-off of its largest term.
            var w2 = mode.EigenValue;
            var size = m1 * m2 * w2 * w2 + (m1 * (k2 + k3) + m2 * (k1 + k2)) * w2 + (k1 + k2) * (k2 + k3);
            NumericAssert.Small(FrequencyEquation(m1, m2, k1, k2, k3, w2) / size, 1e-12, $"frequency equation at mode {mode.Number}");

            var ratio = mode.Shape[1] / mode.Shape[0];
            // The printed form uses the first row of (K − ω²M)X = 0; the second row gives X2/X1 = k2/(k2 + k3 − m2ω²).
            // Each loses digits to cancellation when its mass dominates the mode (here up to a factor ~1e6, e.g.
            // m1 = 1000 in mode 2), so the printed form is held to 1e-9 and the better-conditioned row to
            // 1e-12 × (1 + its condition number m·ω²/|k − m·ω²|).
            var fromRow1 = (k1 + k2 - m1 * w2) / k2;
            var fromRow2 = k2 / (k2 + k3 - m2 * w2);
            var cond1 = m1 * w2 / Math.Abs(k1 + k2 - m1 * w2);
            var cond2 = m2 * w2 / Math.Abs(k2 + k3 - m2 * w2);
            NumericAssert.Close(fromRow1, ratio, new Tolerance(1e-9, 1e-9), $"X2/X1 of mode {mode.Number}, printed form");
            NumericAssert.Close(cond1 <= cond2 ? fromRow1 : fromRow2, ratio, Tolerance.Rel(1e-12 * (1 + Math.Min(cond1, cond2))),
                $"X2/X1 of mode {mode.Number}, better-conditioned row");
        }
    }

    [Fact]
    public void PublishedExampleA_MatchesPrintedFrequenciesAndModeRatios()
    {
        // m1 = 10, m2 = 1, k1 = 30, k2 = 5, k3 = 0: ω = 1.581139, 2.449490 rad/s, X2/X1 = 2 and −5.
        // Source: REFERENCES.md §1 case A, Rao, Mechanical Vibrations, 5th ed., Ex. 5.3 (values recomputed; attribution
        // from memory). Printed to 6 decimals: tolerance 1e-6 absolute.
        var result = ModalAnalysis.Solve(TwoMassThreeSpring(10, 1, 30, 5, 0));
        NumericAssert.Close(1.581139, result.Modes[0].AngularFrequency, Tolerance.Abs(1e-6), "ω1");
        NumericAssert.Close(2.449490, result.Modes[1].AngularFrequency, Tolerance.Abs(1e-6), "ω2");
        NumericAssert.Close(2.0, result.Modes[0].Shape[1] / result.Modes[0].Shape[0], Tolerance.Abs(1e-10), "X2/X1 mode 1");
        NumericAssert.Close(-5.0, result.Modes[1].Shape[1] / result.Modes[1].Shape[0], Tolerance.Abs(1e-10), "X2/X1 mode 2");
    }

    [Fact]
    public void PublishedExampleB_MatchesPrintedFrequenciesAndModeRatios()
    {
        // m1 = 9, m2 = 1, k1 = 24, k2 = 3, k3 = 0: ω = 1.414214, 2.000000 rad/s, X2/X1 = 3 and −3.
        // Source: REFERENCES.md §1 case B, Inman, Engineering Vibration, ch. 4 examples (values recomputed;
        // attribution from memory). Printed to 6 decimals: tolerance 1e-6 absolute.
        var result = ModalAnalysis.Solve(TwoMassThreeSpring(9, 1, 24, 3, 0));
        NumericAssert.Close(1.414214, result.Modes[0].AngularFrequency, Tolerance.Abs(1e-6), "ω1");
        NumericAssert.Close(2.000000, result.Modes[1].AngularFrequency, Tolerance.Abs(1e-6), "ω2");
        NumericAssert.Close(3.0, result.Modes[0].Shape[1] / result.Modes[0].Shape[0], Tolerance.Abs(1e-10), "X2/X1 mode 1");
        NumericAssert.Close(-3.0, result.Modes[1].Shape[1] / result.Modes[1].Shape[0], Tolerance.Abs(1e-10), "X2/X1 mode 2");
    }

    [Fact]
    public void PublishedExampleC_MatchesPrintedFrequenciesAndModeRatios()
    {
        // m1 = m, m2 = 2m, k1 = k2 = k3 = k: ω = 0.796225 and 1.538189 × √(k/m), X1/X2 = 0.732051 and −2.732051.
        // Source: REFERENCES.md §1 case C, Thomson & Dahleh, Theory of Vibration with Applications, 5th ed. (values
        // recomputed; attribution from memory). Printed to 6 decimals: tolerance 1e-6 on the dimensionless numbers.
        const double m = 250, k = 4.0e5;
        var unit = Math.Sqrt(k / m);
        var result = ModalAnalysis.Solve(TwoMassThreeSpring(m, 2 * m, k, k, k));
        NumericAssert.Close(0.796225, result.Modes[0].AngularFrequency / unit, Tolerance.Abs(1e-6), "ω1/√(k/m)");
        NumericAssert.Close(1.538189, result.Modes[1].AngularFrequency / unit, Tolerance.Abs(1e-6), "ω2/√(k/m)");
        NumericAssert.Close(0.732051, result.Modes[0].Shape[0] / result.Modes[0].Shape[1], Tolerance.Abs(1e-6), "X1/X2 mode 1");
        NumericAssert.Close(-2.732051, result.Modes[1].Shape[0] / result.Modes[1].Shape[1], Tolerance.Abs(1e-6), "X1/X2 mode 2");
    }

    [Fact]
    public void PublishedExampleE_TwoStoreyShearFrame_MatchesPrintedFrequenciesAndShapes()
    {
        // m1 = 2m, m2 = m, k1 = 2k, k2 = k, k3 = 0: ω = 0.707107 and 1.414214 × √(k/m), φ1 = {½, 1}, φ2 = {−1, 1}.
        // Source: REFERENCES.md §1 case E, Chopra, Dynamics of Structures, ch. 10 (values recomputed; attribution from
        // memory). Printed to 6 decimals: tolerance 1e-6 on ω/√(k/m); the shape ratios are exact fractions.
        const double m = 1.8e4, k = 2.2e7;
        var unit = Math.Sqrt(k / m);
        var result = ModalAnalysis.Solve(TwoMassThreeSpring(2 * m, m, 2 * k, k, 0));
        NumericAssert.Close(0.707107, result.Modes[0].AngularFrequency / unit, Tolerance.Abs(1e-6), "ω1/√(k/m)");
        NumericAssert.Close(1.414214, result.Modes[1].AngularFrequency / unit, Tolerance.Abs(1e-6), "ω2/√(k/m)");
        NumericAssert.Close(0.5, result.Modes[0].Shape[0] / result.Modes[0].Shape[1], Tolerance.Abs(1e-10), "φ1 storey 1 / roof");
        NumericAssert.Close(-1.0, result.Modes[1].Shape[0] / result.Modes[1].Shape[1], Tolerance.Abs(1e-10), "φ2 storey 1 / roof");
    }

    [Fact]
    public void PublishedExampleE_EffectiveModalMasses_MatchListedValues()
    {
        // m = 1: M*1 = 2.666667 (88.89 %), M*2 = 0.333333 of the total 3. Source: REFERENCES.md §1 (case E, Chopra,
        // Dynamics of Structures, ch. 10 and §13.2; values recomputed; attribution from memory). Tolerance 1e-6 kg.
        var result = ModalAnalysis.Solve(TwoMassThreeSpring(2, 1, 2, 1, 0));
        NumericAssert.Close(2.666667, result.Modes[0].EffectiveModalMass, Tolerance.Abs(1e-6), "M*1");
        NumericAssert.Close(0.333333, result.Modes[1].EffectiveModalMass, Tolerance.Abs(1e-6), "M*2");
        NumericAssert.Close(0.8889, result.Modes[0].EffectiveMassFraction, Tolerance.Abs(5e-5), "M*1 fraction");
        NumericAssert.Close(1.0, result.Modes[1].CumulativeEffectiveMassFraction, Tolerance.Abs(1e-12), "cumulative after mode 2");
    }

    [Fact]
    public void PublishedExampleB_EffectiveModalMasses_MatchListedValues()
    {
        // M*1 = 8 kg (80 %), M*2 = 2 kg (20 %). Source: REFERENCES.md §1 (case B; values recomputed; attribution from
        // memory). Exact values: tolerance 1e-10 relative.
        var result = ModalAnalysis.Solve(TwoMassThreeSpring(9, 1, 24, 3, 0));
        NumericAssert.Close(8.0, result.Modes[0].EffectiveModalMass, Tolerance.Rel(1e-10), "M*1");
        NumericAssert.Close(2.0, result.Modes[1].EffectiveModalMass, Tolerance.Rel(1e-10), "M*2");
        NumericAssert.Close(0.8, result.Modes[0].EffectiveMassFraction, Tolerance.Rel(1e-10), "M*1 fraction");
        NumericAssert.Close(0.2, result.Modes[1].EffectiveMassFraction, Tolerance.Rel(1e-10), "M*2 fraction");
    }

    [Fact]
    public void PublishedExampleA_EffectiveModalMasses_MatchListedValues()
    {
        // M*1 = 10.285714 kg (= 72/7), M*2 = 0.714286 kg (= 5/7). Source: REFERENCES.md §1 (case A; values recomputed;
        // attribution from memory). Printed to 6 decimals: tolerance 1e-6 kg.
        var result = ModalAnalysis.Solve(TwoMassThreeSpring(10, 1, 30, 5, 0));
        NumericAssert.Close(10.285714, result.Modes[0].EffectiveModalMass, Tolerance.Abs(1e-6), "M*1");
        NumericAssert.Close(0.714286, result.Modes[1].EffectiveModalMass, Tolerance.Abs(1e-6), "M*2");
        NumericAssert.Close(11.0, result.TotalMass, Tolerance.Rel(1e-15), "total mass");
    }

    [Fact]
    public void PublishedExampleA_FreeResponseModalCoefficients_MatchListedValues()
    {
        // From x(0) = {1, 0}, ẋ(0) = 0: x1(t) = (5/7) cos 1.5811t + (2/7) cos 2.4495t. Source: REFERENCES.md §1 (case A,
        // Rao, Mechanical Vibrations, 5th ed., Ex. 5.3; values recomputed; attribution from memory). By modal
        // superposition with mass-normalised shapes x(t) = Σ φ_j (φ_jᵀ M x0) cos ω_j t, so the coefficient of mode j in
        // x1 is φ_j[0]² m1 (common practice). Exact fractions: tolerance 1e-12.
        const double m1 = 10;
        var result = ModalAnalysis.Solve(TwoMassThreeSpring(m1, 1, 30, 5, 0));
        NumericAssert.Close(5.0 / 7, result.Modes[0].Shape[0] * result.Modes[0].Shape[0] * m1, Tolerance.Abs(1e-12), "mode 1 coefficient");
        NumericAssert.Close(2.0 / 7, result.Modes[1].Shape[0] * result.Modes[1].Shape[0] * m1, Tolerance.Abs(1e-12), "mode 2 coefficient");
        NumericAssert.Close(1.5811, result.Modes[0].AngularFrequency, Tolerance.Abs(5e-5), "ω1 as printed");
        NumericAssert.Close(2.4495, result.Modes[1].AngularFrequency, Tolerance.Abs(5e-5), "ω2 as printed");
    }
}
