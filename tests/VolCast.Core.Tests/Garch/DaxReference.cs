using System.Globalization;
using VolCast.Core.Data;

namespace VolCast.Core.Tests.Garch;

/// <summary>Reads the DAX closes and the R reference fits in Fixtures/Garch (made by make-dax-fits.R).</summary>
internal static class DaxReference
{
    private static readonly string Folder = Path.Combine(AppContext.BaseDirectory, "Fixtures", "Garch");

    /// <summary>The 1,859 daily log returns of datasets::EuStockMarkets[, "DAX"].</summary>
    public static double[] Returns()
    {
        var closes = File.ReadAllLines(Path.Combine(Folder, "dax-close.csv"))
            .Skip(1)
            .Where(line => line.Length > 0)
            .Select(line => double.Parse(line, CultureInfo.InvariantCulture))
            .ToArray();
        return VolCast.Core.Data.Returns.LogReturns(closes);
    }

    /// <summary>The closes as a price history on invented consecutive business dates (the R series carries no dates).</summary>
    public static PriceHistory History()
    {
        var closes = File.ReadAllLines(Path.Combine(Folder, "dax-close.csv"))
            .Skip(1)
            .Where(line => line.Length > 0)
            .Select(line => double.Parse(line, CultureInfo.InvariantCulture))
            .ToArray();
        return PriceHistory.FromCloses(Weekdays.From(new DateOnly(1991, 7, 1), closes.Length), closes);
    }

    /// <summary>One reference fit row.</summary>
    public sealed record Row(
        string Source, string Model, bool IncludeMean, string Init, int LikFrom,
        double Mu, double Omega, double Alpha, double Beta, double Gamma, double LogLikelihood, double? H1,
        double? SeMu, double? SeOmega, double? SeAlpha, double? SeBeta);

    public static Row Fit(string source, string model, bool includeMean)
    {
        var lines = File.ReadAllLines(Path.Combine(Folder, "dax-fits.csv")).Where(l => !l.StartsWith('#')).ToArray();
        var header = lines[0].Split(',');
        foreach (var line in lines.Skip(1))
        {
            var f = line.Split(',');
            string Get(string name) => f[Array.IndexOf(header, name)];
            double D(string name) => double.Parse(Get(name), CultureInfo.InvariantCulture);
            double? N(string name) => Get(name).Length == 0 ? null : D(name);
            if (Get("source") == source && Get("model") == model && bool.Parse(Get("include_mean")) == includeMean)
            {
                return new Row(source, model, includeMean, Get("init"), int.Parse(Get("lik_from"), CultureInfo.InvariantCulture),
                    D("mu"), D("omega"), D("alpha"), D("beta"), D("gamma"), D("log_likelihood"), N("h1"),
                    N("se_mu"), N("se_omega"), N("se_alpha"), N("se_beta"));
            }
        }

        throw new InvalidOperationException($"No reference row for {source} {model} mean={includeMean}.");
    }
}
