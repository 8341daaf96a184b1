using System.Globalization;

namespace VolCast.Cli.Batch;

/// <summary>Shows a batch's progress: one line updated in place on a terminal, one plain line per finished asset when redirected.</summary>
internal sealed class BatchConsoleProgress(TextWriter writer, bool interactive) : IProgress<BatchProgress>
{
    private readonly Lock _gate = new();
    private bool _lineOpen;

    /// <inheritdoc/>
    public void Report(BatchProgress value)
    {
        var eta = value.EstimatedRemaining is TimeSpan t ? Format(t) : "estimating";
        var text = string.Create(
            CultureInfo.InvariantCulture,
            $"batch: {value.Done} done ({value.Reused} kept from an earlier run), {value.Failed} failed, {value.Remaining} remaining of {value.Total}; about {eta} left");
        lock (_gate)
        {
            if (interactive)
            {
                writer.Write("\r" + text.PadRight(100));
                _lineOpen = true;
            }
            else
            {
                writer.WriteLine(text + " (last: " + value.Last + ")");
            }

            writer.Flush();
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

    private static string Format(TimeSpan t) =>
        t.TotalHours >= 1 ? t.ToString(@"h\:mm\:ss", CultureInfo.InvariantCulture) : t.ToString(@"m\:ss", CultureInfo.InvariantCulture);
}
