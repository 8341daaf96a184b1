using VolCast.Core.Options;

namespace VolCast.Core.Tests.Options;

public sealed class ConstantTenorSeriesTests
{
    private const double Spot = 100;
    private const double Rate = 0.03;
    private const double Yield = 0.01;
    private static readonly DateOnly Day = new(2024, 3, 1);

    [Fact]
    public void Compute_FlatSmilePerExpiry_RecoversTotalVarianceInterpolationTo1e9()
    {
        // [D] Synthetic chain: flat smiles at 25% (20 days) and 30% (50 days), calls and puts at every strike.
        // The 30-day value is the total-variance interpolation written out here from its definition.
        var quotes = Chain(Day, 20, 0.25).Concat(Chain(Day, 50, 0.30)).ToList();
        var result = ConstantTenorSeries.Compute(quotes, new ConstantTenorOptions(30));

        double t1 = 20 / 365.0, t2 = 50 / 365.0, tau = 30 / 365.0;
        var w = (0.25 * 0.25 * t1) + (((0.30 * 0.30 * t2) - (0.25 * 0.25 * t1)) * (tau - t1) / (t2 - t1));
        var point = Assert.Single(result.Points);
        Assert.Equal(Day, point.Date);
        Assert.Equal(Math.Sqrt(w / tau), point.Volatility, 1e-9);
        Assert.False(point.IsExtrapolated);
        Assert.Equal(Day.AddDays(20), point.NearExpiry);
        Assert.Equal(Day.AddDays(50), point.FarExpiry);
        Assert.All(result.Expiries, e => Assert.Equal(ForwardSource.PutCallParity, e.ForwardSource));
        Assert.Equal(Spot * Math.Exp((Rate - Yield) * t1), result.Expiries[0].Forward, 1e-10);
        Assert.Empty(result.Diagnostics);
    }

    [Fact]
    public void Compute_ExpiryExactlyAtTenor_UsesItsVolatility()
    {
        var quotes = Chain(Day, 10, 0.22).Concat(Chain(Day, 30, 0.27)).Concat(Chain(Day, 60, 0.35)).ToList();
        var point = Assert.Single(ConstantTenorSeries.Compute(quotes, new ConstantTenorOptions(30)).Points);
        Assert.Equal(0.27, point.Volatility, 1e-10);
        Assert.Equal(point.NearExpiry, point.FarExpiry);
    }

    [Fact]
    public void Compute_TenorBeforeFirstExpiry_RefusesDateByDefault()
    {
        var quotes = Chain(Day, 40, 0.25).Concat(Chain(Day, 70, 0.3)).ToList();
        var result = ConstantTenorSeries.Compute(quotes, new ConstantTenorOptions(30));
        Assert.Empty(result.Points);
        var diagnostic = Assert.Single(result.Diagnostics);
        Assert.Equal(DiagnosticReason.TenorBeforeFirstExpiry, diagnostic.Reason);
        Assert.Equal(DiagnosticScope.Date, diagnostic.Scope);
        Assert.Equal(1, result.RejectedDateCount);
    }

    [Fact]
    public void Compute_TenorAfterLastExpiryWithFlatExtrapolation_FlagsValue()
    {
        var quotes = Chain(Day, 10, 0.25).Concat(Chain(Day, 20, 0.28)).ToList();
        var result = ConstantTenorSeries.Compute(quotes, new ConstantTenorOptions(30, TenorExtrapolation.FlatVolatility));
        var point = Assert.Single(result.Points);
        Assert.True(point.IsExtrapolated);
        Assert.Equal(0.28, point.Volatility, 1e-10);
        var diagnostic = Assert.Single(result.Diagnostics);
        Assert.Equal(DiagnosticReason.Extrapolated, diagnostic.Reason);
        Assert.True(diagnostic.IsWarning);
        Assert.Equal(0, result.RejectedDateCount);
    }

    [Fact]
    public void Compute_SmileWithOnlyOutOfTheMoneyQuotes_InterpolatesLinearlyInVolAtRateForward()
    {
        // [D] A put at 95 priced at 30% and a call at 105 priced at 20%, no common strike: the forward comes from
        // r and q, and the at-the-money volatility is linear in σ between the two strikes.
        var expiry = Day.AddDays(30);
        var t = 30 / 365.0;
        var quotes = new List<OptionQuote>
        {
            Quote(Day, expiry, 95, OptionType.Put, 0.30),
            Quote(Day, expiry, 105, OptionType.Call, 0.20),
        };
        var result = ConstantTenorSeries.Compute(quotes, new ConstantTenorOptions(30));
        var atm = Assert.Single(result.Expiries);
        var forward = Spot * Math.Exp((Rate - Yield) * t);
        Assert.Equal(ForwardSource.RateAndDividendYield, atm.ForwardSource);
        Assert.Equal(forward, atm.Forward, 1e-12);
        Assert.Equal(0.30 + ((0.20 - 0.30) * (forward - 95) / 10), atm.Volatility, 1e-10);
        Assert.Equal(atm.Volatility, Assert.Single(result.Points).Volatility, 1e-12);
    }

