namespace VolCast.Core.Demo;

/// <summary>
/// How one invented asset of the demo behaves: its volatility regimes, the dynamics of its log-volatility, its jumps
/// and the premium its implied volatility carries. The defaults are the demo index (Alder Ridge Composite).
/// </summary>
/// <remarks>
/// Volatilities are annualized decimals (0.16 = 16%) with 252 trading days a year. Regime windows are in years from
/// the first date, with smooth (logistic) edges; a window past the end of the sample simply never arrives.
/// </remarks>
/// <param name="BaseVolatility">The usual regime level.</param>
/// <param name="CalmVolatility">The level in the calm window.</param>
/// <param name="StressedVolatility">The level in the stressed window.</param>
/// <param name="CalmFromYear">Start of the calm window, in years from the first date.</param>
/// <param name="CalmToYear">End of the calm window.</param>
/// <param name="StressFromYear">Start of the stressed window.</param>
/// <param name="StressToYear">End of the stressed window.</param>
/// <param name="Persistence">Daily AR(1) persistence of log-volatility around its regime level, in [0, 1).</param>
/// <param name="LogVolatilityShock">Standard deviation of the daily shock to log-volatility.</param>
/// <param name="Leverage">Correlation of the log-volatility shock with the previous day's return shock, in (−1, 1).</param>
/// <param name="JumpProbability">Chance of a jump on a day, in [0, 1).</param>
/// <param name="JumpMean">Mean jump size as a log return.</param>
/// <param name="MeanPremium">Mean premium of implied over the model's expected volatility, in volatility points (decimal).</param>
/// <param name="StartPrice">The first open's reference price.</param>
public sealed record DemoAssetParameters(
    double BaseVolatility = 0.16,
    double CalmVolatility = 0.10,
    double StressedVolatility = 0.38,
    double CalmFromYear = 2,
    double CalmToYear = 5,
    double StressFromYear = 8,
    double StressToYear = 9.5,
    double Persistence = 0.985,
    double LogVolatilityShock = 0.05,
    double Leverage = -0.55,
    double JumpProbability = 1.0 / 250,
    double JumpMean = -0.04,
    double MeanPremium = 0.025,
    double StartPrice = 1000)
{
    /// <summary>Gets the demo index's parameters (the defaults).</summary>
    public static DemoAssetParameters Index { get; } = new();

    /// <summary>Checks every parameter is in range.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is out of range; the message names it and its value.</exception>
    public void Validate()
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(BaseVolatility);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(CalmVolatility);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(StressedVolatility);
        ArgumentOutOfRangeException.ThrowIfNegative(Persistence);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(Persistence, 1.0);
        ArgumentOutOfRangeException.ThrowIfNegative(LogVolatilityShock);
        ArgumentOutOfRangeException.ThrowIfLessThanOrEqual(Leverage, -1.0);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(Leverage, 1.0);
        ArgumentOutOfRangeException.ThrowIfNegative(JumpProbability);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(JumpProbability, 1.0);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(StartPrice);
    }
}
