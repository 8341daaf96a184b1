using System.Globalization;
using System.Text.Json;
using VolCast.Core.Now;

namespace VolCast.IO.Results;

/// <summary>
/// Writes now.json: today's reading of the data on the last forecast date (<see cref="NowReading"/>). Volatilities and
/// gaps are decimals, percentiles 0 to 100, margins in vol points; null where undefined.
/// </summary>
internal static class NowJson
{
    /// <summary>The file's name.</summary>
    public const string FileName = "now.json";

    /// <summary>The sentence that says what the file is and is not.</summary>
    public const string Disclaimer = "A reading of the data on the last date, not a recommendation: it says where today's numbers stand against the run's own history, not what to trade.";

    public static void Write(TextWriter writer, NowReading now) => writer.Write(JsonText.Build(json => Write(json, now)));

    private static void Write(Utf8JsonWriter json, NowReading now)
    {
        json.WriteStartObject();
        json.WriteString("note", Disclaimer);
        json.WriteString("date", now.Date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture));
        json.WriteNumber("horizon_days", now.HorizonDays);
        Numbers.Write(json, "implied", now.Implied);
        Numbers.Write(json, "realized_last_window", now.RealizedLastWindow);
        Numbers.Write(json, "cone_percentile", now.ConePercentile);
        json.WriteNumber("cone_windows", now.ConeWindows);
        json.WriteNumber("threshold_vol_points", now.ThresholdVolPoints);
        json.WriteStartArray("forecasters");
        foreach (var f in now.Forecasts)
        {
            json.WriteStartObject();
            json.WriteString("forecaster", f.Spec);
            Numbers.Write(json, "forecast", f.Forecast);
            Numbers.Write(json, "implied_minus_forecast", f.ImpliedMinusForecast);
            Numbers.Write(json, "percentile", f.Percentile);
            json.WriteNumber("earlier_dates", f.EarlierDates);
            json.WriteEndObject();
        }

        json.WriteEndArray();
        json.WriteStartArray("rules");
        foreach (var r in now.Rules)
        {
            json.WriteStartObject();
            json.WriteString("rule", r.Rule);
            Numbers.Write(json, "forecaster", r.Forecaster);
            Numbers.Write(json, "forecast", r.Forecast);
            Numbers.Write(json, "implied_minus_forecast", r.ImpliedMinusForecast);
            Numbers.Write(json, "threshold_vol_points", r.ThresholdVolPoints);
            json.WriteString("signal", r.Signal);
            Numbers.Write(json, "margin_vol_points", r.MarginVolPoints);
            Numbers.Write(json, "note", r.Note);
            json.WriteEndObject();
        }

        json.WriteEndArray();
        json.WriteEndObject();
    }
}
