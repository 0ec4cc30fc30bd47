using System.Globalization;
using Scriban.Runtime;

namespace Briefwright.Templating;

/// <summary>
/// Number and date formatting for templates (<c>pct</c>, <c>change</c>, <c>num</c>, <c>sig</c>, <c>big</c>,
/// <c>years</c>, <c>pv</c>, <c>prob</c>, <c>date</c>), applying one policy written in docs/templates.md: changes in
/// percent to one decimal, years to one decimal, present values to two significant figures, probabilities from a
/// sample never as 0% or 100%, no exponent notation.
/// </summary>
public class TemplateFunctions(BriefLanguage language)
{
    private static readonly CultureInfo Invariant = CultureInfo.InvariantCulture;

    /// <summary>A fraction as a percentage: 0.0412 → "4.1%".</summary>
    public string Pct(double fraction, int digits = 1) => Fixed(fraction * 100, digits) + L.PercentSign;

    /// <summary>A percentage change with its sign: 4.08 → "+4.1%", −0.3 → "−0.3%".</summary>
    public string Change(double percent, int digits = 1)
    {
        string s = Fixed(Math.Abs(percent), digits);
        return (Math.Round(percent, digits) > 0 ? "+" : Math.Round(percent, digits) < 0 ? "−" : "") + s + L.PercentSign;
    }

    /// <summary>Fixed decimals with a true minus sign.</summary>
    public string Num(double value, int digits = 2) => Fixed(value, digits);

    /// <summary>Significant digits: 0.0004123 → "0.000412" for 3.</summary>
    public string Sig(double value, int digits = 3)
    {
        if (value == 0 || !double.IsFinite(value)) return Fixed(value, 0);
        int magnitude = (int)Math.Floor(Math.Log10(Math.Abs(value)));
        int decimals = Math.Max(0, digits - 1 - magnitude);
        double rounded = Math.Round(value, Math.Min(15, decimals));
        string s = FixedInvariant(rounded, Math.Min(15, decimals));
        return Localise(s.Contains('.') ? s.TrimEnd('0').TrimEnd('.') : s);
    }

    /// <summary>Large numbers with thousands separators: 1234567 → "1,234,567".</summary>
    public string Big(double value, int digits = 0)
    {
        string s = Math.Abs(value).ToString("N" + Math.Clamp(digits, 0, 15), Invariant);
        int whole = s.IndexOf('.') is var dot and >= 0 ? dot : s.Length;
        var language = L;
        // Below the language's minimum grouping (Spanish writes 2000 but 20 000), no separator at all.
        if (whole - s.Count(c => c == ',') < 4 + language.MinimumGroupingDigits - 1)
            s = s.Replace(",", "", StringComparison.Ordinal);
        s = s.Replace(",", "\u0001", StringComparison.Ordinal).Replace(".", language.Decimal, StringComparison.Ordinal)
            .Replace("\u0001", language.Group, StringComparison.Ordinal);
        return (value < 0 ? "−" : "") + s;
    }

    /// <summary>
    /// Years, always to one decimal (the same precision beside each other): 34.51 → "34.5 years"; 28 → "28.0 years".
    /// </summary>
    public string Years(double value, int digits = 1) => L.Format("unit.years", Fixed(value, digits));

    /// <summary>
    /// A present value to two significant figures: 0.8213 → "0.82", 3.449 → "3.4", 0.002 → "&lt; 0.01",
    /// −0.004 → "&gt; −0.01".
    /// </summary>
    public string Pv(double value)
    {
        if (value == 0) return "0";
        if (Math.Abs(value) < 0.01) return value > 0 ? "< " + Localise("0.01") : "> −" + Localise("0.01");
        int magnitude = (int)Math.Floor(Math.Log10(Math.Abs(value)));
        int decimals = Math.Max(0, 1 - magnitude);
        double rounded = Math.Round(value, decimals);
        if (Math.Abs(rounded) >= 10)
        {
            decimals = 0;
            rounded = Math.Round(value / Math.Pow(10, magnitude - 1)) * Math.Pow(10, magnitude - 1);
        }
        return Fixed(rounded, decimals);
    }

    /// <summary>
    /// A probability estimated from a sample: one decimal, but never "0.0%" or "100.0%", which a finite sample cannot
    /// show: 1 → "&gt; 99.9%", 0 → "&lt; 0.1%".
    /// </summary>
    public string Prob(double fraction)
    {
        double pct = Math.Round(fraction * 100, 1);
        if (pct >= 100) return "> " + Localise("99.9") + L.PercentSign;
        if (pct <= 0) return "< " + Localise("0.1") + L.PercentSign;
        return Fixed(pct, 1) + L.PercentSign;
    }

