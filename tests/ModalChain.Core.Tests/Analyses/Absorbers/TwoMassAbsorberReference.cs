using System.Numerics;

namespace ModalChain.Core.Tests.Analyses.Absorbers;

/// <summary>
/// Independent reference for the absorber tests: the closed-form steady-state response of an undamped primary (M, k)
/// carrying an absorber (m, k_a, c_a), from the two equations of motion solved by Cramer's rule. It is written here,
/// in the tests, from the textbook equations (Den Hartog, Mechanical Vibrations, 4th ed., §3.3), not taken from src.
/// </summary>
internal static class TwoMassAbsorberReference
{
    /// <summary>Complex (X1, X2) for a unit force on the primary at ω, optionally with base acceleration instead.</summary>
    /// <remarks>
    /// Force on the primary: (k + k_a − Mω² + iωc) X1 − (k_a + iωc) X2 = F, −(k_a + iωc) X1 + (k_a − mω² + iωc) X2 = 0.
    /// Base acceleration a (coordinates relative to the base): right-hand sides −M a and −m a.
    /// </remarks>
    public static (Complex X1, Complex X2) Response(double bigM, double k, double m, double ka, double ca, double omega, bool baseAcceleration = false)
    {
        var coupling = new Complex(ka, omega * ca);
        var a11 = new Complex(k - bigM * omega * omega, 0) + coupling;
        var a22 = new Complex(-m * omega * omega, 0) + coupling;
        var a12 = -coupling;
        var f1 = baseAcceleration ? new Complex(-bigM, 0) : Complex.One;
        var f2 = baseAcceleration ? new Complex(-m, 0) : Complex.Zero;
        var det = a11 * a22 - a12 * a12;
        return ((f1 * a22 - a12 * f2) / det, (a11 * f2 - a12 * f1) / det);
    }

    /// <summary>Primary amplification |X1|·k/F (force) or |X1|·k/(M a) (base) at frequency ratio g = ω/ω_p, with μ, f and ζ_a referred to the absorber.</summary>
    public static double Amplification(double mu, double f, double zetaAbsorber, double g, bool baseAcceleration = false)
    {
        const double bigM = 1, k = 1; // ω_p = 1
        var m = mu * bigM;
        var ka = m * f * f;
        var ca = 2 * zetaAbsorber * m * f;
        var (x1, _) = Response(bigM, k, m, ka, ca, g, baseAcceleration);
        return x1.Magnitude * k / (baseAcceleration ? bigM : 1);
    }

    /// <summary>The local maxima of <paramref name="h"/> over [a, b], each refined by golden-section search to 1e-12 in g.</summary>
    public static List<(double G, double Value)> Peaks(Func<double, double> h, double a, double b, int samples = 20000)
    {
        var peaks = new List<(double, double)>();
        var step = (b - a) / samples;
        for (var i = 1; i < samples; i++)
        {
            double g0 = a + (i - 1) * step, g1 = a + i * step, g2 = a + (i + 1) * step;
            if (h(g1) >= h(g0) && h(g1) > h(g2)) peaks.Add(GoldenMax(h, g0, g2));
        }
        return peaks;
    }

    private static (double, double) GoldenMax(Func<double, double> h, double lo, double hi)
    {
        var r = (Math.Sqrt(5) - 1) / 2;
        double x1 = hi - r * (hi - lo), x2 = lo + r * (hi - lo);
        while (hi - lo > 1e-12)
        {
            if (h(x1) < h(x2)) { lo = x1; x1 = x2; x2 = lo + r * (hi - lo); }
            else { hi = x2; x2 = x1; x1 = hi - r * (hi - lo); }
        }
        var g = 0.5 * (lo + hi);
        return (g, h(g));
    }

    /// <summary>Frequency ratios in [a, b] where the amplification does not depend on the absorber's damping (the fixed points).</summary>
    public static List<double> FixedPoints(double mu, double f, double a, double b, bool baseAcceleration = false)
    {
        // Two finite dampings: their curves meet only at the fixed points, and neither has a pole.
        double D(double g) => Amplification(mu, f, 0.05, g, baseAcceleration) - Amplification(mu, f, 0.6, g, baseAcceleration);
        var roots = new List<double>();
        const int samples = 4000;
        for (var i = 0; i < samples; i++)
        {
            double lo = a + (b - a) * i / samples, hi = a + (b - a) * (i + 1) / samples;
            if (Math.Sign(D(lo)) == Math.Sign(D(hi))) continue;
            for (var it = 0; it < 200 && hi - lo > 1e-14; it++)
            {
                var mid = 0.5 * (lo + hi);
                if (Math.Sign(D(mid)) == Math.Sign(D(lo))) lo = mid; else hi = mid;
            }
            roots.Add(0.5 * (lo + hi));
        }
        return roots;
    }

    /// <summary>
    /// The minimax of the primary's amplification over the absorber's frequency ratio f and damping ratio ζ_a (force on an
    /// undamped primary): min over f and ζ_a of the larger of the two peaks of |X1|k/F, by nested golden-section searches.
    /// </summary>
    /// <remarks>
    /// For a fixed f the worst peak is unimodal in ζ_a (too little damping raises one peak, too much merges them into one
    /// high peak), and the best of it is unimodal in f; each peak is the maximum over g in [0.5, f] or [f, 1.5], found by
    /// golden section to 1e-12 in g. Brackets: f in [0.9, 1.0], ζ_a in [0.05, 0.3] for μ around 5 %.
    /// </remarks>
    public static (double F, double Zeta, double Peak) Minimax(double mu, double relativeTolerance = 1e-10)
    {
        double Worst(double f, double z)
        {
            double H(double g) => Amplification(mu, f, z, g);
            return Math.Max(GoldenMax(H, 0.5, f).Item2, GoldenMax(H, f, 1.5).Item2);
        }
        (double At, double Value) BestZeta(double f) => GoldenMin(z => Worst(f, z), 0.05, 0.3, relativeTolerance);
        var (f, _) = GoldenMin(f => BestZeta(f).Value, 0.9, 1.0, relativeTolerance);
        var (zeta, peak) = BestZeta(f);
        return (f, zeta, peak);
    }

    private static (double At, double Value) GoldenMin(Func<double, double> h, double lo, double hi, double relativeTolerance)
    {
        var r = (Math.Sqrt(5) - 1) / 2;
        double x1 = hi - r * (hi - lo), x2 = lo + r * (hi - lo), f1 = h(x1), f2 = h(x2);
        while (hi - lo > relativeTolerance * hi)
        {
            if (f1 > f2) { lo = x1; x1 = x2; f1 = f2; x2 = lo + r * (hi - lo); f2 = h(x2); }
            else { hi = x2; x2 = x1; f2 = f1; x1 = hi - r * (hi - lo); f1 = h(x1); }
        }
        var x = 0.5 * (lo + hi);
        return (x, h(x));
    }
}
