namespace VolCast.Core.Garch;

/// <summary>
/// Maps between the optimizer's unconstrained coordinates θ and the natural scaled parameters (μ̃, ω̃, α, γ, β),
/// and carries gradients from the natural parameters back to θ (the chain rule of the reparameterization).
/// </summary>
/// <remarks>
/// θ = [μ̃ (when the mean is estimated), ln ω̃, logit φ, θ_a (, θ_g for GJR)]. GARCH: α = φ·σ(θ_a), β = φ·(1 − σ(θ_a)).
/// GJR: (α, γ/2, β) = φ·softmax(θ_a, θ_g, 0). A face of GJR holds one weight at exactly zero and shares φ between the
/// other two as GARCH does: γ = 0 gives α = φ·σ(θ_a), β = φ·(1 − σ(θ_a)) (GARCH(1,1) itself); α = 0 gives
/// γ/2 = φ·σ(θ_a), β = φ·(1 − σ(θ_a)).
/// </remarks>
internal sealed class GarchParameterMap
{
    private const double StartPersistence = 0.95;

    // Smallest share of the persistence a weight gets in a warm start (see ToUnconstrained).
    private const double WarmStartShareFloor = 0.01;
    private readonly int _offset;

    // Whether φ is shared between one weight and β (GARCH, or a face of GJR) rather than among α, γ/2 and β.
    private readonly bool _twoWeights;

    // The weight shared with β when _twoWeights (α, or γ on the α = 0 face), the one held at zero (or −1), and the
    // factor between the weight and its share of φ (2 for γ, whose share is γ/2).
    private readonly int _shared;
    private readonly int _zero;
    private readonly double _sharedFactor;

    /// <summary>Creates the map for one model shape.</summary>
    /// <param name="variant">The variance equation.</param>
    /// <param name="includeMean">Whether μ is estimated.</param>
    /// <param name="zeroWeight">For GJR, the weight held at exactly zero (<see cref="GarchLikelihood.Gamma"/> or
    /// <see cref="GarchLikelihood.Alpha"/>: a face of the constraint set), or null for the full model.</param>
    public GarchParameterMap(GarchVariant variant, bool includeMean, int? zeroWeight = null)
    {
        if (zeroWeight is int z && (variant != GarchVariant.GjrGarch || (z != GarchLikelihood.Gamma && z != GarchLikelihood.Alpha)))
        {
            throw new ArgumentOutOfRangeException(nameof(zeroWeight), zeroWeight, "A face holds gamma or alpha of a GJR model at zero.");
        }

        Variant = variant;
        IncludeMean = includeMean;
        ZeroWeight = zeroWeight;
        _offset = includeMean ? 1 : 0;
        _twoWeights = variant != GarchVariant.GjrGarch || zeroWeight is not null;
        _zero = zeroWeight ?? -1;
        _shared = zeroWeight == GarchLikelihood.Alpha ? GarchLikelihood.Gamma : GarchLikelihood.Alpha;
        _sharedFactor = _shared == GarchLikelihood.Gamma ? 2 : 1;
        Dimension = _offset + (_twoWeights ? 3 : 4);
        if (zeroWeight is not null)
        {
            ActiveNatural = includeMean
                ? [GarchLikelihood.Mu, GarchLikelihood.Omega, _shared, GarchLikelihood.Beta]
                : [GarchLikelihood.Omega, _shared, GarchLikelihood.Beta];
            return;
        }

        ActiveNatural = (includeMean, variant) switch
        {
            (true, GarchVariant.GjrGarch) => [GarchLikelihood.Mu, GarchLikelihood.Omega, GarchLikelihood.Alpha, GarchLikelihood.Gamma, GarchLikelihood.Beta],
            (false, GarchVariant.GjrGarch) => [GarchLikelihood.Omega, GarchLikelihood.Alpha, GarchLikelihood.Gamma, GarchLikelihood.Beta],
            (true, _) => [GarchLikelihood.Mu, GarchLikelihood.Omega, GarchLikelihood.Alpha, GarchLikelihood.Beta],
            (false, _) => [GarchLikelihood.Omega, GarchLikelihood.Alpha, GarchLikelihood.Beta],
        };
    }

    /// <summary>Gets the variance equation.</summary>
    public GarchVariant Variant { get; }

    /// <summary>Gets a value indicating whether μ is estimated.</summary>
    public bool IncludeMean { get; }

    /// <summary>Gets the weight held at zero on a face of GJR, or null for the full model.</summary>
    public int? ZeroWeight { get; }

    /// <summary>Gets the number of unconstrained coordinates.</summary>
    public int Dimension { get; }

    /// <summary>Gets the indices of the natural parameters that are estimated.</summary>
    public int[] ActiveNatural { get; }

    /// <summary>Returns the default cold start: μ̃ = sample mean (or 0), φ = 0.95, long-run variance = 1 (the scaled sample variance), α = 0.05 (GJR: α = 0.03, γ = 0.06).</summary>
    public double[] DefaultStart(double scaledMean)
    {
        var theta = new double[Dimension];
        if (IncludeMean)
        {
            theta[0] = scaledMean;
        }

        theta[_offset] = Math.Log(1 - StartPersistence);
        theta[_offset + 1] = Logit(StartPersistence);
        if (!_twoWeights)
        {
            theta[_offset + 2] = Math.Log(0.03 / 0.89);
            theta[_offset + 3] = Math.Log(0.03 / 0.89);
        }
        else
        {
            theta[_offset + 2] = Logit(0.05 / StartPersistence);
        }

        return theta;
    }

