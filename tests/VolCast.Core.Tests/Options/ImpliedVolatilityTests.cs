using System.Globalization;
using FsCheck.Xunit;
using VolCast.Core.Options;

namespace VolCast.Core.Tests.Options;

public sealed class ImpliedVolatilityTests
{
    [Fact]
    public void FromBlackScholesMerton_HullSection15_11_GivesAbout0_235()
    {
        // Hull 11e §15.11 [C]: a call worth 1.875 with S=21, K=20, r=10%, T=0.25 has implied volatility about 0.235
        // (0.234513 [D]); the book brackets it with σ=0.20 → 1.76 and σ=0.30 → 2.10.
        Assert.Equal(1.76, BlackScholesMerton.Price(OptionType.Call, 21, 20, 0.25, 0.20, 0.10, 0), 0.005);
        Assert.Equal(2.10, BlackScholesMerton.Price(OptionType.Call, 21, 20, 0.25, 0.30, 0.10, 0), 0.005);
        var result = ImpliedVolatility.FromBlackScholesMerton(OptionType.Call, 1.875, 21, 20, 0.25, 0.10, 0);
        Assert.Equal(ImpliedVolatilityStatus.Solved, result.Status);
        Assert.Equal(0.235, result.Volatility!.Value, 0.0005);
        Assert.Equal(0.234513, result.Volatility!.Value, 5e-7);
    }

    [Fact]
    public void FromBlackScholesMerton_HullExample15_6Prices_GiveBack20Percent()
    {
        // Hull 11e Example 15.6 [C]: the book's rounded prices 4.76 / 0.81 come from σ = 20%; rounding to cents
        // moves σ by under 0.1 point.
        var call = ImpliedVolatility.FromBlackScholesMerton(OptionType.Call, 4.76, 42, 40, 0.5, 0.10, 0);
        var put = ImpliedVolatility.FromBlackScholesMerton(OptionType.Put, 0.81, 42, 40, 0.5, 0.10, 0);
        Assert.Equal(0.20, call.Volatility!.Value, 0.001);
        Assert.Equal(0.20, put.Volatility!.Value, 0.001);
    }

    [Fact]
    public void FromBlackScholesMerton_ThirtyDayAtTheMoneyPriceFive_GivesAbout43_7Percent()
    {
        // Common practice, no source: with S=K=100, r=0, T=30/365 a price of 5.00 implies about 43.7%
        // (0.437452 [D], recomputed in R with uniroot).
        var result = ImpliedVolatility.FromBlackScholesMerton(OptionType.Call, 5.00, 100, 100, 30 / 365.0, 0, 0);
        Assert.Equal(0.437, result.Volatility!.Value, 0.0005);
        Assert.Equal(0.4374518793, result.Volatility!.Value, 1e-9);
    }

    [Fact]
    public void FromBlackScholesMerton_RGridPrices_RecoverRVolatility()
    {
        // [D]: prices computed in R (Fixtures/Options/bsm_grid.R) invert to the σ R used, where vega is not
        // negligible (vega ≥ 1e-4·S per unit σ); elsewhere the result is typed, never a number.
        var checkedRows = 0;
        foreach (var row in BlackScholesMertonTests.ReadGrid())
        {
            var result = ImpliedVolatility.FromBlackScholesMerton(row.Type, row.Price, row.Spot, row.Strike, row.Years, row.Rate, row.DividendYield);
            var vega = BlackScholesMerton.Vega(row.Spot, row.Strike, row.Years, row.Volatility, row.Rate, row.DividendYield);
            if (vega >= 1e-4 * row.Spot)
            {
                Assert.True(result.IsSolved, FormattableString.Invariant($"{row}: {result}"));
                Assert.True(Math.Abs(result.Volatility!.Value - row.Volatility) <= 1e-9,
                    FormattableString.Invariant($"{row}: {result.Volatility:R}"));
                checkedRows++;
            }
            else
            {
                // A price that underflowed to 0 is no quote (NonPositiveInput).
                Assert.True(result.IsSolved || result.Status is ImpliedVolatilityStatus.BelowIntrinsic or ImpliedVolatilityStatus.VegaTooSmall
                    or ImpliedVolatilityStatus.NonPositiveInput, FormattableString.Invariant($"{row}: {result}"));
            }
        }

        Assert.True(checkedRows > 300, FormattableString.Invariant($"only {checkedRows} rows had vega above the cutoff"));
    }

