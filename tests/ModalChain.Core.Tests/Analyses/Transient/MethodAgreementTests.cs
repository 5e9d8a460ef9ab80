using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Model;
using ModalChain.TestSupport;
using static ModalChain.Core.Tests.Analyses.Transient.TransientTestKit;

namespace ModalChain.Core.Tests.Analyses.Transient;

/// <summary>The four integrators agree where theory says they must.</summary>
public class MethodAgreementTests
{
    private static LoadSet Loads(int n) => new(n,
    [
        new LoadTerm([(0, 1.0)], new HalfSinePulse(800, 0.03, 0.01)),
        new LoadTerm([(n - 1, 1.0)], new SineFunction(300, 7.5)),
        new LoadTerm([(n / 2, 40.0)], new UnbalanceSpeedRamp(0, 120, 0.4)),
    ]);

    [Fact]
    public void Exact_AndModalWithAllModes_AgreeOnClassicallyDampedNetworks()
    {
        // With C = a0 M + a1 K the modes uncouple exactly (Caughey & O'Kelly 1965), and both methods are exact for the
        // same piecewise-linear load, so they must agree to round-off at any step.
        for (var seed = 1; seed <= 5; seed++)
        {
            var system = RandomSystem(6, seed, rayleigh: true);
            var u0 = new double[6];
            var v0 = new double[6];
            u0[2] = 1e-3;
            v0[4] = -0.01;
            var exact = Run("exact", system, Loads(6), u0, v0, 2e-3, 300);
            var modal = Run("modal", system, Loads(6), u0, v0, 2e-3, 300);
            var scale = exact.U.Max(u => u.Max(Math.Abs));
            for (var s = 0; s <= 300; s += 25)
            {
                NumericAssert.Close(exact.U[s], modal.U[s], Tolerance.Abs(1e-8 * scale), $"seed {seed} u at step {s}");
                NumericAssert.Close(exact.A[s], modal.A[s], Tolerance.Abs(1e-7 * exact.A.Max(a => a.Max(Math.Abs))), $"seed {seed} a at step {s}");
            }
        }
    }

    [Fact]
    public void Newmark_ConvergesToExact_AsTheStepShrinks()
    {
        // Non-classical discrete damping: the exact method is the reference; Newmark's difference to it falls as h²
        // (Newmark 1959). The exact run uses a fine step so that its own load sampling error is negligible.
        var system = RandomSystem(6, seed: 31, rayleigh: false);
        var u0 = new double[6];
        var v0 = new double[6];
        const double end = 0.3;
        var reference = Run("exact", system, Loads(6), u0, v0, end / 9600, 9600).U[^1];
        var errors = new[] { 300, 600, 1200 }.Select(steps =>
        {
            var u = Run("newmark", system, Loads(6), u0, v0, end / steps, steps).U[^1];
            return Math.Sqrt(u.Zip(reference, (a, b) => (a - b) * (a - b)).Sum());
        }).ToArray();
        NumericAssert.Close(2.0, Math.Log2(errors[0] / errors[1]), Tolerance.Abs(0.15), "order 300→600");
        NumericAssert.Close(2.0, Math.Log2(errors[1] / errors[2]), Tolerance.Abs(0.15), "order 600→1200");
    }

    [Fact]
    public void Exact_DoesNotDependOnTheStep_ForLinearLoads()
    {
        // A ramp load is linear between any two steps, so steps of 1 ms and 10 ms give the same states at common times.
        var system = RandomSystem(4, seed: 3, rayleigh: false);
        var load = new LoadSet(4, [new LoadTerm([(1, 1.0)], new RampFunction(0, 5000, 0.1))]);
        var fine = Run("exact", system, load, new double[4], new double[4], 1e-3, 200);
        var coarse = Run("exact", system, load, new double[4], new double[4], 1e-2, 20);
        var scale = fine.U.Max(u => u.Max(Math.Abs));
        for (var s = 0; s <= 20; s++)
            NumericAssert.Close(fine.U[10 * s], coarse.U[s], Tolerance.Abs(1e-10 * scale), $"u at {0.01 * s:F2} s");
    }
}
