using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Dofs;

namespace ModalChain.Core.Assembly;

/// <summary>The mass, stiffness and damping matrices of a network over its free degrees of freedom.</summary>
/// <remarks>
/// Matrices are stored sparse (compressed rows) so that large models fit; <see cref="Matrix{T}.ToArray"/> or
/// <c>DenseMass</c> and friends give dense copies for small models. M is diagonal for lumped masses.
/// Units: M in kg, K in N/m, C in N·s/m.
/// </remarks>
/// <param name="Dofs">The degree-of-freedom numbering.</param>
/// <param name="Mass">Mass matrix M in kg.</param>
/// <param name="Stiffness">Stiffness matrix K in N/m.</param>
/// <param name="Damping">Viscous damping matrix C in N·s/m from discrete dampers.</param>
/// <param name="Influence">Rigid-body influence vector ι: unit motion of every free DOF in the network's direction.</param>
/// <param name="MassIsDiagonal">True when M has no off-diagonal entries (always, for lumped masses).</param>
public sealed record StructuralMatrices(
    DofMap Dofs,
    Matrix<double> Mass,
    Matrix<double> Stiffness,
    Matrix<double> Damping,
    Vector<double> Influence,
    bool MassIsDiagonal)
{
    /// <summary>Number of free degrees of freedom.</summary>
    public int Size => Dofs.Count;

    /// <summary>Dense copy of M.</summary>
    public Matrix<double> DenseMass() => Matrix<double>.Build.DenseOfMatrix(Mass);

    /// <summary>Dense copy of K.</summary>
    public Matrix<double> DenseStiffness() => Matrix<double>.Build.DenseOfMatrix(Stiffness);

    /// <summary>Dense copy of C.</summary>
    public Matrix<double> DenseDamping() => Matrix<double>.Build.DenseOfMatrix(Damping);
}
