namespace Briefwright.Model.Inputs;

/// <summary>
/// Bounds the model relies on to keep every result finite. Output per effective worker is
/// (s/(n+g+δ))^(α/(1−α)): with s ≥ 0.1%, n+g+δ ≥ 0.1% and α &lt; 0.9 the exponent stays below 9 and the ratio between
/// 10⁻⁴ and 10³, so the result lies between about 10⁻³⁶ and 10²⁷. Workers must exist: the share of a cohort alive when
/// its schooling ends must be at least <see cref="MinSurvivorsAtWork"/>. The scenario stage checks the same numbers.
/// </summary>
public static class ModelLimits
{
    public const double MinSavingRate = 0.001;
    public const double MaxCapitalShare = 0.9;
    public const double MinEffectiveDepreciation = 0.001;
    public const double MinSurvivorsAtWork = 1e-6;

    /// <summary>The share of a cohort alive when an option's schooling ends (the first age of work).</summary>
    public static double SurvivorsAtWork(ModelInputs inputs, PolicyOption option) =>
        inputs.Demography.Survival.At(inputs.Demography.EntryAge + option.SchoolingYears);
}
