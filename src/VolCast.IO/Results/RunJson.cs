using System.Globalization;
using System.Text.Json;
using VolCast.Core.Backtest;

namespace VolCast.IO.Results;

/// <summary>Writes run.json: the tool version, the inputs with their SHA-256, the times, every setting of the run and the manifest of its files.</summary>
internal static class RunJson
{
    public static void Write(TextWriter writer, BacktestResult result, BacktestRunInfo run, IReadOnlyList<string> files) =>
        writer.Write(JsonText.Build(json => Run(json, result, run, files)));

    private static void Run(Utf8JsonWriter json, BacktestResult r, BacktestRunInfo run, IReadOnlyList<string> files)
    {
        var s = r.Settings;
        json.WriteStartObject();
        json.WriteString("tool", "volcast");
        json.WriteString("version", run.ToolVersion);
        json.WriteString("started_utc", JsonText.Utc(run.StartedUtc));
        json.WriteString("finished_utc", JsonText.Utc(run.FinishedUtc));
        json.WriteStartArray("inputs");
        foreach (var input in run.Inputs)
        {
            json.WriteStartObject();
            json.WriteString("role", input.Role);
            json.WriteString("path", input.Path);
            json.WriteString("sha256", input.Sha256);
            json.WriteEndObject();
        }

        json.WriteEndArray();
        if (run.ImpliedUnit is null)
        {
            json.WriteNull("implied_unit");
        }
        else
        {
            json.WriteString("implied_unit", run.ImpliedUnit);
        }

        json.WriteStartObject("settings");
        if (s.Horizon.TradingDays is int h)
        {
            json.WriteNumber("horizon", h);
            json.WriteNull("tenor");
        }
        else
        {
            json.WriteNull("horizon");
            json.WriteString("tenor", s.Horizon.ToString());
        }

        json.WriteNumber("nominal_horizon_days", s.Horizon.NominalDays);
        WriteDate(json, "start", s.Start);
        WriteDate(json, "end", s.End);
        json.WriteString("first_forecast_date", r.Dates[0].ToString("yyyy-MM-dd", CultureInfo.InvariantCulture));
        json.WriteString("last_forecast_date", r.Dates[^1].ToString("yyyy-MM-dd", CultureInfo.InvariantCulture));
        Strings(json, "forecasters", s.Forecasters);
        json.WriteBoolean("sweep", s.Sweep);
        json.WriteBoolean("full_sweep", s.FullSweep);
        Strings(json, "sweepEstimators", s.SweepEstimators.Select(Core.Estimators.EstimatorNames.Name));
        json.WriteStartArray("sweepLookbacks");
        foreach (var w in s.SweepLookbacks)
        {
            json.WriteNumberValue(w);
        }

        json.WriteEndArray();
        json.WriteStartArray("ewmaLambdas");
        foreach (var l in s.EwmaLambdas)
        {
            json.WriteNumberValue(l);
        }

        json.WriteEndArray();
        json.WriteNumber("selectionWindowDays", s.SelectionWindowDays);
        json.WriteStartObject("mcs");
        json.WriteNumber("replications", s.McsReplications);
        json.WriteNumber("alpha", s.McsAlpha);
        Numbers.Write(json, "blockLength", s.McsBlockLength);
        json.WriteNumber("seed", s.McsSeed);
        json.WriteEndObject();
        json.WriteNumber("ruleThreshold", s.RuleThreshold);
        Numbers.Write(json, "ruleForecaster", s.RuleForecaster);
        Numbers.Write(json, "ruleHistorical", s.RuleHistorical);
        Numbers.Write(json, "baseline", s.Baseline);
        Numbers.Write(json, "candidate", s.Candidate);
        json.WriteNumber("annualizationFactor", s.AnnualizationFactor);
        json.WriteString("target", Config.BacktestConfigFile.TargetNames[(int)s.Target]);
        var form = run.InputFormat;
        if (form.IsDefault)
        {
            // No form declared: the strict ISO form of docs/files.md.
            json.WriteNull("inputFormat");
        }
        else
        {
            json.WriteStartObject("inputFormat");
            json.WriteString("dateFormat", form.DateFormatOrIso);
            json.WriteString("delimiter", form.Delimiter.ToString());
            json.WriteString("decimal", form.DecimalSeparator.ToString());
            Strings(json, "missing", new[] { string.Empty }.Concat(CsvFormat.MissingMarks));
            json.WriteEndObject();
        }
        json.WriteEndObject();
        Strings(json, "input_warnings", run.InputWarnings);
        Strings(json, "input_notes", run.InputNotes);
        json.WriteString("suspect", run.Suspect);
        json.WriteNumber("rows_left_out", run.RowsLeftOut);
        Strings(json, "files", files);
        json.WriteEndObject();
    }

    private static void Strings(Utf8JsonWriter json, string name, IEnumerable<string> values)
    {
        json.WriteStartArray(name);
        foreach (var v in values)
        {
            json.WriteStringValue(v);
        }

        json.WriteEndArray();
    }

    private static void WriteDate(Utf8JsonWriter json, string name, DateOnly? date) =>
        Numbers.Write(json, name, date?.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture));
}
