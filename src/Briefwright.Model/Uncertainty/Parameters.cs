using Briefwright.Model.Inputs;

namespace Briefwright.Model.Uncertainty;

/// <summary>
/// The parameters that sensitivity and uncertainty analysis may vary, each a pure function from a value to new
/// model inputs. <c>return_scale</c> multiplies every return to schooling (a scale of 1 is the scenario itself).
/// </summary>
public static class Parameters
{
    public sealed record Definition(
        string Name, string Label, bool IsRate, Func<ModelInputs, double> Get,
        Func<ModelInputs, double, ModelInputs> Set);

    public static readonly IReadOnlyList<Definition> All = new Definition[]
    {
        new("population_growth", "Population growth", true, i => i.Demography.GrowthRate,
            (i, v) => i with { Demography = i.Demography with { GrowthRate = v } }),
        new("school_entry_age", "School-entry age", false, i => i.Demography.EntryAge,
            (i, v) => i with { Demography = i.Demography with { EntryAge = v } }),
        new("retirement_age", "Retirement age", false, i => i.Demography.RetirementAge,
            (i, v) => i with { Demography = i.Demography with { RetirementAge = v } }),
        new("participation", "Labour-force participation", true, i => i.Demography.Participation,
            (i, v) => i with { Demography = i.Demography with { Participation = v } }),
        new("saving_rate", "Saving rate", true, i => i.Production.SavingRate,
            (i, v) => i with { Production = i.Production with { SavingRate = v } }),
        new("capital_share", "Capital share", true, i => i.Production.CapitalShare,
            (i, v) => i with { Production = i.Production with { CapitalShare = v } }),
        new("depreciation", "Depreciation rate", true, i => i.Production.Depreciation,
            (i, v) => i with { Production = i.Production with { Depreciation = v } }),
        new("technology_growth", "Technology growth", true, i => i.Production.TechnologyGrowth,
            (i, v) => i with { Production = i.Production with { TechnologyGrowth = v } }),
        new("return_scale", "Returns to schooling (scale)", false, _ => 1.0,
            (i, v) => i with { HumanCapital = i.HumanCapital with { Returns = Scale(i.HumanCapital.Returns, v) } }),
    };

    public static Definition? Find(string name) => All.FirstOrDefault(d => d.Name == name);

    public static ReturnSchedule Scale(ReturnSchedule r, double k) => r switch
    {
        ConstantReturn c => new ConstantReturn(c.Rate * k),
        BracketReturns b => new BracketReturns(b.Brackets.Select(x => x with { Rate = x.Rate * k }).ToList()),
        PowerReturn p => p with { Theta = p.Theta * k },
        _ => r,
    };

    /// <summary>
    /// Why these inputs break a model rule, or null when they are valid. Draws that break a rule are rejected.
    /// </summary>
    public static string? Violation(ModelInputs i)
    {
        var d = i.Demography;
        var p = i.Production;
        if (!(p.SavingRate >= ModelLimits.MinSavingRate && p.SavingRate < 1)) return "saving rate outside [0.1%, 100%)";
        if (!(p.CapitalShare > 0 && p.CapitalShare < ModelLimits.MaxCapitalShare))
            return "capital share outside (0, 0.9)";
        if (!(p.Depreciation >= 0 && p.Depreciation < 1)) return "depreciation outside [0, 100%)";
        if (!(d.GrowthRate + p.TechnologyGrowth + p.Depreciation >= ModelLimits.MinEffectiveDepreciation))
            return "n + g + δ below 0.1%";
        if (!(d.Participation > 0 && d.Participation <= 1)) return "participation outside (0, 1]";
        if (!(d.EntryAge >= 0)) return "negative school-entry age";
        if (!(d.RetirementAge > 0)) return "retirement age not positive";
        if (!ReturnsBelowOne(i.HumanCapital.Returns)) return "a return to schooling of 100% or more";
        if (!(d.RetirementAge <= d.Survival.MaxAge)) return "retirement after the maximum age";
        foreach (var o in i.Options)
        {
            if (!(d.EntryAge + o.SchoolingYears < (o.RetirementAge ?? d.RetirementAge)))
                return $"schooling of option {o.Id} reaches retirement";
            if (!(ModelLimits.SurvivorsAtWork(i, o) >= ModelLimits.MinSurvivorsAtWork))
                return $"nobody survives to the working age of option {o.Id}";
        }
        return null;
    }

    private static bool ReturnsBelowOne(ReturnSchedule r) => r switch
    {
        ConstantReturn c => c.Rate > 0 && c.Rate < 1,
        BracketReturns b => b.Brackets.All(x => x.Rate >= 0 && x.Rate < 1),
        PowerReturn p => p.Theta > 0 && p.Theta < 2,
        _ => true,
    };
}
