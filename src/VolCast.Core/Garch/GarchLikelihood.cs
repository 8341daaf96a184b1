using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics;

namespace VolCast.Core.Garch;

/// <summary>
/// Gaussian negative log-likelihood of a GARCH(1,1) / GJR-GARCH(1,1) model and its analytic gradient, on returns
/// that the caller has already scaled.
/// </summary>
/// <remarks>
/// Natural parameters are passed as a span of five, in the order μ, ω, α, γ, β (γ = 0 for plain GARCH).
/// The value is ½ Σ [ln 2π + ln σ²ₜ + ε²ₜ / σ²ₜ] summed from the first counted return; the gradient is found by
/// carrying dσ²ₜ/dθ through the recursion, so one pass over the data gives both.
/// </remarks>
internal sealed class GarchLikelihood
{
    /// <summary>Index of μ in a natural parameter vector.</summary>
    public const int Mu = 0;

    /// <summary>Index of ω in a natural parameter vector.</summary>
    public const int Omega = 1;

    /// <summary>Index of α in a natural parameter vector.</summary>
    public const int Alpha = 2;

    /// <summary>Index of γ in a natural parameter vector.</summary>
    public const int Gamma = 3;

    /// <summary>Index of β in a natural parameter vector.</summary>
    public const int Beta = 4;

    /// <summary>Number of natural parameters.</summary>
    public const int Count = 5;

    private const int LogBlock = 8;

    private static readonly double LogTwoPi = Math.Log(2 * Math.PI);

    private readonly double[] _y;
    private readonly int _length;
    private readonly VarianceStart _start;
    private readonly int _firstCounted;
    private readonly double _fixedStart;
    private readonly bool _alwaysLeverage;

    // The products of LogBlock consecutive σ²ₜ of the last evaluation (scratch: the logarithms are taken after the loop),
    // so an instance evaluates on one thread at a time; each fit makes its own.
    private readonly double[] _blockProducts;

    /// <summary>Creates the likelihood over <paramref name="length"/> scaled returns.</summary>
    /// <param name="scaledReturns">The returns divided by their scale.</param>
    /// <param name="length">How many of them to use.</param>
    /// <param name="start">How the recursion starts.</param>
    /// <param name="conditionOnFirstReturn">Whether the first return is left out of the sum.</param>
    /// <param name="fixedStartVariance">σ²₁ (scaled) for <see cref="VarianceStart.Fixed"/>.</param>
    /// <param name="leverage">Whether the γ derivative is carried even at γ = 0 (GJR); plain GARCH skips it.</param>
    public GarchLikelihood(double[] scaledReturns, int length, VarianceStart start, bool conditionOnFirstReturn, double fixedStartVariance = 0, bool leverage = true)
    {
        _alwaysLeverage = leverage;
        _fixedStart = fixedStartVariance;
        _y = scaledReturns;
        _length = length;
        _start = start;
        _firstCounted = conditionOnFirstReturn ? 1 : 0;
        _blockProducts = new double[(length / LogBlock) + 1];
    }

    /// <summary>Gets how many returns enter the likelihood sum.</summary>
    public int CountedReturns => _length - _firstCounted;

    /// <summary>Returns the negative log-likelihood and writes its gradient with respect to the natural parameters.</summary>
    public double Evaluate(ReadOnlySpan<double> q, Span<double> gradient)
    {
        var y = _y.AsSpan(0, _length);
        double mu = q[Mu], omega = q[Omega], alpha = q[Alpha], gamma = q[Gamma], beta = q[Beta];
        var persistence = alpha + beta + (0.5 * gamma);
        var (m, dmDmu) = ResidualMeanSquare(y, mu);
        double h, dMu, dOmega, dAlpha, dGamma, dBeta;
        if (_start == VarianceStart.Backcast)
        {
            h = omega + (persistence * m);
            dMu = persistence * dmDmu;
            dOmega = 1;
            dAlpha = m;
            dGamma = 0.5 * m;
            dBeta = m;
        }
        else
        {
            var fixedStart = _start == VarianceStart.Fixed;
            h = fixedStart ? _fixedStart : m;
            dMu = fixedStart ? 0 : dmDmu;
            dOmega = dAlpha = dGamma = dBeta = 0;
        }

        // Σ ln σ²ₜ is taken as ln of products of LogBlock terms: one logarithm per block instead of per day. The loop
        // only multiplies and stores each block's product; the logarithms are taken after it (NegativeLogLikelihoodSum),
        // because a call inside the loop made the JIT keep the loop's sums in memory, stored and reloaded every day
        // (every vector register is caller-saved on x64). Same products, same order, same bits.
        var blocks = _blockProducts;
        double ratioSum = 0, gMu = 0, product = 1;
        int inBlock = 0, block = 0;

        // The derivatives in ω, α, γ, β and their gradient sums are the four lanes of one vector: each lane does the
        // multiply and the add of the scalar recursion in the same order (the JIT never fuses them on its own), so the
        // bits are those of four scalar chains, in a quarter of the instructions.
        var d = Vector256.Create(dOmega, dAlpha, dGamma, dBeta);
        var g = Vector256<double>.Zero;
        var betas = Vector256.Create(beta);
        var last = y.Length - 1;

        // Without leverage (plain GARCH) the indicator is held at 0: α + γ·0 is α, and the γ lane is not used.
        var leverage = gamma != 0 || _alwaysLeverage ? 1.0 : 0.0;
        for (var t = 0; t < y.Length; t++)
        {
            var e = y[t] - mu;
            var e2 = e * e;
            if (t >= _firstCounted)
            {
                var inv = 1 / h;
                var ratio = e2 * inv;
                product *= h;
                if (++inBlock == LogBlock)
                {
                    blocks[block++] = product;
                    product = 1;
                    inBlock = 0;
                }

                ratioSum += ratio;
                var c = (1 - ratio) * inv;
                gMu += (c * dMu) - (2 * e * inv);
                g += Vector256.Create(c) * d;
            }

            if (t < last)
            {
                // 1 when e < 0, else 0, from the sign bit: a comparison compiles to a branch that the returns' random
                // signs mispredict half the time. (e = −0 gives 1, but then e² = 0 and nothing changes.)
                var negative = leverage * (BitConverter.DoubleToUInt64Bits(e) >> 63);
                var arch = alpha + (gamma * negative);
                dMu = (-2 * arch * e) + (beta * dMu);
                d = Vector256.Create(1, e2, negative * e2, h) + (betas * d);
                h = omega + (arch * e2) + (beta * h);
            }
        }

        gradient[Mu] = 0.5 * gMu;
        gradient[Omega] = 0.5 * g[0];
        gradient[Alpha] = 0.5 * g[1];
        gradient[Gamma] = 0.5 * g[2];
        gradient[Beta] = 0.5 * g[3];
        return 0.5 * (NegativeLogLikelihoodSum(ratioSum, block, product) + (CountedReturns * LogTwoPi));
    }

