using System.Globalization;
using System.Text.Json;
using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Cone;
using VolCast.Core.Data;
using VolCast.Core.Demo;
using VolCast.IO.Csv;
using VolCast.IO.Results;

namespace VolCast.Reports.Tests;

/// <summary>
/// Every number a chart shows can be read back from a data file of the same run: the reliability diagram's pooled
/// curves from metrics.json, the cone's percentiles from cone.csv. Runs a small backtest on invented demo data.
/// </summary>
public sealed class ChartDataFileTests : IDisposable
{
    private static readonly DemoScenario Scenario = new DemoScenarioGenerator(5, years: 3).Generate();

    private static readonly BacktestResult Result = Backtester.Run(Scenario.Index, Scenario.Implied, new BacktestSettings
    {
        Forecasters = ["close-to-close:21", "ewma:0.94"],
        Sweep = false,
        McsReplications = 200,
        Baseline = "close-to-close:21",
        Candidate = "ewma:0.94",
    });

    private static readonly BacktestRunInfo Run = new(
        "0.1.0-test",
        [new InputFileInfo("prices", "prices.csv", new string('a', 64))],
        DateTimeOffset.UnixEpoch,
        DateTimeOffset.UnixEpoch,
        "decimal",
        []);

    private readonly string _folder = Path.Combine(Path.GetTempPath(), "volcast-chart-data-" + Guid.NewGuid().ToString("N"));

    public void Dispose()
    {
        if (Directory.Exists(_folder))
        {
            Directory.Delete(_folder, recursive: true);
        }
    }

    [Fact]
    public void ReliabilityDiagram_EveryPooledPoint_IsInMetricsJson()
    {
        var calibration = BacktestCalibrator.Evaluate(Result, Scenario.Index);
        Directory.CreateDirectory(_folder);
        BacktestResultsWriter.WriteData(_folder, new BacktestRun(Result, calibration, Run, Scenario.Index, Scenario.Index.Count));
        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(_folder, "metrics.json")));
        var forecasters = json.RootElement.GetProperty("calibration").GetProperty("forecasters").EnumerateArray()
            .ToDictionary(f => f.GetProperty("forecaster").GetString()!, f => f.GetProperty("pooled_reliability"));

        var curves = ReportOdds.Curves(Result, calibration);

        Assert.NotEmpty(curves);
        foreach (var curve in curves)
        {
            var bins = forecasters[curve.Name];
            Assert.Equal(curve.Counts.Count, bins.GetArrayLength());
            for (var k = 0; k < curve.Counts.Count; k++)
            {
                Assert.Equal(curve.Counts[k], bins[k].GetProperty("n").GetInt32());
                Assert.Equal(curve.Predicted[k], bins[k].GetProperty("mean_predicted").GetDouble());
                Assert.Equal(curve.Observed[k], bins[k].GetProperty("observed_frequency").GetDouble());
                Assert.Equal(curve.Lower[k], bins[k].GetProperty("interval_lower").GetDouble());
                Assert.Equal(curve.Upper[k], bins[k].GetProperty("interval_upper").GetDouble());
            }
        }
    }

    [Fact]
    public void ConeChart_ItsPercentiles_AreInConeCsv()
    {
        var calibration = BacktestCalibrator.Evaluate(Result, Scenario.Index);
        var written = ReportWriter.Write(_folder, new BacktestRun(Result, calibration, Run, Scenario.Index, Scenario.Index.Count));

        Assert.Contains(ReportWriter.ConeFileName, written);
        Assert.Contains("cone.png", written);
        var cone = VolatilityCone.Compute(Returns.LogReturns(Scenario.Index.Close), VolatilityCone.DefaultHorizons, Result.Settings.AnnualizationFactor);
        var lines = File.ReadAllLines(Path.Combine(_folder, ReportWriter.ConeFileName));
        Assert.Equal(ConeCsv.Header, lines[0]);
        Assert.Equal(cone.Horizons.Count + 1, lines.Length);
        for (var i = 0; i < cone.Horizons.Count; i++)
        {
            var cells = lines[i + 1].Split(',').Select(c => double.Parse(c, CultureInfo.InvariantCulture)).ToArray();
            var row = cone.Horizons[i];
            Assert.Equal(row.HorizonDays, cells[0]);
            Assert.Equal(row.Raw.Median, cells[6]);
            Assert.Equal(row.Adjusted.Median, cells[13]);
            Assert.Equal(row.Latest, cells[17]);
        }
    }
}
