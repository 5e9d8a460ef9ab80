using System.Text.Json;

namespace ModalChain.Cli.Tests.Commands;

/// <summary>Runs the command-line program in-process and keeps what it wrote, with helpers for the check, tune and study tests.</summary>
internal sealed record CommandRun(int ExitCode, string Output, string Error)
{
    public static CommandRun Of(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        var code = CliApp.Run(args, output, error);
        return new CommandRun(code, output.ToString(), error.ToString());
    }

    public JsonElement Json() => JsonDocument.Parse(Output).RootElement;

    private static readonly System.Collections.Concurrent.ConcurrentBag<string> Created = CreateBag();

    private static System.Collections.Concurrent.ConcurrentBag<string> CreateBag()
    {
        var bag = new System.Collections.Concurrent.ConcurrentBag<string>();
        AppDomain.CurrentDomain.ProcessExit += (_, _) =>
        {
            foreach (var f in bag) try { File.Delete(f); } catch (IOException) { }
        };
        return bag;
    }

    /// <summary>A new temporary .yaml path, deleted when the test process ends.</summary>
    public static string TempPath()
    {
        var path = Path.Combine(Path.GetTempPath(), "modalchain-tests-" + Guid.NewGuid().ToString("N") + ".yaml");
        Created.Add(path);
        return path;
    }

    /// <summary>Writes <paramref name="text"/> to a new temporary .yaml file (deleted when the test process ends) and returns its path.</summary>
    public static string ModelFile(string text)
    {
        var path = TempPath();
        File.WriteAllText(path, text);
        return path;
    }

    /// <summary>The repository's models/ folder, found from the test assembly's location.</summary>
    public static string Models()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "ModalChain.sln"))) dir = dir.Parent;
        return Path.Combine(dir?.FullName ?? throw new InvalidOperationException("repository root not found"), "models");
    }

    /// <summary>A one-mass deck (f = √(k/m)/2π) with a separation criterion at <paramref name="speed"/>.</summary>
    public static string Deck(string stiffness, string speed = "1470 rpm", string extra = "") => ModelFile($"""
        title: Test deck
        masses:
          deck: {"{"}mass: 2600 kg{"}"}
          fan: {"{"}mass: 400 kg{"}"}
        springs:
          beams: {"{"}between: [ground, deck], stiffness: {stiffness}{"}"}
          mounts: {"{"}between: [deck, fan], stiffness: 1.6 kN/mm{"}"}
        criteria:
          separation: {"{"}margin: 20 %, speeds: [{speed}], orders: [1, 2]{"}"}
        {extra}
        """);
}
