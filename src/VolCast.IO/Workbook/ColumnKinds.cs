namespace VolCast.IO.Workbook;

/// <summary>
/// Which columns of the results tables hold dates, p-values and volatilities (docs/files.md lists every column). The
/// rule is by name: <c>date</c> and <c>*_date</c> are dates; <c>*_p</c> are p-values; every forecaster column of
/// forecasts.csv and the named volatility columns of the other tables are volatilities; the rest is general.
/// </summary>
internal static class ColumnKinds
{
    private static readonly Dictionary<string, HashSet<string>> VolatilityColumns = new(StringComparer.Ordinal)
    {
        ["metrics.csv"] = ["bias", "mae_vol", "rmse_vol"],
        ["trades.csv"] = ["iv", "hedge_vol", "forecast"],
        ["cone.csv"] = ["min", "p10", "p25", "median", "p75", "p90", "max", "adj_min", "adj_p10", "adj_p25", "adj_median", "adj_p75", "adj_p90", "adj_max", "latest"],
    };

    /// <summary>Gets the kind of one column.</summary>
    /// <param name="file">The CSV file's name (forecasts.csv, metrics.csv, …).</param>
    /// <param name="column">The column's header.</param>
    public static CellKind Of(string file, string column)
    {
        if (column == "date" || column.EndsWith("_date", StringComparison.Ordinal))
        {
            return CellKind.Date;
        }

        if (column.EndsWith("_p", StringComparison.Ordinal))
        {
            return CellKind.PValue;
        }

        if (file == "forecasts.csv" || (VolatilityColumns.TryGetValue(file, out var columns) && columns.Contains(column)))
        {
            return CellKind.Volatility;
        }

        return CellKind.General;
    }
}
