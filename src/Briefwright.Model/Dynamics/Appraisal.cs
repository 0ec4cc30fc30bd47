using Briefwright.Model.Inputs;

namespace Briefwright.Model.Dynamics;

/// <summary>One option's path over time and its present values under every discount schedule.</summary>
public sealed record OptionAppraisal(string OptionId, ReformPath Path, IReadOnlyList<PresentValue> PresentValues);

/// <summary>
/// The schooling length that maximises the present value of the reform (headline schedule, to the horizon),
/// beside the balanced-growth E*. Discounting weighs the early dip and the decades before the gain arrives, so the
/// discounted optimum is far shorter.
/// </summary>
public sealed record DiscountedOptimum(string ScheduleId, double SchoolingYears, double PresentValue, double BalancedGrowthOptimum, string Explanation);

public sealed record AppraisalResults(int ReformYear, int HorizonYears, int PhaseInCohorts, IReadOnlyList<OptionAppraisal> Options, DiscountedOptimum Optimum);

public static class Appraisal
{
    public static AppraisalResults Run(ModelInputs inputs, ReformSettings reform, IReadOnlyList<DiscountSchedule> schedules, double balancedGrowthOptimum)
    {
        double g = inputs.Production.TechnologyGrowth;
        var cache = new ReformSimulator.Cache();
        var options = inputs.Options.Where(o => o.Id != inputs.BaselineId).Select(o =>
        {
            var path = ReformSimulator.Simulate(inputs, o, reform, cache);
            return new OptionAppraisal(o.Id, path, schedules.Select(s => PresentValue.Compute(path, s, g)).ToList());
        }).ToList();
        return new AppraisalResults(reform.Year, reform.HorizonYears, reform.PhaseInCohorts, options, FindDiscountedOptimum(inputs, reform, schedules[0], balancedGrowthOptimum, cache));
    }

    /// <summary>Grid over E₁ from the baseline to the balanced-growth E* (half-year steps), then golden-section refinement.</summary>
    public static DiscountedOptimum FindDiscountedOptimum(ModelInputs inputs, ReformSettings reform, DiscountSchedule schedule, double bgpOptimum, ReformSimulator.Cache? cache = null)
    {
        // One cache for every candidate: the population and the baseline cohorts' table are computed once.
        cache ??= new ReformSimulator.Cache();
        var baseline = inputs.Baseline;
        double g = inputs.Production.TechnologyGrowth;
        double maxE = Math.Min(Math.Max(bgpOptimum, baseline.SchoolingYears), inputs.DemographyFor(baseline).RetirementAge - inputs.Demography.EntryAge - 1);
        double Pv(double e)
        {
            var option = baseline with { Id = "__candidate", SchoolingYears = e };
            var trial = inputs with { Options = inputs.Options.Append(option).ToList() };
            return e == baseline.SchoolingYears ? 0 : PresentValue.Compute(ReformSimulator.Simulate(trial, option, reform, cache), schedule, g).ToHorizon;
        }
        double bestE = baseline.SchoolingYears, bestPv = 0;
        for (double e = baseline.SchoolingYears + 0.5; e <= maxE + 1e-9; e += 0.5)
        {
            double v = Pv(e);
            if (v > bestPv) { bestPv = v; bestE = e; }
        }
        if (bestE > baseline.SchoolingYears)
        {
            double lo = Math.Max(baseline.SchoolingYears, bestE - 0.5), hi = Math.Min(maxE, bestE + 0.5);
            double phi = (Math.Sqrt(5) - 1) / 2;
            double x1 = hi - phi * (hi - lo), x2 = lo + phi * (hi - lo), f1 = Pv(x1), f2 = Pv(x2);
            while (hi - lo > 0.01)
            {
                if (f1 < f2) { lo = x1; x1 = x2; f1 = f2; x2 = lo + phi * (hi - lo); f2 = Pv(x2); }
                else { hi = x2; x2 = x1; f2 = f1; x1 = hi - phi * (hi - lo); f1 = Pv(x1); }
            }
            double e = 0.5 * (lo + hi), v = Pv(e);
            if (v > bestPv) { bestE = e; bestPv = v; }
        }
        string why = bestE <= baseline.SchoolingYears
            ? "No longer schooling has a positive present value at this discount rate: the early loss of workers outweighs the discounted later gain."
            : $"Discounting at {schedule.Label} weighs the early dip (fewer workers while the longer-schooled cohorts are still studying) against gains that arrive only as those cohorts replace older workers over decades; the balanced-growth optimum counts a gain fifty years away the same as one today.";
        return new DiscountedOptimum(schedule.Id, bestE, bestPv, bgpOptimum, why);
    }
}
