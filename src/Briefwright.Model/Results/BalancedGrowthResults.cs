namespace Briefwright.Model.Results;

/// <summary>One option on the balanced growth path (technology level 1 at the brief's date).</summary>
public sealed record OptionResult(
    string Id,
    string Label,
    bool IsBaseline,
    double SchoolingYears,
    double WorkerShare,
    double HumanCapitalPerWorker,
    double OutputPerEffectiveWorker,
    double OutputPerPerson,
    double ChangeVsBaselinePct);

/// <summary>A local maximum of output per person over schooling length.</summary>
public sealed record LocalMaximum(double SchoolingYears, double OutputPerPerson, bool AtBoundary);

/// <summary>How a local maximum was refined.</summary>
public enum RefinementMethod
{
    DerivativeBisection,
    GoldenSection,
}

/// <summary>How the optimum was found and whether the search converged.</summary>
public sealed record SolverDiagnostics(
    int GridPoints, int RefinementIterations, bool Converged, double Tolerance, RefinementMethod Refinement);

/// <summary>Why the closed form E* = R − a₀ + ln(1 − n/r)/n does not apply.</summary>
public enum ClosedFormObstacle
{
    ReturnNotConstant,
    SurvivalNotRectangular,
    ExperienceProfile,
    ReturnBelowGrowth,
}

public enum OptimumMethod
{
    ClosedForm,
    Numerical,
}

/// <summary>The output-maximising schooling length E* and the band of lengths within 1% of its output.</summary>
public sealed record OptimumResult(
    double SchoolingYears,
    double OutputPerPerson,
    OptimumMethod Method,
    ClosedFormObstacle? ClosedFormNotApplicable,
    double[] Within1Pct,
    bool AtBoundary,
    double FeasibleMaxSchooling,
    IReadOnlyList<LocalMaximum> LocalMaxima,
    SolverDiagnostics Diagnostics)
{
    public bool Equals(OptimumResult? other) =>
        other is not null && SchoolingYears.Equals(other.SchoolingYears)
        && OutputPerPerson.Equals(other.OutputPerPerson)
        && Method == other.Method && ClosedFormNotApplicable == other.ClosedFormNotApplicable
        && Same.Items(Within1Pct, other.Within1Pct) && AtBoundary == other.AtBoundary
        && FeasibleMaxSchooling.Equals(other.FeasibleMaxSchooling) && Same.Items(LocalMaxima, other.LocalMaxima)
        && Diagnostics.Equals(other.Diagnostics);

    public override int GetHashCode() =>
        HashCode.Combine(SchoolingYears, OutputPerPerson, Method, Same.Hash(Within1Pct), Diagnostics);
}

/// <summary>Balanced-growth quantities shared by all options.</summary>
public sealed record SteadyState(
    double OutputPerEffectiveWorker, double CapitalPerEffectiveWorker, double EffectiveDepreciation);

/// <summary>
/// One point of the schooling curve: worker share, human capital and output per person at schooling E (baseline
/// demography).
/// </summary>
public sealed record CurvePoint(
    double SchoolingYears, double WorkerShare, double HumanCapitalPerWorker, double OutputPerPerson);

public sealed record BalancedGrowthResults(
    SteadyState SteadyState,
    IReadOnlyList<OptionResult> Options,
    OptimumResult Optimum,
    IReadOnlyList<CurvePoint> SchoolingCurve)
{
    /// <summary>
    /// Every alternative's change split by lever (schooling, retirement age, participation), independent of order.
    /// </summary>
    public IReadOnlyList<Core.LeverDecomposition> Levers { get; init; } = [];
}
