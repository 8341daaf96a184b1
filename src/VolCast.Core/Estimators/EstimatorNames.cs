using System.Collections.ObjectModel;
using System.Globalization;

namespace VolCast.Core.Estimators;

/// <summary>The command-line and configuration names of the estimators, and parsing of them.</summary>
/// <remarks>Names are lower case with hyphens (<c>close-to-close</c>, <c>yang-zhang</c>); parsing ignores case.</remarks>
public static class EstimatorNames
{
    /// <summary>The shortest window any estimator accepts: a sample variance needs two observations.</summary>
    internal const int MinimumWindow = 2;

    private static readonly string[] Names = ["close-to-close", "parkinson", "garman-klass", "rogers-satchell", "yang-zhang"];

    /// <summary>Gets every estimator name, in the order of <see cref="Estimator"/>.</summary>
    public static IReadOnlyList<string> All { get; } = new ReadOnlyCollection<string>(Names);

    /// <summary>Returns the name of an estimator, for example <c>garman-klass</c>.</summary>
    /// <param name="e">The estimator.</param>
    /// <returns>The lower-case hyphenated name.</returns>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="e"/> is not a defined <see cref="Estimator"/>.</exception>
    public static string Name(Estimator e)
    {
        CheckDefined(e, nameof(e));
        return Names[(int)e];
    }

    /// <summary>Parses an estimator name, ignoring case.</summary>
    /// <param name="name">A name such as <c>yang-zhang</c> or <c>Parkinson</c>; null or unknown names fail.</param>
    /// <param name="estimator">The estimator when the name is known; otherwise <see cref="Estimator.CloseToClose"/>.</param>
    /// <returns>True when the name is one of <see cref="All"/>.</returns>
    public static bool TryParse(string? name, out Estimator estimator)
    {
        for (var i = 0; i < Names.Length; i++)
        {
            if (string.Equals(Names[i], name, StringComparison.OrdinalIgnoreCase))
            {
                estimator = (Estimator)i;
                return true;
            }
        }

        estimator = Estimator.CloseToClose;
        return false;
    }

    /// <summary>Returns whether an estimator needs the open, high and low columns.</summary>
    /// <param name="e">The estimator.</param>
    /// <returns>False for close-to-close only.</returns>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="e"/> is not a defined <see cref="Estimator"/>.</exception>
    public static bool NeedsRange(Estimator e)
    {
        CheckDefined(e, nameof(e));
        return e != Estimator.CloseToClose;
    }

    /// <summary>Checks that an estimator value is one of the defined members.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is not defined.</exception>
    internal static void CheckDefined(Estimator estimator, string paramName)
    {
        if (estimator is < Estimator.CloseToClose or > Estimator.YangZhang)
        {
            throw new ArgumentOutOfRangeException(paramName, estimator, string.Create(CultureInfo.InvariantCulture,
                $"{paramName} must be one of {string.Join(", ", Names)} (was {(int)estimator})."));
        }
    }
}
