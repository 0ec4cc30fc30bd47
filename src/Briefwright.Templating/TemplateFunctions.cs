using System.Globalization;

namespace Briefwright.Templating;

/// <summary>
/// Number and date formatting for templates (<c>pct</c>, <c>change</c>, <c>num</c>, <c>sig</c>, <c>big</c>, <c>years</c>,
/// <c>pv</c>, <c>prob</c>, <c>date</c>), applying one policy written in docs/templates.md: changes in percent to one
/// decimal, years to one decimal, present values to two significant figures, probabilities from a sample never as
/// 0% or 100%, no exponent notation.
/// </summary>
public static class TemplateFunctions
{
    private static readonly CultureInfo Invariant = CultureInfo.InvariantCulture;

    /// <summary>A fraction as a percentage: 0.0412 → "4.1%".</summary>
    public static string Pct(double fraction, int digits = 1) => Fixed(fraction * 100, digits) + L.PercentSign;

    /// <summary>A percentage change with its sign: 4.08 → "+4.1%", −0.3 → "−0.3%".</summary>
    public static string Change(double percent, int digits = 1)
    {
        string s = Fixed(Math.Abs(percent), digits);
        return (Math.Round(percent, digits) > 0 ? "+" : Math.Round(percent, digits) < 0 ? "−" : "") + s + L.PercentSign;
    }

    /// <summary>Fixed decimals with a true minus sign.</summary>
    public static string Num(double value, int digits = 2) => Fixed(value, digits);

    /// <summary>Significant digits: 0.0004123 → "0.000412" for 3.</summary>
    public static string Sig(double value, int digits = 3)
    {
        if (value == 0 || !double.IsFinite(value)) return Fixed(value, 0);
        int magnitude = (int)Math.Floor(Math.Log10(Math.Abs(value)));
        int decimals = Math.Max(0, digits - 1 - magnitude);
        double rounded = Math.Round(value, Math.Min(15, decimals));
        string s = FixedInvariant(rounded, Math.Min(15, decimals));
        return Localise(s.Contains('.') ? s.TrimEnd('0').TrimEnd('.') : s);
    }

    /// <summary>Large numbers with thousands separators: 1234567 → "1,234,567".</summary>
    public static string Big(double value, int digits = 0)
    {
        string s = Math.Abs(value).ToString("N" + Math.Clamp(digits, 0, 15), Invariant);
        int whole = s.IndexOf('.') is var dot and >= 0 ? dot : s.Length;
        var language = L;
        // Below the language's minimum grouping (Spanish writes 2000 but 20 000), no separator at all.
        if (whole - s.Count(c => c == ',') < 4 + language.MinimumGroupingDigits - 1) s = s.Replace(",", "", StringComparison.Ordinal);
        s = s.Replace(",", "\u0001", StringComparison.Ordinal).Replace(".", language.Decimal, StringComparison.Ordinal).Replace("\u0001", language.Group, StringComparison.Ordinal);
        return (value < 0 ? "−" : "") + s;
    }

    /// <summary>Years, always to one decimal (the same precision beside each other): 34.51 → "34.5 years"; 28 → "28.0 years".</summary>
    public static string Years(double value, int digits = 1) => L.Format("unit.years", Fixed(value, digits));

    /// <summary>A present value to two significant figures: 0.8213 → "0.82", 3.449 → "3.4", 0.002 → "&lt; 0.01", −0.004 → "&gt; −0.01".</summary>
    public static string Pv(double value)
    {
        if (value == 0) return "0";
        if (Math.Abs(value) < 0.01) return value > 0 ? "< " + Localise("0.01") : "> −" + Localise("0.01");
        int magnitude = (int)Math.Floor(Math.Log10(Math.Abs(value)));
        int decimals = Math.Max(0, 1 - magnitude);
        double rounded = Math.Round(value, decimals);
        if (Math.Abs(rounded) >= 10) { decimals = 0; rounded = Math.Round(value / Math.Pow(10, magnitude - 1)) * Math.Pow(10, magnitude - 1); }
        return Fixed(rounded, decimals);
    }

    /// <summary>
    /// A probability estimated from a sample: one decimal, but never "0.0%" or "100.0%", which a finite sample cannot
    /// show: 1 → "&gt; 99.9%", 0 → "&lt; 0.1%".
    /// </summary>
    public static string Prob(double fraction)
    {
        double pct = Math.Round(fraction * 100, 1);
        if (pct >= 100) return "> " + Localise("99.9") + L.PercentSign;
        if (pct <= 0) return "< " + Localise("0.1") + L.PercentSign;
        return Fixed(pct, 1) + L.PercentSign;
    }

    /// <summary>A small tolerance in words, without exponent notation: 1e-10 → "less than a billionth".</summary>
    public static string Small(double value) => value switch
    {
        <= 1e-9 => L.Get("small.billionth"),
        <= 1e-6 => L.Get("small.millionth"),
        <= 1e-3 => L.Get("small.thousandth"),
        _ => Sig(value, 2),
    };

    /// <summary>A date as "30 November 2026"; accepts a date or YYYY-MM-DD text.</summary>
    public static string Date(object value) => value switch
    {
        DateOnly d => L.Date(d),
        DateTime dt => L.Date(DateOnly.FromDateTime(dt)),
        string s when DateOnly.TryParseExact(s, "yyyy-MM-dd", Invariant, DateTimeStyles.None, out var d) => L.Date(d),
        _ => value?.ToString() ?? "",
    };

    /// <summary>The language of the brief being written (<see cref="BriefLanguage.Current"/>).</summary>
    private static BriefLanguage L => BriefLanguage.Current;

    /// <summary>A number written with a point as the decimal mark, in the brief's language.</summary>
    public static string Localise(string invariant) => L.Decimal == "." ? invariant : invariant.Replace(".", L.Decimal, StringComparison.Ordinal);

    private static string Fixed(double value, int digits) => Localise(FixedInvariant(value, digits));

    private static string FixedInvariant(double value, int digits)
    {
        if (!double.IsFinite(value)) throw new InvalidOperationException($"A number to be printed in the brief is not finite. Got {value.ToString(Invariant)}.");
        string s = Math.Round(value, Math.Clamp(digits, 0, 15)).ToString("F" + Math.Clamp(digits, 0, 15), Invariant);
        if (s.StartsWith('-')) s = s.TrimStart('-') is var abs && abs.Trim('0', '.').Length == 0 ? abs : "−" + abs;
        return s;
    }
}
