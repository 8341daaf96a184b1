namespace VolCast.Core.Scoring;

/// <summary>Counts, per forecaster, the names (assets) where it beats implied significantly, correcting for testing many names at once.</summary>
/// <remarks>
/// For each forecaster, the two-sided Diebold-Mariano p-values on QLIKE against implied, one per name that has the
/// test, are adjusted together with Benjamini-Hochberg (<see cref="FalseDiscoveryRate.BenjaminiHochberg(IReadOnlyList{double})"/>).
/// A name counts as a win when the statistic is negative (the forecaster's loss is lower) and the adjusted p-value
/// is at most the level; the false discovery rate is then controlled at that level across the names for that
/// forecaster (not across forecasters).
/// </remarks>
public static class VersusImpliedFdr
{
    /// <summary>The default level q of the false discovery rate.</summary>
    public const double DefaultLevel = 0.05;

    /// <summary>Counts one row per forecaster, in the order forecasters first appear among the tests.</summary>
    /// <param name="tests">Every name's Diebold-Mariano test on QLIKE of a forecaster against implied: the forecaster's spec, the statistic (negative = the forecaster's loss is lower) and the two-sided p-value.</param>
    /// <param name="level">The level q, strictly between 0 and 1.</param>
    /// <returns>The rows of the table.</returns>
    /// <exception cref="ArgumentNullException"><paramref name="tests"/> is null.</exception>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="level"/> is not strictly between 0 and 1.</exception>
    public static IReadOnlyList<VersusImpliedFdrRow> Count(IEnumerable<(string Spec, double Statistic, double PValue)> tests, double level = DefaultLevel)
    {
        ArgumentNullException.ThrowIfNull(tests);
        if (!(level > 0 && level < 1))
        {
            throw new ArgumentOutOfRangeException(nameof(level), level, "the false discovery rate level must be strictly between 0 and 1.");
        }

        var bySpec = new Dictionary<string, List<(double Statistic, double PValue)>>(StringComparer.Ordinal);
        var order = new List<string>();
        foreach (var test in tests)
        {
            if (!bySpec.TryGetValue(test.Spec, out var list))
            {
                list = [];
                bySpec[test.Spec] = list;
                order.Add(test.Spec);
            }

            list.Add((test.Statistic, test.PValue));
        }

        var table = new List<VersusImpliedFdrRow>(order.Count);
        foreach (var spec in order)
        {
            var forSpec = bySpec[spec];
            var p = new double[forSpec.Count];
            for (var i = 0; i < p.Length; i++)
            {
                p[i] = forSpec[i].PValue;
            }

            var adjusted = FalseDiscoveryRate.BenjaminiHochberg(p);
            int raw = 0, wins = 0, losses = 0;
            for (var i = 0; i < p.Length; i++)
            {
                var negative = forSpec[i].Statistic < 0;
                raw += negative && p[i] <= level ? 1 : 0;
                wins += negative && adjusted[i] <= level ? 1 : 0;
                losses += forSpec[i].Statistic > 0 && adjusted[i] <= level ? 1 : 0;
            }

            table.Add(new VersusImpliedFdrRow(spec, forSpec.Count, raw, wins, losses));
        }

        return table;
    }
}
