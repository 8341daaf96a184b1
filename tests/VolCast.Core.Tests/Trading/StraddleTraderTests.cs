using VolCast.Core.Data;
using VolCast.Core.Options;
using VolCast.Core.Trading;

namespace VolCast.Core.Tests.Trading;

public sealed class StraddleTraderTests
{
    // Six closes over a Monday-to-Monday week (5 trading days, 7 calendar days).
    private static readonly DateOnly[] Dates =
    [
        new(2024, 1, 8), new(2024, 1, 9), new(2024, 1, 10), new(2024, 1, 11), new(2024, 1, 12), new(2024, 1, 15),
    ];

    private static readonly double[] Closes = [100.0, 101.5, 99.8, 100.7, 102.2, 101.0];

    [Fact]
    public void Evaluate_ShortStraddleFromRawCloses_MatchesHandRecomputation()
    {
        // Independent recomputation written out from the definitions (Black-Scholes-Merton 1973 with Merton's yield,
        // Hull, Options, Futures, and Other Derivatives, ch. 15 and 19): N(x) from MathNet's erf, not from the code
        // under test; the straddle as call + put priced separately; every cash flow carried to expiry at r.
        const double iv = 0.25, r = 0.03, q = 0.01, halfSpread = 0.25, bps = 1.0;
        var prices = PriceHistory.FromCloses(Dates, Closes);
        var trade = StraddleTrader.Evaluate(prices, 0, 5, -1, iv, new TradeCosts(halfSpread, bps), rate: r, dividendYield: q);

        var k = Closes[0];
        double Years(int i) => (Dates[i].DayNumber - Dates[0].DayNumber) / 365.0;
        var expiry = Years(5);
        Assert.Equal(7 / 365.0, expiry, 15);
        double N(double x) => 0.5 * (1 + MathNet.Numerics.SpecialFunctions.Erf(x / Math.Sqrt(2)));
        double D1(double s, double tau) => (Math.Log(s / k) + ((r - q + (iv * iv / 2)) * tau)) / (iv * Math.Sqrt(tau));
        double Call(double s, double tau) => (s * Math.Exp(-q * tau) * N(D1(s, tau))) - (k * Math.Exp(-r * tau) * N(D1(s, tau) - (iv * Math.Sqrt(tau))));
        double Put(double s, double tau) => (k * Math.Exp(-r * tau) * N(-(D1(s, tau) - (iv * Math.Sqrt(tau))))) - (s * Math.Exp(-q * tau) * N(-D1(s, tau)));
        double StraddleDelta(double s, double tau) => Math.Exp(-q * tau) * (N(D1(s, tau)) - N(-D1(s, tau)));

        var premium = Call(k, expiry) + Put(k, expiry);
        var vega = 2 * k * Math.Exp(-q * expiry) * Math.Exp(-D1(k, expiry) * D1(k, expiry) / 2) / Math.Sqrt(2 * Math.PI) * Math.Sqrt(expiry) / 100;
        var deltas = new double[5];
        double hedge = 0, notional = 0, previous = 0;
        for (var t = 0; t < 5; t++)
        {
            deltas[t] = StraddleDelta(Closes[t], expiry - Years(t));
            notional += Math.Abs(deltas[t] - previous) * Closes[t] * Math.Exp(r * (expiry - Years(t)));
            var dt = Years(t + 1) - Years(t);
            hedge += -deltas[t] * (Closes[t + 1] - (Closes[t] * Math.Exp((r - q) * dt))) * Math.Exp(r * (expiry - Years(t + 1)));
            previous = deltas[t];
        }

        notional += Math.Abs(deltas[4]) * Closes[5];
        var payoff = Math.Abs(Closes[5] - k);
        var carry = Math.Exp(r * expiry);
        var costs = (halfSpread * vega * carry) + (bps / 10_000 * notional);
        var pnl = -(payoff - (premium * carry) + hedge) - costs;

        Assert.Equal(premium, trade.Premium, 12);
        Assert.Equal(vega, trade.VegaPerVolPoint, 12);
        Assert.Equal(deltas[0], trade.EntryDelta, 12);
        Assert.Equal(hedge, trade.HedgePnl, 12);
        Assert.Equal(payoff, trade.Payoff, 12);
        Assert.Equal(costs, trade.Costs, 12);
        Assert.Equal(pnl, trade.Pnl, 12);
        Assert.Equal(pnl / vega, trade.PnlVolPoints, 10);
        Assert.Equal(100 * pnl / k, trade.PnlPercentOfSpot, 10);
        Assert.Equal(5, trade.TradingDays);
        Assert.Equal(7, trade.CalendarDays);

        // Variance-swap view (Carr & Wu 2009, "Variance risk premiums", the payoff RV² − strike): short side, totals.
        double rv = 0;
        for (var i = 1; i <= 5; i++)
        {
            rv += Math.Pow(Math.Log(Closes[i] / Closes[i - 1]), 2);
        }

        Assert.Equal(-(rv - (iv * iv * 7 / 365)), trade.VarianceGap, 14);
        Assert.Equal(-100 * ((rv * 365 / 7) - (iv * iv)) / (2 * iv), trade.VarianceGapVolPoints, 10);
    }

