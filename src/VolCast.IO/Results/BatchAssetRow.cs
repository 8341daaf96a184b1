using System.Collections.Immutable;

namespace VolCast.IO.Results;

/// <summary>One asset's line in a batch's summary: all the batch keeps of a backtest once its results folder is written.</summary>
/// <remarks>
/// Volatilities are decimals. Diebold-Mariano statistics follow d_t = L(forecaster) − L(implied), so negative favours
/// the forecaster. A failed asset has <see cref="Error"/> set and no scores.
/// </remarks>
public sealed record BatchAssetRow
{
    /// <summary>Gets the asset's name: the price file's name without <c>.csv</c>.</summary>
    public required string Name { get; init; }

    /// <summary>Gets a value indicating whether the asset's backtest finished and its results folder is complete.</summary>
    public required bool Succeeded { get; init; }

    /// <summary>Gets a value indicating whether an implied file was found for the asset; without one forecasters are ranked among themselves.</summary>
    public required bool HasImplied { get; init; }

    /// <summary>Gets the number of forecast dates with a realized target; null when the asset failed.</summary>
    public int? Dates { get; init; }

    /// <summary>Gets the forecaster (implied excluded) with the lowest mean QLIKE over its own scored dates; null when none could be scored.</summary>
    public string? BestQlike { get; init; }

    /// <summary>Gets the best forecaster's mean QLIKE.</summary>
    public double? BestQlikeValue { get; init; }

    /// <summary>Gets the best forecaster's DM statistic on QLIKE against implied; null without implied.</summary>
    public double? BestDmStatistic { get; init; }

    /// <summary>Gets the two-sided p-value of <see cref="BestDmStatistic"/>.</summary>
    public double? BestDmPValue { get; init; }

    /// <summary>Gets the members of the model confidence set on QLIKE at the configured level.</summary>
    public ImmutableArray<string> McsMembers { get; init; } = [];

    /// <summary>Gets the adaptive lookback choices, one per swept family.</summary>
    public ImmutableArray<BatchLookback> Lookbacks { get; init; } = [];

    /// <summary>Gets the mean of implied minus realized volatility over dates with both (the volatility premium, decimal); null without implied.</summary>
    public double? MeanPremium { get; init; }

    /// <summary>Gets every forecaster's DM test on QLIKE against implied, for the cross-asset false-discovery-rate table.</summary>
    public ImmutableArray<BatchForecasterTest> VersusImplied { get; init; } = [];

    /// <summary>Gets why the asset failed, or null.</summary>
    public string? Error { get; init; }
}
