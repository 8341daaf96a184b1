using VolCast.Core.Scoring;
using Xunit.Abstractions;

namespace VolCast.Core.Tests.Scoring;

public class ModelConfidenceSetTests(ITestOutputHelper output)
{
    [Theory]
    // Each row: the fast path (prefix sums, bootstrap means drawn once and reused across steps) must give the same
    // p-values as a naive MCS that resamples explicit date indices and recomputes every step from the losses.
    [InlineData(ModelConfidenceSetStatistic.TMax, BootstrapScheme.MovingBlock)]
    [InlineData(ModelConfidenceSetStatistic.TMax, BootstrapScheme.Stationary)]
    [InlineData(ModelConfidenceSetStatistic.TRange, BootstrapScheme.MovingBlock)]
    [InlineData(ModelConfidenceSetStatistic.TRange, BootstrapScheme.Stationary)]
    public void Compute_AgainstNaiveImplementation_SamePValues(ModelConfidenceSetStatistic statistic, BootstrapScheme scheme)
    {
        var losses = SimulatedLosses(new Random(11), 300, out _);
        var options = new ModelConfidenceSetOptions(blockLength: 5, seed: 42, bootstrapReplications: 200, statistic: statistic, bootstrap: scheme);
        var fast = ModelConfidenceSet.Compute(losses, options);
        var naive = NaiveModelConfidenceSet.Compute(losses, options);
        Assert.Equal(naive.Order, fast.EliminationOrder.ToArray());
        for (var i = 0; i < losses.Length; i++)
        {
            Approx.Absolute(naive.PValues[i], fast.PValues[i], 1e-12);
        }
    }

    [Fact]
    public void Compute_SameSeed_IsBitForBitRepeatable()
    {
        var losses = SimulatedLosses(new Random(3), 500, out _);
        var options = new ModelConfidenceSetOptions(blockLength: 10, seed: 123);
        var first = ModelConfidenceSet.Compute(losses, options);
        var second = ModelConfidenceSet.Compute(losses, options);
        Assert.Equal(first.PValues.ToArray(), second.PValues.ToArray());
        Assert.Equal(first.EliminationOrder.ToArray(), second.EliminationOrder.ToArray());
    }

    [Fact]
    public void Compute_Result_PValuesAreRunningMaximumAndMembershipFollowsAlpha()
    {
        // MCS p-value = running maximum of elimination p-values (Hansen, Lunde and Nason 2011; docs/methods.md#model-confidence-set [M]); in the set iff p ≥ α.
        var losses = SimulatedLosses(new Random(5), 800, out _);
        var options = new ModelConfidenceSetOptions(blockLength: 5, seed: 9, bootstrapReplications: 500);
        var r = ModelConfidenceSet.Compute(losses, options);
        var running = 0.0;
        for (var s = 0; s < r.EliminationOrder.Length; s++)
        {
            running = Math.Max(running, r.EliminationPValues[s]);
            Assert.Equal(running, r.PValues[r.EliminationOrder[s]]);
        }

        Assert.Equal(1.0, r.PValues[r.EliminationOrder[^1]]);
        for (var i = 0; i < losses.Length; i++)
        {
            Assert.Equal(r.PValues[i] >= 0.10, r.InSet[i]);
        }
    }

    [Theory]
    // Known truth by simulation (seeded), 60 seeds, T = 1,000, B = 300, block 5, α = 0.10, unnormalized QLIKE on a
    // one-day proxy. Model 0 is the true variance; model 4 under-forecasts by 30%, which QLIKE punishes hard.
    // Asserted: the true model is in the set in at least 85% of seeds (the MCS aims to hold the best with probability
    // ≥ 90% asymptotically; 85% leaves about 2 binomial s.d. at 60 seeds), and model 4 is out in at least 90%.
    [InlineData(ModelConfidenceSetStatistic.TMax, BootstrapScheme.MovingBlock)]
    [InlineData(ModelConfidenceSetStatistic.TRange, BootstrapScheme.MovingBlock)]
    [InlineData(ModelConfidenceSetStatistic.TMax, BootstrapScheme.Stationary)]
    public void Compute_KnownTruth_KeepsTrueModelAndDropsClearlyWorse(ModelConfidenceSetStatistic statistic, BootstrapScheme scheme)
    {
        const int seeds = 60;
        int trueKept = 0, worseDropped = 0;
        for (var seed = 0; seed < seeds; seed++)
        {
            var losses = SimulatedLosses(new Random(200 + seed), 1000, out _);
            var r = ModelConfidenceSet.Compute(losses, new ModelConfidenceSetOptions(5, seed, bootstrapReplications: 300, statistic: statistic, bootstrap: scheme));
            trueKept += r.InSet[0] ? 1 : 0;
            worseDropped += r.InSet[4] ? 0 : 1;
        }

        output.WriteLine(FormattableString.Invariant($"{statistic}/{scheme}: true model kept {trueKept}/{seeds}, clearly worse dropped {worseDropped}/{seeds}"));
        Assert.True(trueKept >= 0.85 * seeds);
        Assert.True(worseDropped >= 0.90 * seeds);
    }

