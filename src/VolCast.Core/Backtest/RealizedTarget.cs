namespace VolCast.Core.Backtest;

/// <summary>How the realized volatility that a forecast made at t is scored against is measured over t+1 .. t+h.</summary>
public enum RealizedTarget
{
    /// <summary>Zero-mean close-to-close: RV(t,h) = sqrt(A/h · Σ_{i=1..h} r²_{t+i}) with log returns (the default; docs/conventions.md#the-realized-target).</summary>
    SquaredReturns,

    /// <summary>Range-based: sqrt(A/h · Σ_{i=1..h} Parkinson term of bar t+i); needs high and low.</summary>
    Parkinson,

    /// <summary>Range-based: sqrt(A/h · Σ_{i=1..h} Garman-Klass term of bar t+i); needs open, high and low.</summary>
    GarmanKlass,

    /// <summary>Range-based: sqrt(A/h · Σ_{i=1..h} Rogers-Satchell term of bar t+i); needs open, high and low.</summary>
    RogersSatchell,
}
