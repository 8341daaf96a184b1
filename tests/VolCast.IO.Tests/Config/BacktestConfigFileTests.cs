using VolCast.Core.Backtest;
using VolCast.Core.Estimators;
using VolCast.IO.Config;

namespace VolCast.IO.Tests.Config;

public sealed class BacktestConfigFileTests
{
    [Fact]
    public void Parse_FullSweep_IsOffByDefaultAndOnWhenAsked()
    {
        Assert.False(BacktestConfigFile.Parse("{}", "c.json").FullSweep);
        Assert.True(BacktestConfigFile.Parse("{ \"fullSweep\": true }", "c.json").FullSweep);
        Assert.False(BacktestConfigFile.Parse("{ \"fullSweep\": false, \"sweepEstimators\": [\"parkinson\"] }", "c.json").FullSweep);
    }

    [Fact]
    public void Parse_EmptyObject_GivesEveryDefault()
    {
        var s = BacktestConfigFile.Parse("{}", "c.json");
        var d = new BacktestSettings();
        Assert.Equal(d.SweepEstimators.ToArray(), s.SweepEstimators.ToArray());
        Assert.Equal(d.SweepLookbacks.ToArray(), s.SweepLookbacks.ToArray());
        Assert.Equal(d.EwmaLambdas.ToArray(), s.EwmaLambdas.ToArray());
        Assert.True(s.Forecasters.IsEmpty);
        Assert.Equal(d with { SweepEstimators = s.SweepEstimators, SweepLookbacks = s.SweepLookbacks, EwmaLambdas = s.EwmaLambdas, Forecasters = s.Forecasters }, s);
        Assert.Equal(21, s.Horizon.TradingDays);
        Assert.Equal(504, s.SelectionWindowDays);
        Assert.Equal(1000, s.McsReplications);
        Assert.Equal(0.10, s.McsAlpha);
    }

    [Fact]
    public void Parse_EverySetting_ReadsEachOne()
    {
        const string json = """
            {
              // comments are allowed
              "forecasters": ["yang-zhang:21", "garch"],
              "tenor": "30d",
              "start": "2015-01-02", "end": "2020-12-31",
              "sweep": true, "sweepEstimators": ["parkinson"], "sweepLookbacks": [5, 10], "ewmaLambdas": [0.95],
              "selectionWindowDays": 252,
              "mcs": { "replications": 500, "alpha": 0.05, "blockLength": 10, "seed": 7 },
              "ruleThreshold": 0.03, "ruleForecaster": "garch", "ruleHistorical": "close-to-close:63",
              "baseline": "implied", "candidate": "garch", "annualizationFactor": 260, "target": "garman-klass",
            }
            """;
        var s = BacktestConfigFile.Parse(json, "c.json");
        Assert.Equal(["yang-zhang:21", "garch"], s.Forecasters.ToArray());
        Assert.Equal(30, s.Horizon.TenorCalendarDays);
        Assert.Equal(new DateOnly(2015, 1, 2), s.Start);
        Assert.Equal(new DateOnly(2020, 12, 31), s.End);
        Assert.Equal([Estimator.Parkinson], s.SweepEstimators.ToArray());
        Assert.True(s.FullSweep); // naming the estimators to sweep asks for them in full
        Assert.Equal([5, 10], s.SweepLookbacks.ToArray());
        Assert.Equal([0.95], s.EwmaLambdas.ToArray());
        Assert.Equal(252, s.SelectionWindowDays);
        Assert.Equal((500, 0.05, 10, 7), (s.McsReplications, s.McsAlpha, s.McsBlockLength!.Value, s.McsSeed));
        Assert.Equal(0.03, s.RuleThreshold);
        Assert.Equal(("garch", "close-to-close:63", "implied", "garch"), (s.RuleForecaster, s.RuleHistorical, s.Baseline, s.Candidate));
        Assert.Equal(260, s.AnnualizationFactor);
        Assert.Equal(RealizedTarget.GarmanKlass, s.Target);
    }

