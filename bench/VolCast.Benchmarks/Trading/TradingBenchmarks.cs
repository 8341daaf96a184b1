using BenchmarkDotNet.Attributes;
using VolCast.Benchmarks.Backtest;
using VolCast.Core.Backtest;
using VolCast.Core.Data;
using VolCast.Core.Trading;

namespace VolCast.Benchmarks.Trading;

/// <summary>
/// The rule's trading backtest on the default backtest's output (target: under 10% of the default backtest on 5,000
/// days): every firing date's delta-hedged straddle with its daily marks, five rules, the 3 × 7 threshold sweep and
/// the tests. The forecasts are the first three of the default backtest on the same seeded data.
/// </summary>
[MemoryDiagnoser]
public class TradingBenchmarks
{
    private PriceHistory _bars = null!;
    private ImpliedSeries _impliedSeries = null!;
    private PriceHistory _prices = null!;
    private IReadOnlyList<double?> _implied = null!;
    private RuleForecast _proposed = null!;
    private RuleForecast _current = null!;
    private RuleForecast _historical = null!;

    [Params(5000)]
    public int Days { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        var (prices, implied) = BacktestBenchmarks.DefaultBacktestData(Days);
        (_bars, _impliedSeries) = (prices, implied);
        var result = Backtester.Run(prices, implied, new BacktestSettings());
        var first = prices.Dates.IndexOf(result.Dates[0]);
        var count = result.Dates.Length;
        _prices = PriceHistory.FromCloses(prices.Dates.Slice(first, count), prices.Close.Slice(first, count));
        _implied = result.Implied;
        _proposed = new RuleForecast(result.Forecasts[0].Spec, result.Forecasts[0].Values);
        _current = new RuleForecast(result.Forecasts[1].Spec, result.Forecasts[1].Values);
        _historical = new RuleForecast(result.Forecasts[2].Spec, result.Forecasts[2].Values);
    }

    /// <summary>The default backtest on the same data, measured beside the trades so the ratio is taken under the same load.</summary>
    [Benchmark(Baseline = true)]
    public BacktestResult DefaultBacktest() => Backtester.Run(_bars, _impliedSeries, new BacktestSettings());

    [Benchmark]
    public RuleBacktestResult RuleTrades() =>
        RuleBacktest.Run(_prices, _implied, BacktestHorizon.Default, _proposed, _current, _historical, new TradingSettings { Threshold = 0 });
}
