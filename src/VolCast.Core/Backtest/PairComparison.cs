using VolCast.Core.Scoring;

namespace VolCast.Core.Backtest;

/// <summary>
/// A head-to-head Diebold-Mariano comparison of two forecasters on the dates where both have a forecast and a
/// positive realized target: d_t = L(first) − L(second), so a negative statistic means the first has the lower loss.
/// </summary>
/// <remarks>Long-run variance with the rectangular window at lag h − 1 (Bartlett weights where that is not positive, see <see cref="DieboldMarianoResult.FellBackToBartlett"/>), the Harvey-Leybourne-Newbold correction, p-value from Student's t with n − 1 degrees of freedom.</remarks>
/// <param name="First">Spec of the first forecaster.</param>
/// <param name="Second">Spec of the second forecaster.</param>
/// <param name="Count">Number of common dates scored.</param>
/// <param name="FirstLosses">Losses of the first forecaster on the common dates; null when there were none.</param>
/// <param name="SecondLosses">Losses of the second forecaster on the common dates; null when there were none.</param>
/// <param name="Qlike">The test on the QLIKE differential; null with fewer than 2 common dates or too few for the lag.</param>
/// <param name="MseVariance">The test on the differential of squared errors on variance; null likewise.</param>
public sealed record PairComparison(
    string First,
    string Second,
    int Count,
    LossSummary? FirstLosses,
    LossSummary? SecondLosses,
    DieboldMarianoResult? Qlike,
    DieboldMarianoResult? MseVariance);
