using System.Globalization;
using System.Text;
using System.Text.Json;
using VolCast.Cli.Tests.Support;
using VolCast.Core.Data;
using VolCast.Core.Garch;

namespace VolCast.Cli.Tests.Commands;

public sealed class FitCommandTests : IDisposable
{
    private readonly TempFolder _temp = new("fit");

    public void Dispose() => _temp.Dispose();

    [Theory]
    // Both models, with and without the mean.
    [InlineData("garch", false)]
    [InlineData("gjr-garch", false)]
    [InlineData("garch", true)]
    public void Fit_GoodPrices_WritesJsonEqualToTheCoreFit(string model, bool zeroMean)
    {
        // Invented close-only history following a seeded GARCH path; the JSON must carry the Core fit of the same
        // returns exactly (round-trip doubles).
        var closes = SimulatedCloses(800, seed: 7);
        var prices = WritePrices("prices.csv", closes);
        var output = _temp.Combine("fit.json");
        string[] args = zeroMean
            ? ["fit", "--prices", prices, "--model", model, "--zero-mean", "--out", output]
            : ["fit", "--prices", prices, "--model", model, "--out", output];
        var result = CliRunner.Run(args);

        Assert.Equal(0, result.ExitCode);
        Assert.Equal(string.Empty, result.Stderr);
        Assert.Contains("persistence", result.Stdout, StringComparison.Ordinal);
        Assert.Contains($"wrote {output}", result.Stdout, StringComparison.Ordinal);

        var expected = GarchFitter.Fit(Returns.LogReturns(closes), new GarchFitOptions
        {
            Variant = model == "gjr-garch" ? GarchVariant.GjrGarch : GarchVariant.Garch,
            IncludeMean = !zeroMean,
        });
        using var doc = JsonDocument.Parse(File.ReadAllText(output));
        var root = doc.RootElement;
        Assert.Equal(model, root.GetProperty("model").GetString());
        Assert.Equal(expected.Parameters.Mu, root.GetProperty("mu").GetDouble());
        Assert.Equal(expected.Parameters.Omega, root.GetProperty("omega").GetDouble());
        Assert.Equal(expected.Parameters.Alpha, root.GetProperty("alpha").GetDouble());
        Assert.Equal(expected.Parameters.Beta, root.GetProperty("beta").GetDouble());
        Assert.Equal(model == "gjr-garch", root.TryGetProperty("gamma", out _));
        Assert.Equal(expected.LogLikelihood, root.GetProperty("log_likelihood").GetDouble());
        Assert.Equal(799, root.GetProperty("n").GetInt32());
        Assert.True(root.GetProperty("converged").GetBoolean());
        Assert.Equal(JsonValueKind.Object, root.GetProperty("standard_errors").ValueKind);
        Assert.Equal(JsonValueKind.Object, root.GetProperty("robust_standard_errors").ValueKind);
    }

