using System.Globalization;
using Briefwright.Model.Inputs;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario.Yaml;

namespace Briefwright.Scenario.Binding;

/// <summary>The sensitivity and uncertainty sections: each parameter's range or distribution, checked against the
/// model's bounds, and the pilot draws that catch what the model would refuse.</summary>
public sealed partial class AnalysisBinder
{
    private Parameters.Definition? Parameter(YScalar key, string path)
    {
        var def = Parameters.Find(key.Value);
        if (def is null)
            ctx.Report(key.At, path, Suggestions.Closest(key.Value, Parameters.All.Select(p => p.Name)) is { } g
                ? $"unknown parameter (did you mean '{g}'?)"
                : $"unknown parameter (expected one of: {Names})", $"'{key.Value}'");
        return def;
    }

    private (double Low, double High)? Pair(YNode node, string path, Parameters.Definition def, ModelInputs inputs)
    {
        if (node is not YSequence { Items.Count: 2 } seq || seq.Items.Any(i => i is not YScalar))
        {
            ctx.Report(node.At, path, "must be a list of two numbers, [low, high]", node.Kind);
            return null;
        }
        var wrapper = new YMapping(new[]
        {
            new KeyValuePair<YScalar, YNode>(new YScalar("low", false, seq.At), seq.Items[0]),
            new(new YScalar("high", false, seq.At), seq.Items[1]),
        }, seq.At);
        var unit = def.IsRate ? ValueUnit.Rate : ValueUnit.Number;
        var bounds = ParameterBounds.For(def.Name);
        double? lo = ctx.Number(wrapper, "low", path + "[0]", unit, bounds);
        double? hi = ctx.Number(wrapper, "high", path + "[1]", unit, bounds);
        if (lo is null || hi is null) return null;
        if (!(hi > lo))
        {
            ctx.Report(seq.Items[1].At, path + "[1]",
                "the high end must be above the low end " +
                $"({lo.Value.ToString(CultureInfo.InvariantCulture)})", BindContext.Show(seq.Items[1]));
            return null;
        }
        if (!Solvable(inputs, def, lo.Value, seq.Items[0], path + "[0]")
            || !Solvable(inputs, def, hi.Value, seq.Items[1], path + "[1]")) return null;
        return (lo.Value, hi.Value);
    }

    /// <summary>Whether the scenario with <paramref name="def"/> set to <paramref name="value"/> still meets every
    /// model rule (the rules Monte Carlo draws are held to); reports the broken rule at <paramref name="node"/> when
    /// not.</summary>
    private bool Solvable(ModelInputs inputs, Parameters.Definition def, double value, YNode node, string path,
        (Parameters.Definition Def, double Value)? other = null)
    {
        var trial = def.Set(inputs, value);
        if (other is { } o) trial = o.Def.Set(trial, o.Value);
        if (Parameters.Violation(trial) is not { } why) return true;
        string with = other is { } w ? $" and {w.Def.Name} at {Format(w.Def, w.Value)}" : "";
        ctx.Report(node.At, path,
            $"with {def.Name} at {Format(def, value)}{with} the scenario breaks a model rule " +
            $"({why})", BindContext.Show(node));
        return false;
    }

    private static string Format(Parameters.Definition def, double v) =>
        def.IsRate ? Numbers.Percent(v) : Numbers.Plain(v);

