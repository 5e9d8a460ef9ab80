using System.CommandLine;
using System.Globalization;
using ModalChain.Cli.Formatting;
using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Units;
using ModalChain.Io.Csv;
using ModalChain.Io.Json;

namespace ModalChain.Cli.Commands;

/// <summary><c>modalchain transient FILE</c>: response in time to the model's timed loads and initial conditions.</summary>
internal static class TransientCommand
{
    private const int ProgressFromSteps = 20_000;

    public static Command Create(Streams io)
    {
        var file = CommonOptions.ModelFile();
        var format = CommonOptions.Format();
        var method = CommandValues.Choice<TransientMethod?>("--method",
            "newmark (average acceleration), hht (with high-frequency damping), exact (state space, small models) or modal (lowest modes, long runs); default: the file's 'method'.",
            ("newmark", TransientMethod.Newmark), ("hht", TransientMethod.Hht), ("exact", TransientMethod.Exact), ("modal", TransientMethod.Modal));
        var step = CommandValues.Quantity("--step", Quantity.Time, "Time step, e.g. '1 ms' (overrides the file's 'step').", ValueBound.Positive);
        var duration = CommandValues.Quantity("--duration", Quantity.Time, "Simulated time, e.g. '6 s' (overrides the file's 'duration').", ValueBound.Positive);
        var outputs = new Option<string[]>("--output")
        {
            Description = "Record this mass (repeat for several); overrides 'outputs' of the file. Default: every mass.",
            AllowMultipleArgumentsPerToken = true,
        };
        var count = CommandValues.Count("--count",
            "Modal method: keep the lowest N modes (overrides the file's 'modes'; default: all, or the lowest 30 above 300 masses).", 1);
        var loadsOption = CommonOptions.NameList("--loads",
            "Run with these timed loads only, e.g. --loads fan-start,door-slam (names joined by commas, or the option repeated); overrides 'loads' of the file's 'transient' section.");
        var casesOption = CommonOptions.NameList("--cases",
            "Run with the loads of these load cases (under 'load-cases'), e.g. --cases exhaust-fan: each harmonic load acts as its steady sinusoid " +
            "at its running speed, switched on at t = 0 from the initial state, with the phases written (several cases act together); " +
            "added to the timed loads of --loads, in place of the file's transient loads.");
        var solver = CommonOptions.Solver();
        var units = CommonOptions.Units();
        var command = new Command("transient",
            "Response in time to the model's timed loads (steps, pulses, sines, recorded tables, run-ups and run-downs of a " +
            "rotating unbalance, support accelerations) from its initial conditions: displacement, velocity and acceleration " +
            "of each output mass, spring and damper forces and support reactions, with their peaks and RMS and an energy " +
            "balance. The run comes from the file's 'transient' section; the options override it. A progress bar is shown " +
            "on long runs, only on a terminal and only with the table format.")
        { file, method, step, duration, outputs, count, loadsOption, casesOption, solver, format, units };
        command.SetAction(parse =>
        {
            var path = parse.GetValue(file)!;
            var document = CommonOptions.Load(path, io);
            if (document is null) return ExitCodes.InputError;
            if (CommonOptions.SolverOf(parse, solver, io) is not { } choice) return ExitCodes.InputError;
            var spec = document.Transient;
            var stepValue = parse.GetValue(step);
            var durationValue = parse.GetValue(duration);
            if (document.Circuit is { } circuit) return CircuitCommands.Transient(io, document, circuit, parse.GetValue(format), durationValue?.Si, stepValue?.Si);
            if (spec is null && (stepValue is null || durationValue is null))
                return Fail(io, $"{path}: the model has no 'transient' section; add one (see docs/model-format.md) or give --duration and --step");
            spec ??= new TransientSpec([], [], new TransientSettings(1, 1));
            var settings = spec.Settings;

            if (durationValue is not null) settings = settings with { Duration = durationValue.Si };
            if (stepValue is not null) settings = settings with { Step = stepValue.Si };
            if (settings.Step > settings.Duration)
                return Fail(io, string.Create(CultureInfo.InvariantCulture, $"the step ({settings.Step:G4} s) is longer than the duration ({settings.Duration:G4} s)"));
            if (settings.Duration / settings.Step > TransientSettings.MaxSteps)
                return Fail(io, string.Create(CultureInfo.InvariantCulture, $"{settings.Duration / settings.Step:G3} steps is more than {TransientSettings.MaxSteps:G2}; lengthen the step or shorten the run"));
            if (parse.GetValue(method) is { } chosen) settings = settings with { Method = chosen };
            if (parse.GetValue(count) is { } modeCount) settings = settings with { ModeCount = modeCount };
            var chosenOutputs = parse.GetValue(outputs);
            if (chosenOutputs is { Length: > 0 })
            {
                var unknown = SpatialSupport.UnknownOutputs(document.Network, chosenOutputs);
                if (unknown.Length > 0)
                    return Fail(io, $"--output names {string.Join(", ", unknown.Select(u => $"'{u}'"))}, which {SpatialSupport.NotOutputs(document.Network, unknown.Length)} of the model");
                settings = settings with { Outputs = [.. chosenOutputs.Distinct()] };
            }

            var loadNames = spec.Loads;
            var chosenCases = CommonOptions.Names(parse.GetValue(casesOption));
            var caseLoads = new List<TransientExcitation>();
            if (chosenCases.Length > 0)
            {
                if (document.LoadCases.IsEmpty)
                    return Fail(io, $"--cases names load cases, but {path} has no 'load-cases' section (see docs/model-format.md)");
                foreach (var name in chosenCases.Where(n => document.LoadCases.All(c => c.Name != n)))
                    return Fail(io, $"--cases names '{name}', which is not a load case of the model; the load cases are: {string.Join(", ", document.LoadCases.Select(c => c.Name))}");
                foreach (var loadName in chosenCases.SelectMany(n => document.LoadCases.First(c => c.Name == n).Loads).Distinct())
                {
                    var load = document.Structure.FindLoad(loadName)!;
                    if (load.SpeedHz is not > 0)
                        return Fail(io, $"--cases: load '{loadName}' has no running speed ('speed:'), so it has no frequency to act at in time; give it one, or run it in the harmonic response");
                    caseLoads.AddRange(SteadyLoadHistories.Of(load));
                }
                // The cases replace the file's transient loads; --loads adds timed loads to them.
                loadNames = [];
            }
            if (CommonOptions.Names(parse.GetValue(loadsOption)) is { Length: > 0 } chosenLoads)
            {
                var timed = document.TimedLoads.Select(l => l.Name).Distinct().ToArray();
                foreach (var name in chosenLoads.Where(n => !timed.Contains(n)))
                {
                    var harmonic = document.Structure.FindLoad(name) is not null;
                    return Fail(io, $"--loads names '{name}', which is {(harmonic ? "a harmonic load (it has no 'time' function)" : "not a load of the model")}; " +
                        (timed.Length == 0 ? "the model has no load with a 'time' function" : $"the timed loads are: {string.Join(", ", timed)}"));
                }
                loadNames = [.. chosenLoads];
            }
            var loads = !loadNames.IsEmpty
                ? loadNames.SelectMany(n => document.TimedLoads.Where(l => l.Name == n)).ToList() // an unbalance turning in a plane is two histories of one name
                : chosenCases.Length > 0 ? new List<TransientExcitation>()
                : document.TimedLoads.ToList();
            loads.AddRange(caseLoads);
            if (loads.Count == 0 && spec.Initial.IsEmpty)
                return Fail(io, $"{path}: nothing to respond to; give loads a 'time' function (see docs/model-format.md) or 'initial' conditions under 'transient'");

            if (settings.Method == TransientMethod.Exact && document.Network.Masses.Length > TransientAnalysis.ExactMethodMaxDofs)
                return Fail(io, $"the exact method is limited to {TransientAnalysis.ExactMethodMaxDofs} masses (this model has {document.Network.Masses.Length}); use --method newmark or modal");
            // Only the modes the run uses: the time-step checks need the lowest few, not an all-mode solve.
            var system = DampedSystem.Build(document.Structure,
                new ModalOptions(TransientAnalysis.ModesNeeded(document.Network.Masses.Length, settings), Choice: choice));
            var chosenFormat = parse.GetValue(format);
            // The bar goes to a terminal only, and never with JSON or CSV (their output may be piped while stderr is not).
            using var bar = chosenFormat == OutputFormat.Table && settings.StepCount >= ProgressFromSteps && !Console.IsOutputRedirected
                ? ProgressBar.ForTerminal(io, 100, "time stepping") : null;
            var result = TransientAnalysis.Run(system, loads, spec.Initial, settings, bar is null ? null : new PercentProgress(bar));
            bar?.Dispose();
            switch (chosenFormat)
            {
                case OutputFormat.Json:
                    io.WriteJson(stream => TransientJson.Write(stream, document, result, [.. loads.Select(l => l.Name).Distinct()], CliApp.Version));
                    break;
                case OutputFormat.Csv:
                    TransientCsv.Write(io.Output, result);
                    break;
                default:
                    TransientTable.Write(io.Output, document, system, result, loads, CommonOptions.UnitsOf(parse, units, document));
                    break;
            }
            return ExitCodes.Success;
        });
        return command;
    }

    private static int Fail(Streams io, string message)
    {
        io.Error.WriteLine($"modalchain: error: {message}");
        return ExitCodes.InputError;
    }

    /// <summary>Turns the analysis's fraction of steps done into whole percent for the shared progress bar.</summary>
    private sealed class PercentProgress(IProgress<int> bar) : IProgress<double>
    {
        public void Report(double value) => bar.Report((int)Math.Round(100 * Math.Clamp(value, 0, 1)));
    }
}
