using System.Globalization;
using VolCast.Core.Cone;

namespace VolCast.IO.Csv;

/// <summary>Writes a volatility cone as CSV: one row per horizon, unadjusted and adjusted percentiles, decimals.</summary>
public static class ConeCsv
{
    /// <summary>The header row.</summary>
    public const string Header =
        "horizon_days,windows,ht_variance_factor,min,p10,p25,median,p75,p90,max,adj_min,adj_p10,adj_p25,adj_median,adj_p75,adj_p90,adj_max,latest";

    /// <summary>Writes the cone; volatilities are annualized decimals (0.20 = 20%), written round-trip with the invariant culture.</summary>
    /// <param name="writer">Where to write.</param>
    /// <param name="cone">The cone.</param>
    public static void Write(TextWriter writer, VolatilityConeResult cone)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(cone);
        writer.WriteLine(Header);
        foreach (var row in cone.Horizons)
        {
            writer.Write(row.HorizonDays.ToString(CultureInfo.InvariantCulture));
            writer.Write(',');
            writer.Write(row.WindowCount.ToString(CultureInfo.InvariantCulture));
            writer.Write(',');
            writer.Write(row.VarianceFactor.ToString("R", CultureInfo.InvariantCulture));
            foreach (var value in row.Raw.ToArray().Concat(row.Adjusted.ToArray()).Append(row.Latest))
            {
                writer.Write(',');
                writer.Write(value.ToString("R", CultureInfo.InvariantCulture));
            }

            writer.WriteLine();
        }
    }
}
