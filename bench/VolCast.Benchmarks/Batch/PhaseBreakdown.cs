using System.Diagnostics;
using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Trading;
using VolCast.IO;
using VolCast.IO.Results;
using VolCast.Reports;

namespace VolCast.Benchmarks.Batch;

/// <summary>
/// The CPU-seconds of one name's run, phase by phase, in the order the batch runs them (load, forecasters, scores and
/// tests, calibration, rule P&amp;L, data files, metrics.json, charts and page). Process CPU time is read between phases;
/// GARCH refits and the model confidence set are split off by running the backtest again without them.
/// Run: <c>dotnet run -c Release -- phases PRICES.csv IMPLIED.csv [ROUNDS]</c>.
/// </summary>
internal static class PhaseBreakdown
{
    public static void Run(string[] args)
    {
        var pricesPath = args[0];
        var impliedPath = args[1];
        var rounds = args.Length > 2 ? int.Parse(args[2], CultureInfo.InvariantCulture) : 3;
        var settings = new BacktestSettings();
        var totals = new SortedDictionary<string, List<double>>(StringComparer.Ordinal);
        for (var round = 0; round <= rounds; round++)
        {
            // Round 0 warms the JIT and is not counted.
            var phases = Once(pricesPath, impliedPath, settings);
            if (round == 0)
            {
                continue;
            }

            foreach (var (name, seconds) in phases)
            {
                if (!totals.TryGetValue(name, out var list))
                {
                    totals[name] = list = [];
                }

                list.Add(seconds);
            }
        }

        Console.WriteLine("| phase | CPU s (median of " + rounds + ") |");
        Console.WriteLine("| --- | ---: |");
        foreach (var (name, list) in totals)
        {
            list.Sort();
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"| {name} | {list[list.Count / 2]:0.000} |"));
        }

        Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"peak working set {Process.GetCurrentProcess().PeakWorkingSet64 / 1048576} MB"));
    }

    private static List<(string Name, double Seconds)> Once(string pricesPath, string impliedPath, BacktestSettings settings)
    {
        var phases = new List<(string, double)>();
        var cpu = Cpu();
        void Mark(string name)
        {
            var now = Cpu();
            phases.Add((name, now - cpu));
            cpu = now;
        }

        var pricesBytes = InputBytes.Read(pricesPath);
        var impliedBytes = InputBytes.Read(impliedPath);
        var prices = PriceFileReader.Read(pricesBytes);
        var implied = ImpliedFileReader.Read(impliedBytes, ImpliedUnit.Decimal);
        var checkedInputs = SuspectRows.Apply(prices, implied, impliedPath, SuspectAction.Warn);
        Mark("01 load (read, hash, parse, checks)");

        var sessionsDone = 0.0;
        var result = Backtester.Run(checkedInputs.Prices.History, checkedInputs.Implied!.Series, settings, progress: new Probe(() => sessionsDone = Cpu()));
        var afterBacktest = Cpu();
        phases.Add(("02 forecasters (all sessions, GARCH refits included)", sessionsDone - cpu));
        phases.Add(("04 scores, tests, MCS, sweep, rule test", afterBacktest - sessionsDone));
        cpu = afterBacktest;

        var groups = GroupedScores.Compute(result, checkedInputs.Prices.History);
        Mark("04b grouped scores (by year and regime, as the CLI computes them)");
        var calibration = BacktestCalibrator.Evaluate(result, checkedInputs.Prices.History);
        Mark("05 calibration");
        var (rulePnl, absence) = RulePnlEvaluator.Evaluate(result, checkedInputs.Prices.History);
        Mark("06 rule P&L");

        var info = new BacktestRunInfo("bench", [new InputFileInfo("prices", pricesPath, pricesBytes.Sha256)], DateTimeOffset.UtcNow, DateTimeOffset.UtcNow, "decimal", []);
        var run = new BacktestRun(result, calibration, info, checkedInputs.Prices.History, prices.RowsRead) { RulePnl = rulePnl, RulePnlAbsence = absence, Groups = groups };
        using (var json = new StringWriter(CultureInfo.InvariantCulture))
        {
            MetricsJson.Write(json, result, calibration, rulePnl, absence);
        }

        Mark("07 metrics.json");
        var folder = Directory.CreateTempSubdirectory("volcast-phases").FullName;
        try
        {
            BacktestResultsWriter.WriteData(folder, run);
            Mark("08 data files (CSV, summary.txt, metrics.json again)");
            ReportWriter.Build(run);
            Mark("09 charts (report model with every PNG)");
            var page = Path.Combine(folder, "page");
            ReportWriter.Write(page, run);
            Mark("10 charts and page again, written (report.html)");
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }

        // The GARCH refits and the model confidence set, by difference: the same backtest without GARCH-family forecasters, and with 10 replications.
        var noGarch = settings with { Forecasters = [.. BacktestSettings.DefaultForecasters.Where(f => !f.Contains("garch", StringComparison.Ordinal))] };
        var before = Cpu();
        Backtester.Run(checkedInputs.Prices.History, checkedInputs.Implied!.Series, noGarch);
        var withoutGarch = Cpu() - before;
        before = Cpu();
        Backtester.Run(checkedInputs.Prices.History, checkedInputs.Implied!.Series, settings with { McsReplications = 10 });
        var withoutMcs = Cpu() - before;
        before = Cpu();
        Backtester.Run(checkedInputs.Prices.History, checkedInputs.Implied!.Series, settings, sessionsInParallel: 1);
        phases.Add(("02b the whole backtest with the sessions one after another (as a batch runs it)", Cpu() - before));
        var backtest = phases[1].Item2 + phases[2].Item2;
        phases.Add(("03 of which GARCH-family refits (backtest minus backtest without them)", backtest - withoutGarch));
        phases.Add(("04 of which MCS (backtest minus backtest with 10 replications)", backtest - withoutMcs));
        return phases;
    }

    private static double Cpu() => Process.GetCurrentProcess().TotalProcessorTime.TotalSeconds;

    private sealed class Probe(Action sessionsDone) : IProgress<BacktestProgress>
    {
        public void Report(BacktestProgress value)
        {
            if (value.Stage == "scoring" && value.Done == 0)
            {
                sessionsDone();
            }
        }
    }
}
