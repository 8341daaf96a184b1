using System.Globalization;
using VolCast.Core.Data;
using VolCast.Core.Estimators;
using VolCast.Core.Numerics;

namespace VolCast.Core.Forecasters;

/// <summary>
/// HAR (Corsi 2009), direct h-day form: OLS of the average squared return over the next h days on a constant and the
/// daily, weekly (5-day) and monthly (22-day) averages of a daily variance proxy, refitted walk-forward.
/// </summary>
/// <remarks>
/// <para>Regression row s: target Yₛ = (1/h) Σ r²ₛ₊ᵢ (i = 1..h, zero-mean squared close-to-close returns, the same
/// scale as the realized target); regressors vₛ, mean(vₛ₋₄..vₛ), mean(vₛ₋₂₁..vₛ) of the proxy v. With the default
/// proxy v = r²; with the Garman–Klass proxy the coefficients map intraday range variance onto close-to-close variance
/// (absorbing the overnight part).</para>
/// <para>At day t only rows whose target window has closed (s + h ≤ t) are used. Defaults: refit every 5 days on the
/// last 2,520 rows (expanding before), first fit once 250 rows exist. A fitted variance that is not above zero falls
/// back to the mean target of the fit rows (the long-run mean) and is counted. Coefficients that are not finite (a
/// singular design, for example constant prices) count as a failed fit and the previous coefficients are kept.</para>
/// </remarks>
internal sealed class HarForecaster : IVolatilityForecaster
{
    /// <summary>Days in the weekly average.</summary>
    public const int WeekDays = 5;

    /// <summary>Days in the monthly average.</summary>
    public const int MonthDays = 22;

    private readonly HarProxy _proxy;
    private readonly int _refitEveryDays;
    private readonly int? _rollingWindowRows;
    private readonly int _minimumRows;

    /// <summary>Creates a HAR forecaster.</summary>
    /// <param name="proxy">The daily variance proxy.</param>
    /// <param name="refitEveryDays">Days between refits, at least 1.</param>
    /// <param name="rollingWindowRows">Regression rows in the rolling window, or null for expanding; at least the minimum.</param>
    /// <param name="minimumRows">Rows needed before the first fit, at least 30.</param>
    /// <exception cref="ArgumentOutOfRangeException">A count is below its minimum.</exception>
    public HarForecaster(HarProxy proxy = HarProxy.SquaredReturn, int refitEveryDays = 5, int? rollingWindowRows = 2520, int minimumRows = 250)
    {
        Preconditions.AtLeast(refitEveryDays, 1, "trading day");
        Preconditions.AtLeast(minimumRows, 30, "rows");
        if (rollingWindowRows is int w)
        {
            Preconditions.AtLeast(w, minimumRows, "rows", nameof(rollingWindowRows));
        }

        _proxy = proxy;
        _refitEveryDays = refitEveryDays;
        _rollingWindowRows = rollingWindowRows;
        _minimumRows = minimumRows;
    }

    /// <inheritdoc/>
    public string Spec => _proxy == HarProxy.GarmanKlass ? "har:garman-klass" : "har";

    /// <inheritdoc/>
    public IForecastSession Start(ForecastInput input)
    {
        ArgumentNullException.ThrowIfNull(input);
        if (_proxy == HarProxy.GarmanKlass && !input.Prices.HasRange)
        {
            throw new ArgumentException("The 'har:garman-klass' forecaster needs open, high and low prices; this history has closes only. Use 'har'.", nameof(input));
        }

        return new Session(this, input);
    }

    private sealed class Session : DailySession
    {
        private readonly HarForecaster _owner;
        private readonly int _horizon;
        private readonly double _annualization;
        private readonly double[] _squared;
        private readonly double[] _daily;
        private readonly double[] _weekly;
        private readonly double[] _monthly;
        private readonly double[] _targets;
        private readonly double[] _response;
        private readonly HouseholderLeastSquares _solver;
        private double[]? _coefficients;
        private double _longRunMean;
        private int? _lastAttempt;

