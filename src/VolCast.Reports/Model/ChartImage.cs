namespace VolCast.Reports.Model;

/// <summary>A rendered chart: its file name, caption and PNG bytes.</summary>
/// <param name="FileName">The PNG's file name, e.g. <c>cone.png</c>.</param>
/// <param name="Title">The caption shown above the chart in the report.</param>
/// <param name="Description">One or two sentences saying how to read the chart; also the image's alternative text.</param>
/// <param name="Png">The PNG bytes.</param>
public sealed record ChartImage(string FileName, string Title, string Description, ReadOnlyMemory<byte> Png);