    [Fact]
    public void FromBlackScholesMerton_RoundTripGrid_RecoversVolatilityTo1e10()
    {
        // [D] round trip σ → price → σ over moneyness K/S 0.5-2, maturities 1 day to 3 years, σ 5%-150%, calls
        // and puts, with rates and yields. Cutoff: vega (∂price/∂σ) ≥ 1e-5·S; below it 4 ulps of the price alone
        // can move σ by more than 1e-10, so those points are only required to return a typed result.
        double[] moneyness = [0.5, 0.6, 0.7, 0.8, 0.9, 0.95, 1.0, 1.05, 1.1, 1.25, 1.5, 1.75, 2.0];
        double[] days = [1, 2, 7, 14, 30, 60, 91, 182, 365, 730, 1095];
        double[] vols = [0.05, 0.1, 0.2, 0.3, 0.5, 0.8, 1.5];
        (double Rate, double Yield)[] carries = [(0, 0), (0.05, 0.02), (-0.01, 0.03)];
        var solved = 0;
        var worst = 0.0;
        foreach (var type in new[] { OptionType.Call, OptionType.Put })
        {
            foreach (var m in moneyness)
            {
                foreach (var d in days)
                {
                    foreach (var vol in vols)
                    {
                        foreach (var (rate, yield) in carries)
                        {
                            var t = d / 365.0;
                            var strike = 100 * m;
                            var price = BlackScholesMerton.Price(type, 100, strike, t, vol, rate, yield);
                            var result = ImpliedVolatility.FromBlackScholesMerton(type, price, 100, strike, t, rate, yield);
                            var vega = BlackScholesMerton.Vega(100, strike, t, vol, rate, yield);
                            if (vega >= 1e-5 * 100)
                            {
                                Assert.True(result.IsSolved, FormattableString.Invariant($"{type} K={strike} T={d}d σ={vol}: {result}"));
                                var error = Math.Abs(result.Volatility!.Value - vol);
                                worst = Math.Max(worst, error);
                                Assert.True(error <= 1e-10, FormattableString.Invariant($"{type} K={strike} T={d}d σ={vol}: {result.Volatility:R}"));
                                solved++;
                            }
                            else
                            {
                                Assert.True(result.IsSolved || result.Status is ImpliedVolatilityStatus.BelowIntrinsic or ImpliedVolatilityStatus.VegaTooSmall
                                    or ImpliedVolatilityStatus.NonPositiveInput, FormattableString.Invariant($"{type} K={strike} T={d}d σ={vol}: {result}"));
                            }
                        }
                    }
                }
            }
        }

        Assert.True(solved > 3000, FormattableString.Invariant($"only {solved} grid points had vega above the cutoff; worst error {worst:R}"));
    }

    [Fact]
    public void FromBlack76_MatchesFromBlackScholesMertonOnTheForward()
    {
        // Black-76 on F = S e^{(r−q)T} is Black-Scholes-Merton [M]; both solvers must agree.
        var price = BlackScholesMerton.Price(OptionType.Put, 100, 95, 0.4, 0.27, 0.03, 0.015);
        var forward = BlackScholesMerton.Forward(100, 0.4, 0.03, 0.015);
        var viaSpot = ImpliedVolatility.FromBlackScholesMerton(OptionType.Put, price, 100, 95, 0.4, 0.03, 0.015);
        var viaForward = ImpliedVolatility.FromBlack76(OptionType.Put, price, forward, 95, 0.4, 0.03);
        Assert.Equal(0.27, viaSpot.Volatility!.Value, 1e-12);
        Assert.Equal(viaSpot.Volatility!.Value, viaForward.Volatility!.Value, 1e-13);
    }