        public Session(HarForecaster owner, ForecastInput input)
            : base(input.Prices.Count)
        {
            _owner = owner;
            _horizon = input.HorizonDays;
            _annualization = input.AnnualizationFactor;
            var n = input.Prices.Count;
            var returns = Returns.LogReturns(input.Prices.Close);

            // Indexed by price day: entry d belongs to day d (d ≥ 1); each uses data of day d and earlier only.
            _squared = new double[n];
            _daily = new double[n];
            for (var d = 1; d < n; d++)
            {
                _squared[d] = returns[d - 1] * returns[d - 1];
            }

            if (owner._proxy == HarProxy.GarmanKlass)
            {
                var o = input.Prices.Open;
                var h = input.Prices.High;
                var l = input.Prices.Low;
                var c = input.Prices.Close;
                for (var d = 1; d < n; d++)
                {
                    _daily[d] = BarVariance.GarmanKlass(o[d], h[d], l[d], c[d]);
                }
            }
            else
            {
                Array.Copy(_squared, _daily, n);
            }

            _weekly = new double[n];
            _monthly = new double[n];
            for (var d = MonthDays; d < n; d++)
            {
                _weekly[d] = Mean(_daily, d - WeekDays + 1, WeekDays);
                _monthly[d] = Mean(_daily, d - MonthDays + 1, MonthDays);
            }

            // A row's target depends on the row alone, so it is averaged once here and read by every refit.
            _targets = new double[n];
            for (var s = MonthDays; s + _horizon < n; s++)
            {
                _targets[s] = Mean(_squared, s + 1, _horizon);
            }

            var maxRows = Math.Max(Columns, owner._rollingWindowRows is int w ? Math.Min(w, n) : n);
            _response = new double[maxRows];
            _solver = new HouseholderLeastSquares(maxRows, Columns);
        }

        /// <summary>The columns of the design: a constant, daily, weekly and monthly.</summary>
        private const int Columns = 4;

        protected override void Step(int day)
        {
            // Rows s = MonthDays .. day − h have closed targets.
            var lastRow = day - _horizon;
            var rows = lastRow - MonthDays + 1;
            if (rows < _owner._minimumRows || (_lastAttempt is int last && day - last < _owner._refitEveryDays))
            {
                return;
            }

            _lastAttempt = day;
            var count = _owner._rollingWindowRows is int w ? Math.Min(w, rows) : rows;
            var firstRow = lastRow - count + 1;
            RefitCount++;

            // Scale by the mean target so the design is well conditioned whatever the return units.
            var y = _response.AsSpan(0, count);
            double meanTarget = 0;
            for (var i = 0; i < count; i++)
            {
                var target = _targets[firstRow + i];
                y[i] = target;
                meanTarget += target;
            }

            meanTarget /= count;
            if (!(meanTarget > 0))
            {
                FailedFitCount++;
                return;
            }

            // Column-major: column j of the design holds rows 0 .. count − 1 from j · count.
            var x = _solver.Design(count);
            for (var i = 0; i < count; i++)
            {
                var s = firstRow + i;
                x[i] = 1;
                x[count + i] = _daily[s] / meanTarget;
                x[(2 * count) + i] = _weekly[s] / meanTarget;
                x[(3 * count) + i] = _monthly[s] / meanTarget;
                y[i] /= meanTarget;
            }

            Span<double> b = stackalloc double[Columns];
            _solver.Solve(count, y, b);
            var coefficients = new[] { b[0] * meanTarget, b[1], b[2], b[3] };
            if (!AllFinite(coefficients))
            {
                FailedFitCount++;
                return;
            }

            _coefficients = coefficients;
            _longRunMean = meanTarget;
        }

        protected override double? Current(int day)
        {
            if (_coefficients is null || day < MonthDays)
            {
                return null;
            }

            var b = _coefficients;
            var variance = b[0] + (b[1] * _daily[day]) + (b[2] * _weekly[day]) + (b[3] * _monthly[day]);
            if (!(variance > 0))
            {
                FallbackCount++;
                variance = _longRunMean;
            }

            return Math.Sqrt(_annualization * variance);
        }

        private static double Mean(double[] values, int start, int length)
        {
            double sum = 0;
            for (var i = start; i < start + length; i++)
            {
                sum += values[i];
            }

            return sum / length;
        }

        private static bool AllFinite(double[] values)
        {
            foreach (var v in values)
            {
                if (!double.IsFinite(v))
                {
                    return false;
                }
            }

            return true;
        }
    }

    /// <inheritdoc/>
    public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"{Spec} (refit every {_refitEveryDays} days)");
}
