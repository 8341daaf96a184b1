namespace VolCast.Core.Trading;

/// <summary>The daily paths of an every-signal ladder (vol points, each trade weighted 1/h).</summary>
/// <param name="Net">Net path marked at the quoted implied.</param>
/// <param name="Gross">The same without costs.</param>
/// <param name="EntryVolNet">Net path marked at the entry implied (empty when not asked for).</param>
/// <param name="EntryVolGross">The same without costs.</param>
/// <param name="Trades">Trades in the ladder.</param>
/// <param name="DaysInMarket">Days on which a trade was open.</param>
/// <param name="WeightedCarry">Σ weight·e^{rT} over the trades: the ladder's half-spread charge per vol point of spread.</param>
internal sealed record Ladder(double[] Net, double[] Gross, double[] EntryVolNet, double[] EntryVolGross, int Trades, int DaysInMarket, double WeightedCarry);
