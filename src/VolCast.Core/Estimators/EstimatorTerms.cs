using System.Buffers;
using System.Globalization;
using VolCast.Core.Data;

namespace VolCast.Core.Estimators;

/// <summary>
/// The per-bar daily variance terms of one price history, computed once, from which every estimator at every
/// window is read in O(n): build one per history and reuse it for a sweep of windows and estimators.
/// </summary>
/// <remarks>
/// <para>
/// Conventions (docs/methods.md#parkinson to #yang-zhang and docs/methods.md#close-to-close-and-annualisation). A window of N at history index t uses bars t − N + 1 .. t.
/// All values are daily variances (not annualized).
/// </para>
/// <list type="bullet">
/// <item><description>Close-to-close: the N log returns r = ln(C_t / C_{t−1}) ending at t, so a window needs
/// N + 1 closes. Default: sample variance, mean removed, divisor N − 1 (Hull's convention);
/// with <c>zeroMean</c>: Σr² / N.</description></item>
/// <item><description>Parkinson, Garman-Klass, Rogers-Satchell: the mean of the N bars' terms
/// (<see cref="BarVariance"/>), divisor N; they use no previous close, so a window needs N bars.</description></item>
/// <item><description>Yang-Zhang: V_O + k·V_C + (1 − k)·V_RS, with V_O the sample variance (divisor N − 1) of the
/// overnight returns o = ln(O_t / C_{t−1}), V_C the sample variance (divisor N − 1) of c = ln(C_t / O_t),
/// V_RS the Rogers-Satchell mean (divisor N) and k = 0.34 / (1.34 + (N + 1)/(N − 1)). The overnight return
/// needs the previous close, so a window needs N + 1 closes.</description></item>
/// </list>
/// <para>
/// Window sums come from prefix sums kept in double-double form (error-free TwoSum additions), so values do not
/// drift along a long history. Sample variances are (Σx² − (Σx)²/N)/(N − 1) from these sums with the
/// subtraction carried in double-double, so a quiet window after a turbulent one keeps full precision; a window
/// of identical returns gives exactly zero. Instances are immutable and safe to share between threads.
/// </para>
/// </remarks>
internal sealed class EstimatorTerms
{
    private readonly PrefixSum _closeReturn;
    private readonly PrefixSum _closeReturnSquared;
    private readonly PrefixSum? _parkinson;
    private readonly PrefixSum? _garmanKlass;
    private readonly PrefixSum? _rogersSatchell;
    private readonly PrefixSum? _overnight;
    private readonly PrefixSum? _overnightSquared;
    private readonly PrefixSum? _openToClose;
    private readonly PrefixSum? _openToCloseSquared;

    private EstimatorTerms(PriceHistory prices)
    {
        Count = prices.Count;
        HasRange = prices.HasRange;
        var n = prices.Count;
        var close = prices.Close;

        // The per-bar series live in pooled scratch buffers only while the prefix sums are built.
        var pool = ArrayPool<double>.Shared;
        var first = pool.Rent(n);
        try
        {
            var series = first.AsSpan(0, n);

            // Element 0 of every series that needs the previous close is never inside a window; it is left at zero.
            series.Clear();
            for (var t = 1; t < series.Length; t++)
            {
                series[t] = Math.Log(close[t] / close[t - 1]);
            }

            _closeReturn = new PrefixSum(series);
            _closeReturnSquared = new PrefixSum(series, squares: true);
            if (!HasRange)
            {
                return;
            }

            var open = prices.Open;
            var high = prices.High;
            var low = prices.Low;
            var second = pool.Rent(n);
            var third = pool.Rent(n);
            var fourth = pool.Rent(n);
            var fifth = pool.Rent(n);
            try
            {
                var parkinson = second.AsSpan(0, n);
                var garmanKlass = third.AsSpan(0, n);
                var rogersSatchell = fourth.AsSpan(0, n);
                var openToClose = fifth.AsSpan(0, n);
                for (var t = 0; t < series.Length; t++)
                {
                    var o = open[t];
                    var u = Math.Log(high[t] / o);
                    var d = Math.Log(low[t] / o);
                    var c = Math.Log(close[t] / o);
                    parkinson[t] = BarVariance.ParkinsonFromLogs(u, d);
                    garmanKlass[t] = BarVariance.GarmanKlassFromLogs(u, d, c);
                    rogersSatchell[t] = BarVariance.RogersSatchellFromLogs(u, d, c);
                    openToClose[t] = c;
                    series[t] = t > 0 ? Math.Log(o / close[t - 1]) : 0.0;
                }

                _parkinson = new PrefixSum(parkinson);
                _garmanKlass = new PrefixSum(garmanKlass);
                _rogersSatchell = new PrefixSum(rogersSatchell);
                _overnight = new PrefixSum(series);
                _overnightSquared = new PrefixSum(series, squares: true);
                _openToClose = new PrefixSum(openToClose);
                _openToCloseSquared = new PrefixSum(openToClose, squares: true);
            }
            finally
            {
                pool.Return(second);
                pool.Return(third);
                pool.Return(fourth);
                pool.Return(fifth);
            }
        }
        finally
        {
            pool.Return(first);
        }
    }

