namespace Briefwright.Model.Dynamics;

/// <summary>How a reform is simulated: the calendar year it starts, over how many school-entry cohorts it is phased in, and for how many years.</summary>
public sealed record ReformSettings(int Year, int PhaseInCohorts = 1, int HorizonYears = 150)
{
    /// <summary>Time step of the capital equation, in years (exponential integrator, exact for forcing linear within a step).</summary>
    public const double TimeStep = 0.5;
}
