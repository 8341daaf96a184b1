using VolCast.Core.Cone;
using VolCast.Reports.Charts;
using VolCast.Reports.Model;

namespace VolCast.Reports.Tests.Support;

/// <summary>
/// Invented data for a full report: 20 years of seeded daily returns with slowly changing volatility, an implied
/// series that carries a premium, and three forecasters. Only for exercising charts and the HTML, never for numbers.
/// </summary>
internal sealed class SampleReport
{
    private SampleReport(int days, int seed)
    {
        var random = new Random(seed);
        var dates = Weekdays.From(new DateOnly(2005, 1, 3), days);

        // A log-volatility that wanders: daily vol between roughly 0.5% and 3%.
        var returns = new double[days];
        var dailyVol = new double[days];
        var logVol = Math.Log(0.01);
        for (var i = 0; i < days; i++)
        {
            logVol = Math.Log(0.01) + (0.985 * (logVol - Math.Log(0.01))) + (0.08 * Gaussian.Next(random));
            dailyVol[i] = Math.Exp(logVol);
            returns[i] = dailyVol[i] * Gaussian.Next(random);
        }

        Returns = returns;
        Dates = dates;
        const int h = 21;
        var scored = days - h;
        var realized = new double[scored];
        var implied = new double[scored];
        var ewma = new double[scored];
        var slow = new double[scored];
        var garch = new double[scored];
        var variance = dailyVol[0] * dailyVol[0];
        var slowVariance = variance;
        for (var t = 0; t < scored; t++)
        {
            var sum = 0.0;
            for (var k = t + 1; k <= t + h; k++)
            {
                sum += returns[k] * returns[k];
            }

            realized[t] = Math.Sqrt(252.0 / h * sum);
            variance = (0.94 * variance) + (0.06 * returns[t] * returns[t]);
            slowVariance = (0.99 * slowVariance) + (0.01 * returns[t] * returns[t]);
            ewma[t] = Math.Sqrt(252 * variance);
            slow[t] = Math.Sqrt(252 * slowVariance);
            garch[t] = Math.Sqrt(252 * ((0.85 * variance) + (0.15 * 0.0001)));
            implied[t] = (Math.Sqrt(252) * dailyVol[t] * 1.1) + 0.01 + (0.01 * Gaussian.Next(random));
        }

        var scoredDates = dates.Take(scored).ToArray();
        Realized = new TimeSeries("realized (close-to-close, 21 days)", scoredDates, realized);
        Implied = new TimeSeries("implied 30d", scoredDates, implied);
        Forecasts =
        [
            new TimeSeries("ewma:0.94", scoredDates, ewma),
            new TimeSeries("ewma:0.99", scoredDates, slow),
            new TimeSeries("garch", scoredDates, garch),
        ];
        Premium = new TimeSeries("implied 30d − realized", scoredDates, implied.Select((v, i) => v - realized[i]).ToArray());
        LossDifferentials = Forecasts
            .Select(f => new TimeSeries(f.Name, scoredDates, f.Values.Select((v, i) => Qlike(realized[i], v) - Qlike(realized[i], implied[i])).ToArray()))
            .ToArray();
        Lookbacks =
        [
            new LookbackCurve("close-to-close", [10, 21, 42, 63, 126, 252], [0.21, 0.18, 0.17, 0.175, 0.19, 0.22], [42, 42, 42, 63, 21, 42, 42]),
            new LookbackCurve("yang-zhang", [10, 21, 42, 63, 126, 252], [0.2, 0.165, 0.16, 0.168, 0.185, 0.215], [42, 21, 42, 42, 42, 42, 63]),
            new LookbackCurve("parkinson", [10, 21, 42, 63, 126, 252], [0.205, 0.172, 0.166, 0.171, 0.188, 0.218], [21, 42, 42, 63, 63, 42, 42]),
        ];
        ForecastVariance = ewma.Select(v => v * v).ToArray();
        RealizedVariance = realized.Select(v => v * v).ToArray();
        Cone = VolatilityCone.Compute(returns, VolatilityCone.DefaultHorizons);
        Overlays =
        [
            new ConeOverlay("implied 30d", 21, implied[^1]),
            new ConeOverlay("ewma:0.94", 21, ewma[^1]),
            new ConeOverlay("garch", 21, garch[^1]),
        ];
        PremiumAll = Premium.Values.ToArray();
        PremiumSignalled = Premium.Values.Where((v, i) => implied[i] > ewma[i] + 0.02).ToArray();
    }

