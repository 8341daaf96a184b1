using ScottPlot;

namespace VolCast.Reports.Charts;

/// <summary>
/// Places boxes (labels, markers) in pixel space so that none covers another: a greedy pass that gives each item, in
/// turn, the first of its candidate places that stays inside the bounds and clear of every fixed obstacle and of every
/// box already placed. Pure: the same candidates give the same places.
/// </summary>
internal static class BoxPlacement
{
    /// <summary>No candidate was free: the caller decides what to draw (it is never placed, so it blocks nothing).</summary>
    public const int None = -1;

    /// <summary>Chooses one candidate box for each item, first come first served.</summary>
    /// <param name="candidates">For each item, its candidate boxes in order of preference.</param>
    /// <param name="bounds">The area every placed box must lie in.</param>
    /// <param name="obstacles">Boxes already on the image that no placed box may cover.</param>
    /// <returns>For each item, the index of its chosen candidate, or <see cref="None"/> when every candidate was taken or out of bounds.</returns>
    public static int[] Place(IReadOnlyList<IReadOnlyList<PixelRect>> candidates, PixelRect bounds, IReadOnlyList<PixelRect>? obstacles = null)
    {
        ArgumentNullException.ThrowIfNull(candidates);
        var taken = new List<PixelRect>(obstacles ?? []);
        var chosen = new int[candidates.Count];
        for (var i = 0; i < candidates.Count; i++)
        {
            chosen[i] = None;
            for (var c = 0; c < candidates[i].Count; c++)
            {
                var box = candidates[i][c];
                if (Inside(box, bounds) && !taken.Exists(t => Overlap(t, box)))
                {
                    chosen[i] = c;
                    taken.Add(box);
                    break;
                }
            }
        }

        return chosen;
    }

    /// <summary>
    /// The box each item is drawn in: its place from <see cref="Place"/>, or its first candidate when none was free (drawn
    /// there over whatever it covers, so that nothing is left out).
    /// </summary>
    /// <param name="candidates">For each item, its candidate boxes in order of preference; each item has at least one.</param>
    /// <param name="bounds">The area every placed box must lie in.</param>
    /// <param name="obstacles">Boxes already on the image that no placed box may cover.</param>
    /// <returns>One box per item, in the order of <paramref name="candidates"/>.</returns>
    public static PixelRect[] PlaceOrFirst(IReadOnlyList<IReadOnlyList<PixelRect>> candidates, PixelRect bounds, IReadOnlyList<PixelRect>? obstacles = null)
    {
        var chosen = Place(candidates, bounds, obstacles);
        var boxes = new PixelRect[candidates.Count];
        for (var i = 0; i < boxes.Length; i++)
        {
            boxes[i] = candidates[i][chosen[i] == None ? 0 : chosen[i]];
        }

        return boxes;
    }

    /// <summary>Whether two boxes share any area (boxes that only touch along an edge do not).</summary>
    public static bool Overlap(PixelRect a, PixelRect b) =>
        a.Left < b.Right && b.Left < a.Right && a.Top < b.Bottom && b.Top < a.Bottom;

    /// <summary>Whether a box lies wholly inside the bounds (pixel y grows downwards: top is the smaller value).</summary>
    public static bool Inside(PixelRect box, PixelRect bounds) =>
        box.Left >= bounds.Left && box.Right <= bounds.Right && box.Top >= bounds.Top && box.Bottom <= bounds.Bottom;
}
