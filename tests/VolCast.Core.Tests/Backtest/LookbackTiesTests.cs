using VolCast.Core.Backtest;
using VolCast.Core.Scoring;
using Xunit.Abstractions;

namespace VolCast.Core.Tests.Backtest;

public sealed class LookbackTiesTests(ITestOutputHelper output)
{
    [Fact]
    public void Compute_TwoLookbacksWithEqualExpectedLoss_BothTiedAndAClearlyWorseOneOut()
    {
        // Simulation (common practice, no source): realized volatility is lognormal around 20%; two forecasts are the
        // same level times independent lognormal noise of the same size, so their expected QLIKE is equal; the third is
        // 60% too high. A 90% model confidence set (Hansen, Lunde and Nason 2011) keeps a model as good as the best with
        // probability of about 90% or more, so both equal ones are in together in most seeds; the bad one is out.
        const int seeds = 40;
        const int n = 800;
        var bothIn = 0;
        var worseOut = 0;
        for (var seed = 1; seed <= seeds; seed++)
        {
            var random = new Random(seed);
            var realized = new double?[n];
            var a = new double?[n];
            var b = new double?[n];
            var c = new double?[n];
            for (var t = 0; t < n; t++)
            {
                realized[t] = 0.20 * Math.Exp(0.3 * Gaussian.Next(random));
                a[t] = 0.20 * Math.Exp(0.15 * Gaussian.Next(random));
                b[t] = 0.20 * Math.Exp(0.15 * Gaussian.Next(random));
                c[t] = 0.32 * Math.Exp(0.15 * Gaussian.Next(random));
            }

            var answer = LookbackTies.Compute(
                "x", ["x:10", "x:21", "x:63"], [a, b, c], [.. Enumerable.Range(0, n)], realized, null, new ModelConfidenceSetOptions(5, seed, 0.10, 300), 5);
            bothIn += answer.TieSet.Contains("x:10") && answer.TieSet.Contains("x:21") ? 1 : 0;
            worseOut += answer.TieSet.Contains("x:63") ? 0 : 1;
            Assert.Equal(0.90, answer.Level, 12);
            Assert.Equal(n, answer.CommonDates);
        }

        output.WriteLine($"both equal lookbacks tied in {bothIn}/{seeds} seeds; the worse one out in {worseOut}/{seeds}");

        // Rates tested: both equal lookbacks in the set in at least 32 of 40 seeds (80%; each is dropped in at most
        // about 10% of samples), the clearly worse one out in all 40.
        Assert.True(bothIn >= 32, $"both in {bothIn} of {seeds}");
        Assert.Equal(seeds, worseOut);
    }

    [Fact]
    public void Compute_BlockShorterThanHorizon_RaisesTheBlockToTheHorizon()
    {
        // The losses of overlapping h-day windows are autocorrelated up to lag h − 1, so blocks shorter than h cut that
        // dependence (common practice, no source).
        var random = new Random(7);
        var realized = Enumerable.Range(0, 300).Select(_ => (double?)(0.2 * Math.Exp(0.3 * Gaussian.Next(random)))).ToArray();
        var f = realized.Select(_ => (double?)0.2).ToArray();
        var g = realized.Select(_ => (double?)0.25).ToArray();
        var answer = LookbackTies.Compute("x", ["x:5", "x:10"], [f, g], [.. Enumerable.Range(0, 300)], realized, null, new ModelConfidenceSetOptions(2, 1, 0.10, 50), 21);
        Assert.Equal(21, answer.BlockLength);
        Assert.Equal("x:5", answer.InSampleBest);
    }

    [Fact]
    public void Compute_WalkForwardChoices_ReportsLastChoiceMostChosenAndChanges()
    {
        // Counted by hand from the choices below.
        var adaptive = new AdaptiveSelection("adaptive:x", "x", ["x:5", "x:10"], [null, "x:5", "x:10", "x:10", "x:10", "x:5"], 3, 5);
        var realized = new double?[] { 0.2, 0.2, 0.2, 0.2, 0.2, 0.2 };
        var answer = LookbackTies.Compute("x", ["x:5", "x:10"], [realized, realized], [0, 1, 2, 3, 4, 5], realized, adaptive, new ModelConfidenceSetOptions(1, 1, 0.10, 50), 1);
        Assert.Equal("x:5", answer.LastChoice);
        Assert.Equal("x:10", answer.MostChosen);
        Assert.Equal(0.6, answer.MostChosenShare!.Value, 12);
        Assert.Equal(3, answer.ChangeCount);
        Assert.NotNull(answer.Note); // six dates are too few for a bootstrap
    }
}
