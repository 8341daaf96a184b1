namespace VolCast.IO;

/// <summary>
/// Tells whether two paths name the same file, by the file's resolved real path: every symbolic link on the way
/// (the file itself and each folder above it) is followed, so <c>alias/forecasts.csv</c> with <c>alias</c> a link to
/// <c>out</c> is the same file as <c>out/forecasts.csv</c>. Paths that do not exist yet resolve through their
/// nearest existing folder.
/// </summary>
/// <remarks>
/// A hard link (a second name for the same device and inode) is not detected; it needs no protection because every
/// output is written to a temporary file and moved into place, and every removal unlinks a name: the input's own
/// name keeps its bytes either way.
/// </remarks>
public static class FileIdentity
{
    /// <summary>How many symbolic links one path may pass through before it is taken as a loop (the Linux limit).</summary>
    private const int MaxLinks = 40;

    private static StringComparison Comparison =>
        OperatingSystem.IsWindows() || OperatingSystem.IsMacOS() ? StringComparison.OrdinalIgnoreCase : StringComparison.Ordinal;

    /// <summary>Resolves a path to its real path: absolute, normalized, with every symbolic link followed.</summary>
    /// <param name="path">The path, relative to the current folder or absolute.</param>
    /// <returns>The real path; the part below the nearest existing folder is kept as written.</returns>
    /// <exception cref="ArgumentException">The path is empty.</exception>
    /// <exception cref="IOException">The path passes through too many symbolic links (a loop).</exception>
    public static string RealPath(string path)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(path);
        var pending = new Stack<string>();
        var full = Path.GetFullPath(path);
        var root = Path.GetPathRoot(full)!;
        foreach (var part in full[root.Length..].Split(Path.DirectorySeparatorChar, StringSplitOptions.RemoveEmptyEntries).Reverse())
        {
            pending.Push(part);
        }

        var current = root;
        var links = 0;
        while (pending.Count > 0)
        {
            var part = pending.Pop();
            if (part == "..")
            {
                current = Path.GetDirectoryName(current) ?? root;
                continue;
            }

            var next = Path.Combine(current, part);
            FileSystemInfo info = Directory.Exists(next) ? new DirectoryInfo(next) : new FileInfo(next);
            if (info.LinkTarget is not string target)
            {
                current = next;
                continue;
            }

            if (++links > MaxLinks)
            {
                throw new IOException($"{path}: too many symbolic links (a loop?); give a path that resolves to a file.");
            }

            // Replace the link by its target and resolve the target's own parts in turn.
            var absolute = Path.IsPathRooted(target) ? target : Path.Combine(current, target);
            var targetRoot = Path.GetPathRoot(absolute)!;
            foreach (var p in absolute[targetRoot.Length..].Split(Path.DirectorySeparatorChar, StringSplitOptions.RemoveEmptyEntries).Reverse())
            {
                pending.Push(p);
            }

            current = targetRoot;
        }

        return current;
    }

    /// <summary>Whether two paths name the same file once every symbolic link is followed.</summary>
    /// <param name="first">One path.</param>
    /// <param name="second">The other path.</param>
    /// <returns>True when both resolve to the same real path.</returns>
    public static bool Same(string first, string second) => string.Equals(RealPath(first), RealPath(second), Comparison);

    /// <summary>Whether <paramref name="path"/> resolves to <paramref name="folder"/> itself or to something inside it.</summary>
    /// <param name="path">The path to test.</param>
    /// <param name="folder">The folder.</param>
    /// <returns>True when the real path of <paramref name="path"/> is at or below the real path of <paramref name="folder"/>.</returns>
    public static bool IsInside(string path, string folder)
    {
        var p = RealPath(path);
        var f = RealPath(folder).TrimEnd(Path.DirectorySeparatorChar);
        return string.Equals(p, f, Comparison) || p.StartsWith(f + Path.DirectorySeparatorChar, Comparison);
    }

    /// <summary>
    /// Refuses any output that is one of the inputs: throws naming the first output that resolves to the same file as an input.
    /// </summary>
    /// <param name="outputs">Every file the command may write or remove.</param>
    /// <param name="inputs">Every file the command reads.</param>
    /// <exception cref="IOException">An output resolves to the same file as an input; the message names both.</exception>
    public static void RefuseInputs(IEnumerable<string> outputs, IEnumerable<string> inputs)
    {
        ArgumentNullException.ThrowIfNull(outputs);
        ArgumentNullException.ThrowIfNull(inputs);
        var real = inputs.Select(i => (Given: i, Real: RealPath(i))).ToList();
        foreach (var output in outputs)
        {
            var target = RealPath(output);
            foreach (var (given, resolved) in real)
            {
                if (string.Equals(target, resolved, Comparison))
                {
                    var how = string.Equals(Path.GetFullPath(output), Path.GetFullPath(given), Comparison) ? string.Empty : $" (both are {resolved} once links are followed)";
                    throw new IOException($"{output}: writing it would overwrite the input file {given}{how}; choose another --out.");
                }
            }
        }
    }
}
