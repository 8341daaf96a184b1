namespace VolCast.Cli;

/// <summary>The stages of one backtest run, in order (<see cref="BacktestPipeline.Run"/>); each checks for cancellation.</summary>
internal enum BacktestStage
{
    /// <summary>The output folder is checked against the inputs and locked or found free.</summary>
    CheckOutput,

    /// <summary>The input files are read and validated.</summary>
    Load,

    /// <summary>The forecasters walk forward and are scored (Core).</summary>
    Forecast,

    /// <summary>The odds checks: probability calibration and range coverage.</summary>
    Calibrate,

    /// <summary>The rule is traded as delta-hedged straddles and the threshold search tested for data snooping.</summary>
    RulePnl,

    /// <summary>The data files are written into the staging folder.</summary>
    WriteData,

    /// <summary>The charts are drawn, the page rendered and both written into the staging folder.</summary>
    WriteReport,

    /// <summary>The staged run is moved into place.</summary>
    Commit,
}
