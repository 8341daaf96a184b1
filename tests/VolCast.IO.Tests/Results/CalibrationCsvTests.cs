using System.Globalization;
using VolCast.Core.Calibration;
using VolCast.IO.Csv;
using VolCast.IO.Results;

namespace VolCast.IO.Tests.Results;

public sealed class CalibrationCsvTests
{
    internal static HorizonOutcomes Outcomes(int n, int h, int seed)
    {
        var random = new Random(seed);
        var closes = new double[n + h];
        closes[0] = 100;
        for (var t = 1; t < closes.Length; t++)
        {
            closes[t] = closes[t - 1] * Math.Exp(0.0126 * ((random.NextDouble() * 3.4641016) - 1.7320508));
        }

        return new HorizonOutcomes(h, closes[..n], closes[h..(n + h)]);
    }

    [Fact]
    public void Write_TwoForecasters_OneRowPerForecasterMoneynessAndBinWithRoundTripNumbers()
    {
        var outcomes = Outcomes(300, 5, 1);
        var values = Enumerable.Range(0, 300).Select(t => t < 10 ? (double?)null : 0.2 + (0.001 * (t % 7))).ToArray();
        var calibrations = new[]
        {
            ProbabilityCalibration.Evaluate(outcomes, new ForecasterVolatility("ewma:0.94", values)),
            ProbabilityCalibration.Evaluate(outcomes, new ForecasterVolatility("odd,name", new double?[300])),
        };
        // A culture with a decimal comma (built by hand: the test host may run in globalization-invariant mode).
        var comma = (CultureInfo)CultureInfo.InvariantCulture.Clone();
        comma.NumberFormat.NumberDecimalSeparator = ",";
        comma.NumberFormat.NumberGroupSeparator = ".";
        var writer = new StringWriter(comma) { NewLine = "\n" };
        var previous = CultureInfo.CurrentCulture;
        CultureInfo.CurrentCulture = comma;
        try
        {
            CalibrationCsv.Write(writer, calibrations);
        }
        finally
        {
            CultureInfo.CurrentCulture = previous;
        }

        var lines = writer.ToString().Split('\n');
        Assert.Equal(CalibrationCsv.Header, lines[0]);
        Assert.Equal("", lines[^1]);
        var header = lines[0].Split(',');
        // 5 strikes × 10 bins for the first forecaster, one marked row for the one with no value at all.
        Assert.Equal(1 + 50 + 1 + 1, lines.Length);
        var first = lines[1].Split(',');
        Assert.Equal(header.Length, first.Length);
        var strike = calibrations[0].Strikes[0];
        Assert.Equal("ewma:0.94", first[0]);
        Assert.Equal("5", first[1]);
        Assert.Equal(0.9, double.Parse(first[2], CultureInfo.InvariantCulture));
        Assert.Equal("290", first[3]);
        Assert.Equal("10", first[4]);
        Assert.Equal(strike.Decomposition.Brier, double.Parse(first[Array.IndexOf(header, "brier")], CultureInfo.InvariantCulture));
        Assert.Equal(strike.LogScore, double.Parse(first[Array.IndexOf(header, "log_score")], CultureInfo.InvariantCulture));

        // Every bin row of every strike round-trips; empty bins leave the mean, frequency and interval empty.
        for (var row = 0; row < 50; row++)
        {
            var f = lines[1 + row].Split(',');
            var bin = calibrations[0].Strikes[row / 10].Bins[row % 10];
            Assert.Equal(bin.Count, int.Parse(f[Array.IndexOf(header, "bin_count")], CultureInfo.InvariantCulture));
            var mean = f[Array.IndexOf(header, "bin_mean_predicted")];
            if (bin.MeanPredicted is { } m)
            {
                Assert.Equal(m, double.Parse(mean, CultureInfo.InvariantCulture));
                Assert.Equal(bin.IntervalUpper!.Value, double.Parse(f[Array.IndexOf(header, "bin_interval_upper")], CultureInfo.InvariantCulture));
            }
            else
            {
                Assert.Equal("", mean);
            }
        }

        Assert.StartsWith("\"odd,name\",5,,0,300,", lines[51], StringComparison.Ordinal);
    }

    [Fact]
    public void WriteFile_ExistingFile_IsNotOverwrittenUnlessAsked()
    {
        using var folder = new TempFolder();
        var path = Path.Combine(folder.Path, "calibration.csv");
        var calibrations = new[] { ProbabilityCalibration.Evaluate(Outcomes(50, 5, 2), new ForecasterVolatility("garch", Enumerable.Repeat((double?)0.2, 50).ToArray())) };

        CalibrationCsv.WriteFile(path, calibrations);
        Assert.Throws<IOException>(() => CalibrationCsv.WriteFile(path, calibrations));
        CalibrationCsv.WriteFile(path, calibrations, overwrite: true);

        Assert.StartsWith(CalibrationCsv.Header + "\n", File.ReadAllText(path), StringComparison.Ordinal);
        Assert.Single(Directory.GetFiles(folder.Path));
    }
}
