using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;
using ModalChain.TestSupport;
using static ModalChain.Core.Tests.Analyses.Transient.TransientTestKit;

namespace ModalChain.Core.Tests.Analyses.Transient;

/// <summary>The energy balance E₀ + W = T + V + D as a check of the integration.</summary>
public class EnergyBalanceTests
{
    private static EnergyBalance Balance(string method, LinearDynamicSystem system, LoadSet load, double[] u0, double[] v0, double h, int steps)
    {
        var recorder = new ResponseRecorder([], SymmetricSparseMatrix.From(system.Mass), SymmetricSparseMatrix.From(system.Damping),
            SymmetricSparseMatrix.From(system.Stiffness), h, steps, 1, 0, double.PositiveInfinity, null);
        var sink = Run(method, system, load, u0, v0, h, steps);
        for (var s = 0; s < sink.Times.Count; s++) recorder.Accept(s, sink.Times[s], sink.U[s], sink.V[s], sink.A[s], sink.F[s]);
        return recorder.Energy;
    }

    [Fact]
    public void AverageAcceleration_ClosesTheBalanceToRoundOff_OnRandomDampedNetworks()
    {
        // For γ = ½, β = ¼ the trapezoidal energy balance is an identity of the scheme (Hughes, The Finite Element
        // Method, 1987, §9.3 — from memory): the balance tests the implementation, not the step.
        for (var seed = 1; seed <= 20; seed++)
        {
            var system = RandomSystem(8, seed, rayleigh: seed % 2 == 0);
            var load = new LoadSet(8, [new LoadTerm([(seed % 8, 1.0)], new HalfSinePulse(2000, 0.02)), new LoadTerm([(0, 1.0)], new SineFunction(500, 9))]);
            var e = Balance("newmark", system, load, new double[8], new double[8], 1e-3, 1000);
            NumericAssert.Small(e.MaxRelativeError, 1e-10, $"seed {seed} balance");
            Assert.True(e.Dissipated > 0 && e.InputWork > 0, $"seed {seed}: work {e.InputWork}, dissipated {e.Dissipated}");
        }
    }

    [Theory]
    [InlineData("exact")]
    [InlineData("modal")]
    public void ExactMethods_CloseTheBalanceToTheOrderOfTheRule(string method)
    {
        // The trapezoidal accounting of W and D is second order, so at ~200 steps per period it closes to ~1e-4.
        for (var seed = 1; seed <= 5; seed++)
        {
            var system = RandomSystem(6, seed, rayleigh: true);
            var load = new LoadSet(6, [new LoadTerm([(seed % 6, 1.0)], new HalfSinePulse(2000, 0.05))]);
            var e = Balance(method, system, load, new double[6], new double[6], 2e-4, 2500);
            NumericAssert.Small(e.MaxRelativeError, 1e-3, $"{method} seed {seed} balance");
        }
    }

    [Fact]
    public void Undamped_EnergyStaysBounded()
    {
        // Unconditional stability of average acceleration (Newmark 1959): even at a step far too long for the highest
        // mode, the free undamped energy neither grows nor decays.
        var system = RandomSystem(10, seed: 5, rayleigh: true, dampingLevel: 0);
        var u0 = Enumerable.Range(0, 10).Select(i => 1e-3 * Math.Sin(i + 1)).ToArray();
        var v0 = Enumerable.Range(0, 10).Select(i => 1e-2 * Math.Cos(3 * i)).ToArray();
        var e = Balance("newmark", system, LoadSet.None(10), u0, v0, 0.05, 20000);
        NumericAssert.Close(e.InitialEnergy, e.FinalKineticEnergy + e.FinalStrainEnergy, Tolerance.Rel(1e-9), "energy after 20 000 steps");
    }
}
