using System.Globalization;
using VolCast.Core.Options;

namespace VolCast.Core.Tests.Options;

public sealed class BlackScholesMertonTests
{
    [Fact]
    public void Price_HullExample15_6_MatchesBook()
    {
        // Hull, Options, Futures, and Other Derivatives 11e, Example 15.6 [C]: S=42, K=40, r=10%, σ=20%, T=0.5
        // gives d1=0.7693, d2=0.6278, c=4.76, p=0.81 (the book rounds to cents; 4.759422 / 0.808599 [D]).
        var call = BlackScholesMerton.Price(OptionType.Call, 42, 40, 0.5, 0.20, 0.10, 0);
        var put = BlackScholesMerton.Price(OptionType.Put, 42, 40, 0.5, 0.20, 0.10, 0);
        Assert.Equal(4.76, call, 0.005);
        Assert.Equal(0.81, put, 0.005);
        Assert.Equal(4.759422, call, 5e-7);
        Assert.Equal(0.808599, put, 5e-7);
    }

    [Fact]
    public void Delta_HullExample15_6_ImpliesBookD1()
    {
        // Hull 11e Example 15.6 [C]: d1 = 0.7693, so the call delta N(d1) = 0.7791 (N from the d1 the book prints [D]).
        var delta = BlackScholesMerton.Delta(OptionType.Call, 42, 40, 0.5, 0.20, 0.10, 0);
        var d1 = (Math.Log(42.0 / 40) + ((0.10 + 0.02) * 0.5)) / (0.20 * Math.Sqrt(0.5));
        Assert.Equal(0.7693, d1, 5e-5);
        Assert.Equal(0.5 * (1 + MathNet.Numerics.SpecialFunctions.Erf(0.7693 / Math.Sqrt(2))), delta, 5e-5);
    }

    [Fact]
    public void Price_HullExample15_7_MatchesBook()
    {
        // Hull 11e Example 15.7 [C]: S=40, K=60, r=3%, σ=30%, T=5 gives a call worth 7.04 (7.040239 [D]).
        var call = BlackScholesMerton.Price(OptionType.Call, 40, 60, 5, 0.30, 0.03, 0);
        Assert.Equal(7.04, call, 0.005);
        Assert.Equal(7.040239, call, 5e-7);
    }

    [Fact]
    public void Price_HullExample15_9_MatchesBook()
    {
        // Hull 11e Example 15.9 [C]: the stock price less the present value of the dividends, S=39.0258, K=40,
        // r=9%, σ=30%, T=0.5, gives d1=0.2020, d2=-0.0102 and c=3.67 (3.671206 [D]).
        var call = BlackScholesMerton.Price(OptionType.Call, 39.0258, 40, 0.5, 0.30, 0.09, 0);
        Assert.Equal(3.67, call, 0.005);
        Assert.Equal(3.671206, call, 5e-7);
    }

    [Fact]
    public void Price_SecondarySourceRow_MatchesFiveDecimals()
    {
        // docs/methods.md#black-scholes-merton-and-black-76, the [C2] row: S=22, K=25, r=0.1, σ=0.2, T=0.75 gives c=1.03446, p=2.22805.
        Assert.Equal(1.03446, BlackScholesMerton.Price(OptionType.Call, 22, 25, 0.75, 0.2, 0.1, 0), 5e-6);
        Assert.Equal(2.22805, BlackScholesMerton.Price(OptionType.Put, 22, 25, 0.75, 0.2, 0.1, 0), 5e-6);
    }

    [Fact]
    public void Price_ThirtyDayAtTheMoney_MatchesRuleOfThumb()
    {
        // Common practice, no source: an at-the-money option is worth about 0.4 σ S √T; with S=K=100, r=0,
        // σ=30%, T=30/365 that is 3.44, and the exact value is 3.43 (3.430139 [D], recomputed in R).
        var call = BlackScholesMerton.Price(OptionType.Call, 100, 100, 30 / 365.0, 0.30, 0, 0);
        Assert.Equal(3.43, call, 0.005);
        Assert.Equal(0.4 * 0.30 * 100 * Math.Sqrt(30 / 365.0), call, 0.02);
    }

    [Fact]
    public void Price_RGrid_MatchesIndependentNormalDistribution()
    {
        // [D]: 576 prices recomputed in R 4.2.2 with stats::pnorm (Fixtures/Options/bsm_grid.R), moneyness
        // 0.5-2, 1 day to 3 years, σ 10%-80%. Agreement to 1e-12 of the spot or 1e-9 relative, whichever is looser.
        var rows = ReadGrid();
        Assert.Equal(576, rows.Count);
        foreach (var row in rows)
        {
            var price = BlackScholesMerton.Price(row.Type, row.Spot, row.Strike, row.Years, row.Volatility, row.Rate, row.DividendYield);
            var tolerance = Math.Max(1e-12 * row.Spot, 1e-9 * row.Price);
            Assert.True(Math.Abs(price - row.Price) <= tolerance,
                FormattableString.Invariant($"{row}: VolCast {price:R} vs R {row.Price:R}"));
        }
    }

