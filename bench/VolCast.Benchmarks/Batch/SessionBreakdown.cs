using System.Diagnostics;
using System.Globalization;
using VolCast.Core.Backtest;
using VolCast.Core.Forecasters;
using VolCast.IO;

namespace VolCast.Benchmarks.Batch;

/// <summary>
/// The CPU-seconds of each forecaster session of the default configuration on one name (configured forecasters, the
/// default lookback and EWMA sweeps, the rule's historical estimate), each run alone on one thread from start to the
/// last day. Run: <c>dotnet run -c Release -- sessions PRICES.csv [ROUNDS]</c>.
/// </summary>
internal static class SessionBreakdown
{
    public static void Run(string[] args)
    {
        var prices = PriceFileReader.Read(InputBytes.Read(args[0])).History;
        var rounds = args.Length > 1 ? int.Parse(args[1], CultureInfo.InvariantCulture) : 3;
        var specs = new List<string>(BacktestSettings.DefaultForecasters);
        foreach (var family in new[] { "close-to-close", "yang-zhang" })
        {
            specs.AddRange(BacktestSettings.DefaultSweepLookbacks.Select(w => string.Create(CultureInfo.InvariantCulture, $"{family}:{w}")));
        }

        specs.AddRange(BacktestSettings.DefaultEwmaLambdas.Select(l => string.Create(CultureInfo.InvariantCulture, $"ewma:{l}")));
        var forecasters = specs.Select(ForecasterSpec.Parse).DistinctBy(f => f.Spec).ToList();
        var times = forecasters.ToDictionary(f => f.Spec, _ => new List<double>());
        for (var round = 0; round <= rounds; round++)
        {
            // Round 0 warms the JIT and is not counted; a fresh input per round builds the shared bar terms again (in the first session).
            var input = new ForecastInput(prices, null, BacktestHorizon.Default.NominalDays);
            foreach (var f in forecasters)
            {
                var before = Cpu();
                var session = f.Start(input);
                for (var t = 0; t < prices.Count; t++)
                {
                    _ = session.Forecast(t);
                }

                if (round > 0)
                {
                    times[f.Spec].Add(Cpu() - before);
                }
            }
        }

        Console.WriteLine("| session | CPU ms (median of " + rounds + ") |");
        Console.WriteLine("| --- | ---: |");
        var total = 0.0;
        foreach (var (spec, list) in times)
        {
            list.Sort();
            var median = list[list.Count / 2];
            total += median;
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"| {spec} | {median * 1000:0.0} |"));
        }

        Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"| total | {total * 1000:0.0} |"));
    }

    private static double Cpu() => Process.GetCurrentProcess().TotalProcessorTime.TotalSeconds;
}
