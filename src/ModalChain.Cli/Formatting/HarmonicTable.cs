using System.Globalization;
using ModalChain.Core;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Io.Json;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Cli.Formatting;

/// <summary>The human-readable harmonic report: peaks over the sweep per output, then the operating points.</summary>
internal static class HarmonicTable
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static void Write(TextWriter o, ModelDocument document, DampedSystem system, HarmonicResult result) => Write(o, document, system, result, null);

    /// <summary>The report of one sweep; for a load case (<paramref name="caseName"/> not null) headed by the case, without the caution (the caller writes it once).</summary>
    internal static void Write(TextWriter o, ModelDocument document, DampedSystem system, HarmonicResult result, string? caseName)
    {
        var f = result.FrequenciesHz;
        o.WriteLine(caseName is null ? TerminalText.Line(document.Network.Title) : $"Load case {caseName}");
        o.WriteLine(string.Create(Inv,
            $"Harmonic response, {(result.Method == HarmonicMethod.Modal ? "modal superposition" : "direct solve")}, {f.Length} frequencies from {f.Min():G4} to {f.Max():G4} Hz"));
        o.WriteLine("Loads acting together: " + string.Join("; ", result.Loads.Select(n => Describe(system.Model.FindLoad(n)!))));
        o.WriteLine("Damping: " + DescribeDamping(system));
        o.WriteLine();

        o.WriteLine("Peaks over the sweep");
        var peaks = new TextTable("output", "displacement [mm peak]", "at [Hz]", "velocity [mm/s peak]", "at [Hz]", "acceleration [m/s^2 peak]", "at [Hz]");
        var all = result.Peaks();
        foreach (var r in result.Responses)
        {
            var p = all.Where(x => x.Dof == r.Dof).ToDictionary(x => x.Quantity);
            peaks.Add(r.Dof,
                Num(1e3 * p[ResponseQuantity.Displacement].Magnitude), p[ResponseQuantity.Displacement].FrequencyHz.ToString("F3", Inv),
                Num(1e3 * p[ResponseQuantity.Velocity].Magnitude), p[ResponseQuantity.Velocity].FrequencyHz.ToString("F3", Inv),
                Num(p[ResponseQuantity.Acceleration].Magnitude), p[ResponseQuantity.Acceleration].FrequencyHz.ToString("F3", Inv));
        }
        peaks.Write(o);
        foreach (var p in all.Where(p => p.EdgeWarning is not null))
            o.WriteLine(string.Create(Inv,
                $"  {p.Dof} {HarmonicJson.Name(p.Quantity)}: {p.EdgeWarning} ({(p.IsInterior ? "the peak shown is the largest inside the sweep" : "no peak inside the sweep; the value shown is at its end")})"));
        if (result.Reactions.Length > 0)
        {
            o.WriteLine();
            var reactions = new TextTable("support", "reaction [N peak]", "at [Hz]");
            foreach (var r in result.Reactions)
            {
                var k = Enumerable.Range(0, f.Length).MaxBy(i => r.Force[i].Magnitude);
                reactions.Add(r.Support, Num(r.Force[k].Magnitude), f[k].ToString("F3", Inv));
            }
            reactions.Write(o);
        }

        foreach (var op in result.OperatingPoints)
        {
            var at = op.Response;
            o.WriteLine();
            o.WriteLine(string.Create(Inv, $"Operating point {op.SpeedHz:G6} Hz ({60 * op.SpeedHz:G6} rpm): {string.Join(", ", op.Loads)}"));
            var table = new TextTable("output", "displacement [mm peak]", "phase [deg]", "velocity [mm/s peak]", "velocity [mm/s rms]", "acceleration [m/s^2 peak]");
            foreach (var r in at.Responses)
            {
                var x = r.At(0, op.SpeedHz, ResponseQuantity.Displacement);
                table.Add(r.Dof, Num(1e3 * x.Magnitude), HarmonicJson.PhaseDegrees(x).ToString("F1", Inv),
                    Num(1e3 * r.At(0, op.SpeedHz, ResponseQuantity.Velocity).Magnitude),
                    Num(1e3 * r.At(0, op.SpeedHz, ResponseQuantity.Velocity).Magnitude / Math.Sqrt(2)),
                    Num(r.At(0, op.SpeedHz, ResponseQuantity.Acceleration).Magnitude));
            }
            table.Write(o);
            var forces = new TextTable("element or support", "force [N peak]", "phase [deg]");
            foreach (var e in at.ElementForces)
                forces.Add($"{(e.Kind == ElementKind.Spring ? "spring" : "damper")} {e.Element}", Num(e.Force[0].Magnitude), HarmonicJson.PhaseDegrees(e.Force[0]).ToString("F1", Inv));
            foreach (var r in at.Reactions)
                forces.Add($"reaction at {r.Support}", Num(r.Force[0].Magnitude), HarmonicJson.PhaseDegrees(r.Force[0]).ToString("F1", Inv));
            o.WriteLine();
            forces.Write(o);
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
        if (caseName is not null) return;
        o.WriteLine();
        o.WriteLine("Caution: " + Cautions.Text);
    }

    internal static string Num(double v) => v == 0 ? "0" : Math.Abs(v) >= 1e-3 && Math.Abs(v) < 1e6 ? v.ToString("G4", Inv) : v.ToString("0.000E+00", Inv);

    internal static string Describe(Load load) => load switch
    {
        ForceLoad f => string.Create(Inv, $"{f.Name} (force {f.Amplitude:G4} N at {f.At}{Speed(f.SpeedHz)})"),
        UnbalanceLoad u => string.Create(Inv, $"{u.Name} (unbalance {u.MassRadius:G4} kg*m at {u.At}{Speed(u.SpeedHz)})"),
        BaseMotionLoad b => string.Create(Inv,
            $"{b.Name} ({b.Kind.ToString().ToLowerInvariant()} {b.Amplitude:G4} {(b.Kind == BaseMotionKind.Displacement ? "m" : b.Kind == BaseMotionKind.Velocity ? "m/s" : "m/s^2")} of {b.Support}{Speed(b.SpeedHz)})"),
        _ => load.Name,
    };

    private static string Speed(double? hz) => hz is { } s ? string.Create(Inv, $", {60 * s:G6} rpm") : "";

    private static string DescribeDamping(DampedSystem system)
    {
        var d = system.Model.Damping;
        var parts = new List<string>();
        if (system.Model.Network.Dampers.Length > 0) parts.Add($"{system.Model.Network.Dampers.Length} discrete damper(s)");
        if (!d.ModalRatios.IsDefaultOrEmpty) parts.Add("modal " + string.Join("/", d.ModalRatios.Select(z => (100 * z).ToString("G3", Inv) + " %")));
        if (d.Rayleigh is { } r) parts.Add(string.Create(Inv, $"Rayleigh a0 = {r.MassCoefficient:G4} 1/s, a1 = {r.StiffnessCoefficient:G4} s"));
        if (d.LossFactor > 0) parts.Add(string.Create(Inv, $"loss factor {d.LossFactor:G3}"));
        if (parts.Count == 0) return "none";
        var ratios = system.ModalDampingRatios.Where(double.IsFinite).Select(z => (100 * z).ToString("F2", Inv) + " %").Take(6);
        return string.Join(", ", parts) + (system.IsClassical ? "" : " (not classical)") + "; modal ratios " + string.Join(", ", ratios);
    }
}
