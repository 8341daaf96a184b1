using System.Globalization;

namespace VolCast.Core.Trading.Snooping;

/// <summary>
/// Input checks of the data-snooping tests. Each message says what was wrong, with the value, and what was expected,
/// formatted with the invariant culture.
/// </summary>
internal static class SnoopingGuard
{
    /// <summary>Checks that the number of dates is at least 2.</summary>
    public static void Days(int days, string paramName)
    {
        if (days < 2)
        {
            throw new ArgumentOutOfRangeException(paramName, days, string.Create(CultureInfo.InvariantCulture,
                $"{paramName} must be at least 2 days (a mean and its bootstrap variance need two), was {days}."));
        }
    }

    /// <summary>Checks that the mean block length is finite and at least 1.</summary>
    public static void MeanBlockLength(double meanBlockLength, string paramName)
    {
        if (!double.IsFinite(meanBlockLength) || meanBlockLength < 1)
        {
            throw new ArgumentOutOfRangeException(paramName, meanBlockLength, string.Create(CultureInfo.InvariantCulture,
                $"{paramName} must be a finite number of days of at least 1 (about the horizon), was {meanBlockLength}."));
        }
    }

    /// <summary>Checks that the number of bootstrap replications is at least 1.</summary>
    public static void Replications(int replications, string paramName)
    {
        if (replications < 1)
        {
            throw new ArgumentOutOfRangeException(paramName, replications, string.Create(CultureInfo.InvariantCulture,
                $"{paramName} must be at least 1 bootstrap replication (1,000 is the default), was {replications}."));
        }
    }

    /// <summary>Checks that a test level lies strictly between 0 and 1.</summary>
    public static void Level(double level, string paramName)
    {
        if (!(level > 0 && level < 1))
        {
            throw new ArgumentOutOfRangeException(paramName, level, string.Create(CultureInfo.InvariantCulture,
                $"{paramName} must be between 0 and 1 exclusive (0.05 is the default), was {level}."));
        }
    }

    /// <summary>Checks that there is at least one rule.</summary>
    public static void Rules(int rules, string paramName)
    {
        if (rules < 1)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"{paramName} must hold at least one rule, was {rules}."), paramName);
        }
    }

    /// <summary>Checks that every row of a rule-by-day matrix is present and as long as the first.</summary>
    /// <returns>The common number of days.</returns>
    public static int Rectangular(double[][] rows, string paramName)
    {
        ArgumentNullException.ThrowIfNull(rows, paramName);
        Rules(rows.Length, paramName);
        for (var k = 0; k < rows.Length; k++)
        {
            if (rows[k] is null)
            {
                throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                    $"{paramName}[{k}] is missing: every rule needs its row of daily values."), paramName);
            }

            if (rows[k].Length != rows[0].Length)
            {
                throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                    $"{paramName}[{k}] has {rows[k].Length} days but {paramName}[0] has {rows[0].Length}: every rule must cover the same dates."), paramName);
            }
        }

        Days(rows[0].Length, paramName + "[0].Length");
        return rows[0].Length;
    }

    /// <summary>Checks that every value of a row is finite.</summary>
    public static void Finite(ReadOnlySpan<double> row, string paramName, int rule)
    {
        for (var t = 0; t < row.Length; t++)
        {
            if (!double.IsFinite(row[t]))
            {
                throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                    $"{paramName}[{rule}][{t}] must be a finite number, was {row[t]}: remove the day or fill it before testing."), paramName);
            }
        }
    }

    /// <summary>Checks that bootstrap draws cover the same number of dates as the data.</summary>
    public static void DrawsMatch(StationaryBootstrapDraws draws, int days, string paramName)
    {
        ArgumentNullException.ThrowIfNull(draws, paramName);
        if (draws.Length != days)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"{paramName} resample {draws.Length} dates but the data has {days}: draw them for the data's length."), paramName);
        }
    }
}
