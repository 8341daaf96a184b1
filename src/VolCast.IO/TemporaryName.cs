using System.Diagnostics.CodeAnalysis;
using System.Globalization;
using System.Text.RegularExpressions;

namespace VolCast.IO;

/// <summary>
/// The hidden name of what is written beside its target before it moves into place, <c>.NAME.PID.ID.KIND</c>: the
/// target's name, the writing process's id, a random id, and the kind (<c>tmp</c> while written, <c>old</c> for a
/// results folder being replaced). A killed run leaves such names behind; the process id tells a later run on the same
/// machine whether their writer still runs.
/// </summary>
public static partial class TemporaryName
{
    /// <summary>A new name for <paramref name="target"/> (a file or folder name, without its folder) of this process.</summary>
    /// <param name="target">The name of the file or folder it stands for.</param>
    /// <param name="kind"><c>tmp</c> or <c>old</c>.</param>
    /// <returns>The hidden name.</returns>
    public static string For(string target, string kind) =>
        string.Create(CultureInfo.InvariantCulture, $".{target}.{Environment.ProcessId}.{Guid.NewGuid():N}.{kind}");

    /// <summary>Reads a name made by <see cref="For"/>.</summary>
    /// <param name="name">A file or folder name, without its folder.</param>
    /// <param name="target">The name it stands for.</param>
    /// <param name="processId">The id of the process that made it.</param>
    /// <param name="kind"><c>tmp</c> or <c>old</c>.</param>
    /// <returns>Whether <paramref name="name"/> has that form.</returns>
    public static bool TryParse(string name, [NotNullWhen(true)] out string? target, out int processId, [NotNullWhen(true)] out string? kind)
    {
        ArgumentNullException.ThrowIfNull(name);
        var match = Pattern().Match(name);
        if (match.Success && int.TryParse(match.Groups["pid"].Value, NumberStyles.None, CultureInfo.InvariantCulture, out processId))
        {
            target = match.Groups["name"].Value;
            kind = match.Groups["kind"].Value;
            return true;
        }

        (target, processId, kind) = (null, 0, null);
        return false;
    }

    [GeneratedRegex(@"^\.(?<name>.+)\.(?<pid>[0-9]+)\.[0-9a-f]{32}\.(?<kind>tmp|old)$", RegexOptions.CultureInvariant)]
    private static partial Regex Pattern();
}
