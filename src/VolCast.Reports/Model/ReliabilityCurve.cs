namespace VolCast.Reports.Model;

/// <summary>One forecaster's reliability curve: for each non-empty probability bin, the mean predicted probability, the observed frequency and its interval.</summary>
/// <param name="Name">The forecaster's name, e.g. <c>implied</c> or <c>garch</c>.</param>
/// <param name="Predicted">Mean predicted probability per bin (0 to 1).</param>
/// <param name="Observed">Observed frequency per bin (0 to 1), same length.</param>
/// <param name="Lower">Lower end of the observed frequency's interval per bin, same length.</param>
/// <param name="Upper">Upper end of the observed frequency's interval per bin, same length.</param>
/// <param name="Counts">Forecasts per bin, same length.</param>
internal sealed record ReliabilityCurve(
    string Name,
    IReadOnlyList<double> Predicted,
    IReadOnlyList<double> Observed,
    IReadOnlyList<double> Lower,
    IReadOnlyList<double> Upper,
    IReadOnlyList<int> Counts);
