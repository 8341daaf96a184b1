using System.Text.Json;
using VolCast.Core.Scoring;
using Xunit.Abstractions;

namespace VolCast.Core.Tests.Scoring;

public class DieboldMarianoTests(ITestOutputHelper output)
{
    private static readonly double[] Toy = [1, 2, 3, 4, 5];

    [Fact]
    public void Test_ToyHorizonOne_MatchesReferenceSheet()
    {
        // docs/methods.md#diebold-mariano toy, d = [1..5], h = 1 [D]: DM = 4.743416, DM* = 4.242641 (6 decimals printed).
        var r = DieboldMariano.Test(Toy, 1);
        Approx.Absolute(4.743416, r.UncorrectedStatistic!.Value, 5e-7);
        Approx.Absolute(4.242641, r.Statistic!.Value, 5e-7);
        Assert.Equal(0, r.Lag);
    }

    [Fact]
    public void Test_ToyHorizonTwoRectangular_MatchesReferenceSheet()
    {
        // docs/methods.md#diebold-mariano toy, h = 2, rectangular window [D]: V̂ = 3.6, DM = 3.535534, DM* = 2.449490.
        var r = DieboldMariano.Test(Toy, 2, LongRunVarianceWindow.Rectangular);
        Approx.Relative(3.6, r.LongRunVariance, 1e-14);
        Approx.Absolute(3.535534, r.UncorrectedStatistic!.Value, 5e-7);
        Approx.Absolute(2.449490, r.Statistic!.Value, 5e-7);
        Assert.Equal(LongRunVarianceWindow.Rectangular, r.WindowUsed);
    }

    [Fact]
    public void Test_ToyHorizonTwoBartlett_MatchesReferenceSheet()
    {
        // docs/methods.md#diebold-mariano toy, Bartlett with L = 1 [D]: DM = 4.008919 (before the HLN factor, which is √0.48 for T = 5, h = 2).
        var r = DieboldMariano.Test(Toy, 2, LongRunVarianceWindow.Bartlett);
        Approx.Absolute(4.008919, r.UncorrectedStatistic!.Value, 5e-7);
        Approx.Relative(4.008919 * Math.Sqrt(0.48), r.Statistic!.Value, 1e-6);
    }

    [Theory]
    // docs/methods.md#diebold-mariano HLN factor table [D], 6 decimals printed.
    [InlineData(100, 1, 0.994987)]
    [InlineData(100, 5, 0.954987)]
    [InlineData(100, 22, 0.784984)]
    [InlineData(250, 22, 0.913998)]
    [InlineData(1000, 22, 0.978500)]
    public void HlnFactor_ReferenceTable_Matches(int count, int horizon, double expected)
    {
        Approx.Absolute(expected, DieboldMariano.HlnFactor(count, horizon), 5e-7);
    }

    [Theory]
    // R fixture (Fixtures/Scoring/make-fixture.R): forecast 8.20 dm.test(e1, e2, h, power, varestimator), whose
    // statistic already includes the HLN factor and whose p-value is 2·pt(−|DM*|, T − 1); e1 = forecast − realized,
    // e2 = implied − realized, d = |e1|^power − |e2|^power. Agreement asked: 1e-10 relative.
    [InlineData("bartlett_h5_power2", 5, 2, LongRunVarianceWindow.Bartlett)]
    [InlineData("bartlett_h5_power1", 5, 1, LongRunVarianceWindow.Bartlett)]
    [InlineData("bartlett_h21_power2", 21, 2, LongRunVarianceWindow.Bartlett)]
    [InlineData("acf_h5_power2", 5, 2, LongRunVarianceWindow.Rectangular)] // "acf" is the rectangular window; positive here, so no fallback on either side.
    [InlineData("acf_h1_power2", 1, 2, LongRunVarianceWindow.Rectangular)]
    public void Test_RFixture_MatchesForecastDmTest(string name, int horizon, int power, LongRunVarianceWindow window)
    {
        var fixture = ScoringFixture.Shared;
        var expected = fixture.Reference.GetProperty("diebold_mariano").GetProperty(name);
        var d = new double[fixture.Realized.Length];
        for (var t = 0; t < d.Length; t++)
        {
            d[t] = Math.Pow(Math.Abs(fixture.Forecast[t] - fixture.Realized[t]), power)
                - Math.Pow(Math.Abs(fixture.Implied[t] - fixture.Realized[t]), power);
        }

        var r = DieboldMariano.Test(d, horizon, window);
        Assert.Equal(window, r.WindowUsed);
        Approx.Relative(expected.GetProperty("statistic").GetDouble(), r.Statistic!.Value, 1e-10);
        Approx.Relative(expected.GetProperty("p_value").GetDouble(), r.PValue!.Value, 1e-10);
    }

