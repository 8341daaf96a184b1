namespace VolCast.Core.Scoring;

/// <summary>
/// A per-observation loss of a volatility forecast F against a realized volatility RV, both annualized
/// decimals. Variance losses rank forecasts consistently when RV is a noisy but unbiased proxy (Patton 2011);
/// volatility losses are for intuition, not for ranking.
/// </summary>
public enum LossFunction
{
    /// <summary>Squared error on variance, (F² − RV²)²; robust to a noisy proxy.</summary>
    SquaredErrorVariance,

    /// <summary>Normalized QLIKE on variance, RV²/F² − ln(RV²/F²) − 1; at least 0, and 0 exactly at F = RV. Needs RV &gt; 0.</summary>
    Qlike,

    /// <summary>
    /// Unnormalized QLIKE on variance, ln F² + RV²/F² (Patton 2011's form); differs from <see cref="Qlike"/> by a
    /// term free of the forecast, so loss differentials are identical, and it accepts RV = 0.
    /// </summary>
    QlikeUnnormalized,

    /// <summary>Absolute error on volatility, |F − RV|; not robust to a noisy proxy.</summary>
    AbsoluteErrorVolatility,

    /// <summary>Squared error on volatility, (F − RV)²; not robust to a noisy proxy.</summary>
    SquaredErrorVolatility,
}
