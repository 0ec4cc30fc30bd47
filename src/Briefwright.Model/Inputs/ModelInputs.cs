namespace Briefwright.Model.Inputs;

/// <summary>
/// Stable population: growth rate n, school-entry age a₀, retirement age R, survival l(a), participation p.
/// </summary>
public sealed record Demography(
    double GrowthRate, double EntryAge, double RetirementAge, Survival Survival, double Participation);

/// <summary>Human capital per worker: schooling returns and an optional experience profile.</summary>
public sealed record HumanCapital(ReturnSchedule Returns, ExperienceProfile? Experience);

/// <summary>Cobb–Douglas production Y = K^α (A·H)^(1−α), saving rate s, depreciation δ, technology growth g.</summary>
public sealed record Production(double SavingRate, double CapitalShare, double Depreciation, double TechnologyGrowth);

/// <summary>A policy option: years of schooling and, optionally, its own retirement age or participation.</summary>
public sealed record PolicyOption(
    string Id, string Label, double SchoolingYears, double? RetirementAge = null, double? Participation = null);

/// <summary>Everything the model needs; built by the scenario stage, never read from files here.</summary>
public sealed record ModelInputs(
    Demography Demography,
    HumanCapital HumanCapital,
    Production Production,
    IReadOnlyList<PolicyOption> Options,
    string BaselineId)
{
    public PolicyOption Baseline => Options.First(o => o.Id == BaselineId);

    /// <summary>The demography an option faces: its own retirement age and participation where it sets them.</summary>
    public Demography DemographyFor(PolicyOption option) => Demography with
    {
        RetirementAge = option.RetirementAge ?? Demography.RetirementAge,
        Participation = option.Participation ?? Demography.Participation,
    };
}
