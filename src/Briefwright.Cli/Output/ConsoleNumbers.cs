using System.Globalization;

namespace Briefwright.Cli.Output;

/// <summary>Numbers as the console tables print them: plain invariant digits in a .NET format.</summary>
internal static class ConsoleNumbers
{
    public static string N(double value, string format) => value.ToString(format, CultureInfo.InvariantCulture);
}
