using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Analyses.Harmonic;

/// <summary>Several supports moving differently, solved by partitioning free and prescribed DOFs.</summary>
public class SupportMotionTests
{
    [Fact]
    public void MassBetweenTwoMovingSupports_MatchesHandSolution()
    {
        // m between supports A (k1) and B (k2), undamped: (k1 + k2 − ω²m) X = k1 U1 + k2 U2 (equilibrium of the mass, derived by hand);
        // supports' reactions k_i (X − U_i). Tolerance 1e-12 rel.
        const double m = 20, k1 = 3e4, k2 = 5e4;
        var network = new NetworkBuilder().AddMass("m", m).AddSupport("a").AddSupport("b")
            .AddSpring("ka", "a", "m", k1).AddSpring("kb", "m", "b", k2).Build();
        var u1 = System.Numerics.Complex.FromPolarCoordinates(0.001, 0);
        var u2 = System.Numerics.Complex.FromPolarCoordinates(0.003, Math.PI / 3);
        var system = HarmonicModels.System(network, null,
            new BaseMotionLoad("ua", "a", BaseMotionKind.Displacement, u1.Magnitude, u1.Phase),
            new BaseMotionLoad("ub", "b", BaseMotionKind.Displacement, u2.Magnitude, u2.Phase));
        const double f = 4.5;
        var w2 = Math.Pow(2 * Math.PI * f, 2);
        var expected = (k1 * u1 + k2 * u2) / (k1 + k2 - w2 * m);
        var r = HarmonicAnalysis.Sweep(system, [f], system.Model.Loads, ["m"], HarmonicMethod.Direct);
        NumericAssert.Small((r.Responses[0].Displacement[0] - expected).Magnitude, 1e-12 * expected.Magnitude, "X");
        var ra = r.Reactions.Single(x => x.Support == "a").Force[0];
        NumericAssert.Small((ra - k1 * (expected - u1)).Magnitude, 1e-9 * ra.Magnitude, "reaction at a");
        var springA = r.ElementForces.Single(e => e.Element == "ka").Force[0];
        NumericAssert.Small((springA - k1 * (u1 - expected)).Magnitude, 1e-9 * springA.Magnitude, "force in ka = k(X_a − X_m)");
    }

    [Fact]
    public void Ground_CannotMove()
    {
        var system = HarmonicModels.System(HarmonicModels.Sdof(1, 1, 0.1), null);
        Assert.Throws<ArgumentException>(() => HarmonicAnalysis.Sweep(system, [1],
            [new BaseMotionLoad("g", Network.Ground, BaseMotionKind.Displacement, 1, 0)], ["m"], HarmonicMethod.Direct));
    }
}
