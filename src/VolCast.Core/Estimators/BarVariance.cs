namespace VolCast.Core.Estimators;

/// <summary>The daily variance term of each range-based estimator for one bar, before averaging over a window.</summary>
/// <remarks>
/// With u = ln(H/O), d = ln(L/O), c = ln(C/O) and R = ln(H/L) = u − d (docs/methods.md#parkinson to #rogers-satchell):
/// Parkinson R²/(4 ln 2); Garman-Klass 0.5 R² − (2 ln 2 − 1) c²; Rogers-Satchell u(u − c) + d(d − c).
/// All three are per trading day and not annualized. On a valid bar (L ≤ min(O, C), H ≥ max(O, C)) none is
/// negative, and a bar with O = H = L = C gives exactly zero.
/// </remarks>
internal static class BarVariance
{
    /// <summary>1 / (4 ln 2), Parkinson's scale for the squared log range.</summary>
    public const double ParkinsonScale = 0.36067376022224085;

    /// <summary>2 ln 2 − 1, Garman and Klass's weight on the squared open-to-close return.</summary>
    public const double GarmanKlassCloseWeight = 0.3862943611198906;

    /// <summary>Returns Parkinson's daily variance term ln(H/L)² / (4 ln 2).</summary>
    /// <param name="high">The day's high, positive.</param>
    /// <param name="low">The day's low, positive and not above the high.</param>
    /// <returns>The daily variance term.</returns>
    public static double Parkinson(double high, double low)
    {
        var range = Math.Log(high / low);
        return ParkinsonScale * range * range;
    }

    /// <summary>Returns Garman and Klass's daily variance term 0.5 ln(H/L)² − (2 ln 2 − 1) ln(C/O)².</summary>
    /// <param name="open">The day's open.</param>
    /// <param name="high">The day's high.</param>
    /// <param name="low">The day's low.</param>
    /// <param name="close">The day's close.</param>
    /// <returns>The daily variance term.</returns>
    public static double GarmanKlass(double open, double high, double low, double close) =>
        GarmanKlassFromLogs(Math.Log(high / open), Math.Log(low / open), Math.Log(close / open));

    /// <summary>Returns Rogers and Satchell's daily variance term ln(H/C) ln(H/O) + ln(L/C) ln(L/O).</summary>
    /// <param name="open">The day's open.</param>
    /// <param name="high">The day's high.</param>
    /// <param name="low">The day's low.</param>
    /// <param name="close">The day's close.</param>
    /// <returns>The daily variance term.</returns>
    public static double RogersSatchell(double open, double high, double low, double close) =>
        RogersSatchellFromLogs(Math.Log(high / open), Math.Log(low / open), Math.Log(close / open));

    /// <summary>Parkinson's term from u = ln(H/O) and d = ln(L/O).</summary>
    internal static double ParkinsonFromLogs(double u, double d)
    {
        var range = u - d;
        return ParkinsonScale * range * range;
    }

    /// <summary>Garman and Klass's term from u = ln(H/O), d = ln(L/O), c = ln(C/O).</summary>
    internal static double GarmanKlassFromLogs(double u, double d, double c)
    {
        var range = u - d;
        return (0.5 * range * range) - (GarmanKlassCloseWeight * c * c);
    }

    /// <summary>Rogers and Satchell's term from u = ln(H/O), d = ln(L/O), c = ln(C/O).</summary>
    internal static double RogersSatchellFromLogs(double u, double d, double c) => (u * (u - c)) + (d * (d - c));
}
