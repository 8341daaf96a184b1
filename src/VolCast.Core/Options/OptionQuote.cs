namespace VolCast.Core.Options;

/// <summary>One recorded option price with the market data needed to invert it.</summary>
/// <remarks>
/// Values are kept as recorded: a zero price, an expiry on the quote date or a non-positive strike are not
/// errors here but are counted and reported by <see cref="ConstantTenorSeries"/>. Only the rate and the
/// dividend yield must be finite numbers, because no quote can be judged without them.
/// </remarks>
public sealed record OptionQuote
{
    /// <summary>Creates a quote.</summary>
    /// <param name="date">The quote date.</param>
    /// <param name="underlying">The underlying price S at the time of the quote.</param>
    /// <param name="expiry">The expiry date.</param>
    /// <param name="strike">The strike K.</param>
    /// <param name="type">Call or put.</param>
    /// <param name="price">The option price (mid or last, as recorded).</param>
    /// <param name="rate">Continuously compounded risk-free rate r (decimal per year) to the expiry.</param>
    /// <param name="dividendYield">Continuous dividend yield q (decimal per year).</param>
    /// <param name="sourceLine">The 1-based line the quote came from, or 0 when it has none; used only in diagnostics.</param>
    /// <exception cref="ArgumentOutOfRangeException">The rate or yield is not finite, or the line is negative.</exception>
    public OptionQuote(DateOnly date, double underlying, DateOnly expiry, double strike, OptionType type, double price, double rate, double dividendYield, int sourceLine = 0)
    {
        Preconditions.Finite(rate);
        Preconditions.Finite(dividendYield);
        ArgumentOutOfRangeException.ThrowIfNegative(sourceLine);
        Date = date;
        Underlying = underlying;
        Expiry = expiry;
        Strike = strike;
        Type = type;
        Price = price;
        Rate = rate;
        DividendYield = dividendYield;
        SourceLine = sourceLine;
    }

    /// <summary>Gets the quote date.</summary>
    public DateOnly Date { get; }

    /// <summary>Gets the underlying price S.</summary>
    public double Underlying { get; }

    /// <summary>Gets the expiry date.</summary>
    public DateOnly Expiry { get; }

    /// <summary>Gets the strike K.</summary>
    public double Strike { get; }

    /// <summary>Gets whether this is a call or a put.</summary>
    public OptionType Type { get; }

    /// <summary>Gets the option price.</summary>
    public double Price { get; }

    /// <summary>Gets the continuously compounded risk-free rate r.</summary>
    public double Rate { get; }

    /// <summary>Gets the continuous dividend yield q.</summary>
    public double DividendYield { get; }

    /// <summary>Gets the 1-based source line, or 0.</summary>
    public int SourceLine { get; }
}
