using ScottPlot;
using VolCast.Reports.Charts;

namespace VolCast.Reports.Tests.Charts;

public sealed class BoxPlacementTests
{
    private static readonly PixelRect Area = new(0, 400, 300, 0);

    private static PixelRect Box(float left, float top, float width, float height) => new(left, left + width, top + height, top);

    [Fact]
    public void Place_TakesTheFirstFreeCandidateAndSkipsThoseTakenOrOutside()
    {
        IReadOnlyList<PixelRect>[] candidates =
        [
            [Box(10, 10, 20, 20)],
            [Box(15, 15, 20, 20), Box(390, 10, 20, 20), Box(30, 10, 20, 20)], // covers the first; out of the area; touches the first's edge only
            [Box(10, 10, 5, 5)],                                              // nothing free
        ];

        var chosen = BoxPlacement.Place(candidates, Area);

        Assert.Equal([0, 2, BoxPlacement.None], chosen);
    }

    [Fact]
    public void PlaceOrFirst_GivesEachItemItsPlace_OrItsFirstCandidateWhenNoneIsFree()
    {
        IReadOnlyList<PixelRect>[] candidates =
        [
            [Box(10, 10, 20, 20)],
            [Box(15, 15, 20, 20), Box(30, 10, 20, 20)],
            [Box(12, 12, 5, 5), Box(14, 14, 5, 5)], // both covered by the first: drawn at its first choice
        ];

        var boxes = BoxPlacement.PlaceOrFirst(candidates, Area);

        Assert.Equal([candidates[0][0], candidates[1][1], candidates[2][0]], boxes);
    }

    [Fact]
    public void Place_KeepsClearOfObstacles()
    {
        var chosen = BoxPlacement.Place([[Box(10, 10, 20, 20), Box(50, 10, 20, 20)]], Area, [Box(0, 0, 40, 40)]);

        Assert.Equal([1], chosen);
    }

    [Fact]
    public void Place_NoTwoPlacedBoxesOverlapAndEveryOneLiesInTheArea()
    {
        // Crowded random candidates, as labels clustered where bins of several forecasters meet.
        var random = new Random(17);
        var candidates = new List<IReadOnlyList<PixelRect>>();
        for (var i = 0; i < 200; i++)
        {
            var options = new List<PixelRect>();
            for (var c = 0; c < 6; c++)
            {
                options.Add(Box(random.Next(-10, 390), random.Next(-10, 290), random.Next(5, 30), random.Next(5, 40)));
            }

            candidates.Add(options);
        }

        var chosen = BoxPlacement.Place(candidates, Area);

        var placed = chosen.Select((c, i) => (c, i)).Where(p => p.c != BoxPlacement.None).Select(p => candidates[p.i][p.c]).ToArray();
        Assert.True(placed.Length > 20, $"only {placed.Length} placed");
        Assert.Contains(BoxPlacement.None, chosen);
        for (var i = 0; i < placed.Length; i++)
        {
            Assert.True(BoxPlacement.Inside(placed[i], Area), placed[i].ToString());
            for (var j = 0; j < i; j++)
            {
                Assert.False(BoxPlacement.Overlap(placed[i], placed[j]), $"{placed[j]} and {placed[i]}");
            }
        }
    }

    [Fact]
    public void CountLabels_Candidates_AreAboveThenBelowTheBarThenStepByStepFurtherAway()
    {
        var candidates = CountLabels.Candidates(x: 100, top: 100, bottom: 150, thickness: 10, length: 30, Area);

        Assert.Equal(Box(95, 100 - CountLabels.Gap - 30, 10, 30), candidates[0]);
        Assert.Equal(Box(95, 150 + CountLabels.Gap, 10, 30), candidates[1]);
        Assert.Equal(Box(95, 100 - CountLabels.Gap - CountLabels.Step - 30, 10, 30), candidates[2]);
        Assert.Equal(Box(95, 150 + CountLabels.Gap + CountLabels.Step, 10, 30), candidates[3]);

        // Every place down to the area's edges is offered, and none beyond them but the first two.
        Assert.All(candidates.Skip(2), c => Assert.True(BoxPlacement.Inside(c, Area), c.ToString()));
        Assert.Contains(candidates, c => c.Top - Area.Top < CountLabels.Step);
        Assert.Contains(candidates, c => Area.Bottom - c.Bottom < CountLabels.Step);
    }
}
