using System.Globalization;
using Briefwright.Model.Inputs;
using Briefwright.Scenario.Diagnostics;

namespace Briefwright.Scenario.Binding;

/// <summary>
/// Reads a life table CSV: two columns, age and survivors, an optional header row, ages from 0 upwards.
/// Survivors may be a share (starting at 1) or counts from any radix (starting at, say, 100000); both are scaled to
/// l(0) = 1.
/// </summary>
public static class LifeTableReader
{
    public const int MaxRows = 1000;
    public const double MaxAge = 150;

    public static TabulatedSurvival? Read(string file, string text, string path, BindContext ctx)
    {
        var ages = new List<double>();
        var survivors = new List<double>();
        var lines = text.Split('\n');
        int before = ctx.Problems.Count;
        for (int i = 0; i < lines.Length; i++)
        {
            string line = lines[i].TrimEnd('\r');
            if (line.Trim().Length == 0 || line.TrimStart().StartsWith('#')) continue;
            var cells = line.Split(',');
            var at = new SourceSpan(file, i + 1, 1);
            if (cells.Length != 2)
            {
                ctx.Report(at, path, "each life-table row must have two columns, age and survivors",
                    $"{cells.Length} columns");
                continue;
            }
            bool ageOk = double.TryParse(cells[0].Trim(), NumberStyles.Float, CultureInfo.InvariantCulture,
                out double age) && double.IsFinite(age);
            bool lOk = double.TryParse(cells[1].Trim(), NumberStyles.Float, CultureInfo.InvariantCulture, out double l)
                && double.IsFinite(l);
            if (!ageOk && !lOk && ages.Count == 0) continue; // header row
            if (!ageOk) { ctx.Report(at, path, "age must be a number", $"'{cells[0].Trim()}'"); continue; }
            var lAt = at with { Column = cells[0].Length + 2 };
            if (!lOk) { ctx.Report(lAt, path, "survivors must be a number", $"'{cells[1].Trim()}'"); continue; }
            if (age < 0 || age > MaxAge)
            {
                ctx.Report(at, path, $"ages must be from 0 to {MaxAge}", age.ToString(CultureInfo.InvariantCulture));
                continue;
            }
            CheckOrder(ctx, path, at, lAt, age, l, ages, survivors);
            ages.Add(age);
            survivors.Add(l);
            if (ages.Count > MaxRows)
            {
                ctx.Report(at, path, $"a life table may have at most {MaxRows} rows", "more");
                return null;
            }
        }
        if (ages.Count < 2)
        {
            ctx.Report(new SourceSpan(file, 1, 1), path, "a life table needs at least two rows of age and survivors",
                ages.Count == 1 ? "1 row" : $"{ages.Count} rows");
            return null;
        }
        if (ctx.Problems.Count > before) return null;
        double radix = survivors[0];
        return new TabulatedSurvival(ages, survivors.Select(v => v / radix).ToList());
    }

    /// <summary>Reports a row whose age or survivors break the rules or the order of the rows before it.</summary>
    private static void CheckOrder(BindContext ctx, string path, SourceSpan at, SourceSpan lAt, double age, double l,
        List<double> ages, List<double> survivors)
    {
        if (ages.Count == 0 && age != 0)
            ctx.Report(at, path, "the life table must start at age 0", age.ToString(CultureInfo.InvariantCulture));
        if (ages.Count > 0 && age <= ages[^1])
            ctx.Report(at, path,
                $"ages must increase (previous row: {ages[^1].ToString(CultureInfo.InvariantCulture)})",
                age.ToString(CultureInfo.InvariantCulture));
        if (l < 0)
            ctx.Report(lAt, path, "survivors must not be negative", l.ToString(CultureInfo.InvariantCulture));
        if (ages.Count == 0 && l <= 0)
            ctx.Report(lAt, path, "survivors at age 0 must be positive", l.ToString(CultureInfo.InvariantCulture));
        if (survivors.Count > 0 && l > survivors[^1])
            ctx.Report(lAt, path,
                "survivors must not increase with age (previous row: " +
                $"{survivors[^1].ToString(CultureInfo.InvariantCulture)})",
                l.ToString(CultureInfo.InvariantCulture));
    }
}
