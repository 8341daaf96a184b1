using System.Globalization;
using VolCast.Core.Data;

namespace VolCast.Core.Estimators;

/// <summary>Rolling annualized realized volatility of a price history, one estimator and one window at a time.</summary>
/// <remarks>
/// Conventions are those of <see cref="EstimatorTerms"/>: a window of N at date t uses bars t − N + 1 .. t;
/// volatility = sqrt(A · daily variance), A = 252 by default. Close-to-close defaults to the sample standard
/// deviation of N log returns (mean removed, divisor N − 1; Hull's convention); <c>zeroMean</c> selects Σr²/N.
/// Close-to-close and Yang-Zhang need N + 1 rows (returns and overnight gaps use the previous close);
/// Parkinson, Garman-Klass and Rogers-Satchell need N. For a sweep of windows build one
/// <see cref="EstimatorTerms"/> and read every window from it.
/// </remarks>
public static class RollingVolatility
{
    /// <summary>Computes one estimator's rolling annualized volatility for every date with a full window.</summary>
    /// <param name="prices">The price history.</param>
    /// <param name="estimator">The estimator.</param>
    /// <param name="window">The window N in trading days, at least 2.</param>
    /// <param name="annualizationFactor">Trading days per year A, finite and positive.</param>
    /// <param name="zeroMean">Close-to-close only: true for Σr²/N instead of the sample variance; ignored otherwise.</param>
    /// <returns>The series; its first value is at history index <see cref="BarsNeeded"/> − 1.</returns>
    /// <exception cref="ArgumentNullException"><paramref name="prices"/> is null.</exception>
    /// <exception cref="ArgumentOutOfRangeException">The window is below 2 or longer than the history allows, the
    /// estimator is undefined, or the annualization factor is not finite and positive.</exception>
    /// <exception cref="ArgumentException">A range-based estimator on a close-only history.</exception>
    public static VolatilitySeries Compute(PriceHistory prices, Estimator estimator, int window, double annualizationFactor = 252, bool zeroMean = false)
    {
        ArgumentNullException.ThrowIfNull(prices);
        EstimatorNames.CheckDefined(estimator, nameof(estimator));
        Preconditions.AtLeast(window, EstimatorNames.MinimumWindow, "trading days");
        CheckColumns(estimator, prices.HasRange, nameof(prices));
        CheckFits(estimator, window, prices.Count, nameof(window));
        Preconditions.Positive(annualizationFactor, "number of periods per year (such as 252)");
        return EstimatorTerms.From(prices).Volatility(estimator, window, annualizationFactor, zeroMean);
    }

    /// <summary>Returns how many rows of history one value of an estimator needs.</summary>
    /// <param name="estimator">The estimator.</param>
    /// <param name="window">The window N in trading days, at least 2.</param>
    /// <returns>N + 1 for close-to-close and Yang-Zhang (they use the previous close); N for the others.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The estimator is undefined or the window is below 2.</exception>
    public static int BarsNeeded(Estimator estimator, int window)
    {
        EstimatorNames.CheckDefined(estimator, nameof(estimator));
        Preconditions.AtLeast(window, EstimatorNames.MinimumWindow, "trading days");
        return estimator is Estimator.CloseToClose or Estimator.YangZhang ? checked(window + 1) : window;
    }

    /// <summary>Returns Yang and Zhang's weight k = 0.34 / (1.34 + (N + 1)/(N − 1)) on the open-to-close variance.</summary>
    /// <param name="window">The window N in trading days, at least 2.</param>
    /// <returns>k, between 0.1 and 0.1453.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The window is below 2.</exception>
    public static double YangZhangK(int window)
    {
        Preconditions.AtLeast(window, EstimatorNames.MinimumWindow, "trading days");
        return 0.34 / (1.34 + ((window + 1.0) / (window - 1.0)));
    }

    /// <summary>Checks that a history has enough rows for one value of the estimator.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The window needs more rows than the history has.</exception>
    internal static void CheckFits(Estimator estimator, int window, int rowsAvailable, string paramName)
    {
        var needed = BarsNeeded(estimator, window);
        if (needed > rowsAvailable)
        {
            throw new ArgumentOutOfRangeException(paramName, window, string.Create(CultureInfo.InvariantCulture,
                $"A {EstimatorNames.Name(estimator)} window of {window} trading days needs {needed} rows of price history, but only {rowsAvailable} rows are available; use a window of at most {rowsAvailable - (needed - window)} or a longer history."));
        }
    }

    /// <summary>Checks that a range-based estimator is not asked of a close-only history.</summary>
    /// <exception cref="ArgumentException">The estimator needs open, high and low and the history has closes only.</exception>
    internal static void CheckColumns(Estimator estimator, bool hasRange, string paramName)
    {
        if (!hasRange && EstimatorNames.NeedsRange(estimator))
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"The {EstimatorNames.Name(estimator)} estimator needs the open, high and low columns, but this price history has closes only (missing columns: open, high, low). Use close-to-close, or supply a file with date, open, high, low, close."), paramName);
        }
    }
}
