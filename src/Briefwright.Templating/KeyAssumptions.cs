using Briefwright.Model.Uncertainty;
using Briefwright.Scenario;

namespace Briefwright.Templating;

/// <summary>
/// The short assumptions table for the body: the assumptions that move the headline most, ranked by the tornado.
/// </summary>
public sealed class KeyAssumptions(BriefLanguage language) : TemplateFunctions(language)
{
    public const int MaxRows = 8;

    private static readonly IReadOnlyDictionary<string, string> Paths = new Dictionary<string, string>
    {
        ["population_growth"] = "demography.population_growth", ["school_entry_age"] = "demography.school_entry_age",
        ["retirement_age"] = "demography.retirement_age", ["participation"] = "demography.participation",
        ["saving_rate"] = "production.saving_rate", ["capital_share"] = "production.capital_share",
        ["depreciation"] = "production.depreciation", ["technology_growth"] = "production.technology_growth",
        ["return_scale"] = "human_capital.returns",
    };

    /// <summary>
    /// Shown when the scenario gives no sensitivity ranges: the assumptions the model's answer rests on, unranked.
    /// </summary>
    private static readonly string[] Core =
    {
        "human_capital.returns", "demography.population_growth", "demography.retirement_age",
        "demography.participation", "production.saving_rate", "production.capital_share",
    };

    private Assumption? Find(ScenarioDocument s, string path) =>
        s.Assumptions.FirstOrDefault(a => a.Path == path)
            ?? s.Assumptions.FirstOrDefault(a => a.Path.StartsWith(path + ".", StringComparison.Ordinal));

    public string Table(ScenarioDocument s, AnalysisResults a)
    {
        string headline = s.Inputs.Options.First(o => o.Id == a.HeadlineOptionId).Label;
        if (a.Tornado.Count > 0)
        {
            var rows = a.Tornado.Take(MaxRows).Select(t =>
            {
                var def = Parameters.Find(t.Parameter)!;
                var row = Find(s, Paths.GetValueOrDefault(t.Parameter, ""));
                string value = t.Parameter == "return_scale" ? T("key.return_scale_value")
                    : row is null ? (def.IsRate ? Pct(def.Get(s.Inputs)) : Sig(def.Get(s.Inputs), 3))
                    : row.Text ?? BriefModelBuilder.FormatValue(row);
                string range = t.Parameter == "return_scale" ? T("key.range", "×" + Sig(t.Low, 3), "×" + Sig(t.High, 3))
                    : def.IsRate ? T("key.range", Pct(t.Low), Pct(t.High))
                    : T("key.range", Sig(t.Low, 3), Sig(t.High, 3));
                return (IReadOnlyList<string>)new[]
                {
                    AnalysisModel.ParameterLabel(t.Parameter, t.Label), value, range,
                    T("key.range", Change(t.AtLow.LongRunChangeOf(a.HeadlineOptionId)),
                        Change(t.AtHigh.LongRunChangeOf(a.HeadlineOptionId))),
                };
            });
            return Md.Table(T("key.caption_ranked", headline), T("key.source", s.Brief.Id),
                new[] { T("key.assumption"), T("table.value"), T("key.range_tested"), T("key.change_across") }, rows,
                new HashSet<int> { 1, 2, 3 });
        }
        var core = Core.Select(p => Find(s, p)).Where(r => r is not null).Select(r => (IReadOnlyList<string>)new[]
        {
            BriefModelBuilder.Label(r!), r!.Text ?? BriefModelBuilder.FormatValue(r), BriefModelBuilder.SourceText(r),
        });
        return Md.Table(T("key.caption_unranked"), T("key.source", s.Brief.Id),
            new[] { T("key.assumption"), T("table.value"), T("table.source") }, core, new HashSet<int> { 1 });
    }
}
