using Briefwright.Model.Results;
using Briefwright.Model.Uncertainty;

namespace Briefwright.Templating;

/// <summary>
/// Words chosen from numbers: every direction, comparison or conclusion the brief states is picked here from a
/// computed fact, so that no sentence says "rise" beside a fall or "peak" at a corner.
/// </summary>
public sealed class Wording(BriefLanguage language) : TemplateFunctions(language)
{
    /// <summary>What the brief measures, as it reads inside a sentence ("long-run output per person").</summary>
    public string Outcome => T("outcome");

    /// <summary>"rise", "fall" or "none" for a percentage change as shown to one decimal.</summary>
    public string DirectionWord(double changePct) => HeadlineFacts.Of(changePct) switch
    {
        Direction.Rise => "rise",
        Direction.Fall => "fall",
        _ => "none",
    };

    /// <summary>
    /// "would raise long-run output per person by 4.1%", "would lower … by 2.7%" or "would leave … unchanged (to one
    /// decimal)".
    /// </summary>
    public string Effect(double changePct) => HeadlineFacts.Of(changePct) switch
    {
        Direction.Rise => T("effect.raise", Outcome, Magnitude(changePct)),
        Direction.Fall => T("effect.lower", Outcome, Magnitude(changePct)),
        _ => T("effect.none", Outcome, Localise("0.05") + L.PercentSign),
    };

    /// <summary>A percentage change without its sign, for use after a direction word: −2.74 → "2.7%".</summary>
    public string Magnitude(double changePct) => Change(Math.Abs(changePct)).TrimStart('+');

    /// <summary>A change in percentage points with its sign: "+8.2 points", "−0.3 points", "0.0 points".</summary>
    public string Points(double points)
    {
        string pct = L.PercentSign;
        string s = Change(points);
        s = s.EndsWith(pct, StringComparison.Ordinal) ? s[..^pct.Length] : s;
        return T(Math.Abs(Math.Round(points, 1)) == 1.0 ? "unit.point" : "unit.points", s);
    }

    public string Capitalise(string text) => text.Length == 0 ? text : char.ToUpperInvariant(text[0]) + text[1..];

    /// <summary>How a lever reads inside a sentence.</summary>
    public string LeverName(string lever) => lever switch
    {
        Model.Core.Levers.Schooling or Model.Core.Levers.RetirementAge or Model.Core.Levers.Participation =>
            T("lever." + lever),
        _ => lever.Replace('_', ' '),
    };

    /// <summary>"schooling", "schooling and the retirement age", "a, b and c".</summary>
    public string List(IReadOnlyList<string> items) => items.Count switch
    {
        0 => "",
        1 => items[0],
        _ => string.Join(", ", items.Take(items.Count - 1)) + T("list.and") + items[^1],
    };

    /// <summary>
    /// The shape of a sequence of values: "rises", "falls", "stays the same", "rises, then falls", "falls, then rises"
    /// or "rises and falls more than once".
    /// </summary>
    public string Trend(IReadOnlyList<double> values)
    {
        var steps = new List<int>();
        double scale = values.Select(Math.Abs).DefaultIfEmpty(0).Max();
        for (int i = 1; i < values.Count; i++)
        {
            double d = values[i] - values[i - 1];
            if (Math.Abs(d) <= 1e-9 * Math.Max(scale, 1e-300)) continue;
            int s = Math.Sign(d);
            if (steps.Count == 0 || steps[^1] != s) steps.Add(s);
        }
        return steps.Count switch
        {
            0 => T("trend.same"),
            1 => steps[0] > 0 ? T("trend.rises") : T("trend.falls"),
            2 => steps[0] > 0 ? T("trend.rises_falls") : T("trend.falls_rises"),
            _ => T("trend.many"),
        };
    }

    /// <summary>
    /// When the headline option's effect arrives, from its path against no reform: the deepest dip and the first
    /// year above, or the early gain and the first year below, or that it stays on one side throughout.
    /// </summary>
    public string Arrival(HeadlineFacts h, int reformYear)
    {
        string end = h.HorizonEndYear.ToString();
        bool dipFirst = h.DeepestDipPct is not null && (h.PeakYear is null || h.DipCalendarYear < h.PeakYear);
        if (dipFirst)
        {
            string first = T("arrival.dip", UpTo(h.DeepestDipPct!.Value), h.DipCalendarYear);
            if (h.FirstYearAbove is { } above) return T("arrival.dip_then_above", first, above);
            return h.FirstYearBelow is not null
                ? T("arrival.dip_still_below", first, end)
                : T("arrival.sentence", first);
        }
        if (h.FirstYearBelow is { } below && h.PeakGainPct is { } peak && h.PeakYear < below)
            return T("arrival.peak_then_below", UpTo(peak), h.PeakYear, below);
        if (h.FirstYearBelow is { } from)
            return from <= reformYear ? T("arrival.below_from_start") : T("arrival.below_from", from);
        if (h.FirstYearAbove is { } start)
            return start <= reformYear ? T("arrival.above_from_start") : T("arrival.above_from", start);
        return T("arrival.within_rounding", end);
    }

    private string UpTo(double pct) => HeadlineFacts.Of(pct) == Direction.None
        ? T("arrival.by_less", Localise("0.05") + L.PercentSign) : T("arrival.by_up_to", Magnitude(pct));

    /// <summary>Whether and when the headline option pays back under the first appraisal rule.</summary>
    public string Payback(HeadlineFacts h, string rule, int reformYear)
    {
        string end = h.HorizonEndYear.ToString();
        bool lossesFirst = h.DeepestDipPct is not null;
        if (h.BreakEvenCalendarYear is { } be)
        {
            if (lossesFirst && be > reformYear)
                return T("payback.pays_back", rule, be);
            if (be <= reformYear)
                return T("payback.positive_every_year", rule, end);
            return T("payback.positive_from", rule, be, end);
        }
        return lossesFirst && h.Direction == Direction.Rise
            ? T("payback.not_within", rule, end)
            : T("payback.still_negative", rule, end);
    }

    /// <summary>The 90% range sentence, or null without Monte Carlo draws.</summary>
    public string? Range(HeadlineFacts h)
    {
        if (h.RangeLowPct is not { } lo || h.RangeHighPct is not { } hi) return null;
        if (HeadlineFacts.Of(lo) == Direction.None && HeadlineFacts.Of(hi) == Direction.None)
            return T("range.within_zero", Localise("0.05") + L.PercentSign);
        string s = T("range.between", Change(lo), Change(hi));
        bool straddles = HeadlineFacts.Of(lo) != HeadlineFacts.Of(hi);
        return straddles && h.ProbabilityGain is { } p ? T("range.with_chance", s, Prob(p)) : T("arrival.sentence", s);
    }
}
