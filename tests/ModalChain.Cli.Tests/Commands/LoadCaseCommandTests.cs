using System.Text.Json;
using ModalChain.Cli;
using ModalChain.TestSupport;

namespace ModalChain.Cli.Tests.Commands;

/// <summary>Load cases through the commands (harmonic, check) and the choice of loads and cases on the command line.</summary>
public sealed class LoadCaseCommandTests : IDisposable
{
    private readonly string _directory = Directory.CreateTempSubdirectory("modalchain-cli-cases-").FullName;

    public void Dispose() => Directory.Delete(_directory, recursive: true);

    private const string Network = """
        masses:
          deck: {mass: 3200 kg, at: [0, 0]}
          skid: {mass: 850 kg, at: [0, 1.2]}
          pump: {mass: 400 kg, at: [1, 1.2]}
        springs:
          columns: {between: [ground, deck], stiffness: 95 kN/mm}
          mounts: {between: [deck, skid], stiffness: 8.4 kN/mm}
          pump-mounts: {between: [deck, pump], stiffness: 3 kN/mm}
        damping:
          modal: 3 %
        loads:
          fan-unbalance: {kind: unbalance, at: skid, mass-radius: 12 kg*mm, speed: 1480 rpm}
          pump-unbalance: {kind: unbalance, at: pump, mass-radius: 4 kg*mm, speed: 2960 rpm}
          start-up: {kind: force, at: skid, time: {kind: step, value: 2 kN, at: 0.05 s}}
          hammer: {kind: force, at: deck, time: {kind: step, value: 1 kN, at: 0.1 s}}

        """;

    private const string Cases = """
        load-cases:
          fan: [fan-unbalance]
          pump: {loads: [pump-unbalance]}

        """;

    private const string Sweep = """
          frequencies: {from: 2 Hz, to: 70 Hz, points: 120}
          outputs: [deck, skid]

        """;

    private string Model(string name, string text)
    {
        var path = Path.Combine(_directory, name);
        File.WriteAllText(path, text);
        return path;
    }

    private static JsonDocument Json(params string[] args)
    {
        var run = CliRun.Run([.. args, "--format", "json"]);
        Assert.True(run.ExitCode is 0 or 1, run.ToString());
        return JsonDocument.Parse(run.Stdout);
    }

    [Fact]
    public void ACaseInTheHarmonicJson_EqualsTheSweepOfItsLoadsWithoutCases()
    {
        // Identity: a case is its loads swept alone; the JSON arrays must be the same numbers.
        var withCases = Model("cases.yaml", Network + Cases + "harmonic:\n  combine: rms\n" + Sweep);
        var alone = Model("alone.yaml", Network + "harmonic:\n  loads: [pump-unbalance]\n" + Sweep);
        using var byCase = Json("harmonic", withCases);
        using var single = Json("harmonic", alone);
        var root = byCase.RootElement;
        Assert.Equal(0, root.GetProperty("responses").GetArrayLength());
        Assert.Equal(2, root.GetProperty("cases").GetArrayLength());
        var pump = root.GetProperty("cases").EnumerateArray().Single(c => c.GetProperty("name").GetString() == "pump");
        foreach (var field in new[] { "frequencies_hz", "responses", "peaks", "operating_points", "reactions" })
            Assert.True(JsonElement.DeepEquals(single.RootElement.GetProperty(field), pump.GetProperty(field)), $"'{field}' differs");
        Assert.Equal(JsonValueKind.Null, single.RootElement.GetProperty("combination").ValueKind);
        Assert.Equal("rms", root.GetProperty("combination").GetProperty("rule").GetString());
    }

    [Theory]
    [InlineData("sum")]
    [InlineData("rms")]
    public void TheCombinationInTheJson_IsTheRuleAppliedToItsComponents(string rule)
    {
        // Identity: the combined magnitude is Σ a_k (sum) or √(Σ a_k²) (rms) of the listed components; 1e-12 rel.
        using var json = Json("harmonic", Model("cases.yaml", Network + Cases + $"harmonic:\n  combine: {rule}\n" + Sweep));
        var combination = json.RootElement.GetProperty("combination");
        Assert.Equal(rule, combination.GetProperty("rule").GetString());
        var responses = combination.GetProperty("responses").EnumerateArray().ToList();
        Assert.Equal(2 * 3 * 2, responses.Count); // outputs × quantities × (peak, rms)
        foreach (var r in responses)
        {
            var parts = r.GetProperty("components").EnumerateArray().Select(c => c.GetProperty("magnitude").GetDouble()).ToArray();
            Assert.Equal(2, parts.Length);
            var hand = rule == "sum" ? parts.Sum() : Math.Sqrt(parts.Sum(a => a * a));
            NumericAssert.Close(hand, r.GetProperty("magnitude").GetDouble(), Tolerance.Rel(1e-12), $"{r.GetProperty("dof")} {r.GetProperty("quantity")} {r.GetProperty("amplitude")}");
        }
    }

