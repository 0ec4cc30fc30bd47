using Briefwright.Model.Results;

namespace Briefwright.Model.Uncertainty;

/// <summary>
/// Which way a change goes once shown to one decimal: a change that rounds to zero is <see cref="None"/>.
/// </summary>
public enum Direction
{
    None,
    Rise,
    Fall,
}

/// <summary>
/// The facts page 1 of a brief states about the headline option, with calendar years: its long-run change and 90%
/// range, when it arrives (deepest dip, first year above no reform) and whether it pays back under the first
/// appraisal rule within the horizon. Every sentence of page 1 is chosen from these values.
/// </summary>
public sealed record HeadlineFacts(
    string OptionId,
    double LongRunChangePct,
    Direction Direction,
    double? RangeLowPct,
    double? RangeHighPct,
    double? ProbabilityGain,
    double? DeepestDipPct,
    int? DipCalendarYear,
    double? PeakGainPct,
    int? PeakYear,
    int? FirstYearAbove,
    int? FirstYearBelow,
    string ScheduleId,
    int? BreakEvenCalendarYear,
    double PresentValue,
    int HorizonEndYear)
{
    /// <summary>The direction of a percentage change once rounded to <paramref name="digits"/> decimals.</summary>
    public static Direction Of(double changePct, int digits = 1) =>
        Math.Round(changePct, digits) > 0
            ? Direction.Rise
            : Math.Round(changePct, digits) < 0 ? Direction.Fall : Direction.None;

    public static HeadlineFacts From(BalancedGrowthResults results, AnalysisResults analysis) =>
        From(OptionOutcomes.From(results, analysis).Headline, analysis.Reform);

    public static HeadlineFacts From(OptionOutcome headline, Dynamics.AppraisalResults reform)
    {
        var id = headline.Id;
        var o = headline;
        double change = headline.BalancedGrowth.ChangeVsBaselinePct;
        var mc = headline.Uncertainty;
        var gain = o.Path.Gain;
        int y0 = reform.ReformYear;
        // The first year from which the path stays below no reform to the horizon (a reform that ends in a loss).
        int? below = null;
        for (int t = gain.Length - 1; t >= 0 && gain[t] < 0; t--) below = t;
        int peak = 0;
        for (int t = 1; t < gain.Length; t++) if (gain[t] > gain[peak]) peak = t;
        var pv = o.PresentValues[0];
        return new HeadlineFacts(id, change, Of(change),
            mc?.LongRunChangePct.P5, mc?.LongRunChangePct.P95, mc?.ProbabilityGain.Estimate,
            o.Path.DipDepth is { } dip ? 100 * dip : null, o.Path.DipYear is { } dy ? y0 + dy : null,
            gain[peak] > 0 ? 100 * gain[peak] : null, gain[peak] > 0 ? y0 + peak : null,
            o.Path.FirstPositiveYear is { } fp ? y0 + fp : null, below is { } b ? y0 + b : null,
            pv.ScheduleId, pv.BreakEvenYear is { } be ? y0 + be : null, pv.ToHorizon, y0 + reform.HorizonYears);
    }
}
