using System.CommandLine;
using System.CommandLine.Help;
using System.Globalization;
using System.Reflection;
using ModalChain.Cli.Commands;
using ModalChain.Core;
using ModalChain.Core.Analyses.Absorbers;

namespace ModalChain.Cli;

/// <summary>The command-line program: builds the command tree, parses, runs one command and maps outcomes to exit codes.</summary>
public static class CliApp
{
    /// <summary>The tool's version as printed by --version and recorded in every output.</summary>
    public static string Version { get; } =
        typeof(CliApp).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion ?? "0.0.0";

    internal const string CautionHelp = "Caution: " + Cautions.Text;

    /// <summary>Runs the program under the invariant culture: numbers are read and written the same on every machine.</summary>
    /// <remarks>
    /// The options read their numbers culture-independently themselves (<see cref="CommandValues"/>); running under the
    /// invariant culture as well keeps every output byte-identical whatever the machine's language, including the
    /// parser's own words ("Usage:", "Options:"), which would otherwise follow the user interface language.
    /// </remarks>
    /// <summary>Runs the program with <paramref name="args"/>, writing results to <paramref name="output"/> and problems to <paramref name="error"/>.</summary>
    /// <returns>The exit code (see <see cref="ExitCodes"/>).</returns>
    /// <param name="args">The command line.</param>
    /// <param name="output">Where results go.</param>
    /// <param name="error">Where diagnostics go.</param>
    /// <param name="rawOutput">The byte stream under <paramref name="output"/> (standard output), so JSON is streamed to it without a text detour; null to write JSON through <paramref name="output"/>.</param>
    public static int Run(string[] args, TextWriter output, TextWriter error, Stream? rawOutput = null)
    {
        var (culture, ui) = (CultureInfo.CurrentCulture, CultureInfo.CurrentUICulture);
        CultureInfo.CurrentCulture = CultureInfo.InvariantCulture;
        CultureInfo.CurrentUICulture = CultureInfo.InvariantCulture;
        try { return RunInvariant(args, output, error, rawOutput); }
        finally
        {
            CultureInfo.CurrentCulture = culture;
            CultureInfo.CurrentUICulture = ui;
        }
    }

    private static int RunInvariant(string[] args, TextWriter output, TextWriter error, Stream? rawOutput)
    {
        var io = new Streams(output, error, rawOutput);
        var root = new RootCommand(
            "ModalChain: natural frequencies, mode shapes and vibration response of lumped mass-spring-damper models " +
            "of floors, platforms, racks and shelving that carry machinery.\n\n" +
            "Exit codes: 0 done, 1 a check failed, 2 input error, 3 numerical failure, 4 internal error.\n\n" +
            "Numbers on the command line use '.' as the decimal point and may carry a unit of their kind ('30.5', '30.5 Hz', " +
            "'1480 rpm'); a bare number is in the unit the option's help states.");
        var tune = TuneCommand.Create(io);
        root.Subcommands.Add(ValidateCommand.Create(io));
        root.Subcommands.Add(ModesCommand.Create(io));
        root.Subcommands.Add(CheckCommand.Create(io));
        root.Subcommands.Add(tune);
        root.Subcommands.Add(StudyCommand.Create(io));
        root.Subcommands.Add(HarmonicCommand.Create(io));
        root.Subcommands.Add(TransientCommand.Create(io));
        root.Subcommands.Add(ReportCommand.Create(io));
        // The built-in action prints the entry assembly's version, which is the host's when run in-process.
        foreach (var v in root.Options.OfType<VersionOption>()) v.Action = new PrintVersion(output);
        // The caution closes every help page once; listing it in each command's description printed it nine times.
        foreach (var h in root.Options.OfType<HelpOption>())
            h.Action = new HelpWithCaution((HelpAction)h.Action!, output, new Dictionary<Command, string> { [tune] = "Absorber caution: " + AbsorberCaution.Text });

        try
        {
            // Parsing runs option validators and converters, so it sits inside the handler too: no stack trace escapes.
            var parse = root.Parse(args);
            var config = new InvocationConfiguration { Output = output, Error = error, EnableDefaultExceptionHandler = false };
            if (parse.Errors.Count > 0 && !WantsHelp(args))
            {
                foreach (var e in parse.Errors) error.WriteLine($"modalchain: error: {e.Message}");
                error.WriteLine("Run 'modalchain --help' (or 'modalchain COMMAND --help') for usage.");
                return ExitCodes.InputError;
            }
            return parse.Invoke(config);
        }
        catch (NumericalFailureException e)
        {
            error.WriteLine($"modalchain: error: numerical failure: {e.Message}");
            return ExitCodes.NumericalFailure;
        }
        catch (Exception e)
        {
            error.WriteLine($"modalchain: internal error ({e.GetType().Name}): {e.Message}");
            error.WriteLine("This is a bug in ModalChain; please report it with the model file that caused it.");
            return ExitCodes.InternalError;
        }
    }

