namespace ModalChain.Io.Files;

/// <summary>Compares file paths the way the file system does: full paths with every symbolic link on the way resolved.</summary>
public static class FilePaths
{
    // Linux's own limit on links followed while resolving one path (MAXSYMLINKS).
    private const int MaxLinks = 40;

    /// <summary>The full path of <paramref name="path"/> with every symbolic link in it resolved (as far as the entries exist).</summary>
    /// <exception cref="IOException">Too many symbolic links (a loop).</exception>
    public static string Canonical(string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        var links = 0;
        return Resolve(Path.GetFullPath(path), ref links);
    }

    /// <summary>True when both paths name the same file, also through symbolic links (e.g. a link to the model, or the model's folder reached through a link).</summary>
    public static bool SameFile(string first, string second) =>
        string.Equals(Canonical(first), Canonical(second), OperatingSystem.IsWindows() || OperatingSystem.IsMacOS() ? StringComparison.OrdinalIgnoreCase : StringComparison.Ordinal);

    private static string Resolve(string full, ref int links)
    {
        var root = Path.GetPathRoot(full) ?? "";
        var current = root;
        foreach (var part in full[root.Length..].Split(Path.DirectorySeparatorChar, StringSplitOptions.RemoveEmptyEntries))
        {
            var next = Path.Combine(current, part);
            var info = new FileInfo(next);
            if (info.LinkTarget is { } target)
            {
                if (++links > MaxLinks) throw new IOException($"too many symbolic links while resolving {full}");
                next = Resolve(Path.GetFullPath(target, current), ref links);
            }
            current = next;
        }
        return current;
    }
}
