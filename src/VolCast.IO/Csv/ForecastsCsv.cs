using VolCast.Core.Backtest;

namespace VolCast.IO.Csv;

/// <summary>Writes forecasts.csv: <c>date, realized, implied</c>, then one column per forecaster named by its spec; decimal annualized vol, empty where undefined.</summary>
internal static class ForecastsCsv
{
    public static void Write(TextWriter writer, BacktestResult result)
    {
        writer.Write("date,realized,implied");
        foreach (var f in result.Forecasts)
        {
            writer.Write(',');
            writer.Write(CsvText.Text(f.Spec));
        }

        writer.Write('\n');
        for (var t = 0; t < result.Dates.Length; t++)
        {
            CsvText.WriteDate(writer, result.Dates[t]);
            writer.Write(',');
            CsvText.WriteNumber(writer, result.Realized[t]);
            writer.Write(',');
            CsvText.WriteNumber(writer, result.Implied[t]);
            foreach (var f in result.Forecasts)
            {
                writer.Write(',');
                CsvText.WriteNumber(writer, f.Values[t]);
            }

            writer.Write('\n');
        }
    }
}