    private (IReadOnlyList<SensitivityRange>, IReadOnlyList<GridSpec>) BindSensitivity(YMapping top, ModelInputs inputs)
    {
        var ranges = new List<SensitivityRange>();
        var grids = new List<GridSpec>();
        var m = ctx.Mapping(top, F("sensitivity"), "");
        if (m is null) return (ranges, grids);
        ctx.CheckFields(m, "sensitivity", F("sensitivity"));
        if (ctx.Mapping(m, F("sensitivity.ranges"), "sensitivity") is { } r)
            foreach (var (key, value) in r.Entries)
            {
                string path = $"sensitivity.ranges.{key.Value}";
                if (Parameter(key, path) is { } def && Pair(value, path, def, inputs) is { } pair)
                    ranges.Add(new SensitivityRange(def.Name, pair.Low, pair.High));
            }
        const string gf = "sensitivity.grids[]";
        if (ctx.Sequence(m, F("sensitivity.grids"), "sensitivity") is { } g)
            for (int i = 0; i < g.Items.Count; i++)
            {
                string ip = $"sensitivity.grids[{i}]";
                if (g.Items[i] is not YMapping item)
                {
                    ctx.Report(g.Items[i].At, ip, "must be a mapping with x, x_range, y, y_range", g.Items[i].Kind);
                    continue;
                }
                ctx.CheckFields(item, ip, F(gf));
                var x = item["x"] as YScalar;
                var y = item["y"] as YScalar;
                if (x is null || y is null)
                {
                    ctx.Report(item.At, ip, "needs x and y parameter names", null);
                    continue;
                }
                var dx = Parameter(x, ip + ".x");
                var dy = Parameter(y, ip + ".y");
                double? steps = ctx.Number(item, F(gf + ".steps"), ip);
                string output = ctx.Choice(item, F(gf + ".output"), ip) ?? F(gf + ".output").DefaultText!;
                if (dx is null || dy is null || steps is null) continue;
                if (dx == dy) { ctx.Report(y.At, ip + ".y", "must differ from x", $"'{y.Value}'"); continue; }
                var xr = item["x_range"] is { } xn ? Pair(xn, ip + ".x_range", dx, inputs) : null;
                var yr = item["y_range"] is { } yn ? Pair(yn, ip + ".y_range", dy, inputs) : null;
                if (xr is null || yr is null)
                {
                    if (item["x_range"] is null || item["y_range"] is null)
                        ctx.Report(item.At, ip, "needs x_range and y_range", null);
                    continue;
                }
                // Every rule is linear or monotone in each parameter, so the grid's four corners stand for all its
                // points.
                bool cornersOk = true;
                foreach (double xv in new[] { xr.Value.Low, xr.Value.High })
                    foreach (double yv in new[] { yr.Value.Low, yr.Value.High })
                        if (cornersOk)
                            cornersOk = Solvable(inputs, dx, xv, item["x_range"]!, ip + ".x_range", (dy, yv));
                if (!cornersOk) continue;
                grids.Add(new GridSpec(dx.Name, xr.Value.Low, xr.Value.High, dy.Name, yr.Value.Low, yr.Value.High,
                    (int)steps.Value, output));
            }
        return (ranges, grids);
    }

    private MonteCarloSpec? BindUncertainty(YMapping top, ModelInputs inputs)
    {
        const string p = "uncertainty";
        var m = ctx.Mapping(top, F(p), "");
        if (m is null) return null;
        ctx.CheckFields(m, p, F(p));
        double? draws = ctx.Number(m, F(p + ".draws"), p);
        double? seed = ctx.Number(m, F(p + ".seed"), p);
        double? sobol = ctx.Number(m, F(p + ".sobol_samples"), p);
        var parameters = new List<UncertainParameter>();
        if (ctx.Mapping(m, F(p + ".parameters"), p) is { } ps)
            foreach (var (key, value) in ps.Entries)
            {
                string path = $"{p}.parameters.{key.Value}";
                if (Parameter(key, path) is not { } def) continue;
                if (value is not YMapping dm)
                {
                    ctx.Report(value.At, path, "must be a mapping with a distribution and its parameters", value.Kind);
                    continue;
                }
                if (BindDistribution(dm, path, def) is { } dist) parameters.Add(new UncertainParameter(def.Name, dist));
            }
        if (draws is null || seed is null || sobol is null) return null;
        if (parameters.Count == 0)
        {
            // Only when none was given: a parameter that failed to bind has already been reported where it was written.
            if (m["parameters"] is not YMapping { Entries.Count: > 0 })
                ctx.Report(m.At, p + ".parameters", "must give at least one parameter a distribution", null);
            return null;
        }
        var spec = new MonteCarloSpec((int)draws, (ulong)seed, parameters, (int)sobol);
        return Pilot(inputs, spec, m["parameters"]!) && SobolPilot(inputs, spec, m) ? spec : null;
    }

    /// <summary>
    /// Draws the first <see cref="PilotDraws"/> Monte Carlo draws as the model will (same streams, same rejection rule)
    /// without solving them: when more than a third of those draws fail every attempt, the run would stop, so the
    /// distributions are reported now. Cheap: a draw here is only a few additions and comparisons.
    /// </summary>
    private bool Pilot(ModelInputs inputs, MonteCarloSpec spec, YNode at)
    {
        int n = Math.Min(spec.Draws, PilotDraws), failed = 0;
        string? why = null;
        var u = new double[spec.Parameters.Count];
        for (int i = 0; i < n; i++)
        {
            var rng = SplitMix64.ForStream(spec.Seed, (ulong)i);
            bool accepted = false;
            for (int attempt = 0; attempt < MonteCarlo.MaxAttemptsPerDraw && !accepted; attempt++)
            {
                for (int j = 0; j < u.Length; j++) u[j] = rng.NextOpenUnit();
                var trial = MonteCarlo.Apply(inputs, spec.Parameters, u);
                string? violation = Parameters.Violation(trial);
                accepted = violation is null;
                why ??= violation;
            }
            if (!accepted) failed++;
        }
        if (failed * 3 <= n) return true;
        ctx.Report(at.At, "uncertainty.parameters",
            $"the distributions break a model rule too often: {failed} of the first {n} draws failed all " +
            $"{MonteCarlo.MaxAttemptsPerDraw} attempts (for example: {why}); narrow the distributions",
            $"{failed} of {n}");
        return false;
    }

