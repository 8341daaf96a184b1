using VolCast.Core.Demo;

namespace VolCast.Core.Tests.Demo;

public class DemoScenarioGeneratorTests
{
    [Fact]
    public void Generate_SameSeed_IsIdenticalBitForBit()
    {
        var a = new DemoScenarioGenerator(seed: 7, years: 3).Generate();
        var b = new DemoScenarioGenerator(seed: 7, years: 3).Generate();

        Assert.True(a.Index.Close.SequenceEqual(b.Index.Close));
        Assert.True(a.Index.High.SequenceEqual(b.Index.High));
        Assert.True(a.Implied.Volatility.SequenceEqual(b.Implied.Volatility));
        Assert.True(a.SecondAsset.Close.SequenceEqual(b.SecondAsset.Close));
    }

    [Fact]
    public void Generate_Calendar_SkipsWeekendsAndTheInventedHolidays()
    {
        var scenario = new DemoScenarioGenerator(seed: 1, years: 2).Generate();

        foreach (var date in scenario.Index.Dates)
        {
            Assert.NotEqual(DayOfWeek.Saturday, date.DayOfWeek);
            Assert.NotEqual(DayOfWeek.Sunday, date.DayOfWeek);
            Assert.False(date is { Month: 12, Day: 25 }, $"{date} is 25 December");
            Assert.False(date is { Month: 1, Day: 1 }, $"{date} is 1 January");
            Assert.False(date is { Month: 6, DayOfWeek: DayOfWeek.Monday, Day: > 7 and <= 14 }, $"{date} is Harbour Day");
        }
    }

    [Fact]
    public void Generate_Implied_SitsAboveTheScenariosExpectedVolatilityByAboutThePremium()
    {
        // The generator adds a premium with mean 0.025 (2.5 vol points) to its expected volatility, plus zero-mean noise.
        var scenario = new DemoScenarioGenerator(seed: 11, years: 20).Generate();
        var expectedByDate = new Dictionary<DateOnly, double>();
        for (var i = 0; i < scenario.Index.Count; i++)
        {
            expectedByDate[scenario.Index.Dates[i]] = scenario.ExpectedVolatility[i];
        }

        var sum = 0.0;
        for (var i = 0; i < scenario.Implied.Count; i++)
        {
            sum += scenario.Implied.Volatility[i] - expectedByDate[scenario.Implied.Dates[i]];
        }

        var meanPremium = sum / scenario.Implied.Count;
        Assert.InRange(meanPremium, 0.020, 0.030);
        Assert.InRange(scenario.Implied.Count, (int)(0.95 * scenario.Index.Count), (int)(0.99 * scenario.Index.Count));
    }
}
