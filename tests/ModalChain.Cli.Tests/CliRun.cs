using System.Globalization;
using System.Text.RegularExpressions;

namespace ModalChain.Cli.Tests;

/// <summary>What one in-process run of the program produced.</summary>
internal sealed record CliOutcome(int ExitCode, string Stdout, string Stderr)
{
    public override string ToString() => $"exit {ExitCode}\n--- stdout\n{Stdout}\n--- stderr\n{Stderr}";
}

/// <summary>Runs <see cref="CliApp.Run"/> in-process and finds the repository's files.</summary>
internal static partial class CliRun
{
    public static CliOutcome Run(params string[] args)
    {
        using var stdout = new StringWriter(CultureInfo.InvariantCulture);
        using var stderr = new StringWriter(CultureInfo.InvariantCulture);
        var code = CliApp.Run(args, stdout, stderr);
        return new CliOutcome(code, stdout.ToString(), stderr.ToString());
    }

    /// <summary>The repository root: the nearest folder above the test assembly that holds ModalChain.sln.</summary>
    public static string RepositoryRoot { get; } = FindRoot();

    private static string FindRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "ModalChain.sln"))) return dir.FullName;
        throw new InvalidOperationException($"ModalChain.sln not found above {AppContext.BaseDirectory}");
    }

    /// <summary>Every model in models/, found when the tests run, so a new example is covered without editing a test.</summary>
    public static TheoryData<string> Models() => [.. ModelNames()];

    public static string[] ModelNames() =>
        [.. Directory.GetFiles(Path.Combine(RepositoryRoot, "models"), "*.yaml").Select(f => Path.GetFileName(f)).Order(StringComparer.Ordinal)];

    public static string ModelPath(string name) => Path.Combine(RepositoryRoot, "models", name);

    /// <summary>Help text with its line wrapping undone, so a phrase can be found whatever the width.</summary>
    public static string Unwrapped(string text) => Whitespace().Replace(text, " ");

    [GeneratedRegex(@"\s+")]
    private static partial Regex Whitespace();

    /// <summary>A temporary model file, deleted on dispose.</summary>
    public sealed class TempModel : IDisposable
    {
        public TempModel(string text)
        {
            Path = System.IO.Path.Combine(System.IO.Path.GetTempPath(), $"modalchain-cli-{Guid.NewGuid():N}.yaml");
            File.WriteAllText(Path, text);
        }

        public string Path { get; }

        public void Dispose() => File.Delete(Path);
    }
}
