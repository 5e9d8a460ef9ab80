using System.Collections.Immutable;
using System.CommandLine;
using System.Globalization;
using ModalChain.Cli.Formatting;
using ModalChain.Core;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Analyses.Studies;
using ModalChain.Core.Model;
using ModalChain.Core.Units;
using ModalChain.Io.Csv;
using ModalChain.Io.Json;
using ModalChain.Io.Model;

namespace ModalChain.Cli.Commands;

/// <summary><c>modalchain study FILE --vary PATH --from A --to B</c>: a parameter study, or with <c>--vary speed</c> a speed-frequency chart.</summary>
internal static class StudyCommand
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    // The same limit as a parameter study's steps (StudyRequest.Problems): the chart is drawn from these points, and
    // --steps 100000000 ran for minutes.
    private const int MaxSpeedSteps = 100_000;

    // The highest running speed a model file accepts (6,000,000 rpm); --to 1e308 Hz printed Infinity for the crossings.
    private const double MaxSpeedHz = 1e5;

    public static Command Create(Streams io)
    {
        var file = CommonOptions.ModelFile();
        var vary = new Option<string>("--vary")
        {
            Description = "The numeric field to vary, as section.name.field: masses.NAME.mass, springs.NAME.stiffness or " +
                          "dampers.NAME.coefficient. 'speed' instead gives the speed-frequency chart (natural frequencies " +
                          "against running speed with the order lines and their crossings).",
            Required = true,
        };
        var from = new Option<string>("--from") { Description = "First value with its unit, e.g. '50 kN/mm' (for speed: '0 rpm').", Required = true };
        var to = new Option<string>("--to") { Description = "Last value with its unit, e.g. '200 kN/mm'.", Required = true };
        var steps = new Option<int>("--steps") { Description = "Number of values including both ends (default 31).", DefaultValueFactory = _ => 31 };
        var spacing = new Option<string>("--spacing") { Description = "linear or geometric (equal ratios).", DefaultValueFactory = _ => "linear" };
        spacing.AcceptOnlyFromAmong("linear", "geometric");
        var orders = new Option<string?>("--orders") { Description = "Orders for the speed-frequency chart, comma-separated (default: criteria.separation.orders, else 1,2)." };
        var format = CommonOptions.Format();
        var command = new Command("study",
            "Vary one numeric field of the model over a range, re-solve the modes at each value (in parallel), follow each " +
            "mode by its shape (modal assurance criterion) so identities survive frequency crossings, and find " +
            "the values at which each criterion of the model starts or stops passing, by a bracketed root search.\n\n" + CliApp.CautionHelp)
        { file, vary, from, to, steps, spacing, orders, format };
        command.SetAction(parse =>
        {
            var path = parse.GetValue(file)!;
            var document = CommonOptions.Load(path, io);
            if (document is null) return ExitCodes.InputError;
            var varied = parse.GetValue(vary)!;
            if (varied == "speed")
                return SpeedChart(document, parse.GetValue(from)!, parse.GetValue(to)!, parse.GetValue(steps), parse.GetValue(orders), parse.GetValue(format), io);

            var parameter = ParameterPath.Resolve(varied, document.Network, out var error);
            if (parameter is null)
            {
                io.Error.WriteLine($"modalchain: error: --vary: {error}");
                return ExitCodes.InputError;
            }
            var a = CommandValue.Parse(parse.GetValue(from), parameter.Quantity, "--from", io);
            var b = CommandValue.Parse(parse.GetValue(to), parameter.Quantity, "--to", io);
            if (a is null || b is null) return ExitCodes.InputError;
            var criteria = ImmutableArray.CreateBuilder<StudyCriterion>();
            if (document.Criteria.Separation is { } sep) criteria.Add(StudyCriterion.Separation(sep));
            var operatingLoads = OperatingLoads.Of(document).Where(l => l.SpeedHz is > 0).ToArray();
            if (!document.Criteria.Limits.IsDefaultOrEmpty)
            {
                if (operatingLoads.Length == 0)
                    io.Error.WriteLine("note: the model's vibration limits are not followed: no load has a running speed, so there is no operating point.");
                else
                    foreach (var limit in document.Criteria.Limits)
                        criteria.Add(OperatingPointCriteria.Limit(limit, document.Structure, operatingLoads));
            }
            var request = new StudyRequest(parameter, a.Value.Si, b.Value.Si, parse.GetValue(steps),
                parse.GetValue(spacing) == "geometric" ? StudySpacing.Geometric : StudySpacing.Linear, criteria.ToImmutable());
            var problems = request.Problems();
            if (problems.Length > 0)
            {
                foreach (var p in problems) io.Error.WriteLine($"modalchain: error: {p}");
                return ExitCodes.InputError;
            }

            using var bar = ProgressBar.ForTerminal(io, request.Steps, "solving");
            var result = ParameterStudy.Run(document.Network, request, bar);
            bar?.Dispose();
            switch (parse.GetValue(format))
            {
                case OutputFormat.Json:
                    using (var stdout = new MemoryStream())
                    {
                        StudyJson.Write(stdout, document, result, UnitTable.SiSymbol(parameter.Quantity), CliApp.Version);
                        io.Output.WriteLine(System.Text.Encoding.UTF8.GetString(stdout.ToArray()));
                    }
                    break;
                case OutputFormat.Csv:
                    StudyCsv.Write(io.Output, result, UnitTable.SiSymbol(parameter.Quantity));
                    break;
                default:
                    WriteTable(io.Output, document, result, a.Value);
                    break;
            }
            return ExitCodes.Success;
        });
        return command;
    }

    private static void WriteTable(TextWriter o, ModelDocument document, StudyResult result, CommandValue unit)
    {
        var req = result.Request;
        o.WriteLine(document.Network.Title);
        o.WriteLine($"Study of {req.Parameter.Text} from {unit.Show(req.From)} to {unit.Show(req.To)}, {req.Steps} values ({req.Spacing.ToString().ToLowerInvariant()})");
        o.WriteLine("Modes are followed by shape (modal assurance criterion); 'mode k' is the mode numbered k at the first value.");
        o.WriteLine();
        var headers = new List<string> { $"{req.Parameter.Text} [{unit.Unit}]" };
        headers.AddRange(result.Modes.Select(m => $"mode {m.Identity} [Hz]"));
        headers.AddRange(req.Criteria.Select(c => c.Name));
        var table = new TextTable([.. headers]);
        foreach (var s in result.Steps)
        {
            var row = new List<string> { (s.Value / unit.Factor).ToString("G6", Inv) };
            row.AddRange(result.Modes.Select(m => m.FrequenciesHz[s.Index].ToString("F3", Inv)));
            row.AddRange(s.Reserves.Select((r, c) => (r >= 0 ? "pass " : "FAIL ") + CheckCommand.Signed(r) + " %" +
                (req.Criteria[c].Limit is { } limit ? $" ({CheckCommand.Show(limit.Value * (1 - r), limit.Quantity)})" : "")));
            table.Add([.. row]);
        }
        table.Write(o);
        o.WriteLine();
        var crossings = result.Modes.Where(m => m.ModeNumbers.Distinct().Count() > 1).ToList();
        foreach (var m in crossings)
            o.WriteLine($"mode {m.Identity} changes its frequency rank during the study (numbers {string.Join(", ", m.ModeNumbers.Distinct())}): it crosses another mode.");
        var weak = result.Modes.Where(m => m.WorstMac < 0.8).ToList();
        foreach (var m in weak)
            o.WriteLine(string.Create(Inv, $"warning: mode {m.Identity} changes shape strongly between steps (MAC down to {m.WorstMac:F2}); use more steps to follow it with confidence."));
        if (req.Criteria.Length == 0)
            o.WriteLine("No criteria in the model ('criteria:' section), so no thresholds to find.");
        else if (result.Thresholds.Length == 0)
            o.WriteLine("No criterion changes between pass and fail over this range.");
        else
        {
            o.WriteLine("Thresholds (bracketed root search between neighbouring values, to 1e-9 of the value):");
            foreach (var t in result.Thresholds)
                o.WriteLine($"  {t.Criterion}: {(t.PassesAbove ? "starts passing" : "stops passing")} at {unit.Show(t.Value, "G7")} " +
                            $"(passes {(t.PassesAbove ? "above" : "below")} it; between {unit.Show(t.Bracket.Low)} and {unit.Show(t.Bracket.High)})");
            o.WriteLine("  A change that happens and reverses between two neighbouring values is not seen; use more steps to be sure.");
        }
        o.WriteLine();
        o.WriteLine("Caution: " + Cautions.Text);
    }

    private static int SpeedChart(ModelDocument document, string fromText, string toText, int points, string? ordersText, OutputFormat format, Streams io)
    {
        var a = CommandValue.Parse(fromText, Quantity.Frequency, "--from", io);
        var b = CommandValue.Parse(toText, Quantity.Frequency, "--to", io);
        if (a is null || b is null) return ExitCodes.InputError;
        if (a.Value.Si < 0 || !(b.Value.Si > a.Value.Si) || b.Value.Si > MaxSpeedHz)
        {
            io.Error.WriteLine(string.Create(Inv, $"modalchain: error: the speed range needs 0 <= --from < --to <= {MaxSpeedHz} Hz"));
            return ExitCodes.InputError;
        }
        if (points < 2 || points > MaxSpeedSteps)
        {
            io.Error.WriteLine(string.Create(Inv, $"modalchain: error: --steps must be from 2 to {MaxSpeedSteps} (got {points})"));
            return ExitCodes.InputError;
        }
        var orders = new List<double>();
        if (ordersText is not null)
        {
            foreach (var part in ordersText.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries))
            {
                if (!double.TryParse(part, NumberStyles.Float, Inv, out var h) || !(h > 0) || !double.IsFinite(h))
                {
                    io.Error.WriteLine($"modalchain: error: --orders: '{part}' is not a positive number");
                    return ExitCodes.InputError;
                }
                orders.Add(h);
            }
            if (orders.Count == 0)
            {
                io.Error.WriteLine("modalchain: error: --orders lists no order");
                return ExitCodes.InputError;
            }
        }
        else orders.AddRange(document.Criteria.Separation?.Orders ?? [1.0, 2.0]);

        var modal = ModalAnalysis.Solve(document.Network);
        var chart = SpeedFrequencyChart.Build([.. modal.Modes.Select(m => (m.Number, m.NaturalFrequencyHz))], a.Value.Si, b.Value.Si, points, orders);
        if (format == OutputFormat.Json)
        {
            using var stdout = new MemoryStream();
            StudyJson.WriteChart(stdout, document, chart, CliApp.Version);
            io.Output.WriteLine(System.Text.Encoding.UTF8.GetString(stdout.ToArray()));
            return ExitCodes.Success;
        }
        if (format == OutputFormat.Csv)
        {
            io.Output.WriteLine(string.Join(',', new[] { "speed [rpm]", "speed [Hz]" }
                .Concat(chart.ModeNumbers.Select(n => $"mode {n} [Hz]")).Concat(chart.Orders.Select(h => $"order {h.ToString("G4", Inv)} [Hz]"))));
            foreach (var s in chart.SpeedsHz)
                io.Output.WriteLine(string.Join(',', new[] { (s * 60).ToString("R", Inv), s.ToString("R", Inv) }
                    .Concat(chart.NaturalFrequenciesHz.Select(f => f.ToString("R", Inv))).Concat(chart.Orders.Select(h => (h * s).ToString("R", Inv)))));
            return ExitCodes.Success;
        }
        var o = io.Output;
        o.WriteLine(document.Network.Title);
        o.WriteLine($"Speed-frequency chart from {a.Value.Show(a.Value.Si)} to {b.Value.Show(b.Value.Si)}: orders {string.Join(", ", chart.Orders.Select(h => h.ToString("G4", Inv) + "x"))}");
        o.WriteLine("Natural frequencies of this structure do not depend on the machine's speed; an order line h x speed meets mode n at speed = f_n / h.");
        o.WriteLine();
        var table = new TextTable("speed [rpm]", "speed [Hz]", "order", "mode", "f_n [Hz]");
        foreach (var c in chart.Crossings)
            table.Add((c.SpeedHz * 60).ToString("F1", Inv), c.SpeedHz.ToString("F3", Inv), c.Order.ToString("G4", Inv) + "x", c.ModeNumber.ToString(Inv), c.FrequencyHz.ToString("F3", Inv));
        if (chart.Crossings.Length == 0) o.WriteLine("No order line meets a natural frequency in this speed range.");
        else
        {
            o.WriteLine("Crossings (resonance can be met at these speeds during run-up and run-down):");
            table.Write(o);
            var operating = (document.Criteria.Separation?.SpeedsHz ?? [])
                .Concat(OperatingLoads.Of(document).Where(l => l.SpeedHz is > 0).Select(l => l.SpeedHz!.Value))
                .Distinct().Order().ToList();
            foreach (var s in operating)
            {
                var nearest = chart.Crossings.MinBy(c => Math.Abs(Math.Log(c.SpeedHz / s)))!;
                o.WriteLine(string.Create(Inv,
                    $"Operating speed {s * 60:G6} rpm: nearest crossing at {nearest.SpeedHz * 60:F1} rpm (mode {nearest.ModeNumber}, order {nearest.Order:G4}), {100 * (nearest.SpeedHz / s - 1):+0.0;-0.0} % away."));
            }
        }
        o.WriteLine();
        o.WriteLine("Caution: " + Cautions.Text);
        return ExitCodes.Success;
    }
}