    [Fact]
    public void TheTableAndCsv_ShowEachCaseAndNameTheRule()
    {
        var path = Model("cases.yaml", Network + Cases + "harmonic:\n" + Sweep);
        var table = CliRun.Run("harmonic", path);
        Assert.Equal(0, table.ExitCode);
        Assert.Contains("Load case fan", table.Stdout);
        Assert.Contains("Load case pump", table.Stdout);
        Assert.Contains("rule: sum", table.Stdout);
        Assert.Contains("velocity [mm/s rms, sum]", table.Stdout);
        var csv = CliRun.Run("harmonic", path, "--format", "csv");
        var lines = csv.Stdout.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.StartsWith("case,frequency [Hz],", lines[0]);
        Assert.Contains(lines, l => l.StartsWith("fan,", StringComparison.Ordinal));
        Assert.Contains(lines, l => l.StartsWith("pump,", StringComparison.Ordinal));
        Assert.Single(lines, l => l.StartsWith("case,", StringComparison.Ordinal));
    }

    [Fact]
    public void CasesOption_ReplacesTheFilesChoice()
    {
        var path = Model("cases.yaml", Network + Cases + "harmonic:\n  cases: [fan, pump]\n" + Sweep);
        using var json = Json("harmonic", path, "--cases", "pump");
        var cases = json.RootElement.GetProperty("cases").EnumerateArray().Select(c => c.GetProperty("name").GetString()!).ToArray();
        Assert.Equal(["pump"], cases);
    }

    [Fact]
    public void Check_ComparesLimitsWithTheCombination_AndNamesTheRule()
    {
        // The limit's value is the combined r.m.s. velocity of the harmonic JSON (same computation, direct method); 1e-9 rel.
        var path = Model("cases.yaml", Network + Cases + "harmonic:\n  combine: sum\n" + Sweep +
            "criteria:\n  limits:\n    - {at: skid, quantity: velocity, rms: 2 mm/s}\n");
        using var check = Json("check", path);
        Assert.Equal("sum", check.RootElement.GetProperty("load_case_combination").GetString());
        var value = check.RootElement.GetProperty("limits")[0].GetProperty("value").GetDouble();
        using var harmonic = Json("harmonic", path);
        var combined = harmonic.RootElement.GetProperty("combination").GetProperty("responses").EnumerateArray()
            .Single(r => r.GetProperty("dof").GetString() == "skid" && r.GetProperty("quantity").GetString() == "velocity" && r.GetProperty("amplitude").GetString() == "rms");
        NumericAssert.Close(combined.GetProperty("magnitude").GetDouble(), value, Tolerance.Rel(1e-9), "combined rms velocity at skid");
        var text = CliRun.Run("check", path);
        Assert.Contains("by the rule sum", text.Stdout);
    }

    [Fact]
    public void Study_FollowsALimitOnTheCombination_AsCheckEvaluatesIt()
    {
        // Identity: at the model's own stiffness the study's reserve is check's (the sum rule on an r.m.s. limit,
        // Σ a_k/√2, differs from the root sum of squares a model without cases uses); 1e-9 rel.
        var path = Model("cases.yaml", Network + Cases + "harmonic:\n  combine: sum\n" + Sweep +
            "criteria:\n  limits:\n    - {at: skid, quantity: velocity, rms: 2 mm/s}\n");
        using var check = Json("check", path);
        using var study = Json("study", path, "--vary", "springs.mounts.stiffness", "--from", "8.4 kN/mm", "--to", "9 kN/mm", "--steps", "2");
        var limit = study.RootElement.GetProperty("criteria").EnumerateArray().Single(c => c.GetProperty("name").GetString()!.StartsWith("limit", StringComparison.Ordinal));
        NumericAssert.Close(check.RootElement.GetProperty("limits")[0].GetProperty("reserve").GetDouble(), limit.GetProperty("reserve")[0].GetDouble(), Tolerance.Rel(1e-9), "reserve at 8.4 kN/mm");
    }

    [Fact]
    public void LoadsOption_RunsTheChosenTimedLoadsOnly_AsTheFilesLoadsWould()
    {
        // Identity: --loads start-up gives exactly the run of a file whose transient section lists [start-up].
        const string run = "transient:\n  duration: 0.4 s\n  step: 2 ms\n";
        var all = Model("all.yaml", Network + run);
        var one = Model("one.yaml", Network + run + "  loads: [start-up]\n");
        using var chosen = Json("transient", all, "--loads", "start-up");
        using var file = Json("transient", one);
        using var both = Json("transient", all, "--loads", "start-up,hammer");
        using var every = Json("transient", all);
        Assert.Equal(["start-up"], chosen.RootElement.GetProperty("loads").EnumerateArray().Select(l => l.GetString()!).ToArray());
        Assert.Equal(file.RootElement.GetProperty("peaks").GetRawText(), chosen.RootElement.GetProperty("peaks").GetRawText());
        Assert.Equal(every.RootElement.GetProperty("peaks").GetRawText(), both.RootElement.GetProperty("peaks").GetRawText());
        Assert.NotEqual(chosen.RootElement.GetProperty("peaks").GetRawText(), both.RootElement.GetProperty("peaks").GetRawText());
    }

    [Theory]
    [InlineData("nothing", "not a load of the model")]
    [InlineData("fan-unbalance", "a harmonic load")]
    public void LoadsOption_WithANameThatIsNotATimedLoad_IsAnInputError(string name, string says)
    {
        var path = Model("all.yaml", Network + "transient:\n  duration: 0.4 s\n  step: 2 ms\n");
        var outcome = CliRun.Run("transient", path, "--loads", name);
        Assert.Equal(2, outcome.ExitCode);
        Assert.Contains(says, outcome.Stderr);
        Assert.Contains("the timed loads are: start-up, hammer", outcome.Stderr);
    }
}
