using System.Text.Json;
using VolCast.IO.Csv;

namespace VolCast.IO.Tables;

/// <summary>One value of an output table, typed so that every format writes it the same way.</summary>
/// <remarks>
/// A number that is null, NaN or infinite does not exist: an empty CSV cell and a JSON null. Text is a JSON string
/// and a neutralised CSV text cell (see <see cref="CsvText"/>).
/// </remarks>
public readonly record struct TableCell
{
    private TableCell(TableCellKind kind, string? text, double? number, bool? flag)
    {
        Kind = kind;
        TextValue = text;
        NumberValue = number;
        FlagValue = flag;
    }

    /// <summary>Gets what the cell holds.</summary>
    public TableCellKind Kind { get; }

    /// <summary>Gets the text of a text cell (null for other kinds).</summary>
    public string? TextValue { get; }

    /// <summary>Gets the number of a number or integer cell; null when it does not exist.</summary>
    public double? NumberValue { get; }

    /// <summary>Gets the value of a yes/no cell; null when it does not exist.</summary>
    public bool? FlagValue { get; }

    /// <summary>A text cell.</summary>
    /// <param name="text">The text.</param>
    /// <returns>The cell.</returns>
    public static TableCell Text(string text) => new(TableCellKind.Text, text ?? throw new ArgumentNullException(nameof(text)), null, null);

    /// <summary>A number cell; null, NaN and infinity mean "does not exist".</summary>
    /// <param name="value">The value.</param>
    /// <returns>The cell.</returns>
    public static TableCell Number(double? value) => new(TableCellKind.Number, null, value is double v && double.IsFinite(v) ? v : null, null);

    /// <summary>A count (a whole number); null means "does not exist".</summary>
    /// <param name="value">The value.</param>
    /// <returns>The cell.</returns>
    public static TableCell Count(int? value) => new(TableCellKind.Count, null, value, null);

    /// <summary>A yes/no cell; null means "does not exist".</summary>
    /// <param name="value">The value.</param>
    /// <returns>The cell.</returns>
    public static TableCell Flag(bool? value) => new(TableCellKind.Flag, null, null, value);

    /// <summary>The cell as written in a CSV file.</summary>
    /// <returns>The formatted cell.</returns>
    public string ToCsv() => Kind switch
    {
        TableCellKind.Text => CsvText.Text(TextValue!),
        TableCellKind.Count => CsvText.Integer(NumberValue is double v ? (int)v : null),
        TableCellKind.Flag => CsvText.Boolean(FlagValue),
        _ => CsvText.Number(NumberValue),
    };

    /// <summary>Writes <see cref="ToCsv"/>'s cell to <paramref name="writer"/>, numbers without making a string (the same characters).</summary>
    /// <param name="writer">Where to write.</param>
    internal void WriteCsv(TextWriter writer)
    {
        ArgumentNullException.ThrowIfNull(writer);
        switch (Kind)
        {
            case TableCellKind.Text:
                writer.Write(CsvText.Text(TextValue!));
                break;
            case TableCellKind.Count:
                CsvText.WriteInteger(writer, NumberValue is double v ? (int)v : null);
                break;
            case TableCellKind.Flag:
                writer.Write(CsvText.Boolean(FlagValue));
                break;
            default:
                CsvText.WriteNumber(writer, NumberValue);
                break;
        }
    }

    /// <summary>Writes the cell as a JSON property.</summary>
    /// <param name="json">The writer, inside an object.</param>
    /// <param name="name">The property name.</param>
    public void WriteJson(Utf8JsonWriter json, string name)
    {
        ArgumentNullException.ThrowIfNull(json);
        switch (Kind)
        {
            case TableCellKind.Text:
                json.WriteString(name, TextValue);
                break;
            case TableCellKind.Count when NumberValue is double v:
                json.WriteNumber(name, (int)v);
                break;
            case TableCellKind.Number when NumberValue is double v:
                json.WriteNumber(name, v);
                break;
            case TableCellKind.Flag when FlagValue is bool b:
                json.WriteBoolean(name, b);
                break;
            default:
                json.WriteNull(name);
                break;
        }
    }
}
