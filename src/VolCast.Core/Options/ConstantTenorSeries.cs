using System.Collections.Immutable;
using System.Globalization;

namespace VolCast.Core.Options;

/// <summary>
/// Turns recorded option quotes into a constant-tenor at-the-money implied-volatility series.
/// </summary>
/// <remarks>
/// <para>Per date and expiry (T = calendar days / 365):</para>
/// <list type="number">
/// <item>Forward. Where a call and a put are both quoted at a strike, the strike with the smallest |C − P|
/// (the one nearest the money) gives F = K + e^{rT}(C − P) by put-call parity; this needs no dividend
/// assumption. Otherwise F = S e^{(r − q)T}. Every quote of the expiry is then inverted with Black-76 on that
/// F, discounting at r, which is Black-Scholes-Merton when F comes from r and q.</item>
/// <item>At-the-money volatility. At each strike the out-of-the-money quote is used (puts below F, calls above,
/// the mean of both at F exactly), or the other type when the out-of-the-money one is missing or unsolved.
/// The volatility at F is linear in σ between the nearest strike at or below F and the nearest at or above.
/// With no solved strike on one side the expiry is rejected: there is no extrapolation in strike.</item>
/// </list>
/// <para>Per date: the tenor τ is placed between the two usable expiries around it and the value is linear in
/// total variance, σ² = [w₁ + (w₂ − w₁)(τ − T₁)/(T₂ − T₁)] / τ with w = σ²T; an expiry exactly at τ is used
/// as is. A tenor before the first or after the last usable expiry is refused for that date by default, or
/// extrapolated flat in σ and flagged. A date without a usable expiry gets no value, only a diagnostic.</para>
/// </remarks>
public static class ConstantTenorSeries
{
    /// <summary>Computes the series.</summary>
    /// <param name="quotes">The quotes, in any order.</param>
    /// <param name="options">The tenor and the extrapolation rule.</param>
    /// <returns>The series, the per-expiry at-the-money volatilities, the per-quote results and the diagnostics.</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    public static ConstantTenorResult Compute(IReadOnlyList<OptionQuote> quotes, ConstantTenorOptions options)
    {
        ArgumentNullException.ThrowIfNull(quotes);
        ArgumentNullException.ThrowIfNull(options);
        var byDate = new SortedDictionary<DateOnly, List<OptionQuote>>();
        foreach (var quote in quotes)
        {
            ArgumentNullException.ThrowIfNull(quote, nameof(quotes));
            if (!byDate.TryGetValue(quote.Date, out var list))
            {
                list = [];
                byDate.Add(quote.Date, list);
            }

            list.Add(quote);
        }

        var points = ImmutableArray.CreateBuilder<ConstantTenorPoint>();
        var expiries = ImmutableArray.CreateBuilder<ExpiryAtTheMoney>();
        var solved = ImmutableArray.CreateBuilder<QuoteImpliedVolatility>();
        var diagnostics = ImmutableArray.CreateBuilder<ChainDiagnostic>();
        foreach (var (date, dayQuotes) in byDate)
        {
            var usable = new List<ExpiryAtTheMoney>();
            foreach (var (expiry, expiryQuotes) in GroupUsableByExpiry(date, dayQuotes, diagnostics))
            {
                if (AtTheMoney(date, expiry, expiryQuotes, solved, diagnostics) is { } atm)
                {
                    usable.Add(atm);
                    expiries.Add(atm);
                }
            }

            if (Interpolate(date, usable, options, diagnostics) is { } point)
            {
                points.Add(point);
            }
        }

        return new ConstantTenorResult(options, points.ToImmutable(), expiries.ToImmutable(), solved.ToImmutable(), diagnostics.ToImmutable());
    }

    private static SortedDictionary<DateOnly, List<OptionQuote>> GroupUsableByExpiry(
        DateOnly date, List<OptionQuote> dayQuotes, ImmutableArray<ChainDiagnostic>.Builder diagnostics)
    {
        var byExpiry = new SortedDictionary<DateOnly, List<OptionQuote>>();
        var seen = new HashSet<(DateOnly, double, OptionType)>();
        foreach (var q in dayQuotes)
        {
            if (q.Expiry <= date)
            {
                diagnostics.Add(QuoteDiagnostic(q, DiagnosticReason.Expired, Invariant($"expiry {q.Expiry:yyyy-MM-dd} is on or before the quote date")));
                continue;
            }

            if (!Preconditions.IsPositive(q.Price) || !Preconditions.IsPositive(q.Underlying) || !Preconditions.IsPositive(q.Strike))
            {
                diagnostics.Add(QuoteDiagnostic(q, DiagnosticReason.NonPositiveInput,
                    Invariant($"price {q.Price}, underlying {q.Underlying} and strike {q.Strike} must all be above zero")));
                continue;
            }

            if (!seen.Add((q.Expiry, q.Strike, q.Type)))
            {
                diagnostics.Add(QuoteDiagnostic(q, DiagnosticReason.Duplicate, "an earlier quote has the same date, expiry, strike and type; the first is kept"));
                continue;
            }

            if (!byExpiry.TryGetValue(q.Expiry, out var list))
            {
                list = [];
                byExpiry.Add(q.Expiry, list);
            }

            list.Add(q);
        }

        return byExpiry;
    }

