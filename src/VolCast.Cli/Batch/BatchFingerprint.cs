using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using VolCast.Core.Backtest;
using VolCast.Core.Estimators;
using VolCast.IO;

namespace VolCast.Cli.Batch;

/// <summary>
/// The SHA-256 of a resolved configuration: every setting, the implied unit and the tool version, written in one
/// canonical text. Two runs with the same fingerprint and the same input bytes produce the same results.
/// </summary>
internal static class BatchFingerprint
{
    /// <summary>The fingerprint of a resolved configuration: the SHA-256 of <see cref="Text"/>.</summary>
    public static string Of(BacktestSettings s, ImpliedUnit unit, string toolVersion, CsvFormat? format = null, int? impliedTenorDays = null, DataChecks? checks = null, bool workbook = false) =>
        Hash(Text(s, unit, toolVersion, format, impliedTenorDays, checks, workbook));

    /// <summary>The SHA-256 of a canonical text, lowercase hex.</summary>
    public static string Hash(string text) => Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(text)));

    /// <summary>
    /// The canonical text the fingerprint hashes: one <c>key=value</c> line per setting, each ending in a line feed. The
    /// shards' plan keeps it, so a reduce can name the settings that differ instead of only saying that they do.
    /// </summary>
    public static string Text(BacktestSettings s, ImpliedUnit unit, string toolVersion, CsvFormat? format = null, int? impliedTenorDays = null, DataChecks? checks = null, bool workbook = false)
    {
        var text = new StringBuilder();
        void Line(string name, object? value) => text.Append(name).Append('=').Append(Convert.ToString(value, CultureInfo.InvariantCulture) ?? "null").Append('\n');
        Line("tool", toolVersion);
        Line("ivUnit", unit);
        Line("horizon", s.Horizon.TradingDays is int h ? "days:" + h.ToString(CultureInfo.InvariantCulture) : "tenor:" + s.Horizon);
        Line("start", s.Start?.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture));
        Line("end", s.End?.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture));
        Line("forecasters", string.Join(';', s.Forecasters));
        Line("sweep", s.Sweep);
        Line("sweepEstimators", string.Join(';', s.SweepEstimators.Select(EstimatorNames.Name)));
        Line("sweepLookbacks", string.Join(';', s.SweepLookbacks.Select(x => x.ToString(CultureInfo.InvariantCulture))));
        Line("ewmaLambdas", string.Join(';', s.EwmaLambdas.Select(x => x.ToString("R", CultureInfo.InvariantCulture))));
        Line("selectionWindowDays", s.SelectionWindowDays);
        Line("mcsReplications", s.McsReplications);
        Line("mcsAlpha", s.McsAlpha.ToString("R", CultureInfo.InvariantCulture));
        Line("mcsBlockLength", s.McsBlockLength);
        Line("mcsSeed", s.McsSeed);
        Line("ruleThreshold", s.RuleThreshold.ToString("R", CultureInfo.InvariantCulture));
        Line("ruleForecaster", s.RuleForecaster);
        Line("ruleHistorical", s.RuleHistorical);
        Line("baseline", s.Baseline);
        Line("candidate", s.Candidate);
        Line("annualizationFactor", s.AnnualizationFactor.ToString("R", CultureInfo.InvariantCulture));
        Line("target", s.Target);
        if (format is { IsDefault: false })
        {
            // Only a declared form is written, so the fingerprints of batches of ISO files stay as they were.
            Line("format", format);
        }

        if (impliedTenorDays is int days)
        {
            Line("impliedTenorDays", days);
        }

        if (checks is not null && checks != DataChecks.Default)
        {
            // Dropped rows change the results, so another treatment of bad or suspect rows recomputes the name; the default leaves fingerprints as they were.
            Line("suspect", checks.Suspect);
            Line("skipBadRows", checks.SkipBadRows);
        }

        // Settings added later are written only when they differ from their default, so earlier fingerprints still match.
        if (s.FullSweep)
        {
            Line("fullSweep", true);
        }

        if (workbook)
        {
            Line("workbook", true);
        }

        return text.ToString();
    }
}
