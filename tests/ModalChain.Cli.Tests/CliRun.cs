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

    /// <summary>True when the example <paramref name="name"/> is a circuit model (a top-level 'circuit' section): its outputs speak V, A and Ω and have their own schemas.</summary>
    public static bool IsCircuit(string name) => ModalChain.Io.Model.ModelReader.ReadFile(ModelPath(name)).Model?.Circuit is not null;

    /// <summary>The mechanical models of models/ (every one but the circuit models), for tests of mechanical outputs.</summary>
    public static TheoryData<string> MechanicalModels() => [.. ModelNames().Where(n => !IsCircuit(n))];

    /// <summary>The circuit models of models/.</summary>
    public static TheoryData<string> CircuitModels() => [.. ModelNames().Where(IsCircuit)];

    /// <summary>
    /// The tune options naming a host of <paramref name="network"/>: the heaviest mass of a line model; in a plane or 3d
    /// model the translation DOF label (from <see cref="ModalChain.Core.Dofs.DofMap"/>) that moves most in the first
    /// flexible mode, with that mode, so the host never sits at a node of the mode tuned.
    /// </summary>
    public static string[] TuneHost(ModalChain.Core.Model.Network network)
    {
        if (network.Space == ModalChain.Core.Model.ModelSpace.Line) return ["--host", network.Masses.MaxBy(m => m.Kilograms)!.Name];
        var modal = ModalChain.Core.Analyses.Modal.ModalAnalysis.Solve(network);
        var dofs = modal.Matrices.Dofs;
        var mode = modal.Modes.First(m => !m.IsRigidBody);
        var translations = Enumerable.Range(0, dofs.Count).Where(i => !ModalChain.Core.Model.Directions.IsRotation(dofs.Dofs[i].Direction));
        var host = translations.MaxBy(i => Math.Abs(mode.Shape[i]));
        return ["--host", dofs.Label(host), "--mode", mode.Number.ToString(CultureInfo.InvariantCulture)];
    }

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
