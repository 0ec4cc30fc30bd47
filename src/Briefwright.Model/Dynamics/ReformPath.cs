namespace Briefwright.Model.Dynamics;

/// <summary>
/// Output per person after a reform relative to no reform, year by year from the reform year (t = 0), with the
/// landmarks a brief reports. <see cref="Gain"/>[t] = y_reform(t)/y_no_reform(t) − 1 (a fraction). Landmark years are
/// counted from the reform year; the calendar years are <see cref="ReformYear"/> plus them.
/// </summary>
public sealed record ReformPath(
    string OptionId,
    double[] Gain,
    double LongRunGain,
    double BalancedGrowthGain,
    double? DipDepth,
    int? DipYear,
    int? FirstPositiveYear)
{
    public bool Equals(ReformPath? other) =>
        other is not null && OptionId == other.OptionId && Same.Items(Gain, other.Gain)
        && LongRunGain.Equals(other.LongRunGain) && BalancedGrowthGain.Equals(other.BalancedGrowthGain)
        && DipDepth.Equals(other.DipDepth) && DipYear == other.DipYear
        && FirstPositiveYear == other.FirstPositiveYear && ReformYear == other.ReformYear;

    public override int GetHashCode() => HashCode.Combine(OptionId, Same.Hash(Gain), LongRunGain, DipYear, ReformYear);

    /// <summary>Calendar year of t = 0 (0 when the path was built without one).</summary>
    public int ReformYear { get; init; }

    public int? DipCalendarYear => ReformYear + DipYear;

    public int? FirstPositiveCalendarYear => ReformYear + FirstPositiveYear;

    public int Horizon => Gain.Length - 1;

    public static ReformPath Flat(string optionId, int horizon) =>
        new(optionId, new double[horizon + 1], 0, 0, null, null, 0);
}