    [Theory]
    // Wrong type: the line (1-based) and the property path are named.
    [InlineData("{\n\"horizon\": \"long\"\n}", 2, "horizon")]
    // A misspelt setting is not silently ignored.
    [InlineData("{\n\"horizn\": 21\n}", 2, "horizn")]
    // Not JSON at all.
    [InlineData("{\n\"horizon\": 21,\n\"mcs\": { \"seed\": }\n}", 3, "mcs.seed")]
    public void Parse_Malformed_ThrowsWithLineAndProperty(string json, int line, string property)
    {
        var ex = Assert.Throws<InputDataException>(() => BacktestConfigFile.Parse(json, "c.json"));
        Assert.Equal(line, ex.Line);
        Assert.Contains(property, ex.Message, StringComparison.Ordinal);
        Assert.Contains("c.json", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    // Unknown forecaster: the message lists the valid specs.
    [InlineData("{ \"forecasters\": [\"magic\"] }", "forecasters", "Valid forecasters")]
    [InlineData("{ \"horizon\": 21, \"tenor\": \"30d\" }", "horizon", "not both")]
    [InlineData("{ \"tenor\": \"a month\" }", "tenor", "30d")]
    [InlineData("{ \"start\": \"02/01/2015\" }", "start", "yyyy-MM-dd")]
    [InlineData("{ \"mcs\": { \"alpha\": 1.5 } }", null, "(was 1.5)")]
    [InlineData("{ \"sweepEstimators\": [\"garch\"] }", "sweepEstimators", "yang-zhang")]
    [InlineData("{ \"target\": \"vix\" }", "target", "squared-returns")]
    public void Parse_BadValue_ThrowsNamingPropertyAndValidValues(string json, string? property, string expected)
    {
        var ex = Assert.Throws<InputDataException>(() => BacktestConfigFile.Parse(json, "c.json"));
        Assert.Equal(property, ex.Column);
        Assert.Contains(expected, ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("tenor", "3651d", "(was 3651d)")]
    [InlineData("impliedTenor", "0d", "(was 0d)")]
    [InlineData("impliedTenor", "3651d", "(was 3651d)")]
    public void Parse_TenorOutOfRange_SaysTheRangeAndTheValueAsWritten(string key, string tenor, string echo)
    {
        // The tenor keys say what every numeric setting says: "KEY must be from MIN to MAX UNIT (was VALUE)".
        var json = "{ \"" + key + "\": \"" + tenor + "\" }";

        var ex = Assert.Throws<SettingRangeException>(() => Read(key, json));

        Assert.Contains("c.json: " + key + " must be from 1 to 3,650 calendar days " + echo, ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("tenor")]
    [InlineData("impliedTenor")]
    public void Parse_TenorOfThousandsOfDigits_EchoesItsFirstFortyCharactersNotInfinity(string key)
    {
        var digits = new string('9', 5000) + "d";
        var json = "{ \"" + key + "\": \"" + digits + "\" }";

        var ex = Assert.Throws<SettingRangeException>(() => Read(key, json));

        Assert.Contains("(was " + new string('9', 40) + "…)", ex.Message, StringComparison.Ordinal);
        Assert.DoesNotContain("Infinity", ex.Message, StringComparison.Ordinal);
        Assert.True(ex.Message.Length < 300, ex.Message);
    }

    [Fact]
    public void ParseInputForm_ImpliedTenorNotATenor_SaysWhatIsExpected()
    {
        var ex = Assert.Throws<InputDataException>(() => BacktestConfigFile.ParseInputForm("{ \"impliedTenor\": \"a month\" }", "c.json"));

        Assert.Equal("impliedTenor", ex.Column);
        Assert.Contains("followed by d, such as \"30d\", 1 to 3,650 calendar days (was \"a month\")", ex.Message, StringComparison.Ordinal);
    }

    /// <summary>Reads the key the way a run does: the input form holds impliedTenor, the settings hold tenor.</summary>
    private static object Read(string key, string json) => key == "impliedTenor"
        ? BacktestConfigFile.ParseInputForm(json, "c.json")
        : BacktestConfigFile.Parse(json, "c.json");

    [Fact]
    public void FilePaths_Relative_AreResolvedAgainstTheConfigurationsFolder()
    {
        var config = Path.Combine("runs", "spx", "config.json");
        const string json = "{ \"forecastsFile\": \"mine/forecasts.csv\", \"eventsFile\": \"../events.csv\" }";

        Assert.Equal(Path.Combine("runs", "spx", "mine/forecasts.csv"), BacktestConfigFile.ParseForecasts(json, config).File);
        Assert.Equal(Path.Combine("runs", "spx", "../events.csv"), BacktestConfigFile.ParseEventsFile(json, config));
    }

    [Fact]
    public void FilePaths_BesideAConfigurationInTheWorkingFolder_AreUnchanged()
    {
        const string json = "{ \"forecastsFile\": \"forecasts.csv\", \"eventsFile\": \"events.csv\" }";

        Assert.Equal("forecasts.csv", BacktestConfigFile.ParseForecasts(json, "config.json").File);
        Assert.Equal("events.csv", BacktestConfigFile.ParseEventsFile(json, "config.json"));
    }

    [Fact]
    public void FilePaths_Absolute_AreUsedAsWritten()
    {
        var absolute = Path.Combine(Path.GetTempPath(), "elsewhere", "events.csv");
        var json = "{ \"eventsFile\": " + System.Text.Json.JsonSerializer.Serialize(absolute) + ", \"forecastsFile\": " + System.Text.Json.JsonSerializer.Serialize(absolute) + " }";

        Assert.Equal(absolute, BacktestConfigFile.ParseEventsFile(json, Path.Combine("runs", "config.json")));
        Assert.Equal(absolute, BacktestConfigFile.ParseForecasts(json, Path.Combine("runs", "config.json")).File);
    }

    [Fact]
    public void FilePaths_LeftOutOrEmpty_AreNullOrRefusedNamingTheKey()
    {
        Assert.Null(BacktestConfigFile.ParseEventsFile("{}", "c.json"));
        Assert.Null(BacktestConfigFile.ParseForecasts("{}", "c.json").File);

        var error = Assert.Throws<InputDataException>(() => BacktestConfigFile.ParseEventsFile("{ \"eventsFile\": \" \" }", "c.json"));
        Assert.Equal("eventsFile", error.Column);
    }
}
