namespace VolCast.TestSupport;

/// <summary>An assembly's generated public API differs from its approved file.</summary>
public sealed class PublicApiChangedException : Exception
{
    /// <summary>Creates the exception with the message that says where the files are and how to accept the change.</summary>
    public PublicApiChangedException(string message)
        : base(message)
    {
    }

    /// <summary>Creates the exception without a message.</summary>
    public PublicApiChangedException()
    {
    }

    /// <summary>Creates the exception with a message and the exception that caused it.</summary>
    public PublicApiChangedException(string message, Exception innerException)
        : base(message, innerException)
    {
    }
}
