namespace VolCast.IO;

/// <summary>
/// Writes several output files that belong together (a CSV and its chart, a table and its diagnostics) so that they are
/// replaced as one set: every file is first written in full to a temporary sibling, and only when all are written are
/// they moved into place, one quick rename each. A failure or a stop while writing leaves every target as it was.
/// </summary>
/// <remarks>
/// The renames of <see cref="Commit"/> take milliseconds; a caller that may be ended by a signal runs them where that
/// signal waits for them to finish, so the set is never half old and half new.
/// </remarks>
public sealed class AtomicFileSet : IDisposable
{
    private readonly List<(string Target, string Temporary, bool Overwrite)> _files = [];
    private bool _committed;

    /// <summary>Writes text for <paramref name="path"/> to a temporary sibling (UTF-8, no BOM, LF line ends); it moves into place on <see cref="Commit"/>.</summary>
    /// <param name="path">The file to create or replace.</param>
    /// <param name="write">Writes the content.</param>
    /// <param name="overwrite">Whether an existing file may be replaced.</param>
    /// <param name="protectedInputs">Input files that must never be written over (compared by identity, links followed).</param>
    /// <exception cref="IOException">The target exists and <paramref name="overwrite"/> is false, or the target is one of the inputs.</exception>
    public void AddText(string path, Action<TextWriter> write, bool overwrite = false, IEnumerable<string>? protectedInputs = null)
    {
        ArgumentNullException.ThrowIfNull(write);
        Add(path, AtomicFile.TextContent(write), overwrite, protectedInputs);
    }

    /// <summary>Writes bytes for <paramref name="path"/> to a temporary sibling; they move into place on <see cref="Commit"/>.</summary>
    /// <param name="path">The file to create or replace.</param>
    /// <param name="bytes">The content.</param>
    /// <param name="overwrite">Whether an existing file may be replaced.</param>
    /// <exception cref="IOException">The target exists and <paramref name="overwrite"/> is false.</exception>
    public void AddBytes(string path, ReadOnlyMemory<byte> bytes, bool overwrite = false) =>
        Add(path, stream => stream.Write(bytes.Span), overwrite, null);

    /// <summary>Moves every written file into place, in the order they were added.</summary>
    /// <exception cref="InvalidOperationException">The set was committed already.</exception>
    /// <exception cref="IOException">A target appeared meanwhile without overwrite, or a move failed; files not yet moved stay as they were.</exception>
    public void Commit()
    {
        if (_committed)
        {
            throw new InvalidOperationException("The set was committed or disposed already; write a new set.");
        }

        _committed = true;
        foreach (var (target, temporary, overwrite) in _files)
        {
            File.Move(temporary, target, overwrite);
        }
    }

    /// <summary>Removes the temporary files of a set that was not committed (or whose commit failed part way).</summary>
    public void Dispose()
    {
        foreach (var (_, temporary, _) in _files)
        {
            if (File.Exists(temporary))
            {
                AtomicFile.DeleteQuietly(temporary);
            }
        }

        _files.Clear();
        _committed = true;
    }

    private void Add(string path, Action<Stream> write, bool overwrite, IEnumerable<string>? protectedInputs)
    {
        if (_committed)
        {
            throw new InvalidOperationException("The set was committed or disposed already; write a new set.");
        }

        var (target, temporary) = AtomicFile.WriteTemporary(path, write, overwrite, protectedInputs);
        _files.Add((target, temporary, overwrite));
    }
}
