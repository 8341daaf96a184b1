using System.Globalization;

namespace VolCast.Core.Estimators;

/// <summary>A rolling annualized volatility series read against a price history by index.</summary>
/// <remarks>
/// Element i of <see cref="AnnualizedVolatility"/> is the estimate at the close of history index
/// <see cref="FirstIndex"/> + i, from the window ending on that day (inclusive). Values are decimals (0.20 = 20%).
/// Instances are immutable.
/// </remarks>
public sealed class VolatilitySeries
{
    private readonly double[] _values;

    /// <summary>Creates a series from values, which are copied.</summary>
    /// <param name="estimator">The estimator that produced the values.</param>
    /// <param name="window">The window in trading days, at least 2.</param>
    /// <param name="firstIndex">History index of the first value, not negative.</param>
    /// <param name="annualizedVolatility">The values, finite and not negative.</param>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of its range.</exception>
    public VolatilitySeries(Estimator estimator, int window, int firstIndex, ReadOnlySpan<double> annualizedVolatility)
        : this(estimator, window, firstIndex, annualizedVolatility.ToArray())
    {
        EstimatorNames.CheckDefined(estimator, nameof(estimator));
        Preconditions.AtLeast(window, EstimatorNames.MinimumWindow, "trading days");
        ArgumentOutOfRangeException.ThrowIfNegative(firstIndex);
        for (var i = 0; i < _values.Length; i++)
        {
            var v = _values[i];
            Preconditions.NonNegativeAt(v, i, "volatility", nameof(annualizedVolatility));
        }
    }

    private VolatilitySeries(Estimator estimator, int window, int firstIndex, double[] values)
    {
        Estimator = estimator;
        Window = window;
        FirstIndex = firstIndex;
        _values = values;
    }

    /// <summary>Wraps an array the caller hands over and no longer touches (no copy, no checks).</summary>
    internal static VolatilitySeries Adopt(Estimator estimator, int window, int firstIndex, double[] values) =>
        new(estimator, window, firstIndex, values);

    /// <summary>Gets the estimator that produced the values.</summary>
    public Estimator Estimator { get; }

    /// <summary>Gets the window in trading days.</summary>
    public int Window { get; }

    /// <summary>Gets the index into the price history of the first date with a full window.</summary>
    public int FirstIndex { get; }

    /// <summary>Gets the number of values.</summary>
    public int Count => _values.Length;

    /// <summary>Gets the annualized volatilities; element i is for history index <see cref="FirstIndex"/> + i.</summary>
    public ReadOnlySpan<double> AnnualizedVolatility => _values;
}
