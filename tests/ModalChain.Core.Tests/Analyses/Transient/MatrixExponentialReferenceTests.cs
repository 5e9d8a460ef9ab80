using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Core.Tests.Analyses.Harmonic;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Transient;

/// <summary>
/// Damped multi-mass time histories against a reference written here, independent of src: the state-space equation
/// ż = A z + b F0, z = [u; u̇], A = [[0, I], [−M⁻¹K, −M⁻¹C]], solved by the exponential of the augmented matrix
/// [[A, b], [0, 0]] (Van Loan 1978 [from memory]), itself computed by scaling and squaring of a Taylor series.
/// </summary>
public class MatrixExponentialReferenceTests
{
    /// <summary>M, K and C over the masses from the network's element lists (ground left out), as dense matrices.</summary>
    private static (Matrix<double> M, Matrix<double> K, Matrix<double> C) Matrices(Network network)
    {
        var names = network.Masses.Select(m => m.Name).ToList();
        var n = names.Count;
        var m = Matrix<double>.Build.DenseOfDiagonalArray([.. network.Masses.Select(x => x.Kilograms)]);
        var k = Matrix<double>.Build.Dense(n, n);
        var c = Matrix<double>.Build.Dense(n, n);
        void Add(Matrix<double> a, string nodeA, string nodeB, double value)
        {
            int i = names.IndexOf(nodeA), j = names.IndexOf(nodeB);
            if (i >= 0) a[i, i] += value;
            if (j >= 0) a[j, j] += value;
            if (i >= 0 && j >= 0) { a[i, j] -= value; a[j, i] -= value; }
        }
        foreach (var s in network.Springs) Add(k, s.NodeA, s.NodeB, s.Stiffness);
        foreach (var d in network.Dampers) Add(c, d.NodeA, d.NodeB, d.Coefficient);
        return (m, k, c);
    }

    /// <summary>e^X by scaling and squaring: X/2^s with ‖X/2^s‖₁ ≤ ½, Taylor series to 30 terms, then s squarings.</summary>
    private static Matrix<double> Exponential(Matrix<double> x)
    {
        var squarings = Math.Max(0, (int)Math.Ceiling(Math.Log2(x.L1Norm() / 0.5)));
        var scaled = x / Math.Pow(2, squarings);
        var sum = Matrix<double>.Build.DenseIdentity(x.RowCount);
        var term = Matrix<double>.Build.DenseIdentity(x.RowCount);
        for (var j = 1; j <= 30; j++)
        {
            term = term * scaled / j;
            sum += term;
        }
        for (var s = 0; s < squarings; s++) sum *= sum;
        return sum;
    }

    /// <summary>u(t) at the given times for z(0) = z0 and a constant force F0 at mass <paramref name="loaded"/> (0 for none).</summary>
    private static double[][] Reference(Matrix<double> m, Matrix<double> k, Matrix<double> c, double[] u0, double[] v0,
        int loaded, double force, IReadOnlyList<double> times)
    {
        var n = m.RowCount;
        var minv = m.Inverse();
        var augmented = Matrix<double>.Build.Dense(2 * n + 1, 2 * n + 1);
        augmented.SetSubMatrix(0, n, Matrix<double>.Build.DenseIdentity(n));
        augmented.SetSubMatrix(n, 0, -minv * k);
        augmented.SetSubMatrix(n, n, -minv * c);
        augmented[n + loaded, 2 * n] = force / m[loaded, loaded];
        var z0 = Vector<double>.Build.DenseOfEnumerable(u0.Concat(v0).Append(1.0));
        return [.. times.Select(t => (Exponential(augmented * t) * z0).SubVector(0, n).ToArray())];
    }

    private static double WorstError(TransientResult result, Network network, double[][] reference, double[] times)
    {
        var worst = 0.0;
        var scale = reference.Max(u => u.Max(Math.Abs));
        for (var i = 0; i < network.Masses.Length; i++)
        {
            var values = result.Get(network.Masses[i].Name, ResponseQuantity.Displacement).Values;
            for (var s = 0; s < times.Length; s++) worst = Math.Max(worst, Math.Abs(values[s] - reference[s][i]) / scale);
        }
        return worst;
    }

    [Fact]
    public void StepAndImpulse_OnRandomNonClassicallyDampedNetworks_MatchTheMatrixExponential()
    {
        // Four seeded networks of 3 to 6 masses with discrete dampers (non-classical). Two runs each over two periods of the
        // lowest mode: a step force from rest, and an impulse (an initial velocity, I = m v0) with no load.
        // The exact method must match to 1e-9 of the largest displacement (both are exact for these loads; they agree to
        // better than 1e-11); Newmark average
        // acceleration with 100 steps per period of the highest mode to 2 %, and it must converge at second order
        // (halving the step divides the error by 4 ± 1; Newmark 1959, REFERENCES §5).
        for (var seed = 1; seed <= 4; seed++)
        {
            var n = 3 + seed - 1;
            var network = HarmonicModels.Random(700 + seed, n, dampers: true);
            var (m, k, c) = Matrices(network);
            var system = DampedSystem.Build(StructuralModel.Of(network));
            Assert.False(system.IsClassical);
            var lowest = system.Modes.Modes[0].PeriodSeconds;
            var shortest = system.Modes.Modes[^1].PeriodSeconds;
            var loaded = n / 2;
            var cases = new (string Name, TransientExcitation[] Loads, InitialCondition[] Initial, double[] U0, double[] V0, double Force)[]
            {
                ("step", [new ForceHistory("push", network.Masses[loaded].Name, 1, new StepFunction(500, 0))], [], new double[n], new double[n], 500),
                ("impulse", [], [new InitialCondition(network.Masses[0].Name, 0, 0.2)], new double[n], [0.2, .. new double[n - 1]], 0),
            };
            foreach (var (name, loads, initial, u0, v0, force) in cases)
            {
                var errors = new List<double>();
                foreach (var (method, stepsPerShortest) in new[] { (TransientMethod.Exact, 20), (TransientMethod.Newmark, 100), (TransientMethod.Newmark, 200) })
                {
                    var h = shortest / stepsPerShortest;
                    var steps = (int)Math.Ceiling(2 * lowest / h);
                    var settings = new TransientSettings(steps * h, h, method) { RecordEvery = Math.Max(1, steps / 50) };
                    var result = TransientAnalysis.Run(system, loads, initial, settings);
                    var times = result.Times.ToArray();
                    var reference = Reference(m, k, c, u0, v0, loaded, force, times);
                    errors.Add(WorstError(result, network, reference, times));
                }
                NumericAssert.Small(errors[0], 1e-9, $"seed {seed}, {name}: exact method");
                NumericAssert.Small(errors[1], 2e-2, $"seed {seed}, {name}: Newmark, 100 steps per shortest period");
                Assert.InRange(errors[1] / errors[2], 3.0, 5.0);
            }
        }
    }
}
