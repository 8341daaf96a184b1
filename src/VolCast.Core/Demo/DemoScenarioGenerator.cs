using VolCast.Core.Data;

namespace VolCast.Core.Demo;

/// <summary>
/// Generates the demo scenario from a seed, bit for bit reproducibly. Everything in it is invented.
/// </summary>
/// <remarks>
/// <para>Calendar: weekdays from 2005-01-03 for <see cref="Years"/> years, less three invented holidays a
/// year (1 January, 25 December and "Harbour Day", the second Monday of June).</para>
/// <para>Volatility: the log of the daily volatility follows an AR(1) around a regime level
/// (persistence 0.985 a day), with a leverage effect: the shock to log-volatility is correlated −0.55 with
/// the previous day's return shock. Regimes: 16% a year normally, a calm stretch at 10% (years 2–5) and a
/// stressed stretch at 38% (years 8–9), with smooth transitions.</para>
/// <para>Bars: an overnight gap carries 20% of the day's variance; the session is an intraday path of
/// 78 steps (so highs and lows carry the usual discrete-sampling bias), with a rare jump (about one day
/// in 250, mean −4%). Prices are rounded to cents.</para>
/// <para>Implied: the model's own expected average volatility over the next 30 calendar days (the trading
/// days in that span on this calendar), plus a premium that wanders around 2.5 volatility points, plus
/// quote noise of 0.4 points; about 3% of days are missing.</para>
/// </remarks>
public sealed class DemoScenarioGenerator
{
    private const int StepsPerDay = 78;
    private const double OvernightShare = 0.2;
    private const double JumpStdDev = 0.03;
    private const double QuoteNoise = 0.004;
    private const double MissingShare = 0.03;
    private const int TenorCalendarDays = 30;

    private readonly Random _random;
    private readonly DemoAssetParameters _parameters;
    private double? _spareNormal;

    /// <summary>Creates a generator of the demo index scenario.</summary>
    /// <param name="seed">The random seed; the same seed gives the same scenario bit for bit.</param>
    /// <param name="years">How many calendar years to generate, at least 2.</param>
    public DemoScenarioGenerator(int seed, int years = 20)
        : this(seed, DemoAssetParameters.Index, years)
    {
    }

    /// <summary>Creates a generator of an asset with the given behaviour.</summary>
    /// <param name="seed">The random seed; the same seed and parameters give the same data bit for bit.</param>
    /// <param name="parameters">How the asset behaves (<see cref="DemoAssetParameters.Index"/> for the demo index).</param>
    /// <param name="years">How many calendar years to generate, at least 2.</param>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is out of range, or fewer than 2 years.</exception>
    public DemoScenarioGenerator(int seed, DemoAssetParameters parameters, int years)
    {
        ArgumentNullException.ThrowIfNull(parameters);
        ArgumentOutOfRangeException.ThrowIfLessThan(years, 2);
        parameters.Validate();
        _random = new Random(seed);
        _parameters = parameters;
        Years = years;
    }

    /// <summary>Gets the number of calendar years generated.</summary>
    public int Years { get; }

    /// <summary>Generates the scenario.</summary>
    public DemoScenario Generate()
    {
        var dates = TradingCalendar(new DateOnly(2005, 1, 3), Years);
        var n = dates.Length;
        var dailyVol = new double[n];
        var index = SimulateBars(dates, dailyVol, _parameters);
        var expected = ExpectedVolatility(dates, dailyVol, _parameters);
        var implied = ImpliedFromExpected(dates, expected, _parameters.MeanPremium);
        var secondVol = new double[n];
        var second = SimulateBars(dates, secondVol, _parameters with { BaseVolatility = 0.28, StressedVolatility = 0.55, CalmVolatility = 0.20, StartPrice = 40 });
        return new DemoScenario(index, implied, expected, PriceHistory.FromCloses(dates, second.Close));
    }