    private static bool WantsHelp(string[] args) => args.Any(a => a is "--help" or "-h" or "-?");

    /// <summary>The parser's help page, then the notes of the command shown (if any) and the caution, once.</summary>
    private sealed class HelpWithCaution(HelpAction help, TextWriter output, IReadOnlyDictionary<Command, string> notes)
        : System.CommandLine.Invocation.SynchronousCommandLineAction
    {
        public override bool ClearsParseErrors => true;

        public override int Invoke(ParseResult parseResult)
        {
            var code = help.Invoke(parseResult);
            if (notes.TryGetValue(parseResult.CommandResult.Command, out var note))
            {
                output.WriteLine(note);
                output.WriteLine();
            }
            output.WriteLine(CautionHelp);
            return code;
        }
    }

    private sealed class PrintVersion(TextWriter output) : System.CommandLine.Invocation.SynchronousCommandLineAction
    {
        public override bool ClearsParseErrors => true;

        public override int Invoke(ParseResult parseResult)
        {
            output.WriteLine(Version);
            return ExitCodes.Success;
        }
    }
}

/// <summary>Where a command writes: results to <see cref="Output"/>, diagnostics and notes to <see cref="Error"/>.</summary>
/// <param name="Output">Results as text.</param>
/// <param name="Error">Diagnostics and notes.</param>
/// <param name="RawOutput">The byte stream under <paramref name="Output"/>, when there is one (standard output).</param>
internal sealed record Streams(TextWriter Output, TextWriter Error, Stream? RawOutput = null)
{
    /// <summary>Streams one UTF-8 JSON document and a closing newline to the output, never holding it whole in memory.</summary>
    public void WriteJson(Action<Stream> write)
    {
        ArgumentNullException.ThrowIfNull(write);
        Output.Flush();
        if (RawOutput is { } raw)
        {
            write(raw);
            raw.WriteByte((byte)'\n');
            raw.Flush();
            return;
        }
        using (var text = new TextWriterStream(Output)) write(text);
        Output.WriteLine();
    }
}

/// <summary>A write-only byte stream that decodes UTF-8 into a <see cref="TextWriter"/> as it arrives.</summary>
internal sealed class TextWriterStream(TextWriter writer) : Stream
{
    private readonly System.Text.Decoder _decoder = System.Text.Encoding.UTF8.GetDecoder();
    private char[] _chars = new char[4096];

    public override bool CanRead => false;
    public override bool CanSeek => false;
    public override bool CanWrite => true;
    public override long Length => throw new NotSupportedException();
    public override long Position { get => throw new NotSupportedException(); set => throw new NotSupportedException(); }
    public override void Flush() => writer.Flush();
    public override int Read(byte[] buffer, int offset, int count) => throw new NotSupportedException();
    public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();
    public override void SetLength(long value) => throw new NotSupportedException();
    public override void Write(byte[] buffer, int offset, int count) => Write(buffer.AsSpan(offset, count));

    public override void Write(ReadOnlySpan<byte> buffer)
    {
        var needed = _decoder.GetCharCount(buffer, flush: false);
        if (needed > _chars.Length) _chars = new char[needed];
        var written = _decoder.GetChars(buffer, _chars, flush: false);
        writer.Write(_chars, 0, written);
    }
}
