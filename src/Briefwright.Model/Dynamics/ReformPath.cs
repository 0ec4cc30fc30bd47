namespace Briefwright.Model.Dynamics;

/// <summary>
/// Output per person after a reform relative to no reform, year by year from the reform year (t = 0), with the
/// landmarks a brief reports. <see cref="Gain"/>[t] = y_reform(t)/y_no_reform(t) − 1.
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
    public int Horizon => Gain.Length - 1;

    public static ReformPath Flat(string optionId, int horizon) => new(optionId, new double[horizon + 1], 0, 0, null, null, 0);
}
