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
    public static CliResult RunDll(string dll, string workingDirectory, params string[] args)
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
        using var process = Process.Start(start)!;
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