    /// <summary>Runs the variance filter and returns σ² of the day after the last return.</summary>
    public double NextVariance(ReadOnlySpan<double> q)
    {
        var y = _y.AsSpan(0, _length);
        double mu = q[Mu], omega = q[Omega], alpha = q[Alpha], gamma = q[Gamma], beta = q[Beta];
        double sumSq = 0;
        for (var i = 0; i < y.Length; i++)
        {
            var e = y[i] - mu;
            sumSq += e * e;
        }

        var m = sumSq / y.Length;
        var h = _start switch
        {
            VarianceStart.Backcast => omega + ((alpha + beta + (0.5 * gamma)) * m),
            VarianceStart.Fixed => _fixedStart,
            _ => m,
        };
        for (var t = 0; t < y.Length; t++)
        {
            var e = y[t] - mu;
            var arch = e < 0 ? alpha + gamma : alpha;
            h = omega + (arch * e * e) + (beta * h);
        }

        return h;
    }

    /// <summary>
    /// Writes each counted return's score (gradient of its own negative log-likelihood term) into row t of
    /// <paramref name="scores"/> (rows = returns, columns = natural parameters), for the outer-product matrix of a
    /// sandwich covariance. The start value's dependence on the whole window is carried as in <see cref="Evaluate"/>.
    /// </summary>
    public void Scores(ReadOnlySpan<double> q, double[,] scores)
    {
        var y = _y.AsSpan(0, _length);
        double mu = q[Mu], omega = q[Omega], alpha = q[Alpha], gamma = q[Gamma], beta = q[Beta];
        var persistence = alpha + beta + (0.5 * gamma);
        var (m, dmDmu) = ResidualMeanSquare(y, mu);
        var backcast = _start == VarianceStart.Backcast;
        var fixedStart = _start == VarianceStart.Fixed;
        var h = backcast ? omega + (persistence * m) : fixedStart ? _fixedStart : m;
        Span<double> d = stackalloc double[Count];
        d[Mu] = backcast ? persistence * dmDmu : fixedStart ? 0 : dmDmu;
        d[Omega] = backcast ? 1 : 0;
        d[Alpha] = backcast ? m : 0;
        d[Gamma] = backcast ? 0.5 * m : 0;
        d[Beta] = backcast ? m : 0;
        for (var t = 0; t < y.Length; t++)
        {
            var e = y[t] - mu;
            var e2 = e * e;
            if (t >= _firstCounted)
            {
                var inv = 1 / h;
                var c = 0.5 * (1 - (e2 * inv)) * inv;
                for (var j = 0; j < Count; j++)
                {
                    scores[t - _firstCounted, j] = c * d[j];
                }

                scores[t - _firstCounted, Mu] -= e * inv;
            }

            var negative = e < 0;
            var arch = negative ? alpha + gamma : alpha;
            d[Mu] = (-2 * arch * e) + (beta * d[Mu]);
            d[Omega] = 1 + (beta * d[Omega]);
            d[Alpha] = e2 + (beta * d[Alpha]);
            d[Gamma] = (negative ? e2 : 0) + (beta * d[Gamma]);
            d[Beta] = h + (beta * d[Beta]);
            h = omega + (arch * e2) + (beta * h);
        }
    }

    // Σ ln σ²ₜ + Σ ε²ₜ/σ²ₜ from the block products and the ratio sum of the loop. Its own method, so that no value of
    // the loop lives across a logarithm's call (the JIT would then keep it in memory inside the loop as well). The
    // scaled variances stay within a few orders of magnitude of one, so a block's product cannot under- or overflow at
    // any point the optimizer accepts (a non-finite value is rejected by the line search).
    [MethodImpl(MethodImplOptions.NoInlining)]
    private double NegativeLogLikelihoodSum(double ratioSum, int blocks, double lastProduct)
    {
        double logSum = 0;
        for (var b = 0; b < blocks; b++)
        {
            logSum += Math.Log(_blockProducts[b]);
        }

        return logSum + Math.Log(lastProduct) + ratioSum;
    }

    // The mean square of the residuals y − mu over the window (the variance start's base) and its derivative in mu.
    private static (double MeanSquare, double DerivativeInMu) ResidualMeanSquare(ReadOnlySpan<double> y, double mu)
    {
        double sumSq = 0, sum = 0;
        for (var i = 0; i < y.Length; i++)
        {
            var e = y[i] - mu;
            sumSq += e * e;
            sum += e;
        }

        return (sumSq / y.Length, -2 * sum / y.Length);
    }
}
