using System.CommandLine;
using ModalChain.Core.Analyses.Absorbers;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Io.Model;
using ModalChain.Reports;
using ModalChain.Reports.Sections;
using ModalChain.Reports.Units;
using ModalChain.Reports.Writing;

namespace ModalChain.Cli.Commands;

/// <summary><c>modalchain report FILE -o DIR</c>: the self-contained HTML report (and report.pdf with --format pdf), every figure as its own file and results.json.</summary>
internal static class ReportCommand
{
    public static Command Create(Streams io)
    {
        var file = CommonOptions.ModelFile();
        var output = new Option<string>("--output", "-o") { Description = "Folder to write into (created when missing). Written atomically: a failed run leaves it as it was.", Required = true };
        var format = CommandValues.Choice("--format",
            "html: report.html + SVG figures + results.json (the default); svg: the SVG figures and results.json only; pdf: as html, plus report.pdf, the whole report as one A4 PDF (and each figure as its own PDF).",
            ("html", ReportFormat.Html), ("svg", ReportFormat.Svg), ("pdf", ReportFormat.Pdf));
        var units = CommonOptions.Units();
        var modes = CommandValues.Count("--modes", "Largest number of modes tabulated and drawn (the lowest ones; default 20).", 1);
        var absorberHost = AbsorberArguments.Host("--absorber-host", required: false);
        absorberHost.Description = "Add a tuned-absorber section: the mass the absorber hangs on, or in plane and 3d models a point and translation such as 'deck.z' (with --mass-ratio; as modalchain tune --host).";
        var massRatio = AbsorberArguments.MassRatio(required: false);
        var absorberMode = AbsorberArguments.Mode("--absorber-mode");
        var absorberMethod = AbsorberArguments.Method("--absorber-method");
        var command = new Command("report",
            "Write a reviewer's report of the model into a folder: report.html (one self-contained file: model summary, " +
            "network drawing, modes table, one figure per mode shape, the tuned absorber with --absorber-host and --mass-ratio, caution and traceability to the model file; " +
            "for a circuit model: the schematic, roots, impedance and transfer sweeps and time response in V, A and Ω), each figure " +
            "as its own SVG, results.json with every number behind the report (SI), and with --format pdf the whole report as one A4 PDF, report.pdf.")
        { file, output, format, units, modes, absorberHost, massRatio, absorberMode, absorberMethod };
        var solver = CommonOptions.Solver();
        command.Add(solver);
        command.SetAction(parse =>
        {
            var path = parse.GetValue(file)!;
            var directory = parse.GetValue(output)!;
            if (string.IsNullOrWhiteSpace(directory) || directory.Contains('\0'))
            {
                io.Error.WriteLine($"modalchain: error: --output must name a folder{(directory.Contains('\0') ? " (the name given holds a NUL character)" : " (the name given is empty)")}; give the folder to write the report into.");
                return ExitCodes.InputError;
            }
            var document = CommonOptions.Load(path, io);
            if (document is null) return ExitCodes.InputError;
            if (CommonOptions.SolverOf(parse, solver, io) is not { } choice) return ExitCodes.InputError;
            if (!Generated(io, out var generated)) return ExitCodes.InputError;
            var options = new ReportOptions(CliApp.Version, generated, parse.GetValue(units), parse.GetValue(modes) ?? 20) { Solver = choice };
            var hostName = parse.GetValue(absorberHost);
            var ratioText = parse.GetValue(massRatio);
            if (hostName is null != ratioText is null)
            {
                io.Error.WriteLine("modalchain: error: --absorber-host and --mass-ratio go together: give both to add the absorber section, or neither.");
                return ExitCodes.InputError;
            }
            if (hostName is not null && document.Circuit is not null)
            {
                io.Error.WriteLine($"modalchain: error: {path}: --absorber-host and --mass-ratio size a tuned absorber on a mechanical model; a circuit's report takes neither.");
                return ExitCodes.InputError;
            }
            if (hostName is not null && ratioText is not null)
            {
                var request = AbsorberArguments.Request(ModalAnalysis.Solve(document.Network, new ModalOptions(Choice: choice)), hostName, ratioText, parse.GetValue(absorberMode),
                    OperatingLoads.AbsorberExcitations(document), AbsorberTarget.Force, io);
                if (request is null) return ExitCodes.InputError;
                options = options with { Absorber = new AbsorberReportRequest(request, AbsorberArguments.IsOptimal(parse.GetValue(absorberMethod))) };
            }
            var report = ReportBuilder.Build(document, options);
            try
            {
                var files = ReportWriter.Write(report, directory, parse.GetValue(format));
                io.Output.WriteLine($"{path}: report written to {directory}: {string.Join(", ", files)}");
            }
            catch (ReportWriteException e)
            {
                io.Error.WriteLine($"modalchain: error: {e.Message}");
                return ExitCodes.InputError;
            }
            return ExitCodes.Success;
        });
        return command;
    }

    /// <summary>The date printed on the report: now, or SOURCE_DATE_EPOCH (whole seconds since 1970 UTC) when set, so a report can be reproduced byte for byte.</summary>
    private static bool Generated(Streams io, out DateTimeOffset generated)
    {
        generated = DateTimeOffset.UtcNow;
        var epoch = Environment.GetEnvironmentVariable("SOURCE_DATE_EPOCH");
        if (string.IsNullOrEmpty(epoch)) return true;
        if (long.TryParse(epoch, System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture, out var seconds)
            && seconds <= DateTimeOffset.MaxValue.ToUnixTimeSeconds())
        {
            generated = DateTimeOffset.FromUnixTimeSeconds(seconds);
            return true;
        }
        io.Error.WriteLine($"modalchain: error: SOURCE_DATE_EPOCH '{epoch}' is not a whole number of seconds since 1970-01-01 UTC; unset it or correct it.");
        return false;
    }
}
