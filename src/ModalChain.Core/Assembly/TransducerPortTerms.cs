using System.Collections.Immutable;
using System.Numerics;
using ModalChain.Core.Model;

namespace ModalChain.Core.Assembly;

/// <summary>
/// One term of a port quantity: <see cref="Weight"/> times the <see cref="Derivative"/>-th time derivative of the
/// coordinate of <see cref="Node"/> (any node: an eliminated one is resolved through <see cref="ConstraintElimination"/>).
/// </summary>
/// <param name="Node">A mass, massless node or support.</param>
/// <param name="Derivative">0 displacement (flux linkage), 1 velocity (voltage), 2 acceleration.</param>
/// <param name="Weight">The weight: Bl in T·m for a voltage; 1/L, 1/R or C (the element's value) for a current.</param>
/// <param name="FromSpring">True for a term of a spring (an inductor): a harmonic sweep multiplies it by 1 + iη like the spring itself.</param>
public readonly record struct PortTerm(string Node, int Derivative, double Weight, bool FromSpring);

/// <summary>A transducer's port voltage and port current as linear combinations of node coordinates and their derivatives.</summary>
/// <param name="Transducer">The transducer.</param>
/// <param name="Voltage">u = Bl·(ẋ_a − ẋ_b) in V.</param>
/// <param name="Current">i, in A: the current the transducer drives out of its branch terminal n1 into the circuit (and takes back at n2).</param>
public sealed record TransducerPort(Transducer Transducer, ImmutableArray<PortTerm> Voltage, ImmutableArray<PortTerm> Current);

/// <summary>The port terms of every transducer of a line network (<see cref="Of"/>).</summary>
/// <remarks>
/// <para>Port voltage: u = λ̇_n1 − λ̇_n2 = Bl·(ẋ_a − ẋ_b) (the transducer's constraint, differentiated).</para>
/// <para>
/// Port current: the constraint's multiplier μ, the current the transducer drives out of n1 into the circuit (and
/// takes back in at n2); its force on the mechanical pair is −Bl·i on a and +Bl·i on b, so the power it delivers to
/// the circuit, u·i, is exactly the power Bl·i·(ẋ_a − ẋ_b) it takes from the mechanical side. It is read by Kirchhoff's
/// current law at the node e the transducer eliminates (n1, or n2 when n1 is a support), where the transducer's
/// current is the only source besides the elements: i = σ·Σ over the elements at e of the current leaving e through
/// each, with σ = +1 for e = n1 and −1 for e = n2. An inductor 1/L to node o carries (1/L)(λ_e − λ_o), a resistor
/// (1/R)(λ̇_e − λ̇_o), a capacitor (inerter C) C(λ̈_e − λ̈_o), and a capacitance to ground at e (its mass) C·λ̈_e.
/// Loads never act at an eliminated node (the reader refuses them), so no source current enters there.
/// </para>
/// <para>
/// The current is read from the elements only: damping that the model adds as a whole (modal damping ratios, Rayleigh
/// damping) is not in it, while a structural loss factor multiplies the inductors'
/// terms as it multiplies their stiffness.
/// </para>
/// </remarks>
public static class TransducerPortTerms
{
    private static readonly System.Runtime.CompilerServices.ConditionalWeakTable<Network, object> Table = new();

    /// <summary>The port terms of every transducer of <paramref name="network"/>, in declaration order (empty without transducers).</summary>
    public static ImmutableArray<TransducerPort> Of(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        if (ConstraintElimination.Of(network) is not { } elimination) return [];
        return (ImmutableArray<TransducerPort>)Table.GetValue(network, n => Build(n, elimination));
    }

    /// <summary>The complex amplitude of a port quantity at angular frequency <paramref name="omega"/> in rad/s.</summary>
    /// <param name="terms">The quantity's terms.</param>
    /// <param name="omega">Angular frequency in rad/s.</param>
    /// <param name="springFactor">The factor on spring terms (1 + iη with the structural loss factor η).</param>
    /// <param name="displacement">The complex displacement (flux) amplitude of any node, eliminated ones included.</param>
    public static Complex Harmonic(ImmutableArray<PortTerm> terms, double omega, Complex springFactor, Func<string, Complex> displacement)
    {
        ArgumentNullException.ThrowIfNull(displacement);
        var iw = new Complex(0, omega);
        var sum = Complex.Zero;
        foreach (var t in terms)
        {
            var factor = t.Derivative switch { 0 => t.FromSpring ? springFactor : Complex.One, 1 => iw, _ => iw * iw };
            sum += t.Weight * factor * displacement(t.Node);
        }
        return sum;
    }

