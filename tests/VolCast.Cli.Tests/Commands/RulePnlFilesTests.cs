using System.Globalization;
using System.Text.Json;
using VolCast.Cli.Tests.Reliability;
using VolCast.Cli.Tests.Support;

namespace VolCast.Cli.Tests.Commands;

/// <summary>
/// The rule's trading backtest through the command line, on a seeded random-walk history with an invented implied
/// series: the files it writes, one trade recomputed here from the raw closes, and the runs where the rule cannot be
/// traded (the backtest completes and says why) or the costs are out of range (exit 2).
/// </summary>
public sealed class RulePnlFilesTests : IDisposable
{
    private const int Days = 700;
    private readonly TempFolder _temp = new("rulepnl");

    public void Dispose() => _temp.Dispose();

    [Fact]
    public void Backtest_WithImplied_WritesTradesAndDailyPathsWithTheDocumentedColumnsAndNoNaN()
    {
        var folder = Run(",\"horizon\": 10");

        var trades = Lines(folder, "trades.csv");
        string[] tradeColumns =
            ["timing", "rule", "forecaster", "side", "entry_date", "expiry_date", "trading_days", "days", "spot", "strike", "iv", "hedge_vol", "forecast",
             "premium", "vega", "entry_delta", "hedge_pnl", "payoff", "option_cost", "hedge_cost", "costs", "pnl_zero_cost", "pnl",
             "pnl_vol_points_zero_cost", "pnl_vol_points", "pnl_pct_spot_zero_cost", "pnl_pct_spot", "stress_pnl_vol_points", "variance_gap", "variance_gap_vol_points"];
        Assert.Equal(tradeColumns, trades[0].Split(','));
        Assert.True(trades.Length > 10);
        Assert.All(trades, line => Assert.Equal(tradeColumns.Length, line.Split(',').Length));
        var rules = trades.Skip(1).Select(l => l.Split(',')[1]).ToHashSet();
        Assert.Subset(rules, new HashSet<string> { "always-sell", "proposed" });
        Assert.Contains(trades, l => l.StartsWith("next-day,", StringComparison.Ordinal));

        var paths = Lines(folder, "rule-pnl.csv");
        Assert.Equal(["rule", "date", "pnl", "pnl_zero_cost", "pnl_entry_vol", "threshold"], paths[0].Split(','));
        Assert.All(paths, line => Assert.Equal(6, line.Split(',').Length));
        var pathRules = paths.Skip(1).Select(l => l.Split(',')[0]).ToHashSet();
        Assert.Equal(new HashSet<string> { "always-sell", "proposed", "current", "historical", "walk-forward-threshold" }, pathRules);
        var later = Lines(folder, "rule-pnl-next-day.csv");
        Assert.Equal(["rule", "date", "pnl"], later[0].Split(','));
        Assert.Equal(pathRules, later.Skip(1).Select(l => l.Split(',')[0]).ToHashSet());

        // The report's path figures are reproducible from the two files: each rule's path totals in metrics.json (net and
        // zero cost at the close, net a day later) are the sums of the files' daily values.
        using var metrics = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "metrics.json")));
        var rulePnl = metrics.RootElement.GetProperty("rule_pnl");
        foreach (var (timing, lines, columns) in new[] { ("at_close", paths, new[] { ("path", 2), ("path_zero_cost", 3) }), ("next_day", later, new[] { ("path", 2) }) })
        {
            foreach (var rule in rulePnl.GetProperty(timing).GetProperty("rules").EnumerateArray())
            {
                var name = rule.GetProperty("rule").GetString();
                foreach (var (path, column) in columns)
                {
                    var sum = lines.Skip(1).Select(l => l.Split(',')).Where(c => c[0] == name).Sum(c => double.Parse(c[column], CultureInfo.InvariantCulture));
                    Assert.Equal(rule.GetProperty(path).GetProperty("total").GetDouble(), sum, 9);
                }
            }
        }

        foreach (var file in Directory.GetFiles(folder).Where(f => f.EndsWith(".csv", StringComparison.Ordinal) || f.EndsWith(".json", StringComparison.Ordinal) || f.EndsWith(".txt", StringComparison.Ordinal)))
        {
            Assert.DoesNotContain("NaN", File.ReadAllText(file), StringComparison.Ordinal);
        }

        using var run = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "run.json")));
        var manifest = run.RootElement.GetProperty("files").EnumerateArray().Select(e => e.GetString()).ToList();
        Assert.Contains("trades.csv", manifest);
        Assert.Contains("rule-pnl.csv", manifest);
        Assert.Contains("rule-pnl-next-day.csv", manifest);
    }

    [Fact]
    public void Backtest_FirstAlwaysSellTrade_MatchesBlackScholesPremiumDeltaHedgeAndCostsRecomputedFromTheCloses()
    {
        // Costs other than the defaults, so the test sees the configured ones used.
        var folder = Run(",\"horizon\": 10, \"costs\": { \"optionHalfSpreadVolPoints\": 0.5, \"hedgeCostBps\": 2.0 }");
        var trades = Lines(folder, "trades.csv");
        var header = trades[0].Split(',').Select((name, i) => (name, i)).ToDictionary(p => p.name, p => p.i);
        var row = trades.Skip(1).Select(l => l.Split(',')).First(c => c[0] == "close" && c[1] == "always-sell");
        double N(string column) => double.Parse(row[header[column]], CultureInfo.InvariantCulture);

        var closes = File.ReadAllLines(_temp.Combine("prices.csv")).Skip(1).Select(l => l.Split(','))
            .ToDictionary(c => DateOnly.ParseExact(c[0], "yyyy-MM-dd", CultureInfo.InvariantCulture), c => double.Parse(c[4], CultureInfo.InvariantCulture));
        var dates = closes.Keys.Order().ToList();
        var entry = DateOnly.ParseExact(row[header["entry_date"]], "yyyy-MM-dd", CultureInfo.InvariantCulture);
        var expiry = DateOnly.ParseExact(row[header["expiry_date"]], "yyyy-MM-dd", CultureInfo.InvariantCulture);
        var path = dates.Where(d => d >= entry && d <= expiry).ToList();
        var spot = closes[entry];
        var sigma = N("iv");
        var strike = spot;

        // Expiry at the horizon: 10 trading days after entry (the convention of the trade).
        Assert.Equal(11, path.Count);
        Assert.Equal(spot, N("spot"), 9);
        Assert.Equal(strike, N("strike"), 9);

        // Black-Scholes-Merton with r = q = 0, T = calendar days / 365 (Hull, Options, Futures, and Other Derivatives,
        // the Black-Scholes-Merton formulas): straddle = call + put; vega of the straddle = 2·S·φ(d1)·√T, per vol point / 100.
        var t0 = (expiry.DayNumber - entry.DayNumber) / 365.0;
        Assert.Equal(expiry.DayNumber - entry.DayNumber, (int)N("days"));
        var premium = Straddle(spot, strike, sigma, t0);
        var vega = 2 * spot * Phi(D1(spot, strike, sigma, t0)) * Math.Sqrt(t0) / 100;
        Assert.Equal(premium, N("premium"), 1e-6 * spot);
        Assert.Equal(vega, N("vega"), 1e-6 * vega);

        // Hedge of the long straddle: hold −Δ_t from each close to the next up to the one before expiry, Δ = 2N(d1) − 1 at
        // the entry implied and the remaining calendar time; hedge costs on every traded notional, the unwind included.
        double hedge = 0, traded = 0, previous = 0;
        for (var i = 0; i + 1 < path.Count; i++)
        {
            var s = closes[path[i]];
            var tau = (expiry.DayNumber - path[i].DayNumber) / 365.0;
            var delta = (2 * Cdf(D1(s, strike, sigma, tau))) - 1;
            hedge += -delta * (closes[path[i + 1]] - s);
            traded += Math.Abs(delta - previous) * s;
            previous = delta;
        }

        var sT = closes[expiry];
        traded += Math.Abs(previous) * sT;
        var payoff = Math.Abs(sT - strike);
        var costs = (0.5 * vega) + (2.0 / 10_000 * traded);
        var pnl = -(payoff - premium + hedge) - costs; // a short straddle: s = −1
        Assert.Equal("sell", row[header["side"]]);
        Assert.Equal(payoff, N("payoff"), 1e-9 * spot);
        Assert.Equal(hedge, N("hedge_pnl"), 1e-6 * spot);
        Assert.Equal(costs, N("costs"), 1e-6 * spot);
        Assert.Equal(pnl, N("pnl"), 1e-6 * spot);
        Assert.Equal(pnl / vega, N("pnl_vol_points"), 1e-3);
        Assert.Equal(100 * pnl / spot, N("pnl_pct_spot"), 1e-4);
    }

    [Fact]
    public void Backtest_WithImplied_MetricsJsonHasTheRulePnlSectionAndSummaryLeadsWithTheAnswer()
    {
        var folder = Run(",\"horizon\": 10, \"snooping\": { \"replications\": 200, \"seed\": 7 }");

        using var metrics = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "metrics.json")));
        var section = metrics.RootElement.GetProperty("rule_pnl");
        foreach (var key in new[] { "answer", "cautions", "conventions", "at_close", "next_day", "snooping" })
        {
            Assert.True(section.TryGetProperty(key, out _), key);
        }

        var atClose = section.GetProperty("at_close");
        Assert.Equal(5, atClose.GetProperty("rules").GetArrayLength());
        foreach (var key in new[] { "proposed_vs_current", "versus_always_sell", "sweep", "break_even" })
        {
            Assert.True(atClose.TryGetProperty(key, out _), key);
        }

        var proposed = atClose.GetProperty("rules")[1];
        Assert.Equal("proposed", proposed.GetProperty("rule").GetString());
        foreach (var key in new[] { "trades", "trades_zero_cost", "path", "path_zero_cost", "variance_swap_view", "share_of_days_in_market" })
        {
            Assert.True(proposed.TryGetProperty(key, out _), key);
        }

        // Default sweep: 7 thresholds × 3 forecasters × sell only.
        Assert.Equal(21, atClose.GetProperty("sweep").GetArrayLength());
        var means = section.GetProperty("snooping").GetProperty("means");
        Assert.Equal(200, means.GetProperty("replications").GetInt32());
        Assert.Equal(7, means.GetProperty("seed").GetInt32());
        Assert.Equal(10, means.GetProperty("mean_block_length").GetDouble());
        var spa = means.GetProperty("spa_p_consistent").GetDouble();
        Assert.InRange(spa, 0, 1);
        Assert.InRange(section.GetProperty("snooping").GetProperty("sharpe").GetProperty("reality_check_p").GetDouble(), 0, 1);
        // The documented default half-spread (the configuration above leaves it out).
        Assert.Equal(0.25, section.GetProperty("conventions").GetProperty("option_half_spread_vol_points").GetDouble());

        var summary = File.ReadAllLines(Path.Combine(folder, "summary.txt"));
        Assert.StartsWith("Would the rule have paid? Switching from the current rule to the proposed one", summary[1], StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_BaselineIsImplied_CurrentRuleIsThePlainHistoricalRule()
    {
        // "implied − implied" never fires, so the current rule falls back to the plain historical estimate (documented).
        var folder = Run(",\"horizon\": 10, \"baseline\": \"implied\", \"ruleHistorical\": \"close-to-close:21\"");

        using var metrics = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "metrics.json")));
        var rules = metrics.RootElement.GetProperty("rule_pnl").GetProperty("at_close").GetProperty("rules");
        Assert.Equal("current", rules[2].GetProperty("rule").GetString());
        Assert.Equal("close-to-close:21", rules[2].GetProperty("forecaster").GetString());
        Assert.Equal("close-to-close:21", rules[3].GetProperty("forecaster").GetString());
    }

    [Fact]
    public void Backtest_EverySignalEntries_TradeTableHoldsEveryLadderTrade()
    {
        var folder = Run(",\"horizon\": 10, \"entries\": \"every-signal\"");

        using var metrics = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "metrics.json")));
        var section = metrics.RootElement.GetProperty("rule_pnl");
        Assert.Equal("every-signal", section.GetProperty("conventions").GetProperty("entries").GetString());
        var always = section.GetProperty("at_close").GetProperty("rules")[0];
        var rows = Lines(folder, "trades.csv").Count(l => l.StartsWith("close,always-sell,", StringComparison.Ordinal));

        // Every firing date sells one straddle: the table, the trade count and the ladder agree, and trades overlap
        // (more than one per horizon of 10 trading days).
        Assert.Equal(always.GetProperty("ladder_trades").GetInt32(), rows);
        Assert.Equal(rows, always.GetProperty("trades").GetProperty("count").GetInt32());
        Assert.Equal(section.GetProperty("at_close").GetProperty("firing_dates").GetInt32(), rows);
    }

    [Fact]
    public void Backtest_WithoutImplied_LeavesTheSectionOutAndSaysWhy()
    {
        var prices = ReliabilityFiles.Prices(_temp.Path, "prices.csv", Days, seed: 31);
        var folder = _temp.Combine("out");

        var result = CliRunner.Run("backtest", "--prices", prices, "--config", ReliabilityFiles.FastConfig(_temp.Path), "--out", folder);

        Assert.True(result.ExitCode == 0, result.Stderr);
        using var metrics = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "metrics.json")));
        Assert.False(metrics.RootElement.TryGetProperty("rule_pnl", out _));
        Assert.Contains("implied", metrics.RootElement.GetProperty("rule_pnl_absent").GetString(), StringComparison.Ordinal);
        Assert.False(File.Exists(Path.Combine(folder, "trades.csv")));
        Assert.False(File.Exists(Path.Combine(folder, "rule-pnl.csv")));
    }

    [Fact]
    public void Backtest_RuleThatNeverFires_CompletesAndSaysWhy()
    {
        // Implied near 20% never exceeds a forecast by 90 vol points.
        var folder = Run(",\"horizon\": 10, \"ruleThreshold\": 0.9");

        using var metrics = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "metrics.json")));
        Assert.Contains("never fired", metrics.RootElement.GetProperty("rule_pnl_absent").GetString(), StringComparison.Ordinal);
        Assert.False(File.Exists(Path.Combine(folder, "trades.csv")));
        Assert.Contains("never fired", File.ReadAllText(Path.Combine(folder, "summary.txt")), StringComparison.Ordinal);
    }

    [Fact]
    public void Backtest_HorizonOfOneDay_CompletesAndSaysTheTradeNeedsTwoTradingDays()
    {
        var folder = Run(",\"horizon\": 1");

        using var metrics = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "metrics.json")));
        Assert.Contains("two trading days", metrics.RootElement.GetProperty("rule_pnl_absent").GetString(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("\"costs\": { \"optionHalfSpreadVolPoints\": -0.1 }", "costs.optionHalfSpreadVolPoints")]
    [InlineData("\"costs\": { \"optionHalfSpreadVolPoints\": 25 }", "costs.optionHalfSpreadVolPoints")]
    [InlineData("\"costs\": { \"hedgeCostBps\": -1 }", "costs.hedgeCostBps")]
    [InlineData("\"costs\": { \"hedgeCostBps\": 1000 }", "costs.hedgeCostBps")]
    [InlineData("\"rate\": 3", "rate")]
    [InlineData("\"ruleThresholds\": [0, 2]", "ruleThresholds")]
    [InlineData("\"snooping\": { \"replications\": 1 }", "snooping.replications")]
    public void Backtest_OutOfRangeTradingSetting_ExitsTwoNamingTheSettingAndItsRange(string setting, string name)
    {
        var prices = ReliabilityFiles.Prices(_temp.Path, "prices.csv", 300, seed: 31);
        var config = _temp.Write("bad.json", "{ " + setting + " }");

        var result = CliRunner.Run("backtest", "--prices", prices, "--config", config, "--out", _temp.Combine("out"));

        Assert.Equal(2, result.ExitCode);
        Assert.Contains(name + " must be from", result.Stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(_temp.Combine("out")));
    }

    [Fact]
    public void Backtest_DividendYieldOnAdjustedCloses_ExitsTwoSayingTheDividendsAreInThePath()
    {
        var lines = File.ReadAllLines(ReliabilityFiles.Prices(_temp.Path, "raw.csv", 300, seed: 31));
        var adjusted = _temp.Write("adjusted.csv", string.Join('\n', lines.Select((l, i) => i == 0 ? l + ",adj_close" : l + "," + (0.98 * double.Parse(l.Split(',')[4], CultureInfo.InvariantCulture)).ToString("R", CultureInfo.InvariantCulture))) + "\n");
        var config = _temp.Write("q.json", "{ \"dividendYield\": 0.02 }");

        var result = CliRunner.Run("backtest", "--prices", adjusted, "--config", config, "--out", _temp.Combine("out"));

        Assert.Equal(2, result.ExitCode);
        Assert.Contains("dividendYield", result.Stderr, StringComparison.Ordinal);
    }

    private string Run(string extra)
    {
        var prices = ReliabilityFiles.Prices(_temp.Path, "prices.csv", Days, seed: 31);
        var implied = ReliabilityFiles.Implied(_temp.Path, "implied.csv", new DateOnly(1990, 1, 1), Days);
        var config = ReliabilityFiles.FastConfig(_temp.Path, ",\"ruleForecaster\": \"ewma:0.94\", \"baseline\": \"close-to-close:21\", \"snooping\": { \"replications\": 100 }" + extra);
        var folder = _temp.Combine("out");
        var result = CliRunner.Run("backtest", "--prices", prices, "--implied", implied, "--config", config, "--out", folder);
        Assert.True(result.ExitCode == 0, result.Stderr);
        return folder;
    }

    private static string[] Lines(string folder, string name) => File.ReadAllLines(Path.Combine(folder, name));

    private static double D1(double s, double k, double sigma, double t) => (Math.Log(s / k) + (0.5 * sigma * sigma * t)) / (sigma * Math.Sqrt(t));

    private static double Straddle(double s, double k, double sigma, double t)
    {
        var d1 = D1(s, k, sigma, t);
        var d2 = d1 - (sigma * Math.Sqrt(t));
        var call = (s * Cdf(d1)) - (k * Cdf(d2));
        var put = (k * Cdf(-d2)) - (s * Cdf(-d1));
        return call + put;
    }

    private static double Phi(double x) => Math.Exp(-0.5 * x * x) / Math.Sqrt(2 * Math.PI);

    // The standard normal distribution function: Abramowitz & Stegun, Handbook of Mathematical Functions, 26.2.17
    // (|error| < 7.5e-8), written here independently of the code under test.
    private static double Cdf(double x)
    {
        if (x < 0)
        {
            return 1 - Cdf(-x);
        }

        var k = 1 / (1 + (0.2316419 * x));
        var poly = k * (0.319381530 + (k * (-0.356563782 + (k * (1.781477937 + (k * (-1.821255978 + (k * 1.330274429))))))));
        return 1 - (Phi(x) * poly);
    }
}
