using System.Collections.Immutable;

namespace VolCast.Core.Calibration;

/// <summary>Outcomes built from a price history for the scorable forecast dates, with where each came from.</summary>
/// <param name="Outcomes">The closes at t and t + h_t, one entry per scorable forecast date.</param>
/// <param name="DateIndices">For each entry of <paramref name="Outcomes"/>, its index in the forecast dates given.</param>
/// <param name="Dates">For each entry, its forecast date.</param>
public sealed record AlignedOutcomes(HorizonOutcomes Outcomes, ImmutableArray<int> DateIndices, ImmutableArray<DateOnly> Dates)
{
    /// <summary>Picks a forecaster's values on the scorable dates, in the order of <see cref="Outcomes"/>.</summary>
    /// <param name="name">The forecaster's name.</param>
    /// <param name="values">The forecaster's values on every forecast date (null where it had none).</param>
    /// <returns>The forecaster's series aligned with <see cref="Outcomes"/>.</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">The values are shorter than the forecast dates used.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A value present is not finite or not above zero.</exception>
    public ForecasterVolatility Select(string name, IReadOnlyList<double?> values)
    {
        ArgumentNullException.ThrowIfNull(values);
        var picked = new double?[DateIndices.Length];
        for (var i = 0; i < picked.Length; i++)
        {
            var k = DateIndices[i];
            if (k >= values.Count)
            {
                throw new ArgumentException($"{name}: values must cover every forecast date; index {k} is past its {values.Count} values.", nameof(values));
            }

            picked[i] = values[k];
        }

        return new ForecasterVolatility(name, picked);
    }
}
