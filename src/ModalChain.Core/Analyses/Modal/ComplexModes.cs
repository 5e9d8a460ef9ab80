using System.Collections.Immutable;
using System.Numerics;
using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Assembly;

namespace ModalChain.Core.Analyses.Modal;

/// <summary>One eigenvalue of the damped system's state-space eigenproblem.</summary>
/// <param name="Number">1-based number in ascending |λ|.</param>
/// <param name="EigenValue">λ in 1/s; the free motion is e^{λt}.</param>
/// <param name="UndampedFrequencyHz">|λ|/2π in Hz.</param>
/// <param name="DampedFrequencyHz">|Im λ|/2π in Hz: the frequency of the decaying free oscillation (0 when not oscillatory).</param>
/// <param name="DampingRatio">ζ = −Re λ / |λ| for an oscillatory root; NaN for a real (overdamped) root.</param>
/// <param name="IsOscillatory">False for a real root (overdamped motion, no oscillation).</param>
public sealed record ComplexMode(int Number, Complex EigenValue, double UndampedFrequencyHz, double DampedFrequencyHz, double DampingRatio, bool IsOscillatory);

/// <summary>Damped natural frequencies and damping ratios of a non-classically damped network.</summary>
/// <remarks>
/// Solves the state-space eigenproblem A z = λ z with z = [x; ẋ] and A = [[0, I], [−M⁻¹K, −M⁻¹C]] (Foss 1958;
/// Meirovitch, Principles and Techniques of Vibrations, §4.14 [from memory]). Each underdamped mode gives a
/// conjugate pair λ = −ζω_n ± iω_n√(1−ζ²); one entry per pair (Im λ &gt; 0) is returned, plus each real root.
/// Zero roots (rigid-body modes) are left out. Only viscous damping enters; a hysteretic loss factor has no
/// time-domain eigenproblem and is ignored here. Dense O((2n)³); meant for models up to a few hundred masses.
/// </remarks>
public static class ComplexModes
{
    /// <summary>The complex modes of <paramref name="system"/> (viscous damping C_ff of every source).</summary>
    public static ImmutableArray<ComplexMode> Solve(DampedSystem system)
    {
        ArgumentNullException.ThrowIfNull(system);
        return Solve(system.Partition.Mass, system.Partition.StiffnessFF, system.Damping.FF);
    }

    /// <summary>The complex modes of M ẍ + C ẋ + K x = 0 with diagonal M in kg, K in N/m and C in N·s/m.</summary>
    public static ImmutableArray<ComplexMode> Solve(Matrix<double> mass, Matrix<double> stiffness, Matrix<double> damping)
    {
        ArgumentNullException.ThrowIfNull(mass);
        ArgumentNullException.ThrowIfNull(stiffness);
        ArgumentNullException.ThrowIfNull(damping);
        var n = mass.RowCount;
        var a = Matrix<double>.Build.Dense(2 * n, 2 * n);
        for (var i = 0; i < n; i++)
        {
            a[i, n + i] = 1;
            var inv = 1 / mass[i, i];
            for (var j = 0; j < n; j++)
            {
                a[n + i, j] = -inv * stiffness[i, j];
                a[n + i, n + j] = -inv * damping[i, j];
            }
        }
        var values = a.Evd().EigenValues;
        var scale = values.Select(v => v.Magnitude).DefaultIfEmpty(0).Max();
        var zero = 1e-9 * Math.Max(scale, 1e-300);
        var imagTolerance = 1e-10 * Math.Max(scale, 1e-300);
        var roots = values
            .Where(v => v.Magnitude > zero)
            .Where(v => v.Imaginary > imagTolerance || Math.Abs(v.Imaginary) <= imagTolerance)
            .OrderBy(v => v.Magnitude)
            .ToArray();
        return [.. roots.Select((v, i) =>
        {
            var oscillatory = Math.Abs(v.Imaginary) > imagTolerance;
            return new ComplexMode(i + 1, oscillatory ? v : new Complex(v.Real, 0), v.Magnitude / (2 * Math.PI),
                oscillatory ? v.Imaginary / (2 * Math.PI) : 0, oscillatory ? -v.Real / v.Magnitude : double.NaN, oscillatory);
        })];
    }
}
