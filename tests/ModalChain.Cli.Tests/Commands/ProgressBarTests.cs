using ModalChain.Cli.Commands;

namespace ModalChain.Cli.Tests.Commands;

/// <summary>The transient progress bar: drawn in place, only on change, wiped at the end, never on redirected streams.</summary>
public class ProgressBarTests
{
    [Fact]
    public void Bar_RedrawsOnlyWhenThePercentChanges_AndClearsItsLine()
    {
        var error = new StringWriter();
        using (var bar = new ProgressBar(error))
        {
            bar.Report(0.0);
            bar.Report(0.001);
            bar.Report(0.5);
            bar.Report(1.0);
        }
        var text = error.ToString();
        Assert.Equal(5, text.Count(c => c == '\r'));   // 0 %, 50 %, 100 %, and the wipe: \r, blanks, \r
        Assert.Contains("[###############...............]  50 %", text);
        Assert.EndsWith("\r", text);
    }

    [Fact]
    public void Bar_IsNotShownForWritersThatAreNotTheConsole()
    {
        Assert.False(ProgressBar.CanShow(new Streams(new StringWriter(), new StringWriter())));
    }
}
