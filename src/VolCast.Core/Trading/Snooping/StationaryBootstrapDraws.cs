using System.Globalization;

namespace VolCast.Core.Trading.Snooping;

/// <summary>
/// The resampled dates of a stationary bootstrap (Politis &amp; Romano 1994), held as blocks: for each replication, a
/// list of (start, length) blocks laid end to end that together cover exactly <see cref="Length"/> dates. A block
/// that runs past the last date wraps around to the first.
/// </summary>
/// <remarks>
/// Drawn once by <see cref="StationaryBootstrap.Draw"/> and shared by every statistic of a data-snooping test, so
/// the mean-difference and Sharpe-ratio tests, the Reality Check, SPA and StepM all see the same resamples.
/// Immutable after construction; safe to share between threads.
/// </remarks>
internal sealed class StationaryBootstrapDraws
{
    private readonly int[] _starts;
    private readonly int[] _lengths;
    private readonly int[] _offsets;

    internal StationaryBootstrapDraws(int length, double meanBlockLength, int seed, int[] starts, int[] lengths, int[] offsets)
    {
        Length = length;
        MeanBlockLength = meanBlockLength;
        Seed = seed;
        _starts = starts;
        _lengths = lengths;
        _offsets = offsets;
    }

    /// <summary>Gets the number of dates T in the sample and in every resample.</summary>
    public int Length { get; }

    /// <summary>Gets the mean block length L (the blocks' lengths are geometric with success probability 1/L).</summary>
    public double MeanBlockLength { get; }

    /// <summary>Gets the seed the draws were made with.</summary>
    public int Seed { get; }

    /// <summary>Gets the number of bootstrap replications B.</summary>
    public int Replications => _offsets.Length - 1;

    /// <summary>Gets the number of blocks in one replication (the last one cut so that the blocks cover T dates).</summary>
    /// <param name="replication">Replication index, 0 to B − 1.</param>
    /// <returns>The number of blocks.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The replication index is out of range.</exception>
    public int BlockCount(int replication)
    {
        CheckReplication(replication);
        return _offsets[replication + 1] - _offsets[replication];
    }

    /// <summary>Writes the T resampled date indices of one replication, in order.</summary>
    /// <param name="replication">Replication index, 0 to B − 1.</param>
    /// <param name="destination">At least T entries; the first T are overwritten with indices in 0 .. T − 1.</param>
    /// <exception cref="ArgumentOutOfRangeException">The replication index is out of range.</exception>
    /// <exception cref="ArgumentException">The destination is shorter than T.</exception>
    public void CopyIndices(int replication, Span<int> destination)
    {
        CheckReplication(replication);
        if (destination.Length < Length)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"destination must hold at least {Length} indices (one per date), was {destination.Length}."), nameof(destination));
        }

        var position = 0;
        for (var i = _offsets[replication]; i < _offsets[replication + 1]; i++)
        {
            var index = _starts[i];
            for (var j = 0; j < _lengths[i]; j++)
            {
                destination[position++] = index;
                index = index + 1 == Length ? 0 : index + 1;
            }
        }
    }

    /// <summary>
    /// Gets the blocks of all replications: starts, lengths and each replication's first block (B + 1 offsets; the
    /// arrays may be longer than the last offset).
    /// </summary>
    internal (int[] Starts, int[] Lengths, int[] Offsets) Blocks => (_starts, _lengths, _offsets);

    private void CheckReplication(int replication)
    {
        if ((uint)replication >= (uint)Replications)
        {
            throw new ArgumentOutOfRangeException(nameof(replication), replication, string.Create(CultureInfo.InvariantCulture,
                $"replication must be between 0 and {Replications - 1}, was {replication}."));
        }
    }
}
