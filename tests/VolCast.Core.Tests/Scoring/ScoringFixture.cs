using System.Globalization;
using System.Text.Json;

namespace VolCast.Core.Tests.Scoring;

/// <summary>
/// The committed R reference fixture (Fixtures/Scoring): the input series and R's numbers from sandwich 3.0.2,
/// lmtest 0.9.40 and forecast 8.20 on R 4.2.2 (Debian packages), made by make-fixture.R in that folder.
/// </summary>
internal sealed class ScoringFixture
{
    private static readonly Lazy<ScoringFixture> Instance = new(Load);

    private ScoringFixture(double[] realized, double[] forecast, double[] implied, JsonElement reference)
    {
        Realized = realized;
        Forecast = forecast;
        Implied = implied;
        Reference = reference;
    }

    public static ScoringFixture Shared => Instance.Value;

    public double[] Realized { get; }

    public double[] Forecast { get; }

    public double[] Implied { get; }

    public JsonElement Reference { get; }

    public static double[] Numbers(JsonElement array) => array.EnumerateArray().Select(e => e.GetDouble()).ToArray();

    private static ScoringFixture Load()
    {
        var folder = Path.Combine(AppContext.BaseDirectory, "Fixtures", "Scoring");
        var lines = File.ReadAllLines(Path.Combine(folder, "scoring-series.csv"));
        Assert.Equal("realized,forecast,implied", lines[0]);
        var rows = lines.Skip(1).Where(l => l.Length > 0).Select(l => l.Split(',')
            .Select(v => double.Parse(v, NumberStyles.Float, CultureInfo.InvariantCulture)).ToArray()).ToArray();
        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder, "scoring-reference.json")));
        return new ScoringFixture(
            rows.Select(r => r[0]).ToArray(),
            rows.Select(r => r[1]).ToArray(),
            rows.Select(r => r[2]).ToArray(),
            json.RootElement.Clone());
    }
}
