using VolCast.Core.Forecasters;

namespace VolCast.Core.Tests.Forecasters;

public sealed class ForecasterSpecTests
{
    [Theory]
    // Canonical forms come back unchanged.
    [InlineData("ewma:0.94", "ewma:0.94")]
    // The default decay is J.P. Morgan/Reuters (1996) technical document's 0.94 for daily data (docs/methods.md#ewma [C2]).
    [InlineData("ewma", "ewma:0.94")]
    [InlineData(" EWMA:0.97 ", "ewma:0.97")]
    [InlineData("garch", "garch")]
    [InlineData("GARCH:zero-mean", "garch:zero-mean")]
    [InlineData("gjr-garch", "gjr-garch")]
    [InlineData("gjr-garch:zero-mean", "gjr-garch:zero-mean")]
    [InlineData("har", "har")]
    [InlineData("har:garman-klass", "har:garman-klass")]
    [InlineData("implied", "implied")]
    [InlineData("Implied-Debiased", "implied-debiased")]
    [InlineData("implied-debiased:252", "implied-debiased:252")]
    // Historical windows: estimator names of docs/files.md#names-of-estimators-and-forecasters, window in trading days.
    [InlineData("yang-zhang:21", "yang-zhang:21")]
    [InlineData(" Close-To-Close:63 ", "close-to-close:63")]
    [InlineData("parkinson:5", "parkinson:5")]
    public void Parse_ValidSpec_GivesCanonicalSpec(string spec, string canonical)
    {
        Assert.Equal(canonical, ForecasterSpec.Parse(spec).Spec);
    }

    [Theory]
    // Unknown name.
    [InlineData("garch2")]
    // Decay outside (0, 1) or not a number.
    [InlineData("ewma:1")]
    [InlineData("ewma:abc")]
    // Unknown option.
    [InlineData("garch:t")]
    [InlineData("implied:30")]
    [InlineData("implied-debiased:0")]
    [InlineData("implied-debiased:x")]
    [InlineData("")]
    public void Parse_InvalidSpec_ThrowsListingValidSpecs(string spec)
    {
        var ex = Assert.Throws<ArgumentException>(() => ForecasterSpec.Parse(spec));
        Assert.Contains("Valid forecasters", ex.Message, StringComparison.Ordinal);
        foreach (var form in new[] { "ewma[:LAMBDA]", "garch[:zero-mean]", "gjr-garch[:zero-mean]", "har[:garman-klass]", "implied" })
        {
            Assert.Contains(form, ex.Message, StringComparison.Ordinal);
        }
    }

    [Theory]
    // Window missing, below 2, or not a whole number.
    [InlineData("yang-zhang")]
    [InlineData("close-to-close:1")]
    [InlineData("parkinson:2.5")]
    [InlineData("garman-klass:-5")]
    public void Parse_BadHistoricalWindow_ThrowsNamingTheForm(string spec)
    {
        var ex = Assert.Throws<ArgumentException>(() => ForecasterSpec.Parse(spec));
        Assert.Contains(":WINDOW", ex.Message, StringComparison.Ordinal);
        Assert.Contains("Valid forecasters", ex.Message, StringComparison.Ordinal);
    }
}
