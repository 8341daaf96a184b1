using System.Text.Json;
using VolCast.Core.Garch;
using VolCast.IO.Results;

namespace VolCast.IO.Tests.Results;

public sealed class GarchFitJsonTests
{
    private static GarchFit Fit(GarchVariant variant, GarchStandardErrors? errors, double persistenceBeta = 0.9) => new()
    {
        Variant = variant,
        IncludeMean = true,
        Parameters = new GarchParameters(0.000653508073780597, 4.7544019022913244e-06, 0.068416996212762, persistenceBeta, variant == GarchVariant.GjrGarch ? 0.05 : 0),
        ObservationCount = 1859,
        Converged = true,
        Iterations = 19,
        LogLikelihood = 5966.2144988286018,
        LongRunVolatility = 0.1234,
        NextVariance = 1e-4,
        StandardErrors = errors,
        RobustStandardErrors = null,
        ParametersOnBound = [],
        Message = "The gradient test was met.",
    };

    [Fact]
    public void ToJson_GarchFit_WritesEveryFieldRoundTrip()
    {
        var fit = Fit(GarchVariant.Garch, new GarchStandardErrors(0.0002, 1.2e-6, 0.0148, 0.0236, null));
        using var doc = JsonDocument.Parse(GarchFitJson.ToJson(fit));
        var root = doc.RootElement;

        Assert.Equal("garch", root.GetProperty("model").GetString());
        // Doubles round-trip exactly (shortest round-trip form).
        Assert.Equal(fit.Parameters.Mu, root.GetProperty("mu").GetDouble());
        Assert.Equal(fit.Parameters.Omega, root.GetProperty("omega").GetDouble());
        Assert.Equal(fit.Parameters.Alpha, root.GetProperty("alpha").GetDouble());
        Assert.Equal(fit.Parameters.Beta, root.GetProperty("beta").GetDouble());
        Assert.False(root.TryGetProperty("gamma", out _));
        Assert.Equal(fit.LogLikelihood, root.GetProperty("log_likelihood").GetDouble());
        Assert.Equal("decimal daily log returns", root.GetProperty("log_likelihood_units").GetString());
        // Returns in percent are 100 times the decimals, so their density is 1/100 of it: n·ln 100 lower (change of variables).
        Assert.Equal(fit.LogLikelihood - (1859 * Math.Log(100)), root.GetProperty("log_likelihood_percent").GetDouble(), 9);
        Assert.Equal("backcast", root.GetProperty("variance_start").GetString());
        Assert.Equal(fit.Persistence, root.GetProperty("persistence").GetDouble());
        Assert.Equal(fit.HalfLifeDays!.Value, root.GetProperty("half_life_days").GetDouble());
        Assert.Equal(0.1234, root.GetProperty("long_run_vol").GetDouble());
        Assert.Equal(1859, root.GetProperty("n").GetInt32());
        Assert.True(root.GetProperty("converged").GetBoolean());
        Assert.Equal(19, root.GetProperty("iterations").GetInt32());
        Assert.Equal(0.0148, root.GetProperty("standard_errors").GetProperty("alpha").GetDouble());
        Assert.Equal(JsonValueKind.Null, root.GetProperty("robust_standard_errors").ValueKind);
        Assert.Equal(0, root.GetProperty("parameters_on_bound").GetArrayLength());
    }

    [Fact]
    public void ToJson_SampleVarianceStart_NamesIt()
    {
        var fit = Fit(GarchVariant.Garch, null) with { Start = VarianceStart.SampleVariance };
        using var doc = JsonDocument.Parse(GarchFitJson.ToJson(fit));
        Assert.Equal("sample-variance", doc.RootElement.GetProperty("variance_start").GetString());
    }

    [Fact]
    public void ToJson_GjrFit_WritesGamma()
    {
        var fit = Fit(GarchVariant.GjrGarch, new GarchStandardErrors(0.0002, 1.2e-6, 0.0148, 0.0236, 0.02));
        using var doc = JsonDocument.Parse(GarchFitJson.ToJson(fit));
        Assert.Equal("gjr-garch", doc.RootElement.GetProperty("model").GetString());
        Assert.Equal(0.05, doc.RootElement.GetProperty("gamma").GetDouble());
        Assert.Equal(0.02, doc.RootElement.GetProperty("standard_errors").GetProperty("gamma").GetDouble());
    }

    [Fact]
    public void ToJson_NonStationaryFit_WritesNullNotNaN()
    {
        var fit = Fit(GarchVariant.Garch, null, persistenceBeta: 0.95) with { LongRunVolatility = null };
        var text = GarchFitJson.ToJson(fit);
        Assert.DoesNotContain("NaN", text, StringComparison.Ordinal);
        using var doc = JsonDocument.Parse(text);
        Assert.Equal(JsonValueKind.Null, doc.RootElement.GetProperty("half_life_days").ValueKind);
        Assert.Equal(JsonValueKind.Null, doc.RootElement.GetProperty("long_run_vol").ValueKind);
        Assert.EndsWith("}\n", text, StringComparison.Ordinal);
        Assert.DoesNotContain("\r", text, StringComparison.Ordinal);
    }
}
