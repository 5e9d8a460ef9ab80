using System.Collections.Immutable;
using System.Numerics;
using ModalChain.Core.Model;

using ModalChain.Core.Analyses.Circuits;

namespace ModalChain.Core.Tests.Circuits.Reference;

/// <summary>Independent reference for the tests: the roots of a circuit from the eigenvalues of its own state-space form (the production path before it ran on the network engine).</summary>
/// <remarks>
/// The eigenvalues of the free part of F in <see cref="CircuitStateSpace"/> (the prescribed source fluxes left out:
/// sources switched off). The <see cref="CircuitTopology.ZeroRootCount"/> smallest roots are the DC levels, counted
/// from the topology rather than judged by size; a pair whose imaginary parts are below 1e-7 of its magnitude is taken
/// as two real roots (critical damping rounds to such a pair). A series RLC gives ω₀ = 1/√(LC), ζ = (R/2)√(C/L).
/// </remarks>
internal static class ReferenceModes
{
    private const double RealTolerance = 1e-7;

    /// <summary>The roots of <paramref name="space"/>, DC levels first, then in ascending |s|.</summary>
    public static ImmutableArray<CircuitRoot> Solve(CircuitStateSpace space)
    {
        ArgumentNullException.ThrowIfNull(space);
        var k = space.FreeStateCount;
        if (k == 0) return [];
        var f = space.System.SubMatrix(0, k, 0, k);
        if (f.Enumerate().Any(v => !double.IsFinite(v))) throw new NumericalFailureException("The circuit's state matrix has a non-finite entry.");
        Balance(f);
        var values = f.Evd(MathNet.Numerics.LinearAlgebra.Symmetricity.Asymmetric).EigenValues.ToArray();
        var zeros = Math.Min(CircuitTopology.ZeroRootCount(space.Analogy), values.Length);
        var ordered = values.OrderBy(v => v.Magnitude).ToList();
        var roots = new List<(CircuitRootKind Kind, Complex S)>();
        for (var i = 0; i < zeros; i++) roots.Add((CircuitRootKind.DcLevel, Complex.Zero));
        foreach (var s in ordered.Skip(zeros))
        {
            if (Math.Abs(s.Imaginary) > RealTolerance * s.Magnitude)
            {
                if (s.Imaginary > 0) roots.Add((CircuitRootKind.Oscillation, s));
            }
            else roots.Add((CircuitRootKind.Relaxation, new Complex(s.Real, 0)));
        }
        return [.. roots.Select((r, i) => Describe(i + 1, r.Kind, r.S))];
    }

    // Charges (≈ C·V) and fluxes (≈ V·s) differ by many orders of magnitude: a diagonal similarity by powers of two
    // evens the row and column norms first (Parlett and Reinsch, Numer. Math. 13 (1969) 293–304), so the small real
    // parts that carry the damping are not lost to the large entries. The eigenvalues are unchanged.
    private static void Balance(MathNet.Numerics.LinearAlgebra.Matrix<double> a)
    {
        var n = a.RowCount;
        for (var sweep = 0; sweep < 100; sweep++)
        {
            var done = true;
            for (var i = 0; i < n; i++)
            {
                double column = 0, row = 0;
                for (var j = 0; j < n; j++)
                {
                    if (j == i) continue;
                    column += Math.Abs(a[j, i]);
                    row += Math.Abs(a[i, j]);
                }
                if (column == 0 || row == 0) continue;
                var factor = Math.Pow(2, Math.Round(Math.Log2(Math.Sqrt(row / column))));
                if (factor == 1) continue;
                done = false;
                for (var j = 0; j < n; j++)
                {
                    a[j, i] *= factor;
                    a[i, j] /= factor;
                }
            }
            if (done) return;
        }
    }

    private static CircuitRoot Describe(int number, CircuitRootKind kind, Complex s) => kind switch
    {
        CircuitRootKind.DcLevel => new CircuitRoot(number, kind, Complex.Zero, 0, 0, double.NaN, double.NaN, double.NaN),
        CircuitRootKind.Oscillation => new CircuitRoot(number, kind, s, s.Magnitude / (2 * Math.PI), s.Imaginary / (2 * Math.PI),
            -s.Real / s.Magnitude, s.Real < 0 ? s.Magnitude / (-2 * s.Real) : double.PositiveInfinity, double.NaN),
        _ => new CircuitRoot(number, kind, s, Math.Abs(s.Real) / (2 * Math.PI), 0, double.NaN, double.NaN, -1 / s.Real),
    };
}
