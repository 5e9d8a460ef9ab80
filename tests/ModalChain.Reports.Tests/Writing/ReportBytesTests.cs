using System.Xml;
using ModalChain.Reports.Writing;
using ModalChain.TestSupport;

namespace ModalChain.Reports.Tests.Writing;

/// <summary>The files of a report as bytes: strict XML from the bytes on disk, and the same bytes whatever the machine's language.</summary>
public sealed class ReportBytesTests
{
    private static readonly ReportOptions Options = new("test", new DateTimeOffset(2026, 12, 1, 12, 0, 0, TimeSpan.Zero));

    public static IEnumerable<object[]> Models() => Repository.ModelFiles();

    private static string WriteReport(string model, ReportFormat format)
    {
        var dir = Path.Combine(Repository.TempDirectory(), "report");
        ReportWriter.Write(ReportBuilder.Build(Repository.Load(model), Options), dir, format);
        return dir;
    }

    [Theory]
    [MemberData(nameof(Models))]
    public void EverySvgFile_ParsesWithAStrictXmlReaderFromItsBytes(string model)
    {
        // XML 1.0 §4.3.3 (W3C): a document without a byte-order mark whose declaration names UTF-16 is an error for a
        // conforming parser; XmlReader reads the file's bytes as a strict parser would, with no string in between.
        var dir = WriteReport(model, ReportFormat.Html);
        var svgs = Directory.GetFiles(dir, "*.svg");
        Assert.NotEmpty(svgs);
        foreach (var svg in svgs)
        {
            using var stream = File.OpenRead(svg);
            using var reader = XmlReader.Create(stream, new XmlReaderSettings { DtdProcessing = DtdProcessing.Prohibit });
            while (reader.Read())
                if (reader.NodeType == XmlNodeType.XmlDeclaration)
                    Assert.Equal("utf-8", reader.GetAttribute("encoding"), ignoreCase: true);
            Assert.False(File.ReadAllBytes(svg) is [0xEF, 0xBB, 0xBF, ..], $"{Path.GetFileName(svg)} starts with a byte-order mark");
        }
    }

    [Theory]
    [MemberData(nameof(Models))]
    public void EveryFile_IsByteIdenticalUnderADecimalCommaCulture(string model)
    {
        // Invariant formatting (common practice): the same model gives the same bytes on any machine.
        var invariant = WriteReport(model, ReportFormat.Html);
        string german;
        using (new CultureScope("de-DE")) german = WriteReport(model, ReportFormat.Html);
        AssertSameFolders(invariant, german);
    }

    [Fact]
    public void ChartPdf_IsByteIdenticalUnderADecimalCommaCulture()
    {
        // The PDF of a chart with decimal tick labels (a logarithmic amplitude axis: 0.0001 ... 0.1) is drawn from the same
        // plot as the SVG; rendered under both cultures it must give the same bytes (one figure keeps the test fast).
        var report = ReportBuilder.Build(Repository.Load("models/chiller-deck.yaml"), Options);
        var chart = report.Figures.OfType<Figures.ChartFigure>().First(f => f.Name.StartsWith("harmonic-", StringComparison.Ordinal));
        Assert.Contains(">0.0001<", chart.Svg(standalone: true), StringComparison.Ordinal);
        byte[] Pdf()
        {
            using var buffer = new MemoryStream();
            chart.WritePdf(buffer);
            return buffer.ToArray();
        }
        var invariant = Pdf();
        byte[] german;
        using (new CultureScope("de-DE")) german = Pdf();
        Assert.Equal(invariant, german);
    }

    /// <summary>Both folders hold the same file names with the same bytes; the first differing file and offset on failure.</summary>
    internal static void AssertSameFolders(string expected, string actual)
    {
        static string[] Names(string dir) => [.. Directory.GetFiles(dir).Select(Path.GetFileName).Order(StringComparer.Ordinal)!];
        Assert.Equal(Names(expected), Names(actual));
        foreach (var name in Names(expected))
        {
            var a = File.ReadAllBytes(Path.Combine(expected, name));
            var b = File.ReadAllBytes(Path.Combine(actual, name));
            var at = a.AsSpan().CommonPrefixLength(b);
            if (at < a.Length || at < b.Length)
            {
                string Around(byte[] bytes) => System.Text.Encoding.UTF8.GetString(bytes, Math.Max(0, at - 40), Math.Min(80, bytes.Length - Math.Max(0, at - 40)));
                Assert.Fail($"{name} differs at byte {at}:\n  expected …{Around(a)}…\n  actual   …{Around(b)}…");
            }
        }
    }
}
