using System.Collections.Immutable;

namespace VolCast.Core.Backtest;

/// <summary>
/// The answer to "which lookback should I use?" for one swept family: the in-sample best beside the walk-forward choice,
/// the lookbacks statistically tied with the best, and how steady the walk-forward choice was.
/// </summary>
/// <remarks>
/// The tie set is the model confidence set (Hansen, Lunde and Nason 2011) over the family's lookbacks on QLIKE, on the
/// dates where every lookback has a forecast, with a moving-block bootstrap whose block is at least the horizon. Unlike
/// a Diebold-Mariano test of each lookback against the best one picked on the same data, it accounts for that pick.
/// </remarks>
/// <param name="Family">The estimator family, for example <c>yang-zhang</c> or <c>ewma</c>.</param>
/// <param name="Candidates">The family's specs, in sweep order.</param>
/// <param name="CommonDates">Dates on which every lookback has a forecast and the target is positive.</param>
/// <param name="InSampleBest">The lowest mean QLIKE over those dates (IN-SAMPLE: picked after seeing them); null without dates.</param>
/// <param name="LastChoice">The walk-forward (adaptive) choice on the last date that had one; null when none was possible.</param>
/// <param name="TieSet">The lookbacks in the confidence set, in sweep order; empty when it could not be computed.</param>
/// <param name="TiePValues">Each candidate's confidence-set p-value (aligned with <paramref name="Candidates"/>); empty when not computed.</param>
/// <param name="Level">The confidence level of the tie set, 1 − α (0.90 by default).</param>
/// <param name="BlockLength">The bootstrap block length used, in dates.</param>
/// <param name="MostChosen">The walk-forward choice made on the most dates; null when none was made.</param>
/// <param name="MostChosenShare">Share of the dates with a choice on which <paramref name="MostChosen"/> was chosen; null likewise.</param>
/// <param name="ChangeCount">How often the walk-forward choice changed from one date to the next.</param>
/// <param name="DatesWithChoice">Dates with a walk-forward choice.</param>
/// <param name="Note">Why the tie set was not computed, or null.</param>
public sealed record LookbackAnswer(
    string Family,
    ImmutableArray<string> Candidates,
    int CommonDates,
    string? InSampleBest,
    string? LastChoice,
    ImmutableArray<string> TieSet,
    ImmutableArray<double> TiePValues,
    double Level,
    int BlockLength,
    string? MostChosen,
    double? MostChosenShare,
    int ChangeCount,
    int DatesWithChoice,
    string? Note)
{
    /// <summary>Gets a value indicating whether more than one lookback is tied with the best.</summary>
    public bool IsTied => TieSet.Length > 1;
}
