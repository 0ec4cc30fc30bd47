using Briefwright.Model.Inputs;
using Briefwright.Model.Numerics;

namespace Briefwright.Model.Core;

/// <summary>
/// Integrals over the stable age distribution e^(−na)·l(a) for one demography and one human-capital schedule.
/// Immutable once built; the population total is computed once.
/// </summary>
public sealed class LifeCycle
{
    private readonly Demography demography;
    private readonly HumanCapital humanCapital;
    private readonly bool rectangular;
    private readonly bool fast;

    /// <param name="population">The population integral if already known for this growth rate and survival curve
    /// (it does not depend on schooling, retirement or participation).</param>
    public LifeCycle(Demography demography, HumanCapital humanCapital, double? population = null, bool fast = false)
    {
        this.fast = fast;
        this.demography = demography;
        this.humanCapital = humanCapital;
        rectangular = demography.Survival is RectangularSurvival;
        Population = population ?? PersonYears(0.0, demography.Survival.MaxAge);
    }

    /// <summary>∫₀^Ω e^(−na) l(a) da: population relative to the annual number of births.</summary>
    public double Population { get; }

    /// <summary>Longest schooling that still leaves working years: R − a₀ (or Ω − a₀ if earlier).</summary>
    public double MaxSchooling => WorkEnd - demography.EntryAge;

    private double WorkEnd => Math.Min(demography.RetirementAge, demography.Survival.MaxAge);

    public double Density(double age) => Math.Exp(-demography.GrowthRate * age) * demography.Survival.At(age);

    /// <summary>∫_from^to e^(−na) l(a) da, in closed form for rectangular survival.</summary>
    public double PersonYears(double from, double to)
    {
        to = Math.Min(to, demography.Survival.MaxAge);
        if (!(to > from)) return 0.0;
        if (rectangular)
        {
            double n = demography.GrowthRate, length = to - from;
            return Math.Exp(-n * from) * length * Stable.RelativeExpm1(-n * length);
        }
        if (TiltedKernel.Safe(demography.GrowthRate, to) && TiltedKernel.For(demography.Survival, 0) is { } kernel)
            return kernel.Integrate(from, to, -demography.GrowthRate, demography.Survival.Breakpoints, fast);
        return Quadrature.Integrate(Density, from, to, demography.Survival.Breakpoints, fast);
    }

    /// <summary>ω(E) = p·∫_{a₀+E}^{R} e^(−na) l(a) da / ∫₀^Ω e^(−na) l(a) da.</summary>
    public double WorkerShare(double schooling) =>
        demography.Participation * PersonYears(demography.EntryAge + schooling, WorkEnd) / Population;

    /// <summary>Same integral by quadrature whatever the survival form; used to check the closed form.</summary>
    public double WorkerShareByQuadrature(double schooling)
    {
        double pop = Quadrature.Integrate(Density, 0.0, demography.Survival.MaxAge, demography.Survival.Breakpoints);
        double work = Quadrature.Integrate(
            Density, demography.EntryAge + schooling, WorkEnd, demography.Survival.Breakpoints);
        return demography.Participation * work / pop;
    }

    /// <summary>
    /// Average experience premium e^(β₁x − β₂x²) over the working ages, weighted by the age distribution; 1 without a
    /// profile.
    /// </summary>
    public double ExperienceFactor(double schooling)
    {
        if (humanCapital.Experience is null) return 1.0;
        double den = PersonYears(demography.EntryAge + schooling, WorkEnd);
        return den > 0 ? ExperienceWeightedYears(schooling) / den : 1.0;
    }

    /// <summary>h(E) = e^φ(E) × the experience factor.</summary>
    public double HumanCapitalPerWorker(double schooling) =>
        Math.Exp(humanCapital.Returns.Phi(schooling)) * ExperienceFactor(schooling);

    /// <summary>h(E)·ω(E), the part of output per person that schooling moves.</summary>
    public double Objective(double schooling) =>
        Math.Exp(humanCapital.Returns.Phi(schooling)) * demography.Participation * ExperienceWeightedYears(schooling)
            / Population;

    /// <summary>
    /// d ln(h·ω)/dE = φ'(E) − [d(s) + ∫ d(a)·e^m(x)·m'(x) da] / ∫ d(a)·e^m(x) da, with s = a₀ + E, x = a − s.
    /// </summary>
    public double ObjectiveLogSlope(double schooling)
    {
        double start = demography.EntryAge + schooling;
        double num = ExperienceWeightedYears(schooling);
        if (!(num > 0)) return double.NegativeInfinity;
        double slopeTerm = 0.0;
        if (humanCapital.Experience is { } exp && TiltedKernel.ForCohort(demography, exp, start, WorkEnd) is { } t)
        {
            // (β₁ − 2β₂x) = (β₁ + 2β₂s) − 2β₂a, the same factor as below written as c₀ + c₁a.
            slopeTerm = Math.Exp(t.LogScale)
                * t.Kernel.Integrate(start, WorkEnd, t.Lambda, demography.Survival.Breakpoints, fast,
                    exp.Linear + 2 * exp.Quadratic * start, -2 * exp.Quadratic);
        }
        else if (humanCapital.Experience is { } direct)
        {
            slopeTerm = Quadrature.Integrate(
                a => Density(a) * Math.Exp(direct.LogPremium(a - start))
                    * (direct.Linear - 2 * direct.Quadratic * (a - start)),
                start, WorkEnd, demography.Survival.Breakpoints, fast);
        }
        return humanCapital.Returns.MarginalReturn(schooling) - (Density(start) + slopeTerm) / num;
    }

    private double ExperienceWeightedYears(double schooling)
    {
        double start = demography.EntryAge + schooling;
        if (humanCapital.Experience is not { } exp) return PersonYears(start, WorkEnd);
        if (TiltedKernel.ForCohort(demography, exp, start, WorkEnd) is { } t)
            return Math.Exp(t.LogScale)
                * t.Kernel.Integrate(start, WorkEnd, t.Lambda, demography.Survival.Breakpoints, fast);
        return Quadrature.Integrate(a => Density(a) * Math.Exp(exp.LogPremium(a - start)), start, WorkEnd,
            demography.Survival.Breakpoints, fast);
    }
}
