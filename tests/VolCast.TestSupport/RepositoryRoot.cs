namespace VolCast.TestSupport;

/// <summary>The repository's root folder: the first folder above the test assembly that holds VolCast.sln.</summary>
public static class RepositoryRoot
{
    private static readonly Lazy<string> Folder = new(Find);

    /// <summary>The root's full path.</summary>
    public static string Path => Folder.Value;

    /// <summary>A path below the root, e.g. <c>Combine("reports", "demo")</c>.</summary>
    public static string Combine(params string[] parts) => System.IO.Path.Combine([Path, .. parts]);

    private static string Find()
    {
        for (var folder = new DirectoryInfo(AppContext.BaseDirectory); folder is not null; folder = folder.Parent)
        {
            if (File.Exists(System.IO.Path.Combine(folder.FullName, "VolCast.sln")))
            {
                return folder.FullName;
            }
        }

        throw new DirectoryNotFoundException("VolCast.sln was not found above " + AppContext.BaseDirectory);
    }
}
