using System.Globalization;
using System.Text.Json;
using VolCast.Core.Calibration;

namespace VolCast.IO.Results;

/// <summary>Writes the <c>calibration</c> and <c>coverage</c> sections of metrics.json: the numbers of calibration.csv and coverage.csv.</summary>
/// <remarks>
/// A forecaster with missing dates keeps its row: <c>dates_missing</c> counts them and <c>missing_dates</c> lists
/// them, and a forecaster with no value at all has null scores and an empty strike list. Doubles are round-trip,
/// null (never NaN) where undefined.
/// </remarks>
internal static class CalibrationJson
{
    public static void Write(Utf8JsonWriter json, BacktestCalibration calibration)
    {
        CalibrationSection(json, calibration);
        CoverageSection(json, calibration);
    }

    private static void CalibrationSection(Utf8JsonWriter json, BacktestCalibration calibration)
    {
        json.WriteStartObject("calibration");
        json.WriteString("probability", "N(d2): the lognormal probability that the close at t + h ends above K = moneyness x close at t, with the forecaster's volatility, the configured r and q (0 by default) and time h / A years; a risk-neutral-style probability, with drift r - q - sigma^2/2 in the log price.");
        json.WriteString("bins", "Equal-width predicted-probability bins on [0, 1]; the interval is Wilson's on n_eff = n / h, widened for the overlap of h-day windows.");
        json.WriteString("pooled_reliability", "The reliability diagram's curve: per bin, every strike's forecasts pooled; n-weighted means of the strikes' mean predicted and observed frequency, Wilson's interval on the summed n_eff; empty bins left out.");
        json.WriteString("brier_identity", "brier = reliability - resolution + uncertainty + within_bin_variance - within_bin_covariance (Murphy 1973, with the two within-bin terms).");
        json.WriteStartArray("forecasters");
        foreach (var odds in calibration.Forecasters)
        {
            var c = odds.Calibration;
            json.WriteStartObject();
            json.WriteString("forecaster", c.Spec);
            json.WriteNumber("horizon_days", c.HorizonDays);
            json.WriteNumber("dates_scored", c.Count);
            json.WriteNumber("dates_missing", c.MissingCount);
            json.WriteNumber("invalid_values", odds.InvalidValueCount);
            MissingDates(json, calibration.Aligned, c.MissingDateIndices);
            json.WriteStartArray("strikes");
            foreach (var s in c.Strikes.IsDefault ? [] : c.Strikes)
            {
                Strike(json, s);
            }

            json.WriteEndArray();
            PooledReliability(json, odds);
            json.WriteEndObject();
        }

        json.WriteEndArray();
        json.WriteEndObject();
    }

    private static void Strike(Utf8JsonWriter json, StrikeCalibration s)
    {
        var d = s.Decomposition;
        json.WriteStartObject();
        json.WriteNumber("moneyness", s.Moneyness);
        Numbers.Write(json, "brier", d.Brier);
        Numbers.Write(json, "reliability", d.Reliability);
        Numbers.Write(json, "resolution", d.Resolution);
        Numbers.Write(json, "uncertainty", d.Uncertainty);
        Numbers.Write(json, "within_bin_variance", d.WithinBinVariance);
        Numbers.Write(json, "within_bin_covariance", d.WithinBinCovariance);
        Numbers.Write(json, "log_score", s.LogScore);
        json.WriteNumber("log_score_clipped", s.ClippedCount);
        Numbers.Write(json, "mean_predicted", s.MeanPredicted);
        Numbers.Write(json, "observed_frequency", s.ObservedFrequency);
        json.WriteStartArray("bins");
        foreach (var b in s.Bins)
        {
            json.WriteStartObject();
            json.WriteNumber("bin", b.Index);
            json.WriteNumber("lower", b.Lower);
            json.WriteNumber("upper", b.Upper);
            json.WriteNumber("n", b.Count);
            Numbers.Write(json, "n_eff", b.EffectiveCount);
            Numbers.Write(json, "mean_predicted", b.MeanPredicted);
            Numbers.Write(json, "observed_frequency", b.ObservedFrequency);
            Numbers.Write(json, "interval_lower", b.IntervalLower);
            Numbers.Write(json, "interval_upper", b.IntervalUpper);
            json.WriteEndObject();
        }

        json.WriteEndArray();
        json.WriteEndObject();
    }

