namespace VolCast.Core.Trading;

/// <summary>
/// The threshold the walk-forward rule would use on a date: the sweep threshold whose every-signal trades (proposed
/// forecaster, configured sides) that had closed by that date earned the most in total net P&amp;L (see
/// <see cref="TradingRule.WalkForwardThreshold"/>). Only trades whose window had closed by the date count, so the choice
/// uses no later data.
/// </summary>
/// <param name="Date">The date of the choice (the last forecast date).</param>
/// <param name="Threshold">The threshold chosen (decimal volatility; 0.02 = two vol points).</param>
/// <param name="TradesClosed">Firing dates whose trade had closed by <paramref name="Date"/>: the trades the choice was made from.</param>
/// <param name="Fallback">True when no sweep threshold earned more than the one nearest the configured threshold (none had closed, or a tie), which is then used.</param>
public sealed record WalkForwardChoice(DateOnly Date, double Threshold, int TradesClosed, bool Fallback);
