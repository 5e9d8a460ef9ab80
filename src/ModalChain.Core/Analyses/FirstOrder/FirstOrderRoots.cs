using System.Numerics;
using MathNet.Numerics.LinearAlgebra;

namespace ModalChain.Core.Analyses.FirstOrder;

/// <summary>The eigenvalues of a first-order form, computed on a balanced copy of its state matrix.</summary>
public static class FirstOrderRoots
{
    /// <summary>The roots of the free motion (every input held at zero): the eigenvalues of A, balanced first.</summary>
    /// <remarks>
    /// A network's A mixes displacements and velocities whose scales may differ by many orders of magnitude (an electrical
    /// analogue's inverse inductances over capacitances reach 1e8 and more): a diagonal similarity by powers of two evens
    /// the row and column norms first (Parlett and Reinsch, "Balancing a matrix for calculation of eigenvalues and
    /// eigenvectors", Numer. Math. 13 (1969) 293–304), so the small real parts that carry the damping are not lost to the
    /// large entries. The eigenvalues are unchanged; every one is returned, conjugates included, unsorted.
    /// </remarks>
    public static Complex[] Of(FirstOrderSystem system)
    {
        ArgumentNullException.ThrowIfNull(system);
        if (system.Order == 0) return [];
        var a = system.State.Clone();
        if (a.Enumerate().Any(v => !double.IsFinite(v))) throw new NumericalFailureException("the state matrix of the first-order form has a non-finite entry");
        Balance(a);
        return a.Evd(Symmetricity.Asymmetric).EigenValues.ToArray();
    }

    /// <summary>Balances <paramref name="a"/> in place, Ã = D⁻¹ A D with D diagonal in powers of two (exact in floating point); returns D's diagonal.</summary>
    internal static double[] Balance(Matrix<double> a)
    {
        var scale = new double[a.RowCount];
        Array.Fill(scale, 1.0);
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
                scale[i] *= factor;
                for (var j = 0; j < n; j++)
                {
                    a[j, i] *= factor;
                    a[i, j] /= factor;
                }
            }
            if (done) return scale;
        }
        return scale;
    }
}
