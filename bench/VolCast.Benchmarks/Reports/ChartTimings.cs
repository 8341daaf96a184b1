using System.Globalization;
using System.Runtime.InteropServices;
using ScottPlot;
using SkiaSharp;
using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Trading;
using VolCast.IO;
using VolCast.IO.Csv;
using VolCast.IO.Results;
using VolCast.Reports;
using VolCast.Reports.Charts;
using VolCast.Reports.Model;

namespace VolCast.Benchmarks.Reports;

/// <summary>
/// Where a name's charts and its rule P&amp;L stage spend their time, part by part: for every chart of the report, the
/// CPU time of building the ScottPlot plot, drawing it onto a surface and encoding the PNG, measured separately; then
/// the whole chart as the report makes it; then the P&amp;L stage's parts (both entry timings, the snooping tests, the
/// trade and path files). Times are the calling thread's CPU time (clock_gettime with CLOCK_THREAD_CPUTIME_ID), so
/// other processes' load moves them less than wall time; median over the rounds after one warm-up round.
/// Run: <c>dotnet run -c Release -- charts PRICES.csv IMPLIED.csv [ROUNDS]</c>.
/// </summary>
internal static class ChartTimings
{
    public static void Run(string[] args)
    {
        var rounds = args.Length > 2 ? int.Parse(args[2], CultureInfo.InvariantCulture) : 5;
        var prices = PriceFileReader.Read(InputBytes.Read(args[0]));
        var implied = ImpliedFileReader.Read(InputBytes.Read(args[1]), ImpliedUnit.Decimal);
        var inputs = SuspectRows.Apply(prices, implied, args[1], SuspectAction.Warn);
        var history = inputs.Prices.History;
        var result = Backtester.Run(history, inputs.Implied!.Series, new BacktestSettings());
        // The first calls in this process, as a single backtest command makes them: JIT and first-tier code included.
        var (coldImplied, coldProposed, coldCurrent, coldHistorical) = RuleInputs(result, history);
        var coldTrading = result.Settings.Trading with { Threshold = result.Settings.RuleThreshold, AnnualizationDays = result.Settings.AnnualizationFactor };
        var c0 = ThreadCpu();
        RuleBacktest.Run(history, coldImplied, result.Settings.Horizon, coldProposed, coldCurrent, coldHistorical, coldTrading);
        var c1 = ThreadCpu();
        RuleBacktest.Run(history, coldImplied, result.Settings.Horizon, coldProposed, coldCurrent, coldHistorical, coldTrading with { EntryTiming = EntryTiming.NextClose });
        var c2 = ThreadCpu();
        var (pnl, _) = RulePnlEvaluator.Evaluate(result, history);
        var c3 = ThreadCpu();
        var cold = string.Create(CultureInfo.InvariantCulture,
            $"first RuleBacktest.Run (at the close) {(c1 - c0) * 1000:0.0} ms, second (next day) {(c2 - c1) * 1000:0.0} ms, then the first RulePnlEvaluator.Evaluate (two more runs and the first snooping tests) {(c3 - c2) * 1000:0.0} ms");
        var close = pnl!.AtClose;
        var cone = ReportWriter.Cone(result, history);
        var leading = ReportSeries.Leading(result);
        var colors = SeriesColors.For(result);
        var realized = ReportSeries.Realized(result);
        var impliedSeries = ReportSeries.Implied(result);
        var forecasts = leading.Select(s => ReportSeries.Forecast(result, s)).ToList();
        var differentials = leading.Select(s => ReportSeries.QlikeDifferential(result, s)).ToList();
        var curves = ReportSeries.LookbackCurves(result);
        var leader = ReportSeries.Ranked(result).First(m => m.MincerZarnowitz is not null);
        var (forecast, realizedVariance) = ReportSeries.Variances(result, leader.Spec);
        var rule = result.RuleTest!;
        var (all, sell) = ReportSeries.RuleGaps(result);
        var p = SignalledAgainstAll.Compute(rule, historical: false, RuleSignal.SellVolatility, result.HacLag).PValue;
        var calibration = BacktestCalibrator.Evaluate(result, history);
        var reliability = ReportOdds.Curves(result, calibration);

        var charts = new (string Name, Func<Plot> Build, Func<ChartImage> Whole)[]
        {
            ("forecast-vs-realized", () => ReportCharts.BuildForecastVsRealized(realized, impliedSeries, forecasts, colors), () => ReportCharts.ForecastVsRealized(realized, impliedSeries, forecasts, colors)),
            ("premium", () => ReportCharts.BuildPremium(ReportSeries.Premium(result)), () => ReportCharts.Premium(ReportSeries.Premium(result))),
            ("cumulative-qlike", () => ReportCharts.BuildCumulativeLossDifferential(differentials, colors), () => ReportCharts.CumulativeLossDifferential(differentials, colors)),
            ("loss-vs-lookback", () => ReportCharts.BuildLossVsLookback(curves, colors), () => ReportCharts.LossVsLookback(curves, colors)),
            ("mincer-zarnowitz", () => ReportCharts.BuildMincerZarnowitz(leader.Spec, forecast, realizedVariance, leader.MincerZarnowitz!.Intercept, leader.MincerZarnowitz.Slope, colors), () => ReportCharts.MincerZarnowitz(leader.Spec, forecast, realizedVariance, leader.MincerZarnowitz!.Intercept, leader.MincerZarnowitz.Slope, colors)),
            ("cone", () => ReportCharts.BuildCone(cone, ReportWriter.ConeOverlays(result, leading), colors), () => ReportCharts.Cone(cone, ReportWriter.ConeOverlays(result, leading), colors)),
            ("rule-test", () => ReportCharts.BuildRuleTest(all, sell, "sell", rule.ForecastSpec, p, colors), () => ReportCharts.RuleTest(all, sell, "sell", rule.ForecastSpec, p, colors)),
            ("reliability", () => ReportCharts.BuildReliability(reliability, "pooled", colors), () => ReportCharts.Reliability(reliability, "pooled", colors)),
            ("rule-pnl-cumulative (upper panel)", () => PnlCharts.BuildCumulative(close.Dates, close.Rules).Top, () => PnlCharts.Cumulative(close.Dates, close.Rules)),
            ("rule-pnl-marks", () => PnlCharts.BuildMarks(close.Dates, close.Rules), () => PnlCharts.Marks(close.Dates, close.Rules)),
            ("rule-pnl-trades", () => PnlCharts.BuildTrades(close.Rules), () => PnlCharts.Trades(close.Rules)),
            ("rule-pnl-by-year", () => PnlCharts.BuildYears(close.Rules), () => PnlCharts.Years(close.Rules)),
        };

        Console.WriteLine("| chart | build | draw | encode PNG (as ScottPlot does) | whole chart as the report makes it | PNG KB |");
        Console.WriteLine("| --- | ---: | ---: | ---: | ---: | ---: |");
        double sumWhole = 0;
        foreach (var (name, build, whole) in charts)
        {
            var b = new List<double>();
            var d = new List<double>();
            var e = new List<double>();
            var w = new List<double>();
            var size = 0;
            for (var round = 0; round <= rounds; round++)
            {
                var t0 = ThreadCpu();
                using var plot = build();
                var t1 = ThreadCpu();
                using var surface = SKSurface.Create(new SKImageInfo(ChartStyle.Width, ChartStyle.Height));
                plot.Render(surface.Canvas, new PixelRect(0, ChartStyle.Width, ChartStyle.Height, 0));
                var t2 = ThreadCpu();
                using var image = surface.Snapshot();
                using var data = image.Encode(SKEncodedImageFormat.Png, 85);
                var t3 = ThreadCpu();
                var bytes = whole().Png;
                var t4 = ThreadCpu();
                size = bytes.Length;
                if (round > 0)
                {
                    b.Add(t1 - t0);
                    d.Add(t2 - t1);
                    e.Add(t3 - t2);
                    w.Add(t4 - t3);
                }
            }

            if (Environment.GetEnvironmentVariable("VOLCAST_CHART_DIR") is { Length: > 0 } folder)
            {
                var image = whole();
                File.WriteAllBytes(Path.Combine(folder, image.FileName), image.Png.ToArray());
            }

            sumWhole += Median(w);
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"| {name} | {Ms(b)} | {Ms(d)} | {Ms(e)} | {Ms(w)} | {size / 1024} |"));
        }

        Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"| all twelve, whole | | | | {sumWhole * 1000:0.0} ms | |"));

        Encodings(charts[0].Build, rounds);
        Encodings(charts[10].Build, rounds);
        Console.WriteLine();
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"First calls in this process (JIT and first-tier code included): {cold}"));
        PnlStage(result, calibration, history, pnl, rounds);
    }

    private static void PnlStage(BacktestResult result, BacktestCalibration calibration, VolCast.Core.Data.PriceHistory history, RulePnlReport pnl, int rounds)
    {
        var (implied, proposed, current, historical) = RuleInputs(result, history);
        var settings = result.Settings;
        var trading = settings.Trading with { Threshold = settings.RuleThreshold, AnnualizationDays = settings.AnnualizationFactor };
        var parts = new (string Name, Action Work)[]
        {
            ("RuleBacktest.Run, entry at the firing close", () => RuleBacktest.Run(history, implied, settings.Horizon, proposed, current, historical, trading)),
            ("RuleBacktest.Run, entry one trading day later", () => RuleBacktest.Run(history, implied, settings.Horizon, proposed, current, historical, trading with { EntryTiming = EntryTiming.NextClose })),
            ("RulePnlEvaluator.Evaluate (both timings, snooping tests)", () => RulePnlEvaluator.Evaluate(result, history)),
            ("trades.csv", () => TradesCsv.Write(new StringWriter(CultureInfo.InvariantCulture), pnl)),
            ("rule-pnl.csv", () => RulePnlCsv.Write(new StringWriter(CultureInfo.InvariantCulture), pnl)),
            ("rule-pnl-next-day.csv", () => RulePnlCsv.WriteNextDay(new StringWriter(CultureInfo.InvariantCulture), pnl)),
            ("metrics.json with the P&L", () => MetricsJson.Write(new StringWriter(CultureInfo.InvariantCulture), result, calibration, pnl, null)),
            ("metrics.json without it", () => MetricsJson.Write(new StringWriter(CultureInfo.InvariantCulture), result, calibration, null, "none")),
            ("P&L section of the report (tables and four charts)", () => ReportPnl.Build(pnl, null, result.Settings.Horizon)),
        };

        Console.WriteLine();
        Console.WriteLine("| P&L stage part | CPU ms (median) | first call |");
        Console.WriteLine("| --- | ---: | ---: |");
        foreach (var (name, work) in parts)
        {
            var times = new List<double>();
            var first = 0.0;
            for (var round = 0; round <= rounds; round++)
            {
                var t0 = ThreadCpu();
                work();
                var t1 = ThreadCpu();
                if (round > 0)
                {
                    times.Add(t1 - t0);
                }
                else
                {
                    first = t1 - t0;
                }
            }

            Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"| {name} | {Ms(times)} | {first * 1000:0.0} |"));
        }
    }

    /// <summary>The rule's inputs as <see cref="RulePnlEvaluator"/> maps them onto the price history's dates (the default case: every spec is a forecaster the backtest ran, or the rule test's own series).</summary>
    private static (double?[] Implied, RuleForecast Proposed, RuleForecast Current, RuleForecast Historical) RuleInputs(BacktestResult result, VolCast.Core.Data.PriceHistory history)
    {
        var n = history.Count;
        var index = new Dictionary<DateOnly, int>(n);
        for (var i = 0; i < n; i++)
        {
            index[history.Dates[i]] = i;
        }

        double?[] Map(IReadOnlyList<DateOnly> dates, IReadOnlyList<double?> values)
        {
            var mapped = new double?[n];
            for (var i = 0; i < dates.Count; i++)
            {
                if (index.TryGetValue(dates[i], out var j))
                {
                    mapped[j] = values[i];
                }
            }

            return mapped;
        }

        var rule = result.RuleTest!;
        RuleForecast Series(string spec)
        {
            var series = result.Forecasts.FirstOrDefault(f => string.Equals(f.Spec, spec, StringComparison.OrdinalIgnoreCase));
            if (series is not null)
            {
                return new RuleForecast(series.Spec, Map(result.Dates, series.Values));
            }

            var values = string.Equals(spec, rule.ForecastSpec, StringComparison.OrdinalIgnoreCase) ? rule.Forecast : rule.Historical;
            return new RuleForecast(spec, Map(rule.Dates, values.Select(v => (double?)v).ToArray()));
        }

        var historical = Series(rule.HistoricalSpec);
        var current = result.Forecasts.Any(f => string.Equals(f.Spec, result.Baseline, StringComparison.OrdinalIgnoreCase) && f.Kind != ForecastKind.Implied) ? Series(result.Baseline) : historical;
        return (Map(result.Dates, result.Implied), Series(rule.ForecastSpec), current, historical);
    }

    /// <summary>
    /// Compares the PNGs of the same names in two folders pixel by pixel (colour channels only): how many pixels differ
    /// at all and by more than a quarter of the range in some channel. Run: <c>dotnet run -c Release -- charts-diff BEFORE AFTER</c>.
    /// </summary>
    public static void Diff(string[] args)
    {
        foreach (var path in Directory.GetFiles(args[0], "*.png").Order(StringComparer.Ordinal))
        {
            var name = Path.GetFileName(path);
            using var before = SKBitmap.Decode(path);
            using var after = SKBitmap.Decode(Path.Combine(args[1], name));
            int differ = 0, far = 0;
            for (var y = 0; y < before.Height; y++)
            {
                for (var x = 0; x < before.Width; x++)
                {
                    var a = before.GetPixel(x, y);
                    var b = after.GetPixel(x, y);
                    var d = Math.Max(Math.Abs(a.Red - b.Red), Math.Max(Math.Abs(a.Green - b.Green), Math.Abs(a.Blue - b.Blue)));
                    differ += d > 0 ? 1 : 0;
                    far += d > 64 ? 1 : 0;
                }
            }

            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"{name,-28} {new FileInfo(path).Length / 1024,4} KB -> {new FileInfo(Path.Combine(args[1], name)).Length / 1024,4} KB, pixels differing {differ,7} (by more than 64: {far})"));
        }
    }

    /// <summary>PNG encoding of one drawn chart at several zlib levels and filter sets, with and without the alpha channel.</summary>
    private static void Encodings(Func<Plot> build, int rounds)
    {
        using var plot = build();
        using var surface = SKSurface.Create(new SKImageInfo(ChartStyle.Width, ChartStyle.Height));
        plot.Render(surface.Canvas, new PixelRect(0, ChartStyle.Width, ChartStyle.Height, 0));
        using var image = surface.Snapshot();
        using var pixmap = image.PeekPixels();
        Console.WriteLine();
        Console.WriteLine("| PNG settings | pixels | CPU ms | KB |");
        Console.WriteLine("| --- | --- | ---: | ---: |");
        foreach (var opaque in new[] { false, true })
        {
            using var source = opaque ? new SKPixmap(pixmap.Info.WithAlphaType(SKAlphaType.Opaque), pixmap.GetPixels(), pixmap.RowBytes) : new SKPixmap(pixmap.Info, pixmap.GetPixels(), pixmap.RowBytes);
            foreach (var filters in new[] { SKPngEncoderFilterFlags.AllFilters, SKPngEncoderFilterFlags.Sub, SKPngEncoderFilterFlags.Up, SKPngEncoderFilterFlags.NoFilters })
            {
                foreach (var level in new[] { 6, 3, 1 })
                {
                    var times = new List<double>();
                    long size = 0;
                    for (var round = 0; round <= rounds; round++)
                    {
                        var t0 = ThreadCpu();
                        using var data = source.Encode(new SKPngEncoderOptions(filters, level))!;
                        var t1 = ThreadCpu();
                        size = data.Size;
                        if (round > 0)
                        {
                            times.Add(t1 - t0);
                        }
                    }

                    Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"| {filters}, zlib {level} | {(opaque ? "RGB" : "RGBA")} | {Ms(times)} | {size / 1024} |"));
                }
            }
        }
    }

    private static double Median(List<double> values)
    {
        values.Sort();
        return values[values.Count / 2];
    }

    private static string Ms(List<double> values) => string.Create(CultureInfo.InvariantCulture, $"{Median(values) * 1000:0.0}");

    [StructLayout(LayoutKind.Sequential)]
    private struct TimeSpec
    {
        public long Seconds;
        public long Nanoseconds;
    }

    [DllImport("libc", EntryPoint = "clock_gettime")]
    private static extern int ClockGetTime(int clock, out TimeSpec time);

    /// <summary>The calling thread's CPU time in seconds.</summary>
    private static double ThreadCpu()
    {
        const int ThreadCpuTimeClock = 3;
        if (ClockGetTime(ThreadCpuTimeClock, out var time) != 0)
        {
            throw new InvalidOperationException("clock_gettime(CLOCK_THREAD_CPUTIME_ID) failed.");
        }

        return time.Seconds + (time.Nanoseconds * 1e-9);
    }
}
