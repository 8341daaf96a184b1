namespace VolCast.Core.Trading.Snooping;

/// <summary>
/// Draws the resamples of the stationary bootstrap of Politis &amp; Romano (1994), "The stationary bootstrap",
/// JASA 89(428): blocks with uniformly drawn starts and geometric lengths of mean L, wrapping around the end of the
/// sample, laid end to end until the resample has T dates.
/// </summary>
/// <remarks>
/// Each block's length is 1 + ⌊ln U / ln(1 − 1/L)⌋ with U uniform on (0, 1], a geometric variable with
/// P(length = j) = p(1 − p)^{j−1}, p = 1/L; the last block of a replication is cut at T. This is the paper's
/// construction in another order: after each resampled date a new block starts with probability p, independently.
/// L = 1 gives blocks of one date (the i.i.d. bootstrap). The generator is <see cref="Random"/> with the given seed,
/// so the same (T, L, B, seed) give the same draws bit for bit, whatever data they are then applied to.
/// </remarks>
internal static class StationaryBootstrap
{
    /// <summary>Draws B stationary-bootstrap resamples of T dates.</summary>
    /// <param name="length">Number of dates T, at least 2.</param>
    /// <param name="meanBlockLength">Mean block length L, finite and at least 1 (about the horizon of the trades).</param>
    /// <param name="replications">Number of replications B, at least 1.</param>
    /// <param name="seed">Seed of the random number generator.</param>
    /// <returns>The draws, as blocks.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A setting is out of range.</exception>
    public static StationaryBootstrapDraws Draw(int length, double meanBlockLength, int replications, int seed)
    {
        SnoopingGuard.Days(length, nameof(length));
        SnoopingGuard.MeanBlockLength(meanBlockLength, nameof(meanBlockLength));
        SnoopingGuard.Replications(replications, nameof(replications));

        var random = new Random(seed);
        var logStay = meanBlockLength > 1 ? Math.Log(1.0 - (1.0 / meanBlockLength)) : 0.0;
        // Sized for the expected number of blocks, B·(T/L + 1), with room to spare; grown only if the draws run long.
        var capacity = (int)Math.Min(Array.MaxLength, (replications * ((length / meanBlockLength) + 2.0)) + 64);
        var starts = new int[capacity];
        var lengths = new int[capacity];
        var offsets = new int[replications + 1];
        var count = 0;
        for (var b = 0; b < replications; b++)
        {
            offsets[b] = count;
            var filled = 0;
            while (filled < length)
            {
                var start = random.Next(length);
                var blockLength = 1;
                if (logStay < 0)
                {
                    var extra = Math.Floor(Math.Log(1.0 - random.NextDouble()) / logStay);
                    blockLength = 1 + (int)Math.Min(length, extra);
                }

                blockLength = Math.Min(blockLength, length - filled);
                if (count == starts.Length)
                {
                    var grown = (int)Math.Min(Array.MaxLength, (long)count * 2);
                    Array.Resize(ref starts, grown);
                    Array.Resize(ref lengths, grown);
                }

                starts[count] = start;
                lengths[count] = blockLength;
                count++;
                filled += blockLength;
            }
        }

        offsets[replications] = count;
        return new StationaryBootstrapDraws(length, meanBlockLength, seed, starts, lengths, offsets);
    }
}
