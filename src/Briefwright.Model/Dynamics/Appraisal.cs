using Briefwright.Model.Inputs;
using Briefwright.Model.Numerics;

namespace Briefwright.Model.Dynamics;

/// <summary>One option's path over time and its present values under every discount schedule.</summary>
public sealed record OptionAppraisal(string OptionId, ReformPath Path, IReadOnlyList<PresentValue> PresentValues)
{
    public bool Equals(OptionAppraisal? other) =>
        other is not null && OptionId == other.OptionId && Path.Equals(other.Path)
        && Same.Items(PresentValues, other.PresentValues);

    public override int GetHashCode() => HashCode.Combine(OptionId, Path, Same.Hash(PresentValues));
}

/// <summary>
/// The discounted optimum when value is counted only to <see cref="HorizonYears"/> after the reform (no tail).
/// </summary>
public sealed record HorizonOptimum(int HorizonYears, double SchoolingYears, double PresentValue);

/// <summary>
/// The schooling length that maximises the present value of the reform at the headline schedule, beside the
/// balanced-growth E*. The value maximised includes the tail beyond the horizon when it is finite
/// (<see cref="TailIncluded"/>); otherwise it is cut at the horizon, and <see cref="ByHorizon"/> shows how the
/// optimum moves when the cut moves (half and twice the horizon; always reported). Discounting weighs the early dip and
/// the decades before the gain arrives, so the discounted optimum is far shorter than E*. The reasons are worded by
/// the brief (Templating) and the results writer from <see cref="LongerSchoolingPays"/>, <see cref="TailIncluded"/>,
/// <see cref="ScheduleLabel"/>, <see cref="HorizonYears"/> and <see cref="ByHorizon"/>.
/// </summary>
/// <param name="LongerSchoolingPays">False when no schooling longer than the baseline's has a positive present
/// value.</param>
public sealed record DiscountedOptimum(
    string ScheduleId,
    double SchoolingYears,
    double PresentValue,
    bool TailIncluded,
    double BalancedGrowthOptimum,
    IReadOnlyList<HorizonOptimum> ByHorizon,
    string ScheduleLabel,
    int HorizonYears,
    bool LongerSchoolingPays)
{
    public bool Equals(DiscountedOptimum? other) =>
        other is not null && ScheduleId == other.ScheduleId && SchoolingYears.Equals(other.SchoolingYears)
        && PresentValue.Equals(other.PresentValue) && TailIncluded == other.TailIncluded
        && BalancedGrowthOptimum.Equals(other.BalancedGrowthOptimum) && Same.Items(ByHorizon, other.ByHorizon)
        && ScheduleLabel == other.ScheduleLabel && HorizonYears == other.HorizonYears
        && LongerSchoolingPays == other.LongerSchoolingPays;

    public override int GetHashCode() =>
        HashCode.Combine(ScheduleId, SchoolingYears, PresentValue, Same.Hash(ByHorizon));
}

/// <param name="ValuationYear">Calendar year present values are valued at: technology level 1 and discount factor 1
/// there; one unit of a present value is a year of that year's output per person (worded by the brief and the
/// results writer).</param>
public sealed record AppraisalResults(
    int ReformYear,
    int ValuationYear,
    int HorizonYears,
    int PhaseInCohorts,
    IReadOnlyList<OptionAppraisal> Options,
    DiscountedOptimum Optimum)
{
    public bool Equals(AppraisalResults? other) =>
        other is not null && ReformYear == other.ReformYear && ValuationYear == other.ValuationYear
        && HorizonYears == other.HorizonYears && PhaseInCohorts == other.PhaseInCohorts
        && Same.Items(Options, other.Options) && Optimum.Equals(other.Optimum);

    public override int GetHashCode() =>
        HashCode.Combine(ReformYear, ValuationYear, HorizonYears, Same.Hash(Options), Optimum);
}

