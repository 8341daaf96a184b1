using System.Globalization;
using VolCast.Core.Backtest;

namespace VolCast.IO.Csv;

/// <summary>
/// Writes forecasts-long.csv, the tidy form of forecasts.csv for R and Python: <c>date, forecaster, forecast, realized,
/// implied</c>, one row per forecaster and date on which that forecaster has a forecast (forecasters in the order of
/// forecasts.csv, dates ascending within each). Decimal annualized vol, empty where undefined, as in the wide file.
/// </summary>
internal static class ForecastsLongCsv
{
    /// <summary>The file's name in a results folder.</summary>
    public const string FileName = "forecasts-long.csv";

    /// <summary>The header row.</summary>
    public const string Header = "date,forecaster,forecast,realized,implied";

    public static void Write(TextWriter writer, BacktestResult result)
    {
        writer.Write(Header);
        writer.Write('\n');
        foreach (var f in result.Forecasts)
        {
            var name = CsvText.Text(f.Spec);
            for (var t = 0; t < result.Dates.Length; t++)
            {
                if (f.Values[t] is null)
                {
                    continue;
                }

                writer.Write(result.Dates[t].ToString("yyyy-MM-dd", CultureInfo.InvariantCulture));
                writer.Write(',');
                writer.Write(name);
                writer.Write(',');
                writer.Write(CsvText.Number(f.Values[t]));
                writer.Write(',');
                writer.Write(CsvText.Number(result.Realized[t]));
                writer.Write(',');
                writer.Write(CsvText.Number(result.Implied[t]));
                writer.Write('\n');
            }
        }
    }
}
