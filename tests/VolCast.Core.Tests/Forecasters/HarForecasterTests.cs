using VolCast.Core.Data;
using VolCast.Core.Forecasters;
using VolCast.Core.Tests.Garch;
using Xunit.Abstractions;

namespace VolCast.Core.Tests.Forecasters;

public sealed class HarForecasterTests(ITestOutputHelper output)
{
    [Theory]
    // Squared-return proxy, horizon 1 and 10; range proxy at horizon 5.
    [InlineData(false, 1)]
    [InlineData(false, 10)]
    [InlineData(true, 5)]
    public void Forecast_AfterFirstFit_EqualsNaiveNormalEquations(bool range, int horizon)
    {
        // Naive reference: build the regression rows by hand (targets whose windows closed by t only), solve the
        // normal equations by Gaussian elimination, and evaluate at day t. Agreement to 1e-9 relative.
        var prices = ForecastData.Bars(600, seed: 12);
        var forecaster = new HarForecaster(range ? HarProxy.GarmanKlass : HarProxy.SquaredReturn, refitEveryDays: 1000, rollingWindowRows: null, minimumRows: 250);
        var session = forecaster.Start(new ForecastInput(prices, null, horizon));
        var firstFitDay = 22 + 250 - 1 + horizon;
        for (var t = 0; t < firstFitDay; t++)
        {
            Assert.Null(session.Forecast(t));
        }

        var r = Returns.LogReturns(prices.Close);
        var proxy = new double[prices.Count];
        for (var d = 1; d < prices.Count; d++)
        {
            proxy[d] = range
                ? (0.5 * Math.Pow(Math.Log(prices.High[d] / prices.Low[d]), 2)) - (((2 * Math.Log(2)) - 1) * Math.Pow(Math.Log(prices.Close[d] / prices.Open[d]), 2))
                : r[d - 1] * r[d - 1];
        }

        double[] Row(int s) => [1, proxy[s], proxy[(s - 4)..(s + 1)].Average(), proxy[(s - 21)..(s + 1)].Average()];
        var xtx = new double[4, 4];
        var xty = new double[4];
        for (var s = 22; s + horizon <= firstFitDay; s++)
        {
            var x = Row(s);
            var y = Enumerable.Range(s + 1, horizon).Select(i => r[i - 1] * r[i - 1]).Average();
            for (var a = 0; a < 4; a++)
            {
                xty[a] += x[a] * y;
                for (var b = 0; b < 4; b++)
                {
                    xtx[a, b] += x[a] * x[b];
                }
            }
        }

        var beta = Solve(xtx, xty);
        for (var t = firstFitDay; t < firstFitDay + 10; t++)
        {
            var x = Row(t);
            var variance = beta[0] + (beta[1] * x[1]) + (beta[2] * x[2]) + (beta[3] * x[3]);
            var actual = session.Forecast(t)!.Value;
            Assert.Equal(Math.Sqrt(252 * variance), actual, 1e-9 * actual);
        }
    }

    [Fact]
    public void Forecast_NegativeFittedVariance_FallsBackToLongRunMeanAndCounts()
    {
        // Returns alternate: zero, then a move of random size, then zero... With h = 1 a zero day is followed by a
        // move and a move by a zero, so the daily coefficient is about −1 and the fit says "tomorrow ≈ mean − today":
        // after an above-average move the fitted variance is negative, and it must fall back to the mean target
        // (positive) and be counted.
        var returns = new double[700];
        var random = new Random(5);
        for (var i = 0; i < returns.Length; i++)
        {
            returns[i] = i % 2 == 0 ? 0 : (random.NextDouble() < 0.5 ? -0.02 : 0.02) * (0.2 + (2 * random.NextDouble()));
        }

        var prices = PriceHistory.FromCloses(ForecastData.Dates(701), GarchSimulation.Closes(returns));
        var session = new HarForecaster().Start(new ForecastInput(prices, null, 1));
        for (var t = 0; t <= 700; t++)
        {
            if (session.Forecast(t) is double v)
            {
                Assert.True(v > 0 && double.IsFinite(v));
            }
        }

        output.WriteLine(session.Counts.ToString());
        Assert.True(session.Counts.NegativeVarianceFallbacks > 0, session.Counts.ToString());
    }

    [Fact]
    public void Start_RangeProxyOnClosesOnly_ThrowsSayingWhatIsNeeded()
    {
        var prices = PriceHistory.FromCloses(ForecastData.Dates(3), [100, 101, 102]);
        var ex = Assert.Throws<ArgumentException>(() => new HarForecaster(HarProxy.GarmanKlass).Start(new ForecastInput(prices, null, 5)));
        Assert.Contains("needs open, high and low", ex.Message, StringComparison.Ordinal);
    }

    private static double[] Solve(double[,] a, double[] b)
    {
        var n = b.Length;
        var m = (double[,])a.Clone();
        var v = (double[])b.Clone();
        for (var c = 0; c < n; c++)
        {
            var pivot = c;
            for (var r = c + 1; r < n; r++)
            {
                if (Math.Abs(m[r, c]) > Math.Abs(m[pivot, c]))
                {
                    pivot = r;
                }
            }

            for (var k = 0; k < n; k++)
            {
                (m[c, k], m[pivot, k]) = (m[pivot, k], m[c, k]);
            }

            (v[c], v[pivot]) = (v[pivot], v[c]);
            for (var r = c + 1; r < n; r++)
            {
                var f = m[r, c] / m[c, c];
                for (var k = c; k < n; k++)
                {
                    m[r, k] -= f * m[c, k];
                }

                v[r] -= f * v[c];
            }
        }

        var x = new double[n];
        for (var r = n - 1; r >= 0; r--)
        {
            var s = v[r];
            for (var k = r + 1; k < n; k++)
            {
                s -= m[r, k] * x[k];
            }

            x[r] = s / m[r, r];
        }

        return x;
    }
}
