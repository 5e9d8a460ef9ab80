using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Io.Model;
using ModalChain.TestSupport;

namespace ModalChain.Io.Tests.Circuits;

/// <summary>
/// models/floor-shaker-test.yaml (a circuit inside a line model) against its hand-written node flux analogue
/// (Circuits/floor-shaker-test-analogue.yaml): the same network, so the same matrices, roots and responses.
/// </summary>
/// <remarks>
/// Identity: the analogue writes each resistor R as a damper 1/R, the amplifier as a support moved at 1 m/s and the
/// circuit's nodes as massless nodes, which is what the circuit reader and <c>CircuitAnalogy.AddTo</c> must produce. The
/// analogue's 375 Ω coil is written as the double nearest 1/375 N·s/m, so the two files hold the same numbers and every
/// figure must agree to rounding (1e-10 relative asserted, with an absolute floor of 1e-10 of each matrix's largest entry).
/// </remarks>
public class MixedFloorTestIdentityTests
{
    private static ModelDocument Load(string path)
    {
        var result = ModelReader.ReadFile(Path.Combine(AppContext.BaseDirectory, path));
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        return result.Model!;
    }

    private static (DampedSystem Mixed, DampedSystem Analogue) Systems()
    {
        var mixed = Load("models/floor-shaker-test.yaml");
        var analogue = Load("Circuits/floor-shaker-test-analogue.yaml");
        Assert.NotNull(mixed.EmbeddedCircuit);
        Assert.Null(analogue.EmbeddedCircuit);
        return (DampedSystem.Build(mixed.Structure), DampedSystem.Build(analogue.Structure));
    }

    [Fact]
    public void MixedModel_AndItsAnalogue_HaveTheSameMassDampingAndStiffness()
    {
        var (mixed, analogue) = Systems();
        var labels = Enumerable.Range(0, mixed.Partition.FreeCount).Select(mixed.Partition.Free.Label).ToArray();
        Assert.Equal(labels, Enumerable.Range(0, analogue.Partition.FreeCount).Select(analogue.Partition.Free.Label));
        Assert.Equal(analogue.Partition.Supports.ToArray(), mixed.Partition.Supports.ToArray());
        void Same(MathNet.Numerics.LinearAlgebra.Matrix<double> expected, MathNet.Numerics.LinearAlgebra.Matrix<double> actual, string what) =>
            NumericAssert.Close(expected, actual, new Tolerance(1e-10 * expected.Enumerate().Max(Math.Abs), 1e-10), what);
        Same(analogue.Partition.Mass, mixed.Partition.Mass, "M");
        Same(analogue.Damping.FF, mixed.Damping.FF, "C");
        Same(analogue.Partition.StiffnessFF, mixed.Partition.StiffnessFF, "K");
        Same(analogue.Partition.DamperFP, mixed.Partition.DamperFP, "C_fp (the amplifier's coupling)");
        Same(analogue.Partition.StiffnessFP, mixed.Partition.StiffnessFP, "K_fp");
        // The circuit's nodes, and the node the amplifier holds, are marked electrical; in the analogue the same nodes are
        // found as the transducers' electrical side (branch terminals and the nodes joined to them by an element).
        Assert.Equal(["amplifier-out", "sensor-coil", "sensor-out", "shaker-coil"], mixed.Model.Network.ElectricalNodes.Order(StringComparer.Ordinal).ToArray());
        Assert.Equal(["amplifier-out", "sensor-coil", "sensor-out", "shaker-coil"], analogue.Model.Network.ElectricalNodes.Order(StringComparer.Ordinal).ToArray());
    }

    [Fact]
    public void MixedModel_AndItsAnalogue_HaveTheSameRoots()
    {
        var (mixed, analogue) = Systems();
        var a = ComplexModes.Solve(analogue).Select(r => r.EigenValue).OrderBy(z => z.Imaginary).ThenBy(z => z.Real).ToArray();
        var b = ComplexModes.Solve(mixed).Select(r => r.EigenValue).OrderBy(z => z.Imaginary).ThenBy(z => z.Real).ToArray();
        Assert.Equal(a.Length, b.Length);
        Assert.True(a.Length >= 4, "the floor, shaker and sensor roots");
        var scale = a.Max(z => z.Magnitude);
        for (var i = 0; i < a.Length; i++)
        {
            NumericAssert.Close(a[i].Real, b[i].Real, new Tolerance(1e-10 * scale, 1e-10), $"root {i} real part");
            NumericAssert.Close(a[i].Imaginary, b[i].Imaginary, new Tolerance(1e-10 * scale, 1e-10), $"root {i} imaginary part");
        }
    }

    [Fact]
    public void MixedModel_AndItsAnalogue_HaveTheSameHarmonicResponses()
    {
        var mixed = Load("models/floor-shaker-test.yaml");
        var analogue = Load("Circuits/floor-shaker-test-analogue.yaml");
        // The voltage source 'amplifier' is a load of the mixed model named after it: a 1 m/s (1 V) base motion of its node.
        var source = Assert.Single(mixed.Structure.Loads);
        Assert.Equal("amplifier", source.Name);
        var (ms, asys) = (DampedSystem.Build(mixed.Structure), DampedSystem.Build(analogue.Structure));
        double[] frequencies = [2, 4.5, 5.03, 8.6, 11.7, 25, 40];
        string[] outputs = ["bay-a", "bay-b", "reaction-mass", "geophone-mass", "sensor-out"];
        var a = HarmonicAnalysis.Sweep(asys, frequencies, [.. analogue.Structure.Loads], outputs, HarmonicMethod.Direct);
        var b = HarmonicAnalysis.Sweep(ms, frequencies, [.. mixed.Structure.Loads], outputs, HarmonicMethod.Direct);
        foreach (var dof in outputs)
        {
            var x = a.Responses.Single(r => r.Dof == dof).Displacement;
            var y = b.Responses.Single(r => r.Dof == dof).Displacement;
            for (var k = 0; k < frequencies.Length; k++)
            {
                var tolerance = new Tolerance(1e-10 * x[k].Magnitude, 0);
                NumericAssert.Close(x[k].Real, y[k].Real, tolerance, $"{dof} at {frequencies[k]} Hz (real)");
                NumericAssert.Close(x[k].Imaginary, y[k].Imaginary, tolerance, $"{dof} at {frequencies[k]} Hz (imaginary)");
            }
        }
        Assert.True(b.Responses.Single(r => r.Dof == "sensor-out").Displacement.All(z => z != Complex.Zero), "the sensor reads something");
    }
}
