namespace VolCast.IO;

/// <summary>What to do with rows that pass every row check but look wrong against their neighbours (a bad print, a stale run, a value far outside the realized range).</summary>
public enum SuspectAction
{
    /// <summary>Keep the rows and list each finding as a warning (console, run.json, report).</summary>
    Warn = 0,

    /// <summary>Remove the named rows (a bar as a missing day, an implied value as a missing quote) and list them in rejected-rows.csv.</summary>
    Drop = 1,

    /// <summary>Refuse the input (exit code 3) with the full list of findings.</summary>
    Stop = 2,
}
