namespace VolCast.Core.Backtest;

/// <summary>
/// The data cannot support the backtest asked for (a horizon longer than the history, no date shared by prices and
/// implied, a selection window longer than the sample); the message names the numbers and what would fix it.
/// </summary>
public sealed class BacktestDataException : Exception
{
    /// <summary>Gets the input at fault, so a caller can name its file: the prices unless the exception says otherwise.</summary>
    public BacktestInput Input { get; } = BacktestInput.Prices;

    /// <summary>Creates the exception with its message.</summary>
    /// <param name="message">What was wrong, with the numbers, and what would fix it.</param>
    public BacktestDataException(string message)
        : base(message)
    {
    }

    /// <summary>Creates the exception with its message and the input at fault.</summary>
    /// <param name="message">What was wrong, with the numbers, and what would fix it.</param>
    /// <param name="input">The input whose data cannot support the backtest.</param>
    public BacktestDataException(string message, BacktestInput input)
        : base(message)
    {
        Input = input;
    }

    /// <summary>Creates the exception with an empty message.</summary>
    public BacktestDataException()
    {
    }

    /// <summary>Creates the exception wrapping another.</summary>
    /// <param name="message">What was wrong.</param>
    /// <param name="innerException">The cause.</param>
    public BacktestDataException(string message, Exception innerException)
        : base(message, innerException)
    {
    }
}
