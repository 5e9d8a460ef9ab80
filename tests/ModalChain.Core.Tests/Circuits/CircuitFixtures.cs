using System.Collections.Immutable;
using ModalChain.Core.Model;

namespace ModalChain.Core.Tests.Circuits;

/// <summary>Small circuits shared by the circuit tests.</summary>
internal static class CircuitFixtures
{
    /// <summary>A voltage source from ground to 'in', then R from 'in' to 'mid', L from 'mid' to 'out', C from 'out' to ground.</summary>
    public static Circuit SeriesRlc(double r, double l, double c, TimeFunction? waveform = null, double amplitude = 1) => new(
        "series RLC", ["in", "mid", "out"],
        [new Resistor("R1", "in", "mid", r)],
        [new Inductor("L1", "mid", "out", l)],
        [new Capacitor("C1", "out", Circuit.Ground, c)],
        [new VoltageSource("V1", "in", Circuit.Ground, amplitude, waveform)],
        []);

    /// <summary>R, L and C in parallel from 'top' to ground, driven by a current source into 'top'.</summary>
    public static Circuit ParallelRlc(double r, double l, double c, TimeFunction? waveform = null) => new(
        "parallel RLC", ["top"],
        [new Resistor("R1", "top", Circuit.Ground, r)],
        [new Inductor("L1", "top", Circuit.Ground, l)],
        [new Capacitor("C1", "top", Circuit.Ground, c)],
        [],
        [new CurrentSource("I1", Circuit.Ground, "top", 1, waveform)]);

    /// <summary>Two parallel tanks coupled by a capacitor and a resistor: 'a' and 'b' each with C, L and R to ground.</summary>
    /// <remarks>Values in µF, mH and hundreds of ohms (kHz); <paramref name="normalised"/> gives the same topology in F, H and Ω of order one.</remarks>
    public static Circuit CoupledTanks(TimeFunction? waveform = null, bool normalised = false)
    {
        double c = normalised ? 1 : 1e-6, l = normalised ? 1 : 1e-3, r = normalised ? 0.01 : 1;
        return new(
        "coupled tanks", ["a", "b"],
        [new Resistor("Ra", "a", Circuit.Ground, 200 * r), new Resistor("Rb", "b", Circuit.Ground, 150 * r), new Resistor("Rab", "a", "b", 1000 * r)],
        [new Inductor("La", "a", Circuit.Ground, 2 * l), new Inductor("Lb", "b", Circuit.Ground, 3 * l), new Inductor("Lab", "a", "b", 10 * l)],
        [new Capacitor("Ca", "a", Circuit.Ground, 1 * c), new Capacitor("Cb", "b", Circuit.Ground, 2.2 * c), new Capacitor("Cab", "a", "b", 0.47 * c)],
        [],
        [new CurrentSource("I1", Circuit.Ground, "a", 1, waveform)]);
    }
}