    [Theory]
    // R fixture (Fixtures/Scoring/dm-defaults.json, make-dm-defaults.R): forecast 8.20 dm.test(e1, e2, h = h) with every
    // other argument at its default (varestimator = "acf", power = 2, two-sided) [C]. Our default window must give
    // the same statistic and p-value (1e-10 relative) and the same rectangular long-run variance; R's estimate is
    // positive in these cases, so neither side falls back.
    [InlineData("h1", 1)]
    [InlineData("h5", 5)]
    [InlineData("h21", 21)]
    public void Test_DefaultWindow_MatchesForecastDmTestDefaults(string name, int horizon)
    {
        var fixture = ScoringFixture.Shared;
        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "Fixtures", "Scoring", "dm-defaults.json")));
        var expected = json.RootElement.GetProperty("cases").GetProperty(name);
        var d = fixture.Forecast.Select((f, t) => Math.Pow(f - fixture.Realized[t], 2) - Math.Pow(fixture.Implied[t] - fixture.Realized[t], 2)).ToArray();

        var r = DieboldMariano.Test(d, horizon);

        Assert.Equal(LongRunVarianceWindow.Rectangular, r.RequestedWindow);
        Assert.False(r.FellBackToBartlett);
        Assert.Equal("rectangular", r.VarianceEstimator);
        Assert.Equal(horizon - 1, r.Lag);
        Approx.Relative(expected.GetProperty("rectangular_variance").GetDouble(), r.LongRunVariance, 1e-10);
        Approx.Relative(expected.GetProperty("statistic").GetDouble(), r.Statistic!.Value, 1e-10);
        Approx.Relative(expected.GetProperty("p_value").GetDouble(), r.PValue!.Value, 1e-10);
    }

    [Fact]
    public void Test_RFixtureRectangularVariance_MatchesAcfSum()
    {
        // R fixture: sum(c(γ̂_0, 2 γ̂_1..4)) from acf(type = "covariance") on d = e1² − e2², h = 5.
        var fixture = ScoringFixture.Shared;
        var d = fixture.Forecast.Select((f, t) => Math.Pow(f - fixture.Realized[t], 2) - Math.Pow(fixture.Implied[t] - fixture.Realized[t], 2)).ToArray();
        var r = DieboldMariano.Test(d, 5, LongRunVarianceWindow.Rectangular);
        Approx.Relative(fixture.Reference.GetProperty("dm_rectangular_variance_h5").GetDouble(), r.LongRunVariance, 1e-10);
    }

    [Fact]
    public void Test_FirstForecasterLossLower_StatisticIsNegative()
    {
        // Sign convention (documented): d = L1 − L2, negative means the first forecaster's loss is lower.
        double[] first = [0.1, 0.2, 0.1, 0.3, 0.2, 0.1];
        double[] second = [0.3, 0.25, 0.4, 0.35, 0.5, 0.2];
        var r = DieboldMariano.Test(first, second, 1);
        Assert.True(r.Statistic < 0);
        Assert.True(r.MeanDifferential < 0);
    }

    [Fact]
    public void Test_RectangularNegative_FallsBackToBartlett()
    {
        // d_t = 0.1 + (−1)^t: γ̂_1 ≈ −γ̂_0, so the rectangular V̂ = γ̂_0 + 2γ̂_1 < 0 and the Bartlett estimate is used
        // (docs/methods.md#diebold-mariano [C: Harvey, Leybourne and Whitehouse 2017]: fall back to Bartlett weights).
        var d = Enumerable.Range(0, 40).Select(t => 0.1 + (t % 2 == 0 ? 1.0 : -1.0)).ToArray();
        Assert.True(NeweyWest.LongRunVariance(d, 1, LongRunVarianceWindow.Rectangular) < 0);
        var r = DieboldMariano.Test(d, 2, LongRunVarianceWindow.Rectangular);
        var bartlett = DieboldMariano.Test(d, 2, LongRunVarianceWindow.Bartlett);
        Assert.Equal(LongRunVarianceWindow.Rectangular, r.RequestedWindow);
        Assert.Equal(LongRunVarianceWindow.Bartlett, r.WindowUsed);
        Assert.True(r.FellBackToBartlett);
        Assert.Equal("bartlett (rectangular not positive)", r.VarianceEstimator);
        Assert.Equal(r.WindowUsed, DieboldMariano.Test(d, 2).WindowUsed); // the default asks for rectangular and falls back the same way
        Assert.Equal(bartlett.Statistic, r.Statistic);
        Assert.True(r.LongRunVariance > 0);
    }

    [Fact]
    public void Test_ConstantDifferential_HasNoStatistic()
    {
        // Identical forecasts give d = 0 at every date: no variance, so no statistic (null rather than NaN).
        var r = DieboldMariano.Test(new double[50], 5);
        Assert.Null(r.Statistic);
        Assert.Null(r.PValue);
        Assert.Equal(0.0, r.MeanDifferential);
    }

    [Fact]
    public void Test_TooFewForHorizon_Throws()
    {
        // T = 5, h = 4: T + 1 − 2h + h(h−1)/T = 0.4 / 5 > 0 passes; T = 4, h = 4 → (5 − 8 + 3)/4 = 0 fails.
        Assert.NotNull(DieboldMariano.Test(Toy, 4).Statistic);
        Assert.Throws<ArgumentException>(() => DieboldMariano.Test([1.0, 2, 3, 5], 4));
    }

    [Fact]
    public void Test_OneObservation_Throws()
    {
        Assert.Throws<ArgumentException>(() => DieboldMariano.Test([1.0], 1));
    }

    [Fact]
    public void Test_LengthsDiffer_Throws()
    {
        Assert.Throws<ArgumentException>(() => DieboldMariano.Test([1.0, 2], [1.0, 2, 3], 1));
    }

    [Fact]
    public void Test_ZeroMeanOverlappingDifferential_RejectsNearNominalRate()
    {
        // Known truth by simulation (seeded): d_t = sum of 5 consecutive N(0,1) draws (an MA(4), as overlapping 5-day
        // targets give), zero mean, T = 500, 400 seeds, test at 5%.
        // Rectangular window (exact for an MA(h−1)): asserted within [2%, 9%] (binomial s.d. ≈ 1.1 points at 400).
        // Bartlett at lag h − 1 under-weights the MA(4) autocovariances (expected V̂ ≈ 17 vs the true 25), so it
        // over-rejects: asserted within [5%, 20%], above the rectangular rate. Measured rates are printed.
        const int seeds = 400, n = 500, h = 5;
        int rectangular = 0, bartlett = 0;
        for (var seed = 0; seed < seeds; seed++)
        {
            var d = SimulatedSeries.OverlappingSums(new Random(1000 + seed), n, h);
            if (DieboldMariano.Test(d, h, LongRunVarianceWindow.Rectangular).PValue < 0.05)
            {
                rectangular++;
            }

            if (DieboldMariano.Test(d, h, LongRunVarianceWindow.Bartlett).PValue < 0.05)
            {
                bartlett++;
            }
        }

        double rectangularRate = (double)rectangular / seeds, bartlettRate = (double)bartlett / seeds;
        output.WriteLine(FormattableString.Invariant($"rejection at 5%: rectangular {rectangularRate:P1}, Bartlett lag h-1 {bartlettRate:P1}"));
        Assert.InRange(rectangularRate, 0.02, 0.09);
        Assert.InRange(bartlettRate, 0.05, 0.20);
        Assert.True(bartlettRate >= rectangularRate);
    }

    [Fact]
    public void Test_DefaultOnOverlapping21DayTargetsUnderTheNull_RejectsNearFivePercent()
    {
        // Size by simulation (seeded, 2,000 seeds): daily returns N(0, 1); the target at each of T = 750 dates is the
        // mean of the next 21 squared returns (overlapping 21-day realized variance, as in a backtest at the default
        // horizon); two constant variance forecasts 0.8 and 1.2 have equal expected squared-error loss, since
        // E(RV − 0.8)² − E(RV − 1.2)² = 0.8·(E RV − 1) = 0. The loss differential is an MA(20) of skewed terms.
        // The default test (rectangular window at lag 20, HLN correction, t(T − 1)) at the 5% level must reject in
        // 3.5% to 7.5% of the seeds: 5% is the nominal size (Diebold and Mariano 1995; Harvey, Leybourne and Newbold
        // 1997); the band is 1.5 points either side, about three binomial standard errors (0.49 points at 2,000
        // seeds) plus the small-sample distortion of a 20-lag long-run variance on 750 dates. Bartlett weights at the
        // same lag reject more often (printed, and asserted above the default's rate).
        const int seeds = 2000, n = 750, h = 21;
        int rejected = 0, bartlett = 0, fallbacks = 0;
        var squares = new double[n + h];
        var d = new double[n];
        for (var seed = 0; seed < seeds; seed++)
        {
            var random = new Random(70_000 + seed);
            for (var i = 0; i < squares.Length; i++)
            {
                var r = Gaussian.Next(random);
                squares[i] = r * r;
            }

            double window = 0;
            for (var i = 1; i <= h; i++)
            {
                window += squares[i];
            }

            for (var t = 0; t < n; t++)
            {
                // Target at t: mean of squares t+1 .. t+h.
                if (t > 0)
                {
                    window += squares[t + h] - squares[t];
                }

                var rv = window / h;
                d[t] = ((rv - 0.8) * (rv - 0.8)) - ((rv - 1.2) * (rv - 1.2));
            }

            var test = DieboldMariano.Test(d, h);
            rejected += test.PValue < 0.05 ? 1 : 0;
            fallbacks += test.FellBackToBartlett ? 1 : 0;
            bartlett += DieboldMariano.Test(d, h, LongRunVarianceWindow.Bartlett).PValue < 0.05 ? 1 : 0;
        }

        double rate = (double)rejected / seeds, bartlettRate = (double)bartlett / seeds;
        output.WriteLine(FormattableString.Invariant(
            $"21-day overlapping targets, T = {n}, {seeds} seeds, rejection at 5%: rectangular (default) {rate:P2} ({fallbacks} fell back to Bartlett), Bartlett lag 20 {bartlettRate:P2}"));
        Assert.InRange(rate, 0.035, 0.075);
        Assert.True(bartlettRate > rate);
    }

    [Fact]
    public void Test_ShiftedOverlappingDifferential_RejectsMostly()
    {
        // Power (seeded): the same MA(4) with mean −0.5 (s.d. of the long-run mean ≈ 5/√500 ≈ 0.22, so a shift of about
        // 2.2 standard errors): Bartlett rejects in at least half of 200 seeds, always with a negative statistic when it does.
        const int seeds = 200, n = 500, h = 5;
        var rejected = 0;
        for (var seed = 0; seed < seeds; seed++)
        {
            var d = SimulatedSeries.OverlappingSums(new Random(5000 + seed), n, h).Select(v => v - 0.5).ToArray();
            var r = DieboldMariano.Test(d, h);
            if (r.PValue < 0.05)
            {
                rejected++;
                Assert.True(r.Statistic < 0);
            }
        }

        output.WriteLine(FormattableString.Invariant($"power at 5%: {(double)rejected / seeds:P1}"));
        Assert.True(rejected >= seeds / 2);
    }
}
