namespace VolCast.Core.Options;

/// <summary>The right a European option gives its holder.</summary>
public enum OptionType
{
    /// <summary>The right to buy the underlying at the strike at expiry.</summary>
    Call,

    /// <summary>The right to sell the underlying at the strike at expiry.</summary>
    Put,
}
