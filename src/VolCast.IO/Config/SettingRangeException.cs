namespace VolCast.IO.Config;

/// <summary>A numeric setting outside its documented range (<see cref="SettingLimits"/>); the command line maps it to exit code 2.</summary>
public sealed class SettingRangeException : Exception
{
    /// <summary>Creates the error.</summary>
    /// <param name="message">The setting, its range and the value given.</param>
    public SettingRangeException(string message)
        : base(message)
    {
    }

    /// <summary>Creates the error with no message.</summary>
    public SettingRangeException()
    {
    }

    /// <summary>Creates the error with a cause.</summary>
    /// <param name="message">The message.</param>
    /// <param name="innerException">The cause.</param>
    public SettingRangeException(string message, Exception innerException)
        : base(message, innerException)
    {
    }
}
