using System.Collections.Immutable;
using System.CommandLine;
using System.Globalization;
using ModalChain.Cli.Formatting;
using ModalChain.Core;
using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Analyses.Studies;
using ModalChain.Core.Model;
using ModalChain.Core.Units;
using ModalChain.Io.Csv;
using ModalChain.Io.Json;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

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
            Description = "The numeric field to vary, as section.name.field: masses.NAME.mass, springs.NAME.stiffness, " +
                          "dampers.NAME.coefficient or inerters.NAME.inertance; in line models also transducers.NAME.force-factor. " +
                          "In plane and 3d models also bodies.NAME.mass (inertia kept), one direction " +
                          "(springs.NAME.stiffness.z, springs.NAME.rotational-stiffness.rx, dampers.NAME.coefficient.x, inerters.NAME.inertance.y) or " +
                          "springs.NAME.axial (dampers and inerters alike); springs.NAME.stiffness then scales every direction in proportion. 'speed' instead " +
                          "gives the speed-frequency chart (natural frequencies against running speed with the order lines and their crossings).",
            Required = true,
        };
        const string fieldUnits = "A number with an optional unit of the varied field's kind; a bare number is in the field's SI unit " +
                                  "(kg for a mass or an inertance, N/m for a stiffness, N*s/m for a damping coefficient, N*m/rad, N*m*s/rad and kg*m^2 for rotational ones, T*m for a force factor, Hz for speed), which the output states.";
        var from = new Option<string>("--from") { Description = "First value, e.g. '50 kN/mm' (for speed: '0 rpm'). " + fieldUnits, HelpName = "value", Required = true };
        var to = new Option<string>("--to") { Description = "Last value, e.g. '200 kN/mm'. " + fieldUnits, HelpName = "value", Required = true };
        var steps = CommandValues.Count("--steps", "Number of values including both ends (at least 2; default 31).", 2);
        var spacing = CommandValues.Choice("--spacing", "linear (the default) or geometric (equal ratios).",
            ("linear", StudySpacing.Linear), ("geometric", StudySpacing.Geometric));
        var orders = new Option<string?>("--orders") { Description = "Orders for the speed-frequency chart, comma-separated (default: criteria.separation.orders, else 1,2)." };
        var format = CommonOptions.Format();
        var units = CommonOptions.Units();
        var command = new Command("study",
            "Vary one numeric field of the model over a range, re-solve the modes at each value (in parallel), follow each " +
            "mode by its shape (modal assurance criterion) so identities survive frequency crossings, and find " +
            "the values at which each criterion of the model starts or stops passing, by a bracketed root search.")
        { file, vary, from, to, steps, spacing, orders, format, units };
        command.SetAction(parse =>
        {
            var path = parse.GetValue(file)!;
            var document = CommonOptions.Load(path, io);
            if (document is null) return ExitCodes.InputError;
            if (document.Circuit is not null) return CircuitCommands.NotForCircuits(io, path, "study");
            var varied = parse.GetValue(vary)!;
            if (varied == "speed")
                return SpeedChart(document, parse.GetValue(from)!, parse.GetValue(to)!, parse.GetValue(steps) ?? DefaultSteps, parse.GetValue(orders), parse.GetValue(format), io);

            var parameter = ParameterPath.Resolve(varied, document.Network, out var error);
            if (parameter is null)
            {
                io.Error.WriteLine($"modalchain: error: --vary: {error}");
                return ExitCodes.InputError;
            }
            if (parameter.Kind == ParameterKind.ForceFactor)
                io.Error.WriteLine("note: the force factor couples the mechanical pair to the transducer's electrical branch: the study's modes are " +
                                   "the undamped modes of the coupled M and K, where the branch's capacitances (masses) and inductances (springs) " +
                                   "enter through Bl squared; its resistances (dampers) do not, so the electrical damping the transducer adds, " +
                                   "and the port voltage and current, are not in the table (see them with `harmonic` or `transient` at chosen force factors).");
            var a = Value(parse.GetValue(from)!, parameter.Quantity, "--from", varied, ValueBound.Any, io);
            var b = Value(parse.GetValue(to)!, parameter.Quantity, "--to", varied, ValueBound.Any, io);
            if (a is null || b is null) return ExitCodes.InputError;
            var criteria = ImmutableArray.CreateBuilder<StudyCriterion>();
            if (document.Criteria.Separation is { } sep) criteria.Add(StudyCriterion.Separation(sep));
            var operatingLoads = OperatingLoads.Of(document).Where(l => l.SpeedHz is > 0).ToArray();
            if (!document.Criteria.Limits.IsDefaultOrEmpty)
            {
                if (document.Network.Space != ModelSpace.Line)
                    io.Error.WriteLine("note: the model's vibration limits are not followed: limits on plane and 3d models are not supported yet (they name a mass, not a direction); only the separation criterion is.");
                else if (operatingLoads.Length == 0)
                    io.Error.WriteLine("note: the model's vibration limits are not followed: no load has a running speed, so there is no operating point.");
                else
                    foreach (var limit in document.Criteria.Limits)
                        criteria.Add(OperatingPointCriteria.Limit(limit, document.Structure, operatingLoads, document.Cases));
            }
            var request = new StudyRequest(parameter, a.Si, b.Si, parse.GetValue(steps) ?? DefaultSteps, parse.GetValue(spacing), criteria.ToImmutable());
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
                    io.WriteJson(stream => StudyJson.Write(stream, document, result, UnitTable.SiSymbol(parameter.Quantity), CliApp.Version));
                    break;
                case OutputFormat.Csv:
                    StudyCsv.Write(io.Output, result, UnitTable.SiSymbol(parameter.Quantity));
                    break;
                default:
                    WriteTable(io.Output, document, result, CommonOptions.UnitsOf(parse, units, document));
                    break;
            }
            return ExitCodes.Success;
        });
        return command;
    }

    private const int DefaultSteps = 31;

    /// <summary>Reads --from or --to, whose kind is the varied field's; a bare number is noted on stderr with the unit it was read in.</summary>
    private static CommandValue? Value(string text, Quantity quantity, string option, string field, ValueBound bound, Streams io)
    {
        var value = CommandValues.Read(text, quantity, option, bound, out var error);
        if (value is null) io.Error.WriteLine($"modalchain: error: {error}");
        else if (value.Bare)
            io.Error.WriteLine($"note: {option} {text.Trim()} has no unit; read as {value.Show(value.Si)} " +
                               (field == "speed" ? "(a bare speed is in Hz)." : $"(the SI unit of {field})."));
        return value;
    }

    private static void WriteTable(TextWriter o, ModelDocument document, StudyResult result, Reports.Units.DisplayUnits units)
    {
        var req = result.Request;
        // The varied value in the unit every other table shows its kind in (the file's own unit, kN/mm staying kN/mm, or
        // the system of --units), not in whatever unit --from happened to be typed in.
        // Rotational stiffness and damping have no display unit of their own: they are shown in SI.
        var shown = req.Parameter.Quantity switch
        {
            Quantity.Mass => units.MassUnit,
            Quantity.Stiffness => units.StiffnessUnit,
            Quantity.Damping => units.DampingUnit,
            _ => null,
        };
        var unit = shown is null
            ? new CommandValue(0, UnitTable.SiSymbol(req.Parameter.Quantity), 1)
            : new CommandValue(0, shown.Plain, shown.Factor);
        o.WriteLine(TerminalText.Line(document.Network.Title));
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
            row.AddRange(s.Reserves.Select((r, c) => (r >= 0 ? "pass " : "FAIL ") + (double.IsFinite(r)
                ? CheckCommand.Signed(r, null) + " %" + (req.Criteria[c].Limit is { } limit ? $" ({CheckCommand.Show(limit.Value * (1 - r), limit.Quantity, units)})" : "")
                : req.Criteria[c].Limit is null ? ReserveNotes.OfSeparation(r, rigidBody: false) : ReserveNotes.OfLimit(0, r))));
            table.Add([.. row]);
        }
        table.Write(o);
        o.WriteLine();
        var crossings = result.Modes.Where(m => m.ModeNumbers.Distinct().Count() > 1).ToList();
        foreach (var m in crossings)
            o.WriteLine($"mode {m.Identity} changes its frequency rank during the study (numbers {string.Join(", ", m.ModeNumbers.Distinct())}): it crosses another mode.");
        if (result.Modes.Any(m => !m.Motions.IsDefaultOrEmpty))
        {
            if (crossings.Count > 0) o.WriteLine();
            o.WriteLine("Motion of each mode (the direction carrying most of its kinetic energy; arrows where it changes during the study):");
            foreach (var m in result.Modes)
                o.WriteLine($"  mode {m.Identity}: {string.Join(" -> ", Changes(m.Motions))}");
            o.WriteLine();
        }
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

    /// <summary>The motions in order with repeats of a neighbour left out: [a, a, b, b, a] gives [a, b, a].</summary>
    private static IEnumerable<string> Changes(ImmutableArray<string> motions) =>
        motions.Where((m, i) => i == 0 || m != motions[i - 1]);

    private static int SpeedChart(ModelDocument document, string fromText, string toText, int points, string? ordersText, OutputFormat format, Streams io)
    {
        var a = Value(fromText, Quantity.Frequency, "--from", "speed", ValueBound.NonNegative, io);
        var b = Value(toText, Quantity.Frequency, "--to", "speed", ValueBound.NonNegative, io);
        if (a is null || b is null) return ExitCodes.InputError;
        if (!(b.Si > a.Si) || b.Si > MaxSpeedHz)
        {
            io.Error.WriteLine(string.Create(Inv, $"modalchain: error: the speed range needs 0 <= --from < --to <= {MaxSpeedHz} Hz"));
            return ExitCodes.InputError;
        }
        if (points > MaxSpeedSteps)
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
        var chart = SpeedFrequencyChart.Build([.. modal.Modes.Select(m => (m.Number, m.NaturalFrequencyHz))], a.Si, b.Si, points, orders);
        if (format == OutputFormat.Json)
        {
            io.WriteJson(stream => StudyJson.WriteChart(stream, document, chart, CliApp.Version));
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
        o.WriteLine(TerminalText.Line(document.Network.Title));
        o.WriteLine($"Speed-frequency chart from {a.Show(a.Si)} to {b.Show(b.Si)}: orders {string.Join(", ", chart.Orders.Select(h => h.ToString("G4", Inv) + "x"))}");
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
