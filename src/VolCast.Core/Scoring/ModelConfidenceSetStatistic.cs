namespace VolCast.Core.Scoring;

/// <summary>The equivalence-test statistic of the model confidence set (Hansen, Lunde and Nason 2011).</summary>
public enum ModelConfidenceSetStatistic
{
    /// <summary>
    /// T_max = max_i t_i with t_i = d̄_i / se(d̄_i) and d_i,t = L_i,t − (mean loss over the models in the set at t);
    /// the model with the largest t_i is eliminated.
    /// </summary>
    TMax,

    /// <summary>
    /// T_R = max_{i,j} |t_ij| with t_ij = d̄_ij / se(d̄_ij) and d_ij,t = L_i,t − L_j,t; the model with the largest
    /// max_j t_ij is eliminated.
    /// </summary>
    TRange,
}