    [Theory]
    [InlineData(100, 100, 0.25, 0.2, 0.05, 0.02)] // at the money, a quarter
    [InlineData(100, 50, 3, 0.8, 0.05, 0.0)] // deep in the money call, long dated, high vol
    [InlineData(100, 200, 1.0 / 365, 0.3, 0.0, 0.0)] // far out of the money call, one day
    [InlineData(42, 40, 0.5, 0.2, 0.10, 0.0)] // Hull 15.6 inputs
    [InlineData(100, 120, 1, 0.25, -0.01, 0.03)] // negative rate, yield above it
    public void Price_PutCallParity_HoldsTo1e12(double spot, double strike, double years, double vol, double rate, double yield)
    {
        // Put-call parity for European options with a dividend yield (Hull, chapter on properties of stock options [M]): c − p = S e^{−qT} − K e^{−rT}.
        var call = BlackScholesMerton.Price(OptionType.Call, spot, strike, years, vol, rate, yield);
        var put = BlackScholesMerton.Price(OptionType.Put, spot, strike, years, vol, rate, yield);
        var parity = (spot * Math.Exp(-yield * years)) - (strike * Math.Exp(-rate * years));
        Assert.Equal(parity, call - put, 1e-12 * spot);
    }

    [Theory]
    [InlineData(OptionType.Call, 100, 90, 0.5, 0.25, 0.03, 0.01)] // in the money call
    [InlineData(OptionType.Put, 100, 90, 0.5, 0.25, 0.03, 0.01)] // out of the money put
    [InlineData(OptionType.Call, 42, 40, 0.5, 0.2, 0.1, 0)] // Hull 15.6 inputs
    public void DeltaAndVega_MatchCentralDifferences(OptionType type, double spot, double strike, double years, double vol, double rate, double yield)
    {
        // Definition of the sensitivities [D]: central differences with h = 1e-4, truncation error O(h²).
        const double h = 1e-4;
        var up = BlackScholesMerton.Price(type, spot + h, strike, years, vol, rate, yield);
        var down = BlackScholesMerton.Price(type, spot - h, strike, years, vol, rate, yield);
        Assert.Equal((up - down) / (2 * h), BlackScholesMerton.Delta(type, spot, strike, years, vol, rate, yield), 1e-7);
        var volUp = BlackScholesMerton.Price(type, spot, strike, years, vol + h, rate, yield);
        var volDown = BlackScholesMerton.Price(type, spot, strike, years, vol - h, rate, yield);
        Assert.Equal((volUp - volDown) / (2 * h), BlackScholesMerton.Vega(spot, strike, years, vol, rate, yield), 1e-6);
    }

    [Fact]
    public void Price_ZeroVolatility_IsDiscountedForwardIntrinsic()
    {
        // Limit of the formula as σ√T → 0 [D]: max(S e^{−qT} − K e^{−rT}, 0).
        var call = BlackScholesMerton.Price(OptionType.Call, 100, 90, 1, 0, 0.05, 0.01);
        Assert.Equal((100 * Math.Exp(-0.01)) - (90 * Math.Exp(-0.05)), call, 1e-12);
        Assert.Equal(0, BlackScholesMerton.Price(OptionType.Put, 100, 90, 1, 0, 0.05, 0.01));
    }

    [Theory]
    [InlineData(0, 100, 1, 0.2)] // zero spot
    [InlineData(100, -1, 1, 0.2)] // negative strike
    [InlineData(100, 100, -0.1, 0.2)] // negative time
    [InlineData(100, 100, 1, double.NaN)] // NaN volatility
    public void Price_InvalidArgument_Throws(double spot, double strike, double years, double vol)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => BlackScholesMerton.Price(OptionType.Call, spot, strike, years, vol, 0.01, 0));
        Assert.Contains("was", ex.Message, StringComparison.Ordinal);
    }

    internal sealed record GridRow(OptionType Type, double Spot, double Strike, double Years, double Rate, double DividendYield, double Volatility, double Price);

    internal static List<GridRow> ReadGrid()
    {
        var path = Path.Combine(AppContext.BaseDirectory, "Fixtures", "Options", "bsm_grid.csv");
        var rows = new List<GridRow>();
        foreach (var line in File.ReadLines(path).Where(l => !l.StartsWith('#')).Skip(1))
        {
            var f = line.Split(',');
            double D(int i) => double.Parse(f[i], CultureInfo.InvariantCulture);
            rows.Add(new GridRow(f[0] == "call" ? OptionType.Call : OptionType.Put, D(1), D(2), D(3), D(4), D(5), D(6), D(7)));
        }

        return rows;
    }
}
