namespace VolCast.Cli.Batch;

/// <summary>One asset found in the prices folder.</summary>
/// <param name="Name">The price file's name without its <c>.csv</c> extension.</param>
/// <param name="Prices">The price file.</param>
/// <param name="Implied">The implied file of the same name, or null when there is none.</param>
/// <param name="Problem">Why the name cannot be used (it would escape or collide inside the output folder), or null when it can.</param>
internal sealed record BatchAsset(string Name, string Prices, string? Implied, string? Problem = null)
{
    /// <summary>The longest asset name accepted.</summary>
    public const int MaxNameLength = 100;

    /// <summary>The characters an asset name may hold, in words, for messages and the help text.</summary>
    public const string SafeSet = "letters A-Z and a-z, digits 0-9, '.', '-' and '_', starting with a letter or digit, at most 100 characters";

    /// <summary>
    /// Lists the assets: every entry of the prices folder whose extension is <c>.csv</c> in any mix of capitals, in
    /// ordinal name order, with implied matched by name (again in any capitals of <c>.csv</c>). A name outside
    /// <see cref="SafeSet"/> is listed with its problem and never run, so no name can reach outside its own results folder.
    /// A folder named like a CSV file, in either folder, is listed too and fails its name when read ("this is a folder,
    /// not a file"), as a pipe or a device of that name does, rather than being passed over without a word.
    /// </summary>
    public static IReadOnlyList<BatchAsset> Find(string pricesFolder, string? impliedFolder)
    {
        var implied = new Dictionary<string, string>(StringComparer.Ordinal);
        if (impliedFolder is not null)
        {
            foreach (var path in Directory.EnumerateFileSystemEntries(impliedFolder).Order(StringComparer.Ordinal))
            {
                if (IsCsv(path))
                {
                    implied.TryAdd(Path.GetFileNameWithoutExtension(path), path);
                }
            }
        }

        var assets = new List<BatchAsset>();
        var seen = new Dictionary<string, string>(StringComparer.OrdinalIgnoreCase);
        foreach (var path in Directory.EnumerateFileSystemEntries(pricesFolder).Order(StringComparer.Ordinal))
        {
            if (!IsCsv(path))
            {
                continue;
            }

            var name = Path.GetFileNameWithoutExtension(path);
            var problem = NameProblem(name);
            if (problem is null && !seen.TryAdd(name, path))
            {
                problem = $"the name is the same as that of {Path.GetFileName(seen[name])} apart from capitals, so their results folders could be one; rename one of the files.";
            }

            assets.Add(new BatchAsset(name, path, implied.GetValueOrDefault(name), problem));
        }

        return assets;
    }

    /// <summary>Why a name cannot be an asset's folder name, or null when it can.</summary>
    public static string? NameProblem(string name)
    {
        if (name.Length == 0 || name.Length > MaxNameLength || !char.IsAsciiLetterOrDigit(name[0]))
        {
            return "the asset name " + Quote(name) + " is not accepted: an asset name (the file name before .csv) must use " + SafeSet
                + "; rename the file, for example to ABC.csv or BRK-B.csv.";
        }

        foreach (var c in name)
        {
            if (!(char.IsAsciiLetterOrDigit(c) || c is '.' or '-' or '_'))
            {
                return "the asset name " + Quote(name) + " holds the character " + Quote(c.ToString()) + ", which is not accepted: an asset name (the file name before .csv) must use "
                    + SafeSet + "; rename the file, for example to ABC.csv or BRK-B.csv.";
            }
        }

        return null;
    }

    private static bool IsCsv(string path) => string.Equals(Path.GetExtension(path), ".csv", StringComparison.OrdinalIgnoreCase);

    /// <summary>A name in quotes for a message: cut at 40 characters, control characters shown as escapes.</summary>
    public static string Quote(string text)
    {
        var shown = text.Length > 40 ? text[..40] + "…" : text;
        var chars = shown.Select(c => char.IsControl(c) ? $"\\u{(int)c:X4}" : c.ToString());
        return "'" + string.Concat(chars) + "'";
    }
}
