using System.Globalization;
using System.Text;
using BenchmarkDotNet.Attributes;
using ModalChain.Io.Model;
using ModalChain.Reports;
using ModalChain.Reports.Writing;

namespace ModalChain.Benchmarks;

/// <summary>The whole report of a seeded 200-mass chain: analyses, figures, HTML, JSON, and the atomic write to disk.</summary>
/// <remarks>
/// The second case is the issue's target: a 2,000-point harmonic sweep (direct method, four outputs charted) and a
/// 20,000-step Newmark transient (two outputs) on top of the modes.
/// </remarks>
[MemoryDiagnoser]
public class ReportBenchmarks
{
    private ModelDocument _modesOnly = null!;
    private ModelDocument _withSweep = null!;
    private string _directory = null!;
    private readonly ReportOptions _options = new("benchmark", DateTimeOffset.UnixEpoch, MaxModes: 20);

    [GlobalSetup]
    public void Setup()
    {
        _modesOnly = Read(Chain(200, sweep: false));
        _withSweep = Read(Chain(200, sweep: true));
        _directory = Path.Combine(Path.GetTempPath(), "modalchain-report-benchmark", Guid.NewGuid().ToString("N"));
    }

    [GlobalCleanup]
    public void Cleanup()
    {
        if (Directory.Exists(_directory)) Directory.Delete(_directory, recursive: true);
    }

    [Benchmark]
    public int Modes200Masses20Modes() => Write(_modesOnly);

    [Benchmark]
    public int Modes200Masses20ModesSweep2000Transient20000() => Write(_withSweep);

    private int Write(ModelDocument document) =>
        ReportWriter.Write(ReportBuilder.Build(document, _options), _directory, ReportFormat.Html).Length;

    private static ModelDocument Read(string yaml) =>
        ModelReader.Read(yaml, "benchmark.yaml").Model ?? throw new InvalidOperationException("benchmark model has errors");

    /// <summary>A fixed-free chain of n masses with a seeded ±30 % spread of masses and stiffnesses, as YAML.</summary>
    public static string Chain(int n, bool sweep, int seed = 3)
    {
        var random = new Random(seed);
        var inv = CultureInfo.InvariantCulture;
        var yaml = new StringBuilder($"title: benchmark chain of {n}\nmasses:\n");
        for (var i = 0; i < n; i++) yaml.Append(inv, $"  m{i}: {100 * (0.7 + 0.6 * random.NextDouble()):F3} kg\n");
        yaml.Append("springs:\n");
        for (var i = 0; i < n; i++)
            yaml.Append(inv, $"  s{i}: {{between: [{(i == 0 ? "ground" : "m" + (i - 1))}, m{i}], stiffness: {1e6 * (0.7 + 0.6 * random.NextDouble()):F1} N/m}}\n");
        if (sweep)
        {
            yaml.Append("damping: {modal: 2 %}\n");
            yaml.Append(inv, $"loads:\n  rotor: {{kind: unbalance, at: m{n - 1}, mass-radius: 5 g*m, speed: 1480 rpm}}\n");
            yaml.Append(inv, $"  bump: {{kind: force, at: m{n - 1}, time: {{kind: half-sine, amplitude: 5 kN, duration: 20 ms, start: 0 s}}}}\n");
            yaml.Append(inv, $"harmonic:\n  loads: [rotor]\n  frequencies: {{from: 0.5 Hz, to: 60 Hz, points: 2000, spacing: linear}}\n  refine: false\n  outputs: [m0, m{n / 3}, m{2 * n / 3}, m{n - 1}]\n  method: direct\n");
            // 20,000 steps of Newmark's method, as in the issue's performance target.
            yaml.Append(inv, $"transient:\n  duration: 2 s\n  step: 0.1 ms\n  method: newmark\n  loads: [bump]\n  outputs: [m0, m{n - 1}]\n");
        }
        return yaml.ToString();
    }
}
