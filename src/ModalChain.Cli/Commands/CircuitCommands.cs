using System.Collections.Immutable;
using System.Globalization;
using ModalChain.Cli.Formatting;
using ModalChain.Core;
using ModalChain.Core.Analyses.Circuits;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Model;
using ModalChain.Io.Json;
using ModalChain.Io.Model;

namespace ModalChain.Cli.Commands;

/// <summary>What <c>modes</c>, <c>harmonic</c>, <c>transient</c> and <c>validate</c> do with a circuit model.</summary>
internal static class CircuitCommands
{
    /// <summary>Roots, damping ratios and Q factors.</summary>
    public static int Modes(Streams io, ModelDocument document, CircuitModel model, OutputFormat format)
    {
        if (format == OutputFormat.Csv) return NoCsv(io);
        var roots = CircuitModes.Solve(CircuitAnalogy.Of(model.Circuit));
        if (format == OutputFormat.Json) io.WriteJson(stream => CircuitJson.WriteModes(stream, document, roots, CliApp.Version));
        else CircuitTables.WriteRoots(io.Output, model.Circuit.Title, roots);
        return ExitCodes.Success;
    }

    /// <summary>Impedance and transfer sweeps of each source; --from/--to/--points override the file's range.</summary>
    public static int Harmonic(Streams io, ModelDocument document, CircuitModel model, OutputFormat format, double? fromHz, double? toHz, int? points)
    {
        if (format == OutputFormat.Csv) return NoCsv(io);
        var circuit = model.Circuit;
        if (circuit.VoltageSources.IsEmpty && circuit.CurrentSources.IsEmpty)
            return Fail(io, $"{document.File}: the circuit has no source; a sweep needs a voltage or current source");
        var sweep = model.Sweep;
        if (fromHz is not null || toHz is not null || points is not null)
        {
            var range = sweep as FrequencyRange;
            var f0 = fromHz ?? range?.FromHz;
            var f1 = toHz ?? range?.ToHz;
            if (f0 is null || f1 is null) return Fail(io, "give --from and --to (the file's 'harmonic' has no range to change)");
            if (!(f1 > f0)) return Fail(io, string.Create(CultureInfo.InvariantCulture, $"--to ({f1} Hz) must be above --from ({f0} Hz)"));
            var n = points ?? range?.Points ?? 200;
            if (n > ModelReader.MaxSweepPoints) return Fail(io, $"--points {n} is more than {ModelReader.MaxSweepPoints}, the most a sweep accepts");
            sweep = new FrequencyRange(f0.Value, f1.Value, n, range?.Spacing ?? FrequencySpacing.Logarithmic);
        }
        if (sweep is null) return Fail(io, $"{document.File}: the model has no 'harmonic' section; add one or give --from and --to");
        var frequencies = FrequencyGrid.Build(sweep, false, [], []);
        var responses = CircuitFrequencyResponse.Solve(CircuitAnalogy.Of(circuit), frequencies);
        if (format == OutputFormat.Json) io.WriteJson(stream => CircuitJson.WriteHarmonic(stream, document, responses, CliApp.Version));
        else CircuitTables.WriteSweep(io.Output, circuit.Title, responses);
        return ExitCodes.Success;
    }

    /// <summary>Node voltages and branch currents against time; --duration/--step override the file.</summary>
    public static int Transient(Streams io, ModelDocument document, CircuitModel model, OutputFormat format, double? duration, double? step)
    {
        if (format == OutputFormat.Csv) return NoCsv(io);
        var d = duration ?? model.Duration;
        var h = step ?? model.Step ?? (d is { } dd ? dd / 1000 : null);
        if (d is null || h is null) return Fail(io, $"{document.File}: the model has no 'transient' section; add one or give --duration");
        if (h > d) return Fail(io, "--step must not be longer than --duration");
        if (d / h > 1e6) return Fail(io, "the run asks for more than 1e+06 steps (duration / step); lengthen the step or shorten the run");
        var analogy = CircuitAnalogy.Of(model.Circuit);
        if (analogy.FreeCount > CircuitTransient.MaxFreeNodes)
            return Fail(io, string.Create(CultureInfo.InvariantCulture,
                $"{document.File}: the circuit has {analogy.FreeCount} nodes not held by a voltage source; a transient run takes at most {CircuitTransient.MaxFreeNodes} (its first-order form is dense)"));
        var result = CircuitTransient.Run(analogy, d.Value, h.Value);
        if (format == OutputFormat.Json) io.WriteJson(stream => CircuitJson.WriteTransient(stream, document, result, CliApp.Version));
        else CircuitTables.WriteTransient(io.Output, model.Circuit.Title, result);
        return ExitCodes.Success;
    }

    /// <summary>The summary <c>validate</c> prints for a circuit.</summary>
    public static int Validate(Streams io, string path, ModelDocument document, CircuitModel model)
    {
        var c = model.Circuit;
        var analogy = CircuitAnalogy.Of(c);
        var o = io.Output;
        var inv = CultureInfo.InvariantCulture;
        o.WriteLine($"{path}: valid");
        o.WriteLine($"  title:               {Io.Text.TerminalText.Line(c.Title)} (a circuit)");
        o.WriteLine(string.Create(inv, $"  nodes:               {c.Nodes.Length} besides ground ({analogy.MassiveCount} with capacitance, {analogy.MasslessCount} without, {analogy.PrescribedCount} held by voltage sources)"));
        o.WriteLine(string.Create(inv, $"  R, L, C:             {c.Resistors.Length}, {c.Inductors.Length}, {c.Capacitors.Length}"));
        o.WriteLine(string.Create(inv, $"  sources (V, I):      {c.VoltageSources.Length}, {c.CurrentSources.Length}"));
        o.WriteLine(string.Create(inv, $"  DC levels:           {CircuitTopology.VoltageLevelCount(analogy)} (zero roots of parts no inductor or resistor ties to ground or to a source)"));
        o.WriteLine(string.Create(inv, $"  warnings:            {CommonOptions.WarningCount(document)}"));
        o.WriteLine($"  sha256:              {document.Sha256}");
        return ExitCodes.Success;
    }

    /// <summary>Exit 2 for a command that has no circuit form yet.</summary>
    public static int NotForCircuits(Streams io, string path, string command) =>
        Fail(io, $"{path}: '{command}' does not take circuit models yet; 'validate', 'modes', 'harmonic' and 'transient' do");

    private static int NoCsv(Streams io) => Fail(io, "--format csv is not available for circuit models yet; use text or json");

    private static int Fail(Streams io, string message)
    {
        io.Error.WriteLine($"modalchain: error: {message}");
        return ExitCodes.InputError;
    }
}
