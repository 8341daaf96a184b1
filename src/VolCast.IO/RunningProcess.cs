using System.Diagnostics;

namespace VolCast.IO;

/// <summary>
/// Whether the process that named a temporary file or folder (<c>.NAME.PID.ID.tmp</c>) still runs on this machine, so
/// that what a killed run left can be told from what a live one is writing.
/// </summary>
public static class RunningProcess
{
    /// <summary>Whether a process with this id runs on this machine (this process counts as running).</summary>
    /// <param name="pid">The process id.</param>
    /// <returns>True when it runs; false when no such process exists, it has exited, or it is a zombie (it has ended and
    /// only waits for its parent to collect its exit status).</returns>
    public static bool IsRunning(int pid)
    {
        if (pid == Environment.ProcessId)
        {
            return true;
        }

        // A killed process whose parent died with it (timeout -s KILL kills its own group) is a zombie until the
        // system's first process collects it, which may take seconds or, in a container without an init, forever; the
        // runtime still finds it, so a rerun would keep what it left. Its state is the field after the name in
        // /proc/PID/stat (proc(5)); the name is in parentheses and may itself hold spaces or parentheses.
        if (OperatingSystem.IsLinux() && IsZombie(pid))
        {
            return false;
        }

        try
        {
            using var process = Process.GetProcessById(pid);
            return !process.HasExited;
        }
        catch (Exception ex) when (ex is ArgumentException or InvalidOperationException)
        {
            return false;
        }
    }

    private static bool IsZombie(int pid)
    {
        string stat;
        try
        {
            stat = File.ReadAllText($"/proc/{pid}/stat");
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            return false;
        }

        var end = stat.LastIndexOf(')');
        return end >= 0 && end + 2 < stat.Length && stat[end + 2] is 'Z' or 'X';
    }
}
