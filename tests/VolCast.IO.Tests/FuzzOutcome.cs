namespace VolCast.IO.Tests;

/// <summary>The one rule every reader's fuzz test checks: a read either succeeds or refuses with a clean input error.</summary>
internal static class FuzzOutcome
{
    /// <summary>Runs a read of a mutated file named fuzz.csv; any exception but <see cref="InputDataException"/> (or, for a configuration, <see cref="VolCast.IO.Config.SettingRangeException"/>) escapes and fails the property.</summary>
    public static bool SucceedsOrRefusesCleanly(Action read)
    {
        try
        {
            read();
            return true;
        }
        catch (InputDataException e)
        {
            Assert.False(string.IsNullOrWhiteSpace(e.Problem));
            Assert.Equal("fuzz.csv", e.File);
            Assert.True(e.Line is null or >= 1, $"line {e.Line}");
            Assert.DoesNotContain("System.", e.Message, StringComparison.Ordinal); // no .NET type names for users
            return true;
        }
        catch (VolCast.IO.Config.SettingRangeException e)
        {
            // A configuration value outside its documented range: the file, the setting and its range are named.
            Assert.StartsWith("fuzz.csv: ", e.Message, StringComparison.Ordinal);
            Assert.Contains(" must be from ", e.Message, StringComparison.Ordinal);
            Assert.DoesNotContain("System.", e.Message, StringComparison.Ordinal);
            return true;
        }
    }
}