    [Fact]
    public void Fit_TooFewPrices_ExitsThreeNamingTheMinimum()
    {
        var prices = WritePrices("short.csv", SimulatedCloses(50, seed: 1));
        var result = CliRunner.Run("fit", "--prices", prices, "--model", "garch", "--out", _temp.Combine("f.json"));
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("at least 100 daily returns (101 prices)", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("short.csv", result.Stderr, StringComparison.Ordinal);
        Assert.Contains("variance start backcast", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Fit_ConstantPrices_ExitsThreeNotNaN()
    {
        var prices = WritePrices("flat.csv", Enumerable.Repeat(100.0, 300).ToArray());
        var output = _temp.Combine("f.json");
        var result = CliRunner.Run("fit", "--prices", prices, "--model", "garch", "--out", output);
        Assert.Equal(3, result.ExitCode);
        Assert.Contains("constant prices", result.Stderr, StringComparison.Ordinal);
        Assert.False(File.Exists(output));
        var other = CliRunner.Run("fit", "--prices", prices, "--model", "garch", "--out", output, "--variance-start", "sample-variance");
        Assert.Equal(3, other.ExitCode);
        Assert.Contains("variance start sample-variance", other.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Fit_Dem2GbpPrices_ReportsTheBenchmarkLogLikelihoodInPercentUnits()
    {
        // The Fiorentini, Calzolari and Panattoni (1996) benchmark series (committed from R's fGarch as
        // tests/VolCast.Core.Tests/Fixtures/Garch/dem2gbp.csv, percent log returns) turned into closes: the fit of their
        // log returns, which are the series in decimals, must report the certified log-likelihood −1106.608 [C] in
        // percent units, the benchmark's α = 0.153134 and β = 0.805974 [C], and name its units and start.
        var percent = File.ReadAllLines(RepositoryRoot.Combine("tests", "VolCast.Core.Tests", "Fixtures", "Garch", "dem2gbp.csv"))
            .Where(line => line.Length > 0 && !line.StartsWith('#')).Skip(1)
            .Select(line => double.Parse(line, CultureInfo.InvariantCulture)).ToArray();
        var closes = new double[percent.Length + 1];
        closes[0] = 100;
        for (var i = 0; i < percent.Length; i++)
        {
            closes[i + 1] = closes[i] * Math.Exp(percent[i] / 100);
        }

        var output = _temp.Combine("dem2gbp.json");
        var result = CliRunner.Run("fit", "--prices", WritePrices("dem2gbp-prices.csv", closes), "--model", "garch", "--out", output);

        Assert.Equal(0, result.ExitCode);
        Assert.Contains("with returns in percent", result.Stdout, StringComparison.Ordinal);
        Assert.Contains("variance start backcast", result.Stdout, StringComparison.Ordinal);
        using var doc = JsonDocument.Parse(File.ReadAllText(output));
        var root = doc.RootElement;
        Assert.Equal("backcast", root.GetProperty("variance_start").GetString());
        Assert.Equal("decimal daily log returns", root.GetProperty("log_likelihood_units").GetString());
        Assert.Equal(-1106.608, Math.Round(root.GetProperty("log_likelihood_percent").GetDouble(), 3));
        Assert.Equal(0.153134, Math.Round(root.GetProperty("alpha").GetDouble(), 6));
        Assert.Equal(0.805974, Math.Round(root.GetProperty("beta").GetDouble(), 6));
    }

    [Fact]
    public void Fit_SampleVarianceStart_WritesTheCoreFitWithThatStart()
    {
        var closes = SimulatedCloses(800, seed: 7);
        var output = _temp.Combine("fit-sv.json");
        var result = CliRunner.Run("fit", "--prices", WritePrices("prices.csv", closes), "--model", "garch", "--variance-start", "sample-variance", "--out", output);

        Assert.Equal(0, result.ExitCode);
        var expected = GarchFitter.Fit(Returns.LogReturns(closes), new GarchFitOptions { Start = VarianceStart.SampleVariance });
        using var doc = JsonDocument.Parse(File.ReadAllText(output));
        Assert.Equal("sample-variance", doc.RootElement.GetProperty("variance_start").GetString());
        Assert.Equal(expected.Parameters.Alpha, doc.RootElement.GetProperty("alpha").GetDouble());
        Assert.Equal(expected.LogLikelihood, doc.RootElement.GetProperty("log_likelihood").GetDouble());
    }

    [Fact]
    public void Fit_UnknownModel_ExitsTwo()
    {
        var prices = WritePrices("p.csv", SimulatedCloses(200, seed: 1));
        var result = CliRunner.Run("fit", "--prices", prices, "--model", "egarch");
        Assert.Equal(2, result.ExitCode);
        Assert.Contains("egarch", result.Stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void Fit_ExistingOutput_ExitsTwoWithoutForce()
    {
        var prices = WritePrices("p.csv", SimulatedCloses(200, seed: 1));
        var output = _temp.Combine("f.json");
        File.WriteAllText(output, "keep");
        var result = CliRunner.Run("fit", "--prices", prices, "--model", "garch", "--out", output);
        Assert.Equal(2, result.ExitCode);
        Assert.Equal("keep", File.ReadAllText(output));
        Assert.Equal(0, CliRunner.Run("fit", "--prices", prices, "--model", "garch", "--out", output, "--force").ExitCode);
    }

    private string WritePrices(string name, double[] closes)
    {
        var path = _temp.Combine(name);
        var text = new StringBuilder("date,close\n");
        var dates = Weekdays.From(new DateOnly(2015, 1, 5), closes.Length);
        for (var i = 0; i < closes.Length; i++)
        {
            text.Append(CultureInfo.InvariantCulture, $"{dates[i]:yyyy-MM-dd},{closes[i]:R}\n");
        }

        File.WriteAllText(path, text.ToString());
        return path;
    }

    private static double[] SimulatedCloses(int n, int seed)
    {
        // Seeded GARCH(1,1) path (ω = 3e−6, α = 0.08, β = 0.9), Gaussian shocks; invented data.
        var random = new Random(seed);
        var closes = new double[n];
        closes[0] = 100;
        var h = 3e-6 / 0.02;
        for (var i = 1; i < n; i++)
        {
            var e = Math.Sqrt(h) * Gaussian.Next(random);
            closes[i] = closes[i - 1] * Math.Exp(0.0002 + e);
            h = 3e-6 + (0.08 * e * e) + (0.9 * h);
        }

        return closes;
    }
}
