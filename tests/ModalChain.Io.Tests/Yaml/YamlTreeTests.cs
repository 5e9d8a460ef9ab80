using ModalChain.Io.Diagnostics;
using ModalChain.Io.Model;
using ModalChain.Io.Tests.Model;
using static ModalChain.Io.Tests.Model.ModelText;

namespace ModalChain.Io.Tests.Yaml;

/// <summary>Malformed YAML is one error at the place to fix, never an exception; the YAML layer's positions are 1-based.</summary>
public class YamlTreeTests
{
    [Fact]
    public void KeyIndentedDeeperThanItsNeighbour_IsReportedOnThatLine()
    {
        // "   skid" is one column deeper than "  deck": YamlDotNet stops at the ':' of line 3.
        const string line3 = "   skid: 850 kg";
        var r = Read("masses:", "  deck: 3200 kg", line3);
        SingleError(r, 3, ColumnOf(line3, ":"), "malformed YAML", "indented deeper");
    }

    [Fact]
    public void KeyIndentedShallowerThanItsNeighbour_IsReportedAtThatKey()
    {
        var r = Read("masses:", "    deck: 3200 kg", "  skid: 850 kg");
        SingleError(r, 3, 3, "malformed YAML", "check the indentation", "same column");
    }

    [Fact]
    public void UnclosedBracketInsideABrace_IsReportedWhereTheScannerStopped_NamingTheOpener()
    {
        const string line2 = "  deck: {mass: 3200 kg, at: [0, 0}";
        var r = Read("masses:", line2);
        var opener = ColumnOf(line2, "[");
        SingleError(r, 2, ColumnOf(line2, "}"), "malformed YAML", $"the '[' opened at line 2, column {opener} is not closed with ']'");
    }

    [Fact]
    public void UnclosedBracketAtTheEndOfTheFile_IsReportedAtTheOpener()
    {
        const string line2 = "  deck: {mass: 3200 kg, at: [0, 1.2";
        var r = Read("masses:", line2);
        SingleError(r, 2, ColumnOf(line2, "["), "this '[' is never closed", "add ']'");
    }

    [Fact]
    public void UnclosedBraceFollowedByMoreKeys_IsReportedAtTheOpener()
    {
        // YamlDotNet throws InvalidOperationException here rather than a YamlException; it must not escape.
        const string line2 = "  deck: {mass: 3200 kg";
        var r = Read("masses:", line2, "springs: {}");
        SingleError(r, 2, ColumnOf(line2, "{"), "this '{' is never closed", "add '}'");
    }

    [Fact]
    public void UnclosedBraceAtTheEndOfTheFile_IsReportedAtTheOpener()
    {
        var r = Read("title: t", "masses: {deck: 3200 kg");
        SingleError(r, 2, 9, "this '{' is never closed");
    }

    [Fact]
    public void OpenQuote_IsReportedAtTheQuote()
    {
        const string line2 = "  deck: \"3200 kg";
        var r = Read("masses:", line2, "  skid: 850 kg");
        SingleError(r, 2, ColumnOf(line2, "\""), "malformed YAML", "is a quote left open?");
    }

    [Fact]
    public void TabIndentation_IsReportedAtTheTab()
    {
        // YamlDotNet marks this at 1:1 (the mapping that contains it); the tab itself is the place to fix.
        var r = Read("masses:", "  deck: 3200 kg", "\tskid: 850 kg");
        SingleError(r, 3, 1, "a tab is used for indentation", "spaces only");
    }

    [Fact]
    public void UnknownAlias_IsReportedAtTheAlias()
    {
        const string line3 = "  skid: *heavy";
        var r = Read("masses:", "  deck: &m 3200 kg", line3);
        SingleError(r, 3, ColumnOf(line3, "*"), "unknown alias '*heavy'");
    }

    [Fact]
    public void KnownAlias_ReadsTheAnchoredValue()
    {
        var r = Read("masses:", "  left: &m 850 kg", "  right: *m", "springs:",
            "  a: {between: [ground, left], stiffness: 1 kN/mm}", "  b: {between: [ground, right], stiffness: 1 kN/mm}");
        Assert.True(r.Succeeded, string.Join("\n", r.Diagnostics));
        Assert.All(r.Model!.Network.Masses, m => Assert.Equal(850.0, m.Kilograms));
    }

    [Fact]
    public void ListAsAKey_IsReportedAtTheKey()
    {
        var r = Read("masses:", "  ? [a, b]", "  : 3 kg");
        SingleError(r, 2, 5, "a key must be a plain name");
    }

    [Fact]
    public void EveryTruncationAndEveryDeletedCharacterOfAModel_GivesDiagnosticsNotExceptions()
    {
        // Robustness sweep: every prefix of a valid model, and the model with each single character deleted, must
        // read to a result (model or diagnostics) without throwing, with every position inside the text.
        // Deterministic: the variants are enumerated, not sampled.
        var text = Lines(
            "title: Chiller skid",
            "masses:",
            "  deck: {mass: 3200 kg, at: [0, 0]}",
            "  skid:",
            "    mass: 850 kg",
            "    at: [0, 1.2]",
            "springs:",
            "  columns: {between: [ground, deck], stiffness: 95 kN/mm}",
            "  mounts:",
            "    between: [deck, skid]",
            "    stiffness: '8.4 kN/mm'",
            "dampers:",
            "  loss: {between: [deck, skid], coefficient: 1.5 kN*s/m}");
        var lineCount = text.Split('\n').Length;
        var variants = Enumerable.Range(0, text.Length).Select(n => text[..n])
            .Concat(Enumerable.Range(0, text.Length).Select(i => text.Remove(i, 1)));
        var rejected = 0;
        foreach (var variant in variants)
        {
            var r = ModelReader.Read(variant, FileName);
            Assert.True(r.Succeeded || r.Errors.Any(), "a rejected model must say why");
            foreach (var d in r.Diagnostics)
            {
                Assert.InRange(d.Position.Line, 1, lineCount + 1);
                Assert.InRange(d.Position.Column, 1, 200);
                Assert.False(string.IsNullOrWhiteSpace(d.Message));
            }
            if (!r.Succeeded) rejected++;
        }
        Assert.True(rejected > text.Length / 2, $"only {rejected} variants were rejected; the sweep is not exercising errors");
    }
}
