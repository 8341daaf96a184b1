namespace VolCast.IO.Workbook;

/// <summary>How a column of a results table is stored and shown in the workbook.</summary>
internal enum CellKind
{
    /// <summary>A number shown as the spreadsheet's general format, or text when the cell is not a number.</summary>
    General,

    /// <summary>An annualized volatility in decimal, stored as the number and shown as a percentage with two decimals.</summary>
    Volatility,

    /// <summary>A p-value, stored as the number and shown with three decimals.</summary>
    PValue,

    /// <summary>An ISO date (yyyy-MM-dd), stored as a spreadsheet date and shown as yyyy-mm-dd.</summary>
    Date,
}
