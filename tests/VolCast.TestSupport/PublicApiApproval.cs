using System.Reflection;
using PublicApiGenerator;

namespace VolCast.TestSupport;

/// <summary>
/// Compares an assembly's public API with its approved file under tests/&lt;Project&gt;.Tests/PublicApi/. On a difference
/// it writes the generated API as a received file beside the approved one and fails; with VOLCAST_ACCEPT_API=1 it
/// writes the approved file instead (DEVELOPERS.md, "Public surface").
/// </summary>
public static class PublicApiApproval
{
    /// <summary>The environment variable that accepts the generated API as the approved one.</summary>
    public const string AcceptVariable = "VOLCAST_ACCEPT_API";

    /// <summary>Checks <paramref name="assembly"/> against tests/<paramref name="testProject"/>/PublicApi/NAME.approved.txt.</summary>
    public static void Verify(Assembly assembly, string testProject)
    {
        ArgumentNullException.ThrowIfNull(assembly);
        var name = assembly.GetName().Name!;
        var folder = RepositoryRoot.Combine("tests", testProject, "PublicApi");
        var approvedPath = Path.Combine(folder, name + ".approved.txt");
        var receivedPath = Path.Combine(folder, name + ".received.txt");
        var generated = Normalise(assembly.GeneratePublicApi(new ApiGeneratorOptions
        {
            // The compiler's own attributes say nothing about the surface a caller sees.
            ExcludeAttributes = ["System.Runtime.Versioning.TargetFrameworkAttribute"],
        }));

        if (Environment.GetEnvironmentVariable(AcceptVariable) == "1")
        {
            Directory.CreateDirectory(folder);
            File.WriteAllText(approvedPath, generated);
            File.Delete(receivedPath);
            return;
        }

        var approved = File.Exists(approvedPath) ? Normalise(File.ReadAllText(approvedPath)) : "";
        if (approved == generated)
        {
            File.Delete(receivedPath);
            return;
        }

        Directory.CreateDirectory(folder);
        File.WriteAllText(receivedPath, generated);
        throw new PublicApiChangedException(
            $"The public API of {name} differs from {approvedPath}. The generated API is in {receivedPath}; compare the two. "
            + $"If the change is meant, accept it with `{AcceptVariable}=1 dotnet test VolCast.sln --filter PublicApi` (or copy the "
            + "received file over the approved one) and commit the approved file; otherwise make the new type or member internal.");
    }

    private static string Normalise(string text) => text.Replace("\r\n", "\n", StringComparison.Ordinal).TrimEnd() + "\n";
}
