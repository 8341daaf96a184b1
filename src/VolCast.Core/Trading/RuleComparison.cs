namespace VolCast.Core.Trading;

/// <summary>The mean daily P&amp;L difference of two rules' ladders (first − second), net of costs, with its Newey-West test (lag = the horizon).</summary>
/// <param name="First">The first rule.</param>
/// <param name="Second">The rule it is measured against.</param>
/// <param name="DifferencePerYear">Mean daily difference × trading days per year, vol points.</param>
/// <param name="Test">The test of a zero mean daily difference.</param>
public sealed record RuleComparison(TradingRule First, TradingRule Second, double DifferencePerYear, NeweyWestMeanTest Test);
