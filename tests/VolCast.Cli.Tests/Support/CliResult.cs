namespace VolCast.Cli.Tests.Support;

/// <summary>What one run of the command line produced.</summary>
internal sealed record CliResult(int ExitCode, string Stdout, string Stderr);
