using System.Globalization;

namespace Briefwright.Scenario;

/// <summary>
/// Numbers as messages, the schema, the field reference and the in-sentence names write them: invariant culture,
/// trailing zeros dropped. One set, so that a bound reads the same in a message, the schema's page and the docs.
/// </summary>
public static class Numbers
{
    private static string Pattern(int minDecimals, int maxDecimals) =>
        maxDecimals == 0 ? "0" : "0." + new string('0', minDecimals) + new string('#', maxDecimals - minDecimals);

    /// <summary>A plain number with at most <paramref name="maxDecimals"/> decimals (4: 0.0001).</summary>
    public static string Plain(double v, int maxDecimals = 4) =>
        v.ToString(Pattern(0, maxDecimals), CultureInfo.InvariantCulture);

    /// <summary>A rate as a percentage: 0.0225 → "2.25%" (at most <paramref name="maxDecimals"/> decimals, at least
    /// <paramref name="minDecimals"/>).</summary>
    public static string Percent(double rate, int maxDecimals = 3, int minDecimals = 0) =>
        (rate * 100).ToString(Pattern(minDecimals, maxDecimals), CultureInfo.InvariantCulture) + "%";

    /// <summary>A count with thousands separated by commas: 10,000,000.</summary>
    public static string Count(double n) => n.ToString("N0", CultureInfo.InvariantCulture);

    /// <summary>The shortest text that reads back as the same double.</summary>
    public static string Exact(double v) => v.ToString("R", CultureInfo.InvariantCulture);
}
