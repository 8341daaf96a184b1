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

        // The date and the ",realized,implied" end of a row are the same for every forecaster: formatted once per date.
        var dates = new string[result.Dates.Length];
        var ends = new string[result.Dates.Length];
        for (var t = 0; t < result.Dates.Length; t++)
        {
            dates[t] = CsvText.Date(result.Dates[t]);
            ends[t] = "," + CsvText.Number(result.Realized[t]) + "," + CsvText.Number(result.Implied[t]) + "\n";
        }

        foreach (var f in result.Forecasts)
        {
            var name = CsvText.Text(f.Spec);
            for (var t = 0; t < result.Dates.Length; t++)
            {
                if (f.Values[t] is null)
                {
                    continue;
                }

                writer.Write(dates[t]);
                writer.Write(',');
                writer.Write(name);
                writer.Write(',');
                CsvText.WriteNumber(writer, f.Values[t]);
                writer.Write(ends[t]);
            }
        }
    }
}
