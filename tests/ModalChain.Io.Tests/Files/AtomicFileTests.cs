using ModalChain.Io.Files;

namespace ModalChain.Io.Tests.Files;

/// <summary>Single-file writes: the target holds the old bytes or the new ones, never a part, and no temporary file stays behind.</summary>
public sealed class AtomicFileTests
{
    private static string TempFolder()
    {
        var dir = Path.Combine(Path.GetTempPath(), "modalchain-atomic-tests", Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(dir);
        return dir;
    }

    [Fact]
    public void Write_ReplacesTheFile_AndLeavesNothingElse()
    {
        var dir = TempFolder();
        var path = Path.Combine(dir, "model.yaml");
        File.WriteAllText(path, "old");
        AtomicFile.WriteAllText(path, "new ü");
        Assert.Equal("new ü"u8.ToArray(), File.ReadAllBytes(path)); // UTF-8 without a byte-order mark
        Assert.Equal(["model.yaml"], Directory.GetFileSystemEntries(dir).Select(Path.GetFileName));
    }

    [Fact]
    public void FailureWhileWriting_LeavesTheOldFileAndNoTemporaryFile()
    {
        // A writer that fails half-way (a full disk, a bug) must not reach the target.
        var dir = TempFolder();
        var path = Path.Combine(dir, "model.yaml");
        File.WriteAllText(path, "old");
        Assert.Throws<IOException>(() => AtomicFile.Write(path, s =>
        {
            s.Write("half of the new"u8);
            throw new IOException("disk full (injected)");
        }));
        Assert.Equal("old", File.ReadAllText(path));
        Assert.Equal(["model.yaml"], Directory.GetFileSystemEntries(dir).Select(Path.GetFileName));
    }

    [Fact]
    public void WithoutOverwrite_AnExistingFileIsRefusedAndKept()
    {
        var dir = TempFolder();
        var path = Path.Combine(dir, "model.yaml");
        File.WriteAllText(path, "mine");
        Assert.Throws<IOException>(() => AtomicFile.WriteAllText(path, "new", overwrite: false));
        Assert.Equal("mine", File.ReadAllText(path));
        Assert.Equal(["model.yaml"], Directory.GetFileSystemEntries(dir).Select(Path.GetFileName));
        AtomicFile.WriteAllText(Path.Combine(dir, "other.yaml"), "new", overwrite: false);
        Assert.Equal("new", File.ReadAllText(Path.Combine(dir, "other.yaml")));
    }

    [Fact]
    public void TemporaryFileOfAKilledWrite_IsRemovedByTheNextWrite()
    {
        // A process killed between creating its temporary file and renaming it leaves .NAME.tmp-PID-RANDOM; no process has
        // the id int.MaxValue, so the next write of the same file removes it. Another file's temporary is not touched.
        var dir = TempFolder();
        var path = Path.Combine(dir, "model.yaml");
        File.WriteAllText(Path.Combine(dir, $".model.yaml.tmp-{int.MaxValue}-0123456789ab"), "half");
        File.WriteAllText(Path.Combine(dir, $".other.yaml.tmp-{int.MaxValue}-0123456789ab"), "half");
        AtomicFile.WriteAllText(path, "new");
        Assert.Equal([$".other.yaml.tmp-{int.MaxValue}-0123456789ab", "model.yaml"],
            Directory.GetFileSystemEntries(dir).Select(Path.GetFileName).Order(StringComparer.Ordinal));
    }

    [Fact]
    [System.Runtime.Versioning.UnsupportedOSPlatform("windows")]
    public void SameFile_SeesThroughSymbolicLinksToTheFileAndToItsFolder()
    {
        var dir = TempFolder();
        var model = Path.Combine(dir, "model.yaml");
        File.WriteAllText(model, "x");
        var link = Path.Combine(dir, "link.yaml");
        File.CreateSymbolicLink(link, "model.yaml"); // relative target
        var folderLink = Path.Combine(TempFolder(), "via");
        Directory.CreateSymbolicLink(folderLink, dir);
        var chain = Path.Combine(dir, "chain.yaml");
        File.CreateSymbolicLink(chain, Path.Combine(folderLink, "link.yaml"));

        Assert.True(FilePaths.SameFile(model, link));
        Assert.True(FilePaths.SameFile(Path.Combine(folderLink, "model.yaml"), model));
        Assert.True(FilePaths.SameFile(chain, model));
        Assert.True(FilePaths.SameFile(Path.Combine(dir, "..", Path.GetFileName(dir), "model.yaml"), model));
        Assert.False(FilePaths.SameFile(Path.Combine(dir, "other.yaml"), model));
    }

    [Fact]
    [System.Runtime.Versioning.UnsupportedOSPlatform("windows")]
    public void Canonical_ALoopOfLinks_IsAnIoErrorNotAHang()
    {
        var dir = TempFolder();
        File.CreateSymbolicLink(Path.Combine(dir, "a"), Path.Combine(dir, "b"));
        File.CreateSymbolicLink(Path.Combine(dir, "b"), Path.Combine(dir, "a"));
        Assert.Throws<IOException>(() => FilePaths.Canonical(Path.Combine(dir, "a")));
    }
}

/// <summary>The rule of DEVELOPERS.md "every file write goes through AtomicFile", checked on the sources.</summary>
public sealed class FileWriteRuleTests
{
    [Fact]
    public void NoSourceFileOutsideIoFiles_WritesAFileDirectly()
    {
        var root = new DirectoryInfo(AppContext.BaseDirectory);
        while (root is not null && !File.Exists(Path.Combine(root.FullName, "ModalChain.sln"))) root = root.Parent;
        Assert.NotNull(root);
        var src = Path.Combine(root.FullName, "src");
        // File.X but not AtomicFile.X; FileStream and StreamWriter on a path.
        var write = new System.Text.RegularExpressions.Regex(@"(?<![\w.])File\.(Write|Create|Open|AppendAll|Move|Copy|Replace)|new FileStream\(|new StreamWriter\((?!stream)");
        var offenders = Directory.EnumerateFiles(src, "*.cs", SearchOption.AllDirectories)
            .Where(f => !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}", StringComparison.Ordinal)
                && !f.StartsWith(Path.Combine(src, "ModalChain.Io", "Files"), StringComparison.Ordinal))
            .SelectMany(f => File.ReadLines(f).Select((line, i) => (f, i, line)))
            .Where(x => write.IsMatch(x.line))
            .Select(x => $"{Path.GetRelativePath(root.FullName, x.f)}:{x.i + 1}: {x.line.Trim()}")
            .ToList();
        Assert.True(offenders.Count == 0, "write through ModalChain.Io.Files.AtomicFile instead:\n" + string.Join("\n", offenders));
    }
}
