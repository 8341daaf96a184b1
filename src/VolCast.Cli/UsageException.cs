namespace VolCast.Cli;

/// <summary>A command line that parsed but asks for something impossible; mapped to exit code 2.</summary>
internal sealed class UsageException(string message) : Exception(message);
