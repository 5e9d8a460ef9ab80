using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Massless;

/// <summary>Time histories of models with massless nodes against a matrix exponential of their first-order equations written here.</summary>
public class FirstOrderTransientTests
{
    /// <summary>e^X by scaling and squaring of a 30-term Taylor series (written here, independent of src).</summary>
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

    /// <summary>
    /// A mass m on a standard linear solid whose long-term spring k1 is built as two springs in series through a massless
    /// joint (k1a from the mass to the joint, k1b from the joint to ground), with a Maxwell branch k2 + c.
    /// </summary>
    private static Network Model(double m, double k1a, double k1b, double k2, double c) =>
        new NetworkBuilder { Title = "standard linear solid with a split long-term spring" }
            .AddMass("m", m).AddNode("joint").AddNode("inner")
            .AddSpring("k1a", "m", "joint", k1a).AddSpring("k1b", "joint", Network.Ground, k1b)
            .AddSpring("k2", "m", "inner", k2).AddDamper("c", "inner", Network.Ground, c)
            .Build();

    [Theory]
    [InlineData(TransientMethod.Exact)]
    [InlineData(TransientMethod.Newmark)]
    public void StepForce_OnAStandardLinearSolid_MatchesTheMatrixExponentialOfItsFirstOrderEquations(TransientMethod method)
    {
        // Reference written here: with k1 = k1a·k1b/(k1a + k1b) (series springs) the states z = [x, v, y] obey
        // m v' = F − k1 x − k2 (x − y), x' = v, c y' = k2 (x − y) (the damper's force balance at the massless node);
        // z(t) = e^{A t} z0 + A⁻¹(e^{A t} − I) b F from the exponential of the augmented matrix [[A, bF], [0, 0]]. The
        // joint sits at the static divider x·k1a/(k1a + k1b). Both are exact for a step, so they must agree to 1e-9 of
        // the largest displacement; any method asked for runs the exact first-order form on a model with massless nodes.
        double m = 40, k1a = 9e4, k1b = 6e4, k2 = 1.2e5, c = 800, force = 250;
        var k1 = k1a * k1b / (k1a + k1b);
        var network = Model(m, k1a, k1b, k2, c);
        var system = DampedSystem.Build(StructuralModel.Of(network));
        var period = 2 * Math.PI / Math.Sqrt((k1 + k2) / m);
        var h = period / 40;
        var steps = 400;
        var settings = new TransientSettings(steps * h, h, method) { RecordEvery = 4 };
        var result = TransientAnalysis.Run(system, [new ForceHistory("push", "m", 1, new StepFunction(force, 0))], [], settings);
        Assert.Contains("first-order form", result.MethodDescription, StringComparison.Ordinal);

        var a = Matrix<double>.Build.DenseOfArray(new[,]
        {
            { 0, 1, 0, 0 },
            { -(k1 + k2) / m, 0, k2 / m, force / m },
            { k2 / c, 0, -k2 / c, 0 },
            { 0, 0, 0, 0 },
        });
        var z0 = Vector<double>.Build.DenseOfArray([0, 0, 0, 1]);
        var times = result.Times.ToArray();
        var x = result.Get("m", ResponseQuantity.Displacement).Values;
        var y = result.Get("inner", ResponseQuantity.Displacement).Values;
        var joint = result.Get("joint", ResponseQuantity.Displacement).Values;
        var scale = force / k1;
        for (var s = 0; s < times.Length; s++)
        {
            var z = Exponential(a * times[s]) * z0;
            NumericAssert.Small(Math.Abs(x[s] - z[0]), 1e-9 * scale, $"mass at {times[s]} s");
            NumericAssert.Small(Math.Abs(y[s] - z[2]), 1e-9 * scale, $"inner node at {times[s]} s");
            NumericAssert.Small(Math.Abs(joint[s] - z[0] * k1a / (k1a + k1b)), 1e-9 * scale, $"joint at {times[s]} s");
        }
        // The energy balance E₀ + W = T + V + D must close with every DOF's motion, the massless ones included
        // (common practice: the library's own closure warning is at 1 %).
        Assert.True(result.Energy.MaxRelativeError < 5e-3, $"energy balance closes only to {result.Energy.MaxRelativeError}");
    }

    [Fact]
    public void MasslessInnerNodeVelocity_IsTheDampersForceOverItsCoefficient()
    {
        // Identity of the first-order row: c·ẏ = k2·(x − y) at every recorded time (force balance at the massless node).
        double m = 40, k1a = 9e4, k1b = 6e4, k2 = 1.2e5, c = 800;
        var network = Model(m, k1a, k1b, k2, c);
        var system = DampedSystem.Build(StructuralModel.Of(network));
        var settings = new TransientSettings(0.2, 1e-3, TransientMethod.Exact);
        var result = TransientAnalysis.Run(system, [], [new InitialCondition("m", 0.002, 0.1)], settings);
        var x = result.Get("m", ResponseQuantity.Displacement).Values;
        var y = result.Get("inner", ResponseQuantity.Displacement).Values;
        var yv = result.Get("inner", ResponseQuantity.Velocity).Values;
        for (var s = 0; s < x.Length; s++)
            NumericAssert.Small(Math.Abs(c * yv[s] - k2 * (x[s] - y[s])), 1e-9 * k2 * 0.002, $"force balance at step {s}");
    }
}
