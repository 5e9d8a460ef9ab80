using System.Globalization;

namespace ModalChain.Cli.Formatting;

/// <summary>A one-line progress bar on standard error, shown only when standard error is a terminal.</summary>
internal sealed class ProgressBar : IProgress<int>, IDisposable
{
    private readonly TextWriter _error;
    private readonly int _total;
    private readonly string _label;
    private readonly object _gate = new();
    private int _shown = -1;
    private bool _closed;

    private ProgressBar(TextWriter error, int total, string label)
    {
        _error = error;
        _total = total;
        _label = label;
    }

    /// <summary>A bar when the command writes to the real standard error and it is a terminal; null otherwise (pipes, files, tests).</summary>
    public static ProgressBar? ForTerminal(Streams io, int total, string label) =>
        ReferenceEquals(io.Error, Console.Error) && !Console.IsErrorRedirected ? new ProgressBar(io.Error, total, label) : null;

    public void Report(int value)
    {
        lock (_gate)
        {
            if (_closed) return;
            var percent = (int)(100L * value / Math.Max(1, _total));
            if (percent == _shown) return;
            _shown = percent;
            var filled = percent * 30 / 100;
            _error.Write(string.Create(CultureInfo.InvariantCulture,
                $"\r{_label} [{new string('#', filled)}{new string('.', 30 - filled)}] {value}/{_total}"));
        }
    }

    public void Dispose()
    {
        lock (_gate)
        {
            if (_closed) return;
            _closed = true;
            if (_shown >= 0) _error.Write("\r" + new string(' ', _label.Length + 50) + "\r");
        }
    }
}
