using System.Globalization;
using ModalChain.Core;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Io.Model;
using ModalChain.Io.Text;
using ModalChain.Reports.Units;

namespace ModalChain.Cli.Formatting;

/// <summary>The human-readable transient report: peaks and RMS per output, element forces, reactions, energy balance, warnings.</summary>
internal static class TransientTable
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static void Write(TextWriter o, ModelDocument document, DampedSystem system, TransientResult result, IReadOnlyList<TransientExcitation> loads, DisplayUnits units)
    {
        var (du, vu, au, fu, ju) = (units.Displacement, units.Velocity, units.Acceleration, units.Force, units.Energy);
        var s = result.Settings;
        o.WriteLine(TerminalText.Line(document.Network.Title));
        o.WriteLine(string.Create(Inv, $"Transient response, {result.MethodDescription}: {result.StepCount} steps of {s.Step:G4} s over {result.StepCount * s.Step:G6} s"));
        o.WriteLine("Loads acting together: " + (loads.Count == 0 ? "none (free vibration from the initial state)" : string.Join("; ", loads.DistinctBy(l => l.Name).Select(l => Describe(l, units, loads)))));
        o.WriteLine("Damping: " + DampingLine.ForHistory(system));
        var window = string.Create(Inv, $"{s.RmsFrom ?? 0:G4} to {s.RmsTo ?? result.StepCount * s.Step:G4} s");
        o.WriteLine();

        o.WriteLine($"Peaks (largest magnitude, with sign) and RMS over {window}");
        var (ru, rv, ra) = RotationRows.Units;
        var isRotation = DofMap.RotationLabels(document.Network);
        var motion = new TextTable("output", $"displacement [{du.Plain} peak]", "at [s]", $"displacement [{du.Plain} rms]", $"velocity [{vu.Plain} peak]", "at [s]", $"acceleration [{au.Plain} peak]", "at [s]");
        var rotation = new TextTable("output", $"rotation [{ru.Plain} peak]", "at [s]", $"rotation [{ru.Plain} rms]", $"angular velocity [{rv.Plain} peak]", "at [s]", $"angular acceleration [{ra.Plain} peak]", "at [s]");
        var rotations = 0;
        var network = result.Network;
        foreach (var name in result.Responses.Where(r => r.Quantity == ResponseQuantity.Displacement && !network.IsElectrical(r.Name)).Select(r => r.Name))
        {
            var u = result.Get(name, ResponseQuantity.Displacement);
            var v = result.Get(name, ResponseQuantity.Velocity);
            var a = result.Get(name, ResponseQuantity.Acceleration);
            var turns = isRotation(name);
            var (tu, tv, ta) = turns ? (ru, rv, ra) : (du, vu, au);
            (turns ? rotation : motion).Add(name, Num(tu.From(u.Peak.Value)), Time(u.Peak.Time), Rms(tu.From(u.Rms)), Num(tv.From(v.Peak.Value)), Time(v.Peak.Time),
                Num(ta.From(a.Peak.Value)), Time(a.Peak.Time));
            if (turns) rotations++;
        }
        motion.Write(o);
        if (rotations > 0)
        {
            o.WriteLine();
            rotation.Write(o);
        }

        // The electrical side in V and A (Io.Json.ElectricalLabels): node voltages, element and port currents, sources.
        var electrical = result.Responses.Where(r => r.Direction is null && Io.Json.ElectricalLabels.Unit(network, r.Name, r.Quantity, r.Unit) is "V" or "A").ToArray();
        if (electrical.Length > 0)
        {
            o.WriteLine();
            o.WriteLine("Electrical side (a node's voltage is its velocity in the node flux form; a port current leaves the branch terminal n1 into the circuit)");
            var table = new TextTable("electrical", "quantity", "peak", "unit", "at [s]", "rms");
            foreach (var r in electrical)
            {
                var label = r.Quantity switch
                {
                    ResponseQuantity.PortVoltage or ResponseQuantity.PortCurrent => "port of " + r.Name,
                    ResponseQuantity.SourceCurrent => "source at " + r.Name,
                    ResponseQuantity.SpringForce => "inductor (spring) " + r.Name,
                    ResponseQuantity.DamperForce => "resistor (damper) " + r.Name,
                    _ => "node " + r.Name,
                };
                var quantity = Io.Json.ElectricalLabels.Quantity(network, r.Name, r.Quantity).Replace('_', ' ');
                table.Add(label, quantity, Num(r.Peak.Value), Io.Json.ElectricalLabels.Unit(network, r.Name, r.Quantity, r.Unit), Time(r.Peak.Time), Rms(r.Rms));
            }
            table.Write(o);
        }

        var forces = result.Responses.Where(r => !Io.Json.TransientJson.IsMotion(r.Quantity) && r.Direction is null && !electrical.Contains(r)).ToArray();
        if (forces.Length > 0)
        {
            o.WriteLine();
            var table = new TextTable("element or support", $"force [{fu.Plain} peak]", "at [s]", $"force [{fu.Plain} rms]");
            foreach (var r in forces)
            {
                var label = r.Quantity switch
                {
                    ResponseQuantity.SpringForce => "spring " + r.Name,
                    ResponseQuantity.DamperForce => "damper " + r.Name,
                    _ => "reaction at " + r.Name,
                };
                table.Add(label, Num(fu.From(r.Peak.Value)), Time(r.Peak.Time), Rms(fu.From(r.Rms)));
            }
            table.Write(o);
        }

        var mounts = result.Responses.Where(r => r.Direction is not null).ToArray();
        if (mounts.Length > 0)
        {
            o.WriteLine();
            o.WriteLine("Mount forces: peak (largest magnitude, with sign) of the force (moment) each spring and damper passes to its second end");
            var table = new TextTable("element", "direction", "peak", "unit", "at [s]", "rms");
            foreach (var r in mounts)
                table.Add($"{(r.Quantity == ResponseQuantity.SpringForce ? "spring" : "damper")} {r.Name}", r.Direction!,
                    Num(HarmonicTable.MountValue(r.Unit, r.Peak.Value, units)), HarmonicTable.MountUnit(r.Unit, units), Time(r.Peak.Time),
                    double.IsNaN(r.Rms) ? "n/a" : Num(HarmonicTable.MountValue(r.Unit, r.Rms, units)));
            table.Write(o);
        }

        var e = result.Energy;
        o.WriteLine();
        o.WriteLine(string.Create(Inv,
            $"Energy balance: initial {ju.From(e.InitialEnergy):G4} {ju.Plain} + input work {ju.From(e.InputWork):G4} {ju.Plain} = kinetic {ju.From(e.FinalKineticEnergy):G4} {ju.Plain} + strain {ju.From(e.FinalStrainEnergy):G4} {ju.Plain} + dissipated {ju.From(e.Dissipated):G4} {ju.Plain}; closes to {100 * e.MaxRelativeError:G3} % of the largest energy."));
        foreach (var w in result.Warnings) o.WriteLine("Warning: " + w);
        o.WriteLine("Element forces are k(u_A − u_B) and c(u̇_A − u̇_B) with A and B as in 'between'; reactions are the force each support receives.");
        o.WriteLine();
        o.WriteLine("Caution: " + Cautions.Text);
    }

    private static string Num(double v) => v == 0 ? "0" : Math.Abs(v) >= 1e-3 && Math.Abs(v) < 1e6 ? v.ToString("G4", Inv) : v.ToString("0.000E+00", Inv);

    /// <summary>An RMS, or "n/a" when the window held no step.</summary>
    private static string Rms(double v) => double.IsNaN(v) ? "n/a" : Num(v);

    private static string Time(double t) => t.ToString("F4", Inv);

    private static string Describe(TransientExcitation load, DisplayUnits units, IReadOnlyList<TransientExcitation> loads) => load switch
    {
        ForceHistory { Time: UnbalanceSpeedRamp r } f => string.Create(Inv,
            $"{f.Name} (unbalance {units.MassRadius.From(f.Scale):G4} {units.MassRadius.Plain} at {f.Mass}{Turning(f, loads)}, {60 * r.FromRadPerSecond / (2 * Math.PI):G5} to {60 * r.ToRadPerSecond / (2 * Math.PI):G5} rpm over {r.Over:G4} s from {r.Start:G4} s)"),
        ForceHistory { Direction: var d } f when d.IsRotation() => $"{f.Name} ({Shape(f.Time, MomentUnit)} moment about {d.Label()} on {f.Mass})",
        ForceHistory f => $"{f.Name} ({Shape(f.Time, units.Force)} force{In(f.Direction)} at {f.Mass})",
        SupportAccelerationHistory b => $"{b.Name} ({Shape(b.Acceleration, units.Acceleration)} acceleration of {b.Support}{In(b.Direction)})",
        // A circuit's voltage source: its node's velocity is the voltage, in V whatever the unit system.
        SupportVelocityHistory v => $"{v.Name} ({(v.Scale < 0 ? "minus " : "")}{Shape(v.Velocity, VoltUnit)} at {v.Support})",
        _ => load.Name,
    };

    // Moments are printed in N*m whatever the unit system, as the harmonic table does.
    private static readonly DisplayUnit MomentUnit = new("N·m", "N*m", 1);
    private static readonly DisplayUnit VoltUnit = new("V", "V", 1);

    private static string In(Direction d) => d == Direction.Along ? "" : $" in {d.Label()}";

    /// <summary>" turning in xz" for an unbalance of a plane or 3d model (two histories of one name), else empty.</summary>
    private static string Turning(ForceHistory f, IReadOnlyList<TransientExcitation> loads)
    {
        var directions = loads.OfType<ForceHistory>().Where(l => l.Name == f.Name && l.Direction != Direction.Along).Select(l => l.Direction.Label()).ToList();
        return directions.Count == 0 ? "" : $" turning in {string.Concat(directions)}";
    }

    /// <summary>A time function whose values are in <paramref name="unit"/>'s SI quantity (N for a force, m/s² for an acceleration).</summary>
    private static string Shape(TimeFunction f, DisplayUnit unit) => f switch
    {
        StepFunction s => string.Create(Inv, $"step {unit.From(s.Value):G4} {unit.Plain} at {s.At:G4} s"),
        RampFunction r => string.Create(Inv, $"ramp {unit.From(r.From):G4} to {unit.From(r.To):G4} {unit.Plain} over {r.Over:G4} s"),
        RectangularPulse p => string.Create(Inv, $"rectangular pulse {unit.From(p.Amplitude):G4} {unit.Plain} for {p.Duration:G4} s"),
        HalfSinePulse p => string.Create(Inv, $"half-sine pulse {unit.From(p.Amplitude):G4} {unit.Plain} for {p.Duration:G4} s"),
        SineFunction s => string.Create(Inv, $"sine {unit.From(s.Amplitude):G4} {unit.Plain} at {s.FrequencyHz:G4} Hz"),
        TableFunction t => string.Create(Inv, $"table of {t.Times.Length} samples to {t.Times[^1]:G4} s"),
        _ => "timed",
    };
}
