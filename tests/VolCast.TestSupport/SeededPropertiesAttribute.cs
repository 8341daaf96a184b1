using FsCheck.Xunit;

namespace VolCast.TestSupport;

/// <summary>
/// Put on a test assembly (<c>[assembly: SeededProperties]</c>): every FsCheck property in it starts from
/// <see cref="PropertySeed.Current"/> (fixed under CI, fresh elsewhere, or the seed given in
/// <see cref="PropertySeed.Variable"/>). A property's own <c>Replay</c> still wins. FsCheck prints the seed of any
/// failure, and the property tests' output names the seed in force.
/// </summary>
[AttributeUsage(AttributeTargets.Assembly)]
public sealed class SeededPropertiesAttribute : PropertiesAttribute
{
    /// <summary>Reads the seed when xunit reads the attribute, that is when the properties run.</summary>
    public SeededPropertiesAttribute()
    {
        var seed = PropertySeed.Current;
        if (seed is not null)
        {
            Replay = seed;
        }
    }
}
