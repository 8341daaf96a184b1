namespace VolCast.Core.Tests.Support;

/// <summary>The property tests' seed rule (DEVELOPERS.md, "Property tests"): fixed under CI, fresh elsewhere, overridable.</summary>
public sealed class PropertySeedTests
{
    [Fact]
    public void Resolve_UnderCiWithoutVariable_IsTheFixedCiSeed() =>
        Assert.Equal(PropertySeed.Ci, PropertySeed.Resolve(variable: null, ci: "true"));

    [Theory]
    [InlineData(null)]
    [InlineData("false")]
    public void Resolve_OutsideCiWithoutVariable_IsFresh(string? ci) =>
        Assert.Null(PropertySeed.Resolve(variable: null, ci));

    [Theory]
    [InlineData("(42,7)", "true")]
    [InlineData("(42,7)", null)]
    [InlineData("(42,7,3)", null)]
    public void Resolve_VariableSet_IsThatSeedEvenUnderCi(string variable, string? ci) =>
        Assert.Equal(variable, PropertySeed.Resolve(variable, ci));

    [Fact]
    public void Resolve_VariableFresh_IsFreshEvenUnderCi() =>
        Assert.Null(PropertySeed.Resolve("fresh", "true"));

    [Fact]
    public void Resolve_MalformedVariable_SaysWhatASeedLooksLike()
    {
        var ex = Assert.Throws<FormatException>(() => PropertySeed.Resolve("42", "true"));
        Assert.Contains(PropertySeed.Variable, ex.Message, StringComparison.Ordinal);
        Assert.Contains("(seed,gamma)", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Ci_IsAPairWithAnOddGamma()
    {
        // FsCheck's generator is SplitMix (Steele, Lea and Flood 2014), whose gamma must be odd.
        var parts = PropertySeed.Ci.Trim('(', ')').Split(',');
        Assert.Equal(2, parts.Length);
        Assert.Equal(1UL, ulong.Parse(parts[1], System.Globalization.CultureInfo.InvariantCulture) % 2);
    }
}
