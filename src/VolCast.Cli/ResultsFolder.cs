using VolCast.IO;
using VolCast.IO.Results;

namespace VolCast.Cli;

/// <summary>
/// The output folder of one run, owned from the first check to the last move: checked before any computing, built in
/// a hidden temporary sibling (the staging folder), and committed in one step.
/// </summary>
/// <remarks>
/// <para>Without <c>--force</c> the folder must not exist, and the commit is one directory move that fails if another run
/// created the folder meanwhile. With <c>--force</c> an existing folder is locked (<see cref="LockFileName"/>; a second
/// holder is refused), every target is checked first, and the commit swaps the whole set: the previous run's files (those
/// in its run.json manifest) move aside, the new files move in, and only then is the old set deleted; a failure on the
/// way puts the old set back. A file that shares an output name but is not in the previous manifest is the user's, and is
/// never replaced. Temporary folders are hidden (<c>.NAME.PID.ID.tmp</c>, <c>.NAME.PID.ID.old</c>); the next run that owns
/// the folder removes those of processes that no longer run.</para>
/// </remarks>
internal sealed class ResultsFolder : IDisposable
{
    /// <summary>The lock file a forced run holds inside an existing output folder while it writes there.</summary>
    public const string LockFileName = ".volcast.lock";

    private readonly string _shown;
    private readonly string _target;
    private readonly bool _replace;
    private readonly IReadOnlySet<string> _previous;
    private FileStream? _lock;
    private string? _staging;

    private ResultsFolder(string shown, string target, bool replace, IReadOnlySet<string> previous, FileStream? heldLock)
    {
        _shown = shown;
        _target = target;
        _replace = replace;
        _previous = previous;
        _lock = heldLock;
    }

    /// <summary>
    /// Gets every name a run of this tool may write into a results folder: the data files, the report and its charts, and
    /// the batch's record. A folder whose run.json has no manifest (an earlier version wrote it) is taken to hold these.
    /// </summary>
    public static IReadOnlyList<string> KnownNames { get; } =
        [.. BacktestResultsWriter.FileNames, BacktestResultsWriter.RejectedRowsFileName, .. Reports.ReportWriter.FileNames, BatchAssetJson.FileName];

    /// <summary>
    /// Checks an output folder before any computing: it must not exist unless <paramref name="force"/>; none of the
    /// files the run may write or remove may be an input (by identity, links followed); with <paramref name="force"/>
    /// the folder is locked and no file of an output name may be the user's own. Stale temporary folders of dead
    /// processes are removed.
    /// </summary>
    /// <param name="folder">The output folder as the user gave it.</param>
    /// <param name="force">Whether an existing folder's earlier results may be replaced.</param>
    /// <param name="inputs">Every file the run reads.</param>
    /// <returns>The folder, ready to <see cref="Stage"/>.</returns>
    /// <exception cref="UsageException">The folder exists without <paramref name="force"/>, is a file, or an output would overwrite an input.</exception>
    /// <exception cref="IOException">Another run holds the folder, or a file of an output name is not the tool's.</exception>
    public static ResultsFolder Open(string folder, bool force, IEnumerable<string> inputs)
    {
        ArgumentNullException.ThrowIfNull(folder);
        ArgumentNullException.ThrowIfNull(inputs);
        var target = Path.GetFullPath(folder).TrimEnd(Path.DirectorySeparatorChar);
        if (File.Exists(target))
        {
            throw new UsageException($"{folder}: a file of that name exists; --out must name a folder.");
        }

        var exists = Directory.Exists(target);
        if (exists && !force)
        {
            throw new UsageException($"{folder}: the output folder already exists; choose another --out or pass --force to replace its results files.");
        }

        var previous = exists ? Previous(target) : new HashSet<string>(StringComparer.Ordinal);
        var touched = KnownNames.Concat(previous).Append(LockFileName).Select(name => Path.Combine(target, name));
        try
        {
            FileIdentity.RefuseInputs(touched, inputs);
        }
        catch (IOException ex)
        {
            throw new UsageException(ex.Message);
        }

        RemoveStaleTemporaries(Path.GetDirectoryName(target)!, Path.GetFileName(target));
        if (!exists)
        {
            return new ResultsFolder(folder, target, replace: false, previous, null);
        }

        var held = Lock(folder, target);
        try
        {
            // Read the manifest again under the lock: it is what the swap will trust.
            var owned = Previous(target);
            RefuseForeignFiles(folder, target, owned, KnownNames);
            return new ResultsFolder(folder, target, replace: true, owned, held);
        }
        catch
        {
            held.Dispose();
            throw;
        }
    }

