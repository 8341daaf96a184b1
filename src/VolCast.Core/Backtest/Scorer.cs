using System.Globalization;
using VolCast.Core.Scoring;

namespace VolCast.Core.Backtest;

/// <summary>
/// Scores forecast series on the scored dates with the Core scoring statistics, each on the dates where its inputs
/// exist; a statistic that cannot be computed (too few dates, collinear regressors) is null and leaves a warning.
/// </summary>
internal sealed class Scorer(double?[] realized, List<int> scored, int lag, int horizonDays, List<string> warnings)
{
    public LossSummary? Losses(string spec, double?[] forecast)
    {
        var (rv, f) = Aligned(forecast, null);
        return rv.Length == 0 ? null : Scoring.Losses.Summarize(rv, f);
    }

    public MincerZarnowitzResult? MincerZarnowitz(string spec, double?[] forecast)
    {
        var (rv, f) = Aligned(forecast, null);
        if (rv.Length < Math.Max(3, lag + 2))
        {
            return Skip<MincerZarnowitzResult>(spec, "Mincer-Zarnowitz", rv.Length);
        }

        try
        {
            return Scoring.MincerZarnowitz.FitWithLag(rv, f, lag);
        }
        catch (Exception ex) when (ex is ArgumentException or InvalidOperationException)
        {
            warnings.Add(Invariant($"{spec}: Mincer-Zarnowitz not computed: {ex.Message}"));
            return null;
        }
    }

    public EncompassingResult? Encompassing(string spec, double?[] forecast, double?[] implied)
    {
        var dates = Common(forecast, implied);
        if (dates.Count < Math.Max(4, lag + 2))
        {
            return Skip<EncompassingResult>(spec, "the encompassing regression", dates.Count);
        }

        var rv = new double[dates.Count];
        var iv = new double[dates.Count];
        var f = new double[dates.Count];
        for (var i = 0; i < dates.Count; i++)
        {
            rv[i] = realized[dates[i]]!.Value;
            iv[i] = implied[dates[i]]!.Value;
            f[i] = forecast[dates[i]]!.Value;
        }

        try
        {
            return EncompassingRegression.FitWithLag(rv, iv, f, lag);
        }
        catch (Exception ex) when (ex is ArgumentException or InvalidOperationException)
        {
            warnings.Add(Invariant($"{spec}: encompassing regression not computed: {ex.Message}"));
            return null;
        }
    }

    public PairComparison Compare(string firstSpec, double?[] first, string secondSpec, double?[] second)
    {
        var dates = Common(first, second);
        var n = dates.Count;
        if (n == 0)
        {
            return new PairComparison(firstSpec, secondSpec, 0, null, null, null, null);
        }

        var rv = new double[n];
        var a = new double[n];
        var b = new double[n];
        for (var i = 0; i < n; i++)
        {
            rv[i] = realized[dates[i]]!.Value;
            a[i] = first[dates[i]]!.Value;
            b[i] = second[dates[i]]!.Value;
        }

        DieboldMarianoResult? qlike = null;
        DieboldMarianoResult? mse = null;
        if (n >= Math.Max(2, lag + 2) && (n + 1.0 - (2.0 * horizonDays) + (horizonDays * (horizonDays - 1.0) / n)) > 0)
        {
            qlike = Dm(LossFunction.Qlike, rv, a, b);
            mse = Dm(LossFunction.SquaredErrorVariance, rv, a, b);
        }
        else
        {
            warnings.Add(Invariant($"{firstSpec} vs {secondSpec}: Diebold-Mariano not computed: {n} common dates are too few for lag {lag} and horizon {horizonDays}."));
        }

        return new PairComparison(firstSpec, secondSpec, n, Scoring.Losses.Summarize(rv, a), Scoring.Losses.Summarize(rv, b), qlike, mse);
    }

    private DieboldMarianoResult Dm(LossFunction loss, double[] rv, double[] a, double[] b)
    {
        var la = Scoring.Losses.Compute(loss, rv, a);
        var lb = Scoring.Losses.Compute(loss, rv, b);
        for (var i = 0; i < la.Length; i++)
        {
            la[i] -= lb[i];
        }

        return DieboldMariano.TestWithLag(la, horizonDays, lag, LongRunVarianceWindow.Rectangular);
    }

    private (double[] Realized, double[] Forecast) Aligned(double?[] forecast, double?[]? also)
    {
        var dates = Common(forecast, also ?? forecast);
        var rv = new double[dates.Count];
        var f = new double[dates.Count];
        for (var i = 0; i < dates.Count; i++)
        {
            rv[i] = realized[dates[i]]!.Value;
            f[i] = forecast[dates[i]]!.Value;
        }

        return (rv, f);
    }

    private List<int> Common(double?[] first, double?[] second)
    {
        var dates = new List<int>(scored.Count);
        foreach (var t in scored)
        {
            if (Preconditions.IsPositive(first[t]) && Preconditions.IsPositive(second[t]))
            {
                dates.Add(t);
            }
        }

        return dates;
    }

    private T? Skip<T>(string spec, string what, int count)
        where T : class
    {
        warnings.Add(Invariant($"{spec}: {what} not computed: {count} scored dates are too few for lag {lag}."));
        return null;
    }

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
