using System.CommandLine;
using VolCast.IO;
using VolCast.IO.Config;

namespace VolCast.Cli;

/// <summary>
/// The options that say how the input CSV files are written — <c>--date-format</c>, <c>--delimiter</c>, <c>--decimal</c> —
/// shared by every command that reads one. A value on the command line overrides the configuration's key of the same meaning.
/// </summary>
internal sealed class InputFormatOptions
{
    private InputFormatOptions()
    {
    }

    /// <summary>Gets --date-format.</summary>
    public Option<string?> DateFormat { get; } = new("--date-format")
    {
        Description = "How the files write dates, as a pattern such as MM/dd/yyyy, dd.MM.yyyy or yyyyMMdd (default ISO 8601 yyyy-MM-dd). A time part at midnight or a usual close is read as the date.",
    };

    /// <summary>Gets --delimiter.</summary>
    public Option<string?> Delimiter { get; } = new("--delimiter")
    {
        Description = "The character between cells: ',' (default), ';', tab or '|'. Files from European spreadsheets often use ';'.",
    };

    /// <summary>Gets --decimal.</summary>
    public Option<string?> Decimal { get; } = new("--decimal")
    {
        Description = "The decimal separator of numbers: '.' (default) or ','. A decimal comma needs another --delimiter, such as ';'.",
    };

    /// <summary>Creates the three options and adds them to a command.</summary>
    /// <param name="command">The command that reads CSV files.</param>
    /// <returns>The options, to read back after parsing.</returns>
    public static InputFormatOptions AddTo(Command command)
    {
        var options = new InputFormatOptions();
        command.Options.Add(options.DateFormat);
        command.Options.Add(options.Delimiter);
        command.Options.Add(options.Decimal);
        return options;
    }

    /// <summary>Resolves the form from the command line over the configuration's keys.</summary>
    /// <param name="parse">The parsed command line.</param>
    /// <param name="config">The form the configuration declares, or null when there is none.</param>
    /// <returns>The form.</returns>
    /// <exception cref="UsageException">A value is not accepted, or the delimiter and decimal separator clash.</exception>
    public CsvFormat Resolve(ParseResult parse, CsvFormat? config = null)
    {
        var dateFormat = parse.GetValue(DateFormat) ?? config?.DateFormat;
        var delimiter = parse.GetValue(Delimiter) ?? (config is null ? null : config.Delimiter.ToString());
        var point = parse.GetValue(Decimal) ?? (config is null ? null : config.DecimalSeparator.ToString());
        try
        {
            return CsvFormat.Parse(dateFormat, delimiter, point, key => "--" + key);
        }
        catch (ArgumentException ex)
        {
            throw new UsageException(ex.Message);
        }
    }

    /// <summary>Reads the configuration's form and implied tenor, or the defaults when there is no configuration.</summary>
    /// <param name="config">The configuration file, or null.</param>
    /// <returns>The form (null without a configuration) and the implied tenor in calendar days, or null.</returns>
    /// <exception cref="InputDataException">The configuration cannot be used.</exception>
    public static (CsvFormat? Format, int? ImpliedTenorDays) FromConfig(string? config) =>
        config is null ? (null, null) : BacktestConfigFile.ReadInputForm(config);

    /// <summary>Parses --implied-tenor over the configuration's impliedTenor.</summary>
    /// <param name="text">--implied-tenor as written, or null.</param>
    /// <param name="config">The configuration's value, or null.</param>
    /// <returns>The tenor in calendar days, or null when neither gives one.</returns>
    /// <exception cref="UsageException">The option is not a tenor.</exception>
    public static int? ImpliedTenorDays(string? text, int? config) =>
        text is null
            ? config
            : SettingLimits.TenorDaysOf(text, "--implied-tenor")
                ?? throw new UsageException($"--implied-tenor must be a number of calendar days followed by d, such as 30d, {SettingLimits.TenorDays} (was {BacktestOptions.Shown(text)}).");
}
