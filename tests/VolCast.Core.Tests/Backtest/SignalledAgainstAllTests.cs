using System.Collections.Immutable;
using VolCast.Core.Backtest;

namespace VolCast.Core.Tests.Backtest;

public sealed class SignalledAgainstAllTests
{
    private static RuleTestResult Rule(double[] implied, double[] realized, double[] forecast)
    {
        var dates = Enumerable.Range(0, implied.Length).Select(i => new DateOnly(2024, 1, 1).AddDays(i)).ToImmutableArray();
        return new RuleTestResult(0.02, "garch", "close-to-close:21", [], dates, [.. implied], [.. realized], [.. forecast], [.. forecast]);
    }

    [Fact]
    public void Difference_is_signalled_mean_minus_all_dates_mean_and_t_is_the_two_group_hc0_t()
    {
        // Gaps IV − RV of 1..6 vol points; the last three dates signal selling (implied 5 points above the forecast).
        // Signalled mean 5, all-dates mean 3.5: difference 1.5. With lag 0 the regression on a 0/1 dummy has
        // b = 5 − 2 = 3 and White's HC0 variance Σ₁e²/n₁² + Σ₀e²/n₀² = 2/9 + 2/9, so se = 2/3 and t = 4.5
        // (the unequal-variance two-sample form with divisor n; Greene, Econometric Analysis, the dummy-variable regression).
        double[] realized = [0.20, 0.20, 0.20, 0.20, 0.20, 0.20];
        double[] implied = [0.21, 0.22, 0.23, 0.24, 0.25, 0.26];
        double[] forecast = [0.21, 0.22, 0.23, 0.19, 0.20, 0.21];
        var test = SignalledAgainstAll.Compute(Rule(implied, realized, forecast), historical: false, RuleSignal.SellVolatility, lag: 0);

        Assert.Equal(3, test.SignalledCount);
        Assert.Equal(6, test.AllCount);
        Assert.Equal(0.015, test.Difference!.Value, 12);
        Assert.Equal(4.5, test.TStatistic!.Value, 9);
        Assert.InRange(test.PValue!.Value, 0, 0.05);
    }

    [Fact]
    public void No_signalled_date_leaves_nothing_to_test()
    {
        double[] values = [0.2, 0.2, 0.2, 0.2];
        var test = SignalledAgainstAll.Compute(Rule([0.21, 0.22, 0.23, 0.24], values, [0.21, 0.22, 0.23, 0.24]), historical: false, RuleSignal.BuyVolatility, lag: 1);

        Assert.Equal(0, test.SignalledCount);
        Assert.Null(test.Difference);
        Assert.Null(test.PValue);
    }
}
