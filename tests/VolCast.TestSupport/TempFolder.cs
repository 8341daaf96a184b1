using System.Text;

namespace VolCast.TestSupport;

/// <summary>A new folder under the system temp path, deleted with everything in it when disposed.</summary>
public sealed class TempFolder : IDisposable
{
    /// <summary>Creates the folder, named <c>volcast-{prefix}-{guid}</c>.</summary>
    public TempFolder(string prefix = "tests")
    {
        Path = System.IO.Path.Combine(System.IO.Path.GetTempPath(), $"volcast-{prefix}-{Guid.NewGuid():N}");
        Directory.CreateDirectory(Path);
    }

    /// <summary>The folder's full path.</summary>
    public string Path { get; }

    /// <summary>A path inside the folder (nothing is created).</summary>
    public string Combine(params string[] parts) => System.IO.Path.Combine([Path, .. parts]);

    /// <summary>Writes UTF-8 text without a byte-order mark, exactly as given (no line-end conversion); returns the file's path.</summary>
    public string Write(string name, string text) => WriteBytes(name, new UTF8Encoding(false).GetBytes(text));

    /// <summary>Writes the bytes; returns the file's path.</summary>
    public string WriteBytes(string name, byte[] bytes)
    {
        var file = Combine(name);
        File.WriteAllBytes(file, bytes);
        return file;
    }

    /// <inheritdoc />
    public void Dispose()
    {
        try
        {
            Directory.Delete(Path, recursive: true);
        }
        catch (IOException)
        {
            // Best effort: a leftover temp folder is harmless.
        }
    }
}
