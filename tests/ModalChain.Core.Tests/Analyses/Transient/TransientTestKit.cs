using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Model;

namespace ModalChain.Core.Tests.Analyses.Transient;

/// <summary>Keeps every state an integrator reports, for tests.</summary>
internal sealed class HistorySink : IStepSink
{
    public List<double> Times { get; } = [];
    public List<double[]> U { get; } = [];
    public List<double[]> V { get; } = [];
    public List<double[]> A { get; } = [];
    public List<double[]> F { get; } = [];

    public void Accept(int step, double time, ReadOnlySpan<double> u, ReadOnlySpan<double> v, ReadOnlySpan<double> a, ReadOnlySpan<double> f)
    {
        Times.Add(time);
        U.Add(u.ToArray());
        V.Add(v.ToArray());
        A.Add(a.ToArray());
        F.Add(f.ToArray());
    }

    public double[] Dof(int i) => [.. U.Select(u => u[i])];
}

/// <summary>Small systems and runners shared by the transient tests.</summary>
internal static class TransientTestKit
{
    public static LinearDynamicSystem Sdof(double m, double c, double k) => new(
        Matrix<double>.Build.Dense(1, 1, m), Matrix<double>.Build.Dense(1, 1, c), Matrix<double>.Build.Dense(1, 1, k));

    public static LoadSet Force(int size, int dof, TimeFunction f) => new(size, [new LoadTerm([(dof, 1.0)], f)]);

    /// <summary>Runs one of the three integrators that work on physical matrices.</summary>
    public static HistorySink Run(string method, LinearDynamicSystem system, LoadSet load, double[] u0, double[] v0, double h, int steps)
    {
        var sink = new HistorySink();
        switch (method)
        {
            case "newmark": new NewmarkIntegrator().Run(system, load.AsLoadVector(), u0, v0, h, steps, sink); break;
            case "hht": new NewmarkIntegrator(-0.1).Run(system, load.AsLoadVector(), u0, v0, h, steps, sink); break;
            case "exact": new StateSpaceExactIntegrator().Run(system, load.AsLoadVector(), u0, v0, h, steps, sink); break;
            case "modal": RunModal(system, load, u0, v0, h, steps, sink); break;
            default: throw new ArgumentException(method);
        }
        return sink;
    }

    /// <summary>Modal superposition with all modes of a classically damped system, then back to physical coordinates.</summary>
    private static void RunModal(LinearDynamicSystem system, LoadSet load, double[] u0, double[] v0, double h, int steps, HistorySink sink)
    {
        var n = system.Size;
        var m = Matrix<double>.Build.DenseOfMatrix(system.Mass);
        var k = Matrix<double>.Build.DenseOfMatrix(system.Stiffness);
        var scale = Matrix<double>.Build.DenseOfDiagonalArray([.. Enumerable.Range(0, n).Select(i => 1 / Math.Sqrt(m[i, i]))]);
        var evd = (scale * k * scale).Evd(MathNet.Numerics.LinearAlgebra.Symmetricity.Symmetric);
        var shapes = scale * evd.EigenVectors;
        var omega = evd.EigenValues.Select(e => Math.Sqrt(Math.Max(0, e.Real))).ToArray();
        var g = shapes.TransposeThisAndMultiply(system.Damping * shapes);
        var zeta = omega.Select((w, j) => w > 0 ? g[j, j] / (2 * w) : 0).ToArray();
        var modal = new HistorySink();
        new ModalSuperpositionIntegrator().Run(shapes, omega, zeta, m, load, u0, v0, h, steps, modal);
        for (var s = 0; s < modal.Times.Count; s++)
            sink.Accept(s, modal.Times[s],
                (shapes * Vector<double>.Build.DenseOfArray(modal.U[s])).ToArray(),
                (shapes * Vector<double>.Build.DenseOfArray(modal.V[s])).ToArray(),
                (shapes * Vector<double>.Build.DenseOfArray(modal.A[s])).ToArray(),
                (m * shapes * Vector<double>.Build.DenseOfArray(modal.F[s])).ToArray());
    }

    /// <summary>A seeded random chain of masses with cross springs and a classical (Rayleigh) or discrete damping.</summary>
    public static LinearDynamicSystem RandomSystem(int n, int seed, bool rayleigh, double dampingLevel = 1.0)
    {
        var random = new Random(seed);
        var m = Matrix<double>.Build.Dense(n, n);
        var k = Matrix<double>.Build.Dense(n, n);
        var c = Matrix<double>.Build.Dense(n, n);
        for (var i = 0; i < n; i++) m[i, i] = 50 + 100 * random.NextDouble();
        void Add(Matrix<double> a, int i, int j, double w)
        {
            a[i, i] += w;
            if (j >= 0) { a[j, j] += w; a[i, j] -= w; a[j, i] -= w; }
        }
        Add(k, 0, -1, 1e5 * (0.5 + random.NextDouble()));
        for (var i = 1; i < n; i++) Add(k, i, i - 1, 1e5 * (0.5 + random.NextDouble()));
        for (var e = 0; e < n / 2; e++)
        {
            var i = random.Next(n);
            var j = random.Next(n);
            if (i != j) Add(k, i, j, 3e4 * random.NextDouble());
        }
        if (rayleigh) c = dampingLevel * (0.5 * m + 2e-4 * k);
        else
            for (var e = 0; e < Math.Max(1, n / 2); e++)
            {
                var i = random.Next(n);
                var j = random.Next(-1, n);
                if (i != j) Add(c, i, j, dampingLevel * 200 * random.NextDouble());
            }
        return new LinearDynamicSystem(m, c, k);
    }
}
