namespace VolCast.Core.Options;

/// <summary>Why a quote, an expiry or a date was rejected, or what was flagged about it.</summary>
public enum DiagnosticReason
{
    /// <summary>The quote's expiry is on or before its date.</summary>
    Expired,

    /// <summary>The price, underlying or strike is zero, negative or not a finite number.</summary>
    NonPositiveInput,

    /// <summary>Another quote with the same date, expiry, strike and type came first.</summary>
    Duplicate,

    /// <summary>The price is at or below the discounted intrinsic value.</summary>
    BelowIntrinsic,

    /// <summary>The price is at or above the no-arbitrage upper bound.</summary>
    AboveUpperBound,

    /// <summary>The price is too deep in or out of the money to pin the volatility down.</summary>
    VegaTooSmall,

    /// <summary>The solver reached its iteration limit.</summary>
    NotConverged,

    /// <summary>The quotes of one expiry disagree on the underlying price, the rate or the dividend yield.</summary>
    InconsistentInputs,

    /// <summary>No solved quotes lie on both sides of the forward, so there is no at-the-money volatility.</summary>
    ForwardOutsideStrikes,

    /// <summary>The date has no expiry with an at-the-money volatility.</summary>
    NoUsableExpiry,

    /// <summary>The tenor is shorter than the first usable expiry.</summary>
    TenorBeforeFirstExpiry,

    /// <summary>The tenor is longer than the last usable expiry.</summary>
    TenorAfterLastExpiry,

    /// <summary>A warning: the value was extrapolated flat from the nearest expiry.</summary>
    Extrapolated,

    /// <summary>A warning: total variance σ²T falls from the nearer to the farther expiry (a calendar arbitrage in the quotes).</summary>
    DecreasingTotalVariance,
}
