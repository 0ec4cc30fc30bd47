using Briefwright.Model.Results;
using Briefwright.Model.Uncertainty;

namespace Briefwright.Brief;

/// <summary>Stops a non-finite number before it can reach a brief or its data annex.</summary>
public static class ResultsGuard
{
    private static void Check(double v, string what)
    {
        if (!double.IsFinite(v))
            throw new NonFiniteResultException(
                $"The model produced a non-finite {what}; no brief is written. Got {v}.");
    }

    public static void EnsureFinite(AnalysisResults a)
    {
        foreach (var o in a.Reform.Options)
        {
            foreach (var g in o.Path.Gain) Check(g, $"reform path for option {o.OptionId}");
            foreach (var pv in o.PresentValues)
                Check(pv.ToHorizon, $"present value ({pv.ScheduleId}) for option {o.OptionId}");
        }
        Check(a.Reform.Optimum.SchoolingYears, "discounted optimum");
        foreach (var row in a.Tornado)
            foreach (var v in row.AtLow.LongRunChangePct.Concat(row.AtHigh.LongRunChangePct)
                .Append(row.AtLow.OptimumYears).Append(row.AtHigh.OptimumYears))
                Check(v, $"sensitivity result for {row.Parameter}");
        if (a.MonteCarlo is { } mc)
            foreach (var o in mc.Options)
                Check(o.LongRunChangePct.P50 + o.PresentValue.P50, $"Monte Carlo result for option {o.OptionId}");
        if (a.Sobol is { } s)
            foreach (var i in s.Indices) foreach (var v in i.FirstOrder.Concat(i.Total)) Check(v, "Sobol index");
    }

    public static void EnsureFinite(BalancedGrowthResults r)
    {
        Check(r.SteadyState.OutputPerEffectiveWorker, "output per effective worker");
        foreach (var o in r.Options)
        {
            Check(o.WorkerShare, $"worker share for option {o.Id}");
            Check(o.HumanCapitalPerWorker, $"human capital for option {o.Id}");
            Check(o.OutputPerPerson, $"output per person for option {o.Id}");
            Check(o.ChangeVsBaselinePct, $"change against the baseline for option {o.Id}");
        }
        Check(r.Optimum.SchoolingYears, "optimal schooling length");
        Check(r.Optimum.OutputPerPerson, "output at the optimum");
        foreach (var p in r.SchoolingCurve)
            Check(p.OutputPerPerson, $"output per person at {p.SchoolingYears} years of schooling");
    }
}

/// <summary>A NaN or infinity was about to reach a brief or its annex.</summary>
public sealed class NonFiniteResultException(string message) : InvalidOperationException(message);
