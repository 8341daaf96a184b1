namespace VolCast.Core.Demo;

/// <summary>
/// A small invented universe for trying a batch over many names: twenty assets with different volatility levels,
/// regimes, persistence, leverage, jumps and implied premiums. Every name is of our own making.
/// </summary>
/// <remarks>
/// Each asset's parameters are drawn from ranges by a seeded generator, then its data come from
/// <see cref="DemoScenarioGenerator"/> with its own seed (the universe seed plus its position), over
/// <see cref="Years"/> years from <see cref="Start"/>. The premium ranges from −1 to +6 volatility points, so some
/// names have implied below the volatility that followed.
/// </remarks>
public static class DemoUniverse
{
    /// <summary>The calendar years generated per asset.</summary>
    public const int Years = 8;

    /// <summary>Gets the first calendar date of every asset.</summary>
    public static DateOnly Start { get; } = new(2017, 1, 2);

    /// <summary>Gets the invented names, in order.</summary>
    public static IReadOnlyList<string> Names { get; } =
    [
        "aspen-hollow", "basalt-cove", "cedar-falls", "dune-harbor", "elm-crossing", "fern-valley", "granite-bay",
        "heron-marsh", "iris-point", "juniper-flats", "kestrel-peak", "larch-meadow", "maple-inlet", "nettle-creek",
        "oak-terrace", "pine-lagoon", "quartz-ridge", "rowan-heath", "sorrel-bluff", "tamarack-glen",
    ];

    /// <summary>The parameters of every asset, drawn from <paramref name="seed"/>.</summary>
    /// <param name="seed">The universe seed.</param>
    /// <returns>One entry per name of <see cref="Names"/>, in order.</returns>
    public static IReadOnlyList<DemoAssetParameters> Parameters(int seed)
    {
        var random = new Random(seed);
        var list = new List<DemoAssetParameters>(Names.Count);
        for (var i = 0; i < Names.Count; i++)
        {
            double Uniform(double low, double high) => Math.Round(low + ((high - low) * random.NextDouble()), 4);
            var baseVol = Uniform(0.12, 0.50);
            var calmFrom = Uniform(0.5, 3.0);
            var stressFrom = Uniform(4.0, 6.5);
            list.Add(new DemoAssetParameters(
                BaseVolatility: baseVol,
                CalmVolatility: Math.Round(baseVol * Uniform(0.5, 0.8), 4),
                StressedVolatility: Math.Round(baseVol * Uniform(1.5, 2.6), 4),
                CalmFromYear: calmFrom,
                CalmToYear: calmFrom + Uniform(1.0, 2.0),
                StressFromYear: stressFrom,
                StressToYear: stressFrom + Uniform(0.5, 1.5),
                Persistence: Uniform(0.95, 0.995),
                LogVolatilityShock: Uniform(0.03, 0.09),
                Leverage: Uniform(-0.8, 0.0),
                JumpProbability: Uniform(0.0, 0.01),
                JumpMean: Uniform(-0.08, 0.0),
                MeanPremium: Uniform(-0.01, 0.06),
                StartPrice: Math.Round(Uniform(10, 500), 0)));
        }

        return list;
    }

    /// <summary>Generates every asset of the universe.</summary>
    /// <param name="seed">The universe seed; the same seed gives the same data bit for bit.</param>
    /// <returns>The assets, in the order of <see cref="Names"/>.</returns>
    public static IReadOnlyList<DemoAsset> Generate(int seed)
    {
        var parameters = Parameters(seed);
        var assets = new List<DemoAsset>(Names.Count);
        for (var i = 0; i < Names.Count; i++)
        {
            assets.Add(new DemoScenarioGenerator(unchecked(seed + i + 1), parameters[i], Years).GenerateAsset(Names[i], Start));
        }

        return assets;
    }
}
