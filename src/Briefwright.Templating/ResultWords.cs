using System.Globalization;
using Briefwright.Model.Dynamics;
using Briefwright.Model.Results;

namespace Briefwright.Templating;

/// <summary>
/// Sentences about model results, made from the model's codes and numbers (the model writes no words). Two wordings
/// share the keys of the language files (<c>result.*</c>, <c>reason.*</c>, <c>eq.refinement.*</c>):
/// <see cref="Brief"/> in the brief's language with its number format, and <see cref="Data"/> in English with plain
/// invariant numbers (3.5%, -0.25%), the text the results data and the console carry (docs/results-json.md).
/// </summary>
public sealed class ResultWords
{
    private readonly Func<BriefLanguage> language;
    private readonly Func<double, int, string> number;
    private readonly Func<double, int, string> percent;

    private ResultWords(
        Func<BriefLanguage> language, Func<double, int, string> number, Func<double, int, string> percent)
    {
        this.language = language;
        this.number = number;
        this.percent = percent;
    }

    /// <summary>The brief's language and number format (<see cref="BriefLanguage.Current"/>, as every text of the
    /// brief).</summary>
    public static ResultWords Brief { get; } =
        new(() => BriefLanguage.Current, TemplateFunctions.Num, TemplateFunctions.Pct);

    /// <summary>English with invariant numbers: the results JSON and the console.</summary>
    public static ResultWords Data { get; } =
        new(() => BriefLanguage.English, Plain, (f, d) => Plain(f * 100, d) + "%");

    private static string Plain(double value, int digits) =>
        value.ToString("0." + new string('0', digits), CultureInfo.InvariantCulture);

    private string T(string key, params object?[] args) => language().Format(key, args);

    /// <summary>What one unit of a present value is.</summary>
    public string PriceBase(int valuationYear) => T("result.price_base", valuationYear);

    /// <summary>How the value beyond the horizon was treated.</summary>
    public string TailNote(TailBasis tail) => tail.Treatment switch
    {
        TailTreatment.NotFinite =>
            T("result.tail_not_finite", percent(tail.LongRunRate, 1), percent(tail.TechnologyGrowth, 1)),
        _ => T("result.tail_held", percent(tail.HeldGain, 2)),
    };

    /// <summary>Why the discounted optimum is where it is, and how it treats the value beyond the horizon.</summary>
    public string Explanation(DiscountedOptimum d)
    {
        string cut = d.TailIncluded
            ? T("result.optimum_tail_included", d.HorizonYears)
            : T("result.optimum_tail_cut", d.HorizonYears, string.Join(", ", d.ByHorizon.Select((x, i) =>
                T(i == 0 ? "result.optimum_cut_first" : "result.optimum_cut_other", number(x.SchoolingYears, 1),
                    x.HorizonYears))));
        return d.LongerSchoolingPays
            ? T("result.optimum_discounting", d.ScheduleLabel, cut)
            : T("result.optimum_no_gain", cut);
    }

    /// <summary>Why the closed form was not used.</summary>
    public string ClosedFormReason(ClosedFormObstacle obstacle) => T("reason." + Code(obstacle));

    /// <summary>How the search refined each local maximum.</summary>
    public string Refinement(RefinementMethod method) => T("eq.refinement." + Code(method));

    /// <summary>The code a language file names an obstacle by.</summary>
    public static string Code(ClosedFormObstacle obstacle) => obstacle switch
    {
        ClosedFormObstacle.ReturnNotConstant => "return_not_constant",
        ClosedFormObstacle.SurvivalNotRectangular => "survival_not_rectangular",
        ClosedFormObstacle.ExperienceProfile => "experience_profile",
        ClosedFormObstacle.ReturnBelowGrowth => "return_below_growth",
        _ => throw new ArgumentOutOfRangeException(nameof(obstacle), obstacle, null),
    };

    private static string Code(RefinementMethod method) => method switch
    {
        RefinementMethod.DerivativeBisection => "derivative_bisection",
        RefinementMethod.GoldenSection => "golden_section",
        _ => throw new ArgumentOutOfRangeException(nameof(method), method, null),
    };
}
