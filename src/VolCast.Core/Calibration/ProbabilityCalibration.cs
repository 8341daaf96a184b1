using System.Collections.Immutable;
using VolCast.Core.Options;

namespace VolCast.Core.Calibration;

/// <summary>
/// Backtests the probabilities of finishing above a strike that a volatility forecast implies: N(d2) for strikes
/// K = m·S_t, scored against whether S_{t+h} &gt; K happened.
/// </summary>
/// <remarks>
/// <para>
/// On each date with a forecast σ_F: τ = h_t / A (trading-day time, see <see cref="CalibrationOptions"/>),
/// p = N(d2) with d2 = [ln(1/m) + (r − q − σ_F²/2)τ] / (σ_F√τ) (<see cref="AboveStrikeProbability"/>), outcome
/// 1 when S_{t+h} &gt; m·S_t. Scores: the Brier score with its Murphy (1973) decomposition over equal-width bins
/// (<see cref="BrierDecomposition"/>), the log score with p clipped to [ε, 1 − ε], and the reliability table with
/// Wilson intervals on n_eff = n / h (<see cref="WilsonInterval"/>).
/// </para>
/// <para>
/// A well-calibrated volatility gives bins on the diagonal. A volatility that is too low makes probabilities too
/// extreme: strikes below the close get too high a probability and strikes above it too low a one, so the curve is
/// flatter than the diagonal (observed above predicted at the low end, below at the high end). Too high a
/// volatility pulls probabilities towards the middle and the curve is steeper than the diagonal.
/// </para>
/// </remarks>
internal static class ProbabilityCalibration
{
    /// <summary>Scores one forecaster's above-strike probabilities at every configured moneyness.</summary>
    /// <param name="outcomes">The closes at t and t + h.</param>
    /// <param name="forecaster">The forecaster's volatility per date, aligned with <paramref name="outcomes"/>.</param>
    /// <param name="options">Strikes, drift and bins; the defaults when null.</param>
    /// <returns>One result per moneyness, with the missing dates counted and listed.</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">The series are not aligned, or an option is invalid.</exception>
    public static ForecasterCalibration Evaluate(HorizonOutcomes outcomes, ForecasterVolatility forecaster, CalibrationOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(outcomes);
        ArgumentNullException.ThrowIfNull(forecaster);
        options ??= new CalibrationOptions();
        options.Validate();
        outcomes.CheckAligned(forecaster);

        var h = outcomes.HorizonDays;
        var windows = outcomes.WindowArray;
        var drift = options.RiskFreeRate - options.DividendYield;
        var annualization = options.AnnualizationFactor;
        var moneyness = options.Moneyness;
        var strikes = moneyness.Length;
        var logInverseMoneyness = new double[strikes];
        var accumulators = new BinAccumulator[strikes];
        for (var j = 0; j < strikes; j++)
        {
            logInverseMoneyness[j] = -Math.Log(moneyness[j]);
            accumulators[j] = new BinAccumulator(options.BinCount);
        }

        var start = outcomes.StartArray;
        var end = outcomes.EndArray;
        var sigmas = forecaster.Values;
        var missing = ImmutableArray.CreateBuilder<int>();
        var clip = options.LogScoreClip;
        for (var t = 0; t < sigmas.Length; t++)
        {
            if (sigmas[t] is not { } sigma)
            {
                missing.Add(t);
                continue;
            }

            // τ = h_t / A in trading-day time; σ√τ and the drift are per date, ln(1/m) per strike.
            var tau = windows[t] / annualization;
            var sd = sigma * Math.Sqrt(tau);
            var driftTau = drift * tau;
            var growth = end[t] / start[t];
            for (var j = 0; j < strikes; j++)
            {
                var d2 = ((logInverseMoneyness[j] + driftTau) / sd) - (0.5 * sd);
                accumulators[j].Add(StandardNormal.Cdf(d2), growth > moneyness[j], clip);
            }
        }

        var count = sigmas.Length - missing.Count;
        var results = ImmutableArray.CreateBuilder<StrikeCalibration>(strikes);
        if (count > 0)
        {
            for (var j = 0; j < strikes; j++)
            {
                var a = accumulators[j];
                results.Add(new StrikeCalibration(moneyness[j], a.Decompose(), a.LogScore, a.Clipped, a.MeanPredicted(), a.ObservedFrequency(), a.Table(h, options.IntervalZ)));
            }
        }

        return new ForecasterCalibration(forecaster.Spec, h, count, missing.Count, missing.ToImmutable(), results.ToImmutable());
    }

    /// <summary>The Brier score and its decomposition for any probabilities and outcomes, over equal-width bins.</summary>
    /// <param name="probabilities">Predicted probabilities, each in [0, 1].</param>
    /// <param name="outcomes">Whether each event happened, aligned with <paramref name="probabilities"/>.</param>
    /// <param name="binCount">Number of equal-width bins on [0, 1], at least 1.</param>
    /// <returns>The decomposition.</returns>
    /// <exception cref="ArgumentException">The lengths differ or the input is empty.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A probability is outside [0, 1], or the bin count is below 1.</exception>
    public static BrierDecomposition Decompose(ReadOnlySpan<double> probabilities, ReadOnlySpan<bool> outcomes, int binCount = 10)
    {
        Preconditions.SameLength(outcomes.Length, probabilities.Length, nameof(probabilities), nameof(outcomes));
        if (probabilities.IsEmpty)
        {
            throw new ArgumentException("probabilities must hold at least one forecast, was empty.", nameof(probabilities));
        }

        ArgumentOutOfRangeException.ThrowIfLessThan(binCount, 1);
        var a = new BinAccumulator(binCount);
        for (var i = 0; i < probabilities.Length; i++)
        {
            var p = probabilities[i];
            if (!(p >= 0 && p <= 1))
            {
                throw new ArgumentOutOfRangeException(nameof(probabilities), p, $"probabilities[{i}] must be in [0, 1].");
            }

            a.Add(p, outcomes[i], 1e-12);
        }

        return a.Decompose();
    }
}