    /// <summary>Generates one asset with this generator's parameters: bars, implied volatility and expected volatility.</summary>
    /// <param name="name">The asset's invented name.</param>
    /// <param name="start">The first calendar date; the calendar runs <see cref="Years"/> years from it.</param>
    /// <returns>The asset.</returns>
    public DemoAsset GenerateAsset(string name, DateOnly start)
    {
        ArgumentNullException.ThrowIfNull(name);
        var dates = TradingCalendar(start, Years);
        var dailyVol = new double[dates.Length];
        var prices = SimulateBars(dates, dailyVol, _parameters);
        var expected = ExpectedVolatility(dates, dailyVol, _parameters);
        var implied = ImpliedFromExpected(dates, expected, _parameters.MeanPremium);
        return new DemoAsset(name, _parameters, prices, implied, expected);
    }

    private static DateOnly[] TradingCalendar(DateOnly start, int years)
    {
        var end = start.AddYears(years);
        var list = new List<DateOnly>(years * 262);
        for (var d = start; d < end; d = d.AddDays(1))
        {
            if (d.DayOfWeek is DayOfWeek.Saturday or DayOfWeek.Sunday || IsHoliday(d))
            {
                continue;
            }

            list.Add(d);
        }

        return [.. list];
    }

    private static bool IsHoliday(DateOnly d) =>
        (d.Month == 1 && d.Day == 1)
        || (d.Month == 12 && d.Day == 25)
        || (d.Month == 6 && d.DayOfWeek == DayOfWeek.Monday && d.Day is > 7 and <= 14);

    // Regime level of annualized volatility by fraction of the sample, with smooth (logistic) transitions.
    private static double RegimeVolatility(double yearsIn, DemoAssetParameters p)
    {
        var annualBase = p.BaseVolatility;
        var calm = p.CalmVolatility;
        var stressed = p.StressedVolatility;
        static double Window(double x, double from, double to) =>
            1 / (1 + Math.Exp(-(x - from) * 6)) * (1 / (1 + Math.Exp((x - to) * 6)));

        var calmWeight = Window(yearsIn, p.CalmFromYear, p.CalmToYear);
        var stressWeight = Window(yearsIn, p.StressFromYear, p.StressToYear);
        var logVol = Math.Log(annualBase)
            + (calmWeight * (Math.Log(calm) - Math.Log(annualBase)))
            + (stressWeight * (Math.Log(stressed) - Math.Log(annualBase)));
        return Math.Exp(logVol);
    }

    private PriceHistory SimulateBars(DateOnly[] dates, double[] dailyVol, DemoAssetParameters p)
    {
        var n = dates.Length;
        var open = new double[n];
        var high = new double[n];
        var low = new double[n];
        var close = new double[n];
        var first = dates[0];
        var previousClose = p.StartPrice;
        var deviation = 0.0; // log daily vol minus its regime level
        var previousShock = 0.0;
        var stepScale = Math.Sqrt((1 - OvernightShare) / StepsPerDay);
        for (var t = 0; t < n; t++)
        {
            var yearsIn = (dates[t].DayNumber - first.DayNumber) / 365.25;
            var level = Math.Log(RegimeVolatility(yearsIn, p) / Math.Sqrt(252));
            var volShock = (p.Leverage * previousShock) + (Math.Sqrt(1 - (p.Leverage * p.Leverage)) * Normal());
            deviation = (p.Persistence * deviation) + (p.LogVolatilityShock * volShock);
            var sigma = Math.Exp(level + deviation);
            dailyVol[t] = sigma;

            var overnight = sigma * Math.Sqrt(OvernightShare) * Normal();
            var o = Math.Round(previousClose * Math.Exp(overnight - (0.5 * OvernightShare * sigma * sigma)), 2);
            var jumpStep = _random.NextDouble() < p.JumpProbability ? _random.Next(StepsPerDay) : -1;
            var logPrice = Math.Log(o);
            var hi = logPrice;
            var lo = logPrice;
            var diffusive = overnight;
            for (var s = 0; s < StepsPerDay; s++)
            {
                var z = Normal();
                var step = (sigma * stepScale * z) - (0.5 * sigma * sigma * stepScale * stepScale) + (0.0003 / StepsPerDay);
                diffusive += sigma * stepScale * z;
                if (s == jumpStep)
                {
                    step += p.JumpMean + (JumpStdDev * Normal());
                }

                logPrice += step;
                hi = Math.Max(hi, logPrice);
                lo = Math.Min(lo, logPrice);
            }

            var c = Math.Round(Math.Exp(logPrice), 2);
            open[t] = o;
            close[t] = c;
            high[t] = Math.Max(Math.Round(Math.Exp(hi), 2), Math.Max(o, c));
            low[t] = Math.Min(Math.Round(Math.Exp(lo), 2), Math.Min(o, c));
            previousShock = diffusive / sigma;
            previousClose = c;
        }

        return PriceHistory.FromBars(dates, open, high, low, close);
    }

