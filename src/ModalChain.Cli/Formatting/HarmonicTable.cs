using System.Globalization;
using ModalChain.Core;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Io.Json;
using ModalChain.Io.Model;
using ModalChain.Io.Text;
using ModalChain.Reports.Units;

namespace ModalChain.Cli.Formatting;

/// <summary>The human-readable harmonic report: peaks over the sweep per output, then the operating points.</summary>
internal static class HarmonicTable
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The report of one sweep in <paramref name="units"/>; for a load case (<paramref name="caseName"/> not null) headed by the case, without the caution (the caller writes it once).</summary>
    public static void Write(TextWriter o, ModelDocument document, DampedSystem system, HarmonicResult result, DisplayUnits units, string? caseName = null)
    {
        var (du, vu, au, fu) = (units.Displacement, units.Velocity, units.Acceleration, units.Force);
        var f = result.FrequenciesHz;
        o.WriteLine(caseName is null ? TerminalText.Line(document.Network.Title) : $"Load case {caseName}");
        o.WriteLine(string.Create(Inv,
            $"Harmonic response, {(result.Method == HarmonicMethod.Modal ? "modal superposition" : "direct solve")}, {f.Length} frequencies from {f.Min():G4} to {f.Max():G4} Hz"));
        o.WriteLine("Loads acting together: " + string.Join("; ", result.Loads.Select(n => Describe(system.Model.FindLoad(n)!, units, system.Model.Network))));
        o.WriteLine("Damping: " + DampingLine.ForSweep(system));
        o.WriteLine();

        o.WriteLine("Peaks over the sweep");
        var (ru, rv, ra) = RotationRows.Units;
        var isRotation = DofMap.RotationLabels(system.Model.Network);
        var peaks = new TextTable("output", $"displacement [{du.Plain} peak]", "at [Hz]", $"velocity [{vu.Plain} peak]", "at [Hz]", $"acceleration [{au.Plain} peak]", "at [Hz]");
        var rotationPeaks = new TextTable("output", $"rotation [{ru.Plain} peak]", "at [Hz]", $"angular velocity [{rv.Plain} peak]", "at [Hz]", $"angular acceleration [{ra.Plain} peak]", "at [Hz]");
        var all = result.Peaks();
        var network = system.Model.Network;
        foreach (var r in result.Responses.Where(r => !network.IsElectrical(r.Dof)))
        {
            var p = all.Where(x => x.Dof == r.Dof).ToDictionary(x => x.Quantity);
            var turns = isRotation(r.Dof);
            var (tu, tv, ta) = turns ? (ru, rv, ra) : (du, vu, au);
            (turns ? rotationPeaks : peaks).Add(r.Dof,
                Num(tu.From(p[ResponseQuantity.Displacement].Magnitude)), p[ResponseQuantity.Displacement].FrequencyHz.ToString("F3", Inv),
                Num(tv.From(p[ResponseQuantity.Velocity].Magnitude)), p[ResponseQuantity.Velocity].FrequencyHz.ToString("F3", Inv),
                Num(ta.From(p[ResponseQuantity.Acceleration].Magnitude)), p[ResponseQuantity.Acceleration].FrequencyHz.ToString("F3", Inv));
        }
        peaks.Write(o);
        if (result.Responses.Any(r => isRotation(r.Dof)))
        {
            o.WriteLine();
            rotationPeaks.Write(o);
        }
        WriteElectricalPeaks(o, network, result, all);
        foreach (var p in all.Where(p => p.EdgeWarning is not null))
            o.WriteLine(string.Create(Inv,
                $"  {p.Dof} {HarmonicJson.Name(p.Quantity)}: {p.EdgeWarning} ({(p.IsInterior ? "the peak shown is the largest inside the sweep" : "no peak inside the sweep; the value shown is at its end")})"));
        if (result.Reactions.Length > 0)
        {
            o.WriteLine();
            var reactions = new TextTable("support", $"reaction [{fu.Plain} peak]", "at [Hz]");
            foreach (var r in result.Reactions)
            {
                var k = Enumerable.Range(0, f.Length).MaxBy(i => r.Force[i].Magnitude);
                reactions.Add(r.Support, Num(fu.From(r.Force[k].Magnitude)), f[k].ToString("F3", Inv));
            }
            reactions.Write(o);
        }
        if (!result.MountForces.IsEmpty)
        {
            o.WriteLine();
            o.WriteLine("Mount forces: largest amplitude over the sweep of the force (moment) each spring and damper passes to its second end");
            var mounts = new TextTable("element", "direction", "amplitude [peak]", "unit", "at [Hz]");
            foreach (var (m, peak, at) in result.MountForcePeaks())
                mounts.Add($"{Kind(m.Kind)} {m.Element}", m.Direction, Num(MountValue(m, peak, units)), MountUnit(m, units), at.ToString("F3", Inv));
            mounts.Write(o);
        }

        foreach (var op in result.OperatingPoints)
        {
            var at = op.Response;
            o.WriteLine();
            o.WriteLine(string.Create(Inv, $"Operating point {op.SpeedHz:G6} Hz ({60 * op.SpeedHz:G6} rpm): {string.Join(", ", op.Loads)}"));
            var table = new TextTable("output", $"displacement [{du.Plain} peak]", "phase [deg]", $"velocity [{vu.Plain} peak]", $"velocity [{vu.Plain} rms]", $"acceleration [{au.Plain} peak]");
            var rotationTable = new TextTable("output", $"rotation [{ru.Plain} peak]", "phase [deg]", $"angular velocity [{rv.Plain} peak]", $"angular velocity [{rv.Plain} rms]", $"angular acceleration [{ra.Plain} peak]");
            foreach (var r in at.Responses)
            {
                var x = r.At(0, op.SpeedHz, ResponseQuantity.Displacement);
                var turns = isRotation(r.Dof);
                var (tu, tv, ta) = turns ? (ru, rv, ra) : (du, vu, au);
                (turns ? rotationTable : table).Add(r.Dof, Num(tu.From(x.Magnitude)), HarmonicJson.PhaseDegrees(x).ToString("F1", Inv),
                    Num(tv.From(r.At(0, op.SpeedHz, ResponseQuantity.Velocity).Magnitude)),
                    Num(tv.From(r.At(0, op.SpeedHz, ResponseQuantity.Velocity).Magnitude) / Math.Sqrt(2)),
                    Num(ta.From(r.At(0, op.SpeedHz, ResponseQuantity.Acceleration).Magnitude)));
            }
            table.Write(o);
            if (at.Responses.Any(r => isRotation(r.Dof)))
            {
                o.WriteLine();
                rotationTable.Write(o);
            }
            var forces = new TextTable("element or support", $"force [{fu.Plain} peak]", "phase [deg]");
            var currents = new TextTable("element or source", "current [A peak]", "phase [deg]");
            foreach (var e in at.ElementForces.Where(e => ElectricalLabels.IsElement(network, e.Element, e.Kind == ElementKind.Spring)))
                currents.Add($"{(e.Kind == ElementKind.Spring ? "inductor (spring)" : "resistor (damper)")} {e.Element}", Num(e.Force[0].Magnitude), HarmonicJson.PhaseDegrees(e.Force[0]).ToString("F1", Inv));
            foreach (var c in at.SourceCurrents)
                currents.Add($"source at {c.Support}", Num(c.Current[0].Magnitude), HarmonicJson.PhaseDegrees(c.Current[0]).ToString("F1", Inv));
            foreach (var port in at.TransducerPorts)
                currents.Add($"port of {port.Transducer}", Num(port.Current[0].Magnitude), HarmonicJson.PhaseDegrees(port.Current[0]).ToString("F1", Inv));
            foreach (var e in at.ElementForces.Where(e => !ElectricalLabels.IsElement(network, e.Element, e.Kind == ElementKind.Spring)))
                forces.Add($"{(e.Kind == ElementKind.Spring ? "spring" : "damper")} {e.Element}", Num(fu.From(e.Force[0].Magnitude)), HarmonicJson.PhaseDegrees(e.Force[0]).ToString("F1", Inv));
            foreach (var r in at.Reactions)
                forces.Add($"reaction at {r.Support}", Num(fu.From(r.Force[0].Magnitude)), HarmonicJson.PhaseDegrees(r.Force[0]).ToString("F1", Inv));
            o.WriteLine();
            forces.Write(o);
            if (currents.Count > 0)
            {
                o.WriteLine();
                currents.Write(o);
            }
            if (!at.MountForces.IsEmpty)
            {
                o.WriteLine();
                o.WriteLine(string.Create(Inv, $"Mount forces at {op.SpeedHz:G6} Hz"));
                var mounts = new TextTable("element", "direction", "amplitude [peak]", "unit", "phase [deg]");
                foreach (var m in at.MountForces)
                    mounts.Add($"{Kind(m.Kind)} {m.Element}", m.Direction, Num(MountValue(m, m.Force[0].Magnitude, units)), MountUnit(m, units), HarmonicJson.PhaseDegrees(m.Force[0]).ToString("F1", Inv));
                mounts.Write(o);
            }
            var nearest = system.Modes.Modes.Where(m => !m.IsRigidBody).MinBy(m => Math.Abs(m.NaturalFrequencyHz / op.SpeedHz - 1));
            if (nearest is not null)
            {
                var separation = 100 * (nearest.NaturalFrequencyHz / op.SpeedHz - 1);
                var advice = Math.Abs(separation) < 20 ? " (within ±20 %: a common separation rule of thumb asks for more)." : ".";
                o.WriteLine(string.Create(Inv,
                    $"Nearest natural frequency: mode {nearest.Number} at {nearest.NaturalFrequencyHz:F3} Hz, {separation:+0.0;-0.0} % from the running speed{advice}"));
            }
        }

        o.WriteLine();
        foreach (var n in result.Notes) o.WriteLine("Note: " + n + ".");
        foreach (var w in result.Warnings) o.WriteLine("Warning: " + w + ".");
        o.WriteLine("Phases are relative to the loads' phase reference; velocity = iωX, acceleration = −ω²X; reactions are the force each support receives.");
        if (!result.MountForces.IsEmpty)
            o.WriteLine("Mount forces are k_d(1+iη)Δ_d and iωc_dΔ_d with Δ_d = u_A − u_B of the element's ends in direction d (A and B as in 'between'); 'axial' is along the line from A to B, also given in x, y, z.");
        if (caseName is not null) return;
        o.WriteLine();
        o.WriteLine("Caution: " + Cautions.Text);
    }

    private static string Kind(ElementKind kind) => kind == ElementKind.Spring ? "spring" : "damper";

    /// <summary>A mount force (N) or moment (N*m, a rotational component) in the display units.</summary>
    private static double MountValue(MountForce m, double si, DisplayUnits units) => MountValue(m.Unit, si, units);

    /// <summary>An SI mount value whose unit is <paramref name="siUnit"/> ("N", or "N*m" for a moment) in the display units.</summary>
    internal static double MountValue(string siUnit, double si, DisplayUnits units) =>
        siUnit != "N" ? units.Force.From(si) * units.LengthUnit.From(1) : units.Force.From(si);

    /// <summary>The display unit of a mount force or moment.</summary>
    private static string MountUnit(MountForce m, DisplayUnits units) => MountUnit(m.Unit, units);

    /// <summary>The display unit of a mount value whose SI unit is <paramref name="siUnit"/>.</summary>
    internal static string MountUnit(string siUnit, DisplayUnits units) =>
        siUnit != "N" ? $"{units.Force.Plain}*{units.LengthUnit.Plain}" : units.Force.Plain;

    internal static string Num(double v) => v == 0 ? "0" : Math.Abs(v) >= 1e-3 && Math.Abs(v) < 1e6 ? v.ToString("G4", Inv) : v.ToString("0.000E+00", Inv);

    internal static string Describe(Load load, DisplayUnits units, Network? network = null) => load switch
    {
        // An electrical support moved at a velocity is a voltage source (node flux form): its amplitude is in V.
        BaseMotionLoad { Kind: BaseMotionKind.Velocity } b when network is not null && network.IsElectrical(b.Support) =>
            string.Create(Inv, $"{b.Name} (source voltage {b.Amplitude:G4} V at {b.Support}{Speed(b.SpeedHz)})"),
        ForceLoad { Direction: var d } f when d.IsRotation() => string.Create(Inv, $"{f.Name} (moment {f.Amplitude:G4} N*m about {d.Label()} on {f.At}{Speed(f.SpeedHz)})"),
        ForceLoad f => string.Create(Inv, $"{f.Name} (force {units.Force.From(f.Amplitude):G4} {units.Force.Plain}{In(f.Direction)} at {f.At}{Speed(f.SpeedHz)})"),
        UnbalanceLoad u => string.Create(Inv, $"{u.Name} (unbalance {units.MassRadius.From(u.MassRadius):G4} {units.MassRadius.Plain} at {u.At}{(u.Plane.IsDefaultOrEmpty ? "" : $" turning in {string.Concat(u.Plane.Select(p => p.Label()))}")}{Speed(u.SpeedHz)})"),
        BaseMotionLoad b => BaseMotion(b, b.Kind switch
        {
            BaseMotionKind.Displacement => units.Displacement,
            BaseMotionKind.Velocity => units.Velocity,
            _ => units.Acceleration,
        }),
        _ => load.Name,
    };

    private static string BaseMotion(BaseMotionLoad b, DisplayUnit unit) => string.Create(Inv,
        $"{b.Name} ({b.Kind.ToString().ToLowerInvariant()} {unit.From(b.Amplitude):G4} {unit.Plain}{In(b.Direction)} of {b.Support}{Speed(b.SpeedHz)})");

    /// <summary>" in z" for a direction of a plane or 3d model; nothing in line models.</summary>
    private static string In(Core.Dofs.Direction d) => d == Core.Dofs.Direction.Along ? "" : " in " + d.Label();

    private static string Speed(double? hz) => hz is { } s ? string.Create(Inv, $", {60 * s:G6} rpm") : "";

    /// <summary>
    /// The electrical side's peaks (<see cref="ElectricalLabels"/>): each electrical output's voltage and each transducer
    /// port's voltage and current and each voltage source's current, in V and A; nothing for a mechanical model.
    /// </summary>
    private static void WriteElectricalPeaks(TextWriter o, Network network, HarmonicResult result, IReadOnlyList<ResponsePeak> all)
    {
        var f = result.FrequenciesHz;
        var table = new TextTable("electrical", "quantity", "amplitude [peak]", "unit", "at [Hz]");
        foreach (var r in result.Responses.Where(r => network.IsElectrical(r.Dof)))
        {
            var p = all.First(x => x.Dof == r.Dof && x.Quantity == ResponseQuantity.Velocity);
            table.Add($"node {r.Dof}", "voltage", Num(p.Magnitude), "V", p.FrequencyHz.ToString("F3", Inv));
        }
        void Largest(string what, string quantity, string unit, System.Collections.Immutable.ImmutableArray<System.Numerics.Complex> values)
        {
            var k = Enumerable.Range(0, f.Length).MaxBy(i => values[i].Magnitude);
            table.Add(what, quantity, Num(values[k].Magnitude), unit, f[k].ToString("F3", Inv));
        }
        foreach (var port in result.TransducerPorts)
        {
            Largest($"port of {port.Transducer}", "voltage", "V", port.Voltage);
            Largest($"port of {port.Transducer}", "current", "A", port.Current);
        }
        foreach (var c in result.SourceCurrents) Largest($"source at {c.Support}", "current", "A", c.Current);
        if (table.Count == 0) return;
        o.WriteLine();
        o.WriteLine("Electrical side: largest amplitude over the sweep (a node's voltage is its velocity in the node flux form; a port current leaves the branch terminal n1 into the circuit)");
        table.Write(o);
    }
}
