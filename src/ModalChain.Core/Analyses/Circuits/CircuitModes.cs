using System.Collections.Immutable;
using System.Numerics;
using ModalChain.Core.Analyses.FirstOrder;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Circuits;

/// <summary>What a root of a circuit's free response stands for.</summary>
public enum CircuitRootKind
{
    /// <summary>A zero root: the voltage level a part keeps when no inductor or resistor ties it to ground or to a source (a charge that stays), like a rigid-body mode; never an oscillation.</summary>
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
/// The roots of the circuit's analogue network (<see cref="CircuitAnalogy.ToNetwork"/>): the eigenvalues
/// (<see cref="FirstOrderRoots"/>) of its first-order form (<see cref="FirstOrderSystem"/>, built from the network's
/// assembled M, C and K with the nodes voltage sources hold as fixed supports: sources switched off), whose state holds
/// two entries per node with capacitance and one per node without. The <see cref="CircuitTopology.ZeroRootCount"/>
/// smallest roots are the network's rigid-body roots, counted from the topology rather than judged by size: of these,
/// the <see cref="CircuitTopology.VoltageLevelCount"/> DC levels are listed, and the flux levels
/// (<see cref="CircuitTopology.FluxLevelCount"/>), which no voltage or current shows, are left out; a pair whose imaginary parts are below 1e-7 of its magnitude is taken as two real roots (critical damping
/// rounds to such a pair). A series RLC gives ω₀ = 1/√(LC), ζ = (R/2)√(C/L).
/// </remarks>
public static class CircuitModes
{
    private const double RealTolerance = 1e-7;

    /// <summary>The roots of the circuit <paramref name="analogy"/> maps, DC levels first, then in ascending |s|.</summary>
    /// <exception cref="NumericalFailureException">The first-order form cannot be built (a group of capacitor-joined nodes with no capacitor to ground or a source node).</exception>
    public static ImmutableArray<CircuitRoot> Solve(CircuitAnalogy analogy)
    {
        ArgumentNullException.ThrowIfNull(analogy);
        if (analogy.FreeCount == 0) return [];
        var partition = SupportPartition.Assemble(analogy.ToNetwork());
        var system = FirstOrderSystem.Build(partition.Mass, partition.DamperFF, partition.StiffnessFF, partition.Free.Label);
        var values = FirstOrderRoots.Of(system);
        var zeros = Math.Min(CircuitTopology.ZeroRootCount(analogy), values.Length);
        var levels = Math.Min(CircuitTopology.VoltageLevelCount(analogy), zeros);
        var ordered = values.OrderBy(v => v.Magnitude).ToList();
        var roots = new List<(CircuitRootKind Kind, Complex S)>();
        for (var i = 0; i < levels; i++) roots.Add((CircuitRootKind.DcLevel, Complex.Zero));
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

    private static CircuitRoot Describe(int number, CircuitRootKind kind, Complex s) => kind switch
    {
        CircuitRootKind.DcLevel => new CircuitRoot(number, kind, Complex.Zero, 0, 0, double.NaN, double.NaN, double.NaN),
        CircuitRootKind.Oscillation => new CircuitRoot(number, kind, s, s.Magnitude / (2 * Math.PI), s.Imaginary / (2 * Math.PI),
            -s.Real / s.Magnitude, s.Real < 0 ? s.Magnitude / (-2 * s.Real) : double.PositiveInfinity, double.NaN),
        _ => new CircuitRoot(number, kind, s, Math.Abs(s.Real) / (2 * Math.PI), 0, double.NaN, double.NaN, -1 / s.Real),
    };
}
