namespace VolCast.Core.Options;

/// <summary>How an implied-volatility solve ended.</summary>
public enum ImpliedVolatilityStatus
{
    /// <summary>A volatility was found that reprices the option.</summary>
    Solved,

    /// <summary>The price is at or below the discounted intrinsic value on the forward, max(±(F − K), 0)·e^{−rT}: no volatility above zero gives it.</summary>
    BelowIntrinsic,

    /// <summary>The price is at or above the no-arbitrage upper bound (S e^{−qT} for a call, K e^{−rT} for a put).</summary>
    AboveUpperBound,

    /// <summary>The option is so deep in or out of the money that the price, in double precision, does not pin the volatility down.</summary>
    VegaTooSmall,

    /// <summary>The option has no time left: the expiry is on or before the quote date.</summary>
    Expired,

    /// <summary>A price, underlying, forward or strike is zero, negative or not a finite number, or a rate is not finite.</summary>
    NonPositiveInput,

    /// <summary>The iteration limit was reached before the volatility was pinned down (not expected in practice).</summary>
    NotConverged,
}
