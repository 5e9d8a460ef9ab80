using System.Numerics;
using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.TestSupport;
using static ModalChain.Core.Tests.SpatialNetworks;

namespace ModalChain.Core.Tests.Analyses.Criteria;

/// <summary>Vibration limits, machine zones and floor curves measured at DOF labels, body points and bare points of plane and 3d models.</summary>
public class SpatialCriteriaTests
{
    private const double Mass = 250, Kx = 4.0e6, Ky = 6.5e6, Kz = 9.0e6, Force = 1500;

    /// <summary>A point mass on one mount with three orthogonal stiffnesses: three uncoupled single-DOF systems.</summary>
    private static DampedSystem PointMass(double zeta, params Load[] loads)
    {
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddMass(new Mass("m", Mass) { Location = new Point3(0, 0, 0.4) });
        b.AddSpring(new Spring("mount", "m", Network.Ground, Kz) { Components = [K(Direction.X, Kx), K(Direction.Y, Ky), K(Direction.Z, Kz)] });
        return DampedSystem.Build(new StructuralModel(b.Build(), DampingModel.Modal(zeta), [.. loads]));
    }

    private static double NaturalHzX => Math.Sqrt(Kx / Mass) / (2 * Math.PI);

    [Fact]
    public void LimitAtMx_MatchesTheSingleDofClosedForm_AndTheBareMassReportsXAsLargest()
    {
        // Single DOF under a harmonic force: |X| = (F/k)·D, D = [(1−r²)² + (2ζr)²]^(−½); ζ = 0.05, r = 0.5 gives
        // D = 1.330380 (REFERENCES.md §4: Rao ch. 3, Chopra ch. 3 [from memory]). The y and z directions are not loaded.
        var speed = 0.5 * NaturalHzX;
        var system = PointMass(0.05, new ForceLoad("shaker", "m", Force, 0, speed) { Direction = Direction.X });
        var outcome = OperatingPointLimits.Evaluate(system, system.Model.Loads,
        [
            new VibrationLimit("m.x", ResponseQuantity.Displacement, AmplitudeMeasure.Peak, 1e-3),
            new VibrationLimit("m", ResponseQuantity.Velocity, AmplitudeMeasure.Rms, 1e-2),
            new VibrationLimit("m.z", ResponseQuantity.Displacement, AmplitudeMeasure.Peak, 1e-3),
        ]);
        Assert.Empty(outcome.NotEvaluated);
        var x = Force / Kx * 1.330380;
        NumericAssert.Close(x, outcome.Evaluated[0].Value, Tolerance.Rel(1e-6), "peak u_x (D printed to 6 digits)");
        Assert.Null(outcome.Evaluated[0].MeasuredAt);
        NumericAssert.Close(x * 2 * Math.PI * speed / Math.Sqrt(2), outcome.Evaluated[1].Value, Tolerance.Rel(1e-6), "r.m.s. velocity of the largest direction");
        Assert.Equal("m.x", outcome.Evaluated[1].MeasuredAt);
        NumericAssert.Small(outcome.Evaluated[2].Value, 1e-12 * x, "u_z of an x force on uncoupled directions");
    }

    [Fact]
    public void BodyPointVelocity_MatchesTheRigidBodyMotionOfTheBar()
    {
        // The rigid bar of REFERENCES.md §10 (plane model): about the centre of mass K = [[40000, 15000], [15000, 67500]]
        // in (z, θ_y), M = diag(1000, 810); undamped, a force F in z at the front point (x = +1.0 m) gives the generalised
        // force (F, −1.0·F). The rear point (x = −1.5 m) moves u_z = u_cz + (θ × r)_z = u_cz + 1.5 θ_y (u_p = u_c + θ × (p − c)).
        const double f = 800, speed = 0.5; // Hz, below the first mode (0.9325 Hz)
        var net = Bar();
        var system = DampedSystem.Build(new StructuralModel(net, DampingModel.None, [new ForceLoad("push", "bar.front", f, 0, speed) { Direction = Direction.Z }]));
        var w = 2 * Math.PI * speed;
        double a11 = 40000 - w * w * 1000, a12 = 15000, a22 = 67500 - w * w * 810;
        var det = a11 * a22 - a12 * a12;
        var z = (a22 * f - a12 * -f) / det;
        var theta = (a11 * -f - a12 * f) / det;
        var rear = Math.Abs(z + 1.5 * theta);
        var outcome = OperatingPointLimits.Evaluate(system, system.Model.Loads,
        [
            new VibrationLimit("bar.rear.z", ResponseQuantity.Velocity, AmplitudeMeasure.Peak, 1),
            new VibrationLimit("bar.rear", ResponseQuantity.Velocity, AmplitudeMeasure.Peak, 1),
            new VibrationLimit("bar.z", ResponseQuantity.Displacement, AmplitudeMeasure.Peak, 1),
        ]);
        Assert.Empty(outcome.NotEvaluated);
        NumericAssert.Close(w * rear, outcome.Evaluated[0].Value, Tolerance.Rel(1e-9), "rear point velocity ω|u_cz + 1.5 θ_y|");
        NumericAssert.Close(w * rear, outcome.Evaluated[1].Value, Tolerance.Rel(1e-9), "bare point: z governs (no x load)");
        Assert.Equal("bar.rear.z", outcome.Evaluated[1].MeasuredAt);
        NumericAssert.Close(Math.Abs(z), outcome.Evaluated[2].Value, Tolerance.Rel(1e-9), "centre of mass u_z");
    }

