using System.Globalization;
using System.Text;

namespace VolCast.Cli.Tests.Reliability;

/// <summary>Writes seeded, invented input files for the reliability tests (not reference data).</summary>
internal static class ReliabilityFiles
{
    /// <summary>Writes a random-walk OHLC history of <paramref name="days"/> weekdays from 1990-01-01; returns its path.</summary>
    /// <param name="folder">Where to write.</param>
    /// <param name="name">The file name.</param>
    /// <param name="days">Number of rows.</param>
    /// <param name="seed">Random seed.</param>
    /// <param name="edit">Optional change to each row's (date, close) before writing, by row index.</param>
    public static string Prices(string folder, string name, int days, int seed, Func<int, DateOnly, double, (DateOnly Date, double Close)>? edit = null)
    {
        var random = new Random(seed);
        var sb = new StringBuilder(days * 48).Append("date,open,high,low,close\n");
        var date = new DateOnly(1990, 1, 1);
        var close = 100.0;
        for (var i = 0; i < days; i++)
        {
            var open = close;
            close = open * Math.Exp(0.012 * Gaussian.Next(random));
            var (d, c) = edit is null ? (date, close) : edit(i, date, close);
            close = c;
            var high = Math.Max(open, close) * (1 + (0.004 * random.NextDouble()));
            var low = Math.Min(open, close) * (1 - (0.004 * random.NextDouble()));
            sb.Append(CultureInfo.InvariantCulture, $"{d:yyyy-MM-dd},{open:R},{high:R},{low:R},{close:R}\n");
            date = Weekdays.After(d);
        }

        var path = Path.Combine(folder, name);
        File.WriteAllText(path, sb.ToString());
        return path;
    }

    /// <summary>Writes an implied series (decimal unless <paramref name="percent"/>) for <paramref name="days"/> weekdays from <paramref name="start"/>.</summary>
    public static string Implied(string folder, string name, DateOnly start, int days, bool percent = false)
    {
        var sb = new StringBuilder("date,iv\n");
        var date = start;
        for (var i = 0; i < days; i++)
        {
            var iv = 0.2 + (0.02 * Math.Sin(i / 30.0));
            sb.Append(CultureInfo.InvariantCulture, $"{date:yyyy-MM-dd},{(percent ? iv * 100 : iv):R}\n");
            date = Weekdays.After(date);
        }

        var path = Path.Combine(folder, name);
        File.WriteAllText(path, sb.ToString());
        return path;
    }

    /// <summary>Writes a small backtest configuration that runs fast.</summary>
    public static string FastConfig(string folder, string extra = "")
    {
        var path = Path.Combine(folder, "fast.json");
        File.WriteAllText(path, "{ \"sweep\": false, \"selectionWindowDays\": 60, \"forecasters\": [\"ewma:0.94\", \"close-to-close:21\"]" + extra + " }");
        return path;
    }
}
