namespace Briefwright.Model.Dynamics;

/// <summary>
/// How a reform is simulated and valued: the calendar year it starts, over how many school-entry cohorts it is
/// phased in, for how many years, and the calendar year at which present values are valued (null: the reform year).
/// </summary>
public sealed record ReformSettings(int Year, int PhaseInCohorts = 1, int HorizonYears = 150, int? ValuationYear = null)
{
    /// <summary>
    /// Time step of the capital equation, in years (exponential integrator, exact for forcing linear within a step).
    /// </summary>
    public const double TimeStep = 0.5;

    /// <summary>The calendar year present values are valued at (technology level 1, discount factor 1).</summary>
    public int ValuedAt => ValuationYear ?? Year;

    /// <summary>
    /// Years from the valuation date to the reform year (never negative: the binder requires the valuation year not to
    /// follow the reform).
    /// </summary>
    public int ValuationOffset => Year - ValuedAt;
}
