namespace Briefwright.Scenario.Binding;

/// <summary>
/// The allowed values of each parameter that a scenario sets and that sensitivity and uncertainty analysis may vary,
/// taken from the parameter's field in <see cref="ScenarioFields"/>: a range, a grid or a distribution is held to the
/// same rules as the value itself.
/// </summary>
public static class ParameterBounds
{
    /// <summary><c>return_scale</c> multiplies every return to schooling; it is a parameter, not a field.</summary>
    public static readonly Bounds ReturnScale = Bounds.OpenClosed(0, 5);

    public static Bounds For(string parameter) => parameter switch
    {
        "population_growth" or "school_entry_age" or "retirement_age" or "participation" =>
            ScenarioFields.Get("demography." + parameter).Bounds,
        "saving_rate" or "capital_share" or "depreciation" or "technology_growth" =>
            ScenarioFields.Get("production." + parameter).Bounds,
        "return_scale" => ReturnScale,
        _ => Bounds.Closed(-1000, 1000),
    };
}