    private static object Build(Network network, ConstraintElimination elimination)
    {
        var result = ImmutableArray.CreateBuilder<TransducerPort>(elimination.Nodes.Length);
        var massOf = network.Masses.ToDictionary(m => m.Name, m => m.Kilograms, StringComparer.Ordinal);
        foreach (var e in elimination.Nodes)
        {
            var t = e.Transducer;
            var sigma = e.Node == t.BranchA ? 1.0 : -1.0;
            var current = ImmutableArray.CreateBuilder<PortTerm>();
            void Element(string a, string b, int derivative, double value, bool spring)
            {
                if (a != e.Node && b != e.Node) return;
                var other = a == e.Node ? b : a;
                current.Add(new PortTerm(e.Node, derivative, sigma * value, spring));
                current.Add(new PortTerm(other, derivative, -sigma * value, spring));
            }
            foreach (var s in network.Springs) Element(s.NodeA, s.NodeB, 0, s.Stiffness, spring: true);
            foreach (var d in network.Dampers) Element(d.NodeA, d.NodeB, 1, d.Coefficient, spring: false);
            foreach (var b in network.Inerters) Element(b.NodeA, b.NodeB, 2, b.Inertance, spring: false);
            if (massOf.GetValueOrDefault(e.Node) is > 0 and var c) current.Add(new PortTerm(e.Node, 2, sigma * c, false));
            result.Add(new TransducerPort(t,
                [new PortTerm(t.NodeA, 1, t.ForceFactor, false), new PortTerm(t.NodeB, 1, -t.ForceFactor, false)],
                current.ToImmutable()));
        }
        return result.ToImmutable();
    }

    /// <summary>
    /// An electrical element (an end on an electrical node) or a capacitance on an eliminated node, with the weight (±1)
    /// of each support its current reaches, through its own end or through the other branch terminal of the transducer
    /// that eliminates its end: its force f times that weight is the share of the support's reaction that is a current,
    /// not a force (NodeB null for a capacitance to ground).
    /// </summary>
    internal sealed record ElectricalElement(string NodeA, string? NodeB, int Derivative, double Value, Dictionary<string, double> Weights)
    {
        public double Weight(string support) => Weights.GetValueOrDefault(support);
    }

    internal static ImmutableArray<ElectricalElement> ElectricalShares(Network network, ConstraintElimination? elimination)
    {
        // An electrical element's current reaches a support through its own end there, or, when that end is a node a
        // transducer eliminates (λ_e = λ_other ± Bl·(x_a − x_b)), through the branch's other terminal (weight 1). The
        // share that reaches the mechanical pair through ±Bl is the transducer's force Bl·i: newtons, kept in the reaction.
        var result = ImmutableArray.CreateBuilder<ElectricalElement>();
        void Current(string node, double sign, Dictionary<string, double> weights)
        {
            if (elimination?.Find(node) is { } e)
                node = e.Transducer.BranchA == e.Node ? e.Transducer.BranchB : e.Transducer.BranchA;
            if (network.IsSupport(node)) weights[node] = weights.GetValueOrDefault(node) + sign;
        }
        void Add(string a, string? b, int derivative, double value)
        {
            if (!network.IsElectrical(a) && (b is null || !network.IsElectrical(b))) return;
            var weights = new Dictionary<string, double>(StringComparer.Ordinal);
            Current(a, 1, weights);
            if (b is not null) Current(b, -1, weights);
            if (weights.Values.Any(w => w != 0)) result.Add(new ElectricalElement(a, b, derivative, value, weights));
        }
        foreach (var x in network.Springs) Add(x.NodeA, x.NodeB, 0, x.Stiffness);
        foreach (var x in network.Dampers) Add(x.NodeA, x.NodeB, 1, x.Coefficient);
        foreach (var x in network.Inerters) Add(x.NodeA, x.NodeB, 2, x.Inertance);
        // A capacitance to ground on an eliminated node: its current returns to ground, reaching the other terminal's support.
        if (elimination is not null)
            foreach (var m in network.Masses)
                if (m.Kilograms > 0 && elimination.IsEliminated(m.Name)) Add(m.Name, null, 2, m.Kilograms);
        return result.ToImmutable();
    }
}
