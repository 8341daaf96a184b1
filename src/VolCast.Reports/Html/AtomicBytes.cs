namespace VolCast.Reports.Html;

/// <summary>Writes binary files the way <see cref="VolCast.IO.AtomicFile"/> writes text: a temporary file, then a move.</summary>
public static class AtomicBytes
{
    /// <summary>Writes <paramref name="bytes"/> to <paramref name="path"/> so a reader never sees a half-written file.</summary>
    /// <param name="path">The destination; its folder is created when missing.</param>
    /// <param name="bytes">The content.</param>
    /// <param name="overwrite">Replace an existing file.</param>
    /// <exception cref="IOException">The file exists and <paramref name="overwrite"/> is false.</exception>
    public static void Write(string path, ReadOnlySpan<byte> bytes, bool overwrite)
    {
        ArgumentNullException.ThrowIfNull(path);
        var full = Path.GetFullPath(path);
        if (!overwrite && File.Exists(full))
        {
            throw new IOException($"{path}: the output file already exists; choose another --out or pass --force to replace it.");
        }

        var folder = Path.GetDirectoryName(full)!;
        Directory.CreateDirectory(folder);
        var temp = Path.Combine(folder, $".{Path.GetFileName(full)}.{Environment.ProcessId}.{Guid.NewGuid():N}.tmp");
        try
        {
            using (var stream = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None))
            {
                stream.Write(bytes);
            }

            File.Move(temp, full, overwrite);
        }
        finally
        {
            if (File.Exists(temp))
            {
                File.Delete(temp);
            }
        }
    }
}