    // E[sigma^2(t+k) | sigma(t)] for the log-AR(1): exp(2(level + phi^k dev) + 2 s_k^2), s_k^2 = eta^2 (1 - phi^2k) / (1 - phi^2),
    // averaged over the trading days in (t, t + 30 calendar days], plus the jumps' expected variance; annualized with 252.
    private static double[] ExpectedVolatility(DateOnly[] dates, double[] dailyVol, DemoAssetParameters p)
    {
        var n = dates.Length;
        var result = new double[n];
        var first = dates[0];
        var jumpVariance = p.JumpProbability * ((p.JumpMean * p.JumpMean) + (JumpStdDev * JumpStdDev));
        var stationary = p.LogVolatilityShock * p.LogVolatilityShock / (1 - (p.Persistence * p.Persistence));
        var end = 0;
        for (var t = 0; t < n; t++)
        {
            var horizonEnd = dates[t].AddDays(TenorCalendarDays);
            end = Math.Max(end, t);
            while (end + 1 < n && dates[end + 1] <= horizonEnd)
            {
                end++;
            }

            // Near the end of the sample the 30 days run past the calendar: assume 21 trading days there.
            var h = end - t >= 15 ? end - t : 21;
            var yearsIn = (dates[t].DayNumber - first.DayNumber) / 365.25;
            var regime = Math.Log(RegimeVolatility(yearsIn, p) / Math.Sqrt(252));
            var deviation = Math.Log(dailyVol[t]) - regime;
            var sum = 0.0;
            var phiK = 1.0;
            for (var k = 1; k <= h; k++)
            {
                phiK *= p.Persistence;
                var noise = stationary * (1 - (phiK * phiK));
                sum += Math.Exp((2 * (regime + (phiK * deviation))) + (2 * noise));
            }

            result[t] = Math.Sqrt(252 * ((sum / h) + jumpVariance));
        }

        return result;
    }

    private ImpliedSeries ImpliedFromExpected(DateOnly[] dates, double[] expected, double meanPremium)
    {
        var keptDates = new List<DateOnly>(dates.Length);
        var keptVol = new List<double>(dates.Length);
        var premium = meanPremium;
        for (var t = 0; t < dates.Length; t++)
        {
            premium = meanPremium + (0.97 * (premium - meanPremium)) + (0.003 * Normal());
            var iv = expected[t] + premium + (QuoteNoise * Normal());
            var missing = _random.NextDouble() < MissingShare;
            if (missing)
            {
                continue;
            }

            keptDates.Add(dates[t]);
            keptVol.Add(Math.Round(Math.Max(iv, 0.01), 6));
        }

        return new ImpliedSeries(keptDates.ToArray(), keptVol.ToArray());
    }

    // Box-Muller with the spare value kept, so the sequence depends on the seed only.
    private double Normal()
    {
        if (_spareNormal is double spare)
        {
            _spareNormal = null;
            return spare;
        }

        double u;
        do
        {
            u = _random.NextDouble();
        }
        while (u <= double.Epsilon);

        var v = _random.NextDouble();
        var radius = Math.Sqrt(-2 * Math.Log(u));
        _spareNormal = radius * Math.Sin(2 * Math.PI * v);
        return radius * Math.Cos(2 * Math.PI * v);
    }
}
