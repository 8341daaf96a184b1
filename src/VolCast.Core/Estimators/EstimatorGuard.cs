using System.Globalization;

namespace VolCast.Core.Estimators;

/// <summary>Argument checks shared by the estimator entry points; messages give the rule and the actual value.</summary>
internal static class EstimatorGuard
{
    /// <summary>The shortest window any estimator accepts: a sample variance needs two observations.</summary>
    public const int MinimumWindow = 2;

    /// <summary>Checks that an estimator value is one of the defined members.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is not defined.</exception>
    public static void Defined(Estimator estimator, string paramName)
    {
        if (estimator is < Estimator.CloseToClose or > Estimator.YangZhang)
        {
            throw new ArgumentOutOfRangeException(paramName, estimator, string.Create(CultureInfo.InvariantCulture,
                $"{paramName} must be one of close-to-close, parkinson, garman-klass, rogers-satchell, yang-zhang (was {(int)estimator})."));
        }
    }

    /// <summary>Checks that a window is at least <see cref="MinimumWindow"/> trading days.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The window is below two.</exception>
    public static void Window(int window, string paramName) => Guard.WindowAtLeast(window, MinimumWindow, paramName);

    /// <summary>Checks that a history has enough rows for one value of the estimator.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The window needs more rows than the history has.</exception>
    public static void Fits(Estimator estimator, int window, int rowsAvailable, string paramName)
    {
        var needed = RollingVolatility.BarsNeeded(estimator, window);
        if (needed > rowsAvailable)
        {
            throw new ArgumentOutOfRangeException(paramName, window, string.Create(CultureInfo.InvariantCulture,
                $"A {EstimatorNames.Name(estimator)} window of {window} trading days needs {needed} rows of price history, but only {rowsAvailable} rows are available; use a window of at most {rowsAvailable - (needed - window)} or a longer history."));
        }
    }

    /// <summary>Checks that a range-based estimator is not asked of a close-only history.</summary>
    /// <exception cref="ArgumentException">The estimator needs open, high and low and the history has closes only.</exception>
    public static void HasColumns(Estimator estimator, bool hasRange, string paramName)
    {
        if (!hasRange && EstimatorNames.NeedsRange(estimator))
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"The {EstimatorNames.Name(estimator)} estimator needs the open, high and low columns, but this price history has closes only (missing columns: open, high, low). Use close-to-close, or supply a file with date, open, high, low, close."), paramName);
        }
    }

    /// <summary>Checks that an annualization factor is finite and positive.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The factor is NaN, infinite, zero or negative.</exception>
    public static void AnnualizationFactor(double value, string paramName)
    {
        if (!double.IsFinite(value) || value <= 0)
        {
            throw new ArgumentOutOfRangeException(paramName, value, string.Create(CultureInfo.InvariantCulture,
                $"{paramName} must be a finite number of periods per year above zero, such as 252 (was {value})."));
        }
    }
}
