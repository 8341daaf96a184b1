using System.Globalization;
using VolCast.Core.Data;
using VolCast.Core.Estimators;
using VolCast.Core.Garch;

namespace VolCast.Core.Forecasters;

/// <summary>Builds forecasters from spec strings written <c>NAME</c> or <c>NAME:PARAM</c>, as in a run configuration.</summary>
/// <remarks>
/// Names are matched case-insensitively; surrounding spaces are ignored. Valid specs are listed in
/// <see cref="ValidSpecs"/>.
/// </remarks>
public static class ForecasterSpec
{
    /// <summary>Gets the accepted spec forms, one line each, as shown in error messages.</summary>
    public static IReadOnlyList<string> ValidSpecs { get; } =
    [
        "ewma[:LAMBDA]  (EWMA of squared returns, zero mean, λ = 0.94 by default; LAMBDA in (0, 1), e.g. ewma:0.97)",
        "garch[:zero-mean]  (GARCH(1,1), constant mean unless zero-mean)",
        "gjr-garch[:zero-mean]  (GJR-GARCH(1,1))",
        "har[:garman-klass]  (HAR on squared returns, or on the Garman-Klass range term)",
        "implied  (the implied-volatility series itself)",
        "implied-debiased[:N]  (implied times the root mean of RV²/IV² over the last N closed windows, default the selection window; e.g. implied-debiased:252)",
        "ESTIMATOR:WINDOW  (historical window, flat at today's rolling estimate; ESTIMATOR one of close-to-close, parkinson, garman-klass, rogers-satchell, yang-zhang; WINDOW at least 2 trading days; e.g. yang-zhang:21)",
    ];

    /// <summary>Parses a spec string into a forecaster.</summary>
    /// <param name="spec">For example <c>ewma:0.94</c>, <c>garch</c>, <c>gjr-garch:zero-mean</c>, <c>har</c>, <c>implied</c>.</param>
    /// <returns>The forecaster, with its canonical <see cref="IVolatilityForecaster.Spec"/>.</returns>
    /// <exception cref="ArgumentNullException"><paramref name="spec"/> is null.</exception>
    /// <exception cref="ArgumentException">The name is unknown or the parameter is invalid; the message lists the valid specs.</exception>
    public static IVolatilityForecaster Parse(string spec)
    {
        ArgumentNullException.ThrowIfNull(spec);
        var trimmed = spec.Trim();
        var colon = trimmed.IndexOf(':', StringComparison.Ordinal);
        var name = (colon < 0 ? trimmed : trimmed[..colon]).Trim().ToLowerInvariant();
        var parameter = colon < 0 ? null : trimmed[(colon + 1)..].Trim().ToLowerInvariant();

        switch (name)
        {
            case "ewma":
                if (parameter is null)
                {
                    return new EwmaForecaster();
                }

                if (double.TryParse(parameter, NumberStyles.Float, CultureInfo.InvariantCulture, out var lambda) && lambda > 0 && lambda < 1)
                {
                    return new EwmaForecaster(lambda);
                }

                throw Invalid(spec, $"the EWMA decay must be a number strictly between 0 and 1 (was '{parameter}')");
            case "garch":
            case "gjr-garch":
                var variant = name == "garch" ? GarchVariant.Garch : GarchVariant.GjrGarch;
                return parameter switch
                {
                    null => new GarchForecaster(variant),
                    "zero-mean" => new GarchForecaster(variant, includeMean: false),
                    _ => throw Invalid(spec, $"the only option of {name} is 'zero-mean' (was '{parameter}')"),
                };
            case "har":
                return parameter switch
                {
                    null => new HarForecaster(),
                    "garman-klass" => new HarForecaster(HarProxy.GarmanKlass),
                    _ => throw Invalid(spec, $"the only option of har is 'garman-klass' (was '{parameter}')"),
                };
            case ImpliedSeries.Name:
                return parameter is null ? new ImpliedForecaster() : throw Invalid(spec, "implied takes no parameter");
            case ImpliedDebiasedForecaster.Name:
                if (parameter is null)
                {
                    return new ImpliedDebiasedForecaster();
                }

                if (int.TryParse(parameter, NumberStyles.None, CultureInfo.InvariantCulture, out var windows) && windows >= 1)
                {
                    return new ImpliedDebiasedForecaster(windows);
                }

                throw Invalid(spec, $"implied-debiased is written implied-debiased:N with N a whole number of past forecast dates, at least 1 (was '{parameter}')");
            case "close-to-close" or "parkinson" or "garman-klass" or "rogers-satchell" or "yang-zhang":
                if (parameter is not null
                    && int.TryParse(parameter, NumberStyles.None, CultureInfo.InvariantCulture, out var window)
                    && window >= 2
                    && EstimatorNames.TryParse(name, out var estimator))
                {
                    return new HistoricalWindowForecaster(estimator, window);
                }

                throw Invalid(spec, $"a historical-window forecaster is written {name}:WINDOW with WINDOW a whole number of trading days, at least 2 (was '{parameter ?? "missing"}')");
            case "user":
                throw Invalid(spec, "a user:NAME forecaster is a column of the forecasts file (--forecasts FILE), not a built-in spec");
            default:
                throw Invalid(spec, $"'{name}' is not a known forecaster");
        }
    }

    private static ArgumentException Invalid(string spec, string problem) =>
        new(string.Create(CultureInfo.InvariantCulture,
            $"Invalid forecaster spec '{spec}': {problem}. Valid forecasters:{Environment.NewLine}  {string.Join(Environment.NewLine + "  ", ValidSpecs)}"),
            nameof(spec));
}
