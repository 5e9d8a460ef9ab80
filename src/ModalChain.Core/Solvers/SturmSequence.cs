using MathNet.Numerics.LinearAlgebra;

namespace ModalChain.Core.Solvers;

/// <summary>The number of eigenvalues of K φ = λ M φ below a value, from the inertia of K − σM (the Sturm sequence check).</summary>
/// <remarks>
/// With K − σM = P L D Lᵀ Pᵀ, Sylvester's law of inertia makes the number of negative entries of D equal to the
/// number of negative eigenvalues of K − σM, which for M positive definite is the number of eigenvalues λ &lt; σ
/// (Bathe, Finite Element Procedures, 1996, §11.4.3; Grimes, Lewis &amp; Simon, 1994, SIAM J. Matrix Anal. Appl.
/// 15(1), §2). One sparse factorisation, no eigenvectors: this is how a solver proves it missed no mode.
/// </remarks>
public static class SturmSequence
{
    /// <summary>The number of eigenvalues λ = ω² (rad²/s²) of K φ = λ M φ strictly below <paramref name="eigenvalue"/>.</summary>
    /// <param name="stiffness">Symmetric K in N/m.</param>
    /// <param name="mass">Symmetric positive definite M in kg.</param>
    /// <param name="eigenvalue">The value σ in rad²/s²; should not coincide with an eigenvalue.</param>
    public static int CountBelow(Matrix<double> stiffness, Matrix<double> mass, double eigenvalue)
    {
        ArgumentNullException.ThrowIfNull(stiffness);
        ArgumentNullException.ThrowIfNull(mass);
        Guard.Square(stiffness.RowCount, stiffness.ColumnCount, "K");
        Guard.SameSize(stiffness.RowCount, mass.RowCount, "K", "M");
        Guard.Finite(eigenvalue);
        var k = SymmetricSparseMatrix.From(stiffness);
        var m = SymmetricSparseMatrix.From(mass);
        return CountBelow(SparseLdltPattern.Analyse(k, m), k, m, eigenvalue);
    }

    /// <summary>The count on an already analysed pattern; a near-zero pivot moves σ by a few parts in 10⁹ and tries again.</summary>
    internal static int CountBelow(SparseLdltPattern pattern, SymmetricSparseMatrix k, SymmetricSparseMatrix m, double eigenvalue)
    {
        NumericalFailureException? last = null;
        foreach (var nudge in (ReadOnlySpan<double>)[0, -1e-9, 1e-9, -3e-9])
        {
            var sigma = eigenvalue + nudge * Math.Max(Math.Abs(eigenvalue), double.Epsilon);
            try { return SparseLdlt.Factor(pattern, k, -sigma, m).NegativePivots; }
            catch (NumericalFailureException e) { last = e; }
        }
        throw new NumericalFailureException($"The Sturm count at λ = {eigenvalue:G6} rad²/s² failed: {last!.Message}", last);
    }
}
