using System.Globalization;

namespace VolCast.Core.Calibration;

/// <summary>
/// What happened after each forecast date: the close S_t at the forecast and the close S_{t+h} h trading days
/// later, aligned date by date with every forecaster's series.
/// </summary>
/// <remarks>
/// Index i is one forecast date. Dates whose S_{t+h} is not known yet (the last h of a history) are left out by the
/// caller; every close given must be a finite price above zero.
/// </remarks>
public sealed record HorizonOutcomes
{
    /// <summary>Creates the aligned closes and checks them.</summary>
    /// <param name="horizonDays">The horizon h in trading days, at least 1.</param>
    /// <param name="startClose">S_t, the close on each forecast date.</param>
    /// <param name="endClose">S_{t+h}, the close h trading days later, aligned with <paramref name="startClose"/>.</param>
    /// <exception cref="ArgumentNullException">An array is null.</exception>
    /// <exception cref="ArgumentOutOfRangeException">The horizon is below 1.</exception>
    /// <exception cref="ArgumentException">The lengths differ, or a close is not a finite price above zero.</exception>
    public HorizonOutcomes(int horizonDays, double[] startClose, double[] endClose)
    {
        ArgumentNullException.ThrowIfNull(startClose);
        ArgumentNullException.ThrowIfNull(endClose);
        if (horizonDays < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(horizonDays), horizonDays, string.Create(CultureInfo.InvariantCulture,
                $"horizonDays must be at least 1 trading day, was {horizonDays}."));
        }

        Guard.SameLength(startClose.Length, endClose.Length, nameof(endClose));
        for (var i = 0; i < startClose.Length; i++)
        {
            Guard.PositivePrice(startClose[i], nameof(startClose), i);
            Guard.PositivePrice(endClose[i], nameof(endClose), i);
        }

        HorizonDays = horizonDays;
        StartClose = startClose;
        EndClose = endClose;
    }

    /// <summary>The horizon h in trading days.</summary>
    public int HorizonDays { get; }

    /// <summary>S_t, the close on each forecast date.</summary>
    public IReadOnlyList<double> StartClose { get; }

    /// <summary>S_{t+h}, the close h trading days after each forecast date.</summary>
    public IReadOnlyList<double> EndClose { get; }

    /// <summary>The number of forecast dates.</summary>
    public int Count => StartClose.Count;

    internal double[] StartArray => (double[])StartClose;

    internal double[] EndArray => (double[])EndClose;
}
