using System.Xml.Linq;
using ModalChain.Core.Model;
using ModalChain.Io.Model;

namespace ModalChain.Reports.Tests;

/// <summary>Finds the repository (by walking up to ModalChain.sln) and its example models, and builds small test models.</summary>
internal static class Repository
{
    public static readonly XNamespace Svg = "http://www.w3.org/2000/svg";

    public static string Root { get; } = FindRoot();

    /// <summary>Every model file in models/, discovered at run time so new examples are covered without editing tests.</summary>
    public static IEnumerable<object[]> ModelFiles() =>
        Directory.EnumerateFiles(Path.Combine(Root, "models"), "*.yaml", SearchOption.AllDirectories)
            .Concat(Directory.EnumerateFiles(Path.Combine(Root, "models"), "*.yml", SearchOption.AllDirectories))
            .Order(StringComparer.Ordinal)
            .Select(f => new object[] { Path.GetRelativePath(Root, f) });

    /// <summary>The mechanical models of models/ (circuit models left out: their report has no modes and no mechanical units).</summary>
    public static IEnumerable<object[]> MechanicalModelFiles() => ModelFiles().Where(m => Load((string)m[0]).Circuit is null);

    /// <summary>The circuit models of models/ (a top-level 'circuit' section).</summary>
    public static IEnumerable<object[]> CircuitModelFiles() => ModelFiles().Where(m => Load((string)m[0]).Circuit is not null);

    public static ModelDocument Load(string relativePath)
    {
        var result = ModelReader.ReadFile(Path.Combine(Root, relativePath));
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        return result.Model!;
    }

    public static ModelDocument Parse(string yaml, string name = "test.yaml")
    {
        var result = ModelReader.Read(yaml, name);
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics));
        return result.Model!;
    }

    /// <summary>A fixed-free chain of <paramref name="n"/> equal masses m (kg) and springs k (N/m), without drawing positions.</summary>
    public static ModelDocument UniformChain(int n, double m, double k)
    {
        var yaml = new System.Text.StringBuilder("title: uniform chain\nmasses:\n");
        for (var i = 1; i <= n; i++) yaml.Append($"  m{i}: {m} kg\n");
        yaml.Append("springs:\n");
        for (var i = 1; i <= n; i++) yaml.Append($"  k{i}: {{between: [{(i == 1 ? "ground" : "m" + (i - 1))}, m{i}], stiffness: {k} N/m}}\n");
        return Parse(yaml.ToString(), "uniform-chain.yaml");
    }

    public static Network Network(ModelDocument document) => document.Network;

    public static string TempDirectory()
    {
        var path = Path.Combine(Path.GetTempPath(), "modalchain-reports-tests", Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(path);
        return path;
    }

    private static string FindRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "ModalChain.sln"))) return dir.FullName;
        throw new InvalidOperationException("ModalChain.sln not found above " + AppContext.BaseDirectory);
    }
}
