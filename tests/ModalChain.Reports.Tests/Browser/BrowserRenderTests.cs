using Microsoft.Playwright;
using ModalChain.Reports.Writing;
using SkiaSharp;

namespace ModalChain.Reports.Tests.Browser;

/// <summary>report.html opened in a real browser (Debian's chromium, headless, through Playwright): it renders, offline.</summary>
/// <remarks>
/// The browser is the system's /usr/bin/chromium; Playwright never downloads one (PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD=1 and
/// an explicit ExecutablePath). When chromium is missing the test fails with the command that installs it, unless
/// MODALCHAIN_SKIP_BROWSER=1 is set, in which case it is reported as skipped with that reason.
/// </remarks>
public sealed class BrowserRenderTests
{
    private const string Chromium = "/usr/bin/chromium";

    private static readonly string[] Arguments =
        ["--headless", "--no-sandbox", "--disable-gpu", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];

    [BrowserFact]
    public async Task Report_RendersInHeadlessChromium_WithOneFigurePerModeAndNoNetwork()
    {
        Assert.True(File.Exists(Chromium), $"{Chromium} not found: install it with 'apt-get install -y chromium' (or set MODALCHAIN_SKIP_BROWSER=1 to skip this test).");
        Environment.SetEnvironmentVariable("PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD", "1");

        var document = Repository.UniformChain(4, 120, 2.0e5);
        var parent = Repository.TempDirectory();
        var dir = Path.Combine(parent, "report");
        ReportWriter.Write(ReportBuilder.Build(document, new ReportOptions("test", DateTimeOffset.UtcNow)), dir, ReportFormat.Html);

        using var playwright = await Playwright.CreateAsync();
        await using var context = await playwright.Chromium.LaunchPersistentContextAsync(Path.Combine(parent, "profile"), new BrowserTypeLaunchPersistentContextOptions
        {
            ExecutablePath = Chromium,
            Headless = true,
            Args = Arguments,
            ViewportSize = new ViewportSize { Width = 900, Height = 1200 },
        });
        var page = context.Pages.Count > 0 ? context.Pages[0] : await context.NewPageAsync();
        var foreign = new List<string>();
        page.Request += (_, request) =>
        {
            if (!request.Url.StartsWith("file:", StringComparison.Ordinal) && !request.Url.StartsWith("data:", StringComparison.Ordinal)) foreign.Add(request.Url);
        };
        await page.GotoAsync(new Uri(Path.Combine(dir, "report.html")).AbsoluteUri, new PageGotoOptions { WaitUntil = WaitUntilState.Load });

        Assert.Equal(4, await page.Locator("figure.mode-figure").CountAsync());
        Assert.Equal(4, await page.Locator("figure.mode-figure .figure-body svg").CountAsync());
        Assert.True(await page.Locator("figure.network-figure svg").IsVisibleAsync(), "the network drawing is not visible");
        var svgHeight = await page.Locator("#fig-mode-01 .figure-body svg").EvaluateAsync<double>("e => e.getBoundingClientRect().height");
        Assert.True(svgHeight > 100, $"the first mode figure is only {svgHeight} px tall");
        Assert.Empty(foreign);

        var png = await page.ScreenshotAsync(new PageScreenshotOptions { FullPage = false });
        using var bitmap = SKBitmap.Decode(png);
        var (ink, colours) = Ink(bitmap);
        Assert.True(ink > 0.02, $"the screenshot is nearly blank: {ink:P2} of the pixels differ from the background");
        Assert.True(colours > 8, $"the screenshot has only {colours} distinct colours");

        // Printing: both common paper sizes produce a multi-page PDF.
        foreach (var paper in new[] { "A4", "Letter" })
        {
            var pdf = await page.PdfAsync(new PagePdfOptions { Format = paper, PrintBackground = true });
            var text = System.Text.Encoding.Latin1.GetString(pdf);
            Assert.StartsWith("%PDF-", text, StringComparison.Ordinal);
            var pages = System.Text.RegularExpressions.Regex.Matches(text, @"/Type\s*/Page[^s]").Count;
            Assert.True(pages >= 2, $"{paper}: the printed report has {pages} page(s)");
        }
    }

    /// <summary>The fraction of pixels that are not the page background, and the number of distinct colours (coarsely binned).</summary>
    private static (double Ink, int Colours) Ink(SKBitmap bitmap)
    {
        var background = bitmap.GetPixel(0, 0);
        var different = 0;
        var colours = new HashSet<int>();
        for (var y = 0; y < bitmap.Height; y += 2)
            for (var x = 0; x < bitmap.Width; x += 2)
            {
                var p = bitmap.GetPixel(x, y);
                if (Math.Abs(p.Red - background.Red) + Math.Abs(p.Green - background.Green) + Math.Abs(p.Blue - background.Blue) > 30) different++;
                colours.Add((p.Red >> 4) << 8 | (p.Green >> 4) << 4 | p.Blue >> 4);
            }
        return (different / (bitmap.Width * bitmap.Height / 4.0), colours.Count);
    }
}

/// <summary>A fact that is skipped, with its reason, only when MODALCHAIN_SKIP_BROWSER=1 is set; otherwise it runs and a missing browser fails it.</summary>
public sealed class BrowserFactAttribute : FactAttribute
{
    public BrowserFactAttribute()
    {
        if (Environment.GetEnvironmentVariable("MODALCHAIN_SKIP_BROWSER") == "1")
            Skip = "MODALCHAIN_SKIP_BROWSER=1 is set: the headless-browser check of report.html was not run.";
    }
}
