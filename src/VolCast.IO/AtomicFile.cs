using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;

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
public static partial class AtomicFile
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
    /// Checks the target (not an input; absent unless <paramref name="overwrite"/>), removes what killed writers of it left,
    /// and writes the content to a new temporary sibling.
    /// </summary>
    /// <returns>The target's full path and the temporary file's path.</returns>
    internal static (string Target, string Temporary) WriteTemporary(string path, Action<Stream> write, bool overwrite, IEnumerable<string>? protectedInputs)
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
        RemoveStaleTemporaries(full);
        var temp = Path.Combine(folder, string.Create(CultureInfo.InvariantCulture, $".{Path.GetFileName(full)}.{Environment.ProcessId}.{Guid.NewGuid():N}.tmp"));
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
            var match = TemporaryPattern().Match(Path.GetFileName(temporary));
            if (!match.Success || match.Groups["name"].Value != name
                || !int.TryParse(match.Groups["pid"].Value, NumberStyles.None, CultureInfo.InvariantCulture, out var pid)
                || RunningProcess.IsRunning(pid))
            {
                continue;
            }

            DeleteQuietly(temporary);
        }
    }

    private static void Write(string path, Action<Stream> write, bool overwrite, IEnumerable<string>? protectedInputs)
    {
        var (full, temp) = WriteTemporary(path, write, overwrite, protectedInputs);
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

    [GeneratedRegex(@"^\.(?<name>.+)\.(?<pid>[0-9]+)\.[0-9a-f]{32}\.tmp$", RegexOptions.CultureInvariant)]
    private static partial Regex TemporaryPattern();
}
