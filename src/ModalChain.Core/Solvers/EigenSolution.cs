using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;

namespace ModalChain.Core.Solvers;

/// <summary>Eigenpairs of K φ = λ M φ, ascending in λ = ω² (rad²/s²), with mass-normalised shapes.</summary>
/// <param name="EigenValues">λ_j = ω_j² in rad²/s², ascending; tiny negative round-off is kept as computed.</param>
/// <param name="Shapes">Column j is φ_j with φ_jᵀ M φ_j = 1 and its largest-magnitude entry positive.</param>
/// <param name="Algorithm">Name of the algorithm that produced the pairs.</param>
public sealed record EigenSolution(ImmutableArray<double> EigenValues, Matrix<double> Shapes, string Algorithm)
{
    /// <summary>Number of eigenpairs.</summary>
    public int Count => EigenValues.Length;
}

/// <summary>A named algorithm for the symmetric-definite generalized eigenproblem K φ = λ M φ.</summary>
public interface IGeneralizedEigenSolver
{
    /// <summary>Name printed in results so a reviewer knows which method produced the modes.</summary>
    string Name { get; }

    /// <summary>The lowest <paramref name="count"/> eigenpairs.</summary>
    /// <param name="stiffness">Symmetric positive semi-definite K (N/m).</param>
    /// <param name="mass">Symmetric positive definite M (kg).</param>
    /// <param name="count">How many of the lowest pairs to return, 1..n.</param>
    /// <param name="massIsDiagonal">True when M is diagonal; lets the solver skip a Cholesky factorisation.</param>
    EigenSolution Solve(Matrix<double> stiffness, Matrix<double> mass, int count, bool massIsDiagonal);
}