    [Theory]
    [InlineData(OptionType.Call, 1.99, 42, 40)] // below S − K e^{−rT} = 3.95: under intrinsic
    [InlineData(OptionType.Put, 0.0001, 30, 40)] // put far under its intrinsic 9.8
    [InlineData(OptionType.Call, 0.0, 42, 40)] // zero price is not a quote
    public void FromBlackScholesMerton_PriceAtOrBelowIntrinsic_IsTypedFailure(OptionType type, double price, double spot, double strike)
    {
        var result = ImpliedVolatility.FromBlackScholesMerton(type, price, spot, strike, 0.5, 0.10, 0);
        Assert.False(result.IsSolved);
        Assert.Null(result.Volatility);
        Assert.Equal(price <= 0 ? ImpliedVolatilityStatus.NonPositiveInput : ImpliedVolatilityStatus.BelowIntrinsic, result.Status);
    }

    [Fact]
    public void FromBlackScholesMerton_ExactlyDiscountedIntrinsic_IsBelowIntrinsic()
    {
        // No-arbitrage bounds (Hull, chapter on properties of stock options [M]): c > S e^{−qT} − K e^{−rT};
        // at the bound only σ = 0 would do, which is no implied volatility.
        var intrinsic = 42 - (40 * Math.Exp(-0.05));
        var result = ImpliedVolatility.FromBlackScholesMerton(OptionType.Call, intrinsic, 42, 40, 0.5, 0.10, 0);
        Assert.Equal(ImpliedVolatilityStatus.BelowIntrinsic, result.Status);
    }

    [Theory]
    [InlineData(OptionType.Call, 42.0)] // call worth the whole share
    [InlineData(OptionType.Call, 50.0)] // call above the share price
    [InlineData(OptionType.Put, 40.0)] // put worth the undiscounted strike, above K e^{−rT}
    public void FromBlackScholesMerton_PriceAtOrAboveUpperBound_IsAboveUpperBound(OptionType type, double price)
    {
        // Upper bounds (Hull, chapter on properties of stock options [M]): c < S e^{−qT}, p < K e^{−rT}.
        var result = ImpliedVolatility.FromBlackScholesMerton(type, price, 42, 40, 0.5, 0.10, 0);
        Assert.Equal(ImpliedVolatilityStatus.AboveUpperBound, result.Status);
        Assert.Null(result.Volatility);
    }

    [Theory]
    [InlineData(0.0)] // expires today
    [InlineData(-0.01)] // expired
    public void FromBlackScholesMerton_NoTimeLeft_IsExpired(double years)
    {
        var result = ImpliedVolatility.FromBlackScholesMerton(OptionType.Call, 2.0, 42, 40, years, 0.10, 0);
        Assert.Equal(ImpliedVolatilityStatus.Expired, result.Status);
    }

    [Theory]
    [InlineData(-1.0, 42, 40)] // negative price
    [InlineData(2.0, 0, 40)] // zero spot
    [InlineData(2.0, 42, -40)] // negative strike
    [InlineData(double.NaN, 42, 40)] // NaN price
    [InlineData(2.0, double.PositiveInfinity, 40)] // infinite spot
    public void FromBlackScholesMerton_NonPositiveInput_IsTypedFailure(double price, double spot, double strike)
    {
        var result = ImpliedVolatility.FromBlackScholesMerton(OptionType.Call, price, spot, strike, 0.5, 0.10, 0);
        Assert.Equal(ImpliedVolatilityStatus.NonPositiveInput, result.Status);
    }

    [Fact]
    public void FromBlackScholesMerton_DeepInTheMoneyTimeValueLostInRounding_IsVegaTooSmall()
    {
        // A 1-day call struck at half the spot with σ=10%: the time value (about 1e-300) is far below the
        // price's last digit, so the price says nothing about σ [D].
        var price = BlackScholesMerton.Price(OptionType.Call, 100, 50, 1 / 365.0, 0.1, 0.0, 0.0) + 1e-12;
        var result = ImpliedVolatility.FromBlackScholesMerton(OptionType.Call, price, 100, 50, 1 / 365.0, 0.0, 0.0);
        Assert.Equal(ImpliedVolatilityStatus.VegaTooSmall, result.Status);
    }

