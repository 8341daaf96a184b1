namespace VolCast.Cli.Scan;

/// <summary>One asset found in the prices folder.</summary>
/// <param name="Name">The price file's name without <c>.csv</c>.</param>
/// <param name="Prices">The price file.</param>
/// <param name="Implied">The implied file of the same name, or null when there is none.</param>
internal sealed record ScanAsset(string Name, string Prices, string? Implied)
{
    /// <summary>Lists the assets: every <c>*.csv</c> in the prices folder, in ordinal name order, with implied matched by name.</summary>
    public static IReadOnlyList<ScanAsset> Find(string pricesFolder, string? impliedFolder)
    {
        var assets = new List<ScanAsset>();
        foreach (var path in Directory.EnumerateFiles(pricesFolder, "*.csv").Order(StringComparer.Ordinal))
        {
            var name = Path.GetFileNameWithoutExtension(path);
            var implied = impliedFolder is null ? null : Path.Combine(impliedFolder, name + ".csv");
            assets.Add(new ScanAsset(name, path, implied is not null && File.Exists(implied) ? implied : null));
        }

        return assets;
    }
}