    private static ExpiryAtTheMoney? AtTheMoney(
        DateOnly date,
        DateOnly expiry,
        List<OptionQuote> quotes,
        ImmutableArray<QuoteImpliedVolatility>.Builder solved,
        ImmutableArray<ChainDiagnostic>.Builder diagnostics)
    {
        var first = quotes[0];
        foreach (var q in quotes)
        {
            if (q.Underlying != first.Underlying || q.Rate != first.Rate || q.DividendYield != first.DividendYield)
            {
                diagnostics.Add(new ChainDiagnostic(DiagnosticScope.Expiry, DiagnosticReason.InconsistentInputs, date, expiry, null, null, q.SourceLine,
                    Invariant($"underlying/rate/dividend yield {q.Underlying}/{q.Rate}/{q.DividendYield} differ from {first.Underlying}/{first.Rate}/{first.DividendYield} on an earlier quote of the same expiry")));
                return null;
            }
        }

        var years = DayCount.YearsAct365(date, expiry);
        var (forward, source) = Forward(quotes, years);

        // Strikes ascending; for each the volatility of the out-of-the-money side, else the other side.
        var byStrike = new SortedDictionary<double, (double? Call, double? Put)>();
        foreach (var q in quotes)
        {
            var result = ImpliedVolatility.FromBlack76(q.Type, q.Price, forward, q.Strike, years, q.Rate);
            solved.Add(new QuoteImpliedVolatility(q, forward, result));
            if (!result.IsSolved)
            {
                diagnostics.Add(QuoteDiagnostic(q, ReasonOf(result.Status),
                    Invariant($"no implied volatility for price {q.Price} ({result.Status}) with forward {forward:R}, T = {years:R} years")));
                continue;
            }

            byStrike.TryGetValue(q.Strike, out var pair);
            byStrike[q.Strike] = q.Type == OptionType.Call ? (result.Volatility, pair.Put) : (pair.Call, result.Volatility);
        }

        double? lowerStrike = null, lowerVol = null, upperStrike = null, upperVol = null;
        foreach (var (strike, pair) in byStrike)
        {
            double? vol = strike < forward ? pair.Put ?? pair.Call
                : strike > forward ? pair.Call ?? pair.Put
                : pair is { Call: double c, Put: double p } ? 0.5 * (c + p) : pair.Call ?? pair.Put;
            if (vol is null)
            {
                continue;
            }

            if (strike <= forward)
            {
                lowerStrike = strike;
                lowerVol = vol;
            }

            if (strike >= forward && upperStrike is null)
            {
                upperStrike = strike;
                upperVol = vol;
            }
        }

        if (lowerStrike is not double k1 || upperStrike is not double k2 || lowerVol is not double v1 || upperVol is not double v2)
        {
            diagnostics.Add(new ChainDiagnostic(DiagnosticScope.Expiry, DiagnosticReason.ForwardOutsideStrikes, date, expiry, null, null, null,
                Invariant($"no solved quote on {(lowerStrike is null ? "or below" : "or above")} the forward {forward:R}; {byStrike.Count} strikes solved")));
            return null;
        }

        var atm = k2 == k1 ? v1 : v1 + ((v2 - v1) * (forward - k1) / (k2 - k1));
        return new ExpiryAtTheMoney(date, expiry, years, forward, source, atm, k1, k2);
    }

    private static (double Forward, ForwardSource Source) Forward(List<OptionQuote> quotes, double years)
    {
        var first = quotes[0];
        var best = double.PositiveInfinity;
        var forward = 0.0;
        foreach (var call in quotes)
        {
            if (call.Type != OptionType.Call)
            {
                continue;
            }

            foreach (var put in quotes)
            {
                if (put.Type == OptionType.Put && put.Strike == call.Strike && Math.Abs(call.Price - put.Price) < best)
                {
                    best = Math.Abs(call.Price - put.Price);
                    forward = call.Strike + (Math.Exp(call.Rate * years) * (call.Price - put.Price));
                }
            }
        }

        return forward > 0 && double.IsFinite(forward)
            ? (forward, ForwardSource.PutCallParity)
            : (first.Underlying * Math.Exp((first.Rate - first.DividendYield) * years), ForwardSource.RateAndDividendYield);
    }