    /// <summary>Floor on its beams carrying a bench on isolators: a 3d model whose masses move in z only, or the same as a line model.</summary>
    private static DampedSystem FloorAndBench(bool spatial, double speed)
    {
        var b = new NetworkBuilder { Space = spatial ? ModelSpace.ThreeD : ModelSpace.Line };
        Mass M(string name, double kg, double x) => spatial ? new Mass(name, kg) { Location = new Point3(x, 0, 0), Moves = [Direction.Z] } : new Mass(name, kg);
        Spring S(string name, string a, string bb, double k) => spatial ? new Spring(name, a, bb, k) { Components = [K(Direction.Z, k)] } : new Spring(name, a, bb, k);
        b.AddMass(M("floor", 4000, 0));
        b.AddMass(M("bench", 300, 1));
        b.AddSpring(S("beams", Network.Ground, "floor", 2.2e7));
        b.AddSpring(S("isolators", "floor", "bench", 4.0e5));
        Load load = spatial ? new ForceLoad("pump", "floor", 900, 0, speed) { Direction = Direction.Z } : new ForceLoad("pump", "floor", 900, 0, speed);
        return DampedSystem.Build(new StructuralModel(b.Build(), DampingModel.Modal(0.03), [load]));
    }

    [Fact]
    public void FloorCurveAndMachineZoneOnAZOnlySpatialModel_EqualTheLineModel()
    {
        // Identity: a 3d model whose masses move in z only is the line model of the same chain, so the criteria agree.
        var curve = PublishedLevels.FloorCurve("VC-A")!;
        var zone = PublishedLevels.MachineClass("medium-rigid")!;
        CheckOutcome Check(bool spatial, string at)
        {
            var system = FloorAndBench(spatial, 14.5);
            var criteria = new CriteriaSet(null, []) { Floors = [new FloorCriterion([at], curve)], Zones = [new MachineZoneCriterion([at], zone, 'B')] };
            return CriteriaCheck.Evaluate(system, criteria, system.Model.Loads);
        }
        var line = Check(false, "bench");
        foreach (var at in new[] { "bench", "bench.z" })
        {
            var space = Check(true, at);
            Assert.Empty(space.NotEvaluated);
            var (l, s) = (Assert.Single(line.Floors), Assert.Single(space.Floors));
            Assert.Equal(l.Bands.Select(b => b.Band), s.Bands.Select(b => b.Band));
            NumericAssert.Close([.. l.Bands.Select(b => b.RmsVelocity)], [.. s.Bands.Select(b => b.RmsVelocity)], Tolerance.Rel(1e-9), $"band levels at {at}");
            Assert.Null(s.MeasuredAt); // one translation only: nothing to choose between
            NumericAssert.Close(Assert.Single(line.Zones).RmsVelocity, Assert.Single(space.Zones).RmsVelocity, Tolerance.Rel(1e-9), $"zone velocity at {at}");
        }
    }

    [Fact]
    public void LoadCasesCombine_AtASpatialPoint_AsOnTheLineModel()
    {
        // Identity: the sum rule over two cases at one DOF of a z-only 3d model equals the line model's.
        LimitOutcome Run(bool spatial, string at)
        {
            var system = FloorAndBench(spatial, 14.5);
            var second = spatial ? new ForceLoad("fan", "bench", 200, 0, 23) { Direction = Direction.Z } : new ForceLoad("fan", "bench", 200, 0, 23);
            system = DampedSystem.Build(system.Model with { Loads = [.. system.Model.Loads, second] });
            var cases = new LoadCaseSelection([new LoadCase("pump", ["pump"]), new LoadCase("fan", ["fan"])], CaseCombination.Sum);
            return LoadCaseLimits.Evaluate(system, cases, [new VibrationLimit(at, ResponseQuantity.Velocity, AmplitudeMeasure.Peak, 1e-3)]);
        }
        NumericAssert.Close(Assert.Single(Run(false, "bench").Evaluated).Value, Assert.Single(Run(true, "bench.z").Evaluated).Value, Tolerance.Rel(1e-9), "combined peak velocity");
    }

    [Theory]
    [InlineData("m.rx", "is a rotation")]
    [InlineData("m.q", "is not a mass, body, body point")]
    [InlineData("nowhere", "is not a mass, body, body point")]
    [InlineData("ground", "is a support")]
    public void NamesThatCannotBeMeasured_AreRefusedWithAReason(string at, string reason)
    {
        var points = new MeasuringPoints(PointMass(0.05).Model.Network);
        Assert.Null(points.Resolve(at, out var error, out _));
        Assert.Contains(reason, error, StringComparison.Ordinal);
    }

    [Fact]
    public void ABodyPointWithADirection_IsTheAttachmentRow()
    {
        // u_z at the rear point of the bar = u_cz − r_x θ_y with r_x = −1.5 m (u_p = u_c + θ × (p − c)).
        var point = new MeasuringPoints(Bar()).Resolve("bar.rear.z", out _, out _)!;
        var motion = Assert.Single(point.Motions);
        Assert.Equal("bar.rear.z", motion.Label);
        Assert.Equal(new Complex(1 + 1.5 * 2, 0), motion.Of(d => d switch { "bar.z" => 1, "bar.ry" => 2, _ => throw new ArgumentException(d) }));
        Assert.Equal(["bar.rear.x", "bar.rear.z"], new MeasuringPoints(Bar()).Resolve("bar.rear", out _, out _)!.Motions.Select(m => m.Label));
    }
}
