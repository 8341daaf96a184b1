namespace VolCast.Reports.Model;

/// <summary>Fixed wording shared by every report.</summary>
internal static class ReportText
{
    /// <summary>The cautions every report ends with.</summary>
    public static IReadOnlyList<string> Cautions { get; } =
    [
        "These results describe how the methods would have done in the past, on the data given here, and nothing more.",
        "Nothing in this report is investment, trading or risk advice.",
        "A forecaster that ranked well on this history can do worse on new data; models fail out of sample.",
        "Probabilities and ranges that held on this history can fail on new data: calibrated odds in the past do not make calibrated odds in the future.",
        "Trading options can lose money, including more than the premium paid when selling.",
        "Follow your firm's rules and those of your jurisdiction, and consult a licensed professional before acting on any of this.",
    ];

    /// <summary>The cautions shown beside the "Would the rule have paid?" section.</summary>
    public static IReadOnlyList<string> PnlCautions { get; } =
    [
        "Short options can lose far more than the premium received: a short straddle's loss has no upper bound.",
        "The simulation ignores the smile (every trade is priced at the at-the-money implied volatility), early assignment, margin and liquidity.",
        "Past P&L does not predict future P&L: a rule that paid on this history can lose on the next.",
        "Follow the rules of your firm and of your jurisdiction before trading any of this.",
    ];
}