    [Fact]
    public void Compute_OneModel_IsInSetWithPValueOne()
    {
        var r = ModelConfidenceSet.Compute([[1.0, 2, 3, 4]], new ModelConfidenceSetOptions(2, 1));
        Assert.Equal(1.0, r.PValues[0]);
        Assert.True(r.InSet[0]);
    }

    [Fact]
    public void Compute_IdenticalModels_AllStayWithPValueOne()
    {
        double[] a = [1.0, 2, 3, 4, 3, 2, 1, 2];
        var r = ModelConfidenceSet.Compute([a, (double[])a.Clone()], new ModelConfidenceSetOptions(2, 1));
        Assert.All(r.PValues, p => Assert.Equal(1.0, p));
        Assert.All(r.InSet, Assert.True);
    }

    [Fact]
    public void Compute_BlockLongerThanSample_Throws()
    {
        var ex = Assert.Throws<ArgumentException>(() => ModelConfidenceSet.Compute([[1.0, 2, 3], [2.0, 3, 4]], new ModelConfidenceSetOptions(5, 1)));
        Assert.Contains("block length (5) must not exceed the number of dates (3)", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Compute_SeriesOfDifferentLengths_Throws()
    {
        Assert.Throws<ArgumentException>(() => ModelConfidenceSet.Compute([[1.0, 2, 3], [2.0, 3]], new ModelConfidenceSetOptions(1, 1)));
    }

    [Fact]
    public void Compute_NullSeries_ThrowsNamingIt()
    {
        var ex = Assert.Throws<ArgumentNullException>(() => ModelConfidenceSet.Compute([[1.0, 2, 3], null!], new ModelConfidenceSetOptions(1, 1)));
        Assert.Equal("lossesByModel[1]", ex.ParamName);
    }

    [Fact]
    public void Compute_MatrixAndListForms_Agree()
    {
        // The row-major T × m overload and the one-array-per-model overload are the same computation.
        var losses = SimulatedLosses(new Random(8), 200, out _);
        var matrix = new double[200 * 5];
        for (var t = 0; t < 200; t++)
        {
            for (var i = 0; i < 5; i++)
            {
                matrix[(t * 5) + i] = losses[i][t];
            }
        }

        var options = new ModelConfidenceSetOptions(4, 77, bootstrapReplications: 100);
        Assert.Equal(ModelConfidenceSet.Compute(losses, options).PValues.ToArray(), ModelConfidenceSet.Compute(matrix, 5, options).PValues.ToArray());
    }

    [Fact]
    public void Compute_NaNLoss_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => ModelConfidenceSet.Compute([[1.0, double.NaN, 3], [2.0, 3, 4]], new ModelConfidenceSetOptions(1, 1)));
    }

    [Theory]
    // Each row: one setting out of range.
    [InlineData(0, 0.10, 1000)]  // block below 1
    [InlineData(5, 0.0, 1000)]   // α at 0
    [InlineData(5, 1.0, 1000)]   // α at 1
    [InlineData(5, 0.10, 5)]     // too few replications
    public void Options_OutOfRange_Throws(int block, double alpha, int replications)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new ModelConfidenceSetOptions(block, 1, alpha, replications));
    }

    [Fact]
    public void Options_Defaults_AreTheDocumentedDefaults()
    {
        // The project's defaults: B = 1,000, α = 0.10, seeded; T_max and moving blocks are this layer's documented defaults.
        var o = new ModelConfidenceSetOptions(21, 7);
        Assert.Equal(1000, o.BootstrapReplications);
        Assert.Equal(0.10, o.Alpha);
        Assert.Equal(ModelConfidenceSetStatistic.TMax, o.Statistic);
        Assert.Equal(BootstrapScheme.MovingBlock, o.Bootstrap);
    }

    /// <summary>
    /// Five forecasters of a log-AR(1) variance, scored by unnormalized QLIKE against a one-day proxy σ_t |z_t|:
    /// 0 the truth, 1 the truth with multiplicative noise, 2 the truth × 1.1, 3 the unconditional level, 4 the truth × 0.7.
    /// </summary>
    internal static double[][] SimulatedLosses(Random random, int count, out double[] realized)
    {
        realized = new double[count];
        var forecasts = new double[5][];
        for (var i = 0; i < 5; i++)
        {
            forecasts[i] = new double[count];
        }

        var mu = Math.Log(0.04);
        var logVariance = mu;
        for (var t = 0; t < count; t++)
        {
            logVariance = mu + (0.97 * (logVariance - mu)) + (0.2 * Gaussian.Next(random));
            var sigma = Math.Sqrt(Math.Exp(logVariance));
            realized[t] = sigma * Math.Abs(Gaussian.Next(random));
            forecasts[0][t] = sigma;
            forecasts[1][t] = sigma * Math.Exp(0.15 * Gaussian.Next(random));
            forecasts[2][t] = sigma * 1.1;
            forecasts[3][t] = 0.2 * Math.Exp(0.5 * 0.2 * 0.2 / (1 - (0.97 * 0.97)) / 2);
            forecasts[4][t] = sigma * 0.7;
        }

        var losses = new double[5][];
        for (var i = 0; i < 5; i++)
        {
            losses[i] = Losses.Compute(LossFunction.QlikeUnnormalized, realized, forecasts[i]);
        }

        return losses;
    }
}
