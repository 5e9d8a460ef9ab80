using System.Numerics;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Transducers;

/// <summary>Velocity sensor, shunt damping and shaker against their closed forms.</summary>
public class TransducerResponseTests
{
    // An invented moving-coil sensor: 20 g seismic mass, 10 Hz, 30 % of critical mechanical damping, Bl = 25 T·m.
    private const double M = 0.02, F0 = 10, Zeta = 0.3, Bl = 25;
    private static readonly double K = M * Math.Pow(2 * Math.PI * F0, 2);
    private static readonly double C = 2 * Zeta * Math.Sqrt(K * M);

    private static HarmonicResult Sweep(DampedSystem system, double f, params Load[] loads) =>
        HarmonicAnalysis.Sweep(system, [f], loads, [.. system.Partition.Free.Dofs.Select(d => d.Node)], HarmonicMethod.Direct);

    [Fact]
    public void VelocitySensor_OpenCircuitSensitivity_MatchesTheClosedForm()
    {
        // Closed form (common practice for moving-coil geophones): |V/v_base| = Bl·ω²/|−ω² + 2iζω₀ω + ω₀²|.
        // Read in the housing's frame, base velocity v_b acts on the seismic mass as the force −m·iω·v_b with the
        // housing held (exact for the relative motion); the port voltage is λ̇_sense = iω·Bl·(0 − X_m). The sense node's
        // capacitance C_s is a mass C_s on an eliminated node: it adds the inertance C_s·Bl² to the seismic mass, so the
        // exact figure is Bl·m·ω²/|−m'ω² + icω + k| with m' = m + C_s·Bl² (checked to 1e-10), which is the geophone
        // formula to within C_s·Bl²/m = 3e-8 (checked to 1e-6).
        const double cs = 1e-12;
        var network = TransducerModels.Sensor(M, K, C, Bl, cs);
        var system = DampedSystem.Build(StructuralModel.Of(network));
        var elimination = ConstraintElimination.Of(network)!;
        Assert.Equal("sense", Assert.Single(elimination.Nodes).Node);
        var w0 = 2 * Math.PI * F0;
        var mEff = M + cs * Bl * Bl;
        foreach (var f in Enumerable.Range(0, 25).Select(i => 0.5 * Math.Pow(1.25, i)))
        {
            var w = 2 * Math.PI * f;
            var r = Sweep(system, f, new ForceLoad("inertia", "m", M * w, -Math.PI / 2));
            var x = r.Responses.ToDictionary(d => d.Dof, d => d.Displacement[0]);
            var volts = new Complex(0, w) * elimination.Value<Complex>("sense", n => n == Network.Ground ? Complex.Zero : x[n]);
            var exact = Bl * M * w * w / (K - mEff * w * w + new Complex(0, C * w)).Magnitude;
            NumericAssert.Close(exact, volts.Magnitude, Tolerance.Rel(1e-10), $"|V/v_b| at {f:G4} Hz");
            var geophone = Bl * w * w / (new Complex(w0 * w0 - w * w, 2 * Zeta * w0 * w)).Magnitude;
            NumericAssert.Close(geophone, volts.Magnitude, Tolerance.Rel(1e-6), $"geophone formula at {f:G4} Hz");
        }
    }

    [Theory]
    [InlineData(500.0)]
    [InlineData(1000.0)]
    [InlineData(4000.0)]
    public void ShuntResistor_AddsTheClosedFormDampingRatio(double ohms)
    {
        // Closed on R = R_coil + R_load, the port current is u/R = Bl·v_rel/R and the coil force Bl·i: the electrical
        // side is exactly a damper (Bl)²/R on the relative motion, so ζ = ζ_mech + (Bl)²/(2mω₀R) (common practice for
        // shunt-damped moving-coil sensors; derived in docs/methods.md, "Transducers"). With the port capacitance C_s the
        // mass is m' = m + C_s·Bl² in both terms. Complex-mode damping ratio against it to 1e-10.
        const double cs = 1e-12;
        var network = TransducerModels.Sensor(M, K, C, Bl, cs, ohms);
        var system = DampedSystem.Build(StructuralModel.Of(network));
        var mode = Assert.Single(ComplexModes.Solve(system));
        var mEff = M + cs * Bl * Bl;
        var w0 = Math.Sqrt(K / mEff);
        var expected = C / (2 * mEff * w0) + Bl * Bl / (2 * mEff * w0 * ohms);
        NumericAssert.Close(expected, mode.DampingRatio, Tolerance.Rel(1e-10), $"ζ with {ohms} Ω");
        NumericAssert.Close(w0 / (2 * Math.PI), mode.UndampedFrequencyHz, Tolerance.Rel(1e-10), "undamped frequency");
    }

    [Fact]
    public void Shaker_TableForceAndElectricalImpedance_MatchTheClosedForms()
    {
        // An invented shaker: 2 kg table on 40 kN/m and 15 N·s/m, Bl = 12 T·m, R_e = 4 Ω, driven by 1 V.
        // Closed forms (common practice for electrodynamic shakers): the table obeys
        // (k − ω²m' + iω(c + Bl²/R_e)) X = Bl·V/R_e, so its force at DC is Bl·V/R_e; the source current is
        // I = (V − Bl·iωX)/R_e and the impedance Z = V/I = R_e + (Bl)²/Z_m with Z_m = iωm' + c + k/(iω), m' = m + C_p·Bl².
        const double m = 2, k = 4e4, c = 15, bl = 12, re = 4, cp = 1e-9, volts = 1;
        var network = TransducerModels.Shaker(m, k, c, bl, re, cp);
        var system = DampedSystem.Build(StructuralModel.Of(network));
        var mEff = m + cp * bl * bl;
        var drive = new BaseMotionLoad("drive", "amp", BaseMotionKind.Velocity, volts, 0);
        foreach (var f in new[] { 1e-5, 0.1, 1, 5, 10, 20, 22.5, 25, 30, 50, 100, 400 })
        {
            var w = 2 * Math.PI * f;
            var r = HarmonicAnalysis.Sweep(system, [f], [drive], ["table"], HarmonicMethod.Direct);
            var x = r.Responses.Single().Displacement[0];
            var expectedX = bl * volts / re / (k - mEff * w * w + new Complex(0, w * (c + bl * bl / re)));
            NumericAssert.Small((x - expectedX).Magnitude, 1e-10 * expectedX.Magnitude, $"table at {f} Hz");
            // The source's current is minus the force its support receives, r = −(V − λ̇_port)/R_e (the resistor pulls the
            // source node towards the port's flux, as a damper pulls its end); the sweep reports it as a source current.
            var current = r.SourceCurrents.Single(s => s.Support == "amp").Current[0];
            var zm = new Complex(c, w * mEff - k / w);
            var expectedZ = re + bl * bl / zm;
            var z = volts / current;
            NumericAssert.Small((z - expectedZ).Magnitude, 1e-10 * expectedZ.Magnitude, $"Z at {f} Hz");
        }
        // DC: the spring carries Bl·V/R_e; at 1e-5 Hz the dynamic terms are below 1e-8 of it.
        var low = HarmonicAnalysis.Sweep(system, [1e-5], [drive], ["table"], HarmonicMethod.Direct);
        NumericAssert.Close(bl * volts / re, k * low.Responses.Single().Displacement[0].Real, Tolerance.Rel(1e-8), "force at DC");
    }
}
