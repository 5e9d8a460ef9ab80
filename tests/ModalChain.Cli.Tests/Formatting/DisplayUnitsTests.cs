using System.Globalization;
using System.Text.RegularExpressions;
using ModalChain.Core.Model;
using ModalChain.Io.Model;
using ModalChain.TestSupport;
using static ModalChain.Cli.Tests.CliRun;

namespace ModalChain.Cli.Tests.Formatting;

/// <summary>Every human-facing table of every command is in the units asked for, in words a person reads, never JSON keys.</summary>
public sealed partial class DisplayUnitsTests
{
    private static ModelDocument Document(string model)
    {
        var r = ModelReader.ReadFile(ModelPath(model));
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
        return r.Model!;
    }

    /// <summary>The table-printing commands that apply to <paramref name="model"/>, each with its arguments.</summary>
    private static IEnumerable<string[]> Commands(string model)
    {
        var path = ModelPath(model);
        var document = Document(model);
        var network = document.Network;
        yield return ["validate", path];
        yield return ["modes", path, "--count", "6"];
        if (!document.Criteria.IsEmpty) yield return ["check", path];
        if (document.Harmonic is not null && !document.Structure.Loads.IsEmpty) yield return ["harmonic", path, "--points", "60"];
        if (document.Transient is not null) yield return ["transient", path];
        yield return ["tune", path, .. TuneHost(network), "--mass-ratio", "5 %"];
        if (network.Space != ModelSpace.Line) yield break; // study refuses plane and 3d models for now
        if (network.Springs.Length > 0)
        {
            var spring = network.Springs[0];
            yield return ["study", path, "--vary", $"springs.{spring.Name}.stiffness", "--from", $"{spring.Stiffness * 0.8:R} N/m",
                "--to", $"{spring.Stiffness * 1.2:R} N/m", "--steps", "3"];
        }
        yield return ["study", path, "--vary", "speed", "--from", "0 rpm", "--to", "3000 rpm", "--steps", "50"];
    }

    public static TheoryData<string, string> ModelsAndSystems()
    {
        var data = new TheoryData<string, string>();
        // Circuit models print V, A and Ω whatever --units says, and their element names are their own (CircuitModelsEndToEndTests).
        foreach (var m in ModelNames().Where(n => !IsCircuit(n)))
        {
            data.Add(m, "si");
            data.Add(m, "imperial");
        }
        return data;
    }

    // A snake_case word of at least two letters on each side ("spring_force", "time_s"); single-letter subscripts of
    // symbols such as f_n, omega_p or u_A are notation, not keys.
    [GeneratedRegex(@"\b[a-z]{2,}(?:_[a-z0-9]{2,})+\b")]
    private static partial Regex SnakeCase();

    private static IEnumerable<string> Names(ModelDocument d) =>
        d.Network.Masses.Select(m => m.Name).Concat(d.Network.Springs.Select(s => s.Name)).Concat(d.Network.Dampers.Select(x => x.Name))
            .Concat(d.Network.Supports.Select(s => s.Name)).Concat(d.Structure.Loads.Select(l => l.Name)).Concat(d.TimedLoads.Select(l => l.Name));

    [Theory]
    [MemberData(nameof(ModelsAndSystems))]
    public void EveryTableOfEveryCommand_ShowsNoJsonKey(string model, string system)
    {
        var names = Names(Document(model)).ToHashSet(StringComparer.Ordinal);
        foreach (var command in Commands(model))
        {
            var o = Run([.. command, "--units", system]);
            Assert.True(o.ExitCode is 0 or 1, $"{string.Join(' ', command)}\n{o}");
            var keys = SnakeCase().Matches(o.Stdout).Select(m => m.Value).Where(k => !names.Any(n => n.Contains(k, StringComparison.Ordinal))).Distinct().ToList();
            Assert.True(keys.Count == 0, $"{string.Join(' ', command)} --units {system} prints {string.Join(", ", keys)}:\n{o.Stdout}");
        }
    }

    // Symbols of the SI display units as the tables print them; none may appear in an imperial table (or the reverse).
    private static readonly string[] SiSymbols = ["[mm", "[m/s", "[N ", "[N]", " kg", "kN", "N*s/m", "[um/s", " mm ", " mm/s", " m/s^2", " N ", " J "];
    private static readonly string[] ImperialSymbols = ["[in", "in/s", "lbf", " lb", "[uin/s", "in*lbf", "oz*in", "in/kip"];

    [Theory]
    [MemberData(nameof(CliRun.Models), MemberType = typeof(CliRun))]
    public void ImperialTables_CarryNoSiUnit(string model)
    {
        foreach (var command in Commands(model))
        {
            var o = Run([.. command, "--units", "imperial"]);
            // The first line is the model's title, free text; the caution is the same in every system.
            var body = string.Join('\n', o.Stdout.Split('\n').Skip(2).Where(l => !l.StartsWith("Caution", StringComparison.Ordinal)));
            var found = SiSymbols.Where(s => body.Contains(s, StringComparison.Ordinal)).ToList();
            Assert.True(found.Count == 0, $"{string.Join(' ', command)} --units imperial prints {string.Join(", ", found)}:\n{o.Stdout}");
        }
    }

    [Theory]
    [MemberData(nameof(CliRun.Models), MemberType = typeof(CliRun))]
    public void SiTables_CarryNoImperialUnit(string model)
    {
        foreach (var command in Commands(model))
        {
            var o = Run([.. command, "--units", "si"]);
            var body = string.Join('\n', o.Stdout.Split('\n').Skip(2));
            var found = ImperialSymbols.Where(s => body.Contains(s, StringComparison.Ordinal)).ToList();
            Assert.True(found.Count == 0, $"{string.Join(' ', command)} --units si prints {string.Join(", ", found)}:\n{o.Stdout}");
        }
    }

