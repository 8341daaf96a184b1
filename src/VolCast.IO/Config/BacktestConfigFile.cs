using System.Collections.Immutable;
using System.Globalization;
using System.Text.Json;
using VolCast.Core.Backtest;
using VolCast.Core.Data;
using VolCast.Core.Estimators;
using VolCast.Core.Forecasters;
using VolCast.Core.Trading;

namespace VolCast.IO.Config;

/// <summary>Reads a backtest configuration (JSON) into <see cref="BacktestSettings"/>; every setting is optional and defaulted.</summary>
/// <remarks>
/// Shape (camelCase; all optional): <c>{ "forecasters": ["yang-zhang:21", "garch"], "horizon": 21 | "tenor": "30d",
/// "start": "2015-01-02", "end": "2024-12-31", "sweep": true, "sweepEstimators": ["yang-zhang"], "sweepLookbacks": [5, 10, 21],
/// "ewmaLambdas": [0.94, 0.97], "selectionWindowDays": 504, "mcs": { "replications": 1000, "alpha": 0.10,
/// "blockLength": 21, "seed": 1 }, "ruleThreshold": 0.02, "ruleForecaster": "garch", "ruleHistorical": "close-to-close:21",
/// "baseline": "implied", "candidate": "garch", "annualizationFactor": 252, "target": "squared-returns",
/// "costs": { "optionHalfSpreadVolPoints": 0.25, "hedgeCostBps": 1.0 }, "rate": 0, "dividendYield": 0,
/// "entries": "one-at-a-time", "ruleSides": "sell-only", "hedgeVolatility": "implied",
/// "ruleThresholds": [0, 0.005, 0.01, 0.02, 0.03, 0.04, 0.05], "snooping": { "replications": 1000, "blockLength": 21, "seed": 1 },
/// "dateFormat": "dd.MM.yyyy", "delimiter": ";", "decimal": ",", "impliedTenor": "30d" }</c>. The last four say how the input
/// files are written and what the implied series covers; they are read with <see cref="ReadInputForm"/>.
/// Unknown properties are errors (a misspelt setting must not be silently ignored). Comments and trailing commas are allowed.
/// </remarks>
public static partial class BacktestConfigFile
{
    private static readonly JsonSerializerOptions Options = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        UnmappedMemberHandling = System.Text.Json.Serialization.JsonUnmappedMemberHandling.Disallow,
        ReadCommentHandling = JsonCommentHandling.Skip,
        AllowTrailingCommas = true,
    };

    /// <summary>Gets the accepted names of the realized target.</summary>
    public static IReadOnlyList<string> TargetNames { get; } = ["squared-returns", "parkinson", "garman-klass", "rogers-satchell"];

    /// <summary>Reads a configuration file.</summary>
    /// <param name="path">The JSON file.</param>
    /// <returns>The settings, defaults filled in for everything the file leaves out.</returns>
    /// <exception cref="InputDataException">The file is not valid JSON, a property is unknown or has the wrong type
    /// (with its line and property), or a value is out of range (with the property and the valid values).</exception>
    /// <exception cref="SettingRangeException">A numeric setting is outside its range in <see cref="SettingLimits"/>.</exception>
    /// <remarks>Only a regular file of at most <see cref="InputFiles.MaxConfigBytes"/> bytes (1 MiB) of UTF-8 text is read;
    /// a folder, a pipe or a device is refused before it is opened.</remarks>
    public static BacktestSettings Read(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        var bytes = InputFiles.ReadCapped(path, "a JSON configuration file", InputFiles.MaxConfigBytes);
        return Parse(Reading.InputText.Decode(bytes, path), path);
    }

    /// <summary>Reads how the input files are written (dateFormat, delimiter, decimal) and the implied series' tenor (impliedTenor).</summary>
    /// <param name="path">The JSON file.</param>
    /// <returns>The form (the default for keys left out) and the implied tenor in calendar days, or null when not given.</returns>
    /// <exception cref="InputDataException">The file cannot be read or a value is not accepted (the message names the key).</exception>
    public static (CsvFormat Format, int? ImpliedTenorDays) ReadInputForm(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        var bytes = InputFiles.ReadCapped(path, "a JSON configuration file", InputFiles.MaxConfigBytes);
        return ParseInputForm(Reading.InputText.Decode(bytes, path), path);
    }

    /// <summary>Parses the input-form keys of configuration text (see <see cref="ReadInputForm"/>).</summary>
    /// <param name="json">The JSON text.</param>
    /// <param name="file">The file name to put in error messages.</param>
    /// <returns>The form and the implied tenor in calendar days, or null.</returns>
    /// <exception cref="InputDataException">The text is not a valid configuration or a value is not accepted.</exception>
    public static (CsvFormat Format, int? ImpliedTenorDays) ParseInputForm(string json, string file)
    {
        ArgumentNullException.ThrowIfNull(json);
        ArgumentNullException.ThrowIfNull(file);
        Parse(json, file);
        return InputForm(JsonSerializer.Deserialize<BacktestConfigDocument>(json, Options)!, file);
    }

    private static (CsvFormat Format, int? ImpliedTenorDays) InputForm(BacktestConfigDocument doc, string file)
    {
        CsvFormat format;
        try
        {
            format = CsvFormat.Parse(doc.DateFormat, doc.Delimiter, doc.Decimal, key => key switch { "date-format" => "dateFormat", _ => key });
        }
        catch (ArgumentException ex)
        {
            var property = ex.Message.StartsWith("dateFormat", StringComparison.Ordinal) ? "dateFormat" : ex.Message.StartsWith("delimiter", StringComparison.Ordinal) ? "delimiter" : "decimal";
            throw InputDataException.Setting(file, null, property, ex.Message);
        }

        int? tenor = null;
        if (doc.ImpliedTenor is string text)
        {
            tenor = SettingLimits.TenorDaysOf(text, "impliedTenor", file)
                ?? throw Bad(file, "impliedTenor", $"must be a number of calendar days followed by d, such as \"30d\", {SettingLimits.TenorDays} (was \"{Cut(text)}\")");
        }

        return (format, tenor);
    }

    /// <summary>Parses configuration text.</summary>
    /// <param name="json">The JSON text.</param>
    /// <param name="file">The file name to put in error messages.</param>
    /// <returns>The settings.</returns>
    /// <exception cref="InputDataException">As for <see cref="Read"/>.</exception>
    /// <exception cref="SettingRangeException">A numeric setting is outside its range in <see cref="SettingLimits"/>.</exception>
    public static BacktestSettings Parse(string json, string file)
    {
        ArgumentNullException.ThrowIfNull(json);
        ArgumentNullException.ThrowIfNull(file);
        var text = json.TrimStart('\uFEFF', ' ', '\t', '\r', '\n');
        if (text.Length == 0)
        {
            throw InputDataException.Setting(file, 1, null, "the configuration file is empty; write a JSON object such as { \"horizon\": 21 }, or {} for the defaults.");
        }

        BacktestConfigDocument? doc;
        try
        {
            doc = JsonSerializer.Deserialize<BacktestConfigDocument>(json, Options);
        }
        catch (JsonException) when (!StartsLikeJson(text))
        {
            throw InputDataException.Setting(file, 1, null, "the configuration file is not JSON; it must be one JSON object in braces, such as { \"horizon\": 21 } (see the README's complete example).");
        }
        catch (JsonException ex)
        {
            // LineNumber is zero-based; Path names the property ($.mcs.alpha).
            var line = ex.LineNumber is long l ? (int)l + 1 : (int?)null;
            var property = string.IsNullOrEmpty(ex.Path) || ex.Path == "$" ? null : ex.Path.TrimStart('$', '.');
            throw InputDataException.Setting(file, line, property,
                "the configuration is not valid: " + Plain(FirstSentence(ex.Message), property) + " Fix the JSON; every setting is optional, see 'volcast backtest --help'.");
        }

        catch (ArgumentException ex) when (ex.InnerException is System.Text.EncoderFallbackException)
        {
            // A lone surrogate in the text cannot be transcoded for the JSON reader: bad input, not a crash.
            throw InputDataException.Setting(file, null, null, "the configuration holds characters that are not valid Unicode text; save it as UTF-8.");
        }

        if (doc is null)
        {
            throw InputDataException.Setting(file, 1, null, "the configuration is 'null'; write an object such as { \"horizon\": 21 } or {} for the defaults.");
        }

        return ToSettings(doc, file);
    }

    private static BacktestSettings ToSettings(BacktestConfigDocument doc, string file)
    {
        // The input form is not a setting of the backtest, but a bad value must stop the read like any other.
        InputForm(doc, file);
        var s = new BacktestSettings();
        if (doc.Horizon is not null && doc.Tenor is not null)
        {
            throw Bad(file, "horizon", $"give either horizon (trading days) or tenor (calendar days such as \"30d\"), not both (horizon {doc.Horizon}, tenor \"{doc.Tenor}\")");
        }

        if (doc.Horizon is int h)
        {
            SettingLimits.Horizon.Check(h, SettingLimits.Horizon.Name, file);
            s = s with { Horizon = BacktestHorizon.Days(h) };
        }

        if (doc.Tenor is string tenor)
        {
            s = s with { Horizon = TenorSetting(tenor, file) };
        }

        s = s with
        {
            Start = doc.Start is null ? null : ParseDate(doc.Start, file, "start"),
            End = doc.End is null ? null : ParseDate(doc.End, file, "end"),
        };

        if (doc.Forecasters is not null)
        {
            foreach (var spec in doc.Forecasters)
            {
                try
                {
                    if (!UserForecaster.IsUserSpec(spec))
                    {
                        ForecasterSpec.Parse(spec ?? string.Empty);
                    }
                }
                catch (ArgumentException ex)
                {
                    throw InputDataException.Setting(file, null, "forecasters", ex.Message);
                }
            }

            s = s with { Forecasters = [.. doc.Forecasters] };
        }

        if (doc.SweepEstimators is not null)
        {
            var list = ImmutableArray.CreateBuilder<Estimator>();
            foreach (var name in doc.SweepEstimators)
            {
                list.Add(EstimatorNames.TryParse(name, out var e)
                    ? e
                    : throw Bad(file, "sweepEstimators", $"unknown estimator \"{Cut(name)}\"; valid: {string.Join(", ", EstimatorNames.All)}"));
            }

            s = s with { SweepEstimators = list.ToImmutable() };
        }

        s = s with
        {
            Sweep = doc.Sweep ?? s.Sweep,

            // Naming the estimators to sweep asks for them in full; otherwise the listed forecasters' families are swept.
            FullSweep = doc.FullSweep ?? (doc.SweepEstimators is not null || s.FullSweep),
            SweepLookbacks = doc.SweepLookbacks is null ? s.SweepLookbacks : [.. doc.SweepLookbacks],
            EwmaLambdas = doc.EwmaLambdas is null ? s.EwmaLambdas : [.. doc.EwmaLambdas],
            SelectionWindowDays = doc.SelectionWindowDays ?? s.SelectionWindowDays,
            McsReplications = doc.Mcs?.Replications ?? s.McsReplications,
            McsAlpha = doc.Mcs?.Alpha ?? s.McsAlpha,
            McsBlockLength = doc.Mcs?.BlockLength ?? s.McsBlockLength,
            McsSeed = doc.Mcs?.Seed ?? s.McsSeed,
            RuleThreshold = doc.RuleThreshold ?? s.RuleThreshold,
            RuleForecaster = doc.RuleForecaster ?? s.RuleForecaster,
            RuleHistorical = doc.RuleHistorical ?? s.RuleHistorical,
            Baseline = doc.Baseline ?? s.Baseline,
            Candidate = doc.Candidate ?? s.Candidate,
            AnnualizationFactor = doc.AnnualizationFactor ?? s.AnnualizationFactor,
        };

        if (doc.Target is string target)
        {
            var index = TargetNames.ToList().FindIndex(n => string.Equals(n, target.Trim(), StringComparison.OrdinalIgnoreCase));
            s = s with { Target = index >= 0 ? (RealizedTarget)index : throw Bad(file, "target", $"unknown realized target \"{Cut(target)}\"; valid: {string.Join(", ", TargetNames)}") };
        }

        s = s with { Trading = ToTrading(doc, s, file) };
        s = s with
        {
            SnoopingReplications = doc.Snooping?.Replications ?? s.SnoopingReplications,
            SnoopingBlockLength = doc.Snooping?.BlockLength ?? s.SnoopingBlockLength,
            SnoopingSeed = doc.Snooping?.Seed ?? s.SnoopingSeed,
        };

        foreach (var (property, spec) in new[] { ("ruleHistorical", s.RuleHistorical), ("ruleForecaster", s.RuleForecaster), ("baseline", s.Baseline), ("candidate", s.Candidate) })
        {
            if (spec is not null && !spec.Trim().Equals(ImpliedSeries.Name, StringComparison.OrdinalIgnoreCase) && !spec.Trim().StartsWith("adaptive:", StringComparison.OrdinalIgnoreCase) && !UserForecaster.IsUserSpec(spec))
            {
                try
                {
                    ForecasterSpec.Parse(spec);
                }
                catch (ArgumentException ex)
                {
                    throw InputDataException.Setting(file, null, property, ex.Message);
                }
            }
        }

        SettingLimits.Check(s, file);
        try
        {
            s.Validate();
        }
        catch (ArgumentException ex)
        {
            throw InputDataException.Setting(file, null, null, ex.Message);
        }

        return s;
    }

    /// <summary>Gets the accepted values of <c>entries</c>, <c>ruleSides</c> and <c>hedgeVolatility</c>, in the order of their enums.</summary>
    internal static (string[] Entries, string[] Sides, string[] Hedge) TradingNames { get; } =
        (["one-at-a-time", "every-signal"], ["sell-only", "both"], ["implied", "forecast"]);

    private static TradingSettings ToTrading(BacktestConfigDocument doc, BacktestSettings s, string file)
    {
        var t = s.Trading;
        var spread = doc.Costs?.OptionHalfSpreadVolPoints ?? t.Costs.OptionHalfSpreadVolPoints;
        var hedge = doc.Costs?.HedgeCostBps ?? t.Costs.HedgeCostBps;
        SettingLimits.OptionHalfSpread.Check(spread, SettingLimits.OptionHalfSpread.Name, file);
        SettingLimits.HedgeCost.Check(hedge, SettingLimits.HedgeCost.Name, file);
        t = t with
        {
            Costs = new TradeCosts(spread, hedge),
            Rate = doc.Rate ?? t.Rate,
            DividendYield = doc.DividendYield ?? t.DividendYield,
            SweepThresholds = doc.RuleThresholds is null ? t.SweepThresholds : [.. doc.RuleThresholds],
            Entries = doc.Entries is null ? t.Entries : (TradeEntries)Choice(doc.Entries, TradingNames.Entries, file, "entries"),
            Sides = doc.RuleSides is null ? t.Sides : (RuleSides)Choice(doc.RuleSides, TradingNames.Sides, file, "ruleSides"),
            HedgeVolatility = doc.HedgeVolatility is null ? t.HedgeVolatility : (HedgeVolatility)Choice(doc.HedgeVolatility, TradingNames.Hedge, file, "hedgeVolatility"),
        };

        if (doc.RuleThresholds is not null)
        {
            foreach (var threshold in doc.RuleThresholds)
            {
                SettingLimits.RuleThresholds.Check(threshold, SettingLimits.RuleThresholds.Name, file);
            }

            var distinct = doc.RuleThresholds.Distinct().Count();
            if (distinct < 2 || distinct != doc.RuleThresholds.Length)
            {
                throw Bad(file, "ruleThresholds", $"must list at least two different thresholds, each once, to compare (and to test for data snooping), such as [0, 0.01, 0.02] (was {doc.RuleThresholds.Length} value(s), {distinct} different)");
            }
        }

        return t;
    }

    private static int Choice(string text, string[] names, string file, string property)
    {
        var index = Array.FindIndex(names, n => string.Equals(n, text.Trim(), StringComparison.OrdinalIgnoreCase));
        return index >= 0 ? index : throw Bad(file, property, $"unknown value \"{Cut(text)}\"; valid: {string.Join(", ", names)}");
    }

    /// <summary>Parses a calendar tenor such as <c>30d</c>.</summary>
    /// <param name="text">The text: a whole number of calendar days, at least 1, followed by d.</param>
    /// <returns>The horizon, or null when the text is not a tenor.</returns>
    public static BacktestHorizon? ParseTenor(string? text)
    {
        var t = text?.Trim().ToLowerInvariant();
        return t is not null && t.EndsWith('d')
            && int.TryParse(t.AsSpan(0, t.Length - 1), NumberStyles.None, CultureInfo.InvariantCulture, out var days) && days >= 1
            ? BacktestHorizon.Tenor(days)
            : null;
    }

    /// <summary>
    /// Reads the configuration's <c>tenor</c>: any run of digits followed by d is a tenor, and one outside
    /// <see cref="SettingLimits.TenorDays"/> (however many digits it has) is refused with the range, like every other setting.
    /// </summary>
    private static BacktestHorizon TenorSetting(string text, string file) =>
        SettingLimits.TenorDaysOf(text, SettingLimits.TenorDays.Name, file) is int days
            ? BacktestHorizon.Tenor(days)
            : throw Bad(file, "tenor", $"must be a number of calendar days followed by d, such as \"30d\", {SettingLimits.TenorDays} (was \"{Cut(text)}\")");

    private static DateOnly ParseDate(string text, string file, string property) =>
        DateOnly.TryParseExact(text, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var d)
            ? d
            : throw Bad(file, property, $"must be a date written yyyy-MM-dd (was \"{Cut(text)}\")");

    /// <summary>Cuts text echoed from the file to 40 characters, so a huge value cannot flood a message.</summary>
    private static string Cut(string? text) => text is null ? string.Empty : text.Length > 40 ? text[..40] + "…" : text;

    /// <summary>
    /// Reads the keys of a configuration that say how input rows are checked: <c>suspect</c> (<c>warn</c>, <c>drop</c>
    /// or <c>stop</c>) and <c>skipBadRows</c> (true or false). Missing keys keep the defaults.
    /// </summary>
    /// <param name="json">The JSON text (already accepted by <see cref="Parse"/>).</param>
    /// <param name="file">The file name to put in error messages.</param>
    /// <returns>The checks.</returns>
    /// <exception cref="InputDataException">The text is not a valid configuration, or <c>suspect</c> is not one of the three words.</exception>
    public static DataChecks ParseDataChecks(string json, string file)
    {
        ArgumentNullException.ThrowIfNull(json);
        ArgumentNullException.ThrowIfNull(file);
        Parse(json, file);
        var doc = JsonSerializer.Deserialize<BacktestConfigDocument>(json, Options)!;
        var suspect = doc.Suspect switch
        {
            null or "warn" => SuspectAction.Warn,
            "drop" => SuspectAction.Drop,
            "stop" => SuspectAction.Stop,
            _ => throw Bad(file, "suspect", $"must be \"warn\", \"drop\" or \"stop\" (was \"{Cut(doc.Suspect)}\")"),
        };
        return new DataChecks(suspect, doc.SkipBadRows ?? false);
    }

    /// <summary>Reads the row-check keys of a configuration file (see <see cref="ParseDataChecks"/>).</summary>
    /// <param name="path">The configuration file.</param>
    /// <returns>The checks.</returns>
    /// <exception cref="InputDataException">The file cannot be read or is not a valid configuration.</exception>
    public static DataChecks ReadDataChecks(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        var bytes = InputFiles.ReadCapped(path, "a JSON configuration file", InputFiles.MaxConfigBytes);
        return ParseDataChecks(Reading.InputText.Decode(bytes, path), path);
    }

    /// <summary>Whether text starts as a JSON value (or a comment) would: otherwise it is not JSON at all and the reader's message would only confuse.</summary>
    private static bool StartsLikeJson(string text) =>
        text[0] is '{' or '[' or '/' or '"' or '-' or (>= '0' and <= '9')
        || text.StartsWith("true", StringComparison.Ordinal) || text.StartsWith("false", StringComparison.Ordinal) || text.StartsWith("null", StringComparison.Ordinal);

    /// <summary>Reads the configuration's <c>workbook</c> key (true: write results.xlsx); false when it is missing.</summary>
    /// <param name="path">The configuration file.</param>
    /// <returns>Whether the workbook is asked for.</returns>
    /// <exception cref="InputDataException">The file cannot be read or is not a valid configuration.</exception>
    public static bool ReadWorkbook(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        var json = Reading.InputText.Decode(InputFiles.ReadCapped(path, "a JSON configuration file", InputFiles.MaxConfigBytes), path);
        Parse(json, path);
        return JsonSerializer.Deserialize<BacktestConfigDocument>(json, Options)!.Workbook ?? false;
    }

    private static InputDataException Bad(string file, string property, FormattableString problem) =>
        InputDataException.Setting(file, null, property, problem.ToString(CultureInfo.InvariantCulture) + ".");

    /// <summary>Rephrases the serializer's messages that name .NET types (users never see type names).</summary>
    private static string Plain(string message, string? property)
    {
        if (message.Contains("could not be mapped to any .NET member", StringComparison.Ordinal))
        {
            return $"{Reading.ValueText.Quote(property ?? string.Empty)} is not a known setting (check its spelling).";
        }

        const string Converted = "could not be converted to ";
        var at = message.IndexOf(Converted, StringComparison.Ordinal);
        if (at < 0)
        {
            return message;
        }

        var type = message[(at + Converted.Length)..].TrimEnd('.');
        var expected =
            type.Contains("Int32", StringComparison.Ordinal) ? "a whole number, such as 21"
            : type.Contains("Double", StringComparison.Ordinal) ? "a number, such as 0.1"
            : type.Contains("Boolean", StringComparison.Ordinal) ? "true or false"
            : type.Contains("[]", StringComparison.Ordinal) ? "a list in square brackets, such as [\"garch\", \"ewma:0.94\"]"
            : type.Contains("String", StringComparison.Ordinal) ? "text in double quotes"
            : "an object in braces, such as { \"horizon\": 21 }";
        return property is null
            ? $"the configuration has the wrong shape; expected {expected}."
            : $"{Reading.ValueText.Quote(property)} has a value of the wrong type; expected {expected}.";
    }

    private static string FirstSentence(string message)
    {
        var cut = message.IndexOf(" Path:", StringComparison.Ordinal);
        return cut > 0 ? message[..cut] : message;
    }
}
