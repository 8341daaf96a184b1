using VolCast.Core.Options;
using VolCast.Core.Trading;
using Xunit.Abstractions;

namespace VolCast.Core.Tests.Trading;

public sealed class DeltaHedgeReferenceTests(ITestOutputHelper output)
{
    [Theory]
    [InlineData(5.0, 0.42)]
    [InlineData(4.0, 0.34)]
    [InlineData(2.0, 0.26)]
    [InlineData(1.0, 0.19)]
    [InlineData(0.5, 0.14)]
    [InlineData(0.25, 0.09)]
    public void Run_HullDeltaHedgingTable_ReproducesTheCostRatio(double weeksBetweenRebalances, double bookRatio)
    {
        // Hull, Options, Futures, and Other Derivatives, the table on the performance of delta hedging (from memory: the
        // book's own rounded simulation): writing calls with S0 = 49, K = 50, r = 5%, σ = 20%, μ = 13%, T = 20 weeks,
        // the standard deviation of the cost of writing and hedging over the Black-Scholes price is about 0.42, 0.34,
        // 0.26, 0.19, 0.14, 0.09 for rebalancing every 5, 4, 2, 1, ½, ¼ weeks. Reproduced by seeded simulation (real-world
        // drift μ), within ±0.04.
        const double s0 = 49, k = 50, r = 0.05, sigma = 0.20, mu = 0.13, paths = 4000;
        var steps = (int)Math.Round(20 / weeksBetweenRebalances);
        var expiry = 20.0 / 52;
        var dt = expiry / steps;
        var random = new Random(20_000 + steps);
        var spots = new double[steps + 1];
        var years = new double[steps + 1];
        for (var i = 0; i <= steps; i++)
        {
            years[i] = i * dt;
        }

        var costs = new double[(int)paths];
        var price = BlackScholesMerton.Price(OptionType.Call, s0, k, expiry, sigma, r, 0);
        for (var p = 0; p < paths; p++)
        {
            spots[0] = s0;
            for (var i = 1; i <= steps; i++)
            {
                spots[i] = spots[i - 1] * Math.Exp(((mu - (0.5 * sigma * sigma)) * dt) + (sigma * Math.Sqrt(dt) * SimulatedMarket.Gaussian(random)));
            }

            var outcome = DeltaHedge.Run(HedgedOption.Call, spots, years, k, sigma, sigma, r, 0, default, default, default, default);
            // The writer's cost of writing and hedging in present value is the premium minus the writer's P&L
            // discounted, so its spread is that of the long position's P&L discounted to today.
            costs[p] = outcome.GrossPnl * Math.Exp(-r * expiry);
        }

        var ratio = StandardDeviation(costs) / price;
        output.WriteLine($"every {weeksBetweenRebalances} weeks: {ratio:F3} (book {bookRatio})");
        Assert.Equal(bookRatio, ratio, 0.04);
    }

    [Theory]
    [InlineData(21)]
    [InlineData(63)]
    public void Run_AtTheMoneyHedgedAtTrueVolatility_MatchesKamalDermanError(int rebalances)
    {
        // Kamal & Derman (1999), "When you cannot hedge continuously: the corrections to Black-Scholes", Risk 12(1), from
        // memory: the hedging error of an at-the-money option hedged N times at the true σ has standard deviation
        // ≈ √(π/4)·vega·σ/√N (first order, so asserted for N ≥ 20). Checked here on the straddle (vega of call + put)
        // by seeded simulation; tolerance 3 standard errors of a standard deviation (sd/√(2n)) plus 5% for the
        // first-order approximation.
        const double s0 = 100, sigma = 0.20, paths = 4000;
        var expiry = rebalances / 252.0;
        var dt = expiry / rebalances;
        var random = new Random(1999 + rebalances);
        var spots = new double[rebalances + 1];
        var years = new double[rebalances + 1];
        for (var i = 0; i <= rebalances; i++)
        {
            years[i] = i * dt;
        }

        var errors = new double[(int)paths];
        for (var p = 0; p < paths; p++)
        {
            spots[0] = s0;
            for (var i = 1; i <= rebalances; i++)
            {
                spots[i] = spots[i - 1] * Math.Exp((-0.5 * sigma * sigma * dt) + (sigma * Math.Sqrt(dt) * SimulatedMarket.Gaussian(random)));
            }

            errors[p] = DeltaHedge.Run(HedgedOption.Straddle, spots, years, s0, sigma, sigma, 0, 0, default, default, default, default).GrossPnl;
        }

        var vega = 2 * BlackScholesMerton.Vega(s0, s0, expiry, sigma, 0, 0);
        var expected = Math.Sqrt(Math.PI / 4) * vega * sigma / Math.Sqrt(rebalances);
        var sd = StandardDeviation(errors);
        output.WriteLine($"N = {rebalances}: sd {sd:F4}, Kamal-Derman {expected:F4}, ratio {sd / expected:F3}");
        Assert.True(Math.Abs(sd - expected) <= (3 * sd / Math.Sqrt(2 * paths)) + (0.05 * expected), $"sd {sd}, expected {expected}");
    }

    private static double StandardDeviation(double[] x)
    {
        var mean = x.Average();
        return Math.Sqrt(x.Sum(v => (v - mean) * (v - mean)) / (x.Length - 1));
    }
}
