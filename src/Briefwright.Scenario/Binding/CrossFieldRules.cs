using System.Globalization;
using Briefwright.Model.Core;
using Briefwright.Model.Inputs;
using Briefwright.Scenario.Yaml;

namespace Briefwright.Scenario.Binding;

/// <summary>Rules that tie several fields together; each is reported at the field a user would change.</summary>
public static class CrossFieldRules
{
    private static string F(double v) => Numbers.Plain(v);
    private static string Pct(double v) => Numbers.Percent(v);

    public static void Check(YMapping top, ModelInputs inputs, BindContext ctx)
    {
        var demography = (YMapping)top["demography"]!;
        var d = inputs.Demography;
        double maxAge = d.Survival.MaxAge;

        if (d.RetirementAge > maxAge)
            ctx.Report(demography["retirement_age"]!.At, "demography.retirement_age",
                $"must not exceed the survival curve's maximum age ({F(maxAge)})", F(d.RetirementAge));

        if (d.EntryAge >= d.RetirementAge)
            ctx.Report(demography["school_entry_age"]!.At, "demography.school_entry_age",
                $"must be below the retirement age ({F(d.RetirementAge)})", F(d.EntryAge));

        var options = (YSequence)top["options"]!;
        for (int i = 0; i < inputs.Options.Count; i++)
        {
            var o = inputs.Options[i];
            var item = (YMapping)options.Items[i];
            double retire = o.RetirementAge ?? d.RetirementAge;
            if (d.EntryAge + o.SchoolingYears >= retire)
                ctx.Report(item["schooling_years"]!.At, $"options[{i}].schooling_years",
                    $"school-entry age plus schooling must be below the retirement age ({F(d.EntryAge)} + " +
                    $"{F(o.SchoolingYears)} = {F(d.EntryAge + o.SchoolingYears)}, retirement at {F(retire)})",
                    F(o.SchoolingYears));
            if (o.RetirementAge is { } r && r > maxAge)
                ctx.Report(item["retirement_age"]!.At, $"options[{i}].retirement_age",
                    $"must not exceed the survival curve's maximum age ({F(maxAge)})", F(r));
        }

        double effective = BalancedGrowth.EffectiveDepreciation(d, inputs.Production);
        if (!(effective >= ModelLimits.MinEffectiveDepreciation))
        {
            var production = (YMapping)top["production"]!;
            ctx.Report(production["depreciation"]!.At, "production.depreciation",
                "population growth + technology growth + depreciation must be at least " +
                $"{Pct(ModelLimits.MinEffectiveDepreciation)}, or the model's results are not finite " +
                $"({Pct(d.GrowthRate)} + {Pct(inputs.Production.TechnologyGrowth)} + " +
                $"{Pct(inputs.Production.Depreciation)} = {Pct(effective)})",
                Pct(inputs.Production.Depreciation));
        }

        // Survival must leave workers: a cohort must still be alive when its schooling ends.
        var survival = (YMapping)demography["survival"]!;
        for (int i = 0; i < inputs.Options.Count; i++)
        {
            var o = inputs.Options[i];
            double alive = ModelLimits.SurvivorsAtWork(inputs, o);
            if (alive >= ModelLimits.MinSurvivorsAtWork) continue;
            var at = survival["file"] ?? survival["max_age"] ?? (YNode)survival;
            ctx.Report(at.At, "demography.survival",
                "the survival curve must leave workers: almost nobody is alive at " +
                $"{F(d.EntryAge + o.SchoolingYears)}, when schooling ends under options[{i}] ({o.Id}); at least " +
                $"{ModelLimits.MinSurvivorsAtWork:0.######} of a cohort must be",
                Numbers.Plain(alive, 8));
            break;
        }
    }
}
