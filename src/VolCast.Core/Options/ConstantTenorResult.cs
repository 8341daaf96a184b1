using System.Collections.Immutable;
using VolCast.Core.Data;

namespace VolCast.Core.Options;

/// <summary>A constant-tenor implied-volatility series with everything that went into it and everything left out.</summary>
/// <param name="Options">The settings used.</param>
/// <param name="Points">One value per date that had one, in date order.</param>
/// <param name="Expiries">The at-the-money volatility of every usable expiry, by date then expiry.</param>
/// <param name="Quotes">The implied volatility of every quote that reached the solver.</param>
/// <param name="Diagnostics">Every rejected or flagged quote, expiry and date.</param>
public sealed record ConstantTenorResult(
    ConstantTenorOptions Options,
    ImmutableArray<ConstantTenorPoint> Points,
    ImmutableArray<ExpiryAtTheMoney> Expiries,
    ImmutableArray<QuoteImpliedVolatility> Quotes,
    ImmutableArray<ChainDiagnostic> Diagnostics)
{
    /// <summary>Gets the number of diagnostics that reject a quote.</summary>
    public int RejectedQuoteCount => Count(DiagnosticScope.Quote);

    /// <summary>Gets the number of diagnostics that reject an expiry.</summary>
    public int RejectedExpiryCount => Count(DiagnosticScope.Expiry);

    /// <summary>Gets the number of dates left without a value.</summary>
    public int RejectedDateCount => Count(DiagnosticScope.Date);

    /// <summary>The series as an <see cref="ImpliedSeries"/>, the form the backtest reads.</summary>
    /// <returns>The series.</returns>
    /// <exception cref="InvalidOperationException">No date has a value.</exception>
    public ImpliedSeries ToImpliedSeries()
    {
        if (Points.IsEmpty)
        {
            throw new InvalidOperationException("No date has a constant-tenor value; see the diagnostics for why.");
        }

        var dates = new DateOnly[Points.Length];
        var vols = new double[Points.Length];
        for (var i = 0; i < Points.Length; i++)
        {
            dates[i] = Points[i].Date;
            vols[i] = Points[i].Volatility;
        }

        return new ImpliedSeries(dates, vols);
    }

    private int Count(DiagnosticScope scope)
    {
        var n = 0;
        foreach (var d in Diagnostics)
        {
            if (d.Scope == scope && !d.IsWarning)
            {
                n++;
            }
        }

        return n;
    }
}
