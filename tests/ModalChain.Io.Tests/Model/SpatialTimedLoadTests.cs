using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Io.Model;
using ModalChain.TestSupport;
using static ModalChain.Io.Tests.Model.ModelText;

namespace ModalChain.Io.Tests.Model;

/// <summary>Loads with a 'time' function in plane and 3d models: read with their direction like the harmonic loads, and run.</summary>
public class SpatialTimedLoadTests
{
    private static ModelDocument Document(params string[] lines)
    {
        var result = Read(lines);
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        return result.Model!;
    }

    [Fact]
    public void ForcesMomentsUnbalancesAndSupportMotions_AreReadWithTheirDirections()
    {
        var document = Document(
            "space: 3d",
            "supports:",
            "  slab: {at: [0, 0, -0.5]}",
            "bodies:",
            "  skid: {mass: 900 kg, centre-of-mass: [0, 0, 0.5], box: [2 m, 1 m, 1 m], points: {top: [0.2, 0, 1.0]}}",
            "springs:",
            "  mount: {between: [skid, slab], stiffness: {x: 1 kN/mm, y: 1 kN/mm, z: 2 kN/mm}, rotational-stiffness: {rx: 1e5, ry: 1e5, rz: 1e5}}",
            "loads:",
            "  hit: {kind: force, at: skid.top, direction: x, time: {kind: half-sine, amplitude: 2 kN, duration: 5 ms}}",
            "  twist: {kind: force, at: skid, direction: rz, time: {kind: step, value: 300 N*m}}",
            "  start: {kind: unbalance, at: skid.top, plane: [x, y], mass-radius: 10 kg*mm, time: {kind: run-up, from: 0 rpm, to: 1500 rpm, over: 4 s}}",
            "  quake: {kind: base-motion, support: slab, direction: y, time: {kind: sine, amplitude: 0.5 m/s^2, frequency: 3 Hz}}");
        var loads = document.TimedLoads;
        var hit = Assert.IsType<ForceHistory>(loads[0]);
        Assert.Equal(("skid.top", Direction.X), (hit.Mass, hit.Direction));
        var twist = Assert.IsType<ForceHistory>(loads[1]);
        Assert.Equal((Direction.Rz, 300.0), (twist.Direction, ((StepFunction)twist.Time).Value));
        // The unbalance turning in x-y: the ramp along x, and along y the same ramp a quarter turn earlier (θ − π/2).
        var along = loads.OfType<ForceHistory>().Where(l => l.Name == "start").ToList();
        Assert.Equal([Direction.X, Direction.Y], along.Select(l => l.Direction));
        var (rx, ry) = ((UnbalanceSpeedRamp)along[0].Time, (UnbalanceSpeedRamp)along[1].Time);
        NumericAssert.Close(rx.PhaseRadians - Math.PI / 2, ry.PhaseRadians, Tolerance.Abs(1e-15), "quarter-turn phase");
        var quake = Assert.IsType<SupportAccelerationHistory>(loads[^1]);
        Assert.Equal(("slab", Direction.Y), (quake.Support, quake.Direction));
    }

    [Fact]
    public void UnbalanceRunUpInAPlane_ForcesEachDirectionAsItsComponentOfTheRotatingForce()
    {
        // With θ(t) from the run-up, the rotating force is m·e(ω² cos θ + α sin θ) along the first direction and
        // m·e(ω² sin θ − α cos θ) along the second (the derivative of the rotating unbalance's position; common practice).
        var document = Document(
            "space: plane",
            "masses:",
            "  rotor: {mass: 50 kg, at: [0, 0]}",
            "springs:",
            "  mount: {between: [rotor, ground], stiffness: {x: 1 kN/mm, z: 1 kN/mm}}",
            "loads:",
            "  start: {kind: unbalance, at: rotor, plane: [x, z], mass-radius: 10 kg*mm, time: {kind: run-up, from: 0 rpm, to: 600 rpm, over: 2 s}}");
        var along = document.TimedLoads.OfType<ForceHistory>().ToList();
        var ramp = (UnbalanceSpeedRamp)along[0].Time;
        foreach (var t in new[] { 0.3, 1.1, 1.9 })
        {
            var w = ramp.SpeedAt(t);
            var theta = ramp.AngleAt(t);
            var a = ramp.AngularAcceleration;
            NumericAssert.Close(w * w * Math.Cos(theta) + a * Math.Sin(theta), along[0].Time.ValueAt(t), Tolerance.Rel(1e-12), $"x at {t} s");
            NumericAssert.Close(w * w * Math.Sin(theta) - a * Math.Cos(theta), along[1].Time.ValueAt(t), Tolerance.Rel(1e-12), $"z at {t} s");
        }
    }

