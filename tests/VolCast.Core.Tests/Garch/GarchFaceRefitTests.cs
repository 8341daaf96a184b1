using FsCheck.Xunit;
using VolCast.Core.Garch;
using Xunit.Abstractions;

namespace VolCast.Core.Tests.Garch;

/// <summary>Walk-forward GJR refits from an estimate with γ or α on zero: the faces of the weight constraints.</summary>
public sealed class GarchFaceRefitTests(ITestOutputHelper output)
{
    private static readonly GarchParameters NoLeverage = new(0.0003, 4e-6, 0.1, 0.85);
    private static readonly GarchParameters Leverage = new(0.0002, 3e-6, 0.03, 0.88, 0.12);
    private static readonly GarchFitOptions Gjr = new() { Variant = GarchVariant.GjrGarch, ComputeStandardErrors = false, GradientTolerance = 1e-6 };

    [Theory]
    [InlineData(GarchLikelihood.Gamma, 0)]
    [InlineData(GarchLikelihood.Alpha, 0)]
    [InlineData(GarchLikelihood.Alpha, 1)]
    public void FaceMap_ChainedGradient_MatchesCentralDifferences(int zeroWeight, int includeMean)
    {
        // Reference: central differences of the likelihood through the face's coordinates (common practice, no source).
        var r = GarchSimulation.Returns(Leverage, 400, seed: 5);
        var sd = Math.Sqrt(r.Select(x => x * x).Average());
        var y = r.Select(x => x / sd).ToArray();
        var likelihood = new GarchLikelihood(y, y.Length, VarianceStart.Backcast, false);
        var map = new GarchParameterMap(GarchVariant.GjrGarch, includeMean == 1, zeroWeight);
        var theta = Enumerable.Range(0, map.Dimension).Select(i => 0.3 - (0.2 * i)).ToArray();
        var q = new double[GarchLikelihood.Count];
        var gq = new double[GarchLikelihood.Count];
        double Value(double[] point)
        {
            map.ToNatural(point, q);
            return likelihood.Evaluate(q, gq);
        }

        Value(theta);
        Assert.Equal(0.0, q[zeroWeight]);
        var analytic = new double[map.Dimension];
        map.ChainGradient(theta, q, gq, analytic);
        for (var i = 0; i < map.Dimension; i++)
        {
            var plus = (double[])theta.Clone();
            var minus = (double[])theta.Clone();
            plus[i] += 1e-6;
            minus[i] -= 1e-6;
            var numeric = (Value(plus) - Value(minus)) / 2e-6;
            Assert.True(Math.Abs(numeric - analytic[i]) <= 1e-5 * (1 + Math.Abs(numeric)), $"coordinate {i}: {analytic[i]} vs {numeric}");
        }
    }

    [Theory]
    // Seeds whose cold GJR fit of the first window ends with γ on its bound (of 4–7; 6 does not).
    [InlineData(4)]
    [InlineData(5)]
    [InlineData(7)]
    public void Refit_GammaOnItsBound_EqualsAPlainGarchFitOfTheWindow(int seed)
    {
        // On γ = 0 the GJR-GARCH(1,1) variance equation is GARCH(1,1) (Glosten, Jagannathan and Runkle 1993, eq. for
        // h_t with the indicator term dropped), so a refit that ends on that face must reproduce an independent plain
        // GARCH(1,1) fit of the same window, with γ reported exactly 0. The path has no leverage.
        const int window = 1000, step = 5;
        var r = GarchSimulation.Returns(NoLeverage, window + step, seed);
        var previous = GarchFitter.Fit(r.AsSpan(0, window), Gjr);
        Assert.Contains("gamma", previous.ParametersOnBound);

        var refit = GarchFitter.Fit(r.AsSpan(step, window), Gjr, previous);
        var plain = GarchFitter.Fit(r.AsSpan(step, window), new GarchFitOptions { ComputeStandardErrors = false });

        Assert.True(refit.Converged, refit.Message);
        Assert.Equal(0.0, refit.Parameters.Gamma);
        Assert.Contains("gamma", refit.ParametersOnBound);
        // Both stop at gradient tests of 1e-6 (refit) and 1e-8 (plain fit): the likelihoods agree to 1e-6 per return.
        Assert.Equal(plain.LogLikelihood, refit.LogLikelihood, 1e-6 * window);
        Assert.Equal(plain.Parameters.Alpha, refit.Parameters.Alpha, 1e-3);
        Assert.Equal(plain.Parameters.Beta, refit.Parameters.Beta, 1e-3);
        Assert.Equal(plain.Parameters.Omega, refit.Parameters.Omega, 0.02 * plain.Parameters.Omega);
    }