    private const string KilonewtonsPerMillimetre = """
        title: Two springs written in kN/mm
        masses:
          deck: {mass: 3200 kg}
          skid: {mass: 850 kg}
        springs:
          columns: {between: [ground, deck], stiffness: 95 kN/mm}
          mounts: {between: [deck, skid], stiffness: 8.4 kN/mm}
        """;

    [Fact]
    public void Tune_ShowsTheAbsorbersStiffness_InTheUnitTheSpringsAreWrittenIn()
    {
        using var model = new TempModel(KilonewtonsPerMillimetre);
        var si = Run("tune", model.Path, "--host", "deck", "--mass-ratio", "5 %");
        Assert.True(si.ExitCode == 0, si.ToString());
        var line = si.Stdout.Split('\n').Single(l => l.TrimStart().StartsWith("stiffness", StringComparison.Ordinal));
        Assert.EndsWith("kN/mm", line.TrimEnd(), StringComparison.Ordinal);
        // The same design in N/m from --format json (SI, the contract): the table's number is that value / 1e6
        // (1 kN/mm = 1e6 N/m by definition of the prefixes).
        var json = System.Text.Json.JsonDocument.Parse(Run("tune", model.Path, "--host", "deck", "--mass-ratio", "5 %", "--format", "json").Stdout);
        var newtonsPerMetre = FindNumber(json.RootElement, "stiffness_n_per_m");
        var shown = double.Parse(line.Split(' ', StringSplitOptions.RemoveEmptyEntries)[1], CultureInfo.InvariantCulture);
        NumericAssert.Close(newtonsPerMetre / 1e6, shown, Tolerance.Rel(1e-5), "stiffness in kN/mm (six significant digits shown)");
    }

    [Fact]
    public void ImperialAsked_OverridesTheWrittenMetricUnit()
    {
        using var model = new TempModel(KilonewtonsPerMillimetre);
        var o = Run("tune", model.Path, "--host", "deck", "--mass-ratio", "5 %", "--units", "imperial");
        var line = o.Stdout.Split('\n').Single(l => l.TrimStart().StartsWith("stiffness", StringComparison.Ordinal));
        Assert.EndsWith("lbf/in", line.TrimEnd(), StringComparison.Ordinal);
    }

    [Fact]
    public void MixedStiffnessUnits_FallBackToTheSystemsUnit()
    {
        using var model = new TempModel(KilonewtonsPerMillimetre.Replace("8.4 kN/mm", "8400 N/mm", StringComparison.Ordinal));
        var o = Run("tune", model.Path, "--host", "deck", "--mass-ratio", "5 %");
        var line = o.Stdout.Split('\n').Single(l => l.TrimStart().StartsWith("stiffness", StringComparison.Ordinal));
        Assert.EndsWith("kN/m", line.TrimEnd(), StringComparison.Ordinal);
    }

    [Fact]
    public void AModelWrittenInUsCustomaryUnits_IsShownInThemWithoutAsking()
    {
        using var model = new TempModel("""
            masses:
              deck: {mass: 7000 lb}
            springs:
              columns: {between: [ground, deck], stiffness: 540000 lbf/in}
            """);
        var o = Run("validate", model.Path);
        Assert.Contains("total mass:          7000 lb", o.Stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void TransientPeaks_InInches_AreTheMillimetreFiguresOver25Point4()
    {
        // 1 in = 25.4 mm exactly (international inch, 1959; NIST SP 811, 2008, App. B).
        var path = ModelPath("fan-platform-startup.yaml");
        var si = Rows(Run("transient", path, "--units", "si").Stdout, "displacement [mm peak]");
        var imperial = Rows(Run("transient", path, "--units", "imperial").Stdout, "displacement [in peak]");
        Assert.NotEmpty(si);
        foreach (var (name, mm) in si)
            // Both are printed to four significant digits, so they agree to the rounding of each (5e-4 relative).
            NumericAssert.Close(mm / 25.4, imperial[name], Tolerance.Rel(1e-3), $"{name} peak displacement [in]");
    }

    /// <summary>The first numeric column of the table whose header starts with "output" and holds <paramref name="header"/>.</summary>
    private static Dictionary<string, double> Rows(string stdout, string header)
    {
        var lines = stdout.Split('\n');
        var start = Array.FindIndex(lines, l => l.TrimStart().StartsWith("output", StringComparison.Ordinal) && l.Contains(header, StringComparison.Ordinal));
        Assert.True(start >= 0, $"no table with '{header}' in\n{stdout}");
        var rows = new Dictionary<string, double>(StringComparer.Ordinal);
        foreach (var line in lines.Skip(start + 2).TakeWhile(l => l.Trim().Length > 0))
        {
            var cells = line.Split(' ', StringSplitOptions.RemoveEmptyEntries);
            rows[cells[0]] = double.Parse(cells[1], CultureInfo.InvariantCulture);
        }
        return rows;
    }

    private static double FindNumber(System.Text.Json.JsonElement e, string name)
    {
        if (e.ValueKind == System.Text.Json.JsonValueKind.Object)
            foreach (var p in e.EnumerateObject())
            {
                if (p.Name == name && p.Value.ValueKind == System.Text.Json.JsonValueKind.Number) return p.Value.GetDouble();
                if (TryFind(p.Value, name) is { } v) return v;
            }
        throw new InvalidOperationException($"no '{name}' in the JSON");
    }

    private static double? TryFind(System.Text.Json.JsonElement e, string name)
    {
        try { return FindNumber(e, name); }
        catch (InvalidOperationException) { return null; }
    }
}
