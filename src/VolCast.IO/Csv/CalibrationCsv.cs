using System.Globalization;
using VolCast.Core.Calibration;

namespace VolCast.IO.Csv;

/// <summary>Writes <c>calibration.csv</c>: one row per forecaster, moneyness and probability bin.</summary>
/// <remarks>
/// Columns: <c>forecaster, horizon_days, moneyness, dates_scored, dates_missing, brier, reliability, resolution,
/// uncertainty, within_bin_variance, within_bin_covariance, log_score, log_score_clipped, mean_predicted,
/// observed_frequency, bin, bin_lower, bin_upper, bin_count, bin_effective_count, bin_mean_predicted,
/// bin_observed_frequency, bin_interval_lower, bin_interval_upper</c>. The strike-level scores repeat on each of
/// the strike's bin rows. Probabilities are N(d2) of finishing above K = moneyness × close (see
/// <see cref="ProbabilityCalibration"/>); the bin interval is Wilson's on n_eff = n / h. A forecaster with no value
/// on any date gets one row with its counts and empty scores, so it is never dropped silently. Empty fields mean
/// "does not exist" (an empty bin); numbers are invariant culture, shortest round-trip form; LF line ends.
/// </remarks>
internal static class CalibrationCsv
{
    /// <summary>The header row, without the line end.</summary>
    public const string Header = "forecaster,horizon_days,moneyness,dates_scored,dates_missing,brier,reliability,resolution,uncertainty,within_bin_variance,within_bin_covariance,log_score,log_score_clipped,mean_predicted,observed_frequency,bin,bin_lower,bin_upper,bin_count,bin_effective_count,bin_mean_predicted,bin_observed_frequency,bin_interval_lower,bin_interval_upper";

    /// <summary>Writes the table to a writer the caller owns.</summary>
    /// <param name="writer">Where the text goes.</param>
    /// <param name="calibrations">One result per forecaster.</param>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    public static void Write(TextWriter writer, IReadOnlyList<ForecasterCalibration> calibrations)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(calibrations);
        writer.Write(Header);
        writer.Write('\n');
        foreach (var c in calibrations)
        {
            ArgumentNullException.ThrowIfNull(c);
            var name = CsvText.Text(c.Spec);
            if (c.Strikes.IsDefaultOrEmpty)
            {
                writer.Write(string.Create(CultureInfo.InvariantCulture, $"{name},{c.HorizonDays},,{c.Count},{c.MissingCount},,,,,,,,,,,,,,,,,,,\n"));
                continue;
            }

            foreach (var s in c.Strikes)
            {
                var d = s.Decomposition;
                var strike = string.Create(CultureInfo.InvariantCulture,
                    $"{name},{c.HorizonDays},{s.Moneyness:R},{c.Count},{c.MissingCount},{d.Brier:R},{d.Reliability:R},{d.Resolution:R},{d.Uncertainty:R},{d.WithinBinVariance:R},{d.WithinBinCovariance:R},{s.LogScore:R},{s.ClippedCount},{s.MeanPredicted:R},{s.ObservedFrequency:R}");
                foreach (var b in s.Bins)
                {
                    writer.Write(strike);
                    writer.Write(string.Create(CultureInfo.InvariantCulture,
                        $",{b.Index},{b.Lower:R},{b.Upper:R},{b.Count},{b.EffectiveCount:R},{CsvText.Number(b.MeanPredicted)},{CsvText.Number(b.ObservedFrequency)},{CsvText.Number(b.IntervalLower)},{CsvText.Number(b.IntervalUpper)}\n"));
                }
            }
        }
    }

    /// <summary>Writes the table to a file atomically (temporary file, then move).</summary>
    /// <param name="path">The file to create.</param>
    /// <param name="calibrations">One result per forecaster.</param>
    /// <param name="overwrite">Whether an existing file may be replaced.</param>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="IOException">The file exists and <paramref name="overwrite"/> is false.</exception>
    public static void WriteFile(string path, IReadOnlyList<ForecasterCalibration> calibrations, bool overwrite = false)
    {
        ArgumentNullException.ThrowIfNull(calibrations);
        AtomicFile.WriteText(path, w => Write(w, calibrations), overwrite);
    }
}