    private static void CoverageSection(Utf8JsonWriter json, BacktestCalibration calibration)
    {
        json.WriteStartObject("coverage");
        json.WriteString("z", "z = ln(S(t+h)/S(t)) / (sigma_F sqrt(h/A)); standard normal if the forecaster is calibrated.");
        json.WriteString("tests", "Shares use every date; the Kupiec and Christoffersen tests use non-overlapping dates only (every h-th date, a failure being |z| > bound); with fewer than dates_needed of them the status is not-enough-data and the tests are null.");
        json.WriteStartArray("forecasters");
        foreach (var odds in calibration.Forecasters)
        {
            var c = odds.Coverage;
            json.WriteStartObject();
            json.WriteString("forecaster", c.Spec);
            json.WriteNumber("horizon_days", c.HorizonDays);
            json.WriteNumber("dates_scored", c.Count);
            json.WriteNumber("dates_missing", c.MissingCount);
            MissingDates(json, calibration.Aligned, c.MissingDateIndices);
            Numbers.Write(json, "z_scale", c.ZScale);
            Numbers.Write(json, "max_abs_z", c.MaxAbsZ);
            Numbers.Write(json, "share_abs_z_above_3", c.ShareAboveThree);
            json.WriteNumber("expected_share_abs_z_above_3", 1 - MoveBandCoverage.NominalCoverage(3.0));
            foreach (var l in c.Levels)
            {
                Level(json, l);
            }

            Regimes(json, odds);
            json.WriteString("verdict", odds.Verdict);
            json.WriteEndObject();
        }

        json.WriteEndArray();
        json.WriteEndObject();
    }

    private static void Level(Utf8JsonWriter json, CoverageLevelResult l)
    {
        json.WriteStartObject(string.Create(CultureInfo.InvariantCulture, $"within{l.Bound:0}"));
        Numbers.Write(json, "share", l.ShareWithin);
        json.WriteNumber("expected", l.NominalCoverage);
        json.WriteString("status", l.Status == CoverageTestStatus.Computed ? "computed" : "not-enough-data");
        json.WriteNumber("nonoverlapping_dates", l.NonOverlappingCount);
        json.WriteNumber("dates_needed", l.SamplesNeeded);
        json.WriteNumber("failures", l.Failures);
        Test(json, "kupiec", l.Kupiec);
        Test(json, "christoffersen_independence", l.Independence);
        Test(json, "christoffersen_conditional_coverage", l.ConditionalCoverage);
        json.WriteEndObject();
    }

    private static void Regimes(Utf8JsonWriter json, ForecasterOdds odds)
    {
        json.WriteStartArray("regimes");
        foreach (var g in odds.Regimes.IsDefault ? [] : odds.Regimes)
        {
            json.WriteStartObject();
            json.WriteString("regime", g.Label);
            json.WriteNumber("realized_vol_from", g.Lower);
            json.WriteNumber("realized_vol_to", g.Upper);
            json.WriteNumber("n", g.Count);
            json.WriteNumber("share_within1", g.ShareWithinOne);
            json.WriteNumber("interval_lower", g.IntervalLower);
            json.WriteNumber("interval_upper", g.IntervalUpper);
            json.WriteNumber("z_scale", g.ZScale);
            json.WriteEndObject();
        }

        json.WriteEndArray();
    }

    /// <summary>The reliability curve pooled over strikes, the one the report's reliability diagram draws (see <see cref="ReliabilityPooling"/>).</summary>
    private static void PooledReliability(Utf8JsonWriter json, ForecasterOdds odds)
    {
        json.WriteStartArray("pooled_reliability");
        foreach (var b in odds.PooledReliability.IsDefault ? [] : odds.PooledReliability)
        {
            json.WriteStartObject();
            json.WriteNumber("bin", b.Index);
            json.WriteNumber("n", b.Count);
            Numbers.Write(json, "n_eff", b.EffectiveCount);
            Numbers.Write(json, "mean_predicted", b.MeanPredicted);
            Numbers.Write(json, "observed_frequency", b.ObservedFrequency);
            Numbers.Write(json, "interval_lower", b.IntervalLower);
            Numbers.Write(json, "interval_upper", b.IntervalUpper);
            json.WriteEndObject();
        }

        json.WriteEndArray();
    }

    private static void MissingDates(Utf8JsonWriter json, AlignedOutcomes aligned, System.Collections.Immutable.ImmutableArray<int> indices)
    {
        json.WriteStartArray("missing_dates");
        foreach (var k in indices.IsDefault ? [] : indices)
        {
            json.WriteStringValue(aligned.Dates[k].ToString("yyyy-MM-dd", CultureInfo.InvariantCulture));
        }

        json.WriteEndArray();
    }

    private static void Test(Utf8JsonWriter json, string name, LikelihoodRatioTest? test)
    {
        if (test is null)
        {
            json.WriteNull(name);
            return;
        }

        json.WriteStartObject(name);
        Numbers.Write(json, "lr", test.Statistic);
        json.WriteNumber("df", test.DegreesOfFreedom);
        Numbers.Write(json, "p_value", test.PValue);
        json.WriteEndObject();
    }
}
