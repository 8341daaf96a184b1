using System.Text.RegularExpressions;

namespace VolCast.Core.Tests;

/// <summary>The repository explains itself: its comments and pages cite files that are in it.</summary>
public partial class DocumentationTests
{
    // Written in pieces so that this file does not cite them itself.
    private static readonly string[] OutsideDocuments = ["references" + ".md", "design" + ".md", "style" + ".md", "../" + "shared"];

    private static readonly string[] Extensions = [".cs", ".md", ".R", ".py", ".sh"];

    [Fact]
    public void RepositoryFiles_CiteNoDocumentOutsideTheRepository()
    {
        var offenders = new List<string>();
        foreach (var (path, text) in RepositoryTextFiles())
        {
            foreach (var cited in OutsideDocuments)
            {
                if (text.Contains(cited, StringComparison.OrdinalIgnoreCase))
                {
                    offenders.Add($"{path} cites {cited}");
                }
            }
        }

        Assert.Empty(offenders);
    }

    [Fact]
    public void RepositoryFiles_CiteOnlyDocsSectionsThatExist()
    {
        var root = RepositoryRoot.Path;
        var missing = new List<string>();
        foreach (var (path, text) in RepositoryTextFiles())
        {
            foreach (Match m in DocsCitation().Matches(text))
            {
                var page = Path.Combine(root, "docs", m.Groups["page"].Value + ".md");
                if (!File.Exists(page))
                {
                    missing.Add($"{path}: docs/{m.Groups["page"].Value}.md does not exist");
                    continue;
                }

                var anchor = m.Groups["anchor"].Value;
                if (anchor.Length > 0 && !Anchors(page).Contains(anchor))
                {
                    missing.Add($"{path}: docs/{m.Groups["page"].Value}.md has no section #{anchor}");
                }
            }
        }

        Assert.Empty(missing);
    }

    private static IEnumerable<(string Path, string Text)> RepositoryTextFiles()
    {
        var root = RepositoryRoot.Path;
        var skipped = new[] { "bin", "obj", ".git" };
        var pending = new Stack<string>([root]);
        while (pending.Count > 0)
        {
            var dir = pending.Pop();
            foreach (var sub in Directory.EnumerateDirectories(dir))
            {
                if (!skipped.Contains(Path.GetFileName(sub)))
                {
                    pending.Push(sub);
                }
            }

            foreach (var file in Directory.EnumerateFiles(dir))
            {
                if (Extensions.Contains(Path.GetExtension(file), StringComparer.Ordinal))
                {
                    yield return (Path.GetRelativePath(root, file), File.ReadAllText(file));
                }
            }
        }
    }

    // GitHub's heading anchors: lower case, punctuation other than '-' dropped, spaces to '-'.
    private static HashSet<string> Anchors(string page) =>
        File.ReadLines(page)
            .Where(line => line.StartsWith('#'))
            .Select(line => line.TrimStart('#').Trim().ToLowerInvariant())
            .Select(heading => AnchorDropped().Replace(heading, string.Empty).Replace(' ', '-'))
            .ToHashSet(StringComparer.Ordinal);

    [GeneratedRegex(@"docs/(?<page>[a-z]+)\.md(#(?<anchor>[a-z0-9-]+))?")]
    private static partial Regex DocsCitation();

    [GeneratedRegex(@"[^a-z0-9 \-]")]
    private static partial Regex AnchorDropped();
}
