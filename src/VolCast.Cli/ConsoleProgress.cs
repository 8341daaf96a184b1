using System.Globalization;
using VolCast.Core.Backtest;

namespace VolCast.Cli;

/// <summary>
/// Shows backtest progress: one line updated in place on a terminal, plain lines (one per stage and quarter) when the
/// output is redirected, so logs stay readable. Safe to call from the parallel forecasting loop.
/// </summary>
internal sealed class ConsoleProgress(TextWriter writer, bool interactive) : IProgress<BacktestProgress>
{
    private readonly Lock _gate = new();
    private string? _stage;
    private int _lastQuarter = -1;
    private bool _lineOpen;

    /// <summary>Gets a value indicating whether the writer is the process's own stdout on a terminal.</summary>
    public static bool IsTerminal(TextWriter writer) => ReferenceEquals(writer, Console.Out) && !Console.IsOutputRedirected;

    /// <inheritdoc/>
    public void Report(BacktestProgress value)
    {
        lock (_gate)
        {
            var text = string.Create(CultureInfo.InvariantCulture, $"{value.Stage}: {value.Done}/{value.Total}");
            if (interactive)
            {
                writer.Write("\r" + text.PadRight(40));
                _lineOpen = true;
                writer.Flush();
                return;
            }

            var quarter = value.Total == 0 ? 4 : 4 * value.Done / value.Total;
            if (value.Stage != _stage || quarter != _lastQuarter)
            {
                _stage = value.Stage;
                _lastQuarter = quarter;
                writer.WriteLine(text);
            }
        }
    }

    /// <summary>Ends the updating line, if one is open.</summary>
    public void Finish()
    {
        lock (_gate)
        {
            if (_lineOpen)
            {
                writer.WriteLine();
                _lineOpen = false;
            }
        }
    }
}
