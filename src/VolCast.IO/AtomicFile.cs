using System.Text;

namespace VolCast.IO;

/// <summary>
/// Writes an output file so that a reader never sees it half-written: the content goes to a temporary
/// file in the same folder, which is then moved over the target in one step.
/// </summary>
/// <remarks>
/// The temporary file is hidden and named for the target and the writing process (<c>.NAME.PID.ID.tmp</c>). A process that
/// is killed while it writes leaves it behind; the next write of the same target removes those of processes that no
/// longer run, so they never pile up and are never taken for results.
/// </remarks>
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
        Write(path, TextContent(write), overwrite, protectedInputs);
    }

    /// <summary>
    /// Writes text to a file that processes on other machines may be writing at the same moment (a batch plan in a folder
    /// shared by shards), as <see cref="WriteText"/> does, except that the temporary files of other processes beside it
    /// are left alone: their process ids say nothing on this machine, so the caller removes stale ones by another rule.
    /// </summary>
    /// <param name="path">The file to create or replace.</param>
    /// <param name="write">Writes the content.</param>
    /// <param name="overwrite">Whether an existing file may be replaced.</param>
    /// <exception cref="IOException">The target exists and <paramref name="overwrite"/> is false.</exception>
    public static void WriteTextInSharedFolder(string path, Action<TextWriter> write, bool overwrite = false)
    {
        ArgumentNullException.ThrowIfNull(write);
        Write(path, TextContent(write), overwrite, null, removeStale: false);
    }

    /// <summary>Writes bytes to <paramref name="path"/> through a temporary file.</summary>
    /// <param name="path">The file to create or replace.</param>
    /// <param name="bytes">The content.</param>
    /// <param name="overwrite">Whether an existing file may be replaced.</param>
    /// <exception cref="IOException">The target exists and <paramref name="overwrite"/> is false.</exception>
    public static void WriteBytes(string path, ReadOnlyMemory<byte> bytes, bool overwrite = false) =>
        Write(path, stream => stream.Write(bytes.Span), overwrite, null);

    /// <summary>The content writer of a text file: UTF-8 without a BOM, LF line ends.</summary>
    internal static Action<Stream> TextContent(Action<TextWriter> write) => stream =>
    {
        // A larger buffer than the default 1,024 characters: the big CSV files are encoded and handed to the file in fewer, longer steps.
        using var writer = new StreamWriter(stream, Utf8NoBom, bufferSize: 1 << 16) { NewLine = "\n" };
        write(writer);
    };

    /// <summary>
    /// Checks the target (not an input; absent unless <paramref name="overwrite"/>), removes what killed writers of it left
    /// (unless <paramref name="removeStale"/> is false), and writes the content to a new temporary sibling.
    /// </summary>
    /// <returns>The target's full path and the temporary file's path.</returns>
    internal static (string Target, string Temporary) WriteTemporary(string path, Action<Stream> write, bool overwrite, IEnumerable<string>? protectedInputs, bool removeStale = true)
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
        if (removeStale)
        {
            RemoveStaleTemporaries(full);
        }

        var temp = Path.Combine(folder, TemporaryName.For(Path.GetFileName(full), "tmp"));
        try
        {
            using var stream = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None);
            write(stream);
        }
        catch
        {
            DeleteQuietly(temp);
            throw;
        }

        return (full, temp);
    }

    /// <summary>Removes a temporary file if it is still there; a failure to remove it is left to the next writer's clean-up.</summary>
    internal static void DeleteQuietly(string temporary)
    {
        try
        {
            File.Delete(temporary);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            // Left behind; the next write of the same target removes it once this process has ended.
        }
    }

    /// <summary>
    /// Removes the temporary files (<c>.NAME.PID.ID.tmp</c>) of <paramref name="path"/> that processes no longer running
    /// left beside it: a write stopped by a kill never finished, and its file is never results.
    /// </summary>
    /// <param name="path">The output file.</param>
    public static void RemoveStaleTemporaries(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        var target = Path.GetFullPath(path);
        var folder = Path.GetDirectoryName(target)!;
        var name = Path.GetFileName(target);
        if (!Directory.Exists(folder))
        {
            return;
        }

        foreach (var temporary in Directory.EnumerateFiles(folder, "." + name + ".*.tmp"))
        {
            if (!TemporaryName.TryParse(Path.GetFileName(temporary), out var of, out var pid, out var kind)
                || of != name || kind != "tmp" || RunningProcess.IsRunning(pid))
            {
                continue;
            }

            DeleteQuietly(temporary);
        }
    }

    private static void Write(string path, Action<Stream> write, bool overwrite, IEnumerable<string>? protectedInputs, bool removeStale = true)
    {
        var (full, temp) = WriteTemporary(path, write, overwrite, protectedInputs, removeStale);
        try
        {
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
