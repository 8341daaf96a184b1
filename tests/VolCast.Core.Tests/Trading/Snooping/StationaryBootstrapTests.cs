using VolCast.Core.Tests.Scoring;
using VolCast.Core.Trading.Snooping;

namespace VolCast.Core.Tests.Trading.Snooping;

public class StationaryBootstrapTests
{
    [Fact]
    public void Draw_SameSeed_GivesTheSameResamplesBitForBit()
    {
        var first = StationaryBootstrap.Draw(300, 7.5, 50, seed: 11);
        var second = StationaryBootstrap.Draw(300, 7.5, 50, seed: 11);
        var other = StationaryBootstrap.Draw(300, 7.5, 50, seed: 12);
        var a = new int[300];
        var b = new int[300];
        var c = new int[300];
        var differs = false;
        for (var r = 0; r < 50; r++)
        {
            first.CopyIndices(r, a);
            second.CopyIndices(r, b);
            other.CopyIndices(r, c);
            Assert.Equal(a, b);
            differs |= !a.AsSpan().SequenceEqual(c);
        }

        Assert.True(differs, "another seed must give other resamples");
    }

    [Fact]
    public void Draw_EachReplication_IsTDatesInBlocksOfConsecutiveDatesThatWrapAround()
    {
        // Politis & Romano (1994): a resample is blocks X_I, X_{I+1}, …, taken modulo T (wrapping to the first date).
        const int Days = 97;
        var draws = StationaryBootstrap.Draw(Days, 6, 200, seed: 5);
        var (starts, lengths, offsets) = draws.Blocks;
        var indices = new int[Days];
        var wrapped = 0;
        for (var r = 0; r < draws.Replications; r++)
        {
            draws.CopyIndices(r, indices);
            var position = 0;
            var total = 0;
            for (var i = offsets[r]; i < offsets[r + 1]; i++)
            {
                Assert.InRange(starts[i], 0, Days - 1);
                Assert.InRange(lengths[i], 1, Days);
                Assert.Equal(starts[i], indices[position]);
                for (var j = 1; j < lengths[i]; j++)
                {
                    Assert.Equal((indices[position + j - 1] + 1) % Days, indices[position + j]);
                    wrapped += indices[position + j] == 0 ? 1 : 0;
                }

                position += lengths[i];
                total += lengths[i];
            }

            Assert.Equal(Days, total);
            Assert.Equal(offsets[r + 1] - offsets[r], draws.BlockCount(r));
        }

        Assert.True(wrapped > 0, "with 200 replications some block must run past the last date and wrap");
    }

    [Theory]
    // Politis & Romano (1994): after each resampled date a new block starts with probability p = 1/L, independently,
    // so the block lengths are geometric with mean L. Over B replications the number of new starts after the first
    // date is Binomial(B·(T − 1), 1/L): the observed rate must be within four binomial standard errors of 1/L.
    [InlineData(1.0)]
    [InlineData(2.0)]
    [InlineData(7.5)]
    [InlineData(21.0)]
    public void Draw_NewBlocksStartAtRateOneOverL_SoBlocksHaveMeanLengthL(double meanBlockLength)
    {
        const int Days = 500;
        const int Replications = 400;
        var draws = StationaryBootstrap.Draw(Days, meanBlockLength, Replications, seed: 2024);
        long starts = 0;
        for (var r = 0; r < Replications; r++)
        {
            starts += draws.BlockCount(r) - 1;
        }

        var trials = (double)Replications * (Days - 1);
        var p = 1.0 / meanBlockLength;
        var rate = starts / trials;
        var standardError = Math.Sqrt(p * (1 - p) / trials);
        Assert.InRange(rate, p - (4 * standardError) - 1e-15, p + (4 * standardError) + 1e-15);
        Assert.InRange(1.0 / rate, meanBlockLength * 0.95, meanBlockLength * 1.05);
    }

