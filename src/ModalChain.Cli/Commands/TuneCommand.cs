using System.Collections.Immutable;
using System.CommandLine;
using System.Globalization;
using ModalChain.Core;
using ModalChain.Core.Analyses.Absorbers;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Units;
using ModalChain.Io.Files;
using ModalChain.Io.Json;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Cli.Commands;

/// <summary><c>modalchain tune FILE --host MASS --mass-ratio 5 %</c>: sizes a tuned vibration absorber for one mode.</summary>
internal static class TuneCommand
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static Command Create(Streams io)
    {
        var file = CommonOptions.ModelFile();
        var host = AbsorberArguments.Host("--host", required: true);
        var ratio = AbsorberArguments.MassRatio(required: true);
        var mode = AbsorberArguments.Mode("--mode");
        var speed = CommandValues.Quantity("--speed", Quantity.Frequency,
            "Running speed to choose the mode by, e.g. '1480 rpm' (overrides the speeds of criteria.separation).", ValueBound.Positive);
        var target = CommandValues.Choice("--target",
            "force (harmonic force over the mode's band; Den Hartog; the default), base (harmonic base acceleration; Warburton 1982), random-force (white-noise force; Warburton 1982) " +
            "or speed (a constant-speed machine: the least worst response at the running speeds ± --speed-tolerance).",
            ("force", AbsorberTarget.Force), ("base", AbsorberTarget.BaseAcceleration), ("random-force", AbsorberTarget.RandomForce), ("speed", AbsorberTarget.RunningSpeed));
        var tolerance = AbsorberArguments.SpeedTolerance("--speed-tolerance");
        var method = AbsorberArguments.Method("--method");
        var format = CommonOptions.Format(OutputFormat.Table, OutputFormat.Json);
        var units = CommonOptions.Units();
        var write = new Option<string?>("--write")
        {
            Description = "Also write the model with the absorber added to this file, ready for every other command. Written atomically " +
                "(a failed run leaves no partial file); an existing file is replaced only with --force, and never the model that was read.",
        };
        var force = new Option<bool>("--force") { Description = "Let --write replace an existing file (never the model that was read)." };
        var command = new Command("tune",
            "Size a tuned vibration absorber (mass, spring, damper) for one mode, from the mode's modal mass at the host " +
            "(1/phi_host^2 with mass-normalised shapes) and the classical optimum for the target excitation. The damping " +
            "ratio printed is the absorber's own, c/(2*sqrt(k*m)).")
        { file, host, ratio, mode, speed, target, tolerance, method, format, units, write, force };
        command.SetAction(parse =>
        {
            var path = parse.GetValue(file)!;
            var document = CommonOptions.Load(path, io);
            if (document is null) return ExitCodes.InputError;
            if (document.Circuit is not null) return CircuitCommands.NotForCircuits(io, path, "tune");
            // Checked before the work, so a refused --write costs nothing.
            if (parse.GetValue(write) is { } destination && RefuseOutput(document.File, destination, parse.GetValue(force), io)) return ExitCodes.InputError;
            var excitations = Excitations(document, parse.GetValue(speed));
            if (excitations is null) return ExitCodes.InputError;
            var modal = ModalAnalysis.Solve(document.Network);
            var request = AbsorberArguments.Request(modal, parse.GetValue(host)!, parse.GetValue(ratio)!, parse.GetValue(mode), excitations.Value,
                parse.GetValue(target), io, parse.GetValue(tolerance));
            if (request is null) return ExitCodes.InputError;
            var tuned = AbsorberStudy.Run(document.Structure, modal, request, AbsorberArguments.IsOptimal(parse.GetValue(method)), OperatingLoads.Of(document), document.Cases);
            var (design, names, assessment, improvement) = (tuned.Design, tuned.Names, tuned.Assessment, tuned.Improvement);

            if (parse.GetValue(write) is { } output)
            {
                var code = WriteModel(document, design, names, output, parse.GetValue(force), io);
                if (code != ExitCodes.Success) return code;
            }
            if (parse.GetValue(format) == OutputFormat.Json)
            {
                io.WriteJson(stream => TuneJson.Write(stream, document, tuned, CliApp.Version));
            }
            else WriteTable(io.Output, document, tuned, request, CommonOptions.UnitsOf(parse, units, document));
            return ExitCodes.Success;
        });
        return command;
    }

    private static string Peak(double value) =>
        double.IsNaN(value) ? "none in the band" : double.IsFinite(value) ? value.ToString("F4", Inv) : "unbounded (no damping acts on that resonance)";

    private static string EdgeNote(Core.Analyses.Harmonic.SweepEdge edge) => edge switch
    {
        Core.Analyses.Harmonic.SweepEdge.Start => " (the response is larger at the band's low end, rising out of the band)",
        Core.Analyses.Harmonic.SweepEdge.End => " (the response is larger at the band's high end, rising out of the band)",
        _ => "",
    };

    private static string Change(double value, double reference) =>
        double.IsFinite(value) && double.IsFinite(reference) && reference > 0 ? string.Create(Inv, $"{100 * (value / reference - 1):+0.0;-0.0} %") : "-";

    private static ImmutableArray<double>? Excitations(ModelDocument document, CommandValue? speed)
    {
        if (speed is not null)
        {
            var orders = document.Criteria.Separation?.Orders ?? [1.0];
            return [.. orders.Select(h => h * speed.Si)];
        }
        return OperatingLoads.AbsorberExcitations(document);
    }

    /// <summary>True (after printing why) when --write must not write <paramref name="output"/>: no name, a folder, the model itself, or an existing file without --force.</summary>
    private static bool RefuseOutput(string model, string output, bool force, Streams io)
    {
        string? problem = null;
        try
        {
            if (string.IsNullOrWhiteSpace(output) || output.Contains('\0')) problem = "--write must name a file";
            else if (Directory.Exists(output)) problem = $"--write {output} is a folder; give a file name";
            else if (Path.Exists(output) && FilePaths.SameFile(output, model))
                problem = $"--write {output} is the model that was read ({model}); it is never overwritten, so choose another file name";
            else if (Path.Exists(output) && !force) problem = $"--write {output} exists; add --force to replace it, or choose another file name";
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            problem = $"--write {output}: {e.Message}";
        }
        if (problem is null) return false;
        io.Error.WriteLine($"modalchain: error: {problem}; nothing was written.");
        return true;
    }

    private static int WriteModel(ModelDocument document, AbsorberDesign design, AbsorberNames names, string output, bool force, Streams io)
    {
        var network = AbsorberTuning.Attach(document.Network, design, names);
        string original;
        try { original = File.ReadAllText(document.File); }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            io.Error.WriteLine($"modalchain: error: cannot read {document.File} again to write {output}: {e.Message}");
            return ExitCodes.InputError;
        }
        var text = ModelWriter.WithAdditions(original, document.File, network,
        [
            $"Written by modalchain tune from {Path.GetFileName(document.File)} (sha256 {document.Sha256[..12]}).",
            string.Create(Inv, $"Absorber '{names.Mass}' on '{design.Host}' for mode {design.ModeNumber} ({design.ModeFrequencyHz:F3} Hz), mass ratio {design.Optimum.MassRatio * 100:G4} %."),
        ]);
        try { AtomicFile.WriteAllText(output, text, overwrite: force); }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            io.Error.WriteLine($"modalchain: error: cannot write {output}: {e.Message}; nothing was written.");
            return ExitCodes.InputError;
        }
        io.Error.WriteLine($"wrote {output}: the model with absorber mass '{names.Mass}', spring '{names.Spring}'{(design.Damping > 0 ? $" and damper '{names.Damper}'" : "")}");
        return ExitCodes.Success;
    }

    private static void WriteTable(TextWriter o, ModelDocument document, TunedAbsorber tuned, AbsorberRequest request, Reports.Units.DisplayUnits units)
    {
        var (mass, stiffness, damping) = (units.MassUnit, units.StiffnessUnit, units.DampingUnit);
        var (d, a, improvement) = (tuned.Design, tuned.Assessment, tuned.Improvement);
        o.WriteLine(TerminalText.Line(document.Network.Title));
        o.WriteLine();
        var targetText = d.Target switch
        {
            AbsorberTarget.Force => "harmonic force on the structure, over the mode's band",
            AbsorberTarget.BaseAcceleration => "harmonic base acceleration",
            AbsorberTarget.RunningSpeed => string.Create(Inv, $"harmonic force at the running speed(s) {string.Join(", ", d.ExcitationsHz.Select(f => f.ToString("G6", Inv)))} Hz ± {d.SpeedTolerance * 100:G3} %"),
            _ => "white-noise force",
        };
        o.WriteLine(string.Create(Inv, $"Mode controlled:        {d.ModeNumber} at {d.ModeFrequencyHz:F4} Hz ({d.ChosenBy})"));
        o.WriteLine(string.Create(Inv, $"Host:                   {d.Host}; modal mass there 1/phi^2 = {mass.From(d.ModalMass):G6} {mass.Plain}"));
        o.WriteLine(string.Create(Inv, $"Mass ratio:             {d.Optimum.MassRatio * 100:G4} %"));
        o.WriteLine($"Tuned for:              {targetText}");
        o.WriteLine($"Method used:            {tuned.Method}: {tuned.MethodDescription}");
        o.WriteLine();
        o.WriteLine("Absorber");
        o.WriteLine(string.Create(Inv, $"  mass                  {mass.From(d.Mass):G6} {mass.Plain}"));
        o.WriteLine(string.Create(Inv, $"  stiffness             {stiffness.From(d.Stiffness):G6} {stiffness.Plain}"));
        o.WriteLine(string.Create(Inv, $"  damping coefficient   {damping.From(d.Damping):G6} {damping.Plain}"));
        o.WriteLine(string.Create(Inv, $"  tuned frequency       {d.FrequencyHz:F4} Hz (ratio to the mode {d.FrequencyHz / d.ModeFrequencyHz:F6})"));
        o.WriteLine(string.Create(Inv, $"  damping ratio         {d.DampingRatio:F6}  (absorber's own: c/(2*sqrt(k*m)))"));
        o.WriteLine(string.Create(Inv, $"                        {d.DampingRatioPrimaryReferenced:F6}  (the same damper referred to the mode's frequency: c/(2*m*omega_p))"));
        if (d.Target == AbsorberTarget.Force)
            o.WriteLine(string.Create(Inv, $"  expected peak         {d.Optimum.PeakAmplification:F4} x static deflection at the host (fixed-point value sqrt(1+2/mu), undamped single-mode primary)"));
        o.WriteLine();
        o.WriteLine(string.Create(Inv, $"On the full model (all modes, the model's damping), harmonic force at '{d.Host}', band {a.BandHz.Low:F2}-{a.BandHz.High:F2} Hz (0.5-1.5 f_p):"));
        o.WriteLine("  each peak belongs to the mode of the model without the absorber whose shape matches best (MAC) the nearest mode with it");
        o.WriteLine("  peaks are |x_host| * K / |F| with K = modal mass * omega_p^2 (the static deflection of the mode's equivalent spring)");
        o.WriteLine($"  peak before           {Peak(a.PeakBefore)}{EdgeNote(a.PeakBeforeRisingAt)}");
        o.WriteLine(string.Create(Inv, $"  peak after            {Peak(a.PeakAfter)} at {a.PeakFrequencyHz:F3} Hz, mode {a.PeakAfterMode}'s peak{EdgeNote(a.PeakAfterRisingAt)}"));
        foreach (var n in a.Neighbours)
            o.WriteLine(string.Create(Inv, $"  mode {n.ModeNumber} ({n.FrequencyHz:F3} Hz)   peak {Peak(n.PeakBefore)} before, {Peak(n.PeakAfter)} after (a neighbouring mode, not controlled)"));
        if (a.AtSpeeds.IsEmpty) o.WriteLine("  at running speeds     not computed: no running speed is given (--speed, criteria.separation.speeds or a load's speed)");
        foreach (var sp in a.AtSpeeds)
            o.WriteLine(string.Create(Inv, $"  at {sp.FrequencyHz,8:G6} Hz         {Peak(sp.Before)} before, {Peak(sp.After)} after (running speed x order)"));
        o.WriteLine(string.Create(Inv, $"  absorber stroke       {units.Compliance.From(a.StrokePerForce):G4} {units.Compliance.Plain} (stroke per force at the host), at {a.PeakFrequencyHz:F3} Hz (relative to the host)"));
        o.WriteLine(double.IsFinite(a.OperatingStroke)
            ? string.Create(Inv, $"  stroke in operation   {units.Displacement.From(a.OperatingStroke):G4} {units.Displacement.Plain} peak {a.OperatingStrokeBasis}")
            : "  stroke in operation   not computed: no load of the model has a running speed");
        if (improvement is not null) o.WriteLine($"  optimal tuning:       {improvement}");
        o.WriteLine("  mistuning (absorber frequency off, same mass and damping ratio):");
        var speeds = !a.AtSpeeds.IsEmpty;
        var table = speeds
            ? new Formatting.TextTable("frequency error", "absorber [Hz]", "peak after", "vs tuned", "worst at speeds", "vs tuned")
            : new Formatting.TextTable("frequency error", "absorber [Hz]", "peak after", "vs tuned");
        var tunedAtSpeeds = speeds ? a.AtSpeeds.Max(s => s.After) : double.NaN;
        foreach (var p in a.Mistuning)
        {
            string[] cells = [string.Create(Inv, $"{p.FrequencyError * 100:+0;-0} %"), (d.FrequencyHz * (1 + p.FrequencyError)).ToString("F3", Inv), Peak(p.Peak),
                Change(p.Peak, a.PeakAfter)];
            table.Add(speeds ? [.. cells, Peak(p.AtSpeeds), Change(p.AtSpeeds, tunedAtSpeeds)] : cells);
        }
        var lines = new StringWriter();
        table.Write(lines);
        foreach (var line in lines.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries)) o.WriteLine("    " + line);
        foreach (var warning in tuned.Warnings) o.WriteLine("  warning: " + warning);
        o.WriteLine("  With the absorber, two modes sit either side of the controlled frequency: judge the fix by the vibration limits, not by separation.");
        if (request.MassRatio > AbsorberTuning.LargeMassRatio)
            o.WriteLine(string.Create(Inv, $"Note: a mass ratio above {AbsorberTuning.LargeMassRatio * 100:G3} % stretches the single-mode approximation; check the result on the full model."));
        o.WriteLine();
        o.WriteLine("Absorber caution: " + AbsorberCaution.Text);
        o.WriteLine();
        o.WriteLine("Caution: " + Cautions.Text);
    }
}