    /// <summary>Creates the staging folder, a hidden sibling of the target on the same file system.</summary>
    /// <returns>The staging folder's full path.</returns>
    public string Stage()
    {
        if (_staging is not null)
        {
            return _staging;
        }

        var parent = Path.GetDirectoryName(_target)!;
        Directory.CreateDirectory(parent);
        _staging = Path.Combine(parent, TemporaryName.For(Path.GetFileName(_target), "tmp"));
        Directory.CreateDirectory(_staging);
        return _staging;
    }

    /// <summary>Moves the staged run into place: one directory move for a new folder, a swap of the whole set under <c>--force</c>.</summary>
    /// <param name="manifest">Every file name in the staging folder (run.json's manifest).</param>
    /// <exception cref="IOException">Another run created the folder meanwhile, or a file could not be moved (the folder is left as it was).</exception>
    /// <remarks>A second Ctrl-C that arrives during the commit waits for it (<see cref="Interruption.Uninterrupted"/>), so the
    /// folder holds either the earlier set or the new one, never part of each.</remarks>
    public void Commit(IReadOnlyList<string> manifest)
    {
        ArgumentNullException.ThrowIfNull(manifest);
        var staging = _staging ?? throw new InvalidOperationException("Stage must be called before Commit.");
        Interruption.Process.Uninterrupted(() => Move(staging, manifest));
    }

    private void Move(string staging, IReadOnlyList<string> manifest)
    {
        if (!_replace)
        {
            try
            {
                Directory.Move(staging, _target);
            }
            catch (IOException) when (Directory.Exists(_target) || File.Exists(_target))
            {
                throw new IOException($"{_shown}: another run created the output folder while this one was computing; nothing was written. Choose another --out, or pass --force to replace that run's results.");
            }

            _staging = null;
            return;
        }

        RefuseForeignFiles(_shown, _target, _previous, manifest);
        Swap(staging, manifest);
        Directory.Delete(staging, recursive: true);
        _staging = null;
    }

    /// <summary>Removes the staging folder if the run did not commit, and releases the lock.</summary>
    public void Dispose()
    {
        if (_staging is not null && Directory.Exists(_staging))
        {
            try
            {
                Directory.Delete(_staging, recursive: true);
            }
            catch (IOException)
            {
                // Left for the next run that owns the folder: it removes temporaries of dead processes.
            }
        }

        _staging = null;
        _lock?.Dispose();
        _lock = null;
    }

    private void Swap(string staging, IReadOnlyList<string> manifest)
    {
        var old = Path.Combine(Path.GetDirectoryName(_target)!, TemporaryName.For(Path.GetFileName(_target), "old"));
        Directory.CreateDirectory(old);
        var movedAside = new List<string>();
        var movedIn = new List<string>();
        try
        {
            // The old set: every file of the previous manifest, and any file the new run replaces (known to be the tool's).
            foreach (var name in _previous.Union(manifest, StringComparer.Ordinal).Order(StringComparer.Ordinal))
            {
                var path = Path.Combine(_target, name);
                if (File.Exists(path))
                {
                    File.Move(path, Path.Combine(old, name));
                    movedAside.Add(name);
                }
            }

            foreach (var name in manifest)
            {
                File.Move(Path.Combine(staging, name), Path.Combine(_target, name));
                movedIn.Add(name);
            }
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            // Put the earlier run back as it was; the new files return to the staging folder, which is then removed.
            foreach (var name in movedIn)
            {
                File.Move(Path.Combine(_target, name), Path.Combine(staging, name), overwrite: true);
            }

            foreach (var name in movedAside)
            {
                File.Move(Path.Combine(old, name), Path.Combine(_target, name), overwrite: true);
            }

            Directory.Delete(old, recursive: true);
            throw new IOException($"{_shown}: the results could not be moved into place ({ex.Message}); the folder holds the earlier results as they were.", ex);
        }

        Directory.Delete(old, recursive: true);
    }

