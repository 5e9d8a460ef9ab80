using System.Numerics;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;

namespace ModalChain.Core.Tests.Massless;

/// <summary>Small networks with massless nodes and an independent dense complex solve, shared by the massless tests.</summary>
internal static class MasslessTestKit
{
    /// <summary>A mass m on a Maxwell element to ground: spring k from the mass to a massless node, damper c from it to ground.</summary>
    public static Network MassOnMaxwell(double m, double k, double c) =>
        new NetworkBuilder { Title = "mass on a Maxwell mount" }
            .AddMass("m", m).AddMass("inner", 0)
            .AddSpring("k", "m", "inner", k).AddDamper("c", "inner", Network.Ground, c)
            .Build();

    /// <summary>
    /// A mass m on a standard linear solid to ground: the long-term spring k1 from the mass to ground in parallel with
    /// a Maxwell branch (spring k2 to a massless node, damper c from it to ground).
    /// </summary>
    public static Network MassOnStandardLinearSolid(double m, double k1, double k2, double c) =>
        new NetworkBuilder { Title = "mass on a standard linear solid" }
            .AddMass("m", m).AddMass("inner", 0)
            .AddSpring("k1", "m", Network.Ground, k1)
            .AddSpring("k2", "m", "inner", k2).AddDamper("c", "inner", Network.Ground, c)
            .Build();

    /// <summary>
    /// The reference harmonic solve written here: the dense complex dynamic stiffness K − ω²M + iωC assembled element
    /// by element from the network (independent of the library's assembly) and solved by Math.NET's complex LU.
    /// Returns the amplitude at every mass (declaration order) for unit-phase forces given per mass name.
    /// </summary>
    public static Complex[] DenseSolve(Network network, double omega, IReadOnlyDictionary<string, Complex> forces)
    {
        var names = network.Masses.Select(m => m.Name).ToList();
        var n = names.Count;
        var z = Matrix<Complex>.Build.Dense(n, n);
        void Add(string a, string b, Complex value)
        {
            int i = names.IndexOf(a), j = names.IndexOf(b);
            if (i >= 0) z[i, i] += value;
            if (j >= 0) z[j, j] += value;
            if (i >= 0 && j >= 0) { z[i, j] -= value; z[j, i] -= value; }
        }
        for (var i = 0; i < n; i++) z[i, i] -= omega * omega * network.Masses[i].Kilograms;
        foreach (var s in network.Springs) Add(s.NodeA, s.NodeB, s.Stiffness);
        foreach (var d in network.Dampers) Add(d.NodeA, d.NodeB, new Complex(0, omega * d.Coefficient));
        foreach (var b in network.Inerters) Add(b.NodeA, b.NodeB, -omega * omega * b.Inertance);
        var f = MathNet.Numerics.LinearAlgebra.Vector<Complex>.Build.Dense(n);
        foreach (var (name, value) in forces) f[names.IndexOf(name)] = value;
        return [.. z.LU().Solve(f)];
    }

    /// <summary>Roots of a x² + b x + c = 0 (real coefficients), the larger-magnitude one first, computed without cancellation.</summary>
    public static (Complex, Complex) QuadraticRoots(double a, double b, double c)
    {
        var disc = b * b - 4 * a * c;
        if (disc >= 0)
        {
            var q = -0.5 * (b + Math.Sign(b) * Math.Sqrt(disc));
            return (new Complex(q / a, 0), new Complex(c / q, 0));
        }
        var re = -b / (2 * a);
        var im = Math.Sqrt(-disc) / (2 * a);
        return (new Complex(re, im), new Complex(re, -im));
    }

    /// <summary>The free-DOF matrices of a line network (M, C of the dampers, K).</summary>
    public static SupportPartition Partition(Network network) => SupportPartition.Assemble(network);
}
