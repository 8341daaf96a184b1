using System.Globalization;
using VolCast.Core.Options;

namespace VolCast.IO.Csv;

/// <summary>Writes a constant-tenor implied-volatility series as CSV <c>date,iv</c>, the form the backtest reads.</summary>
/// <remarks>Dates are yyyy-MM-dd; iv is a decimal (0.20 = 20%) written with round-trip precision in the invariant
/// culture. The file is written through <see cref="AtomicFile"/>.</remarks>
public static class ConstantTenorCsv
{
    /// <summary>Writes the series.</summary>
    /// <param name="path">The output file.</param>
    /// <param name="points">The values, in date order.</param>
    /// <param name="overwrite">Whether an existing file may be replaced.</param>
    /// <param name="protectedInputs">Input files that must never be written over.</param>
    /// <exception cref="IOException">The file exists and <paramref name="overwrite"/> is false, or it is an input.</exception>
    public static void Write(string path, IReadOnlyList<ConstantTenorPoint> points, bool overwrite, IEnumerable<string>? protectedInputs = null)
    {
        ArgumentNullException.ThrowIfNull(points);
        AtomicFile.WriteText(path, writer => Write(writer, points), overwrite, protectedInputs);
    }

    /// <summary>Writes the series to <paramref name="writer"/>.</summary>
    /// <param name="writer">Where the CSV goes.</param>
    /// <param name="points">The values, in date order.</param>
    public static void Write(TextWriter writer, IReadOnlyList<ConstantTenorPoint> points)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(points);
        writer.WriteLine("date,iv");
        foreach (var p in points)
        {
            writer.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{p.Date:yyyy-MM-dd},{p.Volatility:R}"));
        }
    }
}
