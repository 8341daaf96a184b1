using VolCast.Core.Data;

namespace VolCast.Core.Forecasters;

/// <summary>
/// A forecast series the user supplies (one column of a forecasts file), scored like any forecaster under the spec
/// <c>user:NAME</c>: the value dated t is the forecast made at t's close; no forecast on a date the series lacks.
/// </summary>
/// <remarks>
/// The tool cannot tell whether the user's values were made from data up to t only: the user guarantees it. The
/// prefix keeps the name apart from every built-in spec.
/// </remarks>
public sealed class UserForecaster : IVolatilityForecaster
{
    /// <summary>The prefix of a user forecaster's spec.</summary>
    public const string Prefix = "user:";

    private readonly ImpliedSeries _values;

    /// <summary>Creates a user forecaster.</summary>
    /// <param name="name">The column name, not empty (the spec is <c>user:NAME</c>).</param>
    /// <param name="dates">The forecast dates, strictly increasing.</param>
    /// <param name="forecasts">The forecasts of average annualized volatility, decimal, finite and above zero.</param>
    /// <exception cref="ArgumentException">The name is empty, the lengths differ, the dates are not increasing, or a value is not above zero.</exception>
    public UserForecaster(string name, ReadOnlySpan<DateOnly> dates, ReadOnlySpan<double> forecasts)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(name);
        Name = name.Trim();
        _values = new ImpliedSeries(dates, forecasts);
    }

    /// <summary>Gets the column name.</summary>
    public string Name { get; }

    /// <summary>Gets the number of dated forecasts.</summary>
    public int Count => _values.Count;

    /// <summary>Gets the forecast dates.</summary>
    public ReadOnlySpan<DateOnly> Dates => _values.Dates;

    /// <inheritdoc/>
    public string Spec => Prefix + Name;

    /// <summary>Tells whether a spec names a user forecaster (starts with <c>user:</c>, without regard to case).</summary>
    /// <param name="spec">The spec.</param>
    /// <returns>True for a user forecaster's spec.</returns>
    public static bool IsUserSpec(string? spec) => spec is not null && spec.Trim().StartsWith(Prefix, StringComparison.OrdinalIgnoreCase);

    /// <summary>Gets a spec in the canonical form <c>user:NAME</c> (prefix lower case, name as written, spaces trimmed).</summary>
    /// <param name="spec">A spec for which <see cref="IsUserSpec"/> is true.</param>
    /// <returns>The canonical spec.</returns>
    public static string Canonical(string spec)
    {
        ArgumentNullException.ThrowIfNull(spec);
        return Prefix + spec.Trim()[Prefix.Length..].Trim();
    }

    /// <inheritdoc/>
    public IForecastSession Start(ForecastInput input)
    {
        ArgumentNullException.ThrowIfNull(input);
        return new Session(input, _values);
    }

    private sealed class Session(ForecastInput input, ImpliedSeries values) : DailySession(input.Prices.Count)
    {
        private int _next;
        private double? _today;

        protected override void Step(int day)
        {
            var date = input.Prices.Dates[day];
            while (_next < values.Count && values.Dates[_next] < date)
            {
                _next++;
            }

            _today = _next < values.Count && values.Dates[_next] == date ? values.Volatility[_next] : null;
        }

        protected override double? Current(int day) => _today;
    }
}