    [Fact]
    public void FromBlackScholesMerton_FarWingTinyPrice_SolvesInLogSpace()
    {
        // [D] round trip in the far wing, where the price is 1e-20 of the spot: the relative accuracy of the
        // normal tail keeps σ exact to 1e-12.
        var price = BlackScholesMerton.Price(OptionType.Call, 100, 200, 30 / 365.0, 0.3, 0.0, 0.0);
        Assert.InRange(price, 1e-25, 1e-15);
        var result = ImpliedVolatility.FromBlackScholesMerton(OptionType.Call, price, 100, 200, 30 / 365.0, 0.0, 0.0);
        Assert.Equal(0.3, result.Volatility!.Value, 1e-12);
    }

    [Fact]
    public void Solve_RealisticGrid_UsesFewEvaluations()
    {
        // The speed target rests on few price evaluations per solve: at most 8 on a realistic grid [D].
        var max = 0;
        foreach (var m in new[] { 0.7, 0.85, 1.0, 1.15, 1.3 })
        {
            foreach (var d in new[] { 7, 30, 91, 365 })
            {
                foreach (var vol in new[] { 0.1, 0.25, 0.6 })
                {
                    foreach (var type in new[] { OptionType.Call, OptionType.Put })
                    {
                        var price = BlackScholesMerton.Price(type, 100, 100 * m, d / 365.0, vol, 0.03, 0.01);
                        var result = ImpliedVolatility.FromBlackScholesMerton(type, price, 100, 100 * m, d / 365.0, 0.03, 0.01);
                        if (result.IsSolved)
                        {
                            max = Math.Max(max, result.Iterations);
                        }
                    }
                }
            }
        }

        Assert.InRange(max, 1, 8);
    }

    [Property(MaxTest = 500)]
    public bool FromBlackScholesMerton_RandomInputs_RoundTripsOrFailsTyped(ushort moneynessSeed, ushort daysSeed, ushort volSeed, bool isCall)
    {
        // [D] Property: for K/S in [0.5, 2], 1 day to 3 years and σ in [3%, 200%], the solve either recovers σ to
        // 1e-10 (where vega ≥ 1e-5·S, as in the grid test) or returns a typed failure; never a wrong number.
        var strike = 100 * (0.5 + (1.5 * moneynessSeed / ushort.MaxValue));
        var years = (1 + (daysSeed % 1095)) / 365.0;
        var vol = 0.03 + (1.97 * volSeed / ushort.MaxValue);
        var type = isCall ? OptionType.Call : OptionType.Put;
        var price = BlackScholesMerton.Price(type, 100, strike, years, vol, 0.02, 0.01);
        var result = ImpliedVolatility.FromBlackScholesMerton(type, price, 100, strike, years, 0.02, 0.01);
        var vega = BlackScholesMerton.Vega(100, strike, years, vol, 0.02, 0.01);
        return vega >= 1e-3
            ? result.IsSolved && Math.Abs(result.Volatility!.Value - vol) <= 1e-10
            : result.IsSolved ? Math.Abs(result.Volatility!.Value - vol) <= 1e-4 : result.Volatility is null;
    }

    [Fact]
    public void Failed_WithSolvedStatus_Throws()
    {
        Assert.Throws<ArgumentException>(() => ImpliedVolatilityResult.Failed(ImpliedVolatilityStatus.Solved));
    }

    [Fact]
    public void ToString_Invariant_ShowsStatusOrValue()
    {
        Assert.Equal("BelowIntrinsic", ImpliedVolatilityResult.Failed(ImpliedVolatilityStatus.BelowIntrinsic).ToString());
        Assert.StartsWith("Solved(0.25,", ImpliedVolatilityResult.Solved(0.25, 3).ToString(), StringComparison.Ordinal);
        Assert.Equal("0.25", 0.25.ToString(CultureInfo.InvariantCulture));
    }
}