    /// <summary>Gets the number of rows in the history the terms were built from.</summary>
    public int Count { get; }

    /// <summary>Gets a value indicating whether the history had open, high and low (range-based estimators work).</summary>
    public bool HasRange { get; }

    /// <summary>Computes the per-bar terms of a price history.</summary>
    /// <param name="prices">The history; a close-only history supports close-to-close only.</param>
    /// <returns>Terms from which any estimator and window can be read.</returns>
    /// <exception cref="ArgumentNullException"><paramref name="prices"/> is null.</exception>
    public static EstimatorTerms From(PriceHistory prices)
    {
        ArgumentNullException.ThrowIfNull(prices);
        return new EstimatorTerms(prices);
    }

    /// <summary>Returns the history index of the first date with a full window.</summary>
    /// <param name="estimator">The estimator.</param>
    /// <param name="window">The window in trading days, at least 2.</param>
    /// <returns><see cref="RollingVolatility.BarsNeeded"/> − 1.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The estimator is undefined or the window is below 2.</exception>
    public static int FirstIndex(Estimator estimator, int window) => RollingVolatility.BarsNeeded(estimator, window) - 1;

    /// <summary>Returns how many rolling values this history gives for an estimator and window.</summary>
    /// <param name="estimator">The estimator.</param>
    /// <param name="window">The window in trading days, at least 2.</param>
    /// <returns><see cref="Count"/> − <see cref="FirstIndex"/>, or zero when the history is too short.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The estimator is undefined or the window is below 2.</exception>
    public int ValueCount(Estimator estimator, int window) => Math.Max(0, Count - FirstIndex(estimator, window));

