namespace VolCast.Reports.Model;

/// <summary>One number in a metric table, its display format and its significance.</summary>
/// <param name="Value">The value, or null when it does not apply (shown as a dash).</param>
/// <param name="Format">A .NET numeric format string applied with the invariant culture, e.g. <c>0.000</c> or <c>0.0%</c>.</param>
/// <param name="Significance">The stars to show beside the value.</param>
internal sealed record MetricCell(double? Value, string Format = "0.0000", Significance Significance = Significance.None)
{
    /// <summary>The format of a p-value cell: three decimals, "&lt; 0.001" below 0.001 (<see cref="Core.Scoring.PValueText"/>).</summary>
    public const string PValue = "p-value";
}