    /// <summary>
    /// The Sobol samples' counterpart of <see cref="Pilot"/>: the first <see cref="PilotDraws"/> base samples as the
    /// model draws them (same seed, same rows), each with its d + 2 runs checked against the model's rules without
    /// solving. A sample is used only when all its runs meet them and is not redrawn, so distributions that Monte Carlo
    /// survives by redrawing can leave the indices nothing; the model needs <see cref="Sobol.MinRows"/> of them.
    /// </summary>
    private bool SobolPilot(ModelInputs inputs, MonteCarloSpec spec, YMapping at)
    {
        if (spec.SobolSamples == 0) return true;
        int n = Math.Min(spec.SobolSamples, PilotDraws), d = spec.Parameters.Count, accepted = 0;
        string? why = null;
        var a = new double[d];
        var b = new double[d];
        var mixed = new double[d];
        bool Meets(double[] u)
        {
            string? violation = Parameters.Violation(MonteCarlo.Apply(inputs, spec.Parameters, u));
            why ??= violation;
            return violation is null;
        }
        for (int r = 0; r < n; r++)
        {
            Sobol.BaseRow(AnalysisRunner.SobolSeed(spec), r, a, b);
            bool ok = Meets(a) && Meets(b);
            for (int i = 0; i < d && ok; i++)
            {
                a.CopyTo(mixed, 0);
                mixed[i] = b[i];
                ok = Meets(mixed);
            }
            if (ok) accepted++;
        }
        if (accepted >= Sobol.MinRows(n)) return true;
        var node = at["sobol_samples"] ?? at["parameters"]!;
        ctx.Report(node.At, node == at["sobol_samples"] ? "uncertainty.sobol_samples" : "uncertainty.parameters",
            $"the distributions break a model rule too often for the Sobol indices: only {accepted} of the first {n} " +
            $"base samples met every rule in all {d + 2} of their runs (at least {Sobol.MinRows(n)} must; for " +
            $"example: {why}); narrow the distributions, or set sobol_samples to 0",
            $"{accepted} of {n}");
        return false;
    }

    private Distribution? BindDistribution(YMapping m, string path, Parameters.Definition def)
    {
        const string d = "uncertainty.parameters.*";
        var unit = def.IsRate ? ValueUnit.Rate : ValueUnit.Number;
        // The ends of a bounded distribution are values the parameter takes, so they follow the parameter's own rules.
        var ends = ParameterBounds.For(def.Name);
        double? Value(string key)
        {
            var f = F(d + "." + key);
            return ctx.Number(m, f, path, unit: unit, bounds: f.ParameterBounds ? ends : f.Bounds);
        }
        string? kind = ctx.Choice(m, F(d + ".distribution"), path);
        if (kind is not null) ctx.CheckFields(m, path, F(d), kind);
        switch (kind)
        {
            case "normal":
            {
                double? mean = Value("mean"), sd = Value("sd");
                return mean is null || sd is null ? null : new NormalDistribution(mean.Value, sd.Value);
            }
            case "truncated_normal":
            {
                double? mean = Value("mean"), sd = Value("sd");
                double? lo = Value("low"), hi = Value("high");
                if (mean is null || sd is null || lo is null || hi is null) return null;
                if (!HighAboveLow(m, path, lo.Value, hi.Value)) return null;
                return new TruncatedNormalDistribution(mean.Value, sd.Value, lo.Value, hi.Value);
            }
            case "uniform":
            {
                double? lo = Value("low"), hi = Value("high");
                if (lo is null || hi is null) return null;
                if (!HighAboveLow(m, path, lo.Value, hi.Value)) return null;
                return new UniformDistribution(lo.Value, hi.Value);
            }
            case "triangular":
            {
                double? lo = Value("low"), mode = Value("mode"), hi = Value("high");
                if (lo is null || mode is null || hi is null) return null;
                if (!(lo <= mode && mode <= hi && hi > lo))
                {
                    ctx.Report(m["mode"]!.At, path + ".mode",
                        "must satisfy low ≤ mode ≤ high with low < high", BindContext.Show(m["mode"]!));
                    return null;
                }
                return new TriangularDistribution(lo.Value, mode.Value, hi.Value);
            }
            case "lognormal":
            {
                double? median = Value("median"), sigma = ctx.Number(m, F(d + ".sigma_log"), path);
                return median is null || sigma is null ? null : new LognormalDistribution(median.Value, sigma.Value);
            }
            default:
                return null;
        }
    }

    /// <summary>Whether <paramref name="hi"/> is above <paramref name="lo"/>; reports it at high when not.</summary>
    private bool HighAboveLow(YMapping m, string path, double lo, double hi)
    {
        if (hi > lo) return true;
        ctx.Report(m["high"]!.At, path + ".high", "must be above low", BindContext.Show(m["high"]!));
        return false;
    }
}
