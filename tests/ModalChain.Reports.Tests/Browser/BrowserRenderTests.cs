using Microsoft.Playwright;
using ModalChain.Reports.Writing;
using SkiaSharp;

namespace ModalChain.Reports.Tests.Browser;

/// <summary>report.html opened in a real browser (Chromium or Chrome, headless, through Playwright): it renders, offline.</summary>
/// <remarks>
/// The browser is found by <see cref="SystemBrowser"/> (MODALCHAIN_BROWSER, then the usual names on PATH); Playwright
/// never downloads one (PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD=1 and an explicit ExecutablePath). Without a browser the test
/// is skipped with the reason on a developer's machine, and fails under CI=true, where .ci/run installs chromium.
/// </remarks>
public sealed class BrowserRenderTests
{
    private static readonly string[] Arguments =
        ["--headless", "--no-sandbox", "--disable-gpu", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];

    [BrowserFact]
    public async Task Report_RendersInHeadlessChromium_WithOneFigurePerModeAndNoNetwork()
    {
        // Under CI the fact is never skipped, so a missing browser fails here instead of passing unseen.
        var chromium = SystemBrowser.Find() ?? throw new Xunit.Sdk.XunitException(SystemBrowser.Missing());
        Environment.SetEnvironmentVariable("PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD", "1");

        var document = Repository.UniformChain(4, 120, 2.0e5);
        var parent = Repository.TempDirectory();
        var dir = Path.Combine(parent, "report");
        ReportWriter.Write(ReportBuilder.Build(document, new ReportOptions("test", DateTimeOffset.UtcNow)), dir, ReportFormat.Html);

        using var playwright = await Playwright.CreateAsync();
        await using var context = await playwright.Chromium.LaunchPersistentContextAsync(Path.Combine(parent, "profile"), new BrowserTypeLaunchPersistentContextOptions
        {
            ExecutablePath = chromium,
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

/// <summary>
/// A fact that needs a browser: skipped, with the reason, when none is found, except under CI=true, where it always runs
/// (and so fails without a browser): the check is never silently lost where it matters.
/// </summary>
public sealed class BrowserFactAttribute : FactAttribute
{
    public BrowserFactAttribute()
    {
        if (!SystemBrowser.IsContinuousIntegration && SystemBrowser.Find() is null) Skip = SystemBrowser.Missing();
    }
}

/// <summary>Finds a Chromium-family browser installed on this machine; never downloads one.</summary>
public static class SystemBrowser
{
    /// <summary>Names tried on PATH, in order.</summary>
    public static readonly string[] Names =
        ["chromium", "chromium-browser", "google-chrome", "google-chrome-stable", "chrome", "microsoft-edge", "msedge"];

    /// <summary>True when the CI variable is set to true (as CI services do), where a missing browser is a failure.</summary>
    public static bool IsContinuousIntegration =>
        Environment.GetEnvironmentVariable("CI") is { } ci && (ci.Equals("true", StringComparison.OrdinalIgnoreCase) || ci == "1");

    /// <summary>The browser to use: MODALCHAIN_BROWSER when it names an existing file, else the first of <see cref="Names"/> on PATH; null when none.</summary>
    public static string? Find()
    {
        if (Environment.GetEnvironmentVariable("MODALCHAIN_BROWSER") is { Length: > 0 } chosen)
            return File.Exists(chosen) ? Path.GetFullPath(chosen) : null;
        var path = Environment.GetEnvironmentVariable("PATH") ?? "";
        var suffixes = OperatingSystem.IsWindows() ? new[] { ".exe", "" } : [""];
        foreach (var name in Names)
            foreach (var dir in path.Split(Path.PathSeparator, StringSplitOptions.RemoveEmptyEntries))
                foreach (var suffix in suffixes)
                {
                    var candidate = Path.Combine(dir, name + suffix);
                    if (File.Exists(candidate)) return candidate;
                }
        return null;
    }

    /// <summary>Why no browser was found, and how to provide one.</summary>
    public static string Missing() =>
        Environment.GetEnvironmentVariable("MODALCHAIN_BROWSER") is { Length: > 0 } chosen
            ? $"MODALCHAIN_BROWSER is '{chosen}', which does not exist: the headless-browser check of report.html was not run."
            : $"no browser found (MODALCHAIN_BROWSER is not set and none of {string.Join(", ", Names)} is on PATH): the headless-browser " +
              "check of report.html was not run. Install one (e.g. 'apt-get install -y chromium') or set MODALCHAIN_BROWSER to its path." +
              (IsContinuousIntegration ? " CI=true is set, where this check must run." : "");
}
