using System.Text;

namespace VolCast.IO;

/// <summary>
/// Writes an output file so that a reader never sees it half-written: the content goes to a temporary
/// file in the same folder, which is then moved over the target in one step.
/// </summary>
public static class AtomicFile
{
    private static UTF8Encoding Utf8NoBom { get; } = new(encoderShouldEmitUTF8Identifier: false);

    /// <summary>Writes text to <paramref name="path"/> through a temporary file (UTF-8, no BOM, LF line ends).</summary>
    /// <param name="path">The file to create or replace.</param>
    /// <param name="write">Writes the content.</param>
    /// <param name="overwrite">Whether an existing file may be replaced.</param>
    /// <param name="protectedInputs">Input files that must never be written over; a target that resolves to one of them (<see cref="FileIdentity"/>) is refused.</param>
    /// <exception cref="IOException">The target exists and <paramref name="overwrite"/> is false, or the target is one of the inputs.</exception>
    public static void WriteText(string path, Action<TextWriter> write, bool overwrite = false, IEnumerable<string>? protectedInputs = null)
    {
        ArgumentNullException.ThrowIfNull(write);
        Write(path, stream =>
        {
            // A larger buffer than the default 1,024 characters: the big CSV files are encoded and handed to the file in fewer, longer steps.
            using var writer = new StreamWriter(stream, Utf8NoBom, bufferSize: 1 << 16) { NewLine = "\n" };
            write(writer);
        }, overwrite, protectedInputs);
    }

    /// <summary>Writes bytes to <paramref name="path"/> through a temporary file.</summary>
    /// <param name="path">The file to create or replace.</param>
    /// <param name="bytes">The content.</param>
    /// <param name="overwrite">Whether an existing file may be replaced.</param>
    /// <exception cref="IOException">The target exists and <paramref name="overwrite"/> is false.</exception>
    public static void WriteBytes(string path, ReadOnlyMemory<byte> bytes, bool overwrite = false) =>
        Write(path, stream => stream.Write(bytes.Span), overwrite, null);

    private static void Write(string path, Action<Stream> write, bool overwrite, IEnumerable<string>? protectedInputs)
    {
        var full = Path.GetFullPath(path);
        if (protectedInputs is not null)
        {
            foreach (var input in protectedInputs)
            {
                // By identity, not by spelling: a symbolic link to an input is the input.
                if (FileIdentity.Same(input, full))
                {
                    throw new IOException($"{path}: the output would overwrite an input file; choose another --out.");
                }
            }
        }

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
                write(stream);
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
