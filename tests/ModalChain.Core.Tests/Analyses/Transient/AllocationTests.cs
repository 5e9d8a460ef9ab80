using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Model;
using static ModalChain.Core.Tests.Analyses.Transient.TransientTestKit;

namespace ModalChain.Core.Tests.Analyses.Transient;

/// <summary>The time-stepping loops allocate nothing per step: the extra steps of a longer run cost no memory.</summary>
public class AllocationTests
{
    private sealed class NullSink : IStepSink
    {
        public double Last;

        public void Accept(int step, double time, ReadOnlySpan<double> u, ReadOnlySpan<double> v, ReadOnlySpan<double> a, ReadOnlySpan<double> f) =>
            Last = u[0];
    }

    private static long Allocated(Action run)
    {
        run();
        var before = GC.GetAllocatedBytesForCurrentThread();
        run();
        return GC.GetAllocatedBytesForCurrentThread() - before;
    }

    [Theory]
    [InlineData("newmark")]
    [InlineData("hht")]
    [InlineData("exact")]
    [InlineData("modal")]
    public void ExtraSteps_AllocateNothing(string method)
    {
        var system = RandomSystem(12, seed: 3, rayleigh: true);
        var load = new LoadSet(12, [new LoadTerm([(3, 1.0)], new HalfSinePulse(100, 0.01)), new LoadTerm([(7, 0.01)], new UnbalanceSpeedRamp(0, 100, 1))]);
        var u0 = new double[12];
        var v0 = new double[12];
        var shapes = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.DenseIdentity(12);
        var omega = Enumerable.Repeat(10.0, 12).ToArray();
        var zeta = Enumerable.Repeat(0.02, 12).ToArray();
        Action Run(int steps) => method switch
        {
            "newmark" => () => new NewmarkIntegrator().Run(system, load.AsLoadVector(), u0, v0, 1e-3, steps, new NullSink()),
            "hht" => () => new NewmarkIntegrator(-0.1).Run(system, load.AsLoadVector(), u0, v0, 1e-3, steps, new NullSink()),
            "exact" => () => new StateSpaceExactIntegrator().Run(system, load.AsLoadVector(), u0, v0, 1e-3, steps, new NullSink()),
            _ => () => new ModalSuperpositionIntegrator().Run(shapes, omega, zeta, system.Mass, load, u0, v0, 1e-3, steps, new NullSink()),
        };
        var shortRun = Allocated(Run(100));
        const int extraSteps = 50_000;
        var longRun = Allocated(Run(100 + extraSteps));
        // The smallest object is 24 bytes, so one allocation per step would cost at least 24 bytes a step (1.2 MB here).
        // The runtime allocates some tens of kB once under load (tiered compilation, on-stack replacement of the long
        // loop: 6 kB and 76 kB were seen on a busy machine), so the bound is a quarter of the smallest object a step.
        var bound = 6L * extraSteps;
        Assert.True(longRun - shortRun < bound, $"{method}: {extraSteps:N0} extra steps allocated {longRun - shortRun} bytes (bound {bound:N0})");
    }

    [Theory]
    [InlineData(TransientMethod.Newmark)]
    [InlineData(TransientMethod.Modal)]
    public void AWholeRun_AllocatesTheRecordedHistoriesOnceAndNotPerDof(TransientMethod method)
    {
        // Peak memory follows what is recorded: the extra steps of a longer run on 320 DOFs cost the extra recorded
        // samples once (8 bytes per probe and sample), with no copy of the histories and nothing per DOF and step.
        // Bound: 1.25 × 8 bytes per extra recorded value plus the runtime's one-off 100 kB (see above).
        var network = ModalChain.Core.Tests.Analyses.Harmonic.HarmonicModels.Random(5, 320, dampers: false);
        var model = new StructuralModel(network, new DampingModel([], RayleighDamping.FromTargets(0.02, 1, 10), 0), []);
        var system = ModalChain.Core.Assembly.DampedSystem.Build(model, new ModalChain.Core.Analyses.Modal.ModalOptions(Count: 30));
        var load = new ForceHistory("tap", "m7", 1, new HalfSinePulse(50, 0.05));
        TransientResult Run(double duration) => TransientAnalysis.Run(system, [load], [],
            new TransientSettings(duration, 1e-3, method) { Outputs = ["m7", "m300"] });
        var shortRun = Run(0.5);
        const int extraSteps = 5_000;
        var samples = (long)shortRun.Responses.Length + 1;   // every history and the times
        var shortBytes = Allocated(() => Run(0.5));
        var longBytes = Allocated(() => Run(0.5 + extraSteps * 1e-3));
        var bound = (long)(1.25 * 8 * samples * extraSteps) + 100_000;
        Assert.True(longBytes - shortBytes < bound,
            $"{method}: {extraSteps:N0} extra steps of {samples} recorded values allocated {longBytes - shortBytes:N0} bytes (bound {bound:N0})");
    }
}
