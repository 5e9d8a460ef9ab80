using System.CommandLine;
using ModalChain.Cli.Formatting;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
using ModalChain.Core.Units;
using ModalChain.Io.Csv;
using ModalChain.Io.Json;

namespace ModalChain.Cli.Commands;

/// <summary><c>modalchain modes FILE</c>: natural frequencies, mode shapes and effective masses.</summary>
internal static class ModesCommand
{
    /// <summary>Largest model whose complex modes are computed (a dense state-space eigenproblem of order 2n).</summary>
    internal const int ComplexModesMaxDofs = 2000;

    public static Command Create(Streams io)
    {
        var file = CommonOptions.ModelFile();
        var format = CommonOptions.Format();
        var count = CommandValues.Count("--count", "Report only the lowest N modes (default: all).", 1);
        var below = CommandValues.Quantity("--below", Quantity.Frequency,
            "Report every mode with a natural frequency below this, e.g. '40 Hz' or '1500 rpm' (with --count, at most the " +
            "lowest N of them); large sparse models are solved for these modes only, with a count proving none was missed.",
            ValueBound.Positive);
        var solver = CommonOptions.Solver();
        var detail = CommandValues.Choice("--detail",
            "What the JSON carries per mode: standard (the default: frequencies, shape, participation, effective mass and " +
            $"damping of every mode, with the kinetic-energy share per mass and the strain-energy share per spring for the lowest {ModesJson.DefaultEnergyShareModes} modes) " +
            "or energy (the energy shares of every mode too; the file grows by modes x (masses + springs) numbers).",
            ("standard", ModesDetail.Standard), ("energy", ModesDetail.Energy));
        var units = CommonOptions.Units();
        var command = new Command("modes",
            "Natural frequencies, periods, mass-normalised mode shapes, participation factors and effective modal masses " +
            "of the undamped network, with quality figures (eigen residual, M-orthogonality).")
        { file, count, below, solver, format, detail, units };
        command.SetAction(parse =>
        {
            var path = parse.GetValue(file)!;
            var stages = StageTimes.FromEnvironment(io);
            var document = CommonOptions.Load(path, io);
            if (document is null) return ExitCodes.InputError;
            if (document.Circuit is { } circuit) return CircuitCommands.Modes(io, document, circuit, parse.GetValue(format));
            if (CommonOptions.SolverOf(parse, solver, io) is not { } choice) return ExitCodes.InputError;
            var belowHz = parse.GetValue(below)?.Si;
            stages?.Mark("read and check");
            if (stages is not null)
            {
                // Benchmark runs only: the eigen step timed on its own (an extra solve, so end-to-end times are taken without this).
                var matrices = Core.Assembly.Assembler.Assemble(document.Network);
                stages.Mark("assemble (extra, timing only)");
                Core.Solvers.GeneralizedEigen.Solve(matrices, parse.GetValue(count), null, choice,
                    belowHz is { } f ? Math.Pow(2 * Math.PI * f, 2) : null);
                stages.Mark("eigen solve (extra, timing only)");
            }
            // One eigen solve: the damping ratios are those of the modes reported, from the same shapes.
            var result = ModalAnalysis.Solve(document.Network, new ModalOptions(parse.GetValue(count), Choice: choice, BelowFrequencyHz: belowHz));
            stages?.Mark("assemble, solve and post-process modes");
            var damped = DampedSystem.Build(document.Structure, result, choice);
            // The complex modes are a dense eigenproblem of order 2n: only for models that a dense solve suits.
            var complexModes = (damped.IsClassical && !damped.HasFirstOrderStates) || damped.Partition.FreeCount > ComplexModesMaxDofs ? [] : ComplexModes.Solve(damped);
            stages?.Mark("damping");
            switch (parse.GetValue(format))
            {
                case OutputFormat.Json:
                    var shareModes = parse.GetValue(detail) == ModesDetail.Energy ? int.MaxValue : ModesJson.DefaultEnergyShareModes;
                    io.WriteJson(stream => ModesJson.Write(stream, document, result, CliApp.Version, damped, complexModes, shareModes));
                    break;
                case OutputFormat.Csv:
                    ModesCsv.Write(io.Output, result);
                    break;
                default:
                    ModesTable.Write(io.Output, result, CommonOptions.UnitsOf(parse, units, document), damped, complexModes);
                    break;
            }
            stages?.Mark("write");
            stages?.Report();
            return ExitCodes.Success;
        });
        return command;
    }
}

/// <summary>How much the modes JSON carries per mode (<c>--detail</c>).</summary>
internal enum ModesDetail
{
    /// <summary>Energy shares for the lowest <see cref="ModesJson.DefaultEnergyShareModes"/> modes only.</summary>
    Standard,

    /// <summary>Energy shares for every mode.</summary>
    Energy,
}
