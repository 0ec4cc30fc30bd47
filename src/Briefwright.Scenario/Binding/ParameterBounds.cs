using Briefwright.Model.Inputs;

namespace Briefwright.Scenario.Binding;

/// <summary>
/// The allowed values of each parameter that a scenario sets and that sensitivity and uncertainty analysis may vary:
/// one table, so a range, a grid or a distribution is held to the same rules as the value itself.
/// </summary>
public static class ParameterBounds
{
    public static readonly Bounds PopulationGrowth = Bounds.Closed(-0.1, 0.1);
    public static readonly Bounds SchoolEntryAge = Bounds.Closed(0, 30);
    public static readonly Bounds RetirementAge = Bounds.OpenClosed(0, 150);
    public static readonly Bounds Participation = Bounds.OpenClosed(0, 1);
    public static readonly Bounds SavingRate = Bounds.ClosedOpen(ModelLimits.MinSavingRate, 1);
    public static readonly Bounds CapitalShare = Bounds.Open(0, ModelLimits.MaxCapitalShare);
    public static readonly Bounds Depreciation = Bounds.ClosedOpen(0, 1);
    public static readonly Bounds TechnologyGrowth = Bounds.Closed(-0.1, 0.1);
    public static readonly Bounds ReturnScale = Bounds.OpenClosed(0, 5);

    public static Bounds For(string parameter) => parameter switch
    {
        "population_growth" => PopulationGrowth,
        "school_entry_age" => SchoolEntryAge,
        "retirement_age" => RetirementAge,
        "participation" => Participation,
        "saving_rate" => SavingRate,
        "capital_share" => CapitalShare,
        "depreciation" => Depreciation,
        "technology_growth" => TechnologyGrowth,
        "return_scale" => ReturnScale,
        _ => Bounds.Closed(-1000, 1000),
    };
}
