using System.CommandLine;
using ModalChain.Cli.Formatting;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Assembly;
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
        var command = new Command("modes",
            "Natural frequencies, periods, mass-normalised mode shapes, participation factors and effective modal masses " +
            "of the undamped network, with quality figures (eigen residual, M-orthogonality).")
        { file, count, format };
        command.SetAction(parse =>
        {
            var path = parse.GetValue(file)!;
            var document = CommonOptions.Load(path, io);
            if (document is null) return ExitCodes.InputError;
            var result = ModalAnalysis.Solve(document.Network, new ModalOptions(parse.GetValue(count)));
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
