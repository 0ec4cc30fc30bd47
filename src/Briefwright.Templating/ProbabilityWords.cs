using Briefwright.Model.Uncertainty;

namespace Briefwright.Templating;

/// <summary>
/// A Monte Carlo probability in words, with its 95% interval and never as a certainty: when all or none of the draws
/// show the event, the bound of the interval is what the brief can say ("99.8% or more").
/// </summary>
public sealed class ProbabilityWords(BriefLanguage language) : TemplateFunctions(language)
{
    public string Sentence(Probability p) =>
        p.Count == p.Draws ? T("probability.all", Pct(p.Low, 1), Big(p.Draws))
        : p.Count == 0 ? T("probability.none", Pct(p.High, 1), Big(p.Draws))
        : T("probability.some", Pct(p.Estimate, 1), Pct(p.Low, 1), Pct(p.High, 1));

    public string Cell(Probability p) =>
        p.Count == p.Draws ? T("probability.or_more", Pct(p.Low, 1))
        : p.Count == 0 ? T("probability.or_less", Pct(p.High, 1))
        : $"{Pct(p.Estimate, 1)} ({Pct(p.Low, 1)}–{Pct(p.High, 1)})";
}
