using System.Text;
using System.Text.Json;
using VolCast.Core.Garch;

namespace VolCast.IO.Results;

/// <summary>Writes a GARCH fit as the JSON document of <c>volcast fit</c>.</summary>
/// <remarks>
/// Field names are snake_case: <c>model, include_mean, variance_start, mu, omega, alpha, beta, gamma, log_likelihood,
/// log_likelihood_units, log_likelihood_percent, persistence, half_life_days, long_run_vol, n, converged, iterations,
/// parameters_on_bound, standard_errors, robust_standard_errors, message</c>. Parameters are in units of the returns
/// fitted (decimal daily log returns when the fit came from prices); <c>log_likelihood</c> is of those returns and
/// <c>log_likelihood_percent</c> of the same returns times 100 (lower by n·ln 100, the units of published GARCH
/// benchmarks); <c>variance_start</c> is <c>backcast</c> or <c>sample-variance</c> (or <c>fixed</c>);
/// <c>long_run_vol</c> is annualized and decimal. <c>gamma</c> is present only for
/// GJR-GARCH. Values that do not exist (half-life of a non-stationary fit, errors not computed) are null, never NaN.
/// Numbers are written in the invariant culture in their shortest round-trip form.
/// </remarks>
public static class GarchFitJson
{
    private static readonly JsonWriterOptions Options = new() { Indented = true };

    /// <summary>Returns the JSON document for <paramref name="fit"/> (LF line ends, final newline).</summary>
    /// <param name="fit">The fit to write.</param>
    /// <returns>The JSON text.</returns>
    public static string ToJson(GarchFit fit)
    {
        ArgumentNullException.ThrowIfNull(fit);
        using var stream = new MemoryStream();
        using (var json = new Utf8JsonWriter(stream, Options))
        {
            Write(json, fit);
        }

        return Encoding.UTF8.GetString(stream.ToArray()).Replace("\r\n", "\n", StringComparison.Ordinal) + "\n";
    }

    /// <summary>Writes the JSON document for <paramref name="fit"/> to <paramref name="writer"/>.</summary>
    /// <param name="writer">Where the text goes.</param>
    /// <param name="fit">The fit to write.</param>
    public static void Write(TextWriter writer, GarchFit fit)
    {
        ArgumentNullException.ThrowIfNull(writer);
        writer.Write(ToJson(fit));
    }

    /// <summary>
    /// Returns the fit's log-likelihood with the returns expressed in percent: the density of 100·r is that of r
    /// divided by 100, so it is <see cref="GarchFit.LogLikelihood"/> − n·ln 100 (the parameters scale with the returns).
    /// </summary>
    /// <param name="fit">A fit to decimal returns.</param>
    /// <returns>The log-likelihood in percent units.</returns>
    public static double PercentLogLikelihood(GarchFit fit)
    {
        ArgumentNullException.ThrowIfNull(fit);
        return fit.LogLikelihood - (fit.ObservationCount * Math.Log(100));
    }

    private static void Write(Utf8JsonWriter json, GarchFit fit)
    {
        var p = fit.Parameters;
        var gjr = fit.Variant == GarchVariant.GjrGarch;
        json.WriteStartObject();
        json.WriteString("model", gjr ? "gjr-garch" : "garch");
        json.WriteBoolean("include_mean", fit.IncludeMean);
        json.WriteString("variance_start", fit.Start switch
        {
            VarianceStart.SampleVariance => "sample-variance",
            VarianceStart.Fixed => "fixed",
            _ => "backcast",
        });
        json.WriteNumber("mu", p.Mu);
        json.WriteNumber("omega", p.Omega);
        json.WriteNumber("alpha", p.Alpha);
        json.WriteNumber("beta", p.Beta);
        if (gjr)
        {
            json.WriteNumber("gamma", p.Gamma);
        }

        json.WriteNumber("log_likelihood", fit.LogLikelihood);
        json.WriteString("log_likelihood_units", "decimal daily log returns");
        json.WriteNumber("log_likelihood_percent", PercentLogLikelihood(fit));
        json.WriteNumber("persistence", fit.Persistence);
        Numbers.Write(json, "half_life_days", fit.HalfLifeDays);
        Numbers.Write(json, "long_run_vol", fit.LongRunVolatility);
        json.WriteNumber("n", fit.ObservationCount);
        json.WriteBoolean("converged", fit.Converged);
        json.WriteNumber("iterations", fit.Iterations);
        json.WriteStartArray("parameters_on_bound");
        foreach (var name in fit.ParametersOnBound)
        {
            json.WriteStringValue(name);
        }

        json.WriteEndArray();
        WriteErrors(json, "standard_errors", fit.StandardErrors, fit.IncludeMean, gjr);
        WriteErrors(json, "robust_standard_errors", fit.RobustStandardErrors, fit.IncludeMean, gjr);
        json.WriteString("message", fit.Message);
        json.WriteEndObject();
    }

    private static void WriteErrors(Utf8JsonWriter json, string name, GarchStandardErrors? errors, bool includeMean, bool gjr)
    {
        if (errors is null)
        {
            json.WriteNull(name);
            return;
        }

        json.WriteStartObject(name);
        if (includeMean)
        {
            Numbers.Write(json, "mu", errors.Mu);
        }

        json.WriteNumber("omega", errors.Omega);
        json.WriteNumber("alpha", errors.Alpha);
        json.WriteNumber("beta", errors.Beta);
        if (gjr)
        {
            Numbers.Write(json, "gamma", errors.Gamma);
        }

        json.WriteEndObject();
    }
}
