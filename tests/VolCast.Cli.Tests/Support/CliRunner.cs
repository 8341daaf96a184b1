using System.Diagnostics;

namespace VolCast.Cli.Tests.Support;

/// <summary>Runs the <c>volcast</c> command line, in-process (fast, most tests) or as the built executable (end to end).</summary>
internal static class CliRunner
{
    /// <summary>Runs <c>Program.Run</c> with captured writers.</summary>
    public static CliResult Run(params string[] args)
    {
        using var stdout = new StringWriter();
        using var stderr = new StringWriter();
        var code = Program.Run(args, stdout, stderr);
        return new CliResult(code, stdout.ToString(), stderr.ToString());
    }

    /// <summary>Runs the built executable (volcast.dll beside the test assembly) as a child process.</summary>
    public static CliResult RunProcess(string workingDirectory, params string[] args) =>
        RunDll(Path.Combine(AppContext.BaseDirectory, "volcast.dll"), workingDirectory, args);

    /// <summary>Runs a copy of the built executable at <paramref name="dll"/> as a child process.</summary>
    public static CliResult RunDll(string dll, string workingDirectory, params string[] args) => Finish(Start(dll, workingDirectory, null, args), args);

    /// <summary>Runs the built executable as a child process with <paramref name="environment"/> set (a null value unsets the variable).</summary>
    public static CliResult RunProcess(string workingDirectory, IReadOnlyDictionary<string, string?> environment, params string[] args) =>
        Finish(Start(Path.Combine(AppContext.BaseDirectory, "volcast.dll"), workingDirectory, environment, args), args);

    /// <summary>Starts the built executable as a child process and returns it running; <see cref="Finish"/> waits for it.</summary>
    public static Process StartProcess(string workingDirectory, params string[] args) =>
        Start(Path.Combine(AppContext.BaseDirectory, "volcast.dll"), workingDirectory, null, args);

    /// <summary>Waits for a started child process (at most 2 minutes) and collects what it wrote.</summary>
    public static CliResult Finish(Process process, string[] args)
    {
        ArgumentNullException.ThrowIfNull(process);
        using (process)
        {
            var stdout = process.StandardOutput.ReadToEndAsync();
            var stderr = process.StandardError.ReadToEndAsync();
            if (!process.WaitForExit(TimeSpan.FromMinutes(2)))
            {
                process.Kill(entireProcessTree: true);
                throw new TimeoutException($"volcast {string.Join(' ', args)} did not finish within 2 minutes.");
            }

            return new CliResult(process.ExitCode, stdout.Result, stderr.Result);
        }
    }

    private static Process Start(string dll, string workingDirectory, IReadOnlyDictionary<string, string?>? environment, string[] args)
    {
        var start = new ProcessStartInfo("dotnet")
        {
            WorkingDirectory = workingDirectory,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        start.ArgumentList.Add(dll);
        foreach (var arg in args)
        {
            start.ArgumentList.Add(arg);
        }

        start.Environment.Remove("VOLCAST_DEBUG");
        foreach (var name in new[] { "JOB_COMPLETION_INDEX", "SLURM_ARRAY_TASK_ID", "SLURM_ARRAY_TASK_COUNT", "SLURM_ARRAY_TASK_MIN", "SLURM_ARRAY_TASK_MAX" })
        {
            // A test run inside a scheduler must not hand its own shard to the child.
            start.Environment.Remove(name);
        }

        foreach (var (name, value) in environment ?? new Dictionary<string, string?>())
        {
            start.Environment[name] = value;
        }

        return Process.Start(start)!;
    }
}
