using VolCast.Core.Data;

namespace VolCast.Core.Tests.Trading;

/// <summary>Seeded price paths at a known constant volatility, on weekdays, with the calendar-day time basis of the pricing.</summary>
public static class SimulatedMarket
{
    /// <summary>
    /// Closes on consecutive weekdays from 2000-01-03 with log returns of variance σ²·(calendar days)/365 and mean
    /// (μ − σ²/2)·days/365, so E[S_{t+1}/S_t] = e^{μ·days/365} (μ = 0: a martingale, the r = q = 0 risk-neutral path).
    /// </summary>
    public static PriceHistory ConstantVolatility(int seed, int days, double sigma, double drift = 0, double start = 100)
    {
        var random = new Random(seed);
        var dates = new DateOnly[days];
        var close = new double[days];
        var date = new DateOnly(2000, 1, 3);
        var price = start;
        for (var i = 0; i < days; i++)
        {
            if (i > 0)
            {
                var next = date.AddDays(date.DayOfWeek == DayOfWeek.Friday ? 3 : 1);
                var dt = (next.DayNumber - date.DayNumber) / 365.0;
                price *= Math.Exp(((drift - (0.5 * sigma * sigma)) * dt) + (sigma * Math.Sqrt(dt) * Gaussian(random)));
                date = next;
            }

            dates[i] = date;
            close[i] = price;
        }

        return PriceHistory.FromCloses(dates, close);
    }

    /// <summary>A standard normal draw by Box-Muller from a seeded <see cref="Random"/>.</summary>
    public static double Gaussian(Random random)
    {
        var u = 1.0 - random.NextDouble();
        var v = random.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u)) * Math.Cos(2 * Math.PI * v);
    }

    /// <summary>The same value on every date.</summary>
    public static double?[] Constant(int days, double value)
    {
        var result = new double?[days];
        Array.Fill(result, value);
        return result;
    }
}