    /// <summary>The daily log returns.</summary>
    public double[] Returns { get; }

    /// <summary>The trading dates of the returns.</summary>
    public IReadOnlyList<DateOnly> Dates { get; }

    public TimeSeries Realized { get; }

    public TimeSeries Implied { get; }

    public IReadOnlyList<TimeSeries> Forecasts { get; }

    public TimeSeries Premium { get; }

    public IReadOnlyList<TimeSeries> LossDifferentials { get; }

    public IReadOnlyList<LookbackCurve> Lookbacks { get; }

    public double[] ForecastVariance { get; }

    public double[] RealizedVariance { get; }

    public VolatilityConeResult Cone { get; }

    public IReadOnlyList<ConeOverlay> Overlays { get; }

    public double[] PremiumAll { get; }

    public double[] PremiumSignalled { get; }

    /// <summary>Twenty years of weekdays (5,040 days) from seed 42, unless told otherwise.</summary>
    public static SampleReport Create(int days = 5040, int seed = 42) => new(days, seed);

    /// <summary>Every chart of the report.</summary>
    public IReadOnlyList<ChartImage> Charts() =>
    [
        ReportCharts.ForecastVsRealized(Realized, Implied, Forecasts),
        ReportCharts.Premium(Premium),
        ReportCharts.CumulativeLossDifferential(LossDifferentials),
        ReportCharts.LossVsLookback(Lookbacks),
        ReportCharts.MincerZarnowitz("ewma:0.94", ForecastVariance, RealizedVariance, 0.004, 0.92),
        ReportCharts.Cone(Cone, Overlays),
        ReportCharts.RuleTest(PremiumAll, PremiumSignalled, "sell when implied > ewma:0.94 + 2 pts", "ewma:0.94"),
    ];

    /// <summary>A complete model with the given charts and price file name (to test escaping).</summary>
    public static ReportModel Model(IReadOnlyList<ChartImage> charts, string pricesFile = "prices.csv") => new(
        "Volatility forecast backtest: DEMO, 21-day horizon",
        new Verdict(
            "ewma:0.94 ranks first on QLIKE and beats implied volatility by 0.031 a day, significant at 1% (Diebold-Mariano, HAC).",
            [
                "Model confidence set at 10%: ewma:0.94, garch.",
                "Chosen lookback: 42 trading days, picked in 71% of walk-forward refits.",
                "Candidate ewma:0.94 against baseline close-to-close:21: QLIKE lower by 0.012, p = 0.004.",
            ]),
        [
            new MetricTable(
                "Forecast losses (ranked on QLIKE)",
                [new MetricColumn("QLIKE", "unitless, lower is better"), new MetricColumn("MSE", "variance², ×10⁻⁴"), new MetricColumn("RMSE", "vol points"), new MetricColumn("DM vs implied", "t-statistic, HAC")],
                [
                    new MetricRow("ewma:0.94", [new MetricCell(0.1412), new MetricCell(1.23, "0.00"), new MetricCell(4.1, "0.0"), new MetricCell(-3.2, "0.00", Significance.OnePercent)]),
                    new MetricRow("garch", [new MetricCell(0.1450), new MetricCell(1.31, "0.00"), new MetricCell(4.3, "0.0"), new MetricCell(-2.1, "0.00", Significance.FivePercent)]),
                    new MetricRow("implied 30d", [new MetricCell(0.1723), new MetricCell(1.62, "0.00"), new MetricCell(5.0, "0.0"), new MetricCell(null)]),
                ],
                "Diebold-Mariano on the QLIKE differential against implied, Newey-West with 20 lags; negative means lower loss than implied."),
        ],
        charts,
        new DataQuality(5040, 5019, 0.987, ["implied.csv: unit inferred as percent (values above 1.5); pass --iv-unit to declare it.", "prices.csv, line 812: duplicate date 2008-03-14 dropped."]),
        new RunInfo(
            "0.1.0",
            new DateTimeOffset(2025, 1, 2, 3, 4, 5, TimeSpan.Zero),
            TimeSpan.FromSeconds(1.25),
            [new Setting("horizon", "21 trading days"), new Setting("annualization", "252 trading days a year"), new Setting("forecasters", "ewma:0.94, ewma:0.99, garch")],
            [new InputFile("prices", pricesFile, new string('a', 64)), new InputFile("implied", "implied.csv", new string('b', 64))]));

    private static double Qlike(double realized, double forecast)
    {
        var ratio = realized * realized / (forecast * forecast);
        return ratio - Math.Log(ratio) - 1;
    }
}
