using System.Globalization;
using System.Text;

namespace VolCast.IO.Reading;

/// <summary>Shows a value from a user's file inside a message: quoted, shortened, control characters escaped.</summary>
internal static class ValueText
{
    private const int MaxShown = 40;

    /// <summary>Returns the value in single quotes, at most 40 characters, with control, format (invisible, direction-changing) and surrogate characters written as \uXXXX.</summary>
    public static string Quote(string value)
    {
        var sb = new StringBuilder(Math.Min(value.Length, MaxShown) + 8).Append('\'');
        var shown = Math.Min(value.Length, MaxShown);
        for (var i = 0; i < shown; i++)
        {
            var c = value[i];
            if (char.IsControl(c) || char.IsSurrogate(c) || c == '\uFFFD' || char.GetUnicodeCategory(c) == UnicodeCategory.Format)
            {
                sb.Append(CultureInfo.InvariantCulture, $"\\u{(int)c:X4}");
            }
            else
            {
                sb.Append(c);
            }
        }

        if (value.Length > MaxShown)
        {
            sb.Append(CultureInfo.InvariantCulture, $"… ({value.Length} characters)");
        }

        return sb.Append('\'').ToString();
    }

    /// <summary>Formats a number with the invariant culture, round-trip precision.</summary>
    public static string Number(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    /// <summary>Formats a date as yyyy-MM-dd.</summary>
    public static string Date(DateOnly value) => value.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);
}
