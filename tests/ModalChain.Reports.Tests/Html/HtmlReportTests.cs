using System.Text.RegularExpressions;
using System.Xml.Linq;
using ModalChain.Reports.Units;

namespace ModalChain.Reports.Tests.Html;

/// <summary>The HTML frame: traceability, caution, print rules, units and escaping.</summary>
public sealed class HtmlReportTests
{
    private static readonly DateTimeOffset Date = new(2026, 12, 1, 18, 30, 0, TimeSpan.Zero);

    [Fact]
    public void Header_TracesTheInputAndTheRun()
    {
        var document = Repository.UniformChain(2, 1, 100);
        var report = ReportBuilder.Build(document, new ReportOptions("9.8.7", Date));
        Assert.Contains("uniform-chain.yaml", report.Html, StringComparison.Ordinal);
        Assert.Contains(document.Sha256, report.Html, StringComparison.Ordinal);
        Assert.Contains("ModalChain 9.8.7", report.Html, StringComparison.Ordinal);
        Assert.Contains("2026-12-01 18:30 UTC", report.Html, StringComparison.Ordinal);
    }

    [Fact]
    public void Css_HasPrintRulesThatFitA4AndLetter()
    {
        var html = ReportBuilder.Build(Repository.UniformChain(2, 1, 100), new ReportOptions("t", Date)).Html;
        Assert.Contains("@page", html, StringComparison.Ordinal);
        Assert.Contains("@media print", html, StringComparison.Ordinal);
        // No fixed page size: the print dialogue's paper (A4 or Letter) is used; the body is narrower than A4's printable width.
        Assert.DoesNotMatch(@"@page\s*\{[^}]*size:\s*(A4|letter)", html);
    }

    [Fact]
    public void InlineSvgs_HaveUniqueIdsAcrossTheWholePage()
    {
        var html = ReportBuilder.Build(Repository.UniformChain(3, 1, 100), new ReportOptions("t", Date)).Html;
        var ids = Regex.Matches(html, "\\bid=\"([^\"]+)\"").Select(m => m.Groups[1].Value).ToArray();
        Assert.Equal(ids.Length, ids.Distinct(StringComparer.Ordinal).Count());
    }

    [Fact]
    public void NamesFromTheModel_AreEscaped()
    {
        var document = Repository.Parse("""
            title: "Deck <b>& skid</b>"
            masses: {deck: 10 kg}
            springs: {s: {between: [ground, deck], stiffness: 1 kN/m}}
            """);
        var report = ReportBuilder.Build(document, new ReportOptions("t", Date));
        Assert.DoesNotContain("<b>& skid</b>", report.Html, StringComparison.Ordinal);
        Assert.Contains("Deck &lt;b&gt;&amp; skid&lt;/b&gt;", report.Html, StringComparison.Ordinal);
        foreach (var figure in report.Figures) XDocument.Parse(figure.Svg(true));
    }

    [Fact]
    public void ImperialUnits_ShowPoundsAndPoundForcePerInch()
    {
        // 1 lb = 0.45359237 kg and 1 lbf = 4.4482216152605 N exactly, 1 in = 0.0254 m (NIST SP 811, 2008, App. B).
        var document = Repository.Parse("""
            masses: {deck: 453.59237 kg}
            springs: {s: {between: [ground, deck], stiffness: 175126.835 N/m}}
            """);
        var html = ReportBuilder.Build(document, new ReportOptions("t", Date, UnitSystem.Imperial)).Html;
        Assert.Contains("Mass (lb)", html, StringComparison.Ordinal);
        Assert.Contains("<tr><td>deck</td><td class=\"num\">1000</td>", html, StringComparison.Ordinal);
        Assert.Contains("Stiffness (lbf/in)", html, StringComparison.Ordinal);
        Assert.Contains("<tr><td>s</td><td>ground – deck</td><td class=\"num\">1000</td>", html, StringComparison.Ordinal);
    }

    [Fact]
    public void Report_IsTheSameUnderADecimalCommaCulture()
    {
        var document = Repository.UniformChain(3, 1.5, 250);
        var options = new ReportOptions("t", Date);
        var invariant = ReportBuilder.Build(document, options);
        string german;
        using (new ModalChain.TestSupport.CultureScope("de-DE")) german = ReportBuilder.Build(document, options).Html;
        Assert.Equal(invariant.Html, german);
    }
}
