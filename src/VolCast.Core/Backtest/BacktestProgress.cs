namespace VolCast.Core.Backtest;

/// <summary>How far a backtest has come, for a progress display.</summary>
/// <param name="Stage">What is running, in plain words (for example "forecasting", "scoring").</param>
/// <param name="Done">Steps of this stage done.</param>
/// <param name="Total">Steps in this stage.</param>
public readonly record struct BacktestProgress(string Stage, int Done, int Total);