public static class Appraisal
{
    public static AppraisalResults Run(
        ModelInputs inputs, ReformSettings reform, IReadOnlyList<DiscountSchedule> schedules,
        double balancedGrowthOptimum)
    {
        double g = inputs.Production.TechnologyGrowth;
        int o = reform.ValuationOffset;
        var cache = new ReformSimulator.Cache();
        var options = inputs.Options.Where(x => x.Id != inputs.BaselineId).Select(x =>
        {
            var path = ReformSimulator.Simulate(inputs, x, reform, cache);
            return new OptionAppraisal(x.Id, path, schedules.Select(s => PresentValue.Compute(path, s, g, o)).ToList());
        }).ToList();
        return new AppraisalResults(reform.Year, reform.ValuedAt, reform.HorizonYears, reform.PhaseInCohorts, options,
            FindDiscountedOptimum(inputs, reform, schedules[0], balancedGrowthOptimum, cache));
    }

    /// <summary>
    /// Grid over E₁ from the baseline to the balanced-growth E* (half-year steps), then golden-section refinement,
    /// for the headline objective (value with its tail when finite, else to the horizon) and for the value cut at half,
    /// one and twice the horizon. Each candidate is simulated once, to twice the horizon; shorter cuts use its first
    /// years.
    /// </summary>
    public static DiscountedOptimum FindDiscountedOptimum(
        ModelInputs inputs, ReformSettings reform, DiscountSchedule schedule, double bgpOptimum,
        ReformSimulator.Cache? cache = null)
    {
        // One cache for every candidate: the population and the baseline cohorts' table are computed once.
        cache ??= new ReformSimulator.Cache();
        var baseline = inputs.Baseline;
        double g = inputs.Production.TechnologyGrowth;
        int o = reform.ValuationOffset, h = reform.HorizonYears;
        int[] cuts = { Math.Max(1, h / 2), h, 2 * h };
        var longRun = reform with { HorizonYears = cuts[^1] };
        double maxE = Math.Min(
            Math.Max(bgpOptimum, baseline.SchoolingYears),
            inputs.DemographyFor(baseline).RetirementAge - inputs.Demography.EntryAge - 1);
        var simulated = new Dictionary<double, ReformPath>();
        ReformPath Path(double e)
        {
            if (simulated.TryGetValue(e, out var p)) return p;
            var option = baseline with { Id = "__candidate", SchoolingYears = e };
            var trial = inputs with { Options = inputs.Options.Append(option).ToList() };
            return simulated[e] = ReformSimulator.Simulate(trial, option, longRun, cache);
        }
        static ReformPath Cut(ReformPath p, int years) => p with { Gain = p.Gain[..(years + 1)] };
        // Objective 0: the headline value (with its tail when finite); 1…: the value cut at each horizon.
        bool tailFinite = true;
        double Value(double e, int objective)
        {
            if (e == baseline.SchoolingYears) return 0;
            if (objective > 0) return PresentValue.ToHorizonOnly(Cut(Path(e), cuts[objective - 1]), schedule, g, o);
            var pv = PresentValue.Compute(Cut(Path(e), h), schedule, g, o);
            tailFinite = pv.Total is not null;
            return pv.Counted;
        }
        var found = Enumerable.Range(0, cuts.Length + 1)
            .Select(k => Maximise(e => Value(e, k), baseline.SchoolingYears, maxE))
            .ToList();
        var (bestE, bestPv) = found[0];
        var byHorizon = cuts.Select((c, k) => new HorizonOptimum(c, found[k + 1].E, found[k + 1].Value)).ToList();
        return new DiscountedOptimum(schedule.Id, bestE, bestPv, tailFinite, bgpOptimum, byHorizon, schedule.Label, h,
            LongerSchoolingPays: bestE > baseline.SchoolingYears);
    }

    /// <summary>
    /// The best of a half-year grid above <paramref name="lo"/> (f(lo) = 0), refined by golden section to 0.01 years.
    /// </summary>
    private static (double E, double Value) Maximise(Func<double, double> f, double lo0, double maxE)
    {
        double bestE = lo0, bestPv = 0;
        for (double e = lo0 + 0.5; e <= maxE + 1e-9; e += 0.5)
        {
            double v = f(e);
            if (v > bestPv) { bestPv = v; bestE = e; }
        }
        if (bestE > lo0)
        {
            double lo = Math.Max(lo0, bestE - 0.5), hi = Math.Min(maxE, bestE + 0.5);
            (lo, hi, _) = GoldenSection.Maximise(f, lo, hi, 0.01);
            double e = 0.5 * (lo + hi), v = f(e);
            if (v > bestPv) { bestE = e; bestPv = v; }
        }
        return (bestE, bestPv);
    }
}
