namespace VolCast.IO.Tables;

/// <summary>One column of an output table: its name in every format, its unit, and how a row gives its value.</summary>
/// <typeparam name="TRow">The row type.</typeparam>
/// <param name="Name">The CSV column name and the JSON key, e.g. <c>rmse_vol</c>.</param>
/// <param name="Unit">What the number measures and in which unit, e.g. <c>decimal annualized volatility</c>.</param>
/// <param name="Value">The row's value in this column.</param>
public sealed record TableColumn<TRow>(string Name, string Unit, Func<TRow, TableCell> Value);
