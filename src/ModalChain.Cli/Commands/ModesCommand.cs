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
        // A custom parser rather than a validator: a validator's GetValueOrDefault throws on "--count many" instead
        // of reporting it, which crashed the program with a stack trace.
        var count = new Option<int?>("--count")
        {
            Description = "Report only the lowest N modes (default: all).",
            HelpName = "N",
            CustomParser = r =>
            {
                var text = r.Tokens.Count == 1 ? r.Tokens[0].Value : string.Join(' ', r.Tokens.Select(t => t.Value));
                if (int.TryParse(text, System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture, out var n) && n >= 1)
                    return n;
                r.AddError($"--count must be a whole number of modes, at least 1 (got '{text}').");
                return null;
            },
        };
        var below = new Option<string?>("--below")
        {
            Description = "Report every mode with a natural frequency below this frequency, e.g. \"40 Hz\" or \"1500 rpm\" " +
                "(with --count, at most the lowest N of them). Large sparse models are solved for these modes only, " +
                "with a count proving none was missed.",
            HelpName = "FREQUENCY",
        };
        var command = new Command("modes",
            "Natural frequencies, periods, mass-normalised mode shapes, participation factors and effective modal masses " +
            "of the undamped network, with quality figures (eigen residual, M-orthogonality).\n\n" + CliApp.CautionHelp)
        { file, count, below, format };
        command.SetAction(parse =>
        {
            var path = parse.GetValue(file)!;
            var document = CommonOptions.Load(path, io);
            if (document is null) return ExitCodes.InputError;
            double? belowHz = null;
            if (parse.GetValue(below) is { } belowText)
            {
                var parsed = QuantityParser.Parse(belowText, Quantity.Frequency);
                if (!parsed.Succeeded || !(parsed.Value > 0) || !double.IsFinite(parsed.Value))
                {
                    io.Error.WriteLine($"modalchain: error: --below '{belowText}': {parsed.Error ?? "must be a positive frequency"}");
                    return ExitCodes.InputError;
                }
                belowHz = parsed.Value;
            }
            var result = ModalAnalysis.Solve(document.Network, new ModalOptions(parse.GetValue(count), BelowFrequencyHz: belowHz));
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
