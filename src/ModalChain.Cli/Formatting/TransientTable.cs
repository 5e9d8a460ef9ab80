using System.Globalization;
using ModalChain.Core;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Cli.Formatting;

/// <summary>The human-readable transient report: peaks and RMS per output, element forces, reactions, energy balance, warnings.</summary>
internal static class TransientTable
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static void Write(TextWriter o, ModelDocument document, DampedSystem system, TransientResult result, IReadOnlyList<TransientExcitation> loads)
    {
        var s = result.Settings;
        o.WriteLine(TerminalText.Line(document.Network.Title));
        o.WriteLine(string.Create(Inv, $"Transient response, {result.MethodDescription}: {result.StepCount} steps of {s.Step:G4} s over {result.StepCount * s.Step:G6} s"));
        o.WriteLine("Loads acting together: " + (loads.Count == 0 ? "none (free vibration from the initial state)" : string.Join("; ", loads.Select(Describe))));
        o.WriteLine("Damping: " + DescribeDamping(system));
        var window = string.Create(Inv, $"{s.RmsFrom ?? 0:G4} to {s.RmsTo ?? result.StepCount * s.Step:G4} s");
        o.WriteLine();

        o.WriteLine($"Peaks (largest magnitude, with sign) and RMS over {window}");
        var motion = new TextTable("output", "displacement [mm peak]", "at [s]", "displacement [mm rms]", "velocity [mm/s peak]", "at [s]", "acceleration [m/s^2 peak]", "at [s]");
        foreach (var name in result.Responses.Where(r => r.Quantity == ResponseQuantity.Displacement).Select(r => r.Name))
        {
            var u = result.Get(name, ResponseQuantity.Displacement);
            var v = result.Get(name, ResponseQuantity.Velocity);
            var a = result.Get(name, ResponseQuantity.Acceleration);
            motion.Add(name, Num(1e3 * u.Peak.Value), Time(u.Peak.Time), Rms(1e3 * u.Rms), Num(1e3 * v.Peak.Value), Time(v.Peak.Time),
                Num(a.Peak.Value), Time(a.Peak.Time));
        }
        motion.Write(o);

        var forces = result.Responses.Where(r => !Io.Json.TransientJson.IsMotion(r.Quantity)).ToArray();
        if (forces.Length > 0)
        {
            o.WriteLine();
            var table = new TextTable("element or support", "force [N peak]", "at [s]", "force [N rms]");
            foreach (var r in forces)
            {
                var label = r.Quantity switch
                {
                    ResponseQuantity.SpringForce => "spring " + r.Name,
                    ResponseQuantity.DamperForce => "damper " + r.Name,
                    _ => "reaction at " + r.Name,
                };
                table.Add(label, Num(r.Peak.Value), Time(r.Peak.Time), Rms(r.Rms));
            }
            table.Write(o);
        }

        var e = result.Energy;
        o.WriteLine();
        o.WriteLine(string.Create(Inv,
            $"Energy balance: initial {e.InitialEnergy:G4} J + input work {e.InputWork:G4} J = kinetic {e.FinalKineticEnergy:G4} J + strain {e.FinalStrainEnergy:G4} J + dissipated {e.Dissipated:G4} J; closes to {100 * e.MaxRelativeError:G3} % of the largest energy."));
        foreach (var w in result.Warnings) o.WriteLine("Warning: " + w);
        o.WriteLine("Element forces are k(u_A − u_B) and c(u̇_A − u̇_B) with A and B as in 'between'; reactions are the force each support receives.");
        o.WriteLine();
        o.WriteLine("Caution: " + Cautions.Text);
    }

    private static string Num(double v) => v == 0 ? "0" : Math.Abs(v) >= 1e-3 && Math.Abs(v) < 1e6 ? v.ToString("G4", Inv) : v.ToString("0.000E+00", Inv);

    /// <summary>An RMS, or "n/a" when the window held no step.</summary>
    private static string Rms(double v) => double.IsNaN(v) ? "n/a" : Num(v);

    private static string Time(double t) => t.ToString("F4", Inv);

    private static string Describe(TransientExcitation load) => load switch
    {
        ForceHistory { Time: UnbalanceSpeedRamp r } f => string.Create(Inv,
            $"{f.Name} (unbalance {f.Scale:G4} kg*m at {f.Mass}, {60 * r.FromRadPerSecond / (2 * Math.PI):G5} to {60 * r.ToRadPerSecond / (2 * Math.PI):G5} rpm over {r.Over:G4} s from {r.Start:G4} s)"),
        ForceHistory f => $"{f.Name} ({Shape(f.Time)} force at {f.Mass})",
        SupportAccelerationHistory b => $"{b.Name} ({Shape(b.Acceleration)} acceleration of {b.Support})",
        _ => load.Name,
    };

    private static string Shape(TimeFunction f) => f switch
    {
        StepFunction s => string.Create(Inv, $"step {s.Value:G4} at {s.At:G4} s"),
        RampFunction r => string.Create(Inv, $"ramp {r.From:G4} to {r.To:G4} over {r.Over:G4} s"),
        RectangularPulse p => string.Create(Inv, $"rectangular pulse {p.Amplitude:G4} for {p.Duration:G4} s"),
        HalfSinePulse p => string.Create(Inv, $"half-sine pulse {p.Amplitude:G4} for {p.Duration:G4} s"),
        SineFunction s => string.Create(Inv, $"sine {s.Amplitude:G4} at {s.FrequencyHz:G4} Hz"),
        TableFunction t => string.Create(Inv, $"table of {t.Times.Length} samples to {t.Times[^1]:G4} s"),
        _ => "timed",
    };

    private static string DescribeDamping(DampedSystem system)
    {
        var d = system.Model.Damping;
        var parts = new List<string>();
        if (system.Model.Network.Dampers.Length > 0) parts.Add($"{system.Model.Network.Dampers.Length} discrete damper(s)");
        if (!d.ModalRatios.IsDefaultOrEmpty) parts.Add("modal " + string.Join("/", d.ModalRatios.Select(z => (100 * z).ToString("G3", Inv) + " %")));
        if (d.Rayleigh is { } r) parts.Add(string.Create(Inv, $"Rayleigh a0 = {r.MassCoefficient:G4} 1/s, a1 = {r.StiffnessCoefficient:G4} s"));
        if (d.LossFactor > 0) parts.Add(string.Create(Inv, $"loss factor {d.LossFactor:G3} (not used in time histories)"));
        return parts.Count == 0 ? "none" : string.Join(", ", parts) + (system.IsClassical ? "" : " (not classical)");
    }
}
