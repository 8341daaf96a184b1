using System.Globalization;
using System.Text;

namespace VolCast.IO;

/// <summary>
/// Bad user data: names the file, and where they apply the line and column, and says what was expected.
/// The command line maps it to exit code 3.
/// </summary>
public sealed partial class InputDataException : Exception
{
    /// <summary>Creates an input-data error.</summary>
    /// <param name="file">The file the data came from, as the user gave it.</param>
    /// <param name="line">The 1-based line number, or null when the error concerns the whole file.</param>
    /// <param name="column">The column name, or null when the error concerns a whole row or file.</param>
    /// <param name="problem">What was wrong and what was expected, as a sentence.</param>
    public InputDataException(string file, int? line, string? column, string problem)
        : this(file, line, column, problem, setting: false)
    {
    }

    private InputDataException(string file, int? line, string? name, string problem, bool setting)
        : base(Format(file, line, name, Plain(problem), setting))
    {
        File = file;
        Line = line;
        Column = name;
        Problem = Plain(problem);
        IsSetting = setting;
    }

    /// <summary>Gets a value indicating whether <see cref="Column"/> names a setting of a configuration file rather than a column of a table.</summary>
    public bool IsSetting { get; }

    /// <summary>Gets the file the data came from.</summary>
    public string File { get; }

    /// <summary>Gets the 1-based line number, if the error concerns one line.</summary>
    public int? Line { get; }

    /// <summary>Gets the column name, if the error concerns one cell.</summary>
    public string? Column { get; }

    /// <summary>Gets what was wrong and what was expected.</summary>
    public string Problem { get; }

    /// <summary>Creates the error of a configuration file: it names the setting ("setting 'forecasters'"), not a column.</summary>
    /// <param name="file">The configuration file, as the user gave it.</param>
    /// <param name="line">The 1-based line number, or null when not known.</param>
    /// <param name="setting">The setting's name as written in the file (for example <c>forecasters</c> or <c>mcs.alpha</c>), or null for the whole file.</param>
    /// <param name="problem">What was wrong and what was expected, as a sentence.</param>
    /// <returns>The exception.</returns>
    public static InputDataException Setting(string file, int? line, string? setting, string problem) => new(file, line, setting, problem, setting: true);

    /// <summary>Drops the parameter name .NET appends to argument errors ("(Parameter 'spec')"): users never see it.</summary>
    private static string Plain(string problem) => ParameterSuffix().Replace(problem, string.Empty);

    [System.Text.RegularExpressions.GeneratedRegex(@"\s*\(Parameter '[^']*'\)", System.Text.RegularExpressions.RegexOptions.CultureInvariant)]
    private static partial System.Text.RegularExpressions.Regex ParameterSuffix();

    private static string Format(string file, int? line, string? column, string problem, bool setting)
    {
        var sb = new StringBuilder(file);
        if (line is int l)
        {
            sb.Append(CultureInfo.InvariantCulture, $", line {l}");
        }

        if (column is not null)
        {
            // A column is named by its header text, which can be anything: shown cut to 40 characters.
            sb.Append(setting ? ", setting " : ", column ").Append(Reading.ValueText.Quote(column));
        }

        return sb.Append(": ").Append(problem).ToString();
    }
}
