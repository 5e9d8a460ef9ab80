using System.Net;
using System.Text.RegularExpressions;
using ModalChain.Reports.Units;

namespace ModalChain.Reports.Tests.Units;

/// <summary>The report's tables and chart texts are in the units asked for and in words, never JSON keys, for every model in models/.</summary>
public sealed partial class ReportUnitsTests
{
    // Circuit models speak V, A and Ω in every unit system (CircuitReportTests).
    public static IEnumerable<object[]> Models() => Repository.MechanicalModelFiles();

    [GeneratedRegex(@"<table.*?</table>|<svg.*?</svg>", RegexOptions.Singleline)]
    private static partial Regex TablesAndCharts();

    [GeneratedRegex(@"<[^>]+>")]
    private static partial Regex Tag();

    // A snake_case word ("spring_force"); single-letter subscripts such as f_n or ζ_a are notation.
    [GeneratedRegex(@"\b[a-z]{2,}(?:_[a-z0-9]{2,})+\b")]
    private static partial Regex SnakeCase();

    /// <summary>The text a reader sees in the tables and charts of the report (tags removed, entities decoded).</summary>
    private static string Shown(string html) =>
        WebUtility.HtmlDecode(string.Join("\n", TablesAndCharts().Matches(html).Select(m => Tag().Replace(m.Value, " "))));

    [Theory]
    [MemberData(nameof(Models))]
    public void ImperialReport_ShowsNoSiUnitAndNoJsonKey(string model)
    {
        var document = Repository.Load(model);
        var html = ReportBuilder.Build(document, new ReportOptions("t", DateTimeOffset.UnixEpoch, UnitSystem.Imperial)).Html;
        var shown = Shown(html);
        foreach (var name in document.Network.Masses.Select(m => m.Name).Concat(document.Network.Springs.Select(s => s.Name))
                     .Concat(document.Network.Dampers.Select(d => d.Name)).Concat(document.Network.Supports.Select(s => s.Name)))
            shown = shown.Replace(name, "NAME", StringComparison.Ordinal);
        shown = shown.Replace(document.Network.Title, "TITLE", StringComparison.Ordinal);
        Assert.Contains("(lb)", shown, StringComparison.Ordinal); // the masses table: the scan sees the tables
        Assert.Empty(SnakeCase().Matches(shown).Select(m => m.Value).Distinct());
        string[] si = ["(mm", "mm/s", "m/s²", "(N ", "(N)", " N ", "(kg)", " kg", "kN", "N·s/m", "µm/s", " J "];
        var found = si.Where(s => shown.Contains(s, StringComparison.Ordinal)).ToList();
        Assert.True(found.Count == 0, $"{model}: the imperial report shows {string.Join(", ", found)}");
    }

    [Fact]
    public void Report_ShowsStiffness_InTheUnitTheModelWritesIt()
    {
        // chiller-deck.yaml writes every spring in kN/mm.
        var html = ReportBuilder.Build(Repository.Load("models/chiller-deck.yaml"), new ReportOptions("t", DateTimeOffset.UnixEpoch)).Html;
        Assert.Contains("Stiffness (kN/mm)", html, StringComparison.Ordinal);
    }
}
