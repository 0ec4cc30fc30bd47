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

    /// <summary>Cohort labour tables of one set of inputs, shared by the options simulated for them.</summary>
    public sealed class Cache(bool fast = false)
    {
        /// <summary>Use the three-point quadrature (Monte Carlo and Sobol runs).</summary>
        public bool Fast { get; } = fast;

        // Keyed by the whole option (record equality), so trial options that share an id never share a result.
        private readonly Dictionary<PolicyOption, double> outputs = new();
        private double? population;

        internal Dictionary<(double Schooling, double LastAge), CohortLabour> Tables { get; } = new();

        /// <summary>The population integral (the same for every option of one set of inputs).</summary>
        public double Population(ModelInputs inputs) =>
            population ??= new LifeCycle(inputs.Demography, inputs.HumanCapital, fast: Fast).Population;

        /// <summary>Balanced-growth output per person of an option, computed once.</summary>
        public double OutputPerPerson(ModelInputs inputs, PolicyOption option)
        {
            if (!outputs.TryGetValue(option, out double y))
                outputs[option] = y = BalancedGrowth.OutputPerPerson(inputs, option, Population(inputs), Fast);
            return y;
        }
    }

    public static ReformPath Simulate(
        ModelInputs inputs, PolicyOption reform, ReformSettings settings, Cache? cache = null) =>
        Simulate(inputs, reform, settings, cache, settledShortcut: true);

    /// <param name="settledShortcut">Reuse x(t) once every working cohort is a reform cohort; off only to test that it
    /// changes nothing.</param>
    internal static ReformPath Simulate(
        ModelInputs inputs, PolicyOption reform, ReformSettings settings, Cache? cache, bool settledShortcut)
    {
        var baseline = inputs.Baseline;
        if (reform.Id == baseline.Id)
            return ReformPath.Flat(reform.Id, settings.HorizonYears) with { ReformYear = settings.Year };
        cache ??= new Cache();
        var labour = new Labour(inputs, reform, settings.PhaseInCohorts, cache);
        double settled = settledShortcut ? labour.SettledFrom : double.PositiveInfinity;
        var gain = Gains(inputs.Production, labour, settings.HorizonYears, settled);
        double bgpGain = cache.OutputPerPerson(inputs, reform) / cache.OutputPerPerson(inputs, baseline) - 1;
        return Landmarks(reform.Id, gain, bgpGain, settings.Year);
    }

    /// <summary>
    /// x(t), effective labour per person: the baseline's cohorts, then the reform cohorts phased in over the first
    /// cohorts entering school from year 0 (the cohort entering school at time s is aged a = t + a₀ − s at time t).
    /// </summary>
    private sealed class Labour
    {
        private readonly List<Group> groups;
        private readonly double population;

        public Labour(ModelInputs inputs, PolicyOption reform, int phaseInCohorts, Cache cache)
        {
            var baseline = inputs.Baseline;
            Before = inputs.DemographyFor(baseline);
            After = inputs.DemographyFor(reform);
            var hc = inputs.HumanCapital;
            // Tables run to the latest retirement age of any option, so options share them.
            double lastAge = double.NegativeInfinity;
            foreach (var o in inputs.Options)
                lastAge = Math.Max(lastAge, o.RetirementAge ?? inputs.Demography.RetirementAge);
            population = cache.Population(inputs);
            var before = Before;
            CohortLabour Table(double e)
            {
                if (!cache.Tables.TryGetValue((e, lastAge), out var table))
                    cache.Tables[(e, lastAge)] = table = new CohortLabour(before, hc, e, lastAge);
                return table;
            }

            groups = new List<Group> { new(double.NegativeInfinity, 0, Table(baseline.SchoolingYears)) };
            int k = Math.Max(1, phaseInCohorts);
            for (int j = 0; j < k; j++)
            {
                double e = baseline.SchoolingYears + (reform.SchoolingYears - baseline.SchoolingYears) * (j + 1) / k;
                groups.Add(new Group(j, j == k - 1 ? double.PositiveInfinity : j + 1, Table(e)));
            }
            // From R − a₀ + k years on, every cohort of working age entered school after the phase-in.
            SettledFrom = After.RetirementAge - After.EntryAge + k;
        }

        public Demography Before { get; }

        public Demography After { get; }

        /// <summary>The time from which x(t) no longer changes.</summary>
        public double SettledFrom { get; }

        public double At(double t)
        {
            var dem = t < 0 ? Before : After;
            double sum = 0;
            foreach (var g in groups)
            {
                double youngest = t + dem.EntryAge - g.EntryTo, oldest = t + dem.EntryAge - g.EntryFrom;
                sum += g.Labour.SchoolingCapital * g.Labour.Between(youngest, Math.Min(oldest, dem.RetirementAge));
            }
            return dem.Participation * sum / population;
        }
    }

    /// <summary>
    /// Output per person relative to no reform, year by year, from capital per person following the labour path.
    /// </summary>
    /// <param name="settled">From this time on x(t) is evaluated once instead of at every step (the same numbers,
    /// fewer table look-ups); +∞ to evaluate it every step.</param>
    private static double[] Gains(Production p, Labour labour, int horizon, double settled)
    {
        // Capital: with z = k^(1−α), k̇ = s·k^α·x^(1−α) − λk becomes linear, ż = (1−α)(s·x^(1−α) − λz), and is
        // integrated exactly for forcing that is linear within each time step (an exponential integrator).
        double alpha = p.CapitalShare, s = p.SavingRate;
        double lambda = BalancedGrowth.EffectiveDepreciation(labour.Before, p);
        double beta = 1 - alpha, mu = beta * lambda, h = ReformSettings.TimeStep;
        double decay = Math.Exp(-mu * h);
        // ∫₀^h e^(−μ(h−τ))·(1 − τ/h) dτ and ∫₀^h e^(−μ(h−τ))·τ/h dτ.
        double w1 = (1 - (1 - decay) / (mu * h)) / mu, w0 = (1 - decay) / mu - w1;
        // Forcing and output are written in ln x, which is computed once per step and shared by both.
        double Forcing(double lnX) => s * Math.Exp(beta * lnX);
        double x0 = labour.At(-1);
        double z = s * Math.Exp(beta * Math.Log(x0)) / lambda;
        double Output(double zz, double lnX) => Math.Exp(alpha / beta * Math.Log(zz) + beta * lnX);
        double y0 = Output(z, Math.Log(x0));

        var gain = new double[horizon + 1];
        int stepsPerYear = (int)Math.Round(1 / h);
        double xSettled = double.IsPositiveInfinity(settled) ? double.NaN : labour.At(settled);
        double lnSettled = Math.Log(xSettled);
        double xNow = labour.At(0), lnNow = Math.Log(xNow), fNow = Forcing(lnNow);
        gain[0] = Output(z, lnNow) / y0 - 1;
        for (int year = 0; year < horizon; year++)
        {
            for (int step = 0; step < stepsPerYear; step++)
            {
                double t = year + (step + 1) * h;
                double fNext;
                if (t >= settled)
                {
                    fNext = xNow == xSettled ? fNow : Forcing(lnSettled);
                    xNow = xSettled;
                    lnNow = lnSettled;
                }
                else
                {
                    xNow = labour.At(t);
                    lnNow = Math.Log(xNow);
                    fNext = Forcing(lnNow);
                }
                z = z * decay + beta * (w0 * fNow + w1 * fNext);
                fNow = fNext;
            }
            gain[year + 1] = Output(z, lnNow) / y0 - 1;
        }
        return gain;
    }

    private static ReformPath Landmarks(string id, double[] gain, double bgpGain, int reformYear)
    {
        int dipYear = 0;
        for (int t = 1; t < gain.Length; t++) if (gain[t] < gain[dipYear]) dipYear = t;
        bool dip = gain[dipYear] < 0;
        int? firstPositive = null;
        for (int t = dip ? dipYear : 0; t < gain.Length; t++)
            if (gain[t] > 0) { firstPositive = t; break; }
        return new ReformPath(id, gain, gain[^1], bgpGain, dip ? gain[dipYear] : null, dip ? dipYear : null,
            firstPositive) { ReformYear = reformYear };
    }
}