    private static HashSet<string> Previous(string target)
    {
        var manifest = BacktestResultsWriter.ReadManifest(target);
        return new HashSet<string>(manifest is { } files ? files : KnownNames, StringComparer.Ordinal);
    }

    private static void RefuseForeignFiles(string shown, string target, IReadOnlySet<string> owned, IEnumerable<string> names)
    {
        foreach (var name in names)
        {
            var path = Path.Combine(target, name);
            if (Directory.Exists(path) || (File.Exists(path) && !owned.Contains(name)))
            {
                throw new IOException($"{Path.Combine(shown, name)}: this file was not written by volcast (it is not in the folder's run.json list of files), so --force will not replace it; move it away or choose another --out.");
            }
        }
    }

    private static FileStream Lock(string shown, string target)
    {
        try
        {
            // FileShare.None takes an exclusive lock that the system releases when the process ends, however it ends.
            return new FileStream(Path.Combine(target, LockFileName), FileMode.OpenOrCreate, FileAccess.ReadWrite, FileShare.None);
        }
        catch (IOException ex) when (ex is not FileNotFoundException and not DirectoryNotFoundException)
        {
            throw new IOException($"{shown}: another volcast run is writing into this folder (it holds {LockFileName}); wait for it to finish or choose another --out.", ex);
        }
    }

    /// <summary>
    /// Removes the temporary folders (<c>.NAME.PID.ID.tmp</c> or <c>.old</c>) that runs of processes no longer running left in
    /// <paramref name="parent"/>: for one target name, or for every name when <paramref name="name"/> is null.
    /// </summary>
    /// <param name="parent">The folder that holds the results folders.</param>
    /// <param name="name">The results folder's name, or null for all.</param>
    public static void RemoveStaleTemporaries(string parent, string? name = null) => Remove(parent, name, anyProcess: false);

    /// <summary>
    /// Removes every temporary folder of <paramref name="name"/> in <paramref name="parent"/>, whether or not the process
    /// that made it still runs. Only for a name the caller alone owns, before it stages anything for it: a batch shard's name
    /// in a folder shared between machines, where another machine's process id says nothing here (in containers the rerun
    /// of a killed shard may even have the same id).
    /// </summary>
    /// <param name="parent">The folder that holds the results folders.</param>
    /// <param name="name">The results folder's name.</param>
    public static void RemoveTemporariesOf(string parent, string name)
    {
        ArgumentNullException.ThrowIfNull(name);
        Remove(parent, name, anyProcess: true);
    }

    private static void Remove(string parent, string? name, bool anyProcess)
    {
        if (!Directory.Exists(parent))
        {
            return;
        }

        foreach (var path in Directory.EnumerateDirectories(parent, "." + (name is null ? string.Empty : name + ".") + "*"))
        {
            if (!TemporaryName.TryParse(Path.GetFileName(path), out var target, out var pid, out _)
                || (name is not null && target != name)
                || (!anyProcess && RunningProcess.IsRunning(pid)))
            {
                continue;
            }

            try
            {
                Directory.Delete(path, recursive: true);
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
            {
                // Someone else's or in use: leave it; it is never read as results.
            }
        }
    }
}
