using System.Diagnostics;
using System.Globalization;

namespace ModalChain.Cli;

/// <summary>Wall-clock and processor time of a command's stages, printed to stderr when MODALCHAIN_STAGE_TIMES=1 (for benchmarks).</summary>
/// <remarks>Processor time is the whole process's (every thread, the runtime's included): on a shared machine it is the steadier figure.</remarks>
internal sealed class StageTimes(Streams io)
{
    private readonly Stopwatch _clock = Stopwatch.StartNew();
    private readonly List<(string Stage, double Seconds, double Processor)> _stages = [];
    private double _last;
    private double _lastProcessor = ProcessorSeconds();

    private static double ProcessorSeconds()
    {
        using var self = Process.GetCurrentProcess();
        return self.TotalProcessorTime.TotalSeconds;
    }

    /// <summary>A recorder when the environment asks for stage times, otherwise null.</summary>
    public static StageTimes? FromEnvironment(Streams io) =>
        Environment.GetEnvironmentVariable("MODALCHAIN_STAGE_TIMES") == "1" ? new StageTimes(io) : null;

    /// <summary>Ends the stage called <paramref name="stage"/> now.</summary>
    public void Mark(string stage)
    {
        var now = _clock.Elapsed.TotalSeconds;
        var processor = ProcessorSeconds();
        _stages.Add((stage, now - _last, processor - _lastProcessor));
        _last = now;
        _lastProcessor = processor;
    }

    /// <summary>Prints one line per stage to stderr.</summary>
    public void Report()
    {
        foreach (var (stage, seconds, processor) in _stages)
            io.Error.WriteLine(string.Create(CultureInfo.InvariantCulture, $"stage: {stage}: {seconds:F3} s (processor {processor:F3} s)"));
    }
}
