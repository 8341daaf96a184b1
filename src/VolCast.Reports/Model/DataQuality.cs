namespace VolCast.Reports.Model;

/// <summary>What the inputs looked like: rows read, dates scored, implied coverage, warnings.</summary>
/// <param name="RowsRead">Data rows read from the price file.</param>
/// <param name="ScoredDates">Dates with a forecast and a realized target above zero, i.e. scored.</param>
/// <param name="ImpliedCoverage">Share of the scored dates (<paramref name="ScoredDates"/>) with an implied volatility (0 to 1), or null without an implied file.</param>
/// <param name="Warnings">Every warning raised while reading and aligning, in order: things in the inputs that need a look.</param>
public sealed record DataQuality(int RowsRead, int ScoredDates, double? ImpliedCoverage, IReadOnlyList<string> Warnings)
{
    /// <summary>Gets statements about how the inputs were read (adjusted-close scaling, a default forecaster replaced on a close-only file, rows left out).</summary>
    public IReadOnlyList<string> Notes { get; init; } = [];

    /// <summary>Gets the routine notes every backtest has (the last windows not yet closed, forecast dates without a quote), counted apart from the warnings.</summary>
    public IReadOnlyList<string> RoutineNotes { get; init; } = [];

    /// <summary>Gets how many of the scored dates have an implied volatility (the numerator of <see cref="ImpliedCoverage"/>), or null without an implied file.</summary>
    public int? ScoredDatesWithImplied { get; init; }

    /// <summary>Gets what was done with suspect rows: warn, drop or stop.</summary>
    public string Suspect { get; init; } = "warn";

    /// <summary>Gets how many input rows were left out (listed in rejected-rows.csv).</summary>
    public int RowsLeftOut { get; init; }
}