    private static ConstantTenorPoint? Interpolate(
        DateOnly date, List<ExpiryAtTheMoney> usable, ConstantTenorOptions options, ImmutableArray<ChainDiagnostic>.Builder diagnostics)
    {
        var tenor = DayCount.FormatTenor(options.TenorDays);
        if (usable.Count == 0)
        {
            diagnostics.Add(new ChainDiagnostic(DiagnosticScope.Date, DiagnosticReason.NoUsableExpiry, date, null, null, null, null,
                "no expiry of this date has an at-the-money volatility; see the quote and expiry rows"));
            return null;
        }

        var target = date.AddDays(options.TenorDays);
        var near = usable[0];
        var far = usable[^1];
        if (target < near.Expiry || target > far.Expiry)
        {
            var before = target < near.Expiry;
            var nearest = before ? near : far;
            var range = Invariant($"usable expiries run from {near.Expiry:yyyy-MM-dd} to {far.Expiry:yyyy-MM-dd} ({usable.Count}), the {tenor} point is {target:yyyy-MM-dd}");
            if (options.Extrapolation == TenorExtrapolation.Refuse)
            {
                diagnostics.Add(new ChainDiagnostic(DiagnosticScope.Date,
                    before ? DiagnosticReason.TenorBeforeFirstExpiry : DiagnosticReason.TenorAfterLastExpiry, date, null, null, null, null,
                    range + "; extrapolation refused"));
                return null;
            }

            diagnostics.Add(new ChainDiagnostic(DiagnosticScope.Date, DiagnosticReason.Extrapolated, date, nearest.Expiry, null, null, null,
                range + Invariant($"; flat volatility {nearest.Volatility:R} from {nearest.Expiry:yyyy-MM-dd} used")));
            return new ConstantTenorPoint(date, nearest.Volatility, nearest.Expiry, nearest.Expiry, IsExtrapolated: true);
        }

        for (var i = 0; i < usable.Count; i++)
        {
            if (usable[i].Expiry == target)
            {
                return new ConstantTenorPoint(date, usable[i].Volatility, target, target, IsExtrapolated: false);
            }

            if (usable[i].Expiry > target)
            {
                var lower = usable[i - 1];
                var upper = usable[i];
                var tau = options.TenorYears;
                var w = lower.TotalVariance + ((upper.TotalVariance - lower.TotalVariance) * (tau - lower.Years) / (upper.Years - lower.Years));
                if (upper.TotalVariance < lower.TotalVariance)
                {
                    diagnostics.Add(new ChainDiagnostic(DiagnosticScope.Date, DiagnosticReason.DecreasingTotalVariance, date, upper.Expiry, null, null, null,
                        Invariant($"total variance falls from {lower.TotalVariance:R} at {lower.Expiry:yyyy-MM-dd} to {upper.TotalVariance:R} at {upper.Expiry:yyyy-MM-dd}; value kept")));
                }

                return new ConstantTenorPoint(date, Math.Sqrt(w / tau), lower.Expiry, upper.Expiry, IsExtrapolated: false);
            }
        }

        throw new InvalidOperationException("unreachable: the target lies within the usable expiries");
    }

    private static DiagnosticReason ReasonOf(ImpliedVolatilityStatus status) => status switch
    {
        ImpliedVolatilityStatus.BelowIntrinsic => DiagnosticReason.BelowIntrinsic,
        ImpliedVolatilityStatus.AboveUpperBound => DiagnosticReason.AboveUpperBound,
        ImpliedVolatilityStatus.VegaTooSmall => DiagnosticReason.VegaTooSmall,
        ImpliedVolatilityStatus.Expired => DiagnosticReason.Expired,
        ImpliedVolatilityStatus.NonPositiveInput => DiagnosticReason.NonPositiveInput,
        _ => DiagnosticReason.NotConverged,
    };

    private static ChainDiagnostic QuoteDiagnostic(OptionQuote q, DiagnosticReason reason, string detail) =>
        new(DiagnosticScope.Quote, reason, q.Date, q.Expiry, q.Strike, q.Type, q.SourceLine == 0 ? null : q.SourceLine, detail);


    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
