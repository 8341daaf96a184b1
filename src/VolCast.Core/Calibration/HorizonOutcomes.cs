using System.Globalization;

namespace VolCast.Core.Calibration;

/// <summary>
/// What happened after each forecast date: the close S_t at the forecast and the close S_{t+h_t} h_t trading days
/// later, aligned date by date with every forecaster's series.
/// </summary>
/// <remarks>
/// Index i is one forecast date. Dates whose S_{t+h} is not known yet (the last h of a history) are left out by the
/// caller; every close given must be a finite price above zero. The horizon is either fixed (h trading days on every
/// date) or per date (h_t, as a calendar tenor gives: the trading days whose dates fall in (t, t + tenor]).
/// <see cref="HorizonDays"/> is then the longest h_t; it sets n_eff = n / h for the reliability intervals, the
/// cautious choice.
/// </remarks>
public sealed record HorizonOutcomes
{
    private readonly int[] _windowDays;
    private readonly double[] _startClose;
    private readonly double[] _endClose;

    /// <summary>Creates the aligned closes for a fixed horizon and checks them.</summary>
    /// <param name="horizonDays">The horizon h in trading days, at least 1.</param>
    /// <param name="startClose">S_t, the close on each forecast date.</param>
    /// <param name="endClose">S_{t+h}, the close h trading days later, aligned with <paramref name="startClose"/>.</param>
    /// <exception cref="ArgumentNullException">An array is null.</exception>
    /// <exception cref="ArgumentOutOfRangeException">The horizon is below 1.</exception>
    /// <exception cref="ArgumentException">The lengths differ, or a close is not a finite price above zero.</exception>
    public HorizonOutcomes(int horizonDays, double[] startClose, double[] endClose)
        : this(Fill(horizonDays, startClose), startClose, endClose)
    {
    }

    /// <summary>Creates the aligned closes for a horizon that may differ by date and checks them.</summary>
    /// <param name="windowDays">h_t per date in trading days, each at least 1.</param>
    /// <param name="startClose">S_t, the close on each forecast date.</param>
    /// <param name="endClose">S_{t+h_t}, the close h_t trading days later, aligned with <paramref name="startClose"/>.</param>
    /// <exception cref="ArgumentNullException">An array is null.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A horizon is below 1.</exception>
    /// <exception cref="ArgumentException">The lengths differ, or a close is not a finite price above zero.</exception>
    public HorizonOutcomes(int[] windowDays, double[] startClose, double[] endClose)
    {
        ArgumentNullException.ThrowIfNull(windowDays);
        ArgumentNullException.ThrowIfNull(startClose);
        ArgumentNullException.ThrowIfNull(endClose);
        Preconditions.SameLength(endClose.Length, startClose.Length, nameof(startClose), nameof(endClose));
        Preconditions.SameLength(windowDays.Length, startClose.Length, nameof(startClose), nameof(windowDays));
        var longest = 1;
        for (var i = 0; i < startClose.Length; i++)
        {
            if (windowDays[i] < 1)
            {
                throw new ArgumentOutOfRangeException(nameof(windowDays), windowDays[i], string.Create(CultureInfo.InvariantCulture,
                    $"windowDays[{i}] must be at least 1 trading day, was {windowDays[i]}."));
            }

            longest = Math.Max(longest, windowDays[i]);
            Preconditions.PositiveAt(startClose[i], i, "price", nameof(startClose));
            Preconditions.PositiveAt(endClose[i], i, "price", nameof(endClose));
        }

        HorizonDays = longest;
        _windowDays = windowDays;
        _startClose = startClose;
        _endClose = endClose;
    }

    /// <summary>Checks that a forecaster's series is aligned with these outcomes, date by date.</summary>
    /// <exception cref="ArgumentException">The lengths differ.</exception>
    internal void CheckAligned(ForecasterVolatility forecaster)
    {
        if (forecaster.AnnualizedVolatility.Count != Count)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"{forecaster.Spec}: the forecasts must be aligned with the outcomes and have the same length ({Count} dates), was {forecaster.AnnualizedVolatility.Count}."), nameof(forecaster));
        }
    }

    /// <summary>The horizon h in trading days; the longest h_t when it differs by date.</summary>
    public int HorizonDays { get; }

    /// <summary>h_t per date in trading days.</summary>
    public IReadOnlyList<int> WindowDays => _windowDays;

    /// <summary>S_t, the close on each forecast date.</summary>
    public IReadOnlyList<double> StartClose => _startClose;

    /// <summary>S_{t+h_t}, the close h_t trading days after each forecast date.</summary>
    public IReadOnlyList<double> EndClose => _endClose;

    /// <summary>The number of forecast dates.</summary>
    public int Count => _startClose.Length;

    internal int[] WindowArray => _windowDays;

    internal double[] StartArray => _startClose;

    internal double[] EndArray => _endClose;

    private static int[] Fill(int horizonDays, double[] startClose)
    {
        ArgumentNullException.ThrowIfNull(startClose);
        Preconditions.AtLeast(horizonDays, 1, "trading day");

        var days = new int[startClose.Length];
        Array.Fill(days, horizonDays);
        return days;
    }
}
