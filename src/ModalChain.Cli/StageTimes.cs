using System.Diagnostics;
using System.Globalization;

namespace ModalChain.Cli;

/// <summary>Wall-clock time of a command's stages, printed to stderr when MODALCHAIN_STAGE_TIMES=1 (for benchmarks).</summary>
internal sealed class StageTimes(Streams io)
{
    private readonly Stopwatch _clock = Stopwatch.StartNew();
    private readonly List<(string Stage, double Seconds)> _stages = [];
    private double _last;

    /// <summary>A recorder when the environment asks for stage times, otherwise null.</summary>
    public static StageTimes? FromEnvironment(Streams io) =>
        Environment.GetEnvironmentVariable("MODALCHAIN_STAGE_TIMES") == "1" ? new StageTimes(io) : null;

    /// <summary>Ends the stage called <paramref name="stage"/> now.</summary>
    public void Mark(string stage)
    {
        var now = _clock.Elapsed.TotalSeconds;
        _stages.Add((stage, now - _last));
        _last = now;
    }

    /// <summary>Prints one line per stage to stderr.</summary>
    public void Report()
    {
        foreach (var (stage, seconds) in _stages)
            io.Error.WriteLine(string.Create(CultureInfo.InvariantCulture, $"stage: {stage}: {seconds:F3} s"));
    }
}