    /// <summary>
    /// Returns θ for parameters in original units, given the scale the returns were divided by. A weight (α, γ/2, β) below
    /// 1% of the persistence is raised to it, so that a start from a fit that ended on a constraint can leave it.
    /// </summary>
    public double[] ToUnconstrained(GarchParameters p, double scale)
    {
        var theta = new double[Dimension];
        if (IncludeMean)
        {
            theta[0] = p.Mu / scale;
        }

        theta[_offset] = Math.Log(p.Omega / (scale * scale));
        var gamma = Variant == GarchVariant.GjrGarch && _zero != GarchLikelihood.Gamma ? p.Gamma : 0;
        var alpha = _zero == GarchLikelihood.Alpha ? 0 : p.Alpha;
        var persistence = Math.Clamp(alpha + p.Beta + (0.5 * gamma), 1e-4, 1 - 1e-8);
        theta[_offset + 1] = Logit(persistence);
        // A weight at (or near) zero would map to a coordinate far out on the flat tail of the logistic / softmax,
        // where its gradient vanishes: the fit could never move it back inside, however much the likelihood wanted it.
        var floor = WarmStartShareFloor * persistence;
        var a = Math.Max(_shared == GarchLikelihood.Gamma ? 0.5 * gamma : alpha, floor);
        var b = Math.Max(p.Beta, floor);
        if (!_twoWeights)
        {
            var g = Math.Max(0.5 * gamma, floor);
            theta[_offset + 2] = Math.Log(a / b);
            theta[_offset + 3] = Math.Log(g / b);
        }
        else
        {
            theta[_offset + 2] = Math.Log(a / b);
        }

        return theta;
    }

    /// <summary>Writes the natural scaled parameters (μ̃, ω̃, α, γ, β) for θ.</summary>
    public void ToNatural(ReadOnlySpan<double> theta, Span<double> q)
    {
        q[GarchLikelihood.Mu] = IncludeMean ? theta[0] : 0;
        q[GarchLikelihood.Omega] = Math.Exp(theta[_offset]);
        var persistence = Logistic(theta[_offset + 1]);
        if (!_twoWeights)
        {
            Softmax(theta[_offset + 2], theta[_offset + 3], out var wa, out var wg, out var wb);
            q[GarchLikelihood.Alpha] = persistence * wa;
            q[GarchLikelihood.Gamma] = 2 * persistence * wg;
            q[GarchLikelihood.Beta] = persistence * wb;
        }
        else
        {
            var share = Logistic(theta[_offset + 2]);
            q[GarchLikelihood.Alpha] = 0;
            q[GarchLikelihood.Gamma] = 0;
            q[_shared] = _sharedFactor * persistence * share;
            q[GarchLikelihood.Beta] = persistence * (1 - share);
        }
    }

    /// <summary>Writes dL/dθ given dL/dq at the natural parameters q that θ maps to.</summary>
    public void ChainGradient(ReadOnlySpan<double> theta, ReadOnlySpan<double> q, ReadOnlySpan<double> gq, Span<double> gTheta)
    {
        if (IncludeMean)
        {
            gTheta[0] = gq[GarchLikelihood.Mu];
        }

        gTheta[_offset] = gq[GarchLikelihood.Omega] * q[GarchLikelihood.Omega];
        var persistence = Logistic(theta[_offset + 1]);
        var dPersistence = persistence * (1 - persistence);
        if (!_twoWeights)
        {
            Softmax(theta[_offset + 2], theta[_offset + 3], out var wa, out var wg, out var wb);
            gTheta[_offset + 1] = ((gq[GarchLikelihood.Alpha] * wa) + (gq[GarchLikelihood.Gamma] * 2 * wg) + (gq[GarchLikelihood.Beta] * wb)) * dPersistence;
            var va = gq[GarchLikelihood.Alpha] * persistence;
            var vg = gq[GarchLikelihood.Gamma] * 2 * persistence;
            var vb = gq[GarchLikelihood.Beta] * persistence;
            var weighted = (va * wa) + (vg * wg) + (vb * wb);
            gTheta[_offset + 2] = wa * (va - weighted);
            gTheta[_offset + 3] = wg * (vg - weighted);
        }
        else
        {
            var share = Logistic(theta[_offset + 2]);
            var gShared = _sharedFactor * gq[_shared];
            gTheta[_offset + 1] = ((gShared * share) + (gq[GarchLikelihood.Beta] * (1 - share))) * dPersistence;
            gTheta[_offset + 2] = (gShared - gq[GarchLikelihood.Beta]) * persistence * share * (1 - share);
        }
    }

    private static double Logistic(double x) => x >= 0 ? 1 / (1 + Math.Exp(-x)) : Math.Exp(x) / (1 + Math.Exp(x));

    private static double Logit(double p) => Math.Log(p / (1 - p));

    private static void Softmax(double a, double g, out double wa, out double wg, out double wb)
    {
        var top = Math.Max(0, Math.Max(a, g));
        var ea = Math.Exp(a - top);
        var eg = Math.Exp(g - top);
        var eb = Math.Exp(-top);
        var total = ea + eg + eb;
        wa = ea / total;
        wg = eg / total;
        wb = eb / total;
    }
}
