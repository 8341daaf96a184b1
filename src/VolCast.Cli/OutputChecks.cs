namespace VolCast.Cli;

/// <summary>
/// Checks an output path before any computing, so a run that could never write its results stops at once with a clear
/// message: empty paths, the root, a path under a file, a folder where a file is wanted, a parent that cannot be
/// written, and (for a batch) an output folder that is, holds or lies inside an input folder, compared by real path
/// with symbolic links followed.
/// </summary>
internal static class OutputChecks
{
    /// <summary>Checks an output folder.</summary>
    /// <exception cref="UsageException">The folder cannot be used.</exception>
    public static void Folder(string path, string option = "--out")
    {
        var full = Common(path, option);
        if (File.Exists(full))
        {
            throw new UsageException($"{option} {BacktestOptions.Shown(path)} is a file, not a folder; give a folder path.");
        }
    }

    /// <summary>Checks an output file.</summary>
    /// <exception cref="UsageException">The file cannot be written there.</exception>
    public static void OutputFile(string path, string option = "--out")
    {
        var full = Common(path, option);
        if (Directory.Exists(full))
        {
            throw new UsageException($"{option} {BacktestOptions.Shown(path)} is a folder; give the path of a file to write, such as {Path.Combine(path, "out.json")}.");
        }
    }

    /// <summary>Refuses an output folder that is, contains or lies inside one of the input folders (by real path).</summary>
    /// <exception cref="UsageException">The folders overlap.</exception>
    public static void Separate(string output, params string?[] inputFolders)
    {
        var outReal = RealPath(output);
        foreach (var input in inputFolders)
        {
            if (input is null)
            {
                continue;
            }

            var inReal = RealPath(input);
            var relation = outReal == inReal ? "is"
                : Inside(outReal, inReal) ? "lies inside"
                : Inside(inReal, outReal) ? "contains"
                : null;
            if (relation is not null)
            {
                throw new UsageException($"--out {BacktestOptions.Shown(output)} {relation} the input folder {BacktestOptions.Shown(input)} (compared with links followed); results would mix with or overwrite inputs. Choose an output folder outside the input folders.");
            }
        }
    }

    /// <summary>The absolute path with every symbolic link along it followed; a missing tail is kept as written.</summary>
    public static string RealPath(string path)
    {
        var full = Path.TrimEndingDirectorySeparator(Path.GetFullPath(path));
        var root = Path.GetPathRoot(full) ?? string.Empty;
        var current = root;
        var parts = full[root.Length..].Split(Path.DirectorySeparatorChar, StringSplitOptions.RemoveEmptyEntries);
        for (var i = 0; i < parts.Length; i++)
        {
            var next = Path.Combine(current, parts[i]);
            FileSystemInfo info = Directory.Exists(next) ? new DirectoryInfo(next) : new FileInfo(next);
            if (!info.Exists && info.LinkTarget is null)
            {
                return Path.Combine([next, .. parts[(i + 1)..]]);
            }

            var target = info.LinkTarget is null ? null : info.ResolveLinkTarget(returnFinalTarget: true);
            current = target is null ? next : Path.TrimEndingDirectorySeparator(Path.GetFullPath(target.FullName));
        }

        return current;
    }

    private static bool Inside(string inner, string outer) =>
        inner.StartsWith(Path.TrimEndingDirectorySeparator(outer) + Path.DirectorySeparatorChar, StringComparison.Ordinal);

    private static string Common(string path, string option)
    {
        if (string.IsNullOrWhiteSpace(path))
        {
            throw new UsageException($"{option} is empty; give the path of the results to write.");
        }

        string full;
        try
        {
            full = Path.GetFullPath(path);
        }
        catch (Exception e) when (e is ArgumentException or NotSupportedException or PathTooLongException)
        {
            throw new UsageException($"{option} {BacktestOptions.Shown(path)} is not a usable path ({e.Message}).");
        }

        if (Path.GetPathRoot(full) is string root && Path.TrimEndingDirectorySeparator(full) == Path.TrimEndingDirectorySeparator(root))
        {
            throw new UsageException($"{option} {BacktestOptions.Shown(path)} is the root of the file system; give a folder of its own for the results.");
        }

        // Walk up to the nearest part that exists: it must be a folder (not a file) and writable.
        var existing = Path.GetDirectoryName(Path.TrimEndingDirectorySeparator(full));
        while (existing is not null && !Directory.Exists(existing))
        {
            if (File.Exists(existing))
            {
                throw new UsageException($"{option} {BacktestOptions.Shown(path)} lies under {BacktestOptions.Shown(existing)}, which is a file, not a folder; choose another path.");
            }

            existing = Path.GetDirectoryName(existing);
        }

        if (existing is not null && !Writable(existing))
        {
            throw new UsageException($"{option} {BacktestOptions.Shown(path)}: the folder {BacktestOptions.Shown(existing)} cannot be written by this user; choose a writable place for the results.");
        }

        return full;
    }

    private static bool Writable(string folder)
    {
        try
        {
            var probe = Path.Combine(folder, "." + Guid.NewGuid().ToString("N") + ".probe");
            using (new FileStream(probe, FileMode.CreateNew, FileAccess.Write, FileShare.None, 1, FileOptions.DeleteOnClose))
            {
            }

            return true;
        }
        catch (Exception e) when (e is UnauthorizedAccessException or IOException)
        {
            return false;
        }
    }
}
