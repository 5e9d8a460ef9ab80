using ModalChain.Io.Diagnostics;
using ModalChain.Io.Model;

namespace ModalChain.Io.Tests.Model;

/// <summary>Builds model texts line by line (argument i is line i + 1) and checks the diagnostics read from them.</summary>
internal static class ModelText
{
    public const string FileName = "model.yaml";

    /// <summary>Joins <paramref name="lines"/> with "\n"; line numbers in the tests count these arguments from 1.</summary>
    public static string Lines(params string[] lines) => string.Join("\n", lines) + "\n";

    /// <summary>1-based column where <paramref name="token"/> first occurs in <paramref name="line"/> (the test's own count).</summary>
    public static int ColumnOf(string line, string token)
    {
        var i = line.IndexOf(token, StringComparison.Ordinal);
        Assert.True(i >= 0, $"'{token}' is not in '{line}'");
        return i + 1;
    }

    public static LoadResult Read(params string[] lines) => ModelReader.Read(Lines(lines), FileName);

    /// <summary>Asserts that reading failed with exactly one error, at <paramref name="line"/>:<paramref name="column"/>,
    /// whose message contains every fragment (the fragments are what makes the message actionable).</summary>
    public static Diagnostic SingleError(LoadResult result, int line, int column, params string[] fragments)
    {
        Assert.False(result.Succeeded, "the model should have been rejected");
        Assert.Null(result.Model);
        var errors = result.Errors.ToList();
        Assert.True(errors.Count == 1, "expected one error, got:\n" + string.Join("\n", errors));
        return AssertAt(errors[0], line, column, fragments);
    }

    /// <summary>Asserts that one of the errors sits at the position and contains the fragments.</summary>
    public static Diagnostic ErrorAt(LoadResult result, int line, int column, params string[] fragments)
    {
        Assert.False(result.Succeeded);
        var at = result.Errors.Where(e => e.Position == new SourcePosition(line, column)).ToList();
        Assert.True(at.Count == 1, $"expected one error at {line}:{column}, got:\n" + string.Join("\n", result.Diagnostics));
        return AssertAt(at[0], line, column, fragments);
    }

    private static Diagnostic AssertAt(Diagnostic d, int line, int column, string[] fragments)
    {
        Assert.Equal(Severity.Error, d.Severity);
        Assert.True(d.Position == new SourcePosition(line, column), $"expected {line}:{column}, got {d}");
        foreach (var f in fragments) Assert.Contains(f, d.Message, StringComparison.Ordinal);
        Assert.StartsWith($"{FileName}:{line}:{column}: error: ", d.ToString(), StringComparison.Ordinal);
        return d;
    }
}
