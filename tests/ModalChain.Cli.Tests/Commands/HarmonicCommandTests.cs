using System.Globalization;
using System.Text.Json;
using ModalChain.TestSupport;

namespace ModalChain.Cli.Tests.Commands;

/// <summary><c>modalchain harmonic</c> end to end: table, JSON and CSV on models with a harmonic section, and input errors.</summary>
public class HarmonicCommandTests
{
    private static string Root()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "ModalChain.sln"))) dir = dir.Parent;
        return dir?.FullName ?? throw new InvalidOperationException("repository root not found");
    }

    private static string ChillerDeck => Path.Combine(Root(), "models", "chiller-deck.yaml");

    private static (int Code, string Out, string Err) Run(params string[] args)
    {
        var o = new StringWriter();
        var e = new StringWriter();
        var code = CliApp.Run(args, o, e);
        return (code, o.ToString(), e.ToString());
    }

    private static string TempModel(string text)
    {
        var path = Path.Combine(Path.GetTempPath(), $"modalchain-{Guid.NewGuid():N}.yaml");
        File.WriteAllText(path, text);
        return path;
    }

    [Fact]
    public void ChillerDeck_Table_ShowsPeaksOperatingPointAndCaution()
    {
        using var culture = new CultureScope("de-DE");
        var (code, output, error) = Run("harmonic", ChillerDeck);
        Assert.Equal(0, code);
        Assert.Equal("", error);
        Assert.Contains("Peaks over the sweep", output);
        Assert.Contains("Operating point 24.6667 Hz (1480 rpm): compressor-unbalance", output);
        Assert.Contains("Caution: ", output);
        Assert.DoesNotContain("0,0", output.Replace("10,0", "")); // invariant culture in numbers
    }

    [Fact]
    public void ChillerDeck_Json_HasTheDocumentedShapeInSi()
    {
        var (code, output, _) = Run("harmonic", ChillerDeck, "--format", "json");
        Assert.Equal(0, code);
        using var json = JsonDocument.Parse(output);
        var root = json.RootElement;
        var f = root.GetProperty("frequencies_hz").EnumerateArray().Select(x => x.GetDouble()).ToArray();
        Assert.True(f.Length >= 600, "600 points plus refinement");
        Assert.True(f.Zip(f.Skip(1)).All(p => p.Second > p.First));
        var responses = root.GetProperty("responses").EnumerateArray().ToArray();
        Assert.Equal(6, responses.Length); // deck and skid × displacement, velocity, acceleration
        foreach (var r in responses)
        {
            Assert.Equal(f.Length, r.GetProperty("magnitude").GetArrayLength());
            Assert.Equal(f.Length, r.GetProperty("phase_deg").GetArrayLength());
            var unit = r.GetProperty("quantity").GetString() switch { "displacement" => "m", "velocity" => "m/s", _ => "m/s^2" };
            Assert.Equal(unit, r.GetProperty("unit").GetString());
        }
        // velocity = ω·displacement in magnitude at every point (definition; tolerance 1e-12 rel).
        var skidX = responses.Single(r => r.GetProperty("dof").GetString() == "skid" && r.GetProperty("quantity").GetString() == "displacement");
        var skidV = responses.Single(r => r.GetProperty("dof").GetString() == "skid" && r.GetProperty("quantity").GetString() == "velocity");
        for (var k = 0; k < f.Length; k += 50)
            NumericAssert.Close(2 * Math.PI * f[k] * skidX.GetProperty("magnitude")[k].GetDouble(), skidV.GetProperty("magnitude")[k].GetDouble(), Tolerance.Rel(1e-12), $"|V| at {f[k]} Hz");
        var reaction = Assert.Single(root.GetProperty("reactions").EnumerateArray());
        Assert.Equal("ground", reaction.GetProperty("support").GetString());
        Assert.Equal(6, root.GetProperty("peaks").GetArrayLength());
        var op = Assert.Single(root.GetProperty("operating_points").EnumerateArray());
        NumericAssert.Close(1480, op.GetProperty("speed_rpm").GetDouble(), Tolerance.Rel(1e-12), "speed");
        Assert.Contains("licensed engineer", root.GetProperty("caution").GetString());
    }

    [Fact]
    public void SingleMassModel_Json_MatchesClosedFormAmplification()
    {
        // D = 1/√((1−r²)² + (2ζr)²) at ζ = 0.05, r = 0.5 and 2: 1.330380 and 0.332595; TR = 1.332042 and 0.339182
        // (REFERENCES.md §4, standard SDOF results [attribution from memory]). Tolerance 1e-6 abs on D and TR.
        const double m = 250, k = 4e6, zeta = 0.05;
        var fn = Math.Sqrt(k / m) / (2 * Math.PI);
        var inv = CultureInfo.InvariantCulture;
        var c = 2 * zeta * Math.Sqrt(k * m);
        var path = TempModel(string.Create(inv, $$"""
            masses:
              m: {mass: {{m}} kg}
            springs:
              k: {between: [ground, m], stiffness: {{k}} N/m}
            dampers:
              c: {between: [ground, m], coefficient: {{c:R}} N*s/m}
            loads:
              push: {kind: force, at: m, amplitude: 1 kN, phase: 0 deg}
            harmonic:
              frequencies: [{{0.5 * fn:R}} Hz, {{2 * fn:R}} Hz]
            """));
        try
        {
            var (code, output, error) = Run("harmonic", path, "--format", "json");
            Assert.True(code == 0, error);
            var root = JsonDocument.Parse(output).RootElement;
            var x = root.GetProperty("responses")[0].GetProperty("magnitude");
            NumericAssert.Close(1.330380, x[0].GetDouble() * k / 1000, Tolerance.Abs(1e-6), "D(0.5)");
            NumericAssert.Close(0.332595, x[1].GetDouble() * k / 1000, Tolerance.Abs(1e-6), "D(2)");
            var tr = root.GetProperty("transmissibility")[0].GetProperty("ratio");
            NumericAssert.Close(1.332042, tr[0].GetDouble(), Tolerance.Abs(1e-6), "TR(0.5)");
            NumericAssert.Close(0.339182, tr[1].GetDouble(), Tolerance.Abs(1e-6), "TR(2)");
            var modal = JsonDocument.Parse(Run("harmonic", path, "--format", "json", "--method", "modal").Out).RootElement;
            NumericAssert.Close(x[1].GetDouble(), modal.GetProperty("responses")[0].GetProperty("magnitude")[1].GetDouble(), Tolerance.Rel(1e-9), "modal = direct");
        }
        finally { File.Delete(path); }
    }

    [Fact]
    public void ChillerDeck_Csv_HasOneRowPerFrequencyAndUnitsInTheHeader()
    {
        var (code, output, _) = Run("harmonic", ChillerDeck, "--format", "csv", "--output", "skid", "--from", "10", "--to", "40", "--points", "31");
        Assert.Equal(0, code);
        var lines = output.TrimEnd('\n').Split('\n');
        var header = lines[0].Split(',');
        Assert.Equal("frequency [Hz]", header[0]);
        Assert.Contains("skid displacement magnitude [m]", header);
        Assert.Contains("skid acceleration phase [deg]", header);
        Assert.Contains("reaction ground magnitude [N]", header);
        Assert.DoesNotContain(header, h => h.StartsWith("deck ", StringComparison.Ordinal));
        Assert.True(lines.Length - 1 >= 31, "31 points plus refinement");
        Assert.All(lines.Skip(1), l => Assert.Equal(header.Length, l.Split(',').Length));
        NumericAssert.Close(10, double.Parse(lines[1].Split(',')[0], CultureInfo.InvariantCulture), Tolerance.Rel(1e-12), "first frequency");
    }

    [Fact]
    public void BadLoad_IsReportedWithLineAndColumn_ExitTwo()
    {
        var path = TempModel("masses:\n  deck: {mass: 100 kg}\nsprings:\n  s: {between: [ground, deck], stiffness: 1 kN/mm}\nloads:\n  f: {kind: force, at: dek, amplitude: 1 N}\nharmonic:\n  frequencies: {from: 5 Hz, to: 5 Hz}\n");
        try
        {
            var (code, _, error) = Run("harmonic", path);
            Assert.Equal(2, code);
            Assert.Contains($"{path}:6:24: error: load 'f' acts at unknown mass 'dek'", error);
            Assert.Contains($"{path}:8:33: error: 'to' of 'frequencies' of 'harmonic'", error);
        }
        finally { File.Delete(path); }
    }

    private const string BadInputBase = "masses:\n  deck: {mass: 100 kg}\nsupports:\n  plinth:\nsprings:\n  s: {between: [plinth, deck], stiffness: 1 kN/mm}\n";

    [Theory]
    [InlineData("loads:\n  f: {kind: force, at: dek, amplitude: 1 N}\nharmonic:\n  frequencies: [5 Hz]\n", 8, "dek", "unknown mass 'dek'")]
    [InlineData("loads:\n  q: {kind: base-motion, support: ground, acceleration: 0.1 g}\nharmonic:\n  frequencies: [5 Hz]\n", 8, "ground", "moves 'ground', which is fixed")]
    [InlineData("loads:\n  f: {kind: force, at: deck, amplitude: 1 N}\nharmonic:\n  frequencies: {from: 9 Hz, to: 3 Hz}\n", 10, "3 Hz", "must be above 'from'")]
    [InlineData("loads:\n  f: {kind: force, at: deck, amplitude: 1 N}\nharmonic:\n  frequencies: {from: 1 Hz, to: 3 Hz, points: 0}\n", 10, "0}", "'points'")]
    [InlineData("damping:\n  modal: -2 %\nloads:\n  f: {kind: force, at: deck, amplitude: 1 N}\nharmonic:\n  frequencies: [5 Hz]\n", 8, "-2 %", "cannot be negative")]
    public void BadHarmonicInput_IsOneClearErrorAtItsPosition_ExitTwo(string tail, int line, string token, string message)
    {
        var text = BadInputBase + tail;
        var path = TempModel(text);
        try
        {
            var (code, output, error) = Run("harmonic", path);
            Assert.Equal(2, code);
            Assert.Equal("", output);
            var column = text.Split('\n')[line - 1].IndexOf(token, StringComparison.Ordinal) + 1;
            Assert.True(column > 0, $"'{token}' is on line {line}");
            var first = error.Split('\n')[0];
            Assert.StartsWith($"{path}:{line}:{column}: error: ", first);
            Assert.Contains(message, first);
        }
        finally { File.Delete(path); }
    }

    [Fact]
    public void CommandLineSweepErrors_ExitTwo()
    {
        Assert.Equal(2, Run("harmonic", ChillerDeck, "--from", "30", "--to", "10").Code);
        Assert.Equal(2, Run("harmonic", ChillerDeck, "--points", "1").Code);
        Assert.Equal(2, Run("harmonic", ChillerDeck, "--output", "roof").Code);
        var path = TempModel("masses:\n  deck: {mass: 100 kg}\nsprings:\n  s: {between: [ground, deck], stiffness: 1 kN/mm}\nloads:\n  f: {kind: force, at: deck, amplitude: 1 N}\n");
        try
        {
            var (code, _, error) = Run("harmonic", path);
            Assert.Equal(2, code);
            Assert.Contains("no 'harmonic' section", error);
            Assert.Equal(0, Run("harmonic", path, "--from", "1", "--to", "10").Code);
        }
        finally { File.Delete(path); }
    }

    [Fact]
    public void Modes_Json_ReportsDampingRatioAndComplexModes()
    {
        var (code, output, _) = Run("modes", ChillerDeck, "--format", "json");
        Assert.Equal(0, code);
        var root = JsonDocument.Parse(output).RootElement;
        foreach (var mode in root.GetProperty("modes").EnumerateArray())
        {
            var zeta = mode.GetProperty("damping_ratio").GetDouble();
            Assert.InRange(zeta, 0.02, 0.05); // 2 % modal plus the mounts' damper
        }
        Assert.False(root.GetProperty("damping").GetProperty("classical").GetBoolean());
        var complex = root.GetProperty("complex_modes").EnumerateArray().ToArray();
        Assert.Equal(2, complex.Length);
        Assert.All(complex, c => Assert.True(c.GetProperty("damped_frequency_hz").GetDouble() < c.GetProperty("undamped_frequency_hz").GetDouble()));
    }
}
