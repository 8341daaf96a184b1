using System.Collections.Immutable;
using VolCast.Core.Forecasters;

namespace VolCast.IO;

/// <summary>The result of loading a forecasts file: one user forecaster per column, as decimals.</summary>
/// <param name="Forecasters">One forecaster per value column, in file order, named <c>user:NAME</c>.</param>
/// <param name="Warnings">Warnings raised while loading, including the inferred unit when it was inferred.</param>
/// <param name="UnitUsed">The unit the values were read in: <see cref="ImpliedUnit.Percent"/> or <see cref="ImpliedUnit.Decimal"/>.</param>
/// <param name="UnitInferred">Whether the unit was inferred from the values rather than declared.</param>
/// <param name="Sha256">Lowercase hexadecimal SHA-256 of the file's bytes, for run.json.</param>
public sealed record UserForecastsLoad(
    ImmutableArray<UserForecaster> Forecasters,
    IReadOnlyList<InputWarning> Warnings,
    ImpliedUnit UnitUsed,
    bool UnitInferred,
    string Sha256);
