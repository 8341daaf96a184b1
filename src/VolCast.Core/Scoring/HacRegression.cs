using System.Buffers;
using System.Globalization;
using VolCast.Core.Numerics;

namespace VolCast.Core.Scoring;

/// <summary>
/// Ordinary least squares with a Newey-West (HAC) covariance of the coefficients: Bartlett weights 1 − j/(L+1),
/// a given lag L, no prewhitening and no small-sample adjustment (divisor T).
/// </summary>
/// <remarks>
/// V̂ = T (X′X)⁻¹ Ŝ (X′X)⁻¹ with Ŝ = Γ̂_0 + Σ_{j=1..L} w_j (Γ̂_j + Γ̂_j′), Γ̂_j = (1/T) Σ_t g_t g_{t−j}′ and
/// g_t = x_t ê_t (docs/methods.md#newey-west). This is the covariance a sandwich estimator gives with lag L, prewhitening
/// off and adjustment off.
/// </remarks>
internal static class HacRegression
{
    /// <summary>Fits y = Xβ + e by least squares and estimates the HAC covariance of β̂.</summary>
    /// <param name="y">The dependent variable, T finite values.</param>
    /// <param name="design">The design matrix X, row-major T × k (include a column of ones for an intercept).</param>
    /// <param name="columnCount">k, the number of regressors, at least 1.</param>
    /// <param name="lag">The Newey-West lag L, 0 to T − 1 (0 gives White's HC0 covariance).</param>
    /// <returns>The coefficients, their HAC covariance and R².</returns>
    /// <exception cref="ArgumentException">The sizes disagree, there are not more observations than regressors,
    /// the regressors are collinear, y is constant, or the fit is exact.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A value is not finite or the lag is out of range.</exception>
    public static HacRegressionResult Fit(ReadOnlySpan<double> y, ReadOnlySpan<double> design, int columnCount, int lag)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(columnCount, 1);
        var n = y.Length;
        Preconditions.SameLength(design.Length, n * columnCount, "y (times the column count)", nameof(design));
        Preconditions.CountAtLeast(n, columnCount + 1, string.Create(CultureInfo.InvariantCulture, $"(more than the {columnCount} regressors)"), nameof(y));
        Preconditions.Between(lag, 0, n - 1, "the number of observations minus one");
        for (var i = 0; i < design.Length; i++)
        {
            Preconditions.FiniteAt(design[i], i, nameof(design));
        }

        var k = columnCount;
        var xtx = new double[k * k];
        var xty = new double[k];
        var yMean = NeweyWest.Mean(y, nameof(y));
        for (var t = 0; t < n; t++)
        {
            var row = design.Slice(t * k, k);
            for (var a = 0; a < k; a++)
            {
                xty[a] += row[a] * y[t];
                for (var b = 0; b <= a; b++)
                {
                    xtx[(a * k) + b] += row[a] * row[b];
                }
            }
        }

        for (var a = 0; a < k; a++)
        {
            for (var b = a + 1; b < k; b++)
            {
                xtx[(a * k) + b] = xtx[(b * k) + a];
            }
        }

        var bread = new double[k * k];
        if (!SymmetricMatrix.TryInvert(xtx, k, bread))
        {
            throw new ArgumentException("The regressors are collinear (X'X is singular); a regressor may be constant or repeat another.", nameof(design));
        }

        var beta = new double[k];
        for (var a = 0; a < k; a++)
        {
            for (var b = 0; b < k; b++)
            {
                beta[a] += bread[(a * k) + b] * xty[b];
            }
        }

        var residuals = ArrayPool<double>.Shared.Rent(n);
        try
        {
            double ssr = 0, sst = 0;
            for (var t = 0; t < n; t++)
            {
                var row = design.Slice(t * k, k);
                var fitted = 0.0;
                for (var a = 0; a < k; a++)
                {
                    fitted += row[a] * beta[a];
                }

                var e = y[t] - fitted;
                residuals[t] = e;
                ssr += e * e;
                sst += (y[t] - yMean) * (y[t] - yMean);
            }

            if (!(sst > 0))
            {
                throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                    $"y must vary for a regression, all {n} values equal {y[0]}."), nameof(y));
            }

            Span<double> meat = k <= 8 ? stackalloc double[k * k] : new double[k * k];
            NeweyWest.Meat(design, residuals.AsSpan(0, n), k, lag, meat);
            var covariance = Sandwich(bread, meat, k, n);
            for (var a = 0; a < k; a++)
            {
                if (!(covariance[(a * k) + a] > 0))
                {
                    throw new ArgumentException("The regression fits exactly (all residuals are zero); no standard error or test is possible.", nameof(y));
                }
            }

            return new HacRegressionResult(beta, covariance, n, lag, 1.0 - (ssr / sst));
        }
        finally
        {
            ArrayPool<double>.Shared.Return(residuals);
        }
    }

    private static double[] Sandwich(ReadOnlySpan<double> bread, ReadOnlySpan<double> meat, int k, int n)
    {
        // T (X'X)^-1 S (X'X)^-1, made exactly symmetric.
        var temp = new double[k * k];
        for (var a = 0; a < k; a++)
        {
            for (var b = 0; b < k; b++)
            {
                var sum = 0.0;
                for (var p = 0; p < k; p++)
                {
                    sum += bread[(a * k) + p] * meat[(p * k) + b];
                }

                temp[(a * k) + b] = sum;
            }
        }

        var result = new double[k * k];
        for (var a = 0; a < k; a++)
        {
            for (var b = 0; b <= a; b++)
            {
                var sum = 0.0;
                for (var p = 0; p < k; p++)
                {
                    sum += temp[(a * k) + p] * bread[(p * k) + b];
                }

                result[(a * k) + b] = sum * n;
                result[(b * k) + a] = sum * n;
            }
        }

        return result;
    }
}
