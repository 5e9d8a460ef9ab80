using System.Collections.Immutable;
using ModalChain.Core.Model;
using ModalChain.Core.Units;
using ModalChain.Io.Csv;
using ModalChain.Io.Files;
using ModalChain.Io.Yaml;

namespace ModalChain.Io.Model;

public static partial class ModelReader
{
    private static readonly Range InstantRange = new(0, 1e6);                          // s
    private static readonly Range DurationRange = new(0, 1e6, MinimumInclusive: false); // s
    private static readonly Range SignedForceRange = new(-1e10, 1e10);                 // N
    private static readonly Range SignedAccelerationRange = new(-1e4, 1e4);            // m/s², about ±1000 g
    private static readonly Range SineFrequencyRange = new(0, 1e5);                    // Hz
    private static readonly Range RotorSpeedRange = new(0, 1e4);                       // Hz (600 000 rpm)

    private static readonly string[] ValueFunctionKinds = ["step", "ramp", "rectangular", "half-sine", "sine", "table"];
    private static readonly string[] SpeedFunctionKinds = ["run-up", "run-down"];

    /// <summary>Reads a 'time' function whose values are <paramref name="quantity"/> (a force or a support acceleration).</summary>
    private static TimeFunction? ReadValueFunction(YNode node, Quantity quantity, string what, ReadContext context)
    {
        var range = quantity switch
        {
            Quantity.Force or Quantity.Moment => SignedForceRange,
            Quantity.Voltage => SourceVoltageRange,   // circuit sources (ModelReader.Circuit.cs)
            Quantity.Current => SourceCurrentRange,
            _ => SignedAccelerationRange,
        };
        if (context.Mapping(node, what) is not { } f) return null;
        var kind = FunctionKind(f, ValueFunctionKinds, what, context);
        switch (kind)
        {
            case "step":
            {
                context.RejectUnknownKeys(f, what, "kind", "value", "at");
                var value = context.Required(f, "value", quantity, range, what);
                var at = context.Optional(f, "at", Quantity.Time, InstantRange, what) ?? 0;
                return value is { } v ? new StepFunction(v, at) : null;
            }
            case "ramp":
            {
                context.RejectUnknownKeys(f, what, "kind", "from", "to", "over", "start");
                var from = context.Optional(f, "from", quantity, range, what) ?? 0;
                var to = context.Required(f, "to", quantity, range, what);
                var over = context.Required(f, "over", Quantity.Time, DurationRange, what);
                var start = context.Optional(f, "start", Quantity.Time, InstantRange, what) ?? 0;
                return to is { } b && over is { } t ? new RampFunction(from, b, t, start) : null;
            }
            case "rectangular":
            case "half-sine":
            {
                context.RejectUnknownKeys(f, what, "kind", "amplitude", "duration", "start");
                var amplitude = context.Required(f, "amplitude", quantity, range, what);
                var duration = context.Required(f, "duration", Quantity.Time, DurationRange, what);
                var start = context.Optional(f, "start", Quantity.Time, InstantRange, what) ?? 0;
                if (amplitude is not { } a || duration is not { } d) return null;
                return kind == "rectangular" ? new RectangularPulse(a, d, start) : new HalfSinePulse(a, d, start);
            }
            case "sine":
            {
                context.RejectUnknownKeys(f, what, "kind", "amplitude", "frequency", "phase");
                var amplitude = context.Required(f, "amplitude", quantity, range, what);
                var frequency = context.Required(f, "frequency", Quantity.Frequency, SineFrequencyRange, what);
                var phase = context.Optional(f, "phase", Quantity.Angle, PhaseRange, what) ?? 0;
                return amplitude is { } a && frequency is { } hz ? new SineFunction(a, hz, phase) : null;
            }
            case "table":
            {
                context.RejectUnknownKeys(f, what, "kind", "file", "unit", "time-unit");
                return ReadTable(f, quantity, what, context);
            }
            default:
                return null;
        }
    }

