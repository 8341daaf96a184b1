using System.Globalization;
using VolCast.Core.Backtest;

namespace VolCast.IO;

/// <summary>The tenor an implied-volatility series covers, as declared by the user, checked against the backtest's horizon.</summary>
public static class ImpliedTenor
{
    /// <summary>The longest tenor accepted, in calendar days (ten years).</summary>
    public const int MaxDays = 3650;

    /// <summary>Parses a tenor written as whole calendar days followed by d, such as <c>30d</c>.</summary>
    /// <param name="text">The text as the user wrote it.</param>
    /// <returns>The tenor in calendar days, from 1 to <see cref="MaxDays"/>, or null when the text is not one.</returns>
    public static int? Parse(string? text)
    {
        var t = text?.Trim().ToLowerInvariant();
        return t is not null && t.Length > 1 && t.EndsWith('d')
            && int.TryParse(t.AsSpan(0, t.Length - 1), NumberStyles.None, CultureInfo.InvariantCulture, out var days) && days is >= 1 and <= MaxDays
            ? days
            : null;
    }

    /// <summary>
    /// Warns when the declared tenor of the implied series does not cover the backtest's horizon: a tenor of other
    /// calendar days, or, for a horizon in trading days, a tenor whose round(D · 252 / 365) trading days differ from it.
    /// </summary>
    /// <param name="declaredDays">The implied series' tenor in calendar days, or null when not declared (it is then the backtest's own).</param>
    /// <param name="horizon">The backtest's horizon.</param>
    /// <param name="file">The implied file, as the user gave it.</param>
    /// <returns>The warning, or null when the two agree or no tenor was declared.</returns>
    public static InputWarning? Check(int? declaredDays, BacktestHorizon horizon, string file)
    {
        ArgumentNullException.ThrowIfNull(horizon);
        ArgumentNullException.ThrowIfNull(file);
        if (declaredDays is not int days)
        {
            return null;
        }

        var tradingDays = BacktestHorizon.Tenor(days).NominalDays;
        var c = CultureInfo.InvariantCulture;
        if (horizon.TenorCalendarDays is int tenor)
        {
            return tenor == days ? null : new InputWarning(file, null, string.Create(c,
                $"the implied series is declared as a {days}-calendar-day tenor (--implied-tenor {days}d), but the backtest forecasts a {tenor}-calendar-day tenor: each date compares {days}-day implied volatility with forecasts and realized volatility over the next {tenor} calendar days, so implied is scored on a window it does not quote. Give --tenor {days}d to compare like with like."));
        }

        var h = horizon.TradingDays!.Value;
        return tradingDays == h ? null : new InputWarning(file, null, string.Create(c,
            $"the implied series is declared as a {days}-calendar-day tenor (--implied-tenor {days}d, about {tradingDays} trading days), but the backtest forecasts {h} trading days ahead: each date compares {days}-day implied volatility with forecasts and realized volatility over the next {h} trading days, so implied is scored on a window it does not quote. Give --tenor {days}d (or --horizon {tradingDays}) to compare like with like."));
    }
}
