using System.Globalization;
using VolCast.Core.Data;

namespace VolCast.Core.Forecasters;

/// <summary>
/// Implied volatility scaled by its own recent bias: IV_t · √(mean of RV²_s / IV²_s over the last N forecast dates s
/// whose realized window has closed by t), N the selection window (docs/methods.md#implied-debiased).
/// </summary>
/// <remarks>
/// RV_s is the zero-mean squared-return realized volatility over s+1 .. s+h, closed once s + h ≤ t; dates without an
/// implied quote are skipped. The scale is multiplicative, so the forecast stays above zero whatever the past premium.
/// No forecast on a day without a quote or before the first window has closed.
/// </remarks>
internal sealed class ImpliedDebiasedForecaster : IVolatilityForecaster
{
    /// <summary>The name of the method in a spec.</summary>
    public const string Name = "implied-debiased";

    private readonly int? _windows;

    /// <summary>Creates the forecaster.</summary>
    /// <param name="windows">N, the number of past forecast dates averaged, or null for the run's selection window.</param>
    public ImpliedDebiasedForecaster(int? windows = null)
    {
        if (windows is int w)
        {
            Preconditions.AtLeast(w, 1, "window");
        }

        _windows = windows;
    }

    /// <inheritdoc/>
    public string Spec => _windows is int w ? string.Create(CultureInfo.InvariantCulture, $"{Name}:{w}") : Name;

    /// <inheritdoc/>
    public IForecastSession Start(ForecastInput input)
    {
        ArgumentNullException.ThrowIfNull(input);
        if (input.Implied is null)
        {
            throw new ArgumentException("The 'implied-debiased' forecaster needs an implied-volatility series; none was given.", nameof(input));
        }

        return new Session(input, _windows ?? input.SelectionWindowDays);
    }

    private sealed class Session : DailySession
    {
        private readonly ForecastInput _input;
        private readonly int _windows;
        private readonly double?[] _implied;
        private readonly double[] _sumSquares;
        private readonly double[] _ratio;
        private readonly bool[] _hasRatio;
        private int _next;
        private double _ratioSum;
        private int _ratioCount;
        private double? _today;

        public Session(ForecastInput input, int windows)
            : base(input.Prices.Count)
        {
            _input = input;
            _windows = windows;
            var n = input.Prices.Count;
            _implied = new double?[n];
            _sumSquares = new double[n];
            _ratio = new double[n];
            _hasRatio = new bool[n];
        }

        protected override void Step(int day)
        {
            var implied = _input.Implied!;
            var date = _input.Prices.Dates[day];
            while (_next < implied.Count && implied.Dates[_next] < date)
            {
                _next++;
            }

            _implied[day] = _next < implied.Count && implied.Dates[_next] == date ? implied.Volatility[_next] : null;
            var close = _input.Prices.Close;
            var r = day == 0 ? 0 : Math.Log(close[day] / close[day - 1]);
            _sumSquares[day] = (day == 0 ? 0 : _sumSquares[day - 1]) + (r * r);

            // The window of forecast date s = day − h closes today: its ratio enters the mean, and the one N dates older leaves.
            var h = _input.HorizonDays;
            var s = day - h;
            if (s >= 0 && _implied[s] is double iv)
            {
                var rv2 = _input.AnnualizationFactor / h * (_sumSquares[day] - _sumSquares[s]);
                _ratio[s] = rv2 / (iv * iv);
                _hasRatio[s] = true;
                _ratioSum += _ratio[s];
                _ratioCount++;
            }

            var leaving = s - _windows;
            if (leaving >= 0 && _hasRatio[leaving])
            {
                _ratioSum -= _ratio[leaving];
                _ratioCount--;
            }

            _today = _implied[day] is double today && _ratioCount > 0
                ? today * Math.Sqrt(Math.Max(_ratioSum, 0) / _ratioCount)
                : null;
        }

        protected override double? Current(int day) => _today is > 0 ? _today : null;
    }
}
