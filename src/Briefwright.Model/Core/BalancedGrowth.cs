using Briefwright.Model.Inputs;
using Briefwright.Model.Results;

namespace Briefwright.Model.Core;

/// <summary>Balanced-growth comparison of the policy options and the output-maximising schooling length.</summary>
public static class BalancedGrowth
{
    /// <summary>n + g + δ: the rate at which capital per effective worker is diluted.</summary>
    public static double EffectiveDepreciation(Demography d, Production p) =>
        d.GrowthRate + p.TechnologyGrowth + p.Depreciation;

    /// <summary>ŷ* = (s/(n+g+δ))^(α/(1−α)).</summary>
    public static double OutputPerEffectiveWorker(Demography d, Production p) =>
        Math.Pow(p.SavingRate / EffectiveDepreciation(d, p), p.CapitalShare / (1 - p.CapitalShare));

    /// <summary>Output per person of one option on the balanced growth path (technology level 1).</summary>
    public static double OutputPerPerson(
        ModelInputs inputs, PolicyOption option, double? population = null, bool fast = false)
    {
        var cycle = new LifeCycle(inputs.DemographyFor(option), inputs.HumanCapital, population, fast);
        return OutputPerEffectiveWorker(inputs.Demography, inputs.Production) * cycle.Objective(option.SchoolingYears);
    }

    public static BalancedGrowthResults Solve(ModelInputs inputs, int gridPoints = OptimumSearch.DefaultGridPoints)
    {
        var d = inputs.Demography;
        var p = inputs.Production;
        double yHat = OutputPerEffectiveWorker(d, p);
        double kHat = Math.Pow(p.SavingRate / EffectiveDepreciation(d, p), 1 / (1 - p.CapitalShare));

        var raw = inputs.Options.Select(o =>
        {
            var cycle = new LifeCycle(inputs.DemographyFor(o), inputs.HumanCapital);
            double omega = cycle.WorkerShare(o.SchoolingYears);
            double h = cycle.HumanCapitalPerWorker(o.SchoolingYears);
            return (Option: o, Omega: omega, H: h, Y: yHat * h * omega);
        }).ToList();
        double baseY = raw.First(r => r.Option.Id == inputs.BaselineId).Y;
        var options = raw.Select(r => new OptionResult(
            r.Option.Id, r.Option.Label, r.Option.Id == inputs.BaselineId, r.Option.SchoolingYears,
            r.Omega, r.H, yHat, r.Y, 100.0 * (r.Y / baseY - 1.0))).ToList();

        var baseDemography = inputs.DemographyFor(inputs.Baseline);
        var optimum = OptimumSearch.Find(baseDemography, inputs.HumanCapital, yHat, gridPoints);
        return new BalancedGrowthResults(new SteadyState(yHat, kHat, EffectiveDepreciation(d, p)), options, optimum,
            Curve(new LifeCycle(baseDemography, inputs.HumanCapital), yHat, CurvePoints))
        {
            Levers = Core.Levers.Decompose(inputs)
        };
    }

    public const int CurvePoints = 121;

    /// <summary>Output per person and its two factors over the feasible schooling range, for charts.</summary>
    public static IReadOnlyList<CurvePoint> Curve(LifeCycle cycle, double yHat, int points)
    {
        var curve = new CurvePoint[points];
        for (int i = 0; i < points; i++)
        {
            double e = cycle.MaxSchooling * i / (points - 1);
            double omega = cycle.WorkerShare(e), h = cycle.HumanCapitalPerWorker(e);
            curve[i] = new CurvePoint(e, omega, h, yHat * h * omega);
        }
        return curve;
    }
}
