using Briefwright.Model.Uncertainty;
using static Briefwright.Templating.TemplateFunctions;

namespace Briefwright.Templating;

/// <summary>
/// A Monte Carlo probability in words, with its 95% interval and never as a certainty: when all or none of the draws
/// show the event, the bound of the interval is what the brief can say ("99.8% or more").
/// </summary>
public static class ProbabilityWords
{
    public static string Sentence(Probability p) =>
        p.Count == p.Draws ? $"{Pct(p.Low, 1)} or more (all {Big(p.Draws)} draws; 95% interval)"
        : p.Count == 0 ? $"{Pct(p.High, 1)} or less (none of {Big(p.Draws)} draws; 95% interval)"
        : $"{Pct(p.Estimate, 1)} (95% interval {Pct(p.Low, 1)} to {Pct(p.High, 1)})";

    public static string Cell(Probability p) =>
        p.Count == p.Draws ? $"{Pct(p.Low, 1)} or more" : p.Count == 0 ? $"{Pct(p.High, 1)} or less" : $"{Pct(p.Estimate, 1)} ({Pct(p.Low, 1)}–{Pct(p.High, 1)})";
}
