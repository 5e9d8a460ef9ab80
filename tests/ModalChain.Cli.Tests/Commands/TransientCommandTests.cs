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

    private const string OneMassWithCases = """
        title: one mass with load cases
        masses:
          m: 100 kg
        springs:
          k: {between: [ground, m], stiffness: 98696 N/m}
        damping:
          modal: 20 %
        loads:
          push: {kind: force, at: m, amplitude: 1 kN, phase: 30 deg, speed: 7 Hz}
          idle: {kind: force, at: m, amplitude: 1 kN}
          drop: {kind: force, at: m, time: {kind: step, value: 2 kN, at: 0.1 s}}
        load-cases:
          run: [push]
          still: [idle]
        transient:
          duration: 1 s
          step: 1 ms
          loads: [drop]
        """;

    [Fact]
    public void Cases_RunTheCaseLoadsAsTheirSteadySinusoid_ReachingTheHarmonicSteadyState()
    {
        // A single degree of freedom (m = 100 kg, k = 98 696 N/m, so f_n ≈ 5 Hz; ζ = 20 %) under F cos(Ωt + φ), F = 1 kN,
        // φ = 30°, Ω = 2π·7 Hz, switched on at t = 0 from rest. The start-up transient decays as e^{−ζω_n t} (≈ e^{−25} by
        // 4 s), leaving the closed-form steady state x(t) = Re(X e^{iΩt}), X = F e^{iφ}/(k − mΩ² + icΩ), c = 2ζ√(km)
        // (REFERENCES §4, common practice). Tolerance 1e-4 of |X|: the exact method holds the load linear over a step,
        // an error of about (Ωh)²/12 ≈ 1e-5 with h = 0.25 ms.
        var path = Model("one-mass-cases.yaml", OneMassWithCases);
        var (code, output, error) = Run("transient", path, "--cases", "run", "--duration", "4 s", "--step", "0.25 ms", "--method", "exact", "--format", "json");
        Assert.True(code == ExitCodes.Success, error);
        using var json = JsonDocument.Parse(output);
        var root = json.RootElement;
        Assert.Equal(["push"], root.GetProperty("loads").EnumerateArray().Select(e => e.GetString()!).ToArray());
        var times = root.GetProperty("time_s").EnumerateArray().Select(e => e.GetDouble()).ToArray();
        var x = root.GetProperty("responses").EnumerateArray()
            .Single(r => r.GetProperty("dof").GetString() == "m" && r.GetProperty("quantity").GetString() == "displacement")
            .GetProperty("values").EnumerateArray().Select(e => e.GetDouble()).ToArray();
        const double m = 100, k = 98696, zeta = 0.2, f = 1000, phi = Math.PI / 6;
        var omega = 2 * Math.PI * 7;
        var c = 2 * zeta * Math.Sqrt(k * m);
        var steady = System.Numerics.Complex.FromPolarCoordinates(f, phi) / new System.Numerics.Complex(k - m * omega * omega, c * omega);
        var checkedSamples = 0;
        for (var i = 0; i < times.Length; i++)
        {
            if (times[i] < 3.5) continue;
            var expected = (steady * System.Numerics.Complex.FromPolarCoordinates(1, omega * times[i])).Real;
            NumericAssert.Close(expected, x[i], Tolerance.Abs(1e-4 * steady.Magnitude), $"x at t = {times[i]} s");
            checkedSamples++;
        }
        Assert.True(checkedSamples > 400, $"{checkedSamples} samples checked");
    }

    [Fact]
    public void Cases_ReplaceTheFileLoads_AndAddToLoadsGivenOnTheCommandLine()
    {
        var path = Model("one-mass-cases.yaml", OneMassWithCases);
        var alone = Run("transient", path, "--cases", "run", "--format", "json");
        Assert.True(alone.Code == ExitCodes.Success, alone.Err);
        using (var json = JsonDocument.Parse(alone.Out))
            Assert.Equal(["push"], json.RootElement.GetProperty("loads").EnumerateArray().Select(e => e.GetString()!).ToArray());
        var both = Run("transient", path, "--cases", "run", "--loads", "drop", "--format", "json");
        Assert.True(both.Code == ExitCodes.Success, both.Err);
        using (var json = JsonDocument.Parse(both.Out))
            Assert.Equal(["drop", "push"], json.RootElement.GetProperty("loads").EnumerateArray().Select(e => e.GetString()!).ToArray());
    }

    [Theory]
    [InlineData("nope", "--cases names 'nope', which is not a load case of the model; the load cases are: run, still")]
    [InlineData("still", "--cases: load 'idle' has no running speed")]
    public void Cases_UnknownOrWithoutASpeed_IsAnInputError(string name, string message)
    {
        var path = Model("one-mass-cases.yaml", OneMassWithCases);
        var (code, output, error) = Run("transient", path, "--cases", name);
        Assert.Equal(ExitCodes.InputError, code);
        Assert.Equal("", output);
        Assert.Contains(message, error, StringComparison.Ordinal);
    }

    [Fact]
    public void Cases_OnAModelWithoutLoadCases_IsAnInputError()
    {
        var (code, _, error) = Run("transient", Example, "--cases", "anything");
        Assert.Equal(ExitCodes.InputError, code);
        Assert.Contains("has no 'load-cases' section", error, StringComparison.Ordinal);
    }
}