    /// <summary>Reads a run-up or run-down speed profile of a rotating unbalance.</summary>
    private static UnbalanceSpeedRamp? ReadSpeedFunction(YNode node, string what, ReadContext context)
    {
        if (context.Mapping(node, what) is not { } f) return null;
        var kind = FunctionKind(f, SpeedFunctionKinds, what, context);
        if (kind is null) return null;
        context.RejectUnknownKeys(f, what, "kind", "from", "to", "over", "start", "phase");
        var from = context.Required(f, "from", Quantity.Frequency, RotorSpeedRange, what);
        var to = context.Required(f, "to", Quantity.Frequency, RotorSpeedRange, what);
        var over = context.Required(f, "over", Quantity.Time, DurationRange, what);
        var start = context.Optional(f, "start", Quantity.Time, InstantRange, what) ?? 0;
        var phase = context.Optional(f, "phase", Quantity.Angle, PhaseRange, what) ?? 0;
        if (from is not { } a || to is not { } b || over is not { } t) return null;
        if (kind == "run-up" && !(b > a))
        {
            context.Error(f["to"]!, $"'to' of {what} must be above 'from' for a run-up; use kind: run-down for a machine that slows down");
            return null;
        }
        if (kind == "run-down" && !(b < a))
        {
            context.Error(f["to"]!, $"'to' of {what} must be below 'from' for a run-down; use kind: run-up for a machine that speeds up");
            return null;
        }
        return new UnbalanceSpeedRamp(2 * Math.PI * a, 2 * Math.PI * b, t, start, phase);
    }

    private static string? FunctionKind(YMapping f, string[] kinds, string what, ReadContext context)
    {
        if (f["kind"] is not { } kindNode)
        {
            context.Error(f, $"{what} needs 'kind': one of {string.Join(", ", kinds)}");
            return null;
        }
        if (context.Text(kindNode, $"'kind' of {what}") is not { } kind) return null;
        if (kinds.Contains(kind)) return kind;
        var other = kinds == SpeedFunctionKinds ? ValueFunctionKinds : SpeedFunctionKinds;
        var hint = other.Contains(kind)
            ? (kinds == SpeedFunctionKinds ? "; an unbalance's force follows from its speed, so it takes run-up or run-down" : "; run-up and run-down belong to kind: unbalance loads")
            : ReadContext.Suggest(kind, kinds);
        context.Error(kindNode, $"unknown kind '{kind}' of {what}{hint}; accepted: {string.Join(", ", kinds)}");
        return null;
    }

    /// <summary>Reads a table function from a CSV file next to the model; its rows are checked with their own line numbers.</summary>
    private static TableFunction? ReadTable(YMapping f, Quantity quantity, string what, ReadContext context)
    {
        if (f["file"] is not { } fileNode)
        {
            context.Error(f, $"{what} needs 'file': a CSV file of time, value rows next to the model file");
            return null;
        }
        if (context.Text(fileNode, $"'file' of {what}") is not { } name) return null;
        var valueScale = 1.0;
        if (f["unit"] is { } unitNode && context.Text(unitNode, $"'unit' of {what}") is { } unit)
        {
            var parsed = QuantityParser.Parse("1 " + unit, quantity);
            if (parsed.Succeeded) valueScale = parsed.Value;
            else context.Error(unitNode, $"'unit' of {what} is '{unit}', not a {UnitTable.Describe(quantity)} unit; accepted: {string.Join(", ", UnitTable.Symbols(quantity))}");
        }
        var timeScale = 1.0;
        if (f["time-unit"] is { } timeNode && context.Text(timeNode, $"'time-unit' of {what}") is { } tu)
        {
            var parsed = QuantityParser.Parse("1 " + tu, Quantity.Time);
            if (parsed.Succeeded) timeScale = parsed.Value;
            else context.Error(timeNode, $"'time-unit' of {what} is '{tu}'; accepted: {string.Join(", ", UnitTable.Symbols(Quantity.Time))}");
        }
        var directory = Path.GetDirectoryName(context.File);
        var path = Path.IsPathRooted(name) || string.IsNullOrEmpty(directory) ? name : Path.Combine(directory, name);
        if (InputFile.ReadAllBytes(path, InputFile.MaximumTableBytes, "time table", out var error) is not { } bytes)
        {
            context.Error(fileNode, error == "file not found"
                ? $"{what}: table file '{path}' not found (it is looked for next to the model file)"
                : $"{what}: cannot read table file '{path}': {error}");
            return null;
        }
        // As File.ReadAllText: UTF-8 unless a byte-order mark says otherwise.
        string text;
        using (var reader = new StreamReader(new MemoryStream(bytes), System.Text.Encoding.UTF8, detectEncodingFromByteOrderMarks: true)) text = reader.ReadToEnd();
        var table = TimeTableCsv.Parse(text, path, context.Diagnostics);
        if (table is null) return null;
        return new TableFunction([.. table.Value.Times.Select(t => t * timeScale)], [.. table.Value.Values.Select(v => v * valueScale)]);
    }
}
