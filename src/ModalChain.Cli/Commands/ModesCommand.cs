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
    public static Command Create(Streams io)
    {
        var file = CommonOptions.ModelFile();
        var format = CommonOptions.Format();
        var count = CommandValues.Count("--count", "Report only the lowest N modes (default: all).", 1);
        var below = CommandValues.Quantity("--below", Quantity.Frequency,
            "Report every mode with a natural frequency below this, e.g. '40 Hz' or '1500 rpm' (with --count, at most the " +
            "lowest N of them); large sparse models are solved for these modes only, with a count proving none was missed.",
            ValueBound.Positive);
        var command = new Command("modes",
            "Natural frequencies, periods, mass-normalised mode shapes, participation factors and effective modal masses " +
            "of the undamped network, with quality figures (eigen residual, M-orthogonality).")
        { file, count, below, format };
        command.SetAction(parse =>
        {
            var path = parse.GetValue(file)!;
            var document = CommonOptions.Load(path, io);
            if (document is null) return ExitCodes.InputError;
            var result = ModalAnalysis.Solve(document.Network, new ModalOptions(parse.GetValue(count), BelowFrequencyHz: parse.GetValue(below)?.Si));
            var damped = DampedSystem.Build(document.Structure);
            var complexModes = damped.IsClassical ? [] : ComplexModes.Solve(damped);
            switch (parse.GetValue(format))
            {
                case OutputFormat.Json:
                    using (var stdout = new MemoryStream())
                    {
                        ModesJson.Write(stdout, document, result, CliApp.Version, damped, complexModes);
                        io.Output.Write(System.Text.Encoding.UTF8.GetString(stdout.ToArray()));
                        io.Output.WriteLine();
                    }
                    break;
                case OutputFormat.Csv:
                    ModesCsv.Write(io.Output, result);
                    break;
                default:
                    ModesTable.Write(io.Output, result, damped, complexModes);
                    break;
            }
            return ExitCodes.Success;
        });
        return command;
    }
}
