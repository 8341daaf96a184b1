using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.IO;
using VolCast.IO.Config;

namespace VolCast.Cli;

/// <summary>Turns the options that <c>backtest</c> and <c>batch</c> share into resolved, checked settings.</summary>
internal static class BacktestOptions
{
    /// <summary>Reads the configuration (if any), applies the command-line overrides and checks the result.</summary>
    /// <param name="config">The JSON configuration file, or null for the defaults.</param>
    /// <param name="horizon">--horizon in trading days, or null.</param>
    /// <param name="tenor">--tenor such as 30d, or null.</param>
    /// <param name="start">--start as written, or null.</param>
    /// <param name="end">--end as written, or null.</param>
    /// <returns>The settings.</returns>
    /// <exception cref="UsageException">The options conflict or a value is out of range.</exception>
    /// <exception cref="InputDataException">The configuration file cannot be used.</exception>
    public static BacktestSettings Resolve(string? config, int? horizon, string? tenor, string? start = null, string? end = null)
    {
        if (horizon is not null && tenor is not null)
        {
            throw new UsageException("give either --horizon (trading days) or --tenor (calendar days such as 30d), not both.");
        }

        if (horizon is int h)
        {
            SettingLimits.Horizon.Check(h, "--horizon");
        }

        BacktestHorizon? tenorHorizon = null;
        if (tenor is string tenorText)
        {
            tenorHorizon = ParseTenor(tenorText);
        }

        var settings = config is null ? new BacktestSettings() : BacktestConfigFile.Read(config);
        if (horizon is int days)
        {
            settings = settings with { Horizon = BacktestHorizon.Days(days) };
        }

        if (tenorHorizon is not null)
        {
            settings = settings with { Horizon = tenorHorizon };
        }

        settings = settings with
        {
            Start = start is null ? settings.Start : Date(start, "--start"),
            End = end is null ? settings.End : Date(end, "--end"),
        };
        try
        {
            settings.Validate();
        }
        catch (ArgumentException ex)
        {
            throw new UsageException(ex.Message);
        }

        return settings;
    }

    /// <summary>Parses --tenor and checks its range, before anything is read.</summary>
    private static BacktestHorizon ParseTenor(string text) =>
        SettingLimits.TenorDaysOf(text, "--tenor") is int days
            ? BacktestHorizon.Tenor(days)
            : throw new UsageException($"--tenor must be a number of calendar days followed by d, such as 30d, {SettingLimits.TenorDays} (was {Shown(text)}).");

    /// <summary>A value from the command line inside a message: quoted and cut to 40 characters.</summary>
    internal static string Shown(string text) => "'" + (text.Length > 40 ? text[..40] + "…" : text) + "'";

    /// <summary>Resolves how input rows are checked: the configuration's <c>suspect</c> and <c>skipBadRows</c>, overridden by --suspect and --skip-bad-rows.</summary>
    /// <param name="config">The JSON configuration file, or null.</param>
    /// <param name="suspect">--suspect (warn, drop or stop), or null.</param>
    /// <param name="skipBadRows">Whether --skip-bad-rows was given.</param>
    /// <returns>The checks.</returns>
    /// <exception cref="InputDataException">The configuration file cannot be used.</exception>
    public static DataChecks Checks(string? config, string? suspect, bool skipBadRows)
    {
        var checks = config is null ? DataChecks.Default : BacktestConfigFile.ReadDataChecks(config);
        if (suspect is not null)
        {
            checks = checks with { Suspect = suspect switch { "drop" => SuspectAction.Drop, "stop" => SuspectAction.Stop, _ => SuspectAction.Warn } };
        }

        return skipBadRows ? checks with { SkipBadRows = true } : checks;
    }

    /// <summary>Resolves whether results.xlsx is written: --workbook, or the configuration's <c>workbook</c>.</summary>
    /// <param name="config">The JSON configuration file, or null.</param>
    /// <param name="workbook">Whether --workbook was given.</param>
    /// <returns>True to write the workbook.</returns>
    /// <exception cref="InputDataException">The configuration file cannot be used.</exception>
    public static bool Workbook(string? config, bool workbook) =>
        workbook || (config is not null && BacktestConfigFile.ReadWorkbook(config));

    /// <summary>The help text of --workbook.</summary>
    public const string WorkbookHelp = "Also write results.xlsx beside the CSV files, for spreadsheets: one sheet per table with numbers stored as numbers (vol in %, p-values to three places), frozen header rows, the settings, and the caution on the first sheet. The configuration's workbook: true does the same.";

    /// <summary>The help text of --suspect.</summary>
    public const string SuspectHelp = "What to do with rows that pass the row checks but look wrong (a bar that jumps and reverts, a stale or spiking implied value, one far outside the realized range): warn (default; list each in the console, run.json and the report), drop (leave them out as missing days or quotes and list them in rejected-rows.csv) or stop (refuse with exit code 3 and the full list). Overrides the configuration's suspect.";

    /// <summary>The help text of --config: every key of the configuration file (the README has a complete example) and the numeric ranges.</summary>
    public static string ConfigHelp { get; } =
        "JSON configuration; every setting is optional and the README has a complete example. Keys: forecasters, horizon or tenor, start, end, "
        + "sweep, sweepEstimators, fullSweep (true sweeps every estimator family, not only the listed ones), sweepLookbacks, ewmaLambdas, selectionWindowDays, mcs {replications, alpha, blockLength, seed}, "
        + "ruleThreshold, ruleForecaster, ruleHistorical, baseline, candidate, annualizationFactor, target; "
        + "the rule's trades: costs {optionHalfSpreadVolPoints, hedgeCostBps}, rate, dividendYield, entries (one-at-a-time | every-signal), "
        + "ruleSides (sell-only | both), hedgeVolatility (implied | forecast), ruleThresholds, snooping {replications, blockLength, seed}; "
        + "the inputs: suspect, skipBadRows, dateFormat, delimiter, decimal, impliedTenor, forecastsFile, forecastsUnit, eventsFile (paths in the configuration are relative to its own folder); workbook (true writes results.xlsx). " + SettingLimits.HelpText();

    /// <summary>The help text of --skip-bad-rows.</summary>
    public const string SkipBadRowsHelp = "Leave out rows that fail a row check (unparseable, low above high, a duplicate date) and list them in rejected-rows.csv, instead of refusing the file with the list of every bad row.";

    /// <summary>Maps --iv-unit to the reader's unit (inferred when not given).</summary>
    public static ImpliedUnit Unit(string? ivUnit) =>
        ivUnit switch { "percent" => ImpliedUnit.Percent, "decimal" => ImpliedUnit.Decimal, _ => ImpliedUnit.Infer };

    private static DateOnly Date(string text, string option) =>
        DateOnly.TryParseExact(text, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var d)
            ? d
            : throw new UsageException($"{option} must be a date written yyyy-MM-dd (was {Shown(text)}).");
}
