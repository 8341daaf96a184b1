using System.Reflection;
using System.Text.RegularExpressions;

namespace VolCast.Core.Tests;

/// <summary>Rules of the code base that a reviewer would otherwise have to remember.</summary>
public partial class ConventionTests
{
    private static readonly Assembly Core = typeof(VolCast.Core.Data.PriceHistory).Assembly;

    [Fact]
    public void CoreSources_DoNoFileOrConsoleIo()
    {
        var offenders = new List<string>();
        foreach (var file in Directory.EnumerateFiles(Path.Combine(RepositoryRoot.Path, "src", "VolCast.Core"), "*.cs", SearchOption.AllDirectories))
        {
            if (file.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}", StringComparison.Ordinal))
            {
                continue;
            }

            var text = File.ReadAllText(file);
            if (ForbiddenIo().IsMatch(text))
            {
                offenders.Add(Path.GetFileName(file));
            }
        }

        Assert.Empty(offenders);
    }

    [Fact]
    public void CoreAssembly_ReferencesNoAssemblyButTheFrameworkAndMathNet()
    {
        var names = Core.GetReferencedAssemblies().Select(a => a.Name!).ToList();

        Assert.All(names, n => Assert.True(
            n.StartsWith("System", StringComparison.Ordinal) || n == "netstandard" || n.StartsWith("MathNet", StringComparison.Ordinal),
            $"VolCast.Core references {n}"));
    }

    [Fact]
    public void PublicTypes_AreOnePerFileNamedAfterTheType()
    {
        var root = Path.Combine(RepositoryRoot.Path, "src");
        var missing = new List<string>();
        foreach (var assembly in new[] { Core })
        {
            foreach (var type in assembly.GetExportedTypes().Where(t => !t.IsNested))
            {
                var name = type.Name.Split('`')[0];
                var found = Directory.EnumerateFiles(root, name + ".cs", SearchOption.AllDirectories).Any();
                if (!found)
                {
                    missing.Add(type.FullName!);
                }
            }
        }

        Assert.Empty(missing);
    }

    [GeneratedRegex(@"\bSystem\.IO\b|\bConsole\.|\bFile\.(Read|Write|Open|Create)|\bStreamReader\b|\bStreamWriter\b")]
    private static partial Regex ForbiddenIo();
}
