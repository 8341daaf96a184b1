namespace VolCast.Core.Forecasters;

/// <summary>The daily variance proxy whose daily, weekly and monthly averages are the HAR regressors.</summary>
internal enum HarProxy
{
    /// <summary>The squared close-to-close log return r²ₜ (default; needs closes only).</summary>
    SquaredReturn,

    /// <summary>The Garman–Klass per-bar term 0.5 ln(H/L)² − (2 ln 2 − 1) ln(C/O)² (needs open, high, low; no overnight gap).</summary>
    GarmanKlass,
}
