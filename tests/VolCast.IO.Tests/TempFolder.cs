using System.Text;

namespace VolCast.IO.Tests;

/// <summary>A folder under the system temp path, deleted when disposed.</summary>
public sealed class TempFolder : IDisposable
{
    public TempFolder()
    {
        Path = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "volcast-io-tests-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Path);
    }

    public string Path { get; }

    /// <summary>Writes UTF-8 text without a byte-order mark, exactly as given (no line-end conversion).</summary>
    public string Write(string name, string text) => WriteBytes(name, new UTF8Encoding(false).GetBytes(text));

    public string WriteBytes(string name, byte[] bytes)
    {
        var file = System.IO.Path.Combine(Path, name);
        File.WriteAllBytes(file, bytes);
        return file;
    }

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
