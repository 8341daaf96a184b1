using System.Globalization;

namespace VolCast.IO.Config;

/// <summary>The accepted range of one numeric setting, inclusive at both ends, with its name as the user writes it.</summary>
/// <param name="Name">The setting as written in the configuration (for example <c>mcs.replications</c>).</param>
/// <param name="Min">The smallest accepted value.</param>
/// <param name="Max">The largest accepted value.</param>
/// <param name="Unit">The unit in words, or empty.</param>
public sealed record SettingRange(string Name, double Min, double Max, string Unit)
{
    /// <summary>Returns whether a value lies in the range (NaN never does).</summary>
    /// <param name="value">The value.</param>
    /// <returns>True when Min ≤ value ≤ Max.</returns>
    public bool Contains(double value) => value >= Min && value <= Max;

    /// <summary>The range in words, such as "1 to 2520 trading days".</summary>
    /// <returns>The text.</returns>
    public override string ToString() => string.Create(CultureInfo.InvariantCulture,
        $"{Min:#,0.####} to {Max:#,0.####}{(Unit.Length == 0 ? string.Empty : " " + Unit)}");

    private static string Shown(double value) => value == Math.Floor(value) && Math.Abs(value) < 1e15
        ? value.ToString("#,0", CultureInfo.InvariantCulture)
        : value.ToString("R", CultureInfo.InvariantCulture);

    /// <summary>Refuses a value outside the range, naming the setting as <paramref name="shownAs"/>.</summary>
    /// <param name="value">The value.</param>
    /// <param name="shownAs">How the setting is named in the message (an option such as <c>--horizon</c>, or the configuration key).</param>
    /// <param name="source">Where the value came from (the configuration file), or null for the command line.</param>
    /// <exception cref="SettingRangeException">The value is out of range.</exception>
    public void Check(double value, string shownAs, string? source = null) => Check(value, shownAs, source, written: null);

    /// <summary>
    /// Refuses a value outside the range, echoing it as the user wrote it (cut to 40 characters) rather than as the
    /// number read from it, so that a run of thousands of digits is shown as its first digits, not as "Infinity".
    /// </summary>
    /// <param name="value">The value read from <paramref name="written"/>.</param>
    /// <param name="shownAs">How the setting is named in the message.</param>
    /// <param name="source">Where the value came from (the configuration file), or null for the command line.</param>
    /// <param name="written">The value as written, such as <c>99999d</c>, or null to show the number.</param>
    /// <exception cref="SettingRangeException">The value is out of range.</exception>
    public void Check(double value, string shownAs, string? source, string? written)
    {
        if (!Contains(value))
        {
            var was = written is null ? Shown(value) : written.Length > 40 ? written[..40] + "…" : written;
            throw new SettingRangeException(string.Create(CultureInfo.InvariantCulture,
                $"{(source is null ? string.Empty : source + ": ")}{shownAs} must be from {this} (was {was}); the ranges are listed in --help and in the README."));
        }
    }
}
