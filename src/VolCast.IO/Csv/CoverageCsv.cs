using System.Globalization;
using VolCast.Core.Calibration;

namespace VolCast.IO.Csv;

/// <summary>Writes <c>coverage.csv</c>: one row per forecaster with the checks of the forecast move bands (±1σ, ±2σ).</summary>
/// <remarks>
/// Columns: <c>forecaster, horizon_days, dates_scored, dates_missing, z_scale, max_abs_z, share_abs_z_above_3</c>,
/// then for the ranges |z| ≤ 1 (prefix <c>within1_</c>) and |z| ≤ 2 (prefix <c>within2_</c>): <c>share, expected,
/// status, nonoverlapping_dates, dates_needed, failures, kupiec_lr, kupiec_p, independence_lr, independence_p,
/// conditional_lr, conditional_p</c>, and last <c>verdict</c> (a plain-words sentence, quoted). <c>status</c> is
/// <c>computed</c> or <c>not-enough-data</c>; in the latter case the test columns are empty and
/// <c>dates_needed</c> says how many non-overlapping dates the tests need. The shares use every date; the tests use
/// every h-th date (see <see cref="CoverageLevelResult"/>). Numbers are invariant culture, shortest round-trip
/// form; empty fields mean "does not exist"; LF line ends.
/// </remarks>
internal static class CoverageCsv
{
    private static readonly string[] LevelColumns =
        ["share", "expected", "status", "nonoverlapping_dates", "dates_needed", "failures", "kupiec_lr", "kupiec_p", "independence_lr", "independence_p", "conditional_lr", "conditional_p"];

    /// <summary>The header row, without the line end.</summary>
    public static string Header { get; } = "forecaster,horizon_days,dates_scored,dates_missing,z_scale,max_abs_z,share_abs_z_above_3,"
        + string.Join(',', LevelColumns.Select(c => "within1_" + c)) + ","
        + string.Join(',', LevelColumns.Select(c => "within2_" + c)) + ",verdict";

    /// <summary>Writes the table to a writer the caller owns, each forecaster with the verdict of its record (which names the regimes where the ranges failed).</summary>
    /// <param name="writer">Where the text goes.</param>
    /// <param name="forecasters">One record per forecaster.</param>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">A result does not hold the |z| ≤ 1 and |z| ≤ 2 levels.</exception>
    public static void Write(TextWriter writer, IReadOnlyList<ForecasterOdds> forecasters)
    {
        ArgumentNullException.ThrowIfNull(forecasters);
        Write(writer, forecasters.Select(f => (f.Coverage, f.Verdict)));
    }

    /// <summary>Writes the table to a writer the caller owns, with the verdicts of <see cref="CoverageVerdict.Describe"/> without regimes.</summary>
    /// <param name="writer">Where the text goes.</param>
    /// <param name="coverages">One result per forecaster.</param>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">A result does not hold the |z| ≤ 1 and |z| ≤ 2 levels.</exception>
    public static void Write(TextWriter writer, IReadOnlyList<CoverageResult> coverages)
    {
        ArgumentNullException.ThrowIfNull(coverages);
        Write(writer, coverages.Select(c => (c, c is null ? string.Empty : CoverageVerdict.Describe(c))));
    }

    /// <summary>Writes the table to a file atomically (temporary file, then move).</summary>
    /// <param name="path">The file to create.</param>
    /// <param name="forecasters">One record per forecaster.</param>
    /// <param name="overwrite">Whether an existing file may be replaced.</param>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="IOException">The file exists and <paramref name="overwrite"/> is false.</exception>
    public static void WriteFile(string path, IReadOnlyList<ForecasterOdds> forecasters, bool overwrite = false)
    {
        ArgumentNullException.ThrowIfNull(forecasters);
        AtomicFile.WriteText(path, w => Write(w, forecasters), overwrite);
    }

    private static void Write(TextWriter writer, IEnumerable<(CoverageResult Coverage, string Verdict)> rows)
    {
        ArgumentNullException.ThrowIfNull(writer);
        writer.Write(Header);
        writer.Write('\n');
        foreach (var (c, verdict) in rows)
        {
            ArgumentNullException.ThrowIfNull(c);
            if (c.Levels.Length != 2)
            {
                throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                    $"{c.Spec}: a coverage result must hold the |z| <= 1 and |z| <= 2 levels, had {c.Levels.Length}."), nameof(rows));
            }

            writer.Write(string.Create(CultureInfo.InvariantCulture,
                $"{CsvText.Text(c.Spec)},{c.HorizonDays},{c.Count},{c.MissingCount},{CsvText.Number(c.ZScale)},{CsvText.Number(c.MaxAbsZ)},{CsvText.Number(c.ShareAboveThree)}"));
            foreach (var l in c.Levels)
            {
                var status = l.Status == CoverageTestStatus.Computed ? "computed" : "not-enough-data";
                writer.Write(string.Create(CultureInfo.InvariantCulture,
                    $",{CsvText.Number(l.ShareWithin)},{l.NominalCoverage:R},{status},{l.NonOverlappingCount},{l.SamplesNeeded},{l.Failures},{CsvText.Number(l.Kupiec?.Statistic)},{CsvText.Number(l.Kupiec?.PValue)},{CsvText.Number(l.Independence?.Statistic)},{CsvText.Number(l.Independence?.PValue)},{CsvText.Number(l.ConditionalCoverage?.Statistic)},{CsvText.Number(l.ConditionalCoverage?.PValue)}"));
            }

            writer.Write(',');
            writer.Write(CsvText.Text(verdict, alwaysQuote: true));
            writer.Write('\n');
        }
    }
}
