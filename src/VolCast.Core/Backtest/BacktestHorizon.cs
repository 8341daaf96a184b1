using System.Globalization;

namespace VolCast.Core.Backtest;

/// <summary>The forecast horizon: a fixed number of trading days, or a calendar tenor mapped through the price history's own calendar.</summary>
/// <remarks>
/// With a tenor of D calendar days, the window of a forecast made at date t is the trading days whose dates fall in
/// (t, t + D], so its length h_t varies by date (holidays, weekends). Forecasters are asked for
/// <see cref="NominalDays"/> = round(D · 252 / 365) trading days, a fixed number that depends on no data; the
/// realized target of each date uses its own h_t; HAC and Diebold-Mariano lags use max h_t − 1 over the dates scored
/// (the conservative choice), and the Harvey-Leybourne-Newbold factor uses that same max h_t.
/// </remarks>
public sealed record BacktestHorizon
{
    private BacktestHorizon(int? tradingDays, int? tenorCalendarDays)
    {
        TradingDays = tradingDays;
        TenorCalendarDays = tenorCalendarDays;
    }

    /// <summary>Gets the horizon in trading days, or null when a calendar tenor is used.</summary>
    public int? TradingDays { get; }

    /// <summary>Gets the tenor in calendar days, or null when a trading-day horizon is used.</summary>
    public int? TenorCalendarDays { get; }

    /// <summary>Gets the number of trading days forecasters are asked for: h itself, or round(D · 252 / 365) for a tenor of D days (at least 1).</summary>
    public int NominalDays => TradingDays ?? Math.Max(1, (int)Math.Round(TenorCalendarDays!.Value * 252.0 / 365.0, MidpointRounding.AwayFromZero));

    /// <summary>Gets the default horizon, 21 trading days.</summary>
    public static BacktestHorizon Default { get; } = new(21, null);

    /// <summary>Creates a horizon of h trading days.</summary>
    /// <param name="tradingDays">h, at least 1.</param>
    /// <returns>The horizon.</returns>
    /// <exception cref="ArgumentOutOfRangeException">h is below 1.</exception>
    public static BacktestHorizon Days(int tradingDays)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(tradingDays, 1);
        return new BacktestHorizon(tradingDays, null);
    }

    /// <summary>Creates a calendar tenor of D days.</summary>
    /// <param name="calendarDays">D, at least 1.</param>
    /// <returns>The horizon.</returns>
    /// <exception cref="ArgumentOutOfRangeException">D is below 1.</exception>
    public static BacktestHorizon Tenor(int calendarDays)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(calendarDays, 1);
        return new BacktestHorizon(null, calendarDays);
    }

    /// <summary>Returns "21" for trading days or "30d" for a tenor, the form the command line accepts.</summary>
    /// <returns>The text.</returns>
    public override string ToString() => TradingDays is int h
        ? h.ToString(CultureInfo.InvariantCulture)
        : string.Create(CultureInfo.InvariantCulture, $"{TenorCalendarDays}d");
}
