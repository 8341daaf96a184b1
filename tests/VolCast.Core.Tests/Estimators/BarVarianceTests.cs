using FsCheck;
using FsCheck.Xunit;
using VolCast.Core.Data;
using VolCast.Core.Estimators;

namespace VolCast.Core.Tests.Estimators;

/// <summary>Invariants of the daily terms and the rolling estimators, as property tests.</summary>
public sealed class BarVarianceTests
{
    private static readonly Estimator[] All = [Estimator.CloseToClose, Estimator.Parkinson, Estimator.GarmanKlass, Estimator.RogersSatchell, Estimator.YangZhang];

    [Fact]
    public void Constants_MatchPublishedValues()
    {
        // docs/methods.md#parkinson: 1/(4 ln 2) = 0.360674 [C, secondary]; docs/methods.md#garman-klass: 2 ln 2 − 1 = 0.386294 [C].
        double parkinsonScale = BarVariance.ParkinsonScale, closeWeight = BarVariance.GarmanKlassCloseWeight;
        Assert.Equal(0.360674, parkinsonScale, 0.0000005);
        Assert.Equal(0.386294, closeWeight, 0.0000005);
        Assert.Equal(1 / (4 * Math.Log(2)), parkinsonScale, 1e-16);
        Assert.Equal((2 * Math.Log(2)) - 1, closeWeight, 1e-16);
    }

    [Property(MaxTest = 200)]
    public bool GarmanKlassAndRogersSatchell_AnyValidBar_NeverNegative(NormalFloat logOpen, NormalFloat logClose, NormalFloat up, NormalFloat down)
    {
        // Invariants [D] of docs/methods.md#garman-klass and #rogers-satchell: on a valid bar each daily term is ≥ 0 (GK ≥ 0.114 R²).
        var (o, h, l, c) = ValidBar(logOpen.Get, logClose.Get, up.Get, down.Get);
        var range = Math.Log(h / l);
        var garmanKlass = BarVariance.GarmanKlass(o, h, l, c);
        var rogersSatchell = BarVariance.RogersSatchell(o, h, l, c);
        return garmanKlass >= 0 && rogersSatchell >= 0 && BarVariance.Parkinson(h, l) >= 0
            && garmanKlass >= (0.1137 * range * range) - (1e-15 * range * range);
    }

    [Property(MaxTest = 100)]
    public bool AllTerms_FlatBar_ContributeExactlyZero(NormalFloat logPrice)
    {
        // A bar with O = H = L = C carries no range and no open-to-close move (the formulas of docs/methods.md#parkinson to #rogers-satchell).
        var p = Math.Exp(Math.Clamp(logPrice.Get, -30, 30));
        return BarVariance.Parkinson(p, p) == 0 && BarVariance.GarmanKlass(p, p, p, p) == 0 && BarVariance.RogersSatchell(p, p, p, p) == 0;
    }

    [Property(MaxTest = 30)]
    public bool RollingDailyVariance_WindowOfFlatBarsAtPreviousClose_IsExactlyZero(PositiveInt seed, PositiveInt windowRaw)
    {
        // Flat bars at the previous close add no return, no overnight gap and no range: every estimator is zero
        // on a window made of them, whatever came before (a test of the rolling sums as much as of the formulas).
        var window = 2 + (windowRaw.Get % 30);
        var history = Some.GbmBars(seed.Get, days: 60, overnightVolatility: 0.003);
        var flat = history.Close[^1];
        var n = history.Count + window;
        var open = new double[n];
        var high = new double[n];
        var low = new double[n];
        var close = new double[n];
        history.Open.CopyTo(open);
        history.High.CopyTo(high);
        history.Low.CopyTo(low);
        history.Close.CopyTo(close);
        open.AsSpan(history.Count).Fill(flat);
        high.AsSpan(history.Count).Fill(flat);
        low.AsSpan(history.Count).Fill(flat);
        close.AsSpan(history.Count).Fill(flat);
        var terms = EstimatorTerms.From(PriceHistory.FromBars(Some.TradingDates(n), open, high, low, close));

        foreach (var estimator in All)
        {
            if (terms.RollingDailyVariance(estimator, window)[^1] != 0 || terms.RollingDailyVariance(estimator, window, zeroMean: true)[^1] != 0)
            {
                return false;
            }
        }

        return true;
    }

