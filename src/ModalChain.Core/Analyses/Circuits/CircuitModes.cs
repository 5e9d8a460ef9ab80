using System.Collections.Immutable;
using System.Numerics;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Circuits;

/// <summary>What a root of a circuit's free response stands for.</summary>
public enum CircuitRootKind
{
    /// <summary>A zero root: the DC level of a part no inductor (or resistor) ties to ground, like a rigid-body mode; never an oscillation.</summary>
    DcLevel,
    /// <summary>A complex pair: a decaying oscillation with a natural frequency, damping ratio and Q factor.</summary>
    Oscillation,
    /// <summary>A real negative root: an exponential relaxation with a time constant.</summary>
    Relaxation,
}

/// <summary>One root of the circuit with every source switched off (voltage sources shorted, current sources open).</summary>
/// <param name="Number">1-based number in ascending |s|.</param>
/// <param name="Kind">What the root stands for.</param>
/// <param name="Root">s in 1/s; the free response is e^{st}. For an oscillation the root with Im s &gt; 0.</param>
/// <param name="NaturalFrequencyHz">|s|/2π in Hz (ω₀/2π of an oscillation); 0 for a DC level.</param>
/// <param name="DampedFrequencyHz">Im s/2π in Hz for an oscillation; 0 otherwise.</param>
/// <param name="DampingRatio">ζ = −Re s/|s| for an oscillation; NaN otherwise.</param>
/// <param name="QualityFactor">Q = 1/(2ζ) for an oscillation; NaN otherwise (infinite for a lossless one).</param>
/// <param name="TimeConstant">τ = −1/s in s for a relaxation; NaN otherwise.</param>
public sealed record CircuitRoot(int Number, CircuitRootKind Kind, Complex Root, double NaturalFrequencyHz,
    double DampedFrequencyHz, double DampingRatio, double QualityFactor, double TimeConstant);

/// <summary>The natural frequencies, damping ratios, Q factors and time constants of a circuit.</summary>
/// <remarks>
/// The eigenvalues of the free part of F in <see cref="CircuitStateSpace"/> (the prescribed source fluxes left out:
/// sources switched off). The <see cref="CircuitTopology.ZeroRootCount"/> smallest roots are the DC levels, counted
/// from the topology rather than judged by size; a pair whose imaginary parts are below 1e-7 of its magnitude is taken
/// as two real roots (critical damping rounds to such a pair). A series RLC gives ω₀ = 1/√(LC), ζ = (R/2)√(C/L).
/// </remarks>
public static class CircuitModes
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
