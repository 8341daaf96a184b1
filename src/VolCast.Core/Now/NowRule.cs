namespace VolCast.Core.Now;

/// <summary>What one of the rule's variants says on the last date.</summary>
/// <param name="Rule">The rule: <c>always-sell</c>, <c>proposed</c>, <c>current</c>, <c>historical</c> or <c>walk-forward threshold</c>.</param>
/// <param name="Forecaster">The forecast the rule compares implied with, or null for always-sell.</param>
/// <param name="Forecast">That forecast on the last date (decimal), or null.</param>
/// <param name="ImpliedMinusForecast">Implied minus the forecast (decimal), or null.</param>
/// <param name="Signal"><c>sell</c>, <c>buy</c> or <c>none</c> (no signal, or no implied quote or forecast today).</param>
/// <param name="MarginVolPoints">
/// How far the gap is beyond the threshold, in vol points: |implied − forecast| − threshold; positive when the rule
/// fires, negative by how much it falls short. Null for always-sell and without a gap.
/// </param>
/// <param name="Note">Why there is no signal when that is not plain from the numbers (buying is off, no quote), or null.</param>
public sealed record NowRule(string Rule, string? Forecaster, double? Forecast, double? ImpliedMinusForecast, string Signal, double? MarginVolPoints, string? Note)
{
    /// <summary>Gets the threshold the rule uses today, in vol points: the configured one, or for the walk-forward threshold the one it chose from the trades closed by the last date; null for always-sell.</summary>
    public double? ThresholdVolPoints { get; init; }
}
