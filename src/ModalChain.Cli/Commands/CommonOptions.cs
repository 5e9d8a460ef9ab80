using System.CommandLine;
using ModalChain.Core.Solvers;
using ModalChain.Io.Diagnostics;
using ModalChain.Io.Model;
using ModalChain.Io.Text;

namespace ModalChain.Cli.Commands;

/// <summary>Output formats of the result commands.</summary>
internal enum OutputFormat
{
    Table,
    Json,
    Csv,
}

/// <summary>Arguments and helpers every command shares, so each reads and reports the model the same way.</summary>
internal static class CommonOptions
{
    public static Argument<string> ModelFile() => new("FILE") { Description = "The model file (YAML); see docs/model-format.md." };

    /// <summary>The --format option offering <paramref name="offered"/> (all three when none are named); absent, it is table.</summary>
    public static Option<OutputFormat> Format(params OutputFormat[] offered)
    {
        if (offered.Length == 0) offered = [OutputFormat.Table, OutputFormat.Json, OutputFormat.Csv];
        var described = offered.Select(f => f switch
        {
            OutputFormat.Table => "table (for reading, the default)",
            OutputFormat.Json => "json (one object on stdout, SI units)",
            _ => "csv (for spreadsheets)",
        }).ToArray();
        var sentence = described.Length == 1 ? described[0] : string.Join(", ", described[..^1]) + " or " + described[^1];
        // Help lists only what the command writes, in lower case; an absent --format is default(OutputFormat), Table.
        return CommandValues.Choice("--format", sentence + ".", [.. offered.Select(f => (f.ToString().ToLowerInvariant(), f))]);
    }

    /// <summary>The <c>--solver</c> option of every command that solves modes.</summary>
    public static Option<SolverChoice> Solver()
    {
        var option = new Option<SolverChoice>("--solver")
        {
            Description = "Eigen solver: auto (the default: native LAPACK when a library such as libopenblas.so.0 is installed, " +
                "else the embedded managed one; the sparse one for a few modes of a large model), managed, native or sparse. " +
                "The output names the solver that ran.",
            HelpName = "auto|managed|native|sparse",
        };
        option.AcceptOnlyFromAmong("auto", "managed", "native", "sparse");
        return option;
    }

    /// <summary>The solver asked for, or null (after printing why) when it is native and no library could be loaded.</summary>
    public static SolverChoice? SolverOf(ParseResult parse, Option<SolverChoice> option, Streams io)
    {
        var choice = parse.GetValue(option);
        if (choice == SolverChoice.Native && !NativeLapack.IsAvailable)
        {
            io.Error.WriteLine($"modalchain: error: --solver native: no LAPACK library could be loaded (tried {string.Join(", ", NativeLapack.Candidates)}). " +
                "On Debian or Ubuntu: apt-get install libopenblas0-pthread; or use --solver auto.");
            return null;
        }
        return choice;
    }

    /// <summary>Loads the model, printing every diagnostic; returns null (and the caller exits 2) when it has errors.</summary>
    public static ModelDocument? Load(string file, Streams io)
    {
        var result = ModelReader.ReadFile(file);
        foreach (var d in result.Diagnostics) io.Error.WriteLine(TerminalText.Line(d.ToString()));
        if (result.Model is null)
        {
            var count = result.Errors.Count();
            io.Error.WriteLine($"{file}: {count} error{(count == 1 ? "" : "s")}; nothing was analysed.");
        }
        return result.Model;
    }

    public static int WarningCount(ModelDocument document) => document.Warnings.Count(w => w.Severity == Severity.Warning);

    /// <summary>An option naming elements of the model: names joined by commas, or the option repeated.</summary>
    public static Option<string[]> NameList(string name, string description) => new(name)
    {
        Description = description,
        AllowMultipleArgumentsPerToken = true,
        HelpName = "NAME[,NAME...]",
    };

    /// <summary>The names given to a <see cref="NameList"/> option, split at commas, blanks dropped, duplicates removed, in order.</summary>
    public static string[] Names(string[]? values) =>
        values is null ? [] : [.. values.SelectMany(v => v.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries)).Distinct(StringComparer.Ordinal)];
}