    /// <summary>Writes the rolling daily variance (not annualized) of an estimator for every date with a full window.</summary>
    /// <param name="estimator">The estimator.</param>
    /// <param name="window">The window N in trading days, at least 2.</param>
    /// <param name="destination">Receives element i for history index <see cref="FirstIndex"/> + i; at least
    /// <see cref="ValueCount"/> long.</param>
    /// <param name="zeroMean">Close-to-close only: true for Σr²/N, false (default) for the sample variance with divisor N − 1. Ignored by the other estimators.</param>
    /// <returns>The number of values written, <see cref="ValueCount"/>.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The estimator is undefined, the window is below 2, or the window
    /// needs more rows than the history has.</exception>
    /// <exception cref="ArgumentException">A range-based estimator on a close-only history, or
    /// <paramref name="destination"/> is too short.</exception>
    public int RollingDailyVariance(Estimator estimator, int window, Span<double> destination, bool zeroMean = false)
    {
        var count = Validate(estimator, window);
        if (destination.Length < count)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"destination must hold at least {count} values for a window of {window} over {Count} rows, was {destination.Length}."), nameof(destination));
        }

        var first = FirstIndex(estimator, window);
        var output = destination[..count];
        switch (estimator)
        {
            case Estimator.CloseToClose when zeroMean:
                Mean(_closeReturnSquared, window, first, output);
                break;
            case Estimator.CloseToClose:
                SampleVariance(_closeReturn, _closeReturnSquared, window, first, output);
                break;
            case Estimator.Parkinson:
                Mean(_parkinson!, window, first, output);
                break;
            case Estimator.GarmanKlass:
                Mean(_garmanKlass!, window, first, output);
                break;
            case Estimator.RogersSatchell:
                Mean(_rogersSatchell!, window, first, output);
                break;
            default:
                YangZhang(window, first, output);
                break;
        }

        return count;
    }

    /// <summary>Returns the rolling daily variance (not annualized) of an estimator as a new array.</summary>
    /// <param name="estimator">The estimator.</param>
    /// <param name="window">The window N in trading days, at least 2.</param>
    /// <param name="zeroMean">Close-to-close only: true for Σr²/N, false (default) for the sample variance.</param>
    /// <returns>Element i is for history index <see cref="FirstIndex"/> + i.</returns>
    /// <exception cref="ArgumentOutOfRangeException">See <see cref="RollingDailyVariance(Estimator, int, Span{double}, bool)"/>.</exception>
    /// <exception cref="ArgumentException">A range-based estimator on a close-only history.</exception>
    public double[] RollingDailyVariance(Estimator estimator, int window, bool zeroMean = false)
    {
        var values = new double[Validate(estimator, window)];
        RollingDailyVariance(estimator, window, values, zeroMean);
        return values;
    }

    /// <summary>Writes the rolling annualized volatility sqrt(A · daily variance) for every date with a full window.</summary>
    /// <param name="estimator">The estimator.</param>
    /// <param name="window">The window N in trading days, at least 2.</param>
    /// <param name="destination">Receives element i for history index <see cref="FirstIndex"/> + i.</param>
    /// <param name="annualizationFactor">Trading days per year A, finite and positive; 252 by default.</param>
    /// <param name="zeroMean">Close-to-close only: true for the zero-mean convention.</param>
    /// <returns>The number of values written.</returns>
    /// <exception cref="ArgumentOutOfRangeException">See <see cref="RollingDailyVariance(Estimator, int, Span{double}, bool)"/>,
    /// or the annualization factor is not finite and positive.</exception>
    /// <exception cref="ArgumentException">A range-based estimator on a close-only history, or the destination is too short.</exception>
    public int RollingAnnualizedVolatility(Estimator estimator, int window, Span<double> destination, double annualizationFactor = 252, bool zeroMean = false)
    {
        Preconditions.Positive(annualizationFactor, "number of periods per year (such as 252)");
        var count = RollingDailyVariance(estimator, window, destination, zeroMean);
        for (var i = 0; i < count; i++)
        {
            destination[i] = Math.Sqrt(annualizationFactor * destination[i]);
        }

        return count;
    }

    /// <summary>Returns the rolling annualized volatility of an estimator as a series.</summary>
    /// <param name="estimator">The estimator.</param>
    /// <param name="window">The window N in trading days, at least 2.</param>
    /// <param name="annualizationFactor">Trading days per year A, finite and positive; 252 by default.</param>
    /// <param name="zeroMean">Close-to-close only: true for the zero-mean convention.</param>
    /// <returns>The series, one value per date with a full window.</returns>
    /// <exception cref="ArgumentOutOfRangeException">See <see cref="RollingAnnualizedVolatility(Estimator, int, Span{double}, double, bool)"/>.</exception>
    /// <exception cref="ArgumentException">A range-based estimator on a close-only history.</exception>
    public VolatilitySeries Volatility(Estimator estimator, int window, double annualizationFactor = 252, bool zeroMean = false)
    {
        Preconditions.Positive(annualizationFactor, "number of periods per year (such as 252)");
        var values = new double[Validate(estimator, window)];
        RollingAnnualizedVolatility(estimator, window, values, annualizationFactor, zeroMean);
        return VolatilitySeries.Adopt(estimator, window, FirstIndex(estimator, window), values);
    }

    /// <summary>Writes Yang-Zhang's three parts (V_O, V_C, V_RS), daily variances, for every date with a full window.</summary>
    internal void RollingYangZhangParts(int window, Span<double> overnight, Span<double> openToClose, Span<double> rogersSatchell)
    {
        var count = Validate(Estimator.YangZhang, window);
        var first = FirstIndex(Estimator.YangZhang, window);
        SampleVariance(_overnight!, _overnightSquared!, window, first, overnight[..count]);
        SampleVariance(_openToClose!, _openToCloseSquared!, window, first, openToClose[..count]);
        Mean(_rogersSatchell!, window, first, rogersSatchell[..count]);
    }

    private int Validate(Estimator estimator, int window)
    {
        EstimatorNames.CheckDefined(estimator, nameof(estimator));
        Preconditions.AtLeast(window, EstimatorNames.MinimumWindow, "trading days");
        RollingVolatility.CheckColumns(estimator, HasRange, nameof(estimator));
        RollingVolatility.CheckFits(estimator, window, Count, nameof(window));
        return Count - FirstIndex(estimator, window);
    }

    private static void Mean(PrefixSum terms, int window, int first, Span<double> output)
    {
        var scale = 1.0 / window;
        for (var i = 0; i < output.Length; i++)
        {
            output[i] = terms.Window(first + i, window) * scale;
        }
    }

    private static void SampleVariance(PrefixSum sum, PrefixSum sumOfSquares, int window, int first, Span<double> output)
    {
        for (var i = 0; i < output.Length; i++)
        {
            output[i] = PrefixSum.SampleVariance(sum, sumOfSquares, first + i, window);
        }
    }

    private void YangZhang(int window, int first, Span<double> output)
    {
        var k = RollingVolatility.YangZhangK(window);
        var n = (double)window;
        var overnight = _overnight!;
        var overnightSquared = _overnightSquared!;
        var openToClose = _openToClose!;
        var openToCloseSquared = _openToCloseSquared!;
        var rogersSatchell = _rogersSatchell!;
        for (var i = 0; i < output.Length; i++)
        {
            var t = first + i;
            var vo = PrefixSum.SampleVariance(overnight, overnightSquared, t, window);
            var vc = PrefixSum.SampleVariance(openToClose, openToCloseSquared, t, window);
            var vrs = rogersSatchell.Window(t, window) / n;
            output[i] = vo + (k * vc) + ((1 - k) * vrs);
        }
    }
}
