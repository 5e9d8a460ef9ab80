using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Harmonic;

/// <summary>
/// Damped multi-mass harmonic responses against a reference written here, independent of src: M, C and K built from
/// the network's element lists and (K(1+iη) − ω²M + iωC) X = F solved by Gaussian elimination in System.Numerics.Complex.
/// </summary>
public class DenseComplexReferenceTests
{
    /// <summary>M, K and C over the masses, in the order of <see cref="Network.Masses"/>, ground and supports left out.</summary>
    private static (double[,] M, double[,] K, double[,] C) Matrices(Network network, RayleighDamping? rayleigh)
    {
        var names = network.Masses.Select(m => m.Name).ToList();
        var n = names.Count;
        double[,] mass = new double[n, n], k = new double[n, n], c = new double[n, n];
        for (var i = 0; i < n; i++) mass[i, i] = network.Masses[i].Kilograms;
        void Add(double[,] a, string nodeA, string nodeB, double value)
        {
            int i = names.IndexOf(nodeA), j = names.IndexOf(nodeB);
            if (i >= 0) a[i, i] += value;
            if (j >= 0) a[j, j] += value;
            if (i >= 0 && j >= 0) { a[i, j] -= value; a[j, i] -= value; }
        }
        foreach (var s in network.Springs) Add(k, s.NodeA, s.NodeB, s.Stiffness);
        foreach (var d in network.Dampers) Add(c, d.NodeA, d.NodeB, d.Coefficient);
        if (rayleigh is not null)
            for (var i = 0; i < n; i++)
                for (var j = 0; j < n; j++) c[i, j] += rayleigh.MassCoefficient * mass[i, j] + rayleigh.StiffnessCoefficient * k[i, j];
        return (mass, k, c);
    }

    /// <summary>Solves A x = b by Gaussian elimination with partial pivoting (Golub &amp; Van Loan, §3.4); A and b are copied.</summary>
    private static Complex[] Solve(Complex[,] a, Complex[] b)
    {
        var n = b.Length;
        a = (Complex[,])a.Clone();
        var x = (Complex[])b.Clone();
        for (var col = 0; col < n; col++)
        {
            var pivot = col;
            for (var r = col + 1; r < n; r++)
                if (a[r, col].Magnitude > a[pivot, col].Magnitude) pivot = r;
            for (var j = 0; j < n; j++) (a[col, j], a[pivot, j]) = (a[pivot, j], a[col, j]);
            (x[col], x[pivot]) = (x[pivot], x[col]);
            for (var r = col + 1; r < n; r++)
            {
                var factor = a[r, col] / a[col, col];
                for (var j = col; j < n; j++) a[r, j] -= factor * a[col, j];
                x[r] -= factor * x[col];
            }
        }
        for (var r = n - 1; r >= 0; r--)
        {
            var s = x[r];
            for (var j = r + 1; j < n; j++) s -= a[r, j] * x[j];
            x[r] = s / a[r, r];
        }
        return x;
    }

    [Fact]
    public void DirectAndModalMethods_MatchTheDenseComplexSolve_OnRandomNonClassicallyDampedNetworks()
    {
        // 12 seeded networks of 3 to 12 masses with discrete dampers (non-classical), half with Rayleigh damping and a loss
        // factor added; a force with a phase and an unbalance (F = m e ω², pointing as −m e (iω)²). Both methods with every
        // mode kept must match the independent solve to 1e-10 of the largest output at each frequency (round-off of two
        // different factorisations of the same matrix; they agree to better than 1e-12).
        for (var seed = 1; seed <= 12; seed++)
        {
            var n = 3 + (seed - 1) % 10;
            var network = HarmonicModels.Random(500 + seed, n, dampers: true);
            var rayleigh = seed % 2 == 0 ? RayleighDamping.FromTargets(0.02, 20, 300) : null;
            var eta = seed % 2 == 0 ? 0.01 : 0.0;
            var force = new ForceLoad("f", $"m{n / 2}", 250, 0.7);
            var unbalance = new UnbalanceLoad("u", $"m{n - 1}", 0.03, null, -0.4);
            var system = HarmonicModels.System(network, new DampingModel([], rayleigh, eta), force, unbalance);
            Assert.False(system.IsClassical);
            var (m, k, c) = Matrices(network, rayleigh);
            var names = HarmonicModels.Names(network);
            var frequencies = new[] { 0.3, 1.7, 4.2, 9.5, 15, 23, 37, 60 }
                .Concat(system.Modes.Modes.Take(4).Select(mode => mode.NaturalFrequencyHz)).ToArray();
            var direct = HarmonicAnalysis.Sweep(system, frequencies, [force, unbalance], names, HarmonicMethod.Direct);
            var modal = HarmonicAnalysis.Sweep(system, frequencies, [force, unbalance], names, HarmonicMethod.Modal, modeCount: n);
            for (var f = 0; f < frequencies.Length; f++)
            {
                var w = 2 * Math.PI * frequencies[f];
                var a = new Complex[n, n];
                for (var i = 0; i < n; i++)
                    for (var j = 0; j < n; j++)
                        a[i, j] = k[i, j] * new Complex(1, eta) - w * w * m[i, j] + new Complex(0, w * c[i, j]);
                var b = new Complex[n];
                b[n / 2] += Complex.FromPolarCoordinates(250, 0.7);
                b[n - 1] += Complex.FromPolarCoordinates(0.03 * w * w, -0.4);
                var reference = Solve(a, b);
                var scale = reference.Max(z => z.Magnitude);
                for (var i = 0; i < n; i++)
                {
                    NumericAssert.Small((direct.Responses[i].Displacement[f] - reference[i]).Magnitude, 1e-10 * scale,
                        $"seed {seed}, direct, {names[i]} at {frequencies[f]:G5} Hz");
                    NumericAssert.Small((modal.Responses[i].Displacement[f] - reference[i]).Magnitude, 1e-10 * scale,
                        $"seed {seed}, modal, {names[i]} at {frequencies[f]:G5} Hz");
                }
            }
        }
    }
}
