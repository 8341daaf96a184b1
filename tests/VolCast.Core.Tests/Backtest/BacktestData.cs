using VolCast.Core.Data;
using VolCast.Core.Garch;
using VolCast.Core.Tests.Forecasters;
using VolCast.Core.Tests.Garch;

namespace VolCast.Core.Tests.Backtest;

/// <summary>Seeded simulated histories for backtest tests (invented data, not reference data).</summary>
internal static class BacktestData
{
    /// <summary>GARCH(1,1), zero mean, persistence 0.98, long-run vol ≈ 15.9% a year.</summary>
    public static GarchParameters Truth { get; } = new(0, 2e-6, 0.08, 0.90);

    /// <summary>
    /// A close-only GARCH(1,1) path with known parameters and an implied series equal to the true conditional expected
    /// h-day vol: sqrt(A · (1/h) Σ_{k=1..h} E_t[σ²_{t+k}]), E_t[σ²_{t+k}] = V_L + φ^{k−1} (σ²_{t+1} − V_L),
    /// computed from the simulator's true variance path (not from the forecasters' code).
    /// </summary>
    public static (PriceHistory Prices, ImpliedSeries Implied) GarchWithTrueImplied(int days, int horizon, int seed)
    {
        var p = Truth;
        var random = new Random(seed);
        var longRun = p.LongRunVariance!.Value;
        var phi = p.Alpha + p.Beta;
        var sigma2 = longRun;
        for (var burn = 0; burn < 500; burn++)
        {
            var e = Math.Sqrt(sigma2) * Gaussian.Next(random);
            sigma2 = p.Omega + (p.Alpha * e * e) + (p.Beta * sigma2);
        }

        var close = new double[days];
        var iv = new double[days];
        close[0] = 100;
        for (var t = 0; t < days; t++)
        {
            if (t > 0)
            {
                // sigma2 is σ²_t, known at t − 1; draw r_t.
                var e = Math.Sqrt(sigma2) * Gaussian.Next(random);
                close[t] = close[t - 1] * Math.Exp(e);
                sigma2 = p.Omega + (p.Alpha * e * e) + (p.Beta * sigma2);
            }

            // Now sigma2 = σ²_{t+1}: the implied quote at t's close.
            double sum = 0;
            var decay = 1.0;
            for (var k = 1; k <= horizon; k++)
            {
                sum += longRun + (decay * (sigma2 - longRun));
                decay *= phi;
            }

            iv[t] = Math.Sqrt(252 * sum / horizon);
        }

        var dates = ForecastData.Dates(days);
        return (PriceHistory.FromCloses(dates, close), new ImpliedSeries(dates, iv));
    }
}
