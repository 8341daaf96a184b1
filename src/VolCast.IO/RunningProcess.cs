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
    /// <returns>True when it runs; false when no such process exists or it has exited.</returns>
    public static bool IsRunning(int pid)
    {
        if (pid == Environment.ProcessId)
        {
            return true;
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
}
