using System.Globalization;
using System.Text;

namespace VolCast.IO;

/// <summary>
/// Bad user data: names the file, and where they apply the line and column, and says what was expected.
/// The command line maps it to exit code 3.
/// </summary>
public sealed class InputDataException : Exception
{
    /// <summary>Creates an input-data error.</summary>
    /// <param name="file">The file the data came from, as the user gave it.</param>
    /// <param name="line">The 1-based line number, or null when the error concerns the whole file.</param>
    /// <param name="column">The column name, or null when the error concerns a whole row or file.</param>
    /// <param name="problem">What was wrong and what was expected, as a sentence.</param>
    public InputDataException(string file, int? line, string? column, string problem)
        : base(Format(file, line, column, problem))
    {
        File = file;
        Line = line;
        Column = column;
        Problem = problem;
    }

    /// <summary>Gets the file the data came from.</summary>
    public string File { get; }

    /// <summary>Gets the 1-based line number, if the error concerns one line.</summary>
    public int? Line { get; }

    /// <summary>Gets the column name, if the error concerns one cell.</summary>
    public string? Column { get; }

    /// <summary>Gets what was wrong and what was expected.</summary>
    public string Problem { get; }

    private static string Format(string file, int? line, string? column, string problem)
    {
        var sb = new StringBuilder(file);
        if (line is int l)
        {
            sb.Append(CultureInfo.InvariantCulture, $", line {l}");
        }

        if (column is not null)
        {
            // A column is named by its header text, which can be anything: shown cut to 40 characters.
            sb.Append(", column ").Append(Reading.ValueText.Quote(column));
        }

        return sb.Append(": ").Append(problem).ToString();
    }
}