    [Theory]
    [InlineData(21)]
    [InlineData(22)]
    public void Refit_FromGammaZeroOnDataWithLeverage_LeavesTheFaceForTheInteriorMaximum(int seed)
    {
        // Kuhn-Tucker (Kuhn and Tucker 1951): γ = 0 is a maximum of the constrained likelihood only when ∂ℓ/∂γ ≤ 0
        // there. On a path with γ = 0.12 the derivative is positive, so a refit started from a γ = 0 estimate (the
        // window's plain GARCH fit) must leave the face and reach the maximum a cold GJR fit finds.
        const int window = 1500;
        var r = GarchSimulation.Returns(Leverage, window, seed);
        var plain = GarchFitter.Fit(r, new GarchFitOptions { ComputeStandardErrors = false, GradientTolerance = 1e-6 });
        var cold = GarchFitter.Fit(r, Gjr);
        Assert.True(cold.Parameters.Gamma > 0.05, $"cold gamma {cold.Parameters.Gamma}");
        var previous = cold with { Parameters = plain.Parameters, ParametersOnBound = ["gamma"], InverseHessian = null };

        var refit = GarchFitter.Fit(r, Gjr, previous);

        Assert.True(refit.Converged, refit.Message);
        Assert.DoesNotContain("gamma", refit.ParametersOnBound);
        Assert.True(refit.Parameters.Gamma > 0.05, $"refit gamma {refit.Parameters.Gamma}");
        Assert.True(refit.LogLikelihood > plain.LogLikelihood + 1, $"refit {refit.LogLikelihood:R} vs gamma = 0 {plain.LogLikelihood:R}");
        Assert.True(refit.LogLikelihood >= cold.LogLikelihood - 1e-4, $"refit {refit.LogLikelihood:R} vs cold {cold.LogLikelihood:R}");
    }

    [Theory]
    // Paths without leverage whose 300-day windows put the higher maximum on α = 0 for a stretch and on γ = 0 around
    // it (seeds 11–15 of this path walked; 12 stays on γ = 0 throughout and is left out). Seed 11 also holds a window
    // (day 480) where the γ = 0 face itself has two maxima (β ≈ 0.89 and β ≈ 0.53), which a warm chain alone misses.
    [InlineData(11)]
    [InlineData(13)]
    [InlineData(14)]
    public void WalkForward_HigherMaximumSwitchesSides_RefitNeverBelowTheColdFit(int seed)
    {
        // The GJR likelihood of a short window without leverage has a local maximum on γ = 0 and one on α = 0
        // (Glosten, Jagannathan and Runkle 1993 model; the two-maxima shape is common practice, no source). Each refit
        // must end on the higher one: never below a cold fit of the same window by more than 1e-3 in log-likelihood
        // (the refits stop at a gradient of 1e-6 per return; common practice, no source).
        const int window = 300, step = 5, days = 1500;
        var r = GarchSimulation.Returns(NoLeverage, days, seed);
        GarchFit? previous = null;
        int onAlpha = 0, onGamma = 0;
        for (var day = 250; day <= days; day += step)
        {
            var length = Math.Min(window, day);
            var returns = r.AsSpan(day - length, length);
            var fit = previous is null ? GarchFitter.Fit(returns, Gjr) : GarchFitter.Fit(returns, Gjr, previous);
            var cold = GarchFitter.Fit(returns, Gjr);
            Assert.True(fit.LogLikelihood >= cold.LogLikelihood - 1e-3, $"day {day}: refit {fit.LogLikelihood:R} vs cold {cold.LogLikelihood:R}");
            onAlpha += fit.Parameters.Alpha == 0 && fit.Parameters.Gamma > 0.01 ? 1 : 0;
            onGamma += fit.Parameters.Gamma == 0 && fit.Parameters.Alpha > 0.01 ? 1 : 0;
            if (fit.Converged && fit.Parameters.IsStationary)
            {
                previous = fit;
            }
        }

        output.WriteLine($"refits on alpha = 0: {onAlpha}, on gamma = 0: {onGamma}");
        Assert.True(onAlpha > 0 && onGamma > 0, $"the path should visit both faces: alpha {onAlpha}, gamma {onGamma}");
    }

    [Property(MaxTest = 12)]
    public bool WalkForward_AnySeed_RefitNeverBelowTheColdFit(FsCheck.PositiveInt seed)
    {
        // Whatever the path (here without leverage, where the faces matter most), a refit chain's likelihood is never
        // below a cold fit's of the same window by more than 1e-3 (common practice, no source).
        const int window = 400, step = 5;
        var r = GarchSimulation.Returns(NoLeverage, window + (4 * step), seed.Get);
        GarchFit? previous = null;
        for (var start = 0; start <= 4 * step; start += step)
        {
            var returns = r.AsSpan(start, window);
            var fit = previous is null ? GarchFitter.Fit(returns, Gjr) : GarchFitter.Fit(returns, Gjr, previous);
            if (fit.LogLikelihood < GarchFitter.Fit(returns, Gjr).LogLikelihood - 1e-3)
            {
                return false;
            }

            previous = fit.Converged && fit.Parameters.IsStationary ? fit : previous;
        }

        return true;
    }
}
