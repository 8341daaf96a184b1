using System.Globalization;
using System.Text;
using VolCast.Core.Data;

namespace VolCast.TestSupport;

/// <summary>Writes Core's series as the input files the command line reads, with round-trip numbers.</summary>
public static class CsvFiles
{
    /// <summary>Writes <c>date,open,high,low,close</c> rows; returns <paramref name="path"/>.</summary>
    public static string WriteBars(string path, PriceHistory prices)
    {
        var sb = new StringBuilder("date,open,high,low,close\n");
        for (var i = 0; i < prices.Count; i++)
        {
            sb.Append(CultureInfo.InvariantCulture,
                $"{prices.Dates[i]:yyyy-MM-dd},{prices.Open[i]:R},{prices.High[i]:R},{prices.Low[i]:R},{prices.Close[i]:R}\n");
        }

        File.WriteAllText(path, sb.ToString());
        return path;
    }

    /// <summary>Writes <c>date,iv</c> rows (the values as given, decimal or percent); returns <paramref name="path"/>.</summary>
    public static string WriteImplied(string path, ImpliedSeries implied)
    {
        var sb = new StringBuilder("date,iv\n");
        for (var i = 0; i < implied.Count; i++)
        {
            sb.Append(CultureInfo.InvariantCulture, $"{implied.Dates[i]:yyyy-MM-dd},{implied.Volatility[i]:R}\n");
        }

        File.WriteAllText(path, sb.ToString());
        return path;
    }
}
