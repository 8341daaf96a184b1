using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.Core.Calibration;
using VolCast.Core.Data;
using VolCast.Reports.Charts;
using VolCast.Reports.Model;

namespace VolCast.Reports;

/// <summary>
/// Builds the "Do the odds hold?" section from a <see cref="BacktestCalibration"/>: the reliability curves pooled over
/// strikes, the coverage table and the verdicts.
/// </summary>
/// <remarks>
/// The reliability diagram draws each forecaster's curve pooled over strikes, computed in Core
/// (<see cref="ReliabilityPooling"/>) and written to metrics.json, so every point of the chart is in a data file.
/// </remarks>
internal static class ReportOdds
{
    public static OddsSection Build(BacktestResult result, BacktestCalibration calibration)
    {
        var shown = Shown(result, calibration);
        var curves = Curves(result, calibration);

        var c = CultureInfo.InvariantCulture;
        var moneyness = calibration.Forecasters.SelectMany(f => f.Calibration.Strikes.IsDefault ? [] : f.Calibration.Strikes).Select(s => s.Moneyness).Distinct().Order().ToArray();
        var pooling = moneyness.Length == 0
            ? "no strikes"
            : moneyness.Length == 1
                ? string.Create(c, $"strike {moneyness[0]:0.00} × close")
                : string.Create(c, $"pooled over strikes {moneyness[0]:0.00}–{moneyness[^1]:0.00} × close");
        var chart = curves.Count == 0 ? null : ReportCharts.Reliability(curves, pooling, SeriesColors.For(result));

        var rows = new List<MetricRow>();
        var needed = 0;
        foreach (var odds in calibration.Forecasters)
        {
            var cov = odds.Coverage;
            var one = cov.Levels[0];
            var two = cov.Levels[1];
            needed = Math.Max(needed, one.SamplesNeeded);
            rows.Add(new MetricRow(cov.Spec,
            [
                new MetricCell(one.NonOverlappingCount, "0"),
                new MetricCell(one.ShareWithin, "0.0%"),
                new MetricCell(one.Kupiec?.PValue, MetricCell.PValue),
                new MetricCell(one.ConditionalCoverage?.PValue, MetricCell.PValue),
                new MetricCell(two.ShareWithin, "0.0%"),
                new MetricCell(two.Kupiec?.PValue, MetricCell.PValue),
                new MetricCell(two.ConditionalCoverage?.PValue, MetricCell.PValue),
                new MetricCell(cov.MaxAbsZ, "0.00"),
                new MetricCell(cov.ShareAboveThree, "0.00%"),
                new MetricCell(cov.MissingCount, "0"),
            ]));
        }

        var horizon = calibration.Forecasters.Length > 0 ? calibration.Forecasters[0].Coverage.HorizonDays : result.Settings.Horizon.NominalDays;
        var table = new MetricTable(
            "Coverage of the forecast move bands (±1σ, ±2σ)",
            [
                new MetricColumn("Non-overlapping dates", "count, for the tests"),
                new MetricColumn("|z| ≤ 1", "share; 68.3% if calibrated"),
                new MetricColumn("Kupiec p", "|z| ≤ 1"),
                new MetricColumn("Christoffersen CC p", "|z| ≤ 1"),
                new MetricColumn("|z| ≤ 2", "share; 95.4% if calibrated"),
                new MetricColumn("Kupiec p", "|z| ≤ 2"),
                new MetricColumn("Christoffersen CC p", "|z| ≤ 2"),
                new MetricColumn("Largest |z|", "standard deviations"),
                new MetricColumn("|z| > 3", "share; 0.27% if normal"),
                new MetricColumn("Dates missing", "count, not scored"),
            ],
            rows,
            string.Create(c,
                $"z = ln(S(t+h)/S(t)) / (σ √(h/A)), the move over the horizon in units of the forecaster's own range. Shares use every date; the Kupiec (proportion of failures) and Christoffersen (conditional coverage: right share and no clustering) tests use only non-overlapping dates (each one longest window, {horizon} trading days, after the last), so that the windows do not overlap; low p-values reject calibrated ranges. A dash means fewer than {needed} non-overlapping dates had a value, too few for the tests. A forecaster missing on some dates keeps its row; the count is in the last column."));

        var verdicts = shown.Select(i => Capitalize(calibration.Forecasters[i].Verdict) + ".").ToList();
        var notes = new List<string>
        {
            string.Create(c, $"Probabilities are N(d2), the lognormal chance that the close at the end of each date's own window ({ReportWriter.HorizonStatement(result)}) ends above each strike (0.90 to 1.10 times the close), from the forecaster's volatility with no rate or dividend (r = q = 0): a risk-neutral-style probability with drift −σ²/2 in the log price, not a forecast of the drift."),
            "The reliability diagram pools the strikes (at the money alone, every probability is near 50% and the diagram would show one point); each forecaster's Brier score, its decomposition and the log score per strike are in calibration.csv and metrics.json.",
            "Verdicts are shown for implied, the leading forecasters, the baseline and the candidate; every forecaster's verdict is in coverage.csv. The low, middle and high thirds in the verdicts sort each date by the realized volatility of its own window, known only in hindsight; they are not the volatility levels known at the forecast date of the table by level.",
        };
        return new OddsSection(chart, table, verdicts, notes);
    }

    /// <summary>Indices into the calibration's forecasters to show: implied, the leading three, the baseline and the candidate, without repeats.</summary>
    internal static IReadOnlyList<int> Shown(BacktestResult result, BacktestCalibration calibration)
    {
        var names = new List<string>();
        if (result.HasImplied)
        {
            names.Add(ImpliedSeries.Name);
        }

        names.AddRange(ReportSeries.Leading(result));
        names.Add(result.Baseline);
        names.Add(result.Candidate);
        var indices = new List<int>();
        foreach (var name in names)
        {
            for (var i = 0; i < calibration.Forecasters.Length; i++)
            {
                if (calibration.Forecasters[i].Spec == name && !indices.Contains(i))
                {
                    indices.Add(i);
                }
            }
        }

        return indices;
    }

    /// <summary>The forecasters drawn on the reliability diagram: implied and the two leading forecasters, or the three leading without implied.</summary>
    internal static IReadOnlyList<ReliabilityCurve> Curves(BacktestResult result, BacktestCalibration calibration)
    {
        var names = new List<string>();
        if (result.HasImplied)
        {
            names.Add(ImpliedSeries.Name);
        }

        names.AddRange(ReportSeries.Leading(result).Take(3 - names.Count));
        var curves = new List<ReliabilityCurve>();
        foreach (var name in names)
        {
            var forecaster = calibration.Forecasters.FirstOrDefault(f => f.Spec == name);
            if (forecaster is not null && Pooled(forecaster) is { } curve)
            {
                curves.Add(curve);
            }
        }

        return curves;
    }

    /// <summary>The forecaster's reliability curve pooled over strikes, as computed in Core; null when it has no forecast.</summary>
    internal static ReliabilityCurve? Pooled(ForecasterOdds forecaster)
    {
        var bins = forecaster.PooledReliability;
        if (bins.IsDefaultOrEmpty)
        {
            return null;
        }

        return new ReliabilityCurve(
            forecaster.Spec,
            [.. bins.Select(b => b.MeanPredicted)],
            [.. bins.Select(b => b.ObservedFrequency)],
            [.. bins.Select(b => b.IntervalLower)],
            [.. bins.Select(b => b.IntervalUpper)],
            [.. bins.Select(b => b.Count)]);
    }

    private static string Capitalize(string text) => text.Length == 0 ? text : char.ToUpperInvariant(text[0]) + text[1..];
}
