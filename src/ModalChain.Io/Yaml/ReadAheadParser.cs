using System.Collections.Concurrent;
using System.Runtime.ExceptionServices;
using YamlDotNet.Core;
using YamlDotNet.Core.Events;

namespace ModalChain.Io.Yaml;

/// <summary>Runs YamlDotNet's parser on a thread of its own, a few thousand events ahead of the reader that consumes them.</summary>
/// <remarks>
/// On a large model the scanner and parser take about as long as building the tree from their events; on two cores
/// the two overlap. The reader sees exactly the events, and the exception, that the parser itself would give, in the
/// same order: an exception is handed over in place of the event the parser failed to produce.
/// <para>
/// The thread stops reading as soon as the nesting passes <see cref="YamlTree.MaximumDepth"/> (the reader refuses the
/// file at that event, and a hostile file must not be scanned further) and when the reader is disposed early.
/// </para>
/// </remarks>
internal sealed class ReadAheadParser : IParser, IDisposable
{
    private const int BatchSize = 2048;

    private readonly BlockingCollection<Batch> _batches = new(boundedCapacity: 4);
    private readonly CancellationTokenSource _stop = new();
    private readonly Thread _thread;
    private Batch? _batch;
    private int _next;
    private bool _ended;

    /// <summary>Events as the parser produced them; <see cref="Failure"/> or the end follows the last one.</summary>
    private sealed record Batch(ParsingEvent[] Events, int Count, ExceptionDispatchInfo? Failure, bool Last);

    public ReadAheadParser(IParser inner)
    {
        _thread = new Thread(() => Produce(inner, _stop.Token)) { IsBackground = true, Name = "YAML read-ahead" };
        _thread.Start();
    }

    public ParsingEvent? Current { get; private set; }

    public bool MoveNext()
    {
        while (true)
        {
            if (_ended)
            {
                Current = null;
                return false;
            }
            if (_batch is { } b)
            {
                if (_next < b.Count)
                {
                    Current = b.Events[_next++];
                    return true;
                }
                _batch = null;
                if (b.Failure is { } failure)
                {
                    _ended = true;
                    Current = null;
                    failure.Throw();
                }
                if (b.Last)
                {
                    _ended = true;
                    continue;
                }
            }
            (_batch, _next) = (_batches.Take(), 0);
        }
    }

    private void Produce(IParser inner, CancellationToken stop)
    {
        try
        {
            var depth = 0;
            while (true)
            {
                var events = new ParsingEvent[BatchSize];
                var count = 0;
                ExceptionDispatchInfo? failure = null;
                var last = false;
                try
                {
                    while (count < BatchSize)
                    {
                        if (!inner.MoveNext() || inner.Current is not { } e)
                        {
                            last = true;
                            break;
                        }
                        events[count++] = e;
                        if (e is MappingStart or SequenceStart) depth++;
                        else if (e is MappingEnd or SequenceEnd && depth > 0) depth--;
                        if (depth > YamlTree.MaximumDepth)
                        {
                            last = true; // the reader refuses the file at this event
                            break;
                        }
                    }
                }
                catch (Exception e)
                {
                    failure = ExceptionDispatchInfo.Capture(e);
                }
                _batches.Add(new Batch(events, count, failure, last), stop);
                if (failure is not null || last) return;
            }
        }
        catch (OperationCanceledException)
        {
            // The reader stopped early (an error, or the end of the document it wanted).
        }
    }

    /// <summary>Stops the parser thread and waits for it, whatever the reader consumed.</summary>
    public void Dispose()
    {
        _stop.Cancel();
        _thread.Join();
        _stop.Dispose();
        _batches.Dispose();
    }
}
