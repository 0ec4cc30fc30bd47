using Briefwright.Model.Core;
using Briefwright.Model.Inputs;

namespace Briefwright.Model.Dynamics;

/// <summary>
/// Cohort simulation of a schooling reform. Cohorts entering school from year 0 study E₁ instead of E₀ (phased in
/// linearly over the first cohorts if asked); the option's retirement age and participation apply to everyone
/// from year 0. Effective labour per person x(t) follows from which cohorts are in school, at work or retired;
/// capital per person (in technology units) follows k̇ = s·y − (n+g+δ)·k from the pre-reform balanced path, with
/// y = k^α x^(1−α).
/// </summary>
public static class ReformSimulator
{
    private sealed record Group(double EntryFrom, double EntryTo, CohortLabour Labour);

    public static ReformPath Simulate(ModelInputs inputs, PolicyOption reform, ReformSettings settings)
    {
        var baseline = inputs.Baseline;
        if (reform.Id == baseline.Id) return ReformPath.Flat(reform.Id, settings.HorizonYears);
        var before = inputs.DemographyFor(baseline);
        var after = inputs.DemographyFor(reform);
        var hc = inputs.HumanCapital;
        var p = inputs.Production;
        double lastAge = Math.Max(before.RetirementAge, after.RetirementAge);
        double population = new LifeCycle(before, hc).Population;

        var groups = new List<Group> { new(double.NegativeInfinity, 0, new CohortLabour(before, hc, baseline.SchoolingYears, lastAge)) };
        int k = Math.Max(1, settings.PhaseInCohorts);
        for (int j = 0; j < k; j++)
        {
            double e = baseline.SchoolingYears + (reform.SchoolingYears - baseline.SchoolingYears) * (j + 1) / k;
            groups.Add(new Group(j, j == k - 1 ? double.PositiveInfinity : j + 1, new CohortLabour(before, hc, e, lastAge)));
        }

        // x(t): effective labour per person. Cohort entering school at time s is aged a = t + a₀ − s at time t.
        double X(double t)
        {
            var dem = t < 0 ? before : after;
            double sum = 0;
            foreach (var g in groups)
            {
                double youngest = t + dem.EntryAge - g.EntryTo, oldest = t + dem.EntryAge - g.EntryFrom;
                sum += Math.Exp(g.Labour.LogSchoolingCapital) * g.Labour.Between(youngest, Math.Min(oldest, dem.RetirementAge));
            }
            return dem.Participation * sum / population;
        }

        double alpha = p.CapitalShare, s = p.SavingRate, dilution = BalancedGrowth.EffectiveDepreciation(before, p);
        double x0 = X(-1);
        double kStar = x0 * Math.Pow(s / dilution, 1 / (1 - alpha));
        double y0 = Math.Pow(kStar, alpha) * Math.Pow(x0, 1 - alpha);
        double Y(double kk, double x) => Math.Exp(alpha * Math.Log(kk) + (1 - alpha) * Math.Log(x));
        double Dk(double kk, double x) => s * Y(kk, x) - dilution * kk;

        int horizon = settings.HorizonYears;
        var gain = new double[horizon + 1];
        double capital = kStar, h = ReformSettings.TimeStep;
        int stepsPerYear = (int)Math.Round(1 / h);
        double xNow = X(0);
        gain[0] = Y(capital, xNow) / y0 - 1;
        for (int year = 0; year < horizon; year++)
        {
            for (int step = 0; step < stepsPerYear; step++)
            {
                double t = year + step * h;
                double xMid = X(t + h / 2), xEnd = X(t + h);
                double k1 = Dk(capital, xNow);
                double k2 = Dk(capital + h / 2 * k1, xMid);
                double k3 = Dk(capital + h / 2 * k2, xMid);
                double k4 = Dk(capital + h * k3, xEnd);
                capital += h / 6 * (k1 + 2 * k2 + 2 * k3 + k4);
                xNow = xEnd;
            }
            gain[year + 1] = Y(capital, xNow) / y0 - 1;
        }

        double bgpGain = BalancedGrowth.OutputPerPerson(inputs, reform) / BalancedGrowth.OutputPerPerson(inputs, baseline) - 1;
        return Landmarks(reform.Id, gain, bgpGain);
    }

    private static ReformPath Landmarks(string id, double[] gain, double bgpGain)
    {
        int dipYear = 0;
        for (int t = 1; t < gain.Length; t++) if (gain[t] < gain[dipYear]) dipYear = t;
        bool dip = gain[dipYear] < 0;
        int? firstPositive = null;
        for (int t = dip ? dipYear : 0; t < gain.Length; t++)
            if (gain[t] > 0) { firstPositive = t; break; }
        return new ReformPath(id, gain, gain[^1], bgpGain, dip ? gain[dipYear] : null, dip ? dipYear : null, firstPositive);
    }
}
