using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;

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
/// <param name="Influence">
/// Rigid-body influence vector ι: unit motion of every free DOF in the network's direction (line models); in plane and
/// 3d models the vertical one, ι_z (see <see cref="Influences"/> for every direction).
/// </param>
/// <param name="MassIsDiagonal">True when M has no off-diagonal entries (always, for lumped masses).</param>
public sealed record StructuralMatrices(
    DofMap Dofs,
    Matrix<double> Mass,
    Matrix<double> Stiffness,
    Matrix<double> Damping,
    Vector<double> Influence,
    bool MassIsDiagonal)
{
    private readonly ImmutableArray<DirectionalInfluence> _influences;

    /// <summary>Number of free degrees of freedom.</summary>
    public int Size => Dofs.Count;

    /// <summary>
    /// The influence vector of every direction of the space: [Along → <see cref="Influence"/>] in line models; in plane and 3d
    /// models a unit rigid translation per translation and a unit rigid rotation about <see cref="ReferencePoint"/>
    /// per rotation (θ = 1 on bodies, u = e × (x − o) on masses and body centres), in the order x, y, z, rx, ry, rz.
    /// </summary>
    public ImmutableArray<DirectionalInfluence> Influences
    {
        get => _influences.IsDefaultOrEmpty ? [new DirectionalInfluence(Direction.Along, Influence)] : _influences;
        init => _influences = value;
    }

    /// <summary>The point o (m) the rotational influence vectors turn about: the model's centre of mass unless stated; null in line models.</summary>
    public Point3? ReferencePoint { get; init; }

    /// <summary>The influence vector of <paramref name="direction"/>, or null when the space has no such direction.</summary>
    public Vector<double>? InfluenceIn(Direction direction) => Influences.FirstOrDefault(i => i.Direction == direction)?.Vector;

    /// <summary>Dense copy of M.</summary>
    public Matrix<double> DenseMass() => Matrix<double>.Build.DenseOfMatrix(Mass);

    /// <summary>Dense copy of K.</summary>
    public Matrix<double> DenseStiffness() => Matrix<double>.Build.DenseOfMatrix(Stiffness);

    /// <summary>Dense copy of C.</summary>
    public Matrix<double> DenseDamping() => Matrix<double>.Build.DenseOfMatrix(Damping);
}

/// <summary>The rigid-body influence vector of one direction.</summary>
/// <param name="Direction">The translation (unit motion, m) or rotation (unit rotation, rad, about the reference point).</param>
/// <param name="Vector">ι over the free DOFs (dimensionless for translations; m/rad on translations and 1 on rotations for a rotation).</param>
public sealed record DirectionalInfluence(Direction Direction, Vector<double> Vector);