    [Property(MaxTest = 40)]
    public bool Compute_AllPricesScaledByPositiveFactor_EveryEstimatorUnchanged(PositiveInt seed, NormalFloat logFactor) =>
        ScaledHistoryGivesTheSameVolatility(seed.Get, logFactor.Get);

    [Theory]
    // Found by the property above: seed 42, factor e^13 (a 2-day window whose two returns nearly coincide).
    [InlineData(42, 13.0)]
    public void Compute_AllPricesScaledByPositiveFactor_FoundCases(int seed, double logFactor) =>
        Assert.True(ScaledHistoryGivesTheSameVolatility(seed, logFactor));

    private static bool ScaledHistoryGivesTheSameVolatility(int seed, double logFactor)
    {
        // Every estimator uses only price ratios, so a change of currency or a split applied to the whole history
        // leaves it unchanged (the formulas of docs/methods.md#parkinson to #yang-zhang); rounding of the scaled prices allows ~1e-9 relative, plus an
        // absolute 1e-13 (annualized): when two returns in a window of 2 nearly coincide, their sample deviation is
        // a difference of nearly equal numbers, and the ~1e-16 rounding of each log return is all that is left of it
        // (seed 42, factor e^13 gives 7.7e-7 against 7.7e-7 + 2.5e-15).
        var factor = Math.Exp(Math.Clamp(logFactor, -20, 20));
        var prices = Some.GbmBars(seed, days: 80, overnightVolatility: 0.004);
        var scaled = Scale(prices, factor);
        foreach (var estimator in All)
        {
            foreach (var window in new[] { 2, 10, 40 })
            {
                var a = RollingVolatility.Compute(prices, estimator, window).AnnualizedVolatility;
                var b = RollingVolatility.Compute(scaled, estimator, window).AnnualizedVolatility;
                for (var i = 0; i < a.Length; i++)
                {
                    if (Math.Abs(a[i] - b[i]) > (1e-9 * a[i]) + 1e-13)
                    {
                        return false;
                    }
                }
            }
        }

        return true;
    }

    private static (double Open, double High, double Low, double Close) ValidBar(double logOpen, double logClose, double up, double down)
    {
        // Map any four normal floats to a valid bar: O and C anywhere in e^±20, H above max(O, C), L below min(O, C),
        // by up to 50% in log terms (zero extensions are frequent, giving H = max(O, C) and L = min(O, C)).
        var o = Math.Exp(Math.Clamp(logOpen, -20, 20));
        var c = o * Math.Exp(Math.Clamp(logClose, -0.5, 0.5));
        var h = Math.Max(o, c) * Math.Exp(Math.Min(Math.Abs(up), 0.5));
        var l = Math.Min(o, c) * Math.Exp(-Math.Min(Math.Abs(down), 0.5));
        return (o, Math.Max(h, Math.Max(o, c)), Math.Min(l, Math.Min(o, c)), c);
    }

    private static PriceHistory Scale(PriceHistory prices, double factor)
    {
        var n = prices.Count;
        var open = new double[n];
        var high = new double[n];
        var low = new double[n];
        var close = new double[n];
        for (var i = 0; i < n; i++)
        {
            open[i] = prices.Open[i] * factor;
            close[i] = prices.Close[i] * factor;
            high[i] = Math.Max(prices.High[i] * factor, Math.Max(open[i], close[i]));
            low[i] = Math.Min(prices.Low[i] * factor, Math.Min(open[i], close[i]));
        }

        return PriceHistory.FromBars(prices.Dates, open, high, low, close);
    }
}