    [Fact]
    public void Evaluate_StressOfShortStraddle_IsTheRepricedLoss()
    {
        // The stress of a short hedged straddle: spot −10%, implied +10 vol points, repriced with Black-Scholes-Merton
        // (the shock the issue states); recomputed here from call and put prices.
        var prices = PriceHistory.FromCloses(Dates, Closes);
        var trade = StraddleTrader.Evaluate(prices, 0, 5, -1, 0.25, TradeCosts.Zero);
        var tau = 7 / 365.0;
        var stressed = Straddle(90, 100, tau, 0.35);
        var hedgeGain = -trade.EntryDelta * -10.0; // the long's hedge holds −Δ₀; the spot falls by 10
        var longPnl = stressed - trade.Premium + hedgeGain;
        Assert.Equal(-longPnl / trade.VegaPerVolPoint, trade.StressPnlVolPoints, 10);
        Assert.True(trade.StressPnlVolPoints < 0, "a short straddle loses when spot falls 10% and implied rises");
    }

    [Fact]
    public void Evaluate_LongAndShort_MirrorBeforeCostsAndPayTheSameCosts()
    {
        // Fact of the trade: the long and the short straddle are the two sides of one contract; each pays the costs.
        var prices = PriceHistory.FromCloses(Dates, Closes);
        var longTrade = StraddleTrader.Evaluate(prices, 0, 5, 1, 0.25, TradeCosts.Default);
        var shortTrade = StraddleTrader.Evaluate(prices, 0, 5, -1, 0.25, TradeCosts.Default);
        Assert.Equal(-longTrade.GrossPnl, shortTrade.GrossPnl, 14);
        Assert.Equal(longTrade.Costs, shortTrade.Costs, 14);
        Assert.Equal(shortTrade.GrossPnl - shortTrade.Costs, shortTrade.Pnl, 14);
        // Half-spread of 0.25 vol points at r = 0 costs exactly 0.25 vol points of a vega-sized trade.
        Assert.Equal(0.25, longTrade.OptionCost / longTrade.VegaPerVolPoint, 12);
    }

    [Theory]
    [InlineData(100, 100, 30 / 365.0, 0.2, 0.0, 0.0)]
    [InlineData(87, 100, 0.5, 0.45, 0.05, 0.02)]
    [InlineData(130, 100, 2.0, 0.1, -0.01, 0.03)]
    public void Straddle_OneD1Form_EqualsCallPlusPutAndTheirDeltas(double s, double k, double tau, double sigma, double r, double q)
    {
        // The fused daily form must equal the call and put of the tested pricing class (Black-Scholes-Merton with a yield).
        var value = DeltaHedge.Straddle(s, k, tau, sigma, r, q, out var delta);
        var call = BlackScholesMerton.Price(OptionType.Call, s, k, tau, sigma, r, q);
        var put = BlackScholesMerton.Price(OptionType.Put, s, k, tau, sigma, r, q);
        var callDelta = BlackScholesMerton.Delta(OptionType.Call, s, k, tau, sigma, r, q);
        var putDelta = BlackScholesMerton.Delta(OptionType.Put, s, k, tau, sigma, r, q);
        Assert.Equal(call + put, value, 1e-12 * s);
        Assert.Equal(callDelta + putDelta, delta, 1e-13);
    }

    [Theory]
    [InlineData(-0.1, 1.0)]
    [InlineData(0.25, -1.0)]
    [InlineData(25.0, 1.0)]
    [InlineData(0.25, 1000.0)]
    [InlineData(double.NaN, 1.0)]
    public void TradeCosts_NegativeOrAbsurd_AreRefusedWithTheExpectedUnit(double halfSpread, double bps)
    {
        var error = Assert.ThrowsAny<ArgumentException>(() => new TradeCosts(halfSpread, bps));
        Assert.Contains("between 0 and", error.Message, StringComparison.Ordinal);
    }

    private static double Straddle(double s, double k, double tau, double sigma)
    {
        static double N(double x) => 0.5 * (1 + MathNet.Numerics.SpecialFunctions.Erf(x / Math.Sqrt(2)));
        var d1 = (Math.Log(s / k) + (sigma * sigma / 2 * tau)) / (sigma * Math.Sqrt(tau));
        var d2 = d1 - (sigma * Math.Sqrt(tau));
        return (s * N(d1)) - (k * N(d2)) + (k * N(-d2)) - (s * N(-d1));
    }
}
