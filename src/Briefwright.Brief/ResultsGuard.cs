using Briefwright.Model.Results;

namespace Briefwright.Brief;

/// <summary>Stops a non-finite number before it can reach a brief or its data annex.</summary>
public static class ResultsGuard
{
    public static void EnsureFinite(BalancedGrowthResults r)
    {
        void Check(double v, string what)
        {
            if (!double.IsFinite(v)) throw new InvalidOperationException($"The model produced a non-finite {what}; no brief is written. Got {v}.");
        }
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
        foreach (var p in r.SchoolingCurve) Check(p.OutputPerPerson, $"output per person at {p.SchoolingYears} years of schooling");
    }
}
