using Briefwright.Model.Results;
using Briefwright.Model.Uncertainty;
using static Briefwright.Templating.TemplateFunctions;

namespace Briefwright.Templating;

/// <summary>
/// Words chosen from numbers: every direction, comparison or conclusion the brief states is picked here from a
/// computed fact, so that no sentence says "rise" beside a fall or "peak" at a corner.
/// </summary>
public static class Wording
{
    public const string Outcome = "long-run output per person";

    /// <summary>"rise", "fall" or "none" for a percentage change as shown to one decimal.</summary>
    public static string DirectionWord(double changePct) => HeadlineFacts.Of(changePct) switch
    {
        Direction.Rise => "rise",
        Direction.Fall => "fall",
        _ => "none",
    };

    /// <summary>"would raise long-run output per person by 4.1%", "would lower … by 2.7%" or "would leave … unchanged (to one decimal)".</summary>
    public static string Effect(double changePct) => HeadlineFacts.Of(changePct) switch
    {
        Direction.Rise => $"would raise {Outcome} by {Magnitude(changePct)}",
        Direction.Fall => $"would lower {Outcome} by {Magnitude(changePct)}",
        _ => $"would leave {Outcome} unchanged (a change of less than 0.05%)",
    };

    /// <summary>A percentage change without its sign, for use after a direction word: −2.74 → "2.7%".</summary>
    public static string Magnitude(double changePct) => Change(Math.Abs(changePct)).TrimStart('+');

    /// <summary>A change in percentage points with its sign: "+8.2 points", "−0.3 points", "0.0 points".</summary>
    public static string Points(double points)
    {
        string s = Change(points).TrimEnd('%');
        return s + (s is "+1.0" or "−1.0" or "1.0" ? " point" : " points");
    }

    public static string Capitalise(string text) => text.Length == 0 ? text : char.ToUpperInvariant(text[0]) + text[1..];

    /// <summary>How a lever reads inside a sentence.</summary>
    public static string LeverName(string lever) => lever switch
    {
        Model.Core.Levers.Schooling => "schooling",
        Model.Core.Levers.RetirementAge => "the retirement age",
        Model.Core.Levers.Participation => "participation",
        _ => lever.Replace('_', ' '),
    };

    /// <summary>"schooling", "schooling and the retirement age", "a, b and c".</summary>
    public static string List(IReadOnlyList<string> items) => items.Count switch
    {
        0 => "",
        1 => items[0],
        _ => string.Join(", ", items.Take(items.Count - 1)) + " and " + items[^1],
    };

    /// <summary>The shape of a sequence of values: "rises", "falls", "stays the same", "rises, then falls", "falls, then rises" or "rises and falls more than once".</summary>
    public static string Trend(IReadOnlyList<double> values)
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
            0 => "stays the same",
            1 => steps[0] > 0 ? "rises" : "falls",
            2 => steps[0] > 0 ? "rises, then falls" : "falls, then rises",
            _ => "rises and falls more than once",
        };
    }

    /// <summary>
    /// When the headline option's effect arrives, from its path against no reform: the deepest dip and the first
    /// year above, or the early gain and the first year below, or that it stays on one side throughout.
    /// </summary>
    public static string Arrival(HeadlineFacts h, int reformYear)
    {
        string end = h.HorizonEndYear.ToString();
        bool dipFirst = h.DeepestDipPct is not null && (h.PeakYear is null || h.DipCalendarYear < h.PeakYear);
        if (dipFirst)
        {
            string first = $"Output per person first falls below the path without the reform, {UpTo(h.DeepestDipPct!.Value)} in {h.DipCalendarYear}";
            if (h.FirstYearAbove is { } above) return $"{first}, and is above it from {above}.";
            return h.FirstYearBelow is not null ? $"{first}, and is still below it in {end}." : $"{first}.";
        }
        if (h.FirstYearBelow is { } below && h.PeakGainPct is { } peak && h.PeakYear < below)
            return $"Output per person first rises above the path without the reform, {UpTo(peak)} in {h.PeakYear}, and is below it from {below}.";
        if (h.FirstYearBelow is { } from)
            return from <= reformYear ? "Output per person is below the path without the reform from the start." : $"Output per person is below the path without the reform from {from}.";
        if (h.FirstYearAbove is { } start)
            return start <= reformYear ? "Output per person is above the path without the reform from the start." : $"Output per person is above the path without the reform from {start}.";
        return $"Output per person stays within rounding of the path without the reform to {end}.";
    }

    private static string UpTo(double pct) => HeadlineFacts.Of(pct) == Direction.None ? "by less than 0.05%" : $"by up to {Magnitude(pct)}";

    /// <summary>Whether and when the headline option pays back under the first appraisal rule.</summary>
    public static string Payback(HeadlineFacts h, string rule, int reformYear)
    {
        string end = h.HorizonEndYear.ToString();
        bool lossesFirst = h.DeepestDipPct is not null;
        if (h.BreakEvenCalendarYear is { } be)
        {
            if (lossesFirst && be > reformYear)
                return $"Discounted at {rule}, the later gains make up for the early losses in {be}: the reform pays back then.";
            if (be <= reformYear)
                return $"Discounted at {rule}, the running total of gains and losses is positive in every year to {end}.";
            return $"Discounted at {rule}, the running total of gains and losses is positive from {be} to {end}.";
        }
        return lossesFirst && h.Direction == Direction.Rise
            ? $"Discounted at {rule}, the reform does not pay back within the horizon to {end}."
            : $"Discounted at {rule}, the running total of gains and losses is still negative in {end}.";
    }

    /// <summary>The 90% range sentence, or null without Monte Carlo draws.</summary>
    public static string? Range(HeadlineFacts h)
    {
        if (h.RangeLowPct is not { } lo || h.RangeHighPct is not { } hi) return null;
        if (HeadlineFacts.Of(lo) == Direction.None && HeadlineFacts.Of(hi) == Direction.None)
            return "In 90% of the model runs with uncertain assumptions the long-run change stays within 0.05% of zero.";
        string s = $"In 90% of the model runs with uncertain assumptions the long-run change lies between {Change(lo)} and {Change(hi)}";
        bool straddles = HeadlineFacts.Of(lo) != HeadlineFacts.Of(hi);
        return straddles && h.ProbabilityGain is { } p ? $"{s}; the chance of a gain is {Prob(p)}." : s + ".";
    }
}