    [Fact]
    public void Draw_BlockLengths_AreGeometric()
    {
        // Politis & Romano (1994): P(length = j) = p(1 − p)^{j−1}. Blocks not cut at the end of a replication are
        // checked for j = 1, 2, 3 within four standard errors of a proportion. The cut blocks are left out; leaving out
        // one block per replication among about 200 biases each share by well under one standard error here.
        const double L = 4.0;
        var draws = StationaryBootstrap.Draw(800, L, 300, seed: 99);
        var (_, lengths, offsets) = draws.Blocks;
        var counts = new long[4];
        long total = 0;
        for (var r = 0; r < draws.Replications; r++)
        {
            for (var i = offsets[r]; i < offsets[r + 1] - 1; i++)
            {
                total++;
                if (lengths[i] <= 3)
                {
                    counts[lengths[i]]++;
                }
            }
        }

        var p = 1 / L;
        for (var j = 1; j <= 3; j++)
        {
            var expected = p * Math.Pow(1 - p, j - 1);
            var share = counts[j] / (double)total;
            var se = Math.Sqrt(expected * (1 - expected) / total);
            Assert.InRange(share, expected - (4 * se), expected + (4 * se));
        }
    }

    [Fact]
    public void Draw_BootstrapVarianceOfTheMean_MatchesPolitisRomanoAnalyticFormula()
    {
        // Politis & Romano (1994, Lemma 1, from memory; the same weights κ(T, i) appear in Hansen 2005):
        // Var*(√T·X̄*) = Ĉ(0) + 2 Σ_{i=1}^{T−1} [(1 − i/T)(1 − p)^i + (i/T)(1 − p)^{T−i}] Ĉ(i),
        // Ĉ(i) = (1/T) Σ_{t=1}^{T−i} (X_t − X̄)(X_{t+i} − X̄), p = 1/L. The test's ω̂² is the Monte Carlo estimate of this
        // conditional variance from B draws, so they agree within Monte Carlo error: relative SE ≈ √(2/B) ≈ 1.4% at
        // B = 10,000; tolerance 6%.
        const int Days = 250;
        const double L = 8;
        var x = SnoopingData.Normalized(new Random(17), Days, 6);
        var mean = x.Average();
        var p = 1 / L;
        var analytic = 0.0;
        for (var i = 0; i < Days; i++)
        {
            var c = 0.0;
            for (var t = 0; t + i < Days; t++)
            {
                c += (x[t] - mean) * (x[t + i] - mean);
            }

            c /= Days;
            analytic += i == 0 ? c : 2 * (((1 - ((double)i / Days)) * Math.Pow(1 - p, i)) + ((double)i / Days * Math.Pow(1 - p, Days - i))) * c;
        }

        var result = DataSnooping.TestMeans([x], new DataSnoopingOptions(L, seed: 8, replications: 10_000));
        var bootstrap = result.StandardDeviations[0] * result.StandardDeviations[0];
        Assert.InRange(bootstrap / analytic, 0.94, 1.06);
    }

    [Fact]
    public void TestMeans_BootstrapDeviations_MatchADirectSumOverTheResampledDates()
    {
        // Independent recomputation: ω̂² = (T/B) Σ_b (mean of x over replication b's dates − x̄)², summing every resampled
        // date instead of the prefix-sum blocks used by the code.
        const int Days = 120;
        var x = SnoopingData.Normalized(new Random(4), Days, 3);
        var options = new DataSnoopingOptions(5, seed: 77, replications: 300);
        var draws = DataSnooping.Draw(Days, options);
        var mean = x.Average();
        var indices = new int[Days];
        var sum = 0.0;
        for (var r = 0; r < draws.Replications; r++)
        {
            draws.CopyIndices(r, indices);
            var s = 0.0;
            foreach (var i in indices)
            {
                s += x[i];
            }

            sum += Math.Pow((s / Days) - mean, 2);
        }

        var expected = Math.Sqrt(Days * sum / draws.Replications);
        var result = DataSnooping.TestMeans([x], draws, 0.05);
        Approx.Relative(expected, result.StandardDeviations[0], 1e-10);
    }
}
