using System.Text.Json;
using ModalChain.Cli;
using ModalChain.Core;
using ModalChain.TestSupport;

namespace ModalChain.Cli.Tests.Commands;

/// <summary><c>modalchain transient</c> end to end: the example model in every format, a closed-form check, and bad inputs.</summary>
public sealed class TransientCommandTests : IDisposable
{
    private readonly string _directory = Directory.CreateTempSubdirectory("modalchain-cli-transient-").FullName;

    public void Dispose() => Directory.Delete(_directory, recursive: true);

    private static string Example => Path.Combine(RepositoryRoot(), "models", "fan-platform-startup.yaml");

    private static string RepositoryRoot()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "ModalChain.sln"))) dir = dir.Parent;
        return dir?.FullName ?? throw new InvalidOperationException("ModalChain.sln not found above the test binaries.");
    }

    private static (int Code, string Out, string Err) Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        var code = CliApp.Run(args, output, error);
        return (code, output.ToString(), error.ToString());
    }

    private string Model(string name, string text)
    {
        var path = Path.Combine(_directory, name);
        File.WriteAllText(path, text);
        return path;
    }

    [Fact]
    public void ExampleStartUp_Json_HasTheDocumentedShape()
    {
        var (code, output, error) = Run("transient", Example, "--format", "json");
        Assert.Equal(ExitCodes.Success, code);
        Assert.DoesNotContain("#", error);
        using var json = JsonDocument.Parse(output);
        var root = json.RootElement;
        Assert.Equal("newmark", root.GetProperty("method").GetString());
        var times = root.GetProperty("time_s");
        Assert.Equal(10001, times.GetArrayLength());
        var fan = root.GetProperty("responses").EnumerateArray()
            .Single(r => r.GetProperty("dof").GetString() == "fan" && r.GetProperty("quantity").GetString() == "displacement");
        Assert.Equal("m", fan.GetProperty("unit").GetString());
        Assert.Equal(10001, fan.GetProperty("values").GetArrayLength());
        var peak = root.GetProperty("peaks").EnumerateArray()
            .Single(p => p.GetProperty("name").GetString() == "fan" && p.GetProperty("quantity").GetString() == "displacement");
        // The run-up passes the ~8.75 Hz bounce mode at t ≈ 8.75/24.67 × 8 s = 2.8 s; the peak comes a little later.
        var at = peak.GetProperty("time_s").GetDouble();
        Assert.InRange(at, 2.8, 4.0);
        Assert.True(root.GetProperty("energy").GetProperty("max_relative_error").GetDouble() < 1e-9);
        Assert.Equal(Cautions.Text, root.GetProperty("caution").GetString());
        Assert.Contains(root.GetProperty("reactions").EnumerateArray(), r => r.GetProperty("support").GetString() == "ground");
    }

    [Fact]
    public void ExampleStartUp_TableAndCsv()
    {
        var (code, table, _) = Run("transient", Example);
        Assert.Equal(ExitCodes.Success, code);
        Assert.Contains("Peaks", table);
        Assert.Contains("Caution: ", table);
        Assert.Contains("reaction at ground", table);

        var (csvCode, csv, _) = Run("transient", Example, "--format", "csv", "--duration", "0.5 s", "--method", "modal");
        Assert.Equal(ExitCodes.Success, csvCode);
        var rows = csv.TrimEnd('\n').Split('\n');
        Assert.Equal(502, rows.Length);
        Assert.StartsWith("time [s],fan displacement [m]", rows[0]);
        Assert.All(rows.Skip(1), r => Assert.Equal(rows[0].Split(',').Length, r.Split(',').Length));
    }

    [Fact]
    public void ExampleStartUp_ShortRunBeforeItsRmsWindow_ReportsRmsAsNotAvailableWithAWarning()
    {
        // The example's RMS window is 8 to 10 s; a 1 s run holds no step of it. RMS must be null in JSON and n/a in the
        // table, with a warning, never 0 (common practice: an RMS of nothing is not a measurement).
        var (code, output, _) = Run("transient", Example, "--duration", "1 s", "--format", "json");
        Assert.Equal(ExitCodes.Success, code);
        using var json = JsonDocument.Parse(output);
        var root = json.RootElement;
        Assert.All(root.GetProperty("peaks").EnumerateArray(), p => Assert.Equal(JsonValueKind.Null, p.GetProperty("rms").ValueKind));
        Assert.Contains(root.GetProperty("warnings").EnumerateArray(), w => w.GetString()!.Contains("holds no step", StringComparison.Ordinal));

        var (tableCode, table, _) = Run("transient", Example, "--duration", "1 s");
        Assert.Equal(ExitCodes.Success, tableCode);
        Assert.Contains("n/a", table);
        Assert.Contains("Warning: The RMS window 8 to 10 s holds no step", table);
    }

    [Fact]
    public void SuddenLoadOnOneMass_PeakIsTwiceTheStaticDeflection()
    {
        // Dynamic factor 2 of a suddenly applied load on an undamped mass-spring (Chopra, Dynamics of Structures, §4.3 —
        // from memory; common practice). k = 1 MN/m, F = 2 kN: static 2 mm, peak 4 mm at T/2.
        var path = Model("step.yaml", """
            masses:
              shelf: {mass: 100 kg}
            springs:
              post: {between: [ground, shelf], stiffness: 1 MN/m}
            loads:
              drop: {kind: force, at: shelf, time: {kind: step, value: 2 kN}}
            transient: {duration: 0.2 s, step: 0.05 ms, method: exact}
            """);
        var (code, output, _) = Run("transient", path, "--format", "json");
        Assert.Equal(ExitCodes.Success, code);
        using var json = JsonDocument.Parse(output);
        var peak = json.RootElement.GetProperty("peaks").EnumerateArray()
            .Single(p => p.GetProperty("name").GetString() == "shelf" && p.GetProperty("quantity").GetString() == "displacement");
        NumericAssert.Close(0.004, peak.GetProperty("value").GetDouble(), Tolerance.Rel(1e-6), "peak displacement");
        var spring = json.RootElement.GetProperty("peaks").EnumerateArray().Single(p => p.GetProperty("name").GetString() == "post");
        NumericAssert.Close(-4000, spring.GetProperty("value").GetDouble(), Tolerance.Rel(1e-6), "k(u_ground − u_shelf)");
    }

    [Theory]
    [InlineData("--step", "-1 ms", "must be positive (a time)")]
    [InlineData("--step", "20 s", "longer than the duration")]
    [InlineData("--step", "1 kg", "--step")]
    [InlineData("--method", "euler", "--method 'euler' is not one of newmark, hht, exact, modal")]
    [InlineData("--output", "nobody", "'nobody'")]
    public void BadOptions_ExitWithInputError(string option, string value, string message)
    {
        var (code, output, error) = Run("transient", Example, option, value);
        Assert.Equal(ExitCodes.InputError, code);
        Assert.Equal("", output);
        Assert.Contains(message, error);
    }

    [Fact]
    public void UnsortedTable_IsReportedAtItsCsvLineWithExitCode2()
    {
        File.WriteAllText(Path.Combine(_directory, "hit.csv"), "time,force\n0,0\n0.002,100\n0.001,50\n");
        var path = Model("table.yaml", """
            masses:
              shelf: {mass: 100 kg}
            springs:
              post: {between: [ground, shelf], stiffness: 1 MN/m}
            loads:
              hit: {kind: force, at: shelf, time: {kind: table, file: hit.csv}}
            transient: {duration: 0.1 s, step: 0.1 ms}
            """);
        var (code, _, error) = Run("transient", path);
        Assert.Equal(ExitCodes.InputError, code);
        Assert.Contains($"{Path.Combine(_directory, "hit.csv")}:4:1: error: the time 0.001 s is not after the previous row's 0.002 s", error);
    }

    [Fact]
    public void UnknownLoadAndNegativeStep_AreAllReportedWithLineAndColumn()
    {
        var path = Model("bad.yaml", """
            masses:
              shelf: {mass: 100 kg}
            springs:
              post: {between: [ground, shelf], stiffness: 1 MN/m}
            loads:
              drop: {kind: force, at: shelf, time: {kind: step, value: 2 kN}}
            transient:
              duration: 1 s
              step: -2 ms
              loads: [dorp]
            """);
        var (code, _, error) = Run("transient", path);
        Assert.Equal(ExitCodes.InputError, code);
        Assert.Contains(":9:9: error: 'step' of 'transient'", error);
        Assert.Contains(":10:11: error: 'loads' of 'transient' names unknown load 'dorp' (did you mean 'drop'?)", error);
    }

    [Fact]
    public void ModelWithoutTransientSection_NeedsDurationAndStep()
    {
        var path = Model("plain.yaml", """
            masses:
              shelf: {mass: 100 kg}
            springs:
              post: {between: [ground, shelf], stiffness: 1 MN/m}
            loads:
              drop: {kind: force, at: shelf, time: {kind: step, value: 2 kN}}
            """);
        var (code, _, error) = Run("transient", path);
        Assert.Equal(ExitCodes.InputError, code);
        Assert.Contains("no 'transient' section", error);
        var (ok, output, _) = Run("transient", path, "--duration", "0.1 s", "--step", "0.1 ms", "--format", "csv");
        Assert.Equal(ExitCodes.Success, ok);
        Assert.Equal(1002, output.TrimEnd('\n').Split('\n').Length);
    }
}