    /// <summary>A small tolerance in words, without exponent notation: 1e-10 → "less than a billionth".</summary>
    public string Small(double value) => value switch
    {
        <= 1e-9 => L.Get("small.billionth"),
        <= 1e-6 => L.Get("small.millionth"),
        <= 1e-3 => L.Get("small.thousandth"),
        _ => Sig(value, 2),
    };

    /// <summary>A date as "30 November 2026"; accepts a date or YYYY-MM-DD text.</summary>
    public string Date(object value) => value switch
    {
        DateOnly d => L.Date(d),
        DateTime dt => L.Date(DateOnly.FromDateTime(dt)),
        string s when DateOnly.TryParseExact(s, "yyyy-MM-dd", Invariant, DateTimeStyles.None, out var d) => L.Date(d),
        _ => value?.ToString() ?? "",
    };

    /// <summary>The language of the brief being written, given when this set of words was made.</summary>
    public BriefLanguage L { get; } = language;

    /// <summary>A text of the brief's language, filled with <paramref name="args"/>.</summary>
    public string T(string key, params object?[] args) => L.Format(key, args);

    internal static ScriptObject Obj(params (string Key, object? Value)[] pairs)
    {
        var o = new ScriptObject();
        foreach (var (k, v) in pairs) o[k] = v;
        return o;
    }

    // The parts of a brief's words, each in this language (made when first used), so that one part reaches another
    // as it would a static class: Wording.Effect(x).
    private Wording? wording;
    private Caveats? caveats;
    private ProbabilityWords? probabilityWords;
    private OptimumModel? optimumModel;
    private Equations? equations;
    private KeyAssumptions? keyAssumptions;
    private AnalysisModel? analysisModel;
    private BriefModelBuilder? briefModelBuilder;

    public Wording Wording => wording ??= this as Wording ?? new Wording(L);
    public Caveats Caveats => caveats ??= this as Caveats ?? new Caveats(L);
    public ProbabilityWords ProbabilityWords
        => probabilityWords ??= this as ProbabilityWords ?? new ProbabilityWords(L);
    internal OptimumModel OptimumModel => optimumModel ??= this as OptimumModel ?? new OptimumModel(L);
    public Equations Equations => equations ??= this as Equations ?? new Equations(L);
    public KeyAssumptions KeyAssumptions => keyAssumptions ??= this as KeyAssumptions ?? new KeyAssumptions(L);
    internal AnalysisModel AnalysisModel => analysisModel ??= this as AnalysisModel ?? new AnalysisModel(L);
    public BriefModelBuilder BriefModelBuilder
        => briefModelBuilder ??= this as BriefModelBuilder ?? new BriefModelBuilder(L);

    /// <summary>
    /// Makes the formatting functions callable from templates under their snake_case names (<c>pct</c>, <c>change</c>,
    /// <c>num</c>, <c>sig</c>, <c>big</c>, <c>years</c>, <c>pv</c>, <c>prob</c>, <c>small</c>, <c>date</c>,
    /// <c>localise</c>), each writing in this set's language.
    /// </summary>
    public void AddTo(ScriptObject model)
    {
        model.AddFunction("pct", new Func<double, int, string>(Pct));
        model.AddFunction("change", new Func<double, int, string>(Change));
        model.AddFunction("num", new Func<double, int, string>(Num));
        model.AddFunction("sig", new Func<double, int, string>(Sig));
        model.AddFunction("big", new Func<double, int, string>(Big));
        model.AddFunction("years", new Func<double, int, string>(Years));
        model.AddFunction("pv", new Func<double, string>(Pv));
        model.AddFunction("prob", new Func<double, string>(Prob));
        model.AddFunction("small", new Func<double, string>(Small));
        model.AddFunction("date", new Func<object, string>(Date));
        model.AddFunction("localise", new Func<string, string>(Localise));
    }

    /// <summary>A number written with a point as the decimal mark, in the brief's language.</summary>
    public string Localise(string invariant) =>
        L.Decimal == "." ? invariant : invariant.Replace(".", L.Decimal, StringComparison.Ordinal);

    private string Fixed(double value, int digits) => Localise(FixedInvariant(value, digits));

    private string FixedInvariant(double value, int digits)
    {
        if (!double.IsFinite(value))
            throw new InvalidOperationException(
                $"A number to be printed in the brief is not finite. Got {value.ToString(Invariant)}.");
        string s = Math.Round(value, Math.Clamp(digits, 0, 15)).ToString("F" + Math.Clamp(digits, 0, 15), Invariant);
        if (s.StartsWith('-')) s = s.TrimStart('-') is var abs && abs.Trim('0', '.').Length == 0 ? abs : "−" + abs;
        return s;
    }
}
