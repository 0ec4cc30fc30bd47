using Briefwright.Model.Results;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario;

namespace Briefwright.Templating;

/// <summary>A figure the template may place with <c>figure "id"</c>.</summary>
public sealed record FigureRef(string Id, string Caption);

/// <summary>
/// Everything a template can see: the scenario, its results, the figures made for it and the reproducibility facts.
/// </summary>
public sealed record BriefInputs(
    ScenarioDocument Scenario,
    BalancedGrowthResults Results,
    AnalysisResults Analysis,
    IReadOnlyList<FigureRef> Figures,
    string InputHash,
    string ToolVersion,
    string TemplateName,
    string TemplateHash);
