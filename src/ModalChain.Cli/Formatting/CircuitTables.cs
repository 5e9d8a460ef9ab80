using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using ModalChain.Core;
using ModalChain.Core.Analyses.Circuits;
using ModalChain.Io.Text;

namespace ModalChain.Cli.Formatting;

/// <summary>The terminal tables of a circuit model: roots, impedance and transfer sweeps, and time responses, in V, A, Ω and s.</summary>
internal static class CircuitTables
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The caution circuits carry after the tool's own.</summary>
    public const string CircuitCaution =
        "Circuit results are those of ideal lumped resistors, inductors, capacitors and sources: parasitics, saturation, " +
        "temperature and tolerances are left out. Circuits at hazardous voltages must be designed and checked by a qualified person.";

    /// <summary>The roots of the circuit with the sources switched off.</summary>
    public static void WriteRoots(TextWriter o, string title, ImmutableArray<CircuitRoot> roots)
    {
        o.WriteLine(TerminalText.Line(title));
        o.WriteLine("Roots of the circuit with its sources switched off (voltage sources shorted, current sources open):");
        var table = new TextTable("#", "kind", "f0 (Hz)", "damping ratio", "Q", "fd (Hz)", "time constant (s)", "root s (1/s)");
        foreach (var r in roots)
            table.Add(r.Number.ToString(Inv), Kind(r.Kind),
                r.Kind == CircuitRootKind.DcLevel ? "0" : G(r.NaturalFrequencyHz),
                Maybe(r.DampingRatio), Maybe(r.QualityFactor), r.Kind == CircuitRootKind.Oscillation ? G(r.DampedFrequencyHz) : "-",
                Maybe(r.TimeConstant), Root(r.Root));
        table.Write(o);
        if (roots.Any(r => r.Kind == CircuitRootKind.DcLevel))
            o.WriteLine("A DC level is a zero root: the voltage a part keeps when no inductor or resistor ties it to ground or to a source (a charge that stays); it is not an oscillation.");
        Cautions(o);
    }

    /// <summary>Driving-point impedance and transfer functions of each source over the sweep.</summary>
    public static void WriteSweep(TextWriter o, string title, ImmutableArray<CircuitSourceResponse> responses)
    {
        o.WriteLine(TerminalText.Line(title));
        foreach (var r in responses)
        {
            var unit = r.IsVoltageSource ? "V/V" : "V/A";
            o.WriteLine();
            o.WriteLine($"Source '{TerminalText.Line(r.Source)}' alone ({(r.IsVoltageSource ? "voltage" : "current")} source; the others switched off): " +
                $"impedance it sees, and node voltage per unit source {(r.IsVoltageSource ? "voltage" : "current")} ({unit})");
            var header = new List<string> { "f (Hz)", "|Z| (ohm)", "arg Z (deg)" };
            foreach (var n in r.Nodes) header.Add($"{TerminalText.Line(n)} |H| ({unit})");
            foreach (var n in r.Nodes) header.Add($"{TerminalText.Line(n)} arg H (deg)");
            var table = new TextTable([.. header]);
            for (var k = 0; k < r.FrequenciesHz.Length; k++)
            {
                var row = new List<string> { G(r.FrequenciesHz[k]), G(r.Impedance[k].Magnitude), Deg(r.Impedance[k]) };
                row.AddRange(r.Transfer[k].Select(h => G(h.Magnitude)));
                row.AddRange(r.Transfer[k].Select(Deg));
                table.Add([.. row]);
            }
            table.Write(o);
            var min = Enumerable.Range(0, r.FrequenciesHz.Length).MinBy(k => r.Impedance[k].Magnitude);
            o.WriteLine($"Smallest |Z| over the sweep: {G(r.Impedance[min].Magnitude)} ohm at {G(r.FrequenciesHz[min])} Hz.");
        }
        o.WriteLine();
        Cautions(o);
    }

    /// <summary>Peaks and final values of the node voltages and branch currents, then the histories at up to 25 instants.</summary>
    public static void WriteTransient(TextWriter o, string title, CircuitTransientResult result)
    {
        o.WriteLine(TerminalText.Line(title));
        o.WriteLine(string.Create(Inv, $"Response from rest over {G(result.Times[^1])} s, step {G(result.Times[1] - result.Times[0])} s (exact for steps, ramps and rectangular pulses):"));
        var table = new TextTable("quantity", "max", "min", "final");
        for (var i = 0; i < result.Nodes.Length; i++)
            table.Add($"v({TerminalText.Line(result.Nodes[i])}) (V)", G(result.Volts[i].Max()), G(result.Volts[i].Min()), G(result.Volts[i][^1]));
        foreach (var b in result.Currents)
            table.Add($"i({TerminalText.Line(b.Element)}) (A)", G(b.Amperes.Max()), G(b.Amperes.Min()), G(b.Amperes[^1]));
        table.Write(o);
        o.WriteLine();
        var every = Math.Max(1, (result.Times.Length - 1) / 24);
        var history = new TextTable([.. new[] { "t (s)" }.Concat(result.Nodes.Select(n => $"v({TerminalText.Line(n)}) (V)")).Concat(result.Currents.Select(b => $"i({TerminalText.Line(b.Element)}) (A)"))]);
        for (var k = 0; k < result.Times.Length; k += every)
            history.Add([.. new[] { G(result.Times[k]) }.Concat(result.Volts.Select(v => G(v[k]))).Concat(result.Currents.Select(b => G(b.Amperes[k])))]);
        history.Write(o);
        o.WriteLine("Capacitor currents leave out the impulse at the instant a source voltage jumps; values are those just after it.");
        Cautions(o);
    }

    private static void Cautions(TextWriter o)
    {
        o.WriteLine("Caution: " + Core.Cautions.Text);
        o.WriteLine("Caution: " + CircuitCaution);
    }

    private static string Kind(CircuitRootKind kind) => kind switch
    {
        CircuitRootKind.DcLevel => "DC level",
        CircuitRootKind.Oscillation => "oscillation",
        _ => "relaxation",
    };

    private static string G(double v) => v.ToString("G6", Inv);

    private static string Maybe(double v) => double.IsNaN(v) ? "-" : double.IsPositiveInfinity(v) ? "inf" : G(v);

    private static string Deg(Complex z) => (z.Phase * 180 / Math.PI).ToString("F2", Inv);

    private static string Root(Complex s) =>
        s.Imaginary == 0 ? G(s.Real) : $"{G(s.Real)} {(s.Imaginary < 0 ? "-" : "+")} {G(Math.Abs(s.Imaginary))}i";
}
