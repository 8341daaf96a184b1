using System.Diagnostics;

namespace VolCast.IO.Tests;

// Files that belong together are replaced as one set (written in full first, then moved into place), and a temporary file
// that a killed writer left is removed by the next write of the same target, but never one of a process that still runs.
// The rule of an atomic replace through a temporary sibling and a rename (common practice, no source).
public sealed class AtomicFileSetTests : IDisposable
{
    private readonly TempFolder _temp = new("atomic-set");

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void Set_NotCommitted_LeavesEveryTargetAsItWasAndNoTemporary()
    {
        var csv = _temp.Write("cone.csv", "earlier csv");
        var png = _temp.Write("cone.png", "earlier png");

        using (var set = new AtomicFileSet())
        {
            set.AddText(csv, w => w.Write("new csv"), overwrite: true);
            set.AddBytes(png, "new png"u8.ToArray(), overwrite: true);

            // Written in full, but not in place yet.
            Assert.Equal("earlier csv", File.ReadAllText(csv));
            Assert.Equal("earlier png", File.ReadAllText(png));
        }

        Assert.Equal("earlier csv", File.ReadAllText(csv));
        Assert.Equal("earlier png", File.ReadAllText(png));
        Assert.Equal(["cone.csv", "cone.png"], Directory.GetFileSystemEntries(_temp.Path).Select(Path.GetFileName).Order(StringComparer.Ordinal));
    }

    [Fact]
    public void Set_Committed_ReplacesEveryTargetAndLeavesNoTemporary()
    {
        var csv = _temp.Write("cone.csv", "earlier csv");
        var png = _temp.Combine("cone.png");

        using (var set = new AtomicFileSet())
        {
            set.AddText(csv, w => w.Write("new csv"), overwrite: true);
            set.AddBytes(png, "new png"u8.ToArray(), overwrite: true);
            set.Commit();
        }

        Assert.Equal("new csv", File.ReadAllText(csv));
        Assert.Equal("new png", File.ReadAllText(png));
        Assert.Equal(["cone.csv", "cone.png"], Directory.GetFileSystemEntries(_temp.Path).Select(Path.GetFileName).Order(StringComparer.Ordinal));
    }

    [Fact]
    public void Set_SecondFileRefused_FirstIsNotReplacedEither()
    {
        var csv = _temp.Write("cone.csv", "earlier csv");
        var png = _temp.Write("cone.png", "earlier png");

        using (var set = new AtomicFileSet())
        {
            set.AddText(csv, w => w.Write("new csv"), overwrite: true);
            Assert.Throws<IOException>(() => set.AddBytes(png, "new png"u8.ToArray(), overwrite: false));
        }

        Assert.Equal("earlier csv", File.ReadAllText(csv));
        Assert.Equal("earlier png", File.ReadAllText(png));
        Assert.Equal(2, Directory.GetFileSystemEntries(_temp.Path).Length);
    }

    [Fact]
    public void Write_RemovesTemporariesThatEndedProcessesLeft_AndKeepsThoseOfRunningOnes()
    {
        var target = _temp.Combine("vol.csv");
        var ended = EndedProcessId();
        var stale = _temp.Write($".vol.csv.{ended}.{Guid.NewGuid():N}.tmp", "half a file");
        var running = _temp.Write($".vol.csv.{Environment.ProcessId}.{Guid.NewGuid():N}.tmp", "another writer's");
        var other = _temp.Write($".other.csv.{ended}.{Guid.NewGuid():N}.tmp", "another target's");

        AtomicFile.WriteText(target, w => w.Write("date,vol\n"));

        Assert.False(File.Exists(stale), "a killed writer's temporary file is removed by the next write of the same target");
        Assert.True(File.Exists(running), "a running writer's temporary file is left alone");
        Assert.True(File.Exists(other), "another target's temporary file is left to its own next write");
        Assert.Equal("date,vol\n", File.ReadAllText(target));
    }

    [Fact]
    public void WriteInSharedFolder_LeavesOtherProcessesTemporariesAlone()
    {
        // In a folder shared between machines, a process id from another machine says nothing here: a plan being written
        // there at this moment must not be taken for a killed writer's leftover.
        var target = _temp.Combine("batch-plan.json");
        var elsewhere = _temp.Write($".batch-plan.json.{EndedProcessId()}.{Guid.NewGuid():N}.tmp", "another machine's write");

        AtomicFile.WriteTextInSharedFolder(target, w => w.Write("{}"), overwrite: true);

        Assert.True(File.Exists(elsewhere));
        Assert.Equal("{}", File.ReadAllText(target));
    }

    /// <summary>The id of a process that has ended (a short child, waited for).</summary>
    internal static int EndedProcessId()
    {
        using var child = Process.Start(new ProcessStartInfo("dotnet", "--version") { RedirectStandardOutput = true, UseShellExecute = false })!;
        child.StandardOutput.ReadToEnd();
        child.WaitForExit();
        return child.Id;
    }
}
