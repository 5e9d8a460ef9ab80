using System.CommandLine;
using System.Globalization;
using ModalChain.Cli.Formatting;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Units;
using ModalChain.Io.Csv;
using ModalChain.Io.Json;
using ModalChain.Io.Model;

namespace ModalChain.Cli.Commands;

/// <summary><c>modalchain harmonic FILE</c>: steady-state response to the model's harmonic loads over a frequency sweep.</summary>
internal static class HarmonicCommand
{
    // The same limits as the 'frequencies' range of a model file (docs/model-format.md): a sweep of a million points
    // took over 40 s, and --points 2147483647 failed to allocate its arrays (an internal error).
    private const int MaxPoints = ModelReader.MaxSweepPoints;
    private const double MaxFrequencyHz = 1e5;

    public static Command Create(Streams io)
    {
        var file = CommonOptions.ModelFile();
        var format = CommonOptions.Format();
        var outputs = new Option<string[]>("--output")
        {
            Description = "Report this mass (repeat for several); overrides 'outputs' of the file. Default: every mass.",
            AllowMultipleArgumentsPerToken = true,
        };
        var from = CommandValues.Quantity("--from", Quantity.Frequency, "Lowest frequency of the sweep (overrides the file's range).", ValueBound.Positive);
        var to = CommandValues.Quantity("--to", Quantity.Frequency, "Highest frequency of the sweep.", ValueBound.Positive);
        var points = CommandValues.Count("--points", "Number of points of the sweep (at least 2; default 400 when the file gives none).", 2);
        var method = CommandValues.Choice<HarmonicMethod?>("--method",
            "direct (exact, any damping) or modal (superposition with residual flexibility); default: the file's 'method', else direct.",
            ("direct", HarmonicMethod.Direct), ("modal", HarmonicMethod.Modal));
        var count = CommandValues.Count("--count",
            "Modal method: superpose the lowest N modes (overrides the file's 'modes'; default: every mode below twice the " +
            "highest frequency). Models of more than 300 masses solve only these modes.", 1);
        var casesOption = CommonOptions.NameList("--cases",
            "Sweep these load cases only, e.g. --cases exhaust-fan,supply-fan (names joined by commas, or the option repeated); overrides 'cases' of the file's 'harmonic' section.");
        var solver = CommonOptions.Solver();
        var units = CommonOptions.Units();
        var command = new Command("harmonic",
            "Steady-state response to the model's harmonic loads (forces, rotating unbalances, support motions) over a " +
            "frequency sweep: displacement, velocity and acceleration of each output mass, spring and damper forces, support " +
            "reactions and transmissibility, the peak of each over the sweep, and the response at each load's running speed. " +
            "A model with 'load-cases' is swept case by case and the cases are combined at their running speeds by the stated rule. " +
            "The sweep comes from the file's 'harmonic' section; --from/--to/--points override it.")
        { file, outputs, from, to, points, method, count, casesOption, solver, format, units };
        command.SetAction(parse =>
        {
            var path = parse.GetValue(file)!;
            var stages = StageTimes.FromEnvironment(io);
            var document = CommonOptions.Load(path, io);
            if (document is null) return ExitCodes.InputError;
            if (CommonOptions.SolverOf(parse, solver, io) is not { } choice) return ExitCodes.InputError;
            stages?.Mark("read and check");
            var model = document.Structure;
            var spec = document.Harmonic;
            var fromHz = parse.GetValue(from)?.Si;
            var toHz = parse.GetValue(to)?.Si;
            var pointCount = parse.GetValue(points);
            if (document.Circuit is { } circuit) return CircuitCommands.Harmonic(io, document, circuit, parse.GetValue(format), fromHz, toHz, pointCount);

            if (model.Loads.IsEmpty)
                return Fail(io, $"{path}: the model has no 'loads'; a harmonic response needs at least one (see docs/model-format.md)");
            if (spec is null && (fromHz is null || toHz is null))
                return Fail(io, $"{path}: the model has no 'harmonic' section; add one or give --from and --to");
            spec ??= new HarmonicSpec([], new FrequencyRange(1, 2, 2, FrequencySpacing.Linear), true, [], HarmonicMethod.Direct);

            if (fromHz is not null || toHz is not null || pointCount is not null)
            {
                var range = spec.Frequencies as FrequencyRange;
                var f0 = fromHz ?? range?.FromHz;
                var f1 = toHz ?? range?.ToHz;
                if (f0 is null || f1 is null)
                    return Fail(io, "--points alone cannot change an explicit frequency list; give --from and --to as well");
                if (!(f0 > 0) || !double.IsFinite(f0.Value)) return Fail(io, "--from must be a positive frequency in Hz");
                if (!(f1 > f0) || !double.IsFinite(f1.Value))
                    return Fail(io, string.Create(CultureInfo.InvariantCulture, $"--to ({f1} Hz) must be above --from ({f0} Hz)"));
                if (f1 > MaxFrequencyHz)
                    return Fail(io, string.Create(CultureInfo.InvariantCulture, $"--to ({f1} Hz) is above {MaxFrequencyHz} Hz, the highest frequency a model's sweep accepts"));
                var n = pointCount ?? range?.Points ?? 400;
                if (n < 2) return Fail(io, "--points must be at least 2");
                if (n > MaxPoints) return Fail(io, string.Create(CultureInfo.InvariantCulture, $"--points {n} is more than {MaxPoints}, the most a sweep accepts"));
                spec = spec with { Frequencies = new FrequencyRange(f0.Value, f1.Value, n, range?.Spacing ?? FrequencySpacing.Linear) };
            }
            var chosen = parse.GetValue(outputs);
            if (chosen is { Length: > 0 })
            {
                var unknown = SpatialSupport.UnknownOutputs(model.Network, chosen);
                if (unknown.Length > 0)
                    return Fail(io, $"--output names {string.Join(", ", unknown.Select(u => $"'{u}'"))}, which {SpatialSupport.NotOutputs(model.Network, unknown.Length)} of the model");
                spec = spec with { Outputs = [.. chosen.Distinct()] };
            }
            if (parse.GetValue(method) is { } m) spec = spec with { Method = m };
            if (parse.GetValue(count) is { } modeCount) spec = spec with { ModeCount = modeCount };

            var selection = document.Cases;
            if (CommonOptions.Names(parse.GetValue(casesOption)) is { Length: > 0 } chosenCases)
            {
                if (document.LoadCases.IsEmpty)
                    return Fail(io, $"--cases names load cases, but {path} has no 'load-cases' section (see docs/model-format.md)");
                foreach (var name in chosenCases.Where(n => document.LoadCases.All(c => c.Name != n)))
                    return Fail(io, $"--cases names '{name}', which is not a load case of the model; the load cases are: {string.Join(", ", document.LoadCases.Select(c => c.Name))}");
                selection = new LoadCaseSelection([.. chosenCases.Select(n => document.LoadCases.First(c => c.Name == n))], selection?.Rule ?? CaseCombination.Sum);
            }
            var system = HarmonicAnalysis.Assemble(model, spec, choice);
            stages?.Mark("assemble (modes solved here for the modal method)");
            if (selection is { } cases)
            {
                var byCase = LoadCaseAnalysis.Solve(system, spec, cases);
                switch (parse.GetValue(format))
                {
                    case OutputFormat.Json:
                        io.WriteJson(stream => HarmonicJson.Write(stream, document, byCase, CliApp.Version));
                        break;
                    case OutputFormat.Csv:
                        HarmonicCsv.Write(io.Output, byCase, document.Network);
                        break;
                    default:
                        HarmonicCaseTable.Write(io.Output, document, system, byCase, CommonOptions.UnitsOf(parse, units, document));
                        break;
                }
                return ExitCodes.Success;
            }
            var result = HarmonicAnalysis.Solve(system, spec);
            stages?.Mark("sweep");
            switch (parse.GetValue(format))
            {
                case OutputFormat.Json:
                    io.WriteJson(stream => HarmonicJson.Write(stream, document, result, CliApp.Version));
                    break;
                case OutputFormat.Csv:
                    HarmonicCsv.Write(io.Output, result, document.Network);
                    break;
                default:
                    HarmonicTable.Write(io.Output, document, system, result, CommonOptions.UnitsOf(parse, units, document));
                    break;
            }
            stages?.Mark("write");
            stages?.Report();
            return ExitCodes.Success;
        });
        return command;
    }

    private static int Fail(Streams io, string message)
    {
        io.Error.WriteLine($"modalchain: error: {message}");
        return ExitCodes.InputError;
    }
}
