using BenchmarkDotNet.Running;

namespace VolCast.Benchmarks;

/// <summary>Hands the command line to BenchmarkDotNet's switcher: `dotnet run -c Release -- --filter '*Estimator*'`.</summary>
internal static class Program
{
    public static void Main(string[] args)
    {
        if (args.Length > 0 && args[0] == "phases")
        {
            Batch.PhaseBreakdown.Run(args[1..]);
            return;
        }

        if (args.Length > 0 && args[0] == "charts-diff")
        {
            Reports.ChartTimings.Diff(args[1..]);
            return;
        }

        if (args.Length > 0 && args[0] == "charts")
        {
            Reports.ChartTimings.Run(args[1..]);
            return;
        }

        if (args.Length > 0 && args[0] == "sessions")
        {
            Batch.SessionBreakdown.Run(args[1..]);
            return;
        }

        BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
    }
}
