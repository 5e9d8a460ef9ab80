using System.CommandLine;
using System.Globalization;
using ModalChain.Cli.Formatting;
using ModalChain.Core;
using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Io.Json;
using ModalChain.Io.Model;
using ModalChain.Io.Text;
using ModalChain.Reports.Units;

namespace ModalChain.Cli.Commands;

/// <summary><c>modalchain check FILE</c>: evaluates the model's criteria; exit 0 when all pass, 1 when any fails, 2 on input errors.</summary>
internal static class CheckCommand
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static Command Create(Streams io)
    {
        var file = CommonOptions.ModelFile();
        var format = CommonOptions.Format(OutputFormat.Table, OutputFormat.Json);
        var solver = CommonOptions.Solver();
        var units = CommonOptions.Units();
        var command = new Command("check",
            "Evaluate the criteria of the model's 'criteria:' section: frequency separation (no natural frequency within " +
            "±margin of any running speed × order) and vibration limits at the operating points. Each criterion prints " +
            "its reserve, how far it is from failing in %. Machine zones (r.m.s. velocity against zone boundaries of a machine " +
            "class) and floor curves (one-third-octave r.m.s. velocity against a vibration criterion curve) are checked by name. Exit code 0 when all pass, 1 when any fails or cannot be " +
            "evaluated, 2 on input errors. Default margins are common practice, not code requirements (docs/criteria.md).")
        { file, solver, format, units };
        command.SetAction(parse =>
        {
            var path = parse.GetValue(file)!;
            var document = CommonOptions.Load(path, io);
            if (document is null) return ExitCodes.InputError;
            if (document.Circuit is not null) return CircuitCommands.NotForCircuits(io, path, "check");
            if (document.Criteria.IsEmpty)
            {
                io.Error.WriteLine($"{path}: error: the model has no 'criteria' section, so there is nothing to check (see docs/model-format.md)");
                return ExitCodes.InputError;
            }
            if (CommonOptions.SolverOf(parse, solver, io) is not { } choice) return ExitCodes.InputError;
            var outcome = Evaluate(document, choice);
            if (parse.GetValue(format) == OutputFormat.Json)
            {
                io.WriteJson(stream => CheckJson.Write(stream, document, outcome, CliApp.Version));
            }
            else Write(io.Output, document, outcome, CommonOptions.UnitsOf(parse, units, document));
            return outcome.AllPass ? ExitCodes.Success : ExitCodes.CheckFailed;
        });
        return command;
    }

    /// <summary>Evaluates every criterion of <paramref name="document"/>.</summary>
    internal static CheckOutcome Evaluate(ModelDocument document, ModalChain.Core.Solvers.SolverChoice choice = default)
    {
        var loads = OperatingLoads.Of(document);
        return CriteriaCheck.Evaluate(CriteriaCheck.Assemble(document.Structure, document.Criteria, loads, choice), document.Criteria, loads, document.Cases);
    }

    private static void Write(TextWriter o, ModelDocument document, CheckOutcome outcome, DisplayUnits units)
    {
        var (velocity, floor) = (units.Velocity, units.FloorVelocity);
        o.WriteLine(TerminalText.Line(document.Network.Title));
        o.WriteLine();
        if (outcome.Separation is { } sep)
        {
            var c = sep.Criterion;
            o.WriteLine(string.Create(Inv, $"Frequency separation: no natural frequency within ±{c.Margin * 100:G4} % of running speed × order"));
            var table = new TextTable("speed", "order", "excitation [Hz]", "band [Hz]", "nearest mode", "f_n [Hz]", "separation [%]", "reserve [%]", "result");
            foreach (var (speed, order, fe) in c.Excitations())
            {
                var pairs = sep.Pairs.Where(p => p.SpeedHz == speed && p.Order == order).ToList();
                if (pairs.Count == 0) continue;
                var worst = pairs.MinBy(p => p.Reserve)!;
                table.Add(
                    string.Create(Inv, $"{speed * 60:G6} rpm"),
                    order.ToString("G4", Inv),
                    fe.ToString("F3", Inv),
                    string.Create(Inv, $"{(1 - c.Margin) * fe:F2}-{(1 + c.Margin) * fe:F2}"),
                    worst.ModeNumber.ToString(Inv),
                    worst.NaturalFrequencyHz.ToString("F3", Inv),
                    (100 * worst.Separation).ToString("F1", Inv),
                    Signed(worst.Reserve, worst.ReserveNote),
                    worst.Passes ? "pass" : "FAIL");
            }
            if (!sep.Pairs.IsEmpty) table.Write(o);
            o.WriteLine(sep.ReserveNote is { } note
                ? $"  {(sep.Passes ? "passes" : "FAILS")}; reserve {note}."
                : sep.Passes
                ? string.Create(Inv, $"  passes; the governing mode may shift {100 * sep.Reserve:F1} % before it enters a band.")
                : string.Create(Inv, $"  FAILS; the governing mode must shift {-100 * sep.Reserve:F1} % to leave its band."));
            foreach (var x in sep.Exempted)
                o.WriteLine(string.Create(Inv, $"  mode {x.ModeNumber} ({x.NaturalFrequencyHz:F3} Hz) not checked: {x.Reason}."));
            o.WriteLine("  reserve = relative change of the natural frequency that puts it on the nearest band edge (positive: clear).");
            o.WriteLine();
        }
        if (outcome.Limits.Count > 0)
        {
            o.WriteLine("Vibration limits at the operating points (steady state)");
            var table = new TextTable("where", "quantity", "measure", "value", "limit", "reserve [%]", "result");
            foreach (var l in outcome.Limits)
                table.Add(Where(l.Limit.At, l.MeasuredAt), l.Limit.Quantity.ToString().ToLowerInvariant(), l.Limit.Measure == AmplitudeMeasure.Peak ? "peak" : "rms",
                    Show(l.Value, l.Limit.Quantity, units), Show(l.Limit.Value, l.Limit.Quantity, units), Signed(l.Reserve, l.ReserveNote), l.Passes ? "pass" : "FAIL");
            table.Write(o);
            o.WriteLine("  reserve = (limit - value) / limit.");
            if (outcome.Limits.Any(l => l.MeasuredAt is not null)) o.WriteLine(LargestNote);
            if (outcome.Combination is { } rule)
                o.WriteLine($"  values are the load cases combined at their running speeds by the rule {LoadCaseSelection.Describe(rule)}.");
            o.WriteLine();
        }
        if (outcome.Zones.Length > 0)
        {
            o.WriteLine("Machine vibration zones at the operating points (r.m.s. velocity of the steady state)");
            var table = new TextTable("where", "class", $"A/B-B/C-C/D [{velocity.Plain} rms]", $"value [{velocity.Plain} rms]", "zone", "accepted", "reserve [%]", "result");
            foreach (var z in outcome.Zones)
            {
                var c = z.Criterion.Class;
                table.Add(Where(z.At, z.MeasuredAt), c.Name, string.Create(Inv, $"{velocity.From(c.BoundaryAB):G3}/{velocity.From(c.BoundaryBC):G3}/{velocity.From(c.BoundaryCD):G3}"),
                    double.IsFinite(z.RmsVelocity) ? velocity.From(z.RmsVelocity).ToString("G4", Inv) : "unbounded", z.Zone.ToString(),
                    "up to " + z.Criterion.AcceptedZone, Signed(z.Reserve, z.ReserveNote), z.Passes ? "pass" : "FAIL");
            }
            table.Write(o);
            foreach (var source in outcome.Zones.Select(z => z.Criterion.Class).Distinct().Select(c => $"  {c.Name}: {c.Source}"))
                o.WriteLine(source);
            o.WriteLine("  reserve = (upper boundary of the accepted zone - value) / boundary; zone boundaries are common practice, not compliance.");
            if (outcome.Zones.Any(z => z.MeasuredAt is not null)) o.WriteLine(LargestNote);
            o.WriteLine();
        }
        foreach (var f in outcome.Floors)
        {
            o.WriteLine($"Floor curve {f.Criterion.Curve.Name} at {Where(f.At, f.MeasuredAt, "nearest to failing")}: one-third-octave r.m.s. velocity at the operating points");
            var table = new TextTable("band [Hz]", $"value [{floor.Plain} rms]", $"limit [{floor.Plain} rms]", "reserve [%]", "result");
            foreach (var b in f.Bands)
                table.Add(b.NominalHz.ToString("G4", Inv), double.IsFinite(b.RmsVelocity) ? floor.From(b.RmsVelocity).ToString("G4", Inv) : "unbounded",
                    floor.From(b.Limit).ToString("G4", Inv), Signed(b.Reserve, null), b.Passes ? "pass" : "FAIL");
            table.Write(o);
            o.WriteLine($"  worst band: {(f.Governing is { } g ? g.NominalHz.ToString("G4", Inv) + " Hz, reserve " + Signed(f.Reserve, f.ReserveNote) + " %" : f.ReserveNote)}; {(f.Passes ? "passes" : "FAILS")}.");
            if (f.UncomparedHz.Length > 0)
                o.WriteLine($"  not compared (the curve states no limit there): components at {string.Join(", ", f.UncomparedHz.Select(h => h.ToString("G4", Inv) + " Hz"))}.");
            o.WriteLine($"  source: {f.Criterion.Curve.Source}; below 8 Hz constant acceleration [from memory, unverified].");
            o.WriteLine();
        }
        foreach (var (criterion, reason) in outcome.NotEvaluated)
            o.WriteLine($"NOT EVALUATED: {criterion}: {reason}");
        if (outcome.NotEvaluated.Count > 0) o.WriteLine();
        o.WriteLine(outcome.AllPass ? "Result: all criteria pass." : "Result: at least one criterion fails or could not be evaluated.");
        o.WriteLine("These criteria are the ones stated in the model file; default margins are common practice, not code compliance.");
        o.WriteLine();
        o.WriteLine("Caution: " + Cautions.Text);
    }

    private const string LargestNote =
        "  a point named without a direction is measured in each translation it has; the largest response governs and is named in brackets.";

    /// <summary>"skid.bearing (largest: skid.bearing.y)" (floor curves: the direction nearest to failing) when a point measured in several directions reports one, else the name.</summary>
    internal static string Where(string at, string? measuredAt, string which = "largest") => measuredAt is null ? at : $"{at} ({which}: {measuredAt})";

    /// <summary>A reserve in % with its sign; a reserve with no finite value prints <paramref name="note"/> (never "inf" or "Infinity").</summary>
    internal static string Signed(double fraction, string? note) =>
        double.IsFinite(fraction) ? (100 * fraction).ToString("+0.0;-0.0;0.0", Inv) : note ?? "n/a";

    internal static string Show(double si, ResponseQuantity q, DisplayUnits units) =>
        !double.IsFinite(si) ? (double.IsPositiveInfinity(si) ? "unbounded" : "n/a") : units.Of(q).From(si).ToString("G4", Inv) + " " + units.Of(q).Plain;
}
