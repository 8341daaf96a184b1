namespace VolCast.Core.Estimators;

/// <summary>The realized-volatility estimators VolCast computes over rolling windows of daily bars.</summary>
public enum Estimator
{
    /// <summary>Standard deviation of daily close-to-close log returns (sample or zero-mean convention).</summary>
    CloseToClose,

    /// <summary>Parkinson (1980): the squared high-low log range scaled by 1/(4 ln 2).</summary>
    Parkinson,

    /// <summary>Garman and Klass (1980): 0.5 ln(H/L)² − (2 ln 2 − 1) ln(C/O)², without the overnight term.</summary>
    GarmanKlass,

    /// <summary>Rogers and Satchell (1991): ln(H/C) ln(H/O) + ln(L/C) ln(L/O), unbiased for any drift.</summary>
    RogersSatchell,

    /// <summary>Yang and Zhang (2000): overnight variance + k·open-to-close variance + (1 − k)·Rogers-Satchell.</summary>
    YangZhang,
}
