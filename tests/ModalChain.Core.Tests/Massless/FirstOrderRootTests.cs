using System.Numerics;
using ModalChain.Core.Analyses.FirstOrder;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Massless;

/// <summary>Roots of damped models with first-order states against closed forms.</summary>
public class FirstOrderRootTests
{
    [Theory]
    [InlineData(100.0, 4e4, 2e4)]   // c large against √(km): an oscillatory pair
    [InlineData(100.0, 4e4, 50.0)]  // c small: two real roots, the fast one the mount's relaxation
    [InlineData(2.5, 9e6, 1e3)]
    public void MassOnMaxwellMount_RootsAreZeroAndTheQuadraticOfTheCubic(double m, double k, double c)
    {
        // Derivation (closed form; docs/methods.md "Massless nodes and mounts"): m x'' + k(x − y) = 0 and
        // c y' + k(y − x) = 0 give (m s² + k)(c s + k) − k² = s(m c s² + m k s + k c) = 0: a zero root (the mount has no
        // static stiffness, so the mass can rest anywhere) and the roots of m c s² + m k s + k c.
        var network = MasslessTestKit.MassOnMaxwell(m, k, c);
        var system = DampedSystem.Build(new StructuralModel(network, DampingModel.None, []));
        var roots = ComplexModes.Solve(system);
        var (r1, r2) = MasslessTestKit.QuadraticRoots(m * c, m * k, k * c);
        var expected = r1.Imaginary != 0 ? new[] { r1.Imaginary > 0 ? r1 : r2 } : new[] { r1, r2 };
        Assert.Equal(1 + expected.Length, roots.Length);
        Assert.Equal(ComplexModeKind.RigidBody, roots[0].Kind);
        var found = roots.Skip(1).Select(r => r.EigenValue).ToArray();
        foreach (var e in expected)
        {
            var nearest = found.MinBy(v => (v - e).Magnitude);
            NumericAssert.Small((nearest - e).Magnitude, 1e-10 * e.Magnitude, $"root {e}");
        }
        if (r1.Imaginary == 0 && c * c < 0.01 * m * k)
        {
            // With c ≪ √(mk) the roots split into −k/c·(1 + …), the creep of the spring through the damper (a
            // relaxation), and ≈ −c/m, the mass coasting to rest on the damper (overdamped motion of the mass).
            var fast = roots.Skip(1).MaxBy(r => r.EigenValue.Magnitude)!;
            var slow = roots.Skip(1).MinBy(r => r.EigenValue.Magnitude)!;
            Assert.Equal(ComplexModeKind.Relaxation, fast.Kind);
            Assert.Equal(ComplexModeKind.Elastic, slow.Kind);
        }
    }

    [Theory]
    [InlineData(8e4, 400.0)]
    [InlineData(1.0, 1e-3)]
    public void SpringAndDamperInSeries_WithNoMassAnywhere_RelaxWithRootMinusKOverC(double k, double c)
    {
        // Closed form: a massless node between a spring k (to one support) and a damper c (to another) obeys
        // c y' + k y = 0, so its one root is λ = −k/c, time constant τ = c/k.
        var network = new NetworkBuilder { Title = "spring and damper in series" }
            .AddSupport("wall").AddNode("joint")
            .AddSpring("k", "wall", "joint", k).AddDamper("c", "joint", Network.Ground, c)
            .Build();
        var p = SupportPartition.Assemble(network);
        var system = FirstOrderSystem.Build(p.Mass, p.DamperFF, p.StiffnessFF);
        Assert.Equal(1, system.Order);
        var root = Assert.Single(system.ComplexModes());
        Assert.Equal(ComplexModeKind.Relaxation, root.Kind);
        NumericAssert.Close(-k / c, root.EigenValue.Real, Tolerance.Rel(1e-12), "λ");
        NumericAssert.Close(0, root.EigenValue.Imaginary, Tolerance.Abs(0), "Im λ");
    }

    [Fact]
    public void StandardLinearSolid_RootsAreTheCubicOfItsCharacteristicEquation()
    {
        // Closed form: (m s² + k1 + k2)(c s + k2) − k2² = m c s³ + m k2 s² + (k1 + k2) c s + k1 k2 = 0. Each root
        // found must make the cubic vanish to round-off relative to its largest term, and there are three of them.
        double m = 80, k1 = 5e4, k2 = 1.5e5, c = 900;
        var system = DampedSystem.Build(new StructuralModel(MasslessTestKit.MassOnStandardLinearSolid(m, k1, k2, c), DampingModel.None, []));
        var roots = ComplexModes.Solve(system);
        var all = roots.SelectMany(r => r.IsOscillatory ? new[] { r.EigenValue, Complex.Conjugate(r.EigenValue) } : [r.EigenValue]).ToArray();
        Assert.Equal(3, all.Length);
        foreach (var s in all)
        {
            var terms = new[] { m * c * s * s * s, m * k2 * s * s, (k1 + k2) * c * s, (Complex)(k1 * k2) };
            var value = terms.Aggregate(Complex.Zero, (a, b) => a + b);
            NumericAssert.Small(value.Magnitude, 1e-12 * terms.Max(t => t.Magnitude), $"cubic at {s}");
        }
    }

    [Fact]
    public void DamperBetweenTwoMasslessNodesOnly_IsRefusedWithTheNodesNamed()
    {
        // Common practice: a massless group joined to the rest by no damper path has a singular C_dd and no
        // defined first-order motion; the state-space form must say so, never return wrong roots.
        var network = new NetworkBuilder { Title = "floating damper" }
            .AddMass("m", 10).AddNode("p").AddNode("q")
            .AddSpring("k", Network.Ground, "m", 1e4).AddDamper("c", "p", "q", 100)
            .Build();
        var pt = SupportPartition.Assemble(network);
        var ex = Assert.Throws<NumericalFailureException>(() => FirstOrderSystem.Build(pt.Mass, pt.DamperFF, pt.StiffnessFF, pt.Free.Label));
        Assert.Contains("'p'", ex.Message, StringComparison.Ordinal);
        Assert.Contains("singular", ex.Message, StringComparison.Ordinal);
    }
}
