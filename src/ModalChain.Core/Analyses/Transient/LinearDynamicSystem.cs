using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;

namespace ModalChain.Core.Analyses.Transient;

/// <summary>Writes the load vector f(t) in N at time <paramref name="time"/> (s) into <paramref name="force"/>, which the caller owns.</summary>
public delegate void LoadVector(double time, Span<double> force);

/// <summary>The linear equations of motion M ü + C u̇ + K u = f(t) that the time integrators advance.</summary>
/// <param name="Mass">Mass matrix M in kg, symmetric positive definite.</param>
/// <param name="Damping">Viscous damping matrix C in N·s/m, symmetric positive semi-definite.</param>
/// <param name="Stiffness">Stiffness matrix K in N/m, symmetric positive semi-definite.</param>
public sealed record LinearDynamicSystem(Matrix<double> Mass, Matrix<double> Damping, Matrix<double> Stiffness)
{
    /// <summary>Number of degrees of freedom.</summary>
    public int Size => Mass.RowCount;

    internal void CheckShapes()
    {
        Guard.Square(Mass.RowCount, Mass.ColumnCount, "M");
        Guard.Square(Damping.RowCount, Damping.ColumnCount, "C");
        Guard.Square(Stiffness.RowCount, Stiffness.ColumnCount, "K");
        Guard.SameSize(Mass.RowCount, Stiffness.RowCount, "M", "K");
        Guard.SameSize(Mass.RowCount, Damping.RowCount, "M", "C");
    }
}

/// <summary>One term of a load written as a fixed spatial distribution times a scalar function of time.</summary>
/// <param name="Distribution">Non-zero entries of the distribution: DOF index and weight (dimensionless, or m·e in kg·m for an unbalance).</param>
/// <param name="Time">The time function; the term contributes weight × value(t) in N to each listed DOF.</param>
public sealed record LoadTerm(ImmutableArray<(int Dof, double Weight)> Distribution, TimeFunction Time);

/// <summary>A load f(t) = Σⱼ bⱼ gⱼ(t): spatial distributions bⱼ times scalar time functions gⱼ.</summary>
/// <remarks>
/// Keeping the load factored lets modal superposition project each distribution once (Φᵀbⱼ) instead of projecting
/// the whole load vector every step.
/// </remarks>
/// <param name="Size">Number of degrees of freedom of the load vector.</param>
/// <param name="Terms">The terms.</param>
public sealed record LoadSet(int Size, ImmutableArray<LoadTerm> Terms)
{
    /// <summary>Writes f(t) into <paramref name="force"/>; no allocation.</summary>
    public void Evaluate(double time, Span<double> force)
    {
        force.Clear();
        foreach (var term in Terms)
        {
            var g = term.Time.ValueAt(time);
            if (g == 0) continue;
            foreach (var (dof, weight) in term.Distribution) force[dof] += weight * g;
        }
    }

    /// <summary>This load as a <see cref="LoadVector"/> for the integrators.</summary>
    public LoadVector AsLoadVector() => Evaluate;

    /// <summary>A load that is zero at all times.</summary>
    public static LoadSet None(int size) => new(size, []);
}

/// <summary>Receives the state after every step of a time integration; it must not keep the spans.</summary>
public interface IStepSink
{
    /// <summary>Called for step 0 (the initial state) and after each step.</summary>
    /// <param name="step">Step number n, 0..count.</param>
    /// <param name="time">t = n·h in s.</param>
    /// <param name="displacement">u (m) in the integrator's coordinates (physical, or modal for modal superposition).</param>
    /// <param name="velocity">u̇ in m/s, same coordinates.</param>
    /// <param name="acceleration">ü in m/s², same coordinates.</param>
    /// <param name="force">The load f(t) in N, same coordinates.</param>
    void Accept(int step, double time, ReadOnlySpan<double> displacement, ReadOnlySpan<double> velocity,
        ReadOnlySpan<double> acceleration, ReadOnlySpan<double> force);
}

/// <summary>Shared helpers of the integrators.</summary>
internal static class Integration
{
    public static void CheckRun(int size, ReadOnlySpan<double> u0, ReadOnlySpan<double> v0, double step, int stepCount)
    {
        if (u0.Length != size || v0.Length != size)
            throw new ArgumentException($"The system has {size} DOFs but the initial state has {u0.Length} displacements and {v0.Length} velocities.");
        Guard.Positive(step, nameof(step));
        if (stepCount < 1) throw new ArgumentOutOfRangeException(nameof(stepCount), stepCount, "At least one step is needed.");
    }

    /// <summary>ü₀ = M⁻¹ (f₀ − C u̇₀ − K u₀): the initial acceleration that satisfies the equations of motion at t = 0.</summary>
    public static void InitialAcceleration(SymmetricSparseMatrix m, SymmetricSparseMatrix c, SymmetricSparseMatrix k,
        ReadOnlySpan<double> f0, ReadOnlySpan<double> u0, ReadOnlySpan<double> v0, Span<double> a0)
    {
        var n = m.Size;
        var rhs = new double[n];
        f0.CopyTo(rhs);
        k.MultiplyAdd(-1, u0, rhs);
        c.MultiplyAdd(-1, v0, rhs);
        if (m.IsDiagonal)
        {
            for (var i = 0; i < n; i++)
            {
                var mii = m[i, i];
                if (!(mii > 0)) throw new NumericalFailureException($"M is not positive definite: diagonal entry {i} is {mii}.");
                a0[i] = rhs[i] / mii;
            }
        }
        else SparseCholesky.Factor(m).Solve(rhs, a0);
    }
}
