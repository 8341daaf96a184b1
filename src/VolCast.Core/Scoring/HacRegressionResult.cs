using System.Collections.Immutable;
using System.Globalization;
using MathNet.Numerics;
using MathNet.Numerics.Distributions;
using VolCast.Core.Numerics;

namespace VolCast.Core.Scoring;

/// <summary>
/// An ordinary least-squares fit with its Newey-West (HAC) coefficient covariance, as produced by
/// <see cref="HacRegression.Fit"/>.
/// </summary>
/// <remarks>
/// t tests use Student's t with T − k degrees of freedom (as a linear-model coefficient table with a supplied
/// covariance does); Wald tests use χ²(q). Both rest on the HAC covariance, so both are asymptotic.
/// </remarks>
public sealed record HacRegressionResult
{
    internal HacRegressionResult(double[] coefficients, double[] covariance, int count, int lag, double rSquared)
    {
        Coefficients = [.. coefficients];
        Covariance = [.. covariance];
        var se = new double[coefficients.Length];
        for (var i = 0; i < se.Length; i++)
        {
            se[i] = Math.Sqrt(covariance[(i * coefficients.Length) + i]);
        }

        StandardErrors = [.. se];
        Count = count;
        Lag = lag;
        RSquared = rSquared;
    }

    /// <summary>Gets the number of observations T.</summary>
    public int Count { get; }

    /// <summary>Gets the Newey-West lag L used for the covariance.</summary>
    public int Lag { get; }

    /// <summary>Gets the coefficients β̂, in the order of the design's columns.</summary>
    public ImmutableArray<double> Coefficients { get; }

    /// <summary>Gets the HAC covariance of β̂, row-major k × k.</summary>
    public ImmutableArray<double> Covariance { get; }

    /// <summary>Gets the HAC standard errors, the square roots of the covariance's diagonal.</summary>
    public ImmutableArray<double> StandardErrors { get; }

    /// <summary>Gets the centred R² = 1 − SSR/SST (the design is expected to hold an intercept).</summary>
    public double RSquared { get; }

    /// <summary>Gets the residual degrees of freedom T − k, used for t tests.</summary>
    public int ResidualDegreesOfFreedom => Count - Coefficients.Length;

    /// <summary>Gets the t statistic (β̂_i − value) / se_i.</summary>
    /// <param name="index">The coefficient's column.</param>
    /// <param name="hypothesized">The value under the null; 0 by default.</param>
    /// <returns>The t statistic.</returns>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="index"/> is not a column.</exception>
    public double TStatistic(int index, double hypothesized = 0)
    {
        CheckIndex(index);
        return (Coefficients[index] - hypothesized) / StandardErrors[index];
    }

    /// <summary>Gets the two-sided p-value of <see cref="TStatistic"/> from Student's t with T − k degrees of freedom.</summary>
    /// <param name="index">The coefficient's column.</param>
    /// <param name="hypothesized">The value under the null; 0 by default.</param>
    /// <returns>2 P(t(T − k) ≥ |t|).</returns>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="index"/> is not a column.</exception>
    public double TPValue(int index, double hypothesized = 0) =>
        TwoSidedStudentT(TStatistic(index, hypothesized), ResidualDegreesOfFreedom);

    /// <summary>Tests jointly that the chosen coefficients equal the given values, with the HAC covariance.</summary>
    /// <param name="indices">The columns restricted, distinct.</param>
    /// <param name="values">The hypothesized values, one per column.</param>
    /// <returns>The Wald statistic and its χ²(q) p-value.</returns>
    /// <exception cref="ArgumentException">The spans differ in length, are empty, or repeat a column.</exception>
    /// <exception cref="ArgumentOutOfRangeException">An index is not a column.</exception>
    /// <exception cref="InvalidOperationException">The restricted covariance block is singular.</exception>
    public WaldTestResult Wald(ReadOnlySpan<int> indices, ReadOnlySpan<double> values)
    {
        Preconditions.SameLength(values.Length, indices.Length, nameof(indices), nameof(values));
        Preconditions.CountAtLeast(indices.Length, 1, "to restrict", nameof(indices));
        var q = indices.Length;
        var k = Coefficients.Length;
        var block = new double[q * q];
        var diff = new double[q];
        for (var a = 0; a < q; a++)
        {
            CheckIndex(indices[a]);
            for (var b = 0; b < a; b++)
            {
                if (indices[b] == indices[a])
                {
                    throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                        $"indices must be distinct columns, column {indices[a]} appears twice."), nameof(indices));
                }
            }

            diff[a] = Coefficients[indices[a]] - values[a];
            for (var b = 0; b < q; b++)
            {
                block[(a * q) + b] = Covariance[(indices[a] * k) + indices[b]];
            }
        }

        var w = SymmetricMatrix.InverseQuadraticForm(block, q, diff)
            ?? throw new InvalidOperationException("The HAC covariance of the restricted coefficients is singular; no Wald test is possible.");
        return new WaldTestResult(w, q, ChiSquaredUpperTail(w, q));
    }

    internal static double TwoSidedStudentT(double t, int degreesOfFreedom) =>
        2.0 * StudentT.CDF(0.0, 1.0, degreesOfFreedom, -Math.Abs(t));

    internal static double ChiSquaredUpperTail(double statistic, int degreesOfFreedom) =>
        SpecialFunctions.GammaUpperRegularized(degreesOfFreedom / 2.0, statistic / 2.0);

    private void CheckIndex(int index)
    {
        if (index < 0 || index >= Coefficients.Length)
        {
            throw new ArgumentOutOfRangeException(nameof(index), index, string.Create(CultureInfo.InvariantCulture,
                $"index must name a column from 0 to {Coefficients.Length - 1}, was {index}."));
        }
    }
}
