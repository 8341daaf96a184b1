namespace VolCast.TestSupport;

/// <summary>Standard normal draws from a seeded <see cref="Random"/>, for invented test data.</summary>
public static class Gaussian
{
    /// <summary>
    /// One standard normal draw by the Box-Muller transform (Box and Muller 1958), z = √(−2 ln u₁) cos(2π u₂), taking
    /// u₁ then u₂ from <paramref name="random"/>; u₁ = 1 − U lies in (0, 1], so the logarithm is finite. The second
    /// value of the pair is not kept, so each call consumes exactly two uniforms.
    /// </summary>
    public static double Next(Random random)
    {
        var u1 = 1.0 - random.NextDouble();
        var u2 = random.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }
}