    [Fact]
    public void Compute_OnlyStrikesBelowForward_RejectsExpiryAndReportsDate()
    {
        var expiry = Day.AddDays(30);
        var quotes = new List<OptionQuote> { Quote(Day, expiry, 80, OptionType.Put, 0.3), Quote(Day, expiry, 90, OptionType.Put, 0.3) };
        var result = ConstantTenorSeries.Compute(quotes, new ConstantTenorOptions(30));
        Assert.Empty(result.Points);
        Assert.Contains(result.Diagnostics, d => d.Reason == DiagnosticReason.ForwardOutsideStrikes && d.Scope == DiagnosticScope.Expiry);
        Assert.Contains(result.Diagnostics, d => d.Reason == DiagnosticReason.NoUsableExpiry && d.Scope == DiagnosticScope.Date);
    }

    [Fact]
    public void Compute_BadQuotes_AreCountedAndTheRestStillUsed()
    {
        var quotes = Chain(Day, 20, 0.25).Concat(Chain(Day, 50, 0.30)).ToList();
        var expiry = Day.AddDays(20);
        quotes.Add(new OptionQuote(Day, Spot, Day, 100, OptionType.Call, 1.0, Rate, Yield, 101)); // expires on the quote date
        quotes.Add(new OptionQuote(Day, Spot, expiry, 100, OptionType.Call, 0.0, Rate, Yield, 102)); // zero price (and a duplicate)
        quotes.Add(new OptionQuote(Day, Spot, expiry, 90, OptionType.Call, 5.0, Rate, Yield, 103)); // duplicate of an earlier quote
        quotes.Add(new OptionQuote(Day, Spot, expiry, 137, OptionType.Put, 30.0, Rate, Yield, 104)); // below intrinsic (~37)
        var result = ConstantTenorSeries.Compute(quotes, new ConstantTenorOptions(30));

        Assert.Single(result.Points);
        Assert.Equal(4, result.RejectedQuoteCount);
        Assert.Contains(result.Diagnostics, d => d.SourceLine == 101 && d.Reason == DiagnosticReason.Expired);
        Assert.Contains(result.Diagnostics, d => d.SourceLine == 102 && d.Reason == DiagnosticReason.NonPositiveInput);
        Assert.Contains(result.Diagnostics, d => d.SourceLine == 103 && d.Reason == DiagnosticReason.Duplicate);
        Assert.Contains(result.Diagnostics, d => d.SourceLine == 104 && d.Reason == DiagnosticReason.BelowIntrinsic);
    }

    [Fact]
    public void Compute_UnderlyingDiffersWithinExpiry_RejectsExpiry()
    {
        var quotes = Chain(Day, 20, 0.25).ToList();
        quotes.Add(new OptionQuote(Day, Spot + 1, Day.AddDays(20), 102.5, OptionType.Call, 2.0, Rate, Yield, 7));
        var result = ConstantTenorSeries.Compute(quotes, new ConstantTenorOptions(20));
        Assert.Empty(result.Points);
        Assert.Contains(result.Diagnostics, d => d.Reason == DiagnosticReason.InconsistentInputs && d.SourceLine == 7);
    }

    [Fact]
    public void Compute_DecreasingTotalVariance_KeepsValueWithWarning()
    {
        // 60% for 20 days then 20% for 50 days: σ²T falls, a calendar arbitrage in the quotes.
        var quotes = Chain(Day, 20, 0.60).Concat(Chain(Day, 50, 0.20)).ToList();
        var result = ConstantTenorSeries.Compute(quotes, new ConstantTenorOptions(30));
        Assert.Single(result.Points);
        var warning = Assert.Single(result.Diagnostics);
        Assert.Equal(DiagnosticReason.DecreasingTotalVariance, warning.Reason);
        Assert.True(warning.IsWarning);
    }

    [Fact]
    public void Compute_SeveralDates_OneValuePerDateInOrder()
    {
        var second = Day.AddDays(1);
        var quotes = Chain(second, 19, 0.2).Concat(Chain(second, 49, 0.2)).Concat(Chain(Day, 20, 0.3)).Concat(Chain(Day, 50, 0.3)).ToList();
        var result = ConstantTenorSeries.Compute(quotes, new ConstantTenorOptions(30));
        Assert.Equal([Day, second], result.Points.Select(p => p.Date));
        var series = result.ToImpliedSeries();
        Assert.Equal(2, series.Count);
        Assert.Equal(0.3, series.Volatility[0], 1e-10);
        Assert.Equal(0.2, series.Volatility[1], 1e-10);
    }

    [Fact]
    public void Options_TenorBelowOneDay_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new ConstantTenorOptions(0));
    }

    private static IEnumerable<OptionQuote> Chain(DateOnly date, int days, double vol)
    {
        var expiry = date.AddDays(days);
        for (var strike = 80.0; strike <= 120; strike += 5)
        {
            yield return Quote(date, expiry, strike, OptionType.Call, vol);
            yield return Quote(date, expiry, strike, OptionType.Put, vol);
        }
    }

    private static OptionQuote Quote(DateOnly date, DateOnly expiry, double strike, OptionType type, double vol)
    {
        var price = BlackScholesMerton.Price(type, Spot, strike, DayCount.YearsAct365(date, expiry), vol, Rate, Yield);
        return new OptionQuote(date, Spot, expiry, strike, type, price, Rate, Yield);
    }
}