    [Fact]
    public void StepForceInZOnAZOnly3dModel_EqualsTheLineModel_AndTheSdofStepResponse()
    {
        // Identity: a 3d mass that moves in z only is the line model's mass. Closed form: an undamped single DOF under a
        // suddenly applied force F moves u = F/k (1 − cos ωt) (Chopra, Dynamics of Structures, §4.3); Newmark average
        // acceleration at about 800 steps per period stays within 1e-3 of it relative to the static F/k over 2.5 periods
        // (its period error is about (ωh)²/12).
        const string settings = "transient: {duration: 0.2 s, step: 0.1 ms}";
        var space = Document(
            "space: 3d",
            "masses:",
            "  deck: {mass: 400 kg, at: [0, 0, 0], directions: [z]}",
            "springs:",
            "  legs: {between: [ground, deck], stiffness: {z: 2500 kN/m}}",
            "loads:",
            "  drop: {kind: force, at: deck, direction: z, time: {kind: step, value: 3 kN}}",
            settings);
        var line = Document(
            "masses:",
            "  deck: 400 kg",
            "springs:",
            "  legs: {between: [ground, deck], stiffness: 2500 kN/m}",
            "loads:",
            "  drop: {kind: force, at: deck, time: {kind: step, value: 3 kN}}",
            settings);
        TransientResult Run(ModelDocument d) => TransientAnalysis.Run(DampedSystem.Build(d.Structure), d.TimedLoads, [], d.Transient!.Settings);
        var (s, l) = (Run(space), Run(line));
        var us = s.Get("deck", ResponseQuantity.Displacement);
        var ul = l.Get("deck", ResponseQuantity.Displacement);
        NumericAssert.Close([.. ul.Values], [.. us.Values], Tolerance.Rel(1e-12), "3d z-only against the line model");
        var omega = Math.Sqrt(2.5e6 / 400);
        var statik = 3000 / 2.5e6;
        for (var k = 0; k < s.Times.Length; k += 50)
            NumericAssert.Close(statik * (1 - Math.Cos(omega * s.Times[k])), us.Values[k], Tolerance.Abs(1e-3 * statik), $"u at {s.Times[k]} s");
        NumericAssert.Close(2 * statik, us.Peak.Value, Tolerance.Rel(1e-3), "peak 2F/k");
    }

    [Fact]
    public void SupportAccelerationsInXAndZ_EachMoveTheirOwnDirection_AsTheLineModelsDo()
    {
        // Identity: a plane point mass on a support through uncoupled x and z springs, the support shaken in x by one
        // timed load and in z by another, is two line models: each direction's history equals the line model of it.
        const string settings = "transient: {duration: 0.4 s, step: 0.5 ms}";
        var plane = Document(
            "space: plane",
            "supports:",
            "  slab: {at: [0, -0.5]}",
            "masses:",
            "  m: {mass: 120 kg, at: [0, 0]}",
            "springs:",
            "  mount: {between: [slab, m], stiffness: {x: 300 kN/m, z: 800 kN/m}}",
            "dampers:",
            "  pad: {between: [slab, m], coefficient: {x: 600 N*s/m, z: 900 N*s/m}}",
            "loads:",
            "  sway: {kind: base-motion, support: slab, direction: x, time: {kind: half-sine, amplitude: 2 m/s^2, duration: 40 ms}}",
            "  heave: {kind: base-motion, support: slab, direction: z, time: {kind: sine, amplitude: 0.5 m/s^2, frequency: 7 Hz}}",
            settings);
        ModelDocument Line(string k, string c, string time) => Document(
            "supports:",
            "  slab: {at: [0, -1]}",
            "masses:",
            "  m: 120 kg",
            "springs:",
            $"  mount: {{between: [slab, m], stiffness: {k}}}",
            "dampers:",
            $"  pad: {{between: [slab, m], coefficient: {c}}}",
            "loads:",
            $"  shake: {{kind: base-motion, support: slab, time: {time}}}",
            settings);
        var x = Line("300 kN/m", "600 N*s/m", "{kind: half-sine, amplitude: 2 m/s^2, duration: 40 ms}");
        var z = Line("800 kN/m", "900 N*s/m", "{kind: sine, amplitude: 0.5 m/s^2, frequency: 7 Hz}");
        TransientResult Run(ModelDocument d) => TransientAnalysis.Run(DampedSystem.Build(d.Structure), d.TimedLoads, [], d.Transient!.Settings);
        var p = Run(plane);
        foreach (var (label, line) in new[] { ("m.x", Run(x)), ("m.z", Run(z)) })
        {
            var expected = line.Get("m", ResponseQuantity.Displacement).Values;
            var scale = expected.Max(Math.Abs);
            NumericAssert.Close([.. expected], [.. p.Get(label, ResponseQuantity.Displacement).Values], Tolerance.Abs(1e-9 * scale), label);
        }
    }
}
