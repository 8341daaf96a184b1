using System.Globalization;

namespace VolCast.Core.Options;

/// <summary>The outcome of an implied-volatility solve: a volatility when <see cref="Status"/> is
/// <see cref="ImpliedVolatilityStatus.Solved"/>, otherwise the reason there is none.</summary>
/// <remarks>A failed solve carries no number at all: never NaN and never a clamped value.</remarks>
public readonly record struct ImpliedVolatilityResult
{
    private readonly double _volatility;

    private ImpliedVolatilityResult(ImpliedVolatilityStatus status, double volatility, int iterations)
    {
        Status = status;
        _volatility = volatility;
        Iterations = iterations;
    }

    /// <summary>Gets how the solve ended.</summary>
    public ImpliedVolatilityStatus Status { get; }

    /// <summary>Gets the number of price evaluations the solve used.</summary>
    public int Iterations { get; }

    /// <summary>Gets whether a volatility was found.</summary>
    public bool IsSolved => Status == ImpliedVolatilityStatus.Solved;

    /// <summary>Gets the annualized implied volatility (decimal) when solved, otherwise null.</summary>
    public double? Volatility => IsSolved ? _volatility : null;

    /// <summary>Creates a solved result.</summary>
    /// <param name="volatility">The implied volatility, finite and above zero.</param>
    /// <param name="iterations">The number of price evaluations used.</param>
    /// <returns>The result.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The volatility is not finite and above zero.</exception>
    public static ImpliedVolatilityResult Solved(double volatility, int iterations)
    {
        Preconditions.Positive(volatility);
        return new ImpliedVolatilityResult(ImpliedVolatilityStatus.Solved, volatility, iterations);
    }

    /// <summary>Creates a failed result.</summary>
    /// <param name="status">Why there is no volatility; not <see cref="ImpliedVolatilityStatus.Solved"/>.</param>
    /// <param name="iterations">The number of price evaluations used.</param>
    /// <returns>The result.</returns>
    /// <exception cref="ArgumentException"><paramref name="status"/> is <see cref="ImpliedVolatilityStatus.Solved"/>.</exception>
    public static ImpliedVolatilityResult Failed(ImpliedVolatilityStatus status, int iterations = 0)
    {
        if (status == ImpliedVolatilityStatus.Solved)
        {
            throw new ArgumentException("A failed result needs a failure status, was Solved; use Solved(volatility) instead.", nameof(status));
        }

        return new ImpliedVolatilityResult(status, 0, iterations);
    }

    /// <inheritdoc/>
    public override string ToString() => IsSolved
        ? string.Create(CultureInfo.InvariantCulture, $"Solved({_volatility:R}, {Iterations} evaluations)")
        : string.Create(CultureInfo.InvariantCulture, $"{Status}");
}
